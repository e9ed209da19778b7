#pragma once

#include "cw-figures.h"

G_BEGIN_DECLS

/* Reaction geometry on the chairs figure (CwRenderOptions.highlight_reactivity): the leaving
 * group's bond drawn heavy, and each β-hydrogen anti-periplanar to it drawn heavier, ringed and
 * labelled "ap". Shared by cw-figure-chairs.c only. */

/* clang-format off */
/* The reactivity to draw: opt->reactivity, or one computed from the default geometry table into
 * *owned (free it with g_free). NULL when the option is off or nothing can be computed. */
const CwReactivity *cw_chairs_reaction_prepare (const CwMolecule *mol, const CwAnalysis *an,
                                                const CwRenderOptions *opt, CwReactivity **owned);
/* Whether leaving group g of r is the one (or one of those) the options ask for. */
gboolean            cw_chairs_reaction_wants (const CwReactivity *r, int g, const CwMolecule *mol,
                                              const CwRenderOptions *opt);
/* Emphasises, in the prims of chair `which` already in scene, the chosen leaving groups' bonds and
 * their anti-periplanar β-hydrogens, and adds the rings and "ap" labels clear of the placer's labels. */
void                cw_chairs_reaction_mark (CwScene *scene, CwPlacer *placer, const CwMolecule *mol,
                                             const CwReactivity *r, const CwRenderOptions *opt, int which);
/* The legend line for the marks, its left end at (x, y); returns the width used. */
double              cw_chairs_reaction_legend (CwScene *scene, double x, double y);
/* clang-format on */

G_END_DECLS
