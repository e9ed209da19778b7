/* cw-batch.c: streaming batch analysis of SMILES lines (see cw-batch.h).
 *
 * Fixed-size buffers throughout: the input is read in 1 MiB blocks, the output collected in a
 * 256 KiB buffer, and results are remembered in a fixed direct-mapped cache keyed by the
 * canonical molecule, so memory stays flat however long the input is. Numbers are formatted by
 * hand (fixed decimals, halves rounded up), which is several times faster than printf. */
#include "config.h"

#include "cw-batch.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>
#include <unistd.h>

#include "cw-core-error.h"
#include "cw-smiles-private.h"
#include "cw-smiles.h"
#include "cw-strbuf.h"

#define IN_SIZE (1 << 20)
#define OUT_SIZE (1 << 18)
#define CACHE_SLOTS 4096
#define CACHE_TEXT 400
#define MAX_MOLS 64
#define MAX_FIELDS 64

typedef struct
{
  gint64  key[CW_SM_KEY_LEN];
  guint16 len; /* 0: empty */
  char    text[CACHE_TEXT];
} CacheEntry;

/* The tags are checked first: a small array that stays in the processor cache, so a miss
 * (the usual case for a file of distinct compounds) costs no trip to memory. */

typedef struct
{
  const CwData         *data;
  const CwBatchOptions *opt;
  CwConditions          cond;
  CwSmilesReader       *reader;
  FILE                 *out;
  FILE                 *err;
  char                 *obuf;
  gsize                 olen;
  gboolean              write_failed;
  CwMolecule            mols[MAX_MOLS];
  CwAnalysis            an;
  GString              *scratch;
  GString              *notes;
  CacheEntry           *cache;
  guint64              *tags;
  const char           *flag_name[CW_N_FLAGS];
  guint8                flag_len[CW_N_FLAGS];
  CwBatchSummary       *sum;
  gboolean              csv;
  int                   smiles_col, id_col;
  gboolean              first_row;
  gint64                last_progress;
} Batch;

/* ---- output ---- */

static void
flush_out (Batch *b)
{
  if (b->olen && fwrite (b->obuf, 1, b->olen, b->out) != b->olen)
    b->write_failed = TRUE;
  b->olen = 0;
}

static inline void
put (Batch *b, const char *s, gsize n)
{
  if (b->olen + n > OUT_SIZE)
    {
      flush_out (b);
      if (n > OUT_SIZE)
        {
          if (fwrite (s, 1, n, b->out) != n)
            b->write_failed = TRUE;
          return;
        }
    }
  memcpy (b->obuf + b->olen, s, n);
  b->olen += n;
}

static inline void
puts_ (Batch *b, const char *s)
{
  put (b, s, strlen (s));
}

/* Digit pairs "00".."99": two digits a step. */
static const char digit_pairs[201] = "00010203040506070809101112131415161718192021222324252627282930313233343536373839"
                                     "40414243444546474849505152535455565758596061626364656667686970717273747576777879"
                                     "8081828384858687888990919293949596979899";

/* An unsigned integer (a line number, the integer part of a fixed-point number). */
static inline int
fmt_uint (char *buf, guint64 v)
{
  char tmp[24];
  int  t = sizeof tmp;

  while (v >= 100)
    {
      guint64 q = v / 100;
      t -= 2;
      memcpy (tmp + t, digit_pairs + 2 * (v - q * 100), 2);
      v = q;
    }
  if (v >= 10)
    t -= 2, memcpy (tmp + t, digit_pairs + 2 * v, 2);
  else
    tmp[--t] = '0' + v;
  memcpy (buf, tmp + t, sizeof tmp - t);
  buf[sizeof tmp - t] = '\0';
  return sizeof tmp - t;
}

/* Fixed-point with `decimals` digits (0..6), halves rounded away from zero; printf for huge or
 * odd values. Inlined, so that each call's constant `decimals` turns the divisions into
 * multiplications. */
