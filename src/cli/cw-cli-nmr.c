#include "config.h"

#include <cjson/cJSON.h>
#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "cw-cli-nmr-private.h"
#include "cw-cli.h"
#include "cw-couplings.h"
#include "cw-geometry.h"

/* chairwise-calc geometry and couplings: the 3D chairs (XYZ) and the ring-proton couplings,
 * with the inverse (populations from a measured coupling or width). */

G_DEFINE_AUTOPTR_CLEANUP_FUNC (cJSON, cJSON_Delete)

gboolean
cw_cli_nmr_setup (CwCliNmrContext *ctx, CwCliInput *input, const char *path, const char *cmd, int *code)
{
  g_autoptr (GError) error = NULL;
  CwConditions cond;

  ctx->doc = cw_cli_input_load (input, path, &ctx->data, code);
  if (ctx->doc == NULL)
    return FALSE;
  ctx->gd = cw_geometry_data_new_from_dir (input->data_dir, &error);
  if (ctx->gd == NULL)
    {
      *code = cw_cli_error (cmd, CW_EXIT_ANALYSIS, _("cannot load the geometry table: %s"), error->message);
      return FALSE;
    }
  ctx->mol = cw_document_peek_molecule (ctx->doc);
  cw_document_get_conditions (ctx->doc, &cond);
  if (!cw_analyze (ctx->data, ctx->mol, &cond, &ctx->an, &error))
    {
      *code = cw_cli_error (cmd, CW_EXIT_ANALYSIS, "%s", error->message);
      return FALSE;
    }
  return TRUE;
}

void
cw_cli_nmr_clear (CwCliNmrContext *ctx)
{
  g_clear_pointer (&ctx->doc, cw_document_free);
  g_clear_pointer (&ctx->data, cw_data_free);
  g_clear_pointer (&ctx->gd, cw_geometry_data_free);
}

char *
cw_cli_nmr_percent (double x)
{
  return cw_cli_format_percent (x);
}

void
cw_cli_nmr_print_header (const CwCliNmrContext *ctx)
{
  g_autofree char *summary = cw_molecule_dup_summary (ctx->mol);
  g_autofree char *config = cw_molecule_dup_configuration (ctx->mol);
  g_autofree char *temp = cw_format_temperature (ctx->an.temperature, cw_document_get_temperature_unit (ctx->doc));
  g_autofree char *p1 = cw_cli_nmr_percent (ctx->an.pop[0]);
  g_autofree char *p2 = cw_cli_nmr_percent (ctx->an.pop[1]);

  if (*cw_document_get_title (ctx->doc))
    printf ("%s\n", cw_document_get_title (ctx->doc));
  printf (_("Ring: %s%s%s\n"), summary, *config ? " — " : "", config);
  printf (_("At %s: chair 1 %s %%, chair 2 %s %%\n\n"), temp, p1, p2);
}

void
cw_cli_nmr_add_header_json (cJSON *o, const CwCliNmrContext *ctx, const char *format)
{
  g_autofree char *spec = cw_molecule_dup_spec (ctx->mol);
  g_autofree char *config = cw_molecule_dup_configuration (ctx->mol);
  cJSON           *pop;

  cJSON_AddStringToObject (o, "format", format);
  cJSON_AddNumberToObject (o, "version", 1);
  cJSON_AddStringToObject (o, "title", cw_document_get_title (ctx->doc));
  cJSON_AddStringToObject (o, "ring", spec);
  cJSON_AddStringToObject (o, "configuration", config);
  cJSON_AddNumberToObject (o, "temperature_k", ctx->an.temperature);
  pop = cJSON_AddArrayToObject (o, "populations");
  cJSON_AddItemToArray (pop, cJSON_CreateNumber (ctx->an.pop[0]));
  cJSON_AddItemToArray (pop, cJSON_CreateNumber (ctx->an.pop[1]));
}

void
cw_cli_nmr_print_json (cJSON *o)
{
  g_autofree char *s = NULL;

  cJSON_AddStringToObject (o, "caution", cw_caution_text ());
  s = cJSON_Print (o);
  printf ("%s\n", s);
}

/* ---- geometry ---- */

