#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>
#include <zlib.h>

#include "cw-render-private.h"

/* A PNG writer for figures. cairo_surface_write_to_png compresses hard and takes several times
 * longer than drawing a 300 dpi figure; a figure on white compresses well at zlib's fastest
 * level with the "Sub" filter. The format is the PNG specification's (W3C,
 * Portable Network Graphics, 2nd ed., 2003): signature, IHDR, pHYs, IDAT, IEND, each chunk
 * with its CRC-32. */

static void
put_be32 (guint8 *p, guint32 v)
{
  p[0] = v >> 24;
  p[1] = v >> 16;
  p[2] = v >> 8;
  p[3] = v;
}

static void
chunk (GByteArray *out, const char *type, const guint8 *data, guint32 len)
{
  guint8 head[8], tail[4];
  uLong  crc = crc32 (0L, (const Bytef *) type, 4);

  put_be32 (head, len);
  memcpy (head + 4, type, 4);
  g_byte_array_append (out, head, 8);
  if (len > 0)
    {
      g_byte_array_append (out, data, len);
      crc = crc32 (crc, data, len);
    }
  put_be32 (tail, (guint32) crc);
  g_byte_array_append (out, tail, 4);
}

/* Rows of filter byte + RGB, each pixel stored as its difference from the left one (Sub). */
static void
filter_rows (cairo_surface_t *surface, int width, int rows, guint8 *raw)
{
  const guint8 *data = cairo_image_surface_get_data (surface);
  int           stride = cairo_image_surface_get_stride (surface);
  gsize         row = 1 + 3 * (gsize) width;

  for (int y = 0; y < rows; y++)
    {
      const guint32 *src = (const guint32 *) (data + (gsize) y * stride);
      guint8        *dst = raw + row * y;
      guint8         pr = 0, pg = 0, pb = 0;

      dst[0] = 1; /* Sub */
      for (int x = 0; x < width; x++)
        {
          guint32 px = src[x];
          guint8  r = px >> 16, g = px >> 8, b = px;

          dst[1 + 3 * x] = r - pr;
          dst[2 + 3 * x] = g - pg;
          dst[3 + 3 * x] = b - pb;
          pr = r, pg = g, pb = b;
        }
    }
}

static gboolean
deflate_into (z_stream *zs, const guint8 *in, gsize len, int flush, GByteArray *out)
{
  guint8 buf[65536];
  int    ret;

  zs->next_in = (Bytef *) in;
  zs->avail_in = (uInt) len;
  do
    {
      zs->next_out = buf;
      zs->avail_out = sizeof buf;
      ret = deflate (zs, flush);
      if (ret == Z_STREAM_ERROR)
        return FALSE;
      g_byte_array_append (out, buf, sizeof buf - zs->avail_out);
    }
  while (zs->avail_out == 0 || (flush == Z_FINISH && ret != Z_STREAM_END));
  return TRUE;
}

/* The page is painted in bands of rows into one small surface, each band filtered and fed to
 * the compressor at once: the memory stays small and warm, which at 300 dpi is most of the
 * time a whole-page image would take. */
gboolean
cw_render_write_png_scene (const CwScene *scene, double width, double height, double dpi, const char *path, GError **error)
{
  static const guint8 signature[8] = { 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n' };
  enum
  {
    BAND = 160
  };
  int w = (int) lround (width * dpi / 72.0), h = (int) lround (height * dpi / 72.0);
  g_autoptr (GByteArray) out = g_byte_array_new ();
  g_autoptr (GByteArray) idat = g_byte_array_new ();
  g_autoptr (cairo_surface_t) band = NULL;
  g_autofree guint8 *raw = NULL;
  guint8             ihdr[13], phys[9];
  guint32            ppm = (guint32) (dpi / 0.0254 + 0.5);
  z_stream           zs = { 0 };
  gboolean           ok = TRUE;

  if (w < 1 || h < 1 || w > 30000 || h > 30000)
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_DRAW, _("Image of %d × %d pixels is out of range"), w, h);
      return FALSE;
    }
  band = cairo_image_surface_create (CAIRO_FORMAT_RGB24, w, BAND);
  if (cairo_surface_status (band) != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_DRAW, "%s", cairo_status_to_string (cairo_surface_status (band)));
      return FALSE;
    }
  raw = g_malloc ((1 + 3 * (gsize) w) * BAND);
  /* Run-length matching only: after the Sub filter a figure on white is mostly runs of zeros. */
  if (deflateInit2 (&zs, Z_BEST_SPEED, Z_DEFLATED, 15, 8, Z_RLE) != Z_OK)
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_DRAW, _("PNG compression failed"));
      return FALSE;
    }
  for (int y0 = 0; y0 < h && ok; y0 += BAND)
    {
      int      rows = MIN (BAND, h - y0);
      cairo_t *cr = cairo_create (band);

      /* White first: the page's edge pixels are only partly covered by the figure. */
      cairo_set_source_rgb (cr, 1, 1, 1);
      cairo_paint (cr);
      cairo_translate (cr, 0, -y0);
      cairo_scale (cr, dpi / 72.0, dpi / 72.0);
      cw_render_paint_scene (cr, scene, FALSE, width, height);
      ok = cairo_status (cr) == CAIRO_STATUS_SUCCESS;
      cairo_destroy (cr);
      cairo_surface_flush (band);
      filter_rows (band, w, rows, raw);
      ok = ok && deflate_into (&zs, raw, (1 + 3 * (gsize) w) * rows, y0 + rows >= h ? Z_FINISH : Z_NO_FLUSH, idat);
    }
  deflateEnd (&zs);
  if (!ok)
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_DRAW, _("PNG compression failed"));
      return FALSE;
    }
  put_be32 (ihdr, w);
  put_be32 (ihdr + 4, h);
  ihdr[8] = 8;  /* bits per sample */
  ihdr[9] = 2;  /* truecolour */
  ihdr[10] = 0; /* deflate */
  ihdr[11] = 0; /* adaptive filtering */
  ihdr[12] = 0; /* no interlace */
  put_be32 (phys, ppm);
  put_be32 (phys + 4, ppm);
  phys[8] = 1; /* per metre */
  g_byte_array_append (out, signature, 8);
  chunk (out, "IHDR", ihdr, 13);
  chunk (out, "pHYs", phys, 9);
  chunk (out, "IDAT", idat->data, idat->len);
  chunk (out, "IEND", NULL, 0);
  return g_file_set_contents (path, (const char *) out->data, out->len, error);
}