static inline G_ALWAYS_INLINE int
fmt_fixed (char *buf, double x, int decimals)
{
  static const double  scale[] = { 1, 10, 100, 1000, 10000, 100000, 1000000 };
  static const guint64 iscale[] = { 1, 10, 100, 1000, 10000, 100000, 1000000 };
  guint64              v, ip, fp;
  int                  n = 0;

  if (!isfinite (x) || fabs (x) >= 1e12)
    return g_snprintf (buf, 32, "%.*g", decimals + 3, x);
  v = (guint64) ((x < 0 ? -x : x) * scale[decimals] + 0.5);
  if (x < 0 && v != 0)
    buf[n++] = '-';
  ip = v / iscale[decimals];
  fp = v - ip * iscale[decimals];
  /* integer part */
  if (ip < 10)
    buf[n++] = '0' + ip;
  else
    n += fmt_uint (buf + n, ip);
  if (decimals)
    {
      int d = decimals;
      buf[n++] = '.';
      /* fraction: right to left, two digits a step */
      while (d >= 2)
        {
          guint64 q = fp / 100;
          d -= 2;
          memcpy (buf + n + d, digit_pairs + 2 * (fp - q * 100), 2);
          fp = q;
        }
      if (d)
        buf[n] = '0' + fp;
      n += decimals;
    }
  buf[n] = '\0';
  return n;
}

/* Four significant digits: fixed between 1e-3 and 1e6, else d.ddde±N. */
static int
fmt_sig (char *buf, double x)
{
  int e, n;

  static const double p10[] = { 1e-3, 1e-2, 1e-1, 1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6 };

  if (!isfinite (x) || x <= 0)
    return g_snprintf (buf, 32, "%g", x);
  if (x >= 1e-3 && x < 1e6)
    {
      /* the decade by comparison (the usual case), not by a logarithm; summed, not looped */
      e = -3;
      for (int k = 1; k < (int) G_N_ELEMENTS (p10); k++)
        e += x >= p10[k];
      return fmt_fixed (buf, x, MAX (0, 3 - e));
    }
  e = (int) floor (log10 (x));
  if (e >= -3 && e < 6)
    return fmt_fixed (buf, x, MAX (0, 3 - e));
  n = fmt_fixed (buf, x / pow (10, e), 3);
  if (buf[0] == '1' && buf[1] == '0' && buf[2] == '.')
    {
      /* rounding gave 10.000 */
      e++;
      n = fmt_fixed (buf, x / pow (10, e), 3);
    }
  return n + g_snprintf (buf + n, 16, "e%d", e);
}

static void
put_csv_field (Batch *b, const char *s, gsize n)
{
  gboolean quote = FALSE;

  for (gsize i = 0; i < n; i++)
    quote |= s[i] == ',' || s[i] == '"' || s[i] == '\n' || s[i] == '\r';
  if (!quote)
    {
      put (b, s, n);
      return;
    }
  put (b, "\"", 1);
  for (gsize i = 0; i < n; i++)
    {
      if (s[i] == '"')
        put (b, "\"", 1);
      put (b, s + i, 1);
    }
  put (b, "\"", 1);
}

static void
put_json_string (Batch *b, const char *s, gsize n)
{
  put (b, "\"", 1);
  for (gsize i = 0; i < n; i++)
    {
      unsigned char c = s[i];
      if (c == '"' || c == '\\')
        {
          put (b, "\\", 1);
          put (b, s + i, 1);
        }
      else if (c < 0x20)
        {
          char esc[8];
          g_snprintf (esc, sizeof esc, "\\u%04x", c);
          put (b, esc, 6);
        }
      else
        put (b, s + i, 1);
    }
  put (b, "\"", 1);
}

/* ---- one result ---- */

/* The part of a row that depends only on the molecule: SMILES … flags. */
static void
append_configuration (const CwMolecule *m, GString *s)
{
  gsize before = s->len;

  cw_sm_append_configuration (m, s);
  if (s->len == before && m->n_subs > 1)
    {
      /* only geminal pairs carry the relative configuration: name every slot instead, as
       * cw_molecule_dup_spec does ("1u=methyl 1d=hydroxy 4d=tert-butyl") */
      for (int i = 0; i < m->n_subs; i++)
        {
          if (i)
            cw_str_putc (s, ' ');
          cw_str_putc (s, '0' + m->subs[i].position);
          cw_str_putc (s, m->subs[i].face == CW_FACE_UP ? 'u' : 'd');
          cw_str_putc (s, '=');
          cw_str_puts (s, m->subs[i].group->id);
        }
    }
}

#define put_lit(q, lit) (memcpy ((q), (lit), sizeof (lit) - 1), (q) + sizeof (lit) - 1)

static inline char *
put_sep (char *q)
{
  *q++ = ',';
  return q;
}

