#include "config.h"

#include "cw-data.h"

#include <glib/gi18n-lib.h>

#include "cw-core-error.h"

const char *
cw_data_find_dir (void)
{
  const char *env = g_getenv ("CHAIRWISE_DATADIR");
  g_autofree char *installed = g_build_filename (CW_PKGDATADIR, "groups.json", NULL);

  if (env != NULL && *env != '\0')
    return env;
  if (g_file_test (installed, G_FILE_TEST_EXISTS))
    return CW_PKGDATADIR;
  return CW_SOURCE_DATADIR;
}

CwData *
cw_data_new (CwGroupTable *groups, CwInteractionTable *interactions)
{
  CwData *data = g_new0 (CwData, 1);
  guint n = cw_group_table_get_n_groups (groups);

  data->groups = groups;
  data->interactions = interactions;
  data->n_groups = n;
  data->pair_index = g_new (int, (gsize) CW_N_PAIR_KINDS * n * n);
  /* Each cell holds 2 * entry + swapped, or -1; the engine then needs no string compares. */
  for (int k = 0; k < CW_N_PAIR_KINDS; k++)
    for (guint i = 0; i < n; i++)
      for (guint j = 0; j < n; j++)
        {
          gboolean swapped = FALSE;
          const CwPairEntry *e = cw_interaction_table_find (interactions, (CwPairKind) k,
                                                            cw_group_table_get (groups, i),
                                                            cw_group_table_get (groups, j),
                                                            &swapped);
          int cell = -1;

          if (e != NULL)
            cell = 2 * (int) (e - cw_interaction_table_get_entry (interactions, 0)) + (swapped ? 1 : 0);
          data->pair_index[((gsize) k * n + i) * n + j] = cell;
        }
  return data;
}

CwData *
cw_data_new_from_dir (const char *dir, GError **error)
{
  g_autofree char *gpath = NULL;
  g_autofree char *ipath = NULL;
  g_autoptr (CwGroupTable) groups = NULL;
  g_autoptr (CwInteractionTable) inter = NULL;

  if (dir == NULL)
    dir = cw_data_find_dir ();
  gpath = g_build_filename (dir, "groups.json", NULL);
  ipath = g_build_filename (dir, "interactions.json", NULL);
  groups = cw_group_table_new_from_file (gpath, error);
  if (groups == NULL)
    return NULL;
  inter = cw_interaction_table_new_from_file (ipath, error);
  if (inter == NULL)
    return NULL;
  return cw_data_new (g_steal_pointer (&groups), g_steal_pointer (&inter));
}

void
cw_data_free (CwData *data)
{
  if (data == NULL)
    return;
  cw_group_table_free (data->groups);
  cw_interaction_table_free (data->interactions);
  g_free (data->pair_index);
  g_free (data);
}

const CwPairEntry *
cw_data_find_pair (const CwData *data,
                   CwPairKind kind,
                   const CwGroup *x,
                   const CwGroup *y,
                   gboolean *swapped)
{
  int cell;

  if (x->index < 0 || y->index < 0 || (guint) x->index >= data->n_groups ||
      (guint) y->index >= data->n_groups)
    return cw_interaction_table_find (data->interactions, kind, x, y, swapped);
  cell = data->pair_index[((gsize) kind * data->n_groups + (guint) x->index) * data->n_groups +
                          (guint) y->index];
  if (cell < 0)
    return NULL;
  if (swapped)
    *swapped = cell & 1;
  return cw_interaction_table_get_entry (data->interactions, (guint) (cell >> 1));
}
