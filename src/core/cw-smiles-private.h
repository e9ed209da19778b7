#pragma once

#include <glib.h>
#include <string.h>

#include "cw-molecule.h"

G_BEGIN_DECLS

/* Internal molecular graph of the SMILES reader and writer: one flat array of atoms, each with its
 * neighbours in the order they were written (the order @/@@ refers to). Shared by cw-smiles-*.c,
 * cw-isomers.c and cw-batch.c; no other layer includes this header. */

#define CW_SM_MAX_ATOMS 256
#define CW_SM_MAX_NB 8
#define CW_SM_MAX_CYCLES 32
#define CW_SM_HYDROGEN (-2) /* an implicit hydrogen in a written neighbour order */

typedef enum
{
  CW_SM_BOND_SINGLE = 1,
  CW_SM_BOND_DOUBLE = 2,
  CW_SM_BOND_TRIPLE = 3,
  CW_SM_BOND_QUAD = 4,
  CW_SM_BOND_AROMATIC = 5
} CwSmBond;

typedef enum
{
  CW_SM_CHIRAL_NONE = 0,
  CW_SM_CHIRAL_ANTICLOCKWISE = 1, /* @ */
  CW_SM_CHIRAL_CLOCKWISE = 2      /* @@ */
} CwSmChirality;

typedef struct
{
  guint8  element; /* atomic number; 0 for '*' */
  guint8  aromatic;
  guint8  bracket;
  guint8  chirality;
  gint8   charge;
  gint8   hcount; /* hydrogens written in brackets, or computed for the organic subset */
  gint8   h_slot; /* where an implicit H stands in the written order; -1 when none */
  guint8  degree;
  guint16 isotope;
  gint16  parent; /* atom it was bonded to by a chain or branch bond; -1 for a first atom */
  guint16 pos;    /* offset of the atom in the text */
  guint16 len;    /* length of its token */
  gint16  nb[CW_SM_MAX_NB];
  guint8  bond[CW_SM_MAX_NB];
} CwSmAtom;

typedef struct
{
  gint16  a, b; /* a opened the ring bond, b closed it */
  guint16 pos;  /* offset of the closing digit */
} CwSmClosure;

/* Fragment text -> group, for fragments written as one stretch of text (the usual case):
 * the same stretch with the same root is the same rooted fragment. */
#define CW_SM_FRAG_CACHE 512
#define CW_SM_FRAG_TEXT 40
typedef struct
{
  guint64     key;
  const void *group; /* const CwGroup* */
  guint8      len;
  guint8      root_off;
  char        text[CW_SM_FRAG_TEXT];
} CwSmFragCacheEntry;

/* The cache key of text[lo, hi) with the root atom at root_off, its slot, and whether an
 * entry holds exactly that stretch; the general reader fills the cache and its fast path
 * (cw-smiles-fast.c) reads it, so both must compute the same key. */
static inline guint64
cw_sm_frag_key (const char *text, int lo, int hi, int root_off)
{
  guint64 key = 0xcbf29ce484222325ull ^ (guint64) root_off ^ (guint64) (hi - lo) << 32, w;
  int     i = lo;

  /* eight bytes a step, the last few one by one */
  for (; i + 8 <= hi; i += 8)
    {
      memcpy (&w, text + i, 8);
      key = (key ^ w) * 0x9e3779b97f4a7c15ull;
      key ^= key >> 29;
    }
  if (hi >= 8)
    {
      /* the last hi - i (0..7) bytes, first one highest: the eight bytes ending at hi, byte
       * order reversed, masked (the same value as the loop below, without its branches) */
      memcpy (&w, text + hi - 8, 8);
      w = GUINT64_FROM_BE (w) & ((G_GUINT64_CONSTANT (1) << (8 * (hi - i))) - 1);
    }
  else
    for (w = 0; i < hi; i++)
      w = w << 8 | (guchar) text[i];
  key = (key ^ w) * 0x9e3779b97f4a7c15ull;
  return key ^ (key >> 32);
}

/* Sets of CW_SM_FRAG_WAYS entries, chosen by the high bits of the key times a large odd
 * number (short texts' keys differ little in their low bits). */
#define CW_SM_FRAG_WAYS 4
static inline CwSmFragCacheEntry *
cw_sm_frag_set (CwSmFragCacheEntry *cache, guint64 key)
{
  G_STATIC_ASSERT (CW_SM_FRAG_CACHE / CW_SM_FRAG_WAYS == 128);
  return &cache[((key * 0x9e3779b97f4a7c15ull) >> 57) * CW_SM_FRAG_WAYS];
}

static inline gboolean
cw_sm_frag_entry_is (const CwSmFragCacheEntry *e, guint64 key, const char *text, int lo, int hi, int root_off)
{
  return e->key == key && e->len == hi - lo && e->root_off == root_off && memcmp (e->text, text + lo, hi - lo) == 0;
}