/* The part of a row that depends only on the molecule: SMILES … flags. */
static void
format_result (Batch *b, const CwMolecule *m, const CwAnalysis *an, GString *s)
{
  char        num[256], *q = num;
  guint32     seen = 0;
  int         n_flags = 0;
  gboolean    json = b->opt->json;

  /* the numbers go into one local buffer and then into s in one piece */
  q += fmt_fixed (q, an->delta_g, 3);
  q = json ? put_lit (q, ",\"sigma\":") : put_sep (q);
  q += fmt_fixed (q, an->sigma, 3);
  q = json ? put_lit (q, ",\"K\":") : put_sep (q);
  q += fmt_sig (q, an->K);
  q = json ? put_lit (q, ",\"populations\":[") : put_sep (q);
  q += fmt_fixed (q, an->pop[0], 4);
  *q++ = ',';
  q += fmt_fixed (q, an->pop[1], 4);
  q = json ? put_lit (q, "],\"major_interval\":[") : put_sep (q);
  q += fmt_fixed (q, an->pop_low[an->major], 4);
  *q++ = ',';
  q += fmt_fixed (q, an->pop_high[an->major], 4);
  q = json ? put_lit (q, "],\"flags\":[") : put_sep (q);
  if (json)
    {
      cw_str_puts (s, "\"smiles\":\"");
      cw_sm_reader_write_canonical (b->reader, m, s);
      cw_str_puts (s, "\",\"configuration\":\"");
      append_configuration (m, s);
      cw_str_puts (s, an->major ? "\",\"major_chair\":2,\"delta_g\":" : "\",\"major_chair\":1,\"delta_g\":");
    }
  else
    {
      cw_sm_reader_write_canonical (b->reader, m, s);
      cw_str_putc (s, ',');
      append_configuration (m, s);
      cw_str_puts (s, an->major ? ",2," : ",1,");
    }
  cw_str_put (s, num, q - num);
  for (int k = 0; k < an->n_flags; k++)
    {
      CwFlagCode code = an->flags[k].code;
      if (seen & (1u << code))
        continue;
      seen |= 1u << code;
      if (n_flags)
        cw_str_putc (s, json ? ',' : ';');
      if (json)
        cw_str_putc (s, '"');
      cw_str_put (s, b->flag_name[code], b->flag_len[code]);
      if (json)
        cw_str_putc (s, '"');
      n_flags++;
    }
}

/* The cache key of a molecule as the reader returns it (numbered canonically, its groups in
 * position and face order, so equal molecules have equal lists): the number of groups, then
 * each group's position, face and table index, two to a word. FALSE for a group outside the
 * table. */
static gboolean
molecule_key (const CwMolecule *m, gint64 key[CW_SM_KEY_LEN])
{
  G_STATIC_ASSERT (1 + (CW_MAX_SUBS + 1) / 2 <= CW_SM_KEY_LEN);
  for (int i = 0; i < CW_SM_KEY_LEN; i++) /* a fixed count of stores, no library call */
    key[i] = 0;
  key[0] = m->n_subs;
  for (int i = 0; i < m->n_subs; i++)
    {
      const CwGroup *g = m->subs[i].group;
      guint64        v;
      if (g->index < 0 || g->index > 0xffff || g->custom)
        return FALSE;
      v = ((guint64) m->subs[i].position << 1 | (m->subs[i].face == CW_FACE_UP)) << 16 | (guint64) g->index;
      key[1 + i / 2] |= (gint64) (v << (32 * (i % 2)));
    }
  return TRUE;
}

/* Over the words molecule_key uses (the rest are zero). */
static guint64
key_hash (const gint64 *key)
{
  guint64 h = 0x9e3779b97f4a7c15ull;
  for (int i = 0, n = 1 + (int) (key[0] + 1) / 2; i < n; i++)
    h = (h ^ (guint64) key[i]) * 0x100000001b3ull;
  return (h ^ (h >> 29)) | 1; /* 0 marks an empty tag */
}

