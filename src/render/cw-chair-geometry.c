#include "config.h"

#include "cw-chair-geometry.h"

#include <math.h>

static CwVec3
vsub (CwVec3 a, CwVec3 b)
{
  return (CwVec3){ a.x - b.x, a.y - b.y, a.z - b.z };
}

static CwVec3
vunit (CwVec3 a)
{
  double n = sqrt (a.x * a.x + a.y * a.y + a.z * a.z);

  return (CwVec3){ a.x / n, a.y / n, a.z / n };
}

void
cw_chair3d_build (CwChair3D *chair, int which)
{
  /* Bond length 1: the 60° chord of radius r is r, so 1 = r² + (2h)²; the ring angle is
   * tetrahedral when h = r / (4√2) (derived: cos θ = (4h² − r²/2) / (r² + 4h²) = −1/3). */
  double r = 1.0 / sqrt (1.0 + 4.0 / 32.0);
  double h = r / (4.0 * G_SQRT2);

  for (int k = 0; k < 6; k++)
    {
      double   phi = -k * G_PI / 3.0;
      gboolean up = ((k % 2) == 0) == (which == 0);

      chair->up[k] = up;
      chair->atom[k] = (CwVec3){ r * cos (phi), r * sin (phi), up ? h : -h };
    }
  for (int k = 0; k < 6; k++)
    {
      CwVec3 a = chair->atom[k];
      CwVec3 u1 = vunit (vsub (chair->atom[(k + 1) % 6], a));
      CwVec3 u2 = vunit (vsub (chair->atom[(k + 5) % 6], a));
      CwVec3 ax = { 0, 0, chair->up[k] ? 1.0 : -1.0 };

      chair->axial[k] = ax;
      /* The four tetrahedral directions sum to zero. */
      chair->equatorial[k] = vunit ((CwVec3){ -(u1.x + u2.x + ax.x), -(u1.y + u2.y + ax.y),
                                              -(u1.z + u2.z + ax.z) });
    }
}

void
cw_chair_project (const CwVec3 *v, double azimuth, double tilt, double *px, double *py)
{
  double x = v->x * cos (azimuth) - v->y * sin (azimuth);
  double y = v->x * sin (azimuth) + v->y * cos (azimuth);

  /* Viewer on −y, looking a little down: the far side (+y) rises on the page. */
  *px = x;
  *py = -(v->z * cos (tilt) + y * sin (tilt));
}

double
cw_chair_azimuth (int which)
{
  /* Chair 2 (chair 1 reflected through its mean plane) is, for the ideal chair, chair 1 turned
   * by 60° about the axis; seen from a − 60° it has the same outline as chair 1 seen from a:
   * the familiar one, left end down and right end up (the tests check the two outlines agree). */
  double a = 8.0 * G_PI / 180.0;

  return which == 0 ? a : a - G_PI / 3;
}
