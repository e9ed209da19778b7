#pragma once

#include "cw-scene.h"

G_BEGIN_DECLS

/* A group label ready to place: the markup as written (or reversed for bonds that arrive from
 * the right, "CO₂Me" → "MeO₂C"), and the byte range of the atom the bond meets in its plain text. */
typedef struct
{
  char *markup;
  int   atom_start;
  int   atom_end;
} CwLabelText;

void cw_label_text_init (CwLabelText *lt, const char *markup, gboolean reversed);
void cw_label_text_clear (CwLabelText *lt);
/* The markup read from its other end, or NULL when the label is not a plain sequence of
 * element symbols and abbreviations (then it is placed as one block). */
char *cw_label_reverse_markup (const char *markup);

typedef struct
{
  CwBox    box;    /* the text's logical box */
  double   ax, ay; /* centre of the attachment atom */
  double   ex, ey; /* where the bond stops, short of the atom */
  gboolean reversed;
} CwLabelPlace;

/* Places a label at the end of a bond that leaves (px, py) along the unit vector (dx, dy):
 * the attachment atom's centre sits `length` from (px, py). */
void cw_label_place (const char *markup, double size, double px, double py, double dx, double dy, double length, CwLabelPlace *out, CwLabelText *text_out);
/* Adds the label as a text prim with the given role and returns it. */
CwPrim *cw_label_add (CwScene *scene, const CwLabelText *lt, const CwLabelPlace *place, double size, CwRole role, CwInk ink, gboolean bold);

G_END_DECLS