/* The molecule-dependent text, from the cache or computed; NULL (error set) on failure. */
static const char *
result_text (Batch *b, const CwMolecule *m, gsize *len, GError **error)
{
  gint64      key[CW_SM_KEY_LEN];
  CacheEntry *e;
  guint64     h;
  guint       slot;

  if (!molecule_key (m, key))
    {
      /* a group outside the table: no caching */
      if (!cw_analyze_equilibrium (b->data, m, &b->cond, &b->an, error))
        return NULL;
      b->scratch->len = 0; /* g_string_truncate, without the call */
      b->scratch->str[0] = '\0';
      format_result (b, m, &b->an, b->scratch);
      *len = b->scratch->len;
      return b->scratch->str;
    }
  h = key_hash (key);
  slot = h & (CACHE_SLOTS - 1);
  e = &b->cache[slot];
  if (b->tags[slot] == h && memcmp (e->key, key, sizeof key) == 0)
    {
      *len = e->len;
      return e->text;
    }
  if (!cw_analyze_equilibrium (b->data, m, &b->cond, &b->an, error))
    return NULL;
  b->scratch->len = 0;
  b->scratch->str[0] = '\0';
  format_result (b, m, &b->an, b->scratch);
  if (b->scratch->len < CACHE_TEXT)
    {
      memcpy (e->key, key, sizeof key);
      memcpy (e->text, b->scratch->str, b->scratch->len);
      e->len = b->scratch->len;
      b->tags[slot] = h;
    }
  *len = b->scratch->len;
  return b->scratch->str;
}

/* ---- rows ---- */

static void
row_start (Batch *b, guint64 line, const char *id, gsize id_len)
{
  char buf[24];
  int  n = fmt_uint (buf, line);

  if (b->opt->json)
    {
      puts_ (b, b->first_row ? "\n    {\"line\":" : ",\n    {\"line\":");
      put (b, buf, n);
      puts_ (b, ",\"id\":");
      put_json_string (b, id, id_len);
      put (b, ",", 1);
    }
  else
    {
      put (b, buf, n);
      put (b, ",", 1);
      put_csv_field (b, id, id_len);
      put (b, ",", 1);
    }
  b->first_row = FALSE;
}

static void
error_row (Batch *b, guint64 line, const char *id, gsize id_len, const char *message)
{
  const char *nl = strchr (message, '\n');
  gsize       n = nl ? (gsize) (nl - message) : strlen (message);

  b->sum->errors++;
  if (b->err)
    fprintf (b->err, "%s: line %" G_GUINT64_FORMAT ": %s\n", b->opt->command, line, message);
  row_start (b, line, id, id_len);
  if (b->opt->json)
    {
      puts_ (b, "\"error\":");
      put_json_string (b, message, n);
      puts_ (b, "}");
    }
  else
    {
      puts_ (b, ",,,,,,,,,,,");
      put_csv_field (b, message, n);
      puts_ (b, "\n");
    }
}

static void
process_compound (Batch *b, guint64 line, const char *smiles, gsize len, const char *id, gsize id_len)
{
  g_autoptr (GError) error = NULL;
  CwSmilesInfo info;
  int          n;

  b->sum->compounds++;
  if (b->notes)
    g_string_truncate (b->notes, 0);
  n = cw_smiles_reader_read (b->reader, smiles, len, b->mols, MAX_MOLS, &info, NULL, &error);
  if (n < 0)
    {
      error_row (b, line, id, id_len, error->message);
      return;
    }
  b->sum->analysed++;
  b->sum->expanded += info.n_open > 0;
  b->sum->salts += info.n_dropped > 0;
  for (int i = 0; i < n; i++)
    {
      gsize       tlen;
      const char *text = result_text (b, &b->mols[i], &tlen, &error);
      if (text == NULL)
        {
          error_row (b, line, id, id_len, error->message);
          return;
        }
      row_start (b, line, id, id_len);
      put (b, text, tlen);
      if (b->opt->json)
        {
          if (info.n_open)
            puts_ (b, tlen && text[tlen - 1] == '[' ? "\"open-stereo\"" : ",\"open-stereo\"");
          if (info.n_dropped)
            puts_ (b, (tlen && text[tlen - 1] == '[' && !info.n_open) ? "\"largest-part\"" : ",\"largest-part\"");
          puts_ (b, "]}");
        }
      else
        {
          gboolean any = tlen && text[tlen - 1] != ',';
          if (info.n_open)
            puts_ (b, any ? ";open-stereo" : "open-stereo"), any = TRUE;
          if (info.n_dropped)
            puts_ (b, any ? ";largest-part" : "largest-part");
          puts_ (b, ",\n");
        }
      b->sum->rows++;
    }
}

/* ---- input ---- */

/* Splits a CSV line into fields (double quotes honoured, quotes kept out of the fields only
 * when the field is quoted as a whole). */
