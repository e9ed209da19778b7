#include "config.h"

#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

#include "cw-fragment.h"
#include "cw-geometry.h"
#include "test-helpers.h"

static CwData         *data;
static CwGeometryData *gd;

static void
build (const char *spec, int chair, CwChairGeometry *g)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = *spec ? test_ring (data, spec) : cw_molecule_new ();

  g_assert_true (cw_chair_geometry_build (gd, mol, chair, g, &error));
  g_assert_no_error (error);
}

/* The ring of the built chair reproduces the table's measured geometry: C–C 1.526 Å (Brügger et al.,
 * J. Phys. Chem. A 2011), ∠CCC 111.4° and ring torsion ±54.9° alternating (electron diffraction,
 * Geise, Buys & Mijlhoff, J. Mol. Struct. 1971; from memory, unverified). */
static void
test_ring_geometry (void)
{
  CwChairGeometry g;

  build ("", 0, &g);
  g_assert_cmpint (g.n_atoms, ==, 18);
  for (int k = 0; k < 6; k++)
    {
      int    a = g.ring[k], b = g.ring[(k + 1) % 6], c = g.ring[(k + 2) % 6], d = g.ring[(k + 3) % 6];
      double t = cw_chair_geometry_torsion (&g, a, b, c, d);

      g_assert_cmpfloat_with_epsilon (cw_chair_geometry_distance (&g, a, b), 1.526, 1e-9);
      g_assert_cmpfloat_with_epsilon (cw_chair_geometry_angle (&g, a, b, c), 111.4, 1e-6);
      g_assert_cmpfloat_with_epsilon (fabs (t), 54.9, 0.1);
      /* torsions alternate in sign around a chair (common practice) */
      g_assert_cmpfloat (t * cw_chair_geometry_torsion (&g, b, c, d, g.ring[(k + 4) % 6]), <, 0);
    }
}

/* Ring hydrogens: C–H 1.098 Å axial and 1.093 Å equatorial (Brügger et al. 2011), H–C–H 109.47°
 * (common practice); axial bonds lie along the threefold axis within a few degrees and each
 * equatorial bond is anti-periplanar to the ring bonds one removed (textbook chair drawing rules,
 * common practice). */
static void
test_hydrogens (void)
{
  CwChairGeometry g;

  build ("", 0, &g);
  for (int pos = 1; pos <= 6; pos++)
    {
      int    c = g.ring[pos - 1];
      int    ax = cw_chair_geometry_slot (&g, pos, cw_chair_axial_face (0, pos));
      int    eq = cw_chair_geometry_slot (&g, pos, cw_chair_axial_face (0, pos) == CW_FACE_UP ? CW_FACE_DOWN : CW_FACE_UP);
      double dz = g.atoms[ax].xyz[2] - g.atoms[c].xyz[2];
      int    next = g.ring[pos % 6], next2 = g.ring[(pos + 1) % 6];

      g_assert_true (g.atoms[ax].axial);
      g_assert_false (g.atoms[eq].axial);
      g_assert_cmpfloat_with_epsilon (cw_chair_geometry_distance (&g, c, ax), 1.098, 1e-9);
      g_assert_cmpfloat_with_epsilon (cw_chair_geometry_distance (&g, c, eq), 1.093, 1e-9);
      g_assert_cmpfloat_with_epsilon (cw_chair_geometry_angle (&g, ax, c, eq), 109.47, 1e-6);
      g_assert_cmpfloat (acos (fabs (dz) / 1.098) * 180 / G_PI, <, 5.0);
      /* odd carbons are axial up in chair 1 (DEVELOPERS.md, the model) */
      g_assert_cmpint ((dz > 0), ==, (pos % 2 == 1));
      g_assert_cmpfloat (fabs (cw_chair_geometry_torsion (&g, eq, c, next, next2)), >, 170.0);
    }
}

/* Ring inversion swaps axial and equatorial and keeps faces: 1u-methyl is axial in chair 1 and
 * equatorial in chair 2 (DEVELOPERS.md, the model); its first atom sits 1.530 Å from C1 (Csp3–Csp3, Allen
 * et al. 1987; from memory, unverified). */
static void
test_inversion (void)
{
  CwChairGeometry g1, g2;
  int             s1, s2;

  build ("1u=methyl", 0, &g1);
  build ("1u=methyl", 1, &g2);
  s1 = cw_chair_geometry_slot (&g1, 1, CW_FACE_UP);
  s2 = cw_chair_geometry_slot (&g2, 1, CW_FACE_UP);
  g_assert_cmpint (g1.atoms[s1].kind, ==, CW_ATOM_SUBSTITUENT);
  g_assert_cmpint (g1.atoms[s1].element, ==, CW_EL_C);
  g_assert_true (g1.atoms[s1].axial);
  g_assert_false (g2.atoms[s2].axial);
  g_assert_cmpfloat (g1.atoms[s1].xyz[2], >, g1.atoms[g1.ring[0]].xyz[2]);
  g_assert_cmpfloat (g2.atoms[s2].xyz[2], >, g2.atoms[g2.ring[0]].xyz[2]);
  g_assert_cmpfloat_with_epsilon (cw_chair_geometry_distance (&g1, g1.ring[0], s1), 1.530, 1e-9);
  g_assert_cmpfloat_with_epsilon (cw_chair_geometry_distance (&g2, g2.ring[0], s2), 1.530, 1e-9);
}

