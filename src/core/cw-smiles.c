/* cw-smiles.c: the public SMILES API and the fragment index of the group table. */
#include "config.h"

#include "cw-smiles.h"

#include <glib/gi18n-lib.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-smiles-private.h"

#define READ_MAX 64 /* isomers one reading may give: 2^5 frames at most, deduplicated */

struct _CwSmilesReader
{
  CwSmIndex *index;
  CwSmGraph  graph;
  guint8     mask[CW_SM_MAX_ATOMS];
};

/* ---- the index ---- */

static gboolean
parse_fragment (CwSmGraph *g, const char *smiles, GError **error)
{
  if (smiles == NULL || *smiles == '\0')
    {
      g_set_error_literal (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("the group has no SMILES fragment"));
      return FALSE;
    }
  g->error_pos = -1;
  if (!cw_sm_parse (g, smiles, strlen (smiles), TRUE, error))
    return FALSE;
  if (g->n_dots > 0)
    {
      g_set_error_literal (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("a fragment must be one connected part"));
      return FALSE;
    }
  cw_sm_perceive_aromatic_rings (g);
  return TRUE;
}

static guint64
fragment_hash (CwSmGraph *g, guint8 *mask)
{
  memset (mask, 1, g->n_atoms);
  return cw_sm_fragment_hash (g, 0, mask, 1);
}

/* Does "C" + text (or text + "C" when reverse) hold the rooted fragment of hash `want`, bonded to
 * that extra carbon by its root? Checks the writer's strings before they are used. */
static gboolean
fragment_string_ok (const char *text, gboolean reverse, guint64 want)
{
  g_autofree CwSmGraph *g = g_new (CwSmGraph, 1);
  g_autofree char      *full = reverse ? g_strconcat (text, "C", NULL) : g_strconcat ("C", text, NULL);
  guint8                mask[CW_SM_MAX_ATOMS];
  int                   extra, root;

  g->frag_cache = NULL;
  if (!cw_sm_parse (g, full, strlen (full), FALSE, NULL) || g->n_dots > 0)
    return FALSE;
  cw_sm_perceive_aromatic_rings (g);
  extra = reverse ? g->n_atoms - 1 : 0;
  if (g->atoms[extra].degree != 1)
    return FALSE;
  root = g->atoms[extra].nb[0];
  memset (mask, 1, g->n_atoms);
  mask[extra] = 0;
  return cw_sm_fragment_hash (g, root, mask, 1) == want;
}

/* The fragment written from its root (fwd) and towards it (rev), ring digits from first_digit.
 * A string that does not read back as the fragment is dropped (NULL): the writer then puts the
 * ring carbon first. */
static void
fragment_strings (CwSmGraph *g, guint8 *mask, int first_digit, char **fwd, char **rev)
{
  GString *s = g_string_new (NULL);
  guint64  want;

  memset (mask, 1, g->n_atoms);
  want = cw_sm_fragment_hash (g, 0, mask, 1);
  cw_sm_fragment_write (g, 0, mask, 1, FALSE, first_digit, s);
  *fwd = g_strdup (s->str);
  g_string_truncate (s, 0);
  cw_sm_fragment_write (g, 0, mask, 1, TRUE, first_digit, s);
  *rev = g_string_free (s, FALSE);
  if (!fragment_string_ok (*fwd, FALSE, want))
    g_clear_pointer (fwd, g_free);
  if (!fragment_string_ok (*rev, TRUE, want))
    g_clear_pointer (rev, g_free);
}