static int
split_csv (char *line, gsize len, char **field, gsize *flen)
{
  int   n = 0;
  gsize i = 0;

  while (n < MAX_FIELDS)
    {
      if (i < len && line[i] == '"')
        {
          gsize start = ++i, w = start;
          while (i < len)
            {
              if (line[i] == '"' && i + 1 < len && line[i + 1] == '"')
                line[w++] = '"', i += 2;
              else if (line[i] == '"')
                {
                  i++;
                  break;
                }
              else
                line[w++] = line[i++];
            }
          field[n] = line + start;
          flen[n++] = w - start;
          while (i < len && line[i] != ',')
            i++;
        }
      else
        {
          gsize start = i;
          while (i < len && line[i] != ',')
            i++;
          field[n] = line + start;
          flen[n++] = i - start;
        }
      if (i >= len)
        break;
      i++; /* the comma */
    }
  return n;
}

static void
trim (char **s, gsize *n)
{
  while (*n && g_ascii_isspace ((*s)[0]))
    (*s)++, (*n)--;
  while (*n && g_ascii_isspace ((*s)[*n - 1]))
    (*n)--;
}

static gboolean
is_header (char **field, gsize *flen, int n, Batch *b)
{
  b->smiles_col = -1;
  b->id_col = -1;
  for (int k = 0; k < n; k++)
    {
      char *f = field[k];
      gsize l = flen[k];
      trim (&f, &l);
      if (l == 6 && g_ascii_strncasecmp (f, "smiles", 6) == 0 && b->smiles_col < 0)
        b->smiles_col = k;
      else if (b->id_col < 0 && ((l == 2 && g_ascii_strncasecmp (f, "id", 2) == 0) ||
                                 (l == 4 && g_ascii_strncasecmp (f, "name", 4) == 0)))
        b->id_col = k;
    }
  if (b->smiles_col < 0)
    {
      b->smiles_col = 0;
      b->id_col = -1;
      return FALSE;
    }
  return TRUE;
}

static void
process_line (Batch *b, char *line, gsize len)
{
  guint64 no = ++b->sum->lines;
  char   *smiles = line, *id = "";
  gsize   slen = len, ilen = 0;

  if (len && line[len - 1] == '\r')
    len--, slen--;
  if (no == 1 && len >= 3 && (guchar) line[0] == 0xef && (guchar) line[1] == 0xbb && (guchar) line[2] == 0xbf)
    line += 3, len -= 3, smiles = line, slen = len; /* UTF-8 byte order mark */
  if (b->csv)
    {
      char *field[MAX_FIELDS];
      gsize flen[MAX_FIELDS];
      int   n = split_csv (line, len, field, flen);
      if (no == 1 && b->smiles_col == -2)
        {
          if (is_header (field, flen, n, b))
            return;
          b->id_col = n > 1 ? 1 : -1;
        }
      if (b->smiles_col >= n)
        {
          if (len)
            error_row (b, no, "", 0, _("no SMILES column on this line"));
          return;
        }
      smiles = field[b->smiles_col], slen = flen[b->smiles_col];
      if (b->id_col >= 0 && b->id_col < n)
        id = field[b->id_col], ilen = flen[b->id_col];
      trim (&id, &ilen);
    }
  else
    {
      gsize i = 0;
      for (;;)
        {
          /* SMILES characters are all above the space; stop at the first white space. Eight
           * bytes a step while none of them is at or below the space. */
          while (i + 8 <= len)
            {
              guint64 w, low;
              memcpy (&w, line + i, 8);
              w = GUINT64_FROM_LE (w);
              low = (w - 0x2121212121212121ull) & ~w & 0x8080808080808080ull;
              if (low != 0)
                {
                  /* the lowest flagged byte is exact (higher ones may be borrows) */
                  i += __builtin_ctzll (low) / 8;
                  goto found;
                }
              i += 8;
            }
          while (i < len && (guchar) line[i] > ' ')
            i++;
        found:
          if (i < len && !g_ascii_isspace (line[i]))
            {
              i++;
              continue;
            }
          break;
        }
      slen = i;
      id = line + i, ilen = len - i;
      trim (&id, &ilen);
    }
  trim (&smiles, &slen);
  if (b->csv && slen == 0 && (ilen > 0 || len > 0))
    {
      /* a CSV row with other fields filled but no SMILES is a mistake worth naming */
      gboolean blank = TRUE;
      for (gsize i = 0; i < len && blank; i++)
        blank = line[i] == ',' || g_ascii_isspace (line[i]);
      if (!blank)
        {
          b->sum->compounds++;
          error_row (b, no, id, ilen, _("the SMILES field is empty"));
        }
      return;
    }
  if (slen == 0 || smiles[0] == '#')
    return;
  process_compound (b, no, smiles, slen, id, ilen);
}

