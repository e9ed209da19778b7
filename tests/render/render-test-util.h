#pragma once

/* Shared set-up for render tests: the project's own tables, molecules from ring specs, and
 * overlap checks on drawing models. */
#include <math.h>
#include <string.h>

#include "cw-figures.h"
#include "cw-render.h"
#include "../core/test-helpers.h"

/* the same set-up as the core tests */
#define rt_load_data test_load_data
#define rt_ring test_ring

static inline void
rt_analyze (const CwData *data, const CwMolecule *mol, double kelvin, CwAnalysis *an)
{
  g_autoptr (GError) error = NULL;
  CwConditions cond = { kelvin, CW_SOLVENT_APROTIC };

  g_assert_true (cw_analyze (data, mol, &cond, an, &error));
  g_assert_no_error (error);
}

static inline gboolean
rt_is_label (const CwPrim *p)
{
  return p->kind == CW_PRIM_TEXT;
}

/* Fails when two text boxes of the scene overlap (pad < 0 tolerates touching). */
static inline void
rt_assert_no_text_overlap (const CwScene *scene, const char *what)
{
  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    for (guint j = i + 1; j < cw_scene_get_n (scene); j++)
      {
        const CwPrim *a = cw_scene_get (scene, i), *b = cw_scene_get (scene, j);

        if (rt_is_label (a) && rt_is_label (b) && cw_box_overlap (&a->box, &b->box, -0.5))
          g_error ("%s: “%s” overlaps “%s”", what, a->markup, b->markup);
      }
}
