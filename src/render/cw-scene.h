#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* The drawing model: every figure is first built as a list of positioned primitives in plain
 * structs (user units = points, y downwards), tested numerically, then painted by cw-paint.c.
 * Colours are roles (inks), resolved by the palette at paint time. */

typedef enum
{
  CW_PRIM_LINE,  /* x0,y0 → x1,y1 */
  CW_PRIM_WEDGE, /* solid wedge, narrow at x0,y0, `wide` across at x1,y1 */
  CW_PRIM_HASH,  /* hashed wedge, same geometry */
  CW_PRIM_POLYLINE,
  CW_PRIM_POLYGON, /* filled */
  CW_PRIM_MARKER,  /* shape `marker` of size `wide` at x0,y0 */
  CW_PRIM_RECT,    /* x0,y0 top-left, x1,y1 size; filled when `fill` */
  CW_PRIM_TEXT
} CwPrimKind;

typedef enum
{
  CW_INK_BACKGROUND,
  CW_INK_TEXT,
  CW_INK_BOND,
  CW_INK_MUTED,
  CW_INK_GRID,
  CW_INK_SERIES_1, /* chair 1 */
  CW_INK_SERIES_2, /* chair 2 */
  CW_INK_SERIES_3, /* twist-boat */
  CW_INK_STRAIN,   /* syn-1,3-diaxial marks */
  CW_INK_GAUCHE,   /* gauche marks */
  CW_INK_HIGHLIGHT,
  CW_INK_PANEL, /* faint fill behind the major chair */
  CW_N_INKS
} CwInk;

typedef enum
{
  CW_ROLE_NONE,
  CW_ROLE_RING_BOND,
  CW_ROLE_SUB_BOND,
  CW_ROLE_SUB_LABEL,
  CW_ROLE_POSITION_LABEL,
  CW_ROLE_HYDROGEN,
  CW_ROLE_INTERACTION,
  CW_ROLE_INTERACTION_LABEL,
  CW_ROLE_CAPTION,
  CW_ROLE_ARROW,
  CW_ROLE_AXIS,
  CW_ROLE_CURVE,
  CW_ROLE_LEVEL,
  CW_ROLE_LEGEND,
  CW_ROLE_MARKER,
  CW_ROLE_REACTION_MARK /* chairs: ring and "ap" label of an anti-periplanar β-hydrogen */
} CwRole;

typedef enum
{
  CW_MARKER_CIRCLE,
  CW_MARKER_SQUARE,
  CW_MARKER_TRIANGLE,
  CW_MARKER_DIAMOND
} CwMarkerShape;

typedef struct
{
  double x, y;
} CwPoint;

typedef struct
{
  double x, y, w, h;
} CwBox;

typedef struct
{
  CwPrimKind    kind;
  CwRole        role;
  CwInk         ink;
  int           chair;    /* 0 or 1 for chair drawings, else -1 */
  int           sub;      /* molecule substituent index, or -1 */
  int           position; /* ring carbon 1..6, or 0 */
  gboolean      axial;    /* for substituent bonds in a chair */
  double        x0, y0, x1, y1;
  double        line_width;
  double        wide; /* wedge width at the wide end; marker size */
  double        dash; /* 0 solid, else dash length */
  gboolean      fill;
  gboolean      halo;     /* lines: a margin in halo_ink, so the line reads as in front */
  CwInk         halo_ink; /* what lies under it: the background unless set */
  CwMarkerShape marker;
  guint         first_point, n_points; /* polyline / polygon, into CwScene.points */
  /* text */
  char    *markup;
  double   size;
  gboolean bold;
  double   wrap; /* > 0: wrap at this width */
  CwBox    box;  /* the laid-out text's logical box */
} CwPrim;

typedef struct
{
  GArray *prims;  /* CwPrim */
  GArray *points; /* CwPoint */
  double  width;  /* the box painted: (origin, origin + size) */
  double  height;
  double  origin_x;
  double  origin_y;
} CwScene;

CwScene *cw_scene_new (double width, double height);
void     cw_scene_free (CwScene *scene);
CwPrim  *cw_scene_add (CwScene *scene, CwPrimKind kind, CwRole role, CwInk ink);
CwPrim  *cw_scene_line (CwScene *scene, CwRole role, CwInk ink, double x0, double y0, double x1, double y1, double width);
CwPrim  *cw_scene_polyline (CwScene *scene, CwRole role, CwInk ink, const CwPoint *pts, guint n, double width);
CwPrim  *cw_scene_polygon (CwScene *scene, CwRole role, CwInk ink, const CwPoint *pts, guint n);
/* Arrow from (x0,y0) to (x1,y1) with a filled head at the end; both heads when `both`. */
void cw_scene_arrow (CwScene *scene, CwRole role, CwInk ink, double x0, double y0, double x1, double y1, double width, gboolean both);
/* Text with its top-left corner at (x, y); the box is measured with Pango. */
CwPrim *cw_scene_text (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, gboolean bold, double x, double y);
/* Text placed relative to (x, y): ax, ay in 0..1 pick the point of the box put there. */
CwPrim *cw_scene_text_at (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, gboolean bold, double x, double y, double ax, double ay);
CwPrim *cw_scene_paragraph (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, double x, double y, double wrap);
CwPrim *cw_scene_get (const CwScene *scene, guint i);
/* TRUE when both scenes would paint the same (every prim, point and text alike). */
gboolean cw_scene_equal (const CwScene *a, const CwScene *b);
/* The same, with positions and sizes allowed to differ by less than `tolerance` (scene units);
 * texts, styles and the scene's own size still compare exactly. */
gboolean cw_scene_equal_within (const CwScene *a, const CwScene *b, double tolerance);
/* Copies every prim of src into scene, moved by (dx, dy). */
void  cw_scene_append (CwScene *scene, const CwScene *src, double dx, double dy);
guint cw_scene_get_n (const CwScene *scene);
/* TRUE when a placed text box (inflated by pad) overlaps `box`; skip is a prim index to ignore. */
gboolean cw_scene_box_hits_text (const CwScene *scene, const CwBox *box, double pad, int skip);

/* Geometry helpers, also used by the tests. */
gboolean cw_box_overlap (const CwBox *a, const CwBox *b, double pad);
gboolean cw_segment_hits_box (double x0, double y0, double x1, double y1, const CwBox *box);
CwBox    cw_box_union (const CwBox *a, const CwBox *b);
/* What a prim covers on the page, strokes included. */
CwBox cw_prim_bounds (const CwScene *scene, const CwPrim *p);

/* Text measuring (Pango, 72 units per inch, no hinting so screen and files agree). */
typedef struct
{
  double w, h;             /* logical size */
  double baseline;         /* from the top */
  double atom_x0, atom_x1; /* horizontal extent of the chosen character range */
} CwTextMetrics;

void cw_text_measure (const char *markup, double size, gboolean bold, double wrap, int range_start, int range_end, CwTextMetrics *out);
/* Plain text of a markup string (newly allocated), or a copy when the markup does not parse. */
char *cw_markup_dup_plain (const char *markup);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwScene, cw_scene_free)

G_END_DECLS
