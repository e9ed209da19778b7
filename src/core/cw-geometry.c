#include "config.h"

#include "cw-geometry.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"

#define DEG (G_PI / 180.0)

static void
v_sub (const double a[3], const double b[3], double out[3])
{
  for (int i = 0; i < 3; i++)
    out[i] = a[i] - b[i];
}

static double
v_dot (const double a[3], const double b[3])
{
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

static void
v_cross (const double a[3], const double b[3], double out[3])
{
  out[0] = a[1] * b[2] - a[2] * b[1];
  out[1] = a[2] * b[0] - a[0] * b[2];
  out[2] = a[0] * b[1] - a[1] * b[0];
}

static void
v_normalize (double v[3])
{
  double n = sqrt (v_dot (v, v));

  if (n > 0)
    for (int i = 0; i < 3; i++)
      v[i] /= n;
}

CwFace
cw_chair_axial_face (int chair, int position)
{
  gboolean odd = (position % 2) == 1;

  g_return_val_if_fail (chair == 0 || chair == 1, CW_FACE_UP);
  /* Chair 1: carbons 1, 3, 5 axial up; chair 2 is ring-inverted. */
  return (odd == (chair == 0)) ? CW_FACE_UP : CW_FACE_DOWN;
}

gboolean
cw_chair_is_axial (int chair, int position, CwFace face)
{
  return cw_chair_axial_face (chair, position) == face;
}

static void
place_ring (const CwGeometryData *gd, int chair, CwChairGeometry *out)
{
  double d = gd->cc_bond.value, cos_t = cos (gd->ccc_angle.value * DEG);
  /* D3d chair: r² = d²(1 − cos θ)/1.5 and (2h)² = d² − r² (derived from the bond and the angle). */
  double r = d * sqrt ((1.0 - cos_t) / 1.5);
  double h = 0.5 * sqrt (d * d - r * r);

  for (int k = 0; k < CW_RING_SIZE; k++)
    {
      CwAtom3D *a = &out->atoms[out->n_atoms];
      int       position = k + 1;

      a->kind = CW_ATOM_RING;
      a->element = CW_EL_C;
      a->xyz[0] = r * cos (60.0 * k * DEG);
      a->xyz[1] = r * sin (60.0 * k * DEG);
      a->xyz[2] = (cw_chair_axial_face (chair, position) == CW_FACE_UP) ? h : -h;
      a->position = position;
      a->face = CW_FACE_UP;
      a->sub = -1;
      out->ring[k] = out->n_atoms++;
    }
}

static double
bond_length (const CwGeometryData *gd, CwElement el, gboolean axial)
{
  if (el == CW_EL_H || el == CW_EL_D || !gd->has_bond[el] || gd->bond[el].value <= 0)
    return axial ? gd->ch_axial.value : gd->ch_equatorial.value;
  return gd->bond[el].value;
}

static gboolean
place_slot (const CwGeometryData *gd, const CwMolecule *mol, CwChairGeometry *out, int k, CwFace face, const double dir[3], GError **error)
{
  int                  position = k + 1;
  const CwSubstituent *s = cw_molecule_get (mol, position, face);
  CwAtom3D            *a = &out->atoms[out->n_atoms];
  const double        *c = out->atoms[out->ring[k]].xyz;
  double               len;

  a->position = position;
  a->face = face;
  a->axial = cw_chair_is_axial (out->chair, position, face);
  a->sub = -1;
  if (s != NULL)
    {
      a->kind = CW_ATOM_SUBSTITUENT;
      a->element = s->group->first_atom;
      a->sub = (int) (s - mol->subs);
      if (a->element != CW_EL_H && a->element != CW_EL_D && !gd->has_bond[a->element])
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_UNSUPPORTED,
                       _("No C–%s bond length in the geometry table for group “%s” on carbon %d"),
                          cw_element_symbol (a->element), s->group->id, position);
          return FALSE;
        }
    }
  else
    {
      a->kind = CW_ATOM_HYDROGEN;
      a->element = CW_EL_H;
    }
  len = bond_length (gd, a->element, a->axial);
  for (int i = 0; i < 3; i++)
    a->xyz[i] = c[i] + len * dir[i];
  out->slot[k][face] = out->n_atoms++;
  return TRUE;
}