static cJSON *
geometry_json (const CwCliNmrContext *ctx, const CwChairGeometry *g)
{
  cJSON *o = cJSON_CreateObject ();
  cJSON *atoms;

  cw_cli_nmr_add_header_json (o, ctx, "chairwise-geometry-3d");
  cJSON_AddNumberToObject (o, "chair", g->chair + 1);
  cJSON_AddNumberToObject (o, "population", ctx->an.pop[g->chair]);
  cJSON_AddStringToObject (o, "units", "angstrom");
  atoms = cJSON_AddArrayToObject (o, "atoms");
  for (int i = 0; i < g->n_atoms; i++)
    {
      const CwAtom3D *a = &g->atoms[i];
      cJSON          *x = cJSON_CreateObject ();
      cJSON          *xyz = cJSON_AddArrayToObject (x, "xyz");

      cJSON_AddStringToObject (x, "element", cw_element_symbol (a->element));
      cJSON_AddStringToObject (x, "kind", a->kind == CW_ATOM_RING ? "ring" : a->kind == CW_ATOM_HYDROGEN ? "hydrogen"
                                                                                                         : "substituent");
      cJSON_AddNumberToObject (x, "position", a->position);
      if (a->kind != CW_ATOM_RING)
        {
          cJSON_AddStringToObject (x, "face", cw_face_to_string (a->face));
          cJSON_AddStringToObject (x, "orientation", a->axial ? "axial" : "equatorial");
        }
      if (a->sub >= 0)
        cJSON_AddStringToObject (x, "group", ctx->mol->subs[a->sub].group->id);
      for (int k = 0; k < 3; k++)
        cJSON_AddItemToArray (xyz, cJSON_CreateNumber (round (a->xyz[k] * 1e5) / 1e5));
      cJSON_AddItemToArray (atoms, x);
    }
  cJSON_AddStringToObject (o, "geometry_source", ctx->gd->cc_bond.source);
  return o;
}

int
cw_cli_geometry (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_auto (CwCliNmrContext) ctx = { 0 };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — idealised 3D coordinates of a chair (XYZ)"));
  g_autoptr (GError) error = NULL;
  g_autofree char *output = NULL;
  g_autofree char *comment = NULL;
  g_autofree char *spec = NULL;
  int              chair = 0, code = CW_EXIT_OK;
  CwChairGeometry  g;
  GOptionEntry     entries[] = {
        { "chair", 'c', 0, G_OPTION_ARG_INT, &chair, N_("Chair 1 or 2 (default: the major chair)"), "N" },
          { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, N_("Write the XYZ file here (default: standard output)"), "FILE.xyz" },
            { NULL } };

  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_CONDITIONS | CW_CLI_OPTIONS_FORMATS);
  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "geometry", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "geometry", _("too many arguments"));
  if (chair != 0 && chair != 1 && chair != 2)
    return cw_cli_usage_error (context, "geometry", _("--chair must be 1 or 2"));
  if (input.csv)
    return cw_cli_usage_error (context, "geometry", _("--csv is not offered here; use --json or XYZ"));
  if (!cw_cli_nmr_setup (&ctx, &input, argc > 1 ? argv[1] : NULL, "geometry", &code))
    return code;
  if (chair == 0)
    chair = ctx.an.major + 1;
  if (!cw_chair_geometry_build (ctx.gd, ctx.mol, chair - 1, &g, &error))
    return cw_cli_error ("geometry", CW_EXIT_ANALYSIS, "%s", error->message);
  if (input.json)
    {
      g_autoptr (cJSON) o = geometry_json (&ctx, &g);
      cw_cli_nmr_print_json (o);
      return CW_EXIT_OK;
    }
  spec = cw_molecule_dup_spec (ctx.mol);
  comment = g_strdup_printf ("Chairwise chair %d of %s (%.1f %% at %.1f K); idealised geometry, an estimate",
                             chair, spec, 100 * ctx.an.pop[chair - 1], ctx.an.temperature);
  if (output == NULL)
    {
      g_autofree char *text = cw_chair_geometry_to_xyz (&g, comment);
      fputs (text, stdout);
      return CW_EXIT_OK;
    }
  if (!cw_chair_geometry_save_xyz (&g, comment, output, &error))
    return cw_cli_error ("geometry", CW_EXIT_ANALYSIS, _("cannot write “%s”: %s"), output, error->message);
  fprintf (stderr, _("chairwise-calc geometry: wrote chair %d (%d atoms) to %s\n"), chair, g.n_atoms, output);
  return CW_EXIT_OK;
}