/* A trans-1,2 pair is diaxial (anti-periplanar, |φ| near 180°) in one chair and diequatorial
 * (gauche, |φ| near 60°) in the other; a cis-1,2 pair is gauche in both (common practice). */
static void
test_vicinal_torsions (void)
{
  for (int ch = 0; ch < 2; ch++)
    {
      CwChairGeometry t, c;
      double          phi_t, phi_c;

      build ("1u=chloro 2d=chloro", ch, &t);
      build ("1u=chloro 2u=chloro", ch, &c);
      phi_t = cw_chair_geometry_torsion (&t, t.slot[0][CW_FACE_UP], t.ring[0], t.ring[1], t.slot[1][CW_FACE_DOWN]);
      phi_c = cw_chair_geometry_torsion (&c, c.slot[0][CW_FACE_UP], c.ring[0], c.ring[1], c.slot[1][CW_FACE_UP]);
      if (ch == 0)
        g_assert_cmpfloat (fabs (phi_t), >, 170.0);
      else
        g_assert_cmpfloat_with_epsilon (fabs (phi_t), 60.0, 6.0);
      g_assert_cmpfloat_with_epsilon (fabs (phi_c), 60.0, 6.0);
    }
}

/* XYZ (open format): atom count, comment, one "El x y z" line per atom; it round-trips. */
static void
test_xyz (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("cw-xyz-XXXXXX", &error);
  g_autofree char *path = g_build_filename (dir, "chair.xyz", NULL);
  g_autofree char *text = NULL;
  g_auto (GStrv) lines = NULL;
  CwChairGeometry g;

  build ("1u=chloro 4d=tert-butyl", 1, &g);
  g_assert_true (cw_chair_geometry_save_xyz (&g, "test\nchair 2", path, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (path, &text, NULL, &error));
  lines = g_strsplit (text, "\n", -1);
  g_assert_cmpstr (lines[0], ==, "18");
  g_assert_cmpstr (lines[1], ==, "test chair 2");
  for (int i = 0; i < 18; i++)
    {
      g_auto (GStrv) f = g_strsplit_set (g_strstrip (lines[i + 2]), " ", -1);
      GPtrArray *parts = g_ptr_array_new ();
      for (int k = 0; f[k]; k++)
        if (*f[k])
          g_ptr_array_add (parts, f[k]);
      g_assert_cmpuint (parts->len, ==, 4);
      g_assert_cmpstr (g_ptr_array_index (parts, 0), ==, cw_element_symbol (g.atoms[i].element));
      for (int k = 0; k < 3; k++)
        g_assert_cmpfloat_with_epsilon (g_ascii_strtod (g_ptr_array_index (parts, k + 1), NULL),
                                        g.atoms[i].xyz[k], 1e-5);
      g_ptr_array_free (parts, TRUE);
    }
  g_assert_cmpstr (lines[20], ==, "");
  g_assert_false (cw_chair_geometry_save_xyz (&g, NULL, "/nonexistent-dir/x.xyz", &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_IO);
  g_unlink (path);
  g_rmdir (dir);
}

/* The SMILES fragments of the group table: first-atom neighbours and hydrogens by the valence
 * rules of the OpenSMILES specification (organic subset, bracket atoms). */
static void
test_fragments (void)
{
  struct
  {
    const char *smiles;
    CwElement   first;
    int         n_neighbours;
    int         n_h;
  } cases[] = {
    { "C", CW_EL_C, 0, 3 },
    { "C(C)C", CW_EL_C, 2, 1 },
    { "C(C)(C)C", CW_EL_C, 3, 0 },
    { "C1CCCCC1", CW_EL_C, 2, 1 },
    { "c1ccccc1", CW_EL_C, 2, 0 },
    { "C(=O)OC", CW_EL_C, 2, 0 },
    { "C=O", CW_EL_C, 1, 1 },
    { "C#N", CW_EL_C, 1, 0 },
    { "O", CW_EL_O, 0, 1 },
    { "OS(=O)(=O)c1ccc(C)cc1", CW_EL_O, 1, 0 },
    { "N(C)C", CW_EL_N, 2, 0 },
    { "[NH3+]", CW_EL_N, 0, 3 },
    { "[N+](=O)[O-]", CW_EL_N, 2, 0 },
    { "[Si](C)(C)C", CW_EL_SI, 3, 0 },
    { "[Hg]Cl", CW_EL_HG, 1, 0 },
    { "Cl", CW_EL_CL, 0, 0 },
    { "C(F)(F)F", CW_EL_C, 3, 0 },
  };

  for (gsize i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (GError) error = NULL;
      CwFragmentInfo info;

      g_assert_true (cw_fragment_parse (cases[i].smiles, &info, &error));
      g_assert_no_error (error);
      g_assert_cmpint (info.first_atom, ==, cases[i].first);
      g_assert_cmpint (info.n_neighbours, ==, cases[i].n_neighbours);
      g_assert_cmpint (info.n_hydrogens, ==, cases[i].n_h);
    }
  for (const char **bad = (const char *[]){ "C(", "C1CC", ")C", "Xx", "", NULL }; *bad; bad++)
    {
      g_autoptr (GError) error = NULL;
      CwFragmentInfo info;
      g_assert_false (cw_fragment_parse (*bad, &info, &error));
      g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE);
    }
}

/* Every group of the shipped table has a fragment we can read, whose first atom agrees. */
static void
test_table_fragments (void)
{
  for (guint i = 0; i < cw_group_table_get_n_groups (data->groups); i++)
    {
      const CwGroup *grp = cw_group_table_get (data->groups, i);
      CwFragmentInfo info;

      if (grp->first_atom == CW_EL_H || grp->first_atom == CW_EL_D)
        continue;
      cw_fragment_info (grp, &info);
      if (!info.from_smiles)
        g_test_message ("group %s: fragment “%s” not read", grp->id, grp->smiles);
      g_assert_true (info.from_smiles);
    }
}

/* Bad tables are refused with a message naming the field. */
static void
test_bad_table (void)
{
  const char *bad[] = {
    "{}",
    "{\"format\": \"chairwise-geometry\", \"version\": 1}",
    "{\"format\": \"chairwise-geometry\", \"version\": 9}",
    "not json",
  };

  for (gsize i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (CwGeometryData) t = cw_geometry_data_new_from_data (bad[i], strlen (bad[i]), "x.json", &error);
      g_assert_null (t);
      g_assert_nonnull (error);
      g_assert_nonnull (strstr (error->message, "x.json"));
    }
}

/* Edits of the shipped table that must be refused, each with a message naming what is wrong. */
static void
test_bad_edits (void)
{
  struct
  {
    const char *from, *to, *named;
  } edits[] = {
    { "\"value\": 54.9", "\"value\": 60.0", "ring_torsion" }, /* disagrees with the C–C–C angle */
    { "\"default\": \"general\"", "\"default\": \"nope\"", "nope" },
    { "\"p\": [13.70, -0.73", "\"p\": [13.70", "P1 to P7" },
    { "\"element\": \"Cl\", \"length\"", "\"element\": \"Xx\", \"length\"", "Xx" },
    { "\"value\": 1.526", "\"value\": 15.26", "cc_bond" },
  };
  g_autofree char *path = g_build_filename (cw_data_find_dir (), "geometry.json", NULL);
  g_autofree char *text = NULL;
  g_autoptr (GError) error = NULL;

  g_assert_true (g_file_get_contents (path, &text, NULL, &error));
  for (gsize i = 0; i < G_N_ELEMENTS (edits); i++)
    {
      g_autoptr (GString) s = g_string_new (text);
      g_autoptr (CwGeometryData) t = NULL;

      g_assert_cmpuint (g_string_replace (s, edits[i].from, edits[i].to, 1), ==, 1);
      t = cw_geometry_data_new_from_data (s->str, s->len, "edited.json", &error);
      g_assert_null (t);
      g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
      g_test_message ("%s", error->message);
      g_assert_nonnull (strstr (error->message, edits[i].named));
      g_clear_error (&error);
    }
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  gd = test_load_geometry ();
  g_test_add_func ("/core/geometry/ring", test_ring_geometry);
  g_test_add_func ("/core/geometry/hydrogens", test_hydrogens);
  g_test_add_func ("/core/geometry/inversion", test_inversion);
  g_test_add_func ("/core/geometry/vicinal-torsions", test_vicinal_torsions);
  g_test_add_func ("/core/geometry/xyz", test_xyz);
  g_test_add_func ("/core/geometry/fragments", test_fragments);
  g_test_add_func ("/core/geometry/table-fragments", test_table_fragments);
  g_test_add_func ("/core/geometry/bad-table", test_bad_table);
  g_test_add_func ("/core/geometry/bad-edits", test_bad_edits);
  ret = g_test_run ();
  cw_geometry_data_free (gd);
  cw_data_free (data);
  return ret;
}
