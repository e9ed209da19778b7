/* cw-smiles-probe: reads "SMILES [name]" lines and prints one JSON object per line with what the
 * reference scripts compare against RDKit: the canonical SMILES (and the SMILES after a second
 * round trip), each group with the text-order atom indices of its ring carbon and first atom and
 * its face as read, the molecular formula and the molar mass. */
#include "config.h"

#include <cjson/cJSON.h>
#include <stdio.h>
#include <string.h>

#include "cw-core.h"
#include "cw-smiles-private.h"
#include "cw-smiles.h"

static void
probe (CwSmilesReader *reader, const CwData *data, const char *smiles)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) mols = NULL;
  g_autoptr (GPtrArray) again = NULL;
  cJSON     *o = cJSON_CreateObject ();
  CwSmDetail detail;
  int        n;
  char      *text;

  cJSON_AddStringToObject (o, "input", smiles);
  mols = cw_smiles_read (smiles, data->groups, NULL, &error);
  n = mols ? cw_sm_reader_read_detail (reader, smiles, &detail, NULL) : -1;
  if (mols == NULL || n < 0)
    {
      cJSON_AddBoolToObject (o, "ok", FALSE);
      cJSON_AddStringToObject (o, "error", error ? error->message : "detail reading failed");
    }
  else
    {
      const CwMolecule *m = mols->pdata[0];
      g_autofree char  *out = cw_smiles_write (m);
      g_autofree char  *out2 = NULL;
      g_autofree char  *formula = NULL;
      g_autofree char  *config = cw_molecule_dup_configuration (m);
      cJSON            *subs = cJSON_AddArrayToObject (o, "subs");
      CwFormula         f;

      again = cw_smiles_read (out, data->groups, NULL, NULL);
      out2 = again ? cw_smiles_write (again->pdata[0]) : g_strdup ("");
      cw_formula_compute (m, &f);
      formula = cw_formula_dup_string (&f);
      cJSON_AddBoolToObject (o, "ok", TRUE);
      cJSON_AddNumberToObject (o, "n_molecules", mols->len);
      cJSON_AddStringToObject (o, "smiles", out);
      cJSON_AddStringToObject (o, "smiles_again", out2);
      cJSON_AddStringToObject (o, "configuration", config);
      cJSON_AddStringToObject (o, "formula", formula);
      cJSON_AddNumberToObject (o, "charge", f.charge);
      cJSON_AddNumberToObject (o, "mass", f.molar_mass);
      {
        /* the ring atoms in the reader's position order, the frame the faces are read in */
        cJSON *ring = cJSON_AddArrayToObject (o, "ring");
        for (int k = 0; k < CW_RING_SIZE; k++)
          cJSON_AddItemToArray (ring, cJSON_CreateNumber (detail.ring_atom[k]));
      }
      for (int s = 0; s < n; s++)
        {
          cJSON *x = cJSON_CreateObject ();
          cJSON_AddNumberToObject (x, "ring_atom", detail.ring_atom[detail.ring_index[s]]);
          cJSON_AddNumberToObject (x, "root_atom", detail.root_atom[s]);
          if (detail.face[s] < 0)
            cJSON_AddNullToObject (x, "face");
          else
            cJSON_AddStringToObject (x, "face", detail.face[s] == CW_FACE_UP ? "up" : "down");
          cJSON_AddStringToObject (x, "group", detail.group[s]->id);
          cJSON_AddItemToArray (subs, x);
        }
    }
  text = cJSON_PrintUnformatted (o);
  printf ("%s\n", text);
  cJSON_free (text);
  cJSON_Delete (o);
}

int
main (int argc, char **argv)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = cw_data_new_from_dir (NULL, &error);
  g_autoptr (CwSmilesReader) reader = NULL;
  char line[8192];

  if (data == NULL)
    {
      fprintf (stderr, "cw-smiles-probe: %s\n", error->message);
      return 2;
    }
  reader = cw_smiles_reader_new (data->groups);
  if (argc > 1 && strcmp (argv[1], "--groups") == 0)
    {
      /* the table's ids and fragments, one per line */
      for (guint i = 0; i < cw_group_table_get_n_groups (data->groups); i++)
        {
          const CwGroup *g = cw_group_table_get (data->groups, i);
          printf ("%s\t%s\n", g->id, g->smiles);
        }
      return 0;
    }
  while (fgets (line, sizeof line, stdin))
    {
      char *s = g_strstrip (line);
      char *space = strpbrk (s, " \t");
      if (space)
        *space = '\0';
      if (*s == '\0' || *s == '#')
        continue;
      probe (reader, data, s);
    }
  return 0;
}