/* ---- couplings ---- */

static const char *
orient (gboolean axial)
{
  return axial ? "ax" : "eq";
}

static void
print_couplings_text (const CwCliNmrContext *ctx, const CwCouplings *c)
{
  cw_cli_nmr_print_header (ctx);
  printf (_("Ring protons (chair 1 | chair 2 | averaged; first-order multiplets include ²J = %.1f Hz for CH₂):\n"),
             c->geminal);
  for (int i = 0; i < c->n_protons; i++)
    {
      const CwRingProton *p = &c->protons[i];
      g_autofree char    *label = cw_ring_proton_dup_label (p);
      g_autofree char    *m0 = cw_multiplet_dup_text (&p->multiplet[0]);
      g_autofree char    *m1 = cw_multiplet_dup_text (&p->multiplet[1]);
      g_autofree char    *ma = cw_multiplet_dup_text (&p->multiplet[2]);

      printf ("  %-10s %s|%s  %s | %s | %s\n", label, orient (p->axial[0]), orient (p->axial[1]), m0, m1, ma);
      printf (_("             width (Σ ³J): %.1f | %.1f | %.1f Hz\n"), p->width[0], p->width[1], p->width_avg);
    }
  printf (_("\nVicinal couplings ³J(H,H), Hz (torsion H–C–C–H in degrees):\n"));
  for (int i = 0; i < c->n_vicinal; i++)
    {
      const CwVicinalCoupling *v = &c->vicinal[i];
      g_autofree char         *a = cw_ring_proton_dup_label (&c->protons[v->proton_a]);
      g_autofree char         *b = cw_ring_proton_dup_label (&c->protons[v->proton_b]);

      printf ("  %-10s %-10s  chair 1 %5.1f (%+6.1f°, %s/%s)  chair 2 %5.1f (%+6.1f°, %s/%s)  avg %5.1f\n", a, b,
              v->j[0], v->torsion[0], orient (c->protons[v->proton_a].axial[0]), orient (c->protons[v->proton_b].axial[0]),
              v->j[1], v->torsion[1], orient (c->protons[v->proton_a].axial[1]), orient (c->protons[v->proton_b].axial[1]),
              v->j_avg);
    }
  printf (_("\nKarplus: Haasnoot, de Leeuw & Altona 1980, set “%s”. [%s]\n"), c->set_request,
             c->n_vicinal > 0 ? c->vicinal[0].set->source : "");
  printf (_("ξ convention: %s\n"), ctx->gd->xi_convention);
  printf (_("²J: %s\n"), c->geminal_source);
  if (c->fragment_unknown)
    printf (_("Note: a group's attached atoms are unknown; its electronegativity correction leaves out β-atoms.\n"));
  printf ("\n%s\n", cw_caution_text ());
}

static cJSON *
multiplet_json (const CwMultiplet *m)
{
  cJSON           *o = cJSON_CreateObject ();
  cJSON           *j = cJSON_AddArrayToObject (o, "j_hz");
  g_autofree char *text = cw_multiplet_dup_text (m);

  cJSON_AddStringToObject (o, "pattern", m->pattern);
  cJSON_AddStringToObject (o, "text", text);
  for (int i = 0; i < m->n_j; i++)
    cJSON_AddItemToArray (j, cJSON_CreateNumber (round (m->j[i] * 100) / 100));
  return o;
}

static void
add_triple (cJSON *o, const char *key, double a, double b, double avg)
{
  cJSON *arr = cJSON_AddArrayToObject (o, key);

  cJSON_AddItemToArray (arr, cJSON_CreateNumber (a));
  cJSON_AddItemToArray (arr, cJSON_CreateNumber (b));
  if (!isnan (avg))
    cJSON_AddItemToArray (arr, cJSON_CreateNumber (avg));
}