/* The entry for text[lo, hi) rooted at root_off, or NULL. */
static inline CwSmFragCacheEntry *
cw_sm_frag_find (CwSmFragCacheEntry *cache, guint64 key, const char *text, int lo, int hi, int root_off)
{
  CwSmFragCacheEntry *set = cw_sm_frag_set (cache, key);
  for (int w = 0; w < CW_SM_FRAG_WAYS; w++)
    if (cw_sm_frag_entry_is (&set[w], key, text, lo, hi, root_off))
      return &set[w];
  return NULL;
}

/* A fresh entry for key, first in its set: the others move one place down and the oldest
 * leaves. */
static inline CwSmFragCacheEntry *
cw_sm_frag_insert (CwSmFragCacheEntry *cache, guint64 key)
{
  CwSmFragCacheEntry *set = cw_sm_frag_set (cache, key);
  memmove (&set[1], &set[0], sizeof (CwSmFragCacheEntry) * (CW_SM_FRAG_WAYS - 1));
  return &set[0];
}

typedef struct
{
  CwSmAtom            atoms[CW_SM_MAX_ATOMS];
  int                 n_atoms;
  CwSmClosure         closures[CW_SM_MAX_CYCLES];
  int                 n_closures;
  int                 n_dots;
  const char         *text; /* borrowed, for messages */
  int                 text_len;
  gboolean            fragment;   /* parsing a group fragment: the first atom has one more bond (to the ring) */
  int                 error_pos;  /* offset named by the last error, -1 */
  CwSmFragCacheEntry *frag_cache; /* CW_SM_FRAG_CACHE entries, or NULL */
  gboolean            general_only; /* tests: never take the fast path */
  guint64             n_fast;       /* readings done by the fast path */
} CwSmGraph;

/* cw-smiles-parse.c */
gboolean    cw_sm_parse (CwSmGraph *g, const char *text, int len, gboolean fragment, GError **error);
int         cw_sm_atom_valence (const CwSmGraph *g, int atom); /* sum of bond orders, aromatic = 1 */
gboolean    cw_sm_is_hydrogen (const CwSmGraph *g, int atom);  /* a plain [H] atom */
int         cw_sm_total_h (const CwSmGraph *g, int atom);      /* hcount + [H] neighbours */
const char *cw_sm_element_symbol (int z);
/* The character at text[i] for a message: ‘c’, the UTF-8 character, or "byte 0xNN". */
char *cw_sm_describe_char (const char *text, int len, int i);
/* text[from, to) as valid UTF-8 for a message: control bytes '?', invalid sequences U+FFFD. */
char *cw_sm_valid_text (const char *text, int from, int to);
void  cw_sm_perceive_aromatic_rings (CwSmGraph *g);
void  cw_sm_set_error (GError **error, int code, const CwSmGraph *g, int pos, const char *format, ...)
  G_GNUC_PRINTF (5, 6);

/* cw-smiles-frag.c: rooted fragments. mask[atom] == mark selects the fragment's atoms. */
guint64 cw_sm_fragment_hash (const CwSmGraph *g, int root, const guint8 *mask, guint8 mark);
/* Writes the fragment as SMILES starting at root (or ending at root when reverse). */
void cw_sm_fragment_write (const CwSmGraph *g, int root, const guint8 *mask, guint8 mark, gboolean reverse, int first_digit, GString *out);

/* cw-smiles-canon.c: ring numberings. A transform maps position p (1..6) of the result to position
 * start + dir * (p - 1) of the source; dir = -1 also swaps the faces (turning the ring over keeps
 * the molecule itself; a face swap alone would give its mirror image). */
typedef struct
{
  int      start; /* 1..6 */
  int      dir;   /* +1 or -1 */
  gboolean flip;  /* swap up and down */
} CwRingTransform;

/* The numbering every reader and writer uses: lowest locants, then group order, then faces.
 * mirror: also allow the face swap alone (relative configuration: enantiomers count as one). */
void cw_sm_canonical_transform (const CwMolecule *mol, gboolean mirror, CwRingTransform *out);
void cw_sm_apply_transform (const CwMolecule *in, const CwRingTransform *t, CwMolecule *out);
/* Renumbers mol canonically in place (custom_groups untouched). */
void cw_sm_canonicalize (CwMolecule *mol, gboolean mirror);
/* Writes a key of the molecule under t into key[CW_SM_KEY_LEN]; equal keys mean equal molecules. */
#define CW_SM_KEY_LEN 13
void cw_sm_molecule_key (const CwMolecule *mol, const CwRingTransform *t, gint64 key[CW_SM_KEY_LEN]);
/* Order of groups in canonical keys: table order, custom groups after the table. */
static inline gint64
cw_sm_group_rank (const CwGroup *g)
{
  if (g == NULL)
    return G_GINT64_CONSTANT (1) << 40;
  if (g->index >= 0 && !g->custom)
    return g->index;
  return 100000 + (g->id ? g_str_hash (g->id) % 1000000 : 0);
}
/* Parity of an ordering of four neighbours (symbols 0..3, two bits each, the first lowest):
 * 0 when the four are not all different, 1 odd, 2 even. A copy per file (static): the core is
 * linked into both chairwise-calc and its drawing module, and one exported table in both would
 * be two definitions of one object. */