CwSmIndex *
cw_sm_index_new (const CwGroupTable *table)
{
  CwSmIndex *index = g_new0 (CwSmIndex, 1);
  CwSmGraph *g = g_new (CwSmGraph, 1);
  guint8     mask[CW_SM_MAX_ATOMS];

  index->table = table;
  index->n_groups = cw_group_table_get_n_groups (table);
  index->groups = g_new0 (const CwGroup *, index->n_groups);
  index->fwd = g_new0 (char *, index->n_groups);
  index->rev = g_new0 (char *, index->n_groups);
  index->fwd_len = g_new0 (guint8, index->n_groups);
  index->rev_len = g_new0 (guint8, index->n_groups);
  index->ring_inside = g_new0 (guint8, index->n_groups);
  index->problems = g_string_new (NULL);
  for (int k = 0; k < CW_SM_INDEX_SLOTS; k++)
    index->slot_group[k] = -1;
  for (guint i = 0; i < index->n_groups; i++)
    {
      const CwGroup *group = cw_group_table_get (table, i);
      g_autoptr (GError) error = NULL;
      guint64 h;
      guint   slot;

      index->groups[i] = group;
      if (!parse_fragment (g, group->smiles, &error))
        {
          g_string_append_printf (index->problems, _("group “%s”: %s\n"), group->id, error->message);
          continue;
        }
      for (int c = 0; c < g->n_closures; c++)
        if (!g->atoms[g->closures[c].a].aromatic || !g->atoms[g->closures[c].b].aromatic)
          index->ring_inside[i] = CW_SM_RING_OTHER;
      if (index->ring_inside[i] && g->n_atoms == 6 && g->n_closures == 1)
        {
          /* a plain cyclohexyl: six saturated carbons in one ring, nothing else */
          gboolean plain = TRUE;
          for (int a = 0; a < 6 && plain; a++)
            {
              const CwSmAtom *x = &g->atoms[a];
              plain = x->element == 6 && !x->aromatic && x->charge == 0 && x->isotope == 0 && x->degree == 2;
              for (int k = 0; k < x->degree && plain; k++)
                plain = x->bond[k] == CW_SM_BOND_SINGLE;
            }
          if (plain)
            index->ring_inside[i] = CW_SM_RING_CYCLOHEXYL;
        }
      fragment_strings (g, mask, 2, &index->fwd[i], &index->rev[i]);
      index->fwd[i] = cw_sm_pad_text (index->fwd[i]);
      index->rev[i] = cw_sm_pad_text (index->rev[i]);
      if (index->fwd[i] && strlen (index->fwd[i]) < 256)
        index->fwd_len[i] = strlen (index->fwd[i]);
      if (index->rev[i] && strlen (index->rev[i]) < 256)
        index->rev_len[i] = strlen (index->rev[i]);
      if (index->fwd[i] == NULL)
        g_string_append_printf (index->problems, _("group “%s”: its fragment cannot be written back\n"), group->id);
      h = fragment_hash (g, mask);
      for (slot = h & (CW_SM_INDEX_SLOTS - 1); index->slot_group[slot] >= 0; slot = (slot + 1) & (CW_SM_INDEX_SLOTS - 1))
        if (index->slot_hash[slot] == h)
          break;
      if (index->slot_group[slot] >= 0)
        {
          g_string_append_printf (index->problems, _("groups “%s” and “%s” have the same fragment; “%s” is used\n"),
                                                      index->groups[index->slot_group[slot]]->id, group->id,
                                                      index->groups[index->slot_group[slot]]->id);
          continue;
        }
      index->slot_hash[slot] = h;
      index->slot_group[slot] = i;
    }
  g_free (g);
  return index;
}

void
cw_sm_index_free (CwSmIndex *index)
{
  if (index == NULL)
    return;
  for (guint i = 0; i < index->n_groups; i++)
    {
      g_free (index->fwd[i]);
      g_free (index->rev[i]);
    }
  g_free (index->fwd);
  g_free (index->rev);
  g_free (index->fwd_len);
  g_free (index->rev_len);
  g_free (index->ring_inside);
  g_free (index->groups);
  g_string_free (index->problems, TRUE);
  g_free (index);
}

const CwGroup *
cw_sm_index_lookup (const CwSmIndex *index, guint64 hash)
{
  for (guint slot = hash & (CW_SM_INDEX_SLOTS - 1); index->slot_group[slot] >= 0; slot = (slot + 1) & (CW_SM_INDEX_SLOTS - 1))
    if (index->slot_hash[slot] == hash)
      return index->groups[index->slot_group[slot]];
  return NULL;
}

void
cw_sm_group_strings (const CwGroup *group, const CwSmIndex *index, char **fwd, char **rev, gboolean *owned)
{
  CwSmGraph *g;
  guint8     mask[CW_SM_MAX_ATOMS];

  if (index && group->index >= 0 && (guint) group->index < index->n_groups &&
      index->groups[group->index] == group && index->fwd[group->index])
    {
      *fwd = index->fwd[group->index];
      *rev = index->rev[group->index];
      *owned = FALSE;
      return;
    }
  *owned = TRUE;
  *fwd = *rev = NULL;
  g = g_new (CwSmGraph, 1);
  g->frag_cache = NULL;
  if (parse_fragment (g, group->smiles, NULL))
    fragment_strings (g, mask, 2, fwd, rev);
  g_free (g);
  if (*fwd == NULL)
    {
      /* no usable fragment: a wildcard atom stands for the group */
      g_free (*rev);
      *fwd = g_strdup ("*");
      *rev = g_strdup ("*");
    }
  *fwd = cw_sm_pad_text (*fwd);
  *rev = cw_sm_pad_text (*rev);
}

char *
cw_sm_pad_text (char *text)
{
  gsize n;

  if (text == NULL)
    return NULL;
  n = strlen (text) + 1;
  text = g_realloc (text, n + CW_SM_TEXT_PAD);
  memset (text + n, 0, CW_SM_TEXT_PAD);
  return text;
}

/* ---- the reader ---- */

CwSmilesReader *
cw_smiles_reader_new (const CwGroupTable *table)
{
  CwSmilesReader *reader;

  g_return_val_if_fail (table != NULL, NULL);
  reader = g_new0 (CwSmilesReader, 1);
  reader->index = cw_sm_index_new (table);
  reader->graph.frag_cache = g_new0 (CwSmFragCacheEntry, CW_SM_FRAG_CACHE);
  return reader;
}