static cJSON *
couplings_json (const CwCliNmrContext *ctx, const CwCouplings *c)
{
  cJSON *o = cJSON_CreateObject ();
  cJSON *protons, *vic;

  cw_cli_nmr_add_header_json (o, ctx, "chairwise-couplings");
  cJSON_AddStringToObject (o, "karplus_set", c->set_request);
  cJSON_AddStringToObject (o, "xi_convention", ctx->gd->xi_convention);
  cJSON_AddNumberToObject (o, "geminal_hz", c->geminal);
  cJSON_AddStringToObject (o, "geminal_source", c->geminal_source);
  protons = cJSON_AddArrayToObject (o, "protons");
  for (int i = 0; i < c->n_protons; i++)
    {
      const CwRingProton *p = &c->protons[i];
      cJSON              *x = cJSON_CreateObject ();
      cJSON              *ms = cJSON_AddArrayToObject (x, "multiplets");
      g_autofree char    *label = cw_ring_proton_dup_label (p);

      cJSON_AddNumberToObject (x, "index", i);
      cJSON_AddStringToObject (x, "label", label);
      cJSON_AddNumberToObject (x, "position", p->position);
      cJSON_AddStringToObject (x, "face", cw_face_to_string (p->face));
      cJSON_AddStringToObject (x, "orientation_chair1", p->axial[0] ? "axial" : "equatorial");
      cJSON_AddStringToObject (x, "orientation_chair2", p->axial[1] ? "axial" : "equatorial");
      add_triple (x, "width_hz", p->width[0], p->width[1], p->width_avg);
      for (int ch = 0; ch < 3; ch++)
        cJSON_AddItemToArray (ms, multiplet_json (&p->multiplet[ch]));
      cJSON_AddItemToArray (protons, x);
    }
  vic = cJSON_AddArrayToObject (o, "vicinal");
  for (int i = 0; i < c->n_vicinal; i++)
    {
      const CwVicinalCoupling *v = &c->vicinal[i];
      cJSON                   *x = cJSON_CreateObject ();

      cJSON_AddNumberToObject (x, "proton_a", v->proton_a);
      cJSON_AddNumberToObject (x, "proton_b", v->proton_b);
      add_triple (x, "j_hz", v->j[0], v->j[1], v->j_avg);
      add_triple (x, "torsion_deg", v->torsion[0], v->torsion[1], NAN);
      cJSON_AddStringToObject (x, "parameter_set", v->set->id);
      cJSON_AddItemToArray (vic, x);
    }
  return o;
}

static int
run_inverse (const CwCliNmrContext *ctx, const CwCouplings *c, const char *proton_text, const char *partner_text, double observed, gboolean json)
{
  g_autoptr (GError) error = NULL;
  CwEnergyUnit     unit = cw_document_get_energy_unit (ctx->doc);
  int              proton = cw_couplings_parse_proton (c, proton_text, &error);
  int              partner = -1;
  g_autofree char *msg = NULL;
  CwInverseResult  r;
  double           predicted;

  if (proton < 0)
    return cw_cli_error ("couplings", CW_EXIT_USAGE, "--proton: %s", error->message);
  if (partner_text != NULL && (partner = cw_couplings_parse_proton (c, partner_text, &error)) < 0)
    return cw_cli_error ("couplings", CW_EXIT_USAGE, "--partner: %s", error->message);
  if (!cw_couplings_solve (ctx->gd, c, proton, partner, observed, &r, &error))
    return cw_cli_error ("couplings", CW_EXIT_USAGE, "%s", error->message);
  msg = cw_inverse_dup_message (&r, unit);
  predicted = partner < 0 ? c->protons[proton].width_avg
                          : c->vicinal[cw_couplings_find_vicinal (c, proton, partner)].j_avg;
  if (json)
    {
      g_autoptr (cJSON) o = cJSON_CreateObject ();
      cw_cli_nmr_add_header_json (o, ctx, "chairwise-coupling-inverse");
      cJSON_AddNumberToObject (o, "proton", proton);
      cJSON_AddNumberToObject (o, "partner", partner);
      cJSON_AddStringToObject (o, "observable", partner < 0 ? "width" : "coupling");
      cJSON_AddNumberToObject (o, "observed_hz", observed);
      cJSON_AddNumberToObject (o, "predicted_hz", predicted);
      cJSON_AddStringToObject (o, "status", cw_inverse_status_to_string (r.status));
      add_triple (o, "chair_values_hz", r.chair_value[0], r.chair_value[1], NAN);
      if (!isnan (r.pop[0]))
        add_triple (o, "solved_populations", r.pop[0], r.pop[1], NAN);
      if (!isnan (r.delta_g))
        cJSON_AddNumberToObject (o, "delta_g_kcal_mol", r.delta_g);
      cJSON_AddStringToObject (o, "message", msg);
      cJSON_AddStringToObject (o, "method", "averaged couplings: observed = x1*J(chair 1) + x2*J(chair 2), "
                                            "with the pure-chair values from the Karplus model");
      cw_cli_nmr_print_json (o);
    }
  else
    {
      g_autofree char *a = cw_ring_proton_dup_label (&c->protons[proton]);
      g_autofree char *b = partner >= 0 ? cw_ring_proton_dup_label (&c->protons[partner]) : NULL;

      cw_cli_nmr_print_header (ctx);
      if (b)
        printf (_("Measured ³J(%s, %s) = %.2f Hz\n"), a, b, observed);
      else
        printf (_("Measured width (Σ ³J) of %s = %.2f Hz\n"), a, observed);
      printf ("%s\n", msg);
      printf (_("For comparison, the additive model predicts %.1f Hz at this temperature.\n"), predicted);
      printf (_("The pure-chair values come from the Karplus model, not from locked model compounds.\n"));
      printf ("\n%s\n", cw_caution_text ());
    }
  return r.status == CW_INVERSE_OUTSIDE ? CW_EXIT_ANALYSIS : CW_EXIT_OK;
}

