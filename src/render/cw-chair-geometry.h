#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* The ideal chair (diamond lattice: every angle tetrahedral), threefold axis along z, ring
 * carbon k (position k + 1) numbered clockwise seen from +z, the up face. Projected
 * orthographically with the axis kept vertical on the page, so axial bonds are vertical and each
 * equatorial bond parallel to the ring bonds one removed from it, by construction. */

typedef struct
{
  double x, y, z;
} CwVec3;

typedef struct
{
  CwVec3   atom[6];       /* bond length 1 */
  CwVec3   axial[6];      /* unit vectors */
  CwVec3   equatorial[6]; /* unit vectors */
  gboolean up[6];         /* carbon puckered up: its axial bond points up (+z) */
} CwChair3D;

/* which = 0: chair 1 (carbons 1, 3, 5 axial up); 1: the ring-inverted chair 2. */
void cw_chair3d_build (CwChair3D *chair, int which);
/* Page coordinates (y down) of a 3D point or direction: rotate by `azimuth` about z, tilt the
 * top towards the viewer by `tilt` (radians), drop the depth. */
void cw_chair_project (const CwVec3 *v, double azimuth, double tilt, double *px, double *py);

#define CW_CHAIR_TILT (12.0 * G_PI / 180.0) /* radians, the ring seen slightly from above */
/* The view of each chair, radians about the axis: chair 2 is chair 1 turned by 60° (the
 * ring-inverted chair has the same shape), so both are seen from the same side of the shape and
 * both read as the familiar drawing; the six carbons are spread across the page. */
double cw_chair_azimuth (int which);

G_END_DECLS