static const guint8 cw_sm_permutation_parity[256] G_GNUC_UNUSED = {
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 2, 0, 0, 1, 0,
  0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 2, 0, 0, 0, 0, 0, 0, 0, 0, 2, 0, 0, 1, 0, 0, 0, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 2, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
  0, 0, 0, 2, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 2, 0, 0, 0, 0, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 0, 2, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 2, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 2, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 1, 0, 0, 2, 0, 0, 0, 0, 0, 0, 0, 0, 2, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0,
  0, 1, 0, 0, 2, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
};
/* The source position of result position p (1..6), and whether faces are swapped. */
int      cw_sm_transform_source (const CwRingTransform *t, int p);
gboolean cw_sm_transform_swaps (const CwRingTransform *t);
/* Appends what cw_molecule_dup_configuration returns, without allocating. */
void cw_sm_append_configuration (const CwMolecule *mol, GString *out);
/* Stereo-relevant carbons: one group and an H, or two different groups. */
int cw_sm_relevant_carbons (const CwMolecule *mol, gboolean relevant[CW_RING_SIZE + 1]);
/* The chair species of a relative configuration, counted as cw-isomers.h explains. */

/* The group table read as fragments (cw-smiles.c): rooted hash -> group, and each group's
 * fragment written from its attachment atom (fwd) and towards it (rev), ring digits from 2. */
#define CW_SM_INDEX_SLOTS 1024
#define CW_SM_RING_CYCLOHEXYL 1 /* the fragment is a plain cyclohexyl */
#define CW_SM_RING_OTHER 2
typedef struct
{
  const CwGroupTable *table;
  guint               n_groups;
  const CwGroup     **groups;
  char              **fwd;
  char              **rev;
  guint8             *fwd_len, *rev_len; /* strlen of fwd/rev (0 when NULL or longer than 255) */
  guint8             *ring_inside;       /* CW_SM_RING_*: a ring in the group's fragment that is not aromatic */
  guint64             slot_hash[CW_SM_INDEX_SLOTS];
  gint16              slot_group[CW_SM_INDEX_SLOTS];
  GString            *problems; /* groups whose fragment could not be read, one per line */
} CwSmIndex;

CwSmIndex     *cw_sm_index_new (const CwGroupTable *table);
void           cw_sm_index_free (CwSmIndex *index);
const CwGroup *cw_sm_index_lookup (const CwSmIndex *index, guint64 hash);
/* Texts the SMILES writer copies CW_SM_TEXT_PAD bytes at a time: cw_sm_pad_text reallocates a
 * string (or NULL) with that many zero bytes after its end. */
#define CW_SM_TEXT_PAD 16
char *cw_sm_pad_text (char *text);
/* fwd/rev strings of any group: from the index when it holds the group, else computed (both
 * padded as cw_sm_pad_text does). */
void cw_sm_group_strings (const CwGroup *group, const CwSmIndex *index, char **fwd, char **rev, gboolean *owned);

typedef struct _CwSmilesInfo   CwSmilesInfo;
typedef struct _CwSmilesReader CwSmilesReader;

/* cw-smiles-read.c: the whole reading; returns the number of molecules or -1 (error set). */
int cw_sm_read (const CwSmIndex *index, CwSmGraph *g, guint8 *mask, const char *text, int len, CwMolecule *out, int max_out, CwSmilesInfo *info, GString *notes, GError **error);

/* The raw reading, for tests: graph atom indices (text order) of the ring and of each group's
 * first atom, and each group's face relative to the ring as read (-1 when not written). */
typedef struct
{
  int            ring_atom[CW_RING_SIZE];
  int            root_atom[CW_MAX_SUBS];
  int            ring_index[CW_MAX_SUBS];
  int            face[CW_MAX_SUBS];
  const CwGroup *group[CW_MAX_SUBS];
} CwSmDetail;
int cw_sm_read_detail (const CwSmIndex *index, CwSmGraph *g, guint8 *mask, const char *text, int len, CwSmDetail *detail, GError **error);
int cw_sm_reader_read_detail (CwSmilesReader *reader, const char *text, CwSmDetail *detail, GError **error);

/* cw-smiles-write.c: canonical isomeric SMILES of a molecule (index may be NULL). */
void cw_sm_write_molecule (const CwMolecule *mol, const CwSmIndex *index, GString *out);
/* The same for a molecule already numbered canonically (as the reader returns them). */
void cw_sm_write_canonical (const CwMolecule *mol, const CwSmIndex *index, GString *out);
void cw_sm_reader_write_canonical (CwSmilesReader *reader, const CwMolecule *mol, GString *out);
/* Tests: read everything the general way (general_only), and count the fast path's readings. */
void    cw_sm_reader_set_general_only (CwSmilesReader *reader, gboolean general_only);
guint64 cw_sm_reader_get_n_fast (CwSmilesReader *reader);

G_END_DECLS