int
cw_cli_couplings (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_auto (CwCliNmrContext) ctx = { 0 };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — ring-proton couplings in each chair and averaged"));
  g_autoptr (GError) error = NULL;
  g_autofree char *set = NULL;
  g_autofree char *proton = NULL;
  g_autofree char *partner = NULL;
  g_autofree char *observed = NULL;
  g_autofree char *width = NULL;
  CwCouplings     *c;
  int              code = CW_EXIT_OK;
  double           value = 0;
  GOptionEntry     entries[] = {
        { "karplus-set", 'k', 0, G_OPTION_ARG_STRING, &set, N_("Parameter set: general, two, three, four or by-substituents"), "ID" },
          { "proton", 'p', 0, G_OPTION_ARG_STRING, &proton, N_("For the inverse: the proton, e.g. 1 or 2u"), "H" },
            { "partner", 0, 0, G_OPTION_ARG_STRING, &partner, N_("With --coupling: the vicinal partner proton"), "H" },
              { "coupling", 'J', 0, G_OPTION_ARG_STRING, &observed, N_("Measured coupling to --partner, Hz"), "HZ" },
                { "width", 'w', 0, G_OPTION_ARG_STRING, &width, N_("Measured width (sum of vicinal couplings) of --proton, Hz"), "HZ" },
                  { NULL } };

  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_CONDITIONS | CW_CLI_OPTIONS_FORMATS);
  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "couplings", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "couplings", _("too many arguments"));
  if (input.csv)
    return cw_cli_usage_error (context, "couplings", _("--csv is not offered here; use --json"));
  if ((observed != NULL) + (width != NULL) > 1 || ((observed || width) && proton == NULL) ||
      (observed && partner == NULL) || (width && partner != NULL) || (proton && !observed && !width))
    return cw_cli_usage_error (context, "couplings",
                               _("for the inverse give --proton with either --coupling and --partner, or --width"));
  if (observed || width)
    {
      char       *end = NULL;
      const char *text = observed ? observed : width;
      value = g_ascii_strtod (text, &end);
      if (end == text || *end != '\0' || !isfinite (value))
        return cw_cli_error ("couplings", CW_EXIT_USAGE, _("“%s” is not a number of hertz"), text);
    }
  if (!cw_cli_nmr_setup (&ctx, &input, argc > 1 ? argv[1] : NULL, "couplings", &code))
    return code;
  c = g_new0 (CwCouplings, 1);
  if (!cw_couplings_compute (ctx.gd, ctx.mol, ctx.an.pop, ctx.an.temperature, set, c, &error))
    code = cw_cli_error ("couplings", CW_EXIT_USAGE, "%s", error->message);
  else if (observed || width)
    code = run_inverse (&ctx, c, proton, partner, value, input.json);
  else if (input.json)
    {
      g_autoptr (cJSON) o = couplings_json (&ctx, c);
      cw_cli_nmr_print_json (o);
    }
  else
    print_couplings_text (&ctx, c);
  g_free (c);
  return code;
}