static void
progress (Batch *b, gboolean final)
{
  gint64 now;

  if (!b->opt->progress || b->err == NULL || !isatty (fileno (b->err)))
    return;
  now = g_get_monotonic_time ();
  if (final)
    {
      if (b->last_progress)
        fprintf (b->err, "\r\033[K");
      return;
    }
  if (now - b->last_progress < 500000)
    return;
  b->last_progress = now;
  {
    /* The numbers are formatted first: xgettext cannot see through G_GUINT64_FORMAT. */
    g_autofree char *lines = g_strdup_printf ("%" G_GUINT64_FORMAT, b->sum->lines);
    g_autofree char *errors = g_strdup_printf ("%" G_GUINT64_FORMAT, b->sum->errors);

    /* TRANSLATORS: progress: command, number of lines, number of errors */
    fputc ('\r', b->err);
    fprintf (b->err, _("%s: %s lines, %s errors…"), b->opt->command, lines, errors);
  }
  fflush (b->err);
}

static gboolean
detect_csv (Batch *b, const char *buf, gsize n)
{
  const char      *nl = memchr (buf, '\n', n);
  gsize            len = nl ? (gsize) (nl - buf) : n;
  g_autofree char *first = g_ascii_strdown (buf, len);

  return strstr (first, "smiles") != NULL && memchr (first, ',', len) != NULL;
}

static void
write_head (Batch *b)
{
  char buf[40];

  if (b->opt->json)
    {
      puts_ (b, "{\n  \"format\": \"chairwise-batch\",\n  \"version\": 1,\n  \"temperature_K\": ");
      put (b, buf, fmt_fixed (buf, b->cond.temperature, 2));
      puts_ (b, ",\n  \"solvent\": \"");
      puts_ (b, cw_solvent_to_string (b->cond.solvent));
      puts_ (b, "\",\n  \"energy_unit\": \"kcal/mol\",\n  \"caution\": ");
      put_json_string (b, cw_caution_text (), strlen (cw_caution_text ()));
      puts_ (b, ",\n  \"results\": [");
    }
  else
    puts_ (b, "line,id,smiles,configuration,major_chair,delta_g_kcal,sigma_kcal,K,x_chair1,x_chair2,"
              "x_major_low,x_major_high,flags,error\n");
}

static void
write_tail (Batch *b)
{
  if (!b->opt->json)
    return;
  g_string_printf (b->scratch,
                   "\n  ],\n  \"summary\": {\"lines\": %" G_GUINT64_FORMAT ", \"compounds\": %" G_GUINT64_FORMAT
                   ", \"analysed\": %" G_GUINT64_FORMAT ", \"rows\": %" G_GUINT64_FORMAT
                   ", \"errors\": %" G_GUINT64_FORMAT ", \"open_stereo\": %" G_GUINT64_FORMAT "}\n}\n",
                   b->sum->lines, b->sum->compounds, b->sum->analysed, b->sum->rows, b->sum->errors,
                   b->sum->expanded);
  puts_ (b, b->scratch->str);
}

void
cw_batch_options_init (CwBatchOptions *opt)
{
  memset (opt, 0, sizeof *opt);
  opt->temperature = 298.15;
  opt->solvent = CW_SOLVENT_APROTIC;
  opt->input = CW_BATCH_INPUT_AUTO;
  opt->command = "chairwise-calc batch";
}

