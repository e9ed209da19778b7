/* The ideal 3D chair behind every chair drawing, and its projection onto the page. */
#include "config.h"

#include <math.h>

#include "cw-chair-geometry.h"

/* Ideal tetrahedral angle, acos(−1/3) = 109.47° (common practice). */
#define TETRAHEDRAL (acos (-1.0 / 3.0))

static CwVec3
sub3 (CwVec3 a, CwVec3 b)
{
  return (CwVec3){ a.x - b.x, a.y - b.y, a.z - b.z };
}

static double
dot3 (CwVec3 a, CwVec3 b)
{
  return a.x * b.x + a.y * b.y + a.z * b.z;
}

static double
angle3 (CwVec3 a, CwVec3 b)
{
  return acos (dot3 (a, b) / sqrt (dot3 (a, a) * dot3 (b, b)));
}

static CwVec3
cross3 (CwVec3 a, CwVec3 b)
{
  return (CwVec3){ a.y * b.z - a.z * b.y, a.z * b.x - a.x * b.z, a.x * b.y - a.y * b.x };
}

static void
test_tetrahedral (void)
{
  for (int which = 0; which < 2; which++)
    {
      CwChair3D c;

      cw_chair3d_build (&c, which);
      for (int k = 0; k < 6; k++)
        {
          CwVec3 u1 = sub3 (c.atom[(k + 1) % 6], c.atom[k]);
          CwVec3 u2 = sub3 (c.atom[(k + 5) % 6], c.atom[k]);

          g_assert_cmpfloat_with_epsilon (sqrt (dot3 (u1, u1)), 1.0, 1e-12);
          g_assert_cmpfloat_with_epsilon (angle3 (u1, u2), TETRAHEDRAL, 1e-12);
          g_assert_cmpfloat_with_epsilon (angle3 (u1, c.axial[k]), TETRAHEDRAL, 1e-12);
          g_assert_cmpfloat_with_epsilon (angle3 (u2, c.axial[k]), TETRAHEDRAL, 1e-12);
          g_assert_cmpfloat_with_epsilon (angle3 (u1, c.equatorial[k]), TETRAHEDRAL, 1e-12);
          g_assert_cmpfloat_with_epsilon (angle3 (c.axial[k], c.equatorial[k]), TETRAHEDRAL, 1e-12);
        }
    }
}

/* For a D3d chair cos τ = −cos θ / (1 + cos θ) (derived; docs/render.md); with θ tetrahedral the
 * ring torsion is 60°, alternating in sign around the ring. */
static void
test_torsion (void)
{
  CwChair3D c;
  double    expect = acos (-cos (TETRAHEDRAL) / (1 + cos (TETRAHEDRAL)));

  g_assert_cmpfloat_with_epsilon (expect, G_PI / 3, 1e-12);
  cw_chair3d_build (&c, 0);
  for (int k = 0; k < 6; k++)
    {
      CwVec3 b1 = sub3 (c.atom[(k + 1) % 6], c.atom[k]);
      CwVec3 b2 = sub3 (c.atom[(k + 2) % 6], c.atom[(k + 1) % 6]);
      CwVec3 b3 = sub3 (c.atom[(k + 3) % 6], c.atom[(k + 2) % 6]);
      CwVec3 n1 = cross3 (b1, b2), n2 = cross3 (b2, b3);
      double tau = angle3 (n1, n2);

      g_assert_cmpfloat_with_epsilon (tau, expect, 1e-12);
    }
}

/* Chair 1 has the axial bonds of carbons 1, 3, 5 up; chair 2 is the ring-inverted form
 * (DEVELOPERS.md, the model). Each equatorial bond leans to the other face by a third (tetrahedral). */