void
cw_smiles_reader_free (CwSmilesReader *reader)
{
  if (reader == NULL)
    return;
  cw_sm_index_free (reader->index);
  g_free (reader->graph.frag_cache);
  g_free (reader);
}

const char *
cw_smiles_reader_get_problems (CwSmilesReader *reader)
{
  return reader->index->problems->str;
}

int
cw_smiles_reader_read (CwSmilesReader *reader, const char *smiles, gssize len, CwMolecule *out, int max_out, CwSmilesInfo *info, GString *notes, GError **error)
{
  CwSmilesInfo local;

  g_return_val_if_fail (reader != NULL && smiles != NULL, -1);
  if (info == NULL)
    info = &local;
  if (len < 0)
    len = strlen (smiles);
  if (len > 60000)
    {
      info->error_pos = 0;
      g_set_error_literal (error, CW_CORE_ERROR, CW_CORE_ERROR_UNSUPPORTED, _("the SMILES is too long"));
      return -1;
    }
  return cw_sm_read (reader->index, &reader->graph, reader->mask, smiles, len, out, max_out, info, notes, error);
}

void
cw_smiles_reader_write (CwSmilesReader *reader, const CwMolecule *mol, GString *out)
{
  cw_sm_write_molecule (mol, reader ? reader->index : NULL, out);
}

void
cw_sm_reader_write_canonical (CwSmilesReader *reader, const CwMolecule *mol, GString *out)
{
  cw_sm_write_canonical (mol, reader->index, out);
}

int
cw_sm_reader_read_detail (CwSmilesReader *reader, const char *text, CwSmDetail *detail, GError **error)
{
  return cw_sm_read_detail (reader->index, &reader->graph, reader->mask, text, strlen (text), detail, error);
}

const CwGroup *
cw_smiles_reader_match_fragment (CwSmilesReader *reader, const char *fragment, GError **error)
{
  const CwGroup *group;

  if (!parse_fragment (&reader->graph, fragment, error))
    return NULL;
  group = cw_sm_index_lookup (reader->index, fragment_hash (&reader->graph, reader->mask));
  if (group == NULL)
    g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_UNKNOWN_GROUP, _("no group in the table matches “%s”"), fragment);
  return group;
}

char *
cw_smiles_dup_group_fragment (const CwGroup *group)
{
  CwSmGraph *g = g_new (CwSmGraph, 1);
  guint8     mask[CW_SM_MAX_ATOMS];
  char      *fwd = NULL, *rev = NULL;

  if (parse_fragment (g, group->smiles, NULL))
    {
      fragment_strings (g, mask, 1, &fwd, &rev);
      g_free (rev);
    }
  g_free (g);
  return fwd ? fwd : g_strdup ("*");
}

/* ---- the simple API ---- */

GPtrArray *
cw_smiles_read (const char *smiles, const CwGroupTable *table, GString *notes, GError **error)
{
  g_autoptr (CwSmilesReader) reader = NULL;
  g_autofree CwMolecule *mols = NULL;
  CwSmilesInfo           info;
  GPtrArray             *result;
  const char            *start, *end;
  int                    n;

  g_return_val_if_fail (smiles != NULL && table != NULL, NULL);
  start = smiles;
  while (g_ascii_isspace (*start))
    start++;
  for (end = start; *end && !g_ascii_isspace (*end); end++)
    ;
  if (notes)
    {
      const char *rest = end;
      while (g_ascii_isspace (*rest))
        rest++;
      if (*rest)
        {
          g_autofree char *shown = cw_sm_valid_text (rest, 0, strlen (rest));
          g_string_append_printf (notes, _("Text after the SMILES was ignored: “%s”.\n"), shown);
        }
    }
  reader = cw_smiles_reader_new (table);
  mols = g_new (CwMolecule, READ_MAX);
  n = cw_smiles_reader_read (reader, start, end - start, mols, READ_MAX, &info, notes, error);
  if (n < 0)
    return NULL;
  result = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_molecule_free);
  for (int i = 0; i < n; i++)
    {
      CwMolecule *m = cw_molecule_new ();
      for (int k = 0; k < mols[i].n_subs; k++)
        {
          const CwSubstituent *s = &mols[i].subs[k];
          if (!cw_molecule_set (m, s->position, s->face, s->group, error))
            {
              cw_molecule_free (m);
              g_ptr_array_unref (result);
              return NULL;
            }
        }
      g_ptr_array_add (result, m);
    }
  return result;
}

char *
cw_smiles_write (const CwMolecule *mol)
{
  GString *s = g_string_new (NULL);

  g_return_val_if_fail (mol != NULL, NULL);
  cw_sm_write_molecule (mol, NULL, s);
  return g_string_free (s, FALSE);
}

void
cw_sm_reader_set_general_only (CwSmilesReader *reader, gboolean general_only)
{
  reader->graph.general_only = general_only;
}

guint64
cw_sm_reader_get_n_fast (CwSmilesReader *reader)
{
  return reader->graph.n_fast;
}