gboolean
cw_batch_run (const CwData *data, FILE *in, FILE *out, FILE *err, const CwBatchOptions *opt, CwBatchSummary *summary, GError **error)
{
  Batch   *b = g_new0 (Batch, 1);
  char    *ibuf = g_malloc (IN_SIZE + 1);
  gsize    have = 0;
  gboolean eof = FALSE, ok = TRUE, skipping = FALSE;
  gint64   t0 = g_get_monotonic_time ();

  memset (summary, 0, sizeof *summary);
  b->data = data;
  b->opt = opt;
  b->cond.temperature = opt->temperature;
  b->cond.solvent = opt->solvent;
  b->reader = cw_smiles_reader_new (data->groups);
  b->out = out;
  b->err = err;
  b->obuf = g_malloc (OUT_SIZE);
  b->scratch = g_string_sized_new (512);
  b->cache = g_new (CacheEntry, CACHE_SLOTS);
  b->tags = g_new0 (guint64, CACHE_SLOTS);
  for (int k = 0; k < CW_N_FLAGS; k++)
    {
      b->flag_name[k] = cw_flag_code_to_string (k);
      b->flag_len[k] = strlen (b->flag_name[k]);
    }
  b->sum = summary;
  b->first_row = TRUE;
  b->smiles_col = -2;
  if (!cw_check_temperature (opt->temperature, error))
    {
      ok = FALSE;
      goto out;
    }
  write_head (b);
  while (!eof || have > 0)
    {
      gsize start = 0;
      if (!eof)
        {
          gsize n = fread (ibuf + have, 1, IN_SIZE - have, in);
          if (n == 0)
            {
              if (ferror (in))
                {
                  g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_IO, _("reading the input failed"));
                  ok = FALSE;
                  goto out;
                }
              eof = TRUE;
            }
          if (summary->lines == 0 && have == 0 && n > 0)
            b->csv = opt->input == CW_BATCH_INPUT_CSV ||
                     (opt->input == CW_BATCH_INPUT_AUTO && detect_csv (b, ibuf, n));
          have += n;
        }
      for (;;)
        {
          char *nl = memchr (ibuf + start, '\n', have - start);
          if (nl == NULL)
            break;
          if (!skipping)
            process_line (b, ibuf + start, nl - (ibuf + start));
          else
            skipping = FALSE;
          start = nl - ibuf + 1;
          if ((summary->lines & 0xffff) == 0)
            progress (b, FALSE);
        }
      if (eof && start < have)
        {
          if (!skipping)
            process_line (b, ibuf + start, have - start);
          start = have;
        }
      if (start == 0 && have == IN_SIZE)
        {
          /* a line longer than the buffer: report it and skip to its end */
          error_row (b, ++summary->lines, "", 0, _("line longer than 1 MiB"));
          skipping = TRUE;
          start = have;
        }
      memmove (ibuf, ibuf + start, have - start);
      have -= start;
      if (eof)
        break;
    }
  write_tail (b);
  progress (b, TRUE);
  flush_out (b);
  if (b->write_failed || fflush (out) != 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_IO, _("writing the results failed"));
      ok = FALSE;
    }
out:
  summary->seconds = (g_get_monotonic_time () - t0) / 1e6;
  cw_smiles_reader_free (b->reader);
  g_free (b->obuf);
  g_free (b->cache);
  g_free (b->tags);
  g_string_free (b->scratch, TRUE);
  g_free (ibuf);
  g_free (b);
  return ok;
}

char *
cw_batch_summary_dup_text (const CwBatchSummary *s)
{
  GString *t = g_string_new (NULL);
  /* The numbers are formatted first: xgettext cannot see through G_GUINT64_FORMAT. */
  g_autofree char *compounds = g_strdup_printf ("%" G_GUINT64_FORMAT, s->compounds);
  g_autofree char *lines = g_strdup_printf ("%" G_GUINT64_FORMAT, s->lines);
  g_autofree char *analysed = g_strdup_printf ("%" G_GUINT64_FORMAT, s->analysed);
  g_autofree char *rows = g_strdup_printf ("%" G_GUINT64_FORMAT, s->rows);
  g_autofree char *errors = g_strdup_printf ("%" G_GUINT64_FORMAT, s->errors);

  /* TRANSLATORS: compounds, lines, analysed, rows, errors (all numbers) */
  g_string_append_printf (t, _("%s compounds in %s lines: %s analysed (%s rows), %s with errors"),
                                compounds, lines, analysed, rows, errors);
  if (s->expanded)
    {
      g_autofree char *n = g_strdup_printf ("%" G_GUINT64_FORMAT, s->expanded);

      g_string_append_printf (t, _(", %s with open ring stereocentres (one row per cis/trans isomer)"), n);
    }
  if (s->salts)
    {
      g_autofree char *n = g_strdup_printf ("%" G_GUINT64_FORMAT, s->salts);

      g_string_append_printf (t, _(", %s with parts left out (largest part kept)"), n);
    }
  g_string_append_printf (t, _("; %.2f s (%.0f compounds/s)"), s->seconds,
                                s->seconds > 0 ? s->compounds / s->seconds : 0.0);
  return g_string_free (t, FALSE);
}
