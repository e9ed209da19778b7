#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Elements a group's formula may use, in Hill order after C and H. */
typedef enum
{
  CW_EL_C,
  CW_EL_H,
  CW_EL_D,
  CW_EL_BR,
  CW_EL_CL,
  CW_EL_F,
  CW_EL_HG,
  CW_EL_I,
  CW_EL_N,
  CW_EL_O,
  CW_EL_S,
  CW_EL_SI,
  CW_EL_SN,
  CW_N_ELEMENTS
} CwElement;

typedef enum
{
  CW_CLASS_ALKYL,          /* unbranched at the attachment carbon: Me, Et, CH2OH */
  CW_CLASS_BRANCHED_ALKYL, /* iPr, tBu, cyclohexyl */
  CW_CLASS_ARYL,
  CW_CLASS_UNSATURATED,    /* vinyl, ethynyl, CN, carbonyl groups */
  CW_CLASS_HALOGEN,
  CW_CLASS_OXYGEN,
  CW_CLASS_NITROGEN,
  CW_CLASS_SULFUR,
  CW_CLASS_ELEMENT,        /* Si, Sn, Hg */
  CW_CLASS_ISOTOPE,
  CW_CLASS_OTHER,          /* user-defined groups */
  CW_N_CLASSES
} CwGroupClass;

typedef struct
{
  char *id;       /* stable key, lower-case, e.g. "methyl", "co2me" */
  char *label;    /* UTF-8 with Unicode subscripts, e.g. "CO₂Me" */
  char *markup;   /* Pango markup, e.g. "CO<sub>2</sub>Me" */
  char *smiles;   /* fragment written from the attachment atom, e.g. "C(=O)OC" */
  char *formula;  /* contribution as written in the table, e.g. "C2H3O2" */
  int elements[CW_N_ELEMENTS];
  int charge;
  int unsaturation;    /* rings + pi bonds inside the group */
  CwElement first_atom; /* element bonded to the ring carbon */
  CwGroupClass klass;
  gboolean polar;      /* C–X dipole that makes vicinal pairs non-additive */
  gboolean hbond_donor;
  gboolean hbond_acceptor;
  gboolean leaving;    /* can act as the nucleofuge in an E2 */

  double a;            /* A-value, kcal/mol, ~298 K, aprotic or solvent-independent */
  double a_sigma;      /* its standard uncertainty, kcal/mol */
  double a_min, a_max; /* reported range (equal to a when none) */
  gboolean has_protic;
  double a_protic;
  double a_protic_sigma;
  gboolean has_thermo; /* axial -> equatorial dH (kcal/mol), dS (cal/(mol K)) */
  double dh;
  double ds;
  char *source;        /* provenance of the A-value, as written in the table */
  char *protic_source;
  char *thermo_source;

  gboolean custom;     /* defined by the user in a document */
  int index;           /* position in its table; -1 for custom groups */
} CwGroup;

typedef struct _CwGroupTable CwGroupTable;

CwGroupTable *cw_group_table_new_from_file (const char *path, GError **error);
CwGroupTable *cw_group_table_new_from_data (const char *data, gsize len, const char *name, GError **error);
void          cw_group_table_free          (CwGroupTable *table);
guint         cw_group_table_get_n_groups  (const CwGroupTable *table);
const CwGroup *cw_group_table_get          (const CwGroupTable *table, guint i);
/* Looks up by id, then by label (case-sensitive), then by id case-insensitively. */
const CwGroup *cw_group_table_lookup       (const CwGroupTable *table, const char *key);

CwGroup    *cw_group_new_custom    (const char *id, const char *label, double a, double a_sigma, const char *source);
CwGroup    *cw_group_copy          (const CwGroup *group);
void        cw_group_free          (CwGroup *group);
gboolean    cw_group_parse_formula (const char *formula, int elements[CW_N_ELEMENTS], int *charge, GError **error);
const char *cw_group_class_to_string (CwGroupClass klass);
const char *cw_element_symbol        (CwElement el);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwGroupTable, cw_group_table_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwGroup, cw_group_free)

G_END_DECLS