gboolean
cw_chair_geometry_build (const CwGeometryData *gd,
                         const CwMolecule     *mol,
                         int                   chair,
                         CwChairGeometry      *out,
                         GError              **error)
{
  double half = 0.5 * gd->exocyclic_angle.value * DEG;

  g_return_val_if_fail (gd != NULL && mol != NULL && out != NULL, FALSE);
  if (chair != 0 && chair != 1)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("Chair %d does not exist: choose 1 or 2"), chair + 1);
      return FALSE;
    }
  memset (out, 0, sizeof *out);
  out->chair = chair;
  place_ring (gd, chair, out);
  for (int k = 0; k < CW_RING_SIZE; k++)
    {
      const double *c = out->atoms[out->ring[k]].xyz;
      const double *prev = out->atoms[out->ring[(k + 5) % 6]].xyz;
      const double *next = out->atoms[out->ring[(k + 1) % 6]].xyz;
      double        u[3], v[3], b[3], n[3], up[3], down[3];

      v_sub (prev, c, u);
      v_sub (next, c, v);
      v_normalize (u);
      v_normalize (v);
      for (int i = 0; i < 3; i++)
        b[i] = -(u[i] + v[i]); /* outward bisector of the C–C–C angle */
      v_normalize (b);
      v_cross (u, v, n); /* normal to the C–C–C plane */
      v_normalize (n);
      if (n[2] < 0)
        for (int i = 0; i < 3; i++)
          n[i] = -n[i];
      for (int i = 0; i < 3; i++)
        {
          up[i] = cos (half) * b[i] + sin (half) * n[i];
          down[i] = cos (half) * b[i] - sin (half) * n[i];
        }
      if (!place_slot (gd, mol, out, k, CW_FACE_UP, up, error) ||
          !place_slot (gd, mol, out, k, CW_FACE_DOWN, down, error))
        return FALSE;
    }
  return TRUE;
}

int
cw_chair_geometry_slot (const CwChairGeometry *g, int position, CwFace face)
{
  g_return_val_if_fail (g != NULL && position >= 1 && position <= CW_RING_SIZE, -1);
  return g->slot[position - 1][face];
}

double
cw_torsion_angle (const double a[3], const double b[3], const double c[3], const double d[3])
{
  double b1[3], b2[3], b3[3], n1[3], n2[3], m[3];

  v_sub (b, a, b1);
  v_sub (c, b, b2);
  v_sub (d, c, b3);
  v_cross (b1, b2, n1);
  v_cross (b2, b3, n2);
  v_cross (n1, n2, m);
  /* atan2(|b2| b1·(b2×b3), n1·n2) written with m = n1×n2 = (n1×n2), parallel to b2. */
  return atan2 (v_dot (m, b2) / sqrt (v_dot (b2, b2)), v_dot (n1, n2)) / DEG;
}

double
cw_chair_geometry_torsion (const CwChairGeometry *g, int a, int b, int c, int d)
{
  g_return_val_if_fail (g != NULL, 0.0);
  return cw_torsion_angle (g->atoms[a].xyz, g->atoms[b].xyz, g->atoms[c].xyz, g->atoms[d].xyz);
}

double
cw_chair_geometry_distance (const CwChairGeometry *g, int a, int b)
{
  double v[3];

  v_sub (g->atoms[a].xyz, g->atoms[b].xyz, v);
  return sqrt (v_dot (v, v));
}

double
cw_chair_geometry_angle (const CwChairGeometry *g, int a, int b, int c)
{
  double u[3], v[3];

  v_sub (g->atoms[a].xyz, g->atoms[b].xyz, u);
  v_sub (g->atoms[c].xyz, g->atoms[b].xyz, v);
  v_normalize (u);
  v_normalize (v);
  return acos (CLAMP (v_dot (u, v), -1.0, 1.0)) / DEG;
}

char *
cw_chair_geometry_to_xyz (const CwChairGeometry *g, const char *comment)
{
  GString         *s = g_string_new (NULL);
  g_autofree char *line = g_strdup (comment ? comment : "");

  g_return_val_if_fail (g != NULL, NULL);
  g_strdelimit (line, "\r\n", ' ');
  g_string_append_printf (s, "%d\n%s\n", g->n_atoms, line);
  for (int i = 0; i < g->n_atoms; i++)
    {
      const CwAtom3D *a = &g->atoms[i];
      /* XYZ knows elements only: deuterium is written as H. */
      const char *el = (a->element == CW_EL_D) ? "H" : cw_element_symbol (a->element);
      char        x[G_ASCII_DTOSTR_BUF_SIZE], y[G_ASCII_DTOSTR_BUF_SIZE], z[G_ASCII_DTOSTR_BUF_SIZE];

      /* Locale-independent decimal points. */
      g_ascii_formatd (x, sizeof x, "%.5f", a->xyz[0]);
      g_ascii_formatd (y, sizeof y, "%.5f", a->xyz[1]);
      g_ascii_formatd (z, sizeof z, "%.5f", a->xyz[2]);
      g_string_append_printf (s, "%-2s %12s %12s %12s\n", el, x, y, z);
    }
  return g_string_free (s, FALSE);
}

gboolean
cw_chair_geometry_save_xyz (const CwChairGeometry *g, const char *comment, const char *path, GError **error)
{
  g_autofree char *text = cw_chair_geometry_to_xyz (g, comment);
  g_autoptr (GError) local = NULL;

  g_return_val_if_fail (path != NULL, FALSE);
  /* g_file_set_contents writes a temporary file and renames it over the target. */
  if (!g_file_set_contents (path, text, -1, &local))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_IO, "%s", local->message);
      return FALSE;
    }
  return TRUE;
}