static void
test_alternation (void)
{
  CwChair3D c1, c2;

  cw_chair3d_build (&c1, 0);
  cw_chair3d_build (&c2, 1);
  for (int k = 0; k < 6; k++)
    {
      gboolean odd_position = (k % 2) == 0; /* position k + 1 */

      g_assert_true (c1.up[k] == odd_position);
      g_assert_true (c2.up[k] == !odd_position);
      g_assert_cmpfloat (c1.axial[k].z, ==, odd_position ? 1.0 : -1.0);
      g_assert_cmpfloat_with_epsilon (c1.equatorial[k].z, -c1.axial[k].z / 3.0, 1e-12);
      g_assert_cmpfloat_with_epsilon (c1.atom[k].z, -c2.atom[k].z, 1e-12);
    }
}

static void
project (const CwVec3 *v, int which, double *x, double *y)
{
  cw_chair_project (v, cw_chair_azimuth (which), CW_CHAIR_TILT, x, y);
}

/* On the page: axial bonds exactly vertical; each equatorial bond parallel to the two ring bonds
 * one removed from its carbon (the drawing rule, here a property of the projection). */
static void
test_projection_rules (void)
{
  for (int which = 0; which < 2; which++)
    {
      CwChair3D c;

      cw_chair3d_build (&c, which);
      for (int k = 0; k < 6; k++)
        {
          double ax, ay, ex, ey;

          project (&c.axial[k], which, &ax, &ay);
          g_assert_cmpfloat (fabs (ax), <, 1e-12);
          g_assert_cmpfloat (ay * (c.up[k] ? 1 : -1), <, 0); /* page y grows downwards */
          project (&c.equatorial[k], which, &ex, &ey);
          for (int side = 0; side < 2; side++)
            {
              int    a = side == 0 ? (k + 1) % 6 : (k + 5) % 6;
              int    b = side == 0 ? (k + 2) % 6 : (k + 4) % 6;
              CwVec3 bond = sub3 (c.atom[b], c.atom[a]);
              double bx, by;

              project (&bond, which, &bx, &by);
              g_assert_cmpfloat (fabs (ex * by - ey * bx) / (hypot (ex, ey) * hypot (bx, by)), <, 1e-12);
            }
        }
    }
}

/* Both chairs are drawn with the same outline (chair 2 is chair 1 turned on its axis). */
static void
test_same_outline (void)
{
  CwChair3D c[2];
  double    px[2][6], py[2][6];

  for (int w = 0; w < 2; w++)
    {
      cw_chair3d_build (&c[w], w);
      for (int k = 0; k < 6; k++)
        project (&c[w].atom[k], w, &px[w][k], &py[w][k]);
    }
  for (int k = 0; k < 6; k++)
    {
      gboolean found = FALSE;

      for (int j = 0; j < 6 && !found; j++)
        found = fabs (px[0][k] - px[1][j]) < 1e-9 && fabs (py[0][k] - py[1][j]) < 1e-9;
      g_assert_true (found);
    }
  /* And the six carbons stand apart across the page, so no bonds stack up. */
  for (int k = 0; k < 6; k++)
    for (int j = k + 1; j < 6; j++)
      g_assert_cmpfloat (fabs (px[0][k] - px[0][j]), >, 0.1);
}

/* Carbons 1→6 run clockwise seen from the up face (+z), as in the flat structure drawing, so
 * both drawings show the same enantiomer. */
static void
test_handedness (void)
{
  for (int which = 0; which < 2; which++)
    {
      CwChair3D c;
      double    area = 0;

      cw_chair3d_build (&c, which);
      for (int k = 0; k < 6; k++)
        area += c.atom[k].x * c.atom[(k + 1) % 6].y - c.atom[(k + 1) % 6].x * c.atom[k].y;
      g_assert_cmpfloat (area, <, 0); /* clockwise with y to the left of x */
    }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/render/chair-geometry/tetrahedral", test_tetrahedral);
  g_test_add_func ("/render/chair-geometry/torsion", test_torsion);
  g_test_add_func ("/render/chair-geometry/alternation", test_alternation);
  g_test_add_func ("/render/chair-geometry/projection-rules", test_projection_rules);
  g_test_add_func ("/render/chair-geometry/same-outline", test_same_outline);
  g_test_add_func ("/render/chair-geometry/handedness", test_handedness);
  return g_test_run ();
}
