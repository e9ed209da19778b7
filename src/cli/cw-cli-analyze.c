#include "config.h"

#include <cjson/cJSON.h>
#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>

#include "cw-cli.h"

G_DEFINE_AUTOPTR_CLEANUP_FUNC (cJSON, cJSON_Delete)

static const char *
orientation (const CwAnalysis *an, int chair, int sub)
{
  return an->chair[chair].axial[sub] ? "axial" : "equatorial";
}

static void
print_chair_text (const CwMolecule *mol, const CwAnalysis *an, int c, CwEnergyUnit unit)
{
  const char *u = cw_energy_unit_symbol (unit);

  printf (_("Chair %d%s: %.2f %s above an unstrained chair\n"), c + 1,
          an->major == c && fabs (an->delta_g) > 0 ? _(" (major)") : "",
          cw_energy_from_kcal (an->chair[c].energy, unit), u);
  for (int i = 0; i < mol->n_subs; i++)
    printf ("    C%d %-4s %-10s %s\n", mol->subs[i].position, cw_face_to_string (mol->subs[i].face),
            mol->subs[i].group->label, orientation (an, c, i));
  for (int k = 0; k < an->chair[c].n_terms; k++)
    {
      const CwTerm *t = &an->chair[c].terms[k];
      g_autofree char *label = cw_term_dup_label (t, mol);
      printf ("    %+7.2f ± %.2f  %s%s\n        [%s]\n", cw_energy_from_kcal (t->energy, unit),
              cw_energy_from_kcal (t->sigma, unit), label, t->estimated ? _(" (estimate)") : "",
              t->source ? t->source : "");
    }
}

static void
print_population (int c, const CwAnalysis *an)
{
  g_autofree char *p = cw_cli_format_percent (an->pop[c]);
  g_autofree char *lo = cw_cli_format_percent (an->pop_low[c]);
  g_autofree char *hi = cw_cli_format_percent (an->pop_high[c]);

  printf (_("Chair %d: %s %% (%s to %s %% for ΔG° ± 2σ)\n"), c + 1, p, lo, hi);
}

static void
print_text (const CwDocument *doc, const CwMolecule *mol, const CwAnalysis *an)
{
  CwEnergyUnit unit = cw_document_get_energy_unit (doc);
  const char *u = cw_energy_unit_symbol (unit);
  g_autofree char *config = cw_molecule_dup_configuration (mol);
  g_autofree char *summary = cw_molecule_dup_summary (mol);
  g_autofree char *temp = cw_format_temperature (an->temperature, cw_document_get_temperature_unit (doc));
  g_autofree char *formula = NULL;
  CwFormula f;

  cw_formula_compute (mol, &f);
  formula = cw_formula_dup_string (&f);
  if (*cw_document_get_title (doc))
    printf ("%s\n", cw_document_get_title (doc));
  printf (_("Ring: %s%s%s%s\n"), summary, *config ? " — " : "", config, "");
  printf (_("Formula %s, M = %.2f g/mol (IUPAC 2021 atomic weights), %.0f degree(s) of unsaturation\n"),
          formula, f.molar_mass, f.unsaturation);
  printf (_("Conditions: %s, %s solvent\n\n"), temp, cw_solvent_to_string (an->solvent));
  for (int c = 0; c < 2; c++)
    {
      print_chair_text (mol, an, c, unit);
      printf ("\n");
    }
  printf (_("ΔG° = G(chair 2) − G(chair 1) = %+.2f ± %.2f %s\n"), cw_energy_from_kcal (an->delta_g, unit),
          cw_energy_from_kcal (an->sigma, unit), u);
  if (an->K > 1e-9 && an->K < 1e9)
    printf (_("K = [chair 2]/[chair 1] = %.4g\n"), an->K);
  else /* beyond double range at low T: the logarithm stays finite */
    printf (_("K = [chair 2]/[chair 1] = 10^%.2f\n"), -an->delta_g / (CW_R_KCAL * an->temperature * G_LN10));
  print_population (0, an);
  print_population (1, an);
  printf (_("Ring inversion: barrier ≈ %.1f %s from the lower chair; k(1→2) = %.3g s⁻¹, "
            "k(2→1) = %.3g s⁻¹; equilibration half-life %.3g s\n"),
          cw_energy_from_kcal (an->barrier, unit), u, an->k_forward, an->k_reverse,
          log (2.0) / (an->k_forward + an->k_reverse));
  if (an->n_flags > 0)
    printf (_("\nNotes:\n"));
  for (int i = 0; i < an->n_flags; i++)
    {
      g_autofree char *msg = cw_flag_dup_message (&an->flags[i], mol, unit);
      printf ("  [%s] %s\n", cw_flag_code_to_string (an->flags[i].code), msg);
    }
  printf ("\n%s\n", cw_caution_text ());
}

static cJSON *
term_json (const CwTerm *t, const CwMolecule *mol)
{
  cJSON *o = cJSON_CreateObject ();
  g_autofree char *label = cw_term_dup_label (t, mol);

  cJSON_AddStringToObject (o, "kind", cw_term_kind_to_string (t->kind));
  cJSON_AddStringToObject (o, "label", label);
  cJSON_AddNumberToObject (o, "substituent_a", t->sub_a);
  if (t->sub_b >= 0)
    cJSON_AddNumberToObject (o, "substituent_b", t->sub_b);
  cJSON_AddNumberToObject (o, "energy_kcal_mol", t->energy);
  cJSON_AddNumberToObject (o, "sigma_kcal_mol", t->sigma);
  cJSON_AddBoolToObject (o, "estimated", t->estimated);
  cJSON_AddBoolToObject (o, "temperature_dependent", t->temperature_dependent);
  cJSON_AddStringToObject (o, "source", t->source ? t->source : "");
  return o;
}

static cJSON *
chair_json (const CwMolecule *mol, const CwAnalysis *an, int c)
{
  cJSON *o = cJSON_CreateObject ();
  cJSON *subs = cJSON_AddArrayToObject (o, "substituents");
  cJSON *terms = cJSON_AddArrayToObject (o, "terms");

  cJSON_AddNumberToObject (o, "chair", c + 1);
  cJSON_AddNumberToObject (o, "energy_kcal_mol", an->chair[c].energy);
  cJSON_AddNumberToObject (o, "population", an->pop[c]);
  for (int i = 0; i < mol->n_subs; i++)
    {
      cJSON *s = cJSON_CreateObject ();
      cJSON_AddNumberToObject (s, "index", i);
      cJSON_AddNumberToObject (s, "position", mol->subs[i].position);
      cJSON_AddStringToObject (s, "face", cw_face_to_string (mol->subs[i].face));
      cJSON_AddStringToObject (s, "group", mol->subs[i].group->id);
      cJSON_AddStringToObject (s, "label", mol->subs[i].group->label);
      cJSON_AddStringToObject (s, "orientation", orientation (an, c, i));
      cJSON_AddItemToArray (subs, s);
    }
  for (int k = 0; k < an->chair[c].n_terms; k++)
    cJSON_AddItemToArray (terms, term_json (&an->chair[c].terms[k], mol));
  return o;
}

static void
add_pair (cJSON *o, const char *key, double a, double b)
{
  cJSON *arr = cJSON_AddArrayToObject (o, key);
  cJSON_AddItemToArray (arr, cJSON_CreateNumber (a));
  cJSON_AddItemToArray (arr, cJSON_CreateNumber (b));
}

static void
add_molecule_info (cJSON *o, const CwDocument *doc, const CwMolecule *mol)
{
  g_autofree char *config = cw_molecule_dup_configuration (mol);
  g_autofree char *spec = cw_molecule_dup_spec (mol);
  g_autofree char *formula = NULL;
  CwFormula f;

  cw_formula_compute (mol, &f);
  formula = cw_formula_dup_string (&f);
  cJSON_AddStringToObject (o, "title", cw_document_get_title (doc));
  cJSON_AddStringToObject (o, "ring", spec);
  cJSON_AddStringToObject (o, "configuration", config);
  cJSON_AddStringToObject (o, "formula", formula);
  cJSON_AddNumberToObject (o, "molar_mass_g_mol", f.molar_mass);
  cJSON_AddNumberToObject (o, "degrees_of_unsaturation", f.unsaturation);
}

cJSON *cw_cli_analysis_json (const CwDocument *doc, const CwMolecule *mol, const CwAnalysis *an);

cJSON *
cw_cli_analysis_json (const CwDocument *doc, const CwMolecule *mol, const CwAnalysis *an)
{
  cJSON *o = cJSON_CreateObject ();
  cJSON *chairs, *flags, *inv;

  cJSON_AddStringToObject (o, "format", "chairwise-analysis");
  cJSON_AddNumberToObject (o, "version", 1);
  add_molecule_info (o, doc, mol);
  cJSON_AddNumberToObject (o, "temperature_k", an->temperature);
  cJSON_AddStringToObject (o, "solvent", cw_solvent_to_string (an->solvent));
  cJSON_AddStringToObject (o, "sign_convention",
                           "delta_g = G(chair 2) - G(chair 1); positive: chair 1 is favoured; K = [chair 2]/[chair 1]");
  cJSON_AddNumberToObject (o, "delta_g_kcal_mol", an->delta_g);
  cJSON_AddNumberToObject (o, "delta_g_sigma_kcal_mol", an->sigma);
  cJSON_AddNumberToObject (o, "delta_g_kj_mol", an->delta_g * CW_J_PER_CAL);
  cJSON_AddNumberToObject (o, "delta_g_sigma_kj_mol", an->sigma * CW_J_PER_CAL);
  cJSON_AddNumberToObject (o, "K", an->K);
  cJSON_AddNumberToObject (o, "log10_K", -an->delta_g / (CW_R_KCAL * an->temperature * G_LN10));
  cJSON_AddNumberToObject (o, "population_chair1", an->pop[0]);
  cJSON_AddNumberToObject (o, "population_chair2", an->pop[1]);
  add_pair (o, "population_chair1_interval", an->pop_low[0], an->pop_high[0]);
  add_pair (o, "population_chair2_interval", an->pop_low[1], an->pop_high[1]);
  cJSON_AddNumberToObject (o, "major_chair", an->major + 1);
  chairs = cJSON_AddArrayToObject (o, "chairs");
  for (int c = 0; c < 2; c++)
    cJSON_AddItemToArray (chairs, chair_json (mol, an, c));
  inv = cJSON_AddObjectToObject (o, "ring_inversion");
  cJSON_AddNumberToObject (inv, "barrier_kcal_mol", an->barrier);
  cJSON_AddNumberToObject (inv, "k_forward_per_s", an->k_forward);
  cJSON_AddNumberToObject (inv, "k_reverse_per_s", an->k_reverse);
  cJSON_AddNumberToObject (inv, "equilibration_half_life_s", log (2.0) / (an->k_forward + an->k_reverse));
  cJSON_AddNumberToObject (o, "twist_boat_estimate_kcal_mol", an->twist_boat);
  flags = cJSON_AddArrayToObject (o, "flags");
  for (int i = 0; i < an->n_flags; i++)
    {
      cJSON *f = cJSON_CreateObject ();
      g_autofree char *msg = cw_flag_dup_message (&an->flags[i], mol, CW_UNIT_KCAL);
      cJSON_AddStringToObject (f, "code", cw_flag_code_to_string (an->flags[i].code));
      cJSON_AddStringToObject (f, "message", msg);
      cJSON_AddItemToArray (flags, f);
    }
  cJSON_AddStringToObject (o, "caution", cw_caution_text ());
  return o;
}

static void
print_csv (const CwDocument *doc, const CwMolecule *mol, const CwAnalysis *an, gboolean header)
{
  g_autofree char *config = cw_molecule_dup_configuration (mol);
  g_autofree char *spec = cw_molecule_dup_spec (mol);
  GString *codes = g_string_new (NULL);

  for (int i = 0; i < an->n_flags; i++)
    g_string_append_printf (codes, "%s%s", i ? ";" : "", cw_flag_code_to_string (an->flags[i].code));
  if (header)
    printf ("ring,configuration,temperature_k,delta_g_kcal_mol,delta_g_sigma_kcal_mol,K,"
          "population_chair1,population_chair2,population_chair1_low,population_chair1_high,"
          "major_chair,flags\n");
  printf ("\"%s\",\"%s\",%.2f,%.4f,%.4f,%.6g,%.6f,%.6f,%.6f,%.6f,%d,\"%s\"\n", spec, config,
          an->temperature, an->delta_g, an->sigma, an->K, an->pop[0], an->pop[1], an->pop_low[0],
          an->pop_high[0], an->major + 1, codes->str);
  g_string_free (codes, TRUE);
}

int
cw_cli_analyze (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — both chairs, every term, ΔG°, K and populations"));
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autoptr (GPtrArray) docs = NULL;
  g_autoptr (cJSON) array = NULL;
  int code = CW_EXIT_OK;

  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_CONDITIONS | CW_CLI_OPTIONS_FORMATS);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "analyze", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "analyze", _("too many arguments"));
  if (input.json && input.csv)
    return cw_cli_usage_error (context, "analyze", _("choose one of --json and --csv"));
  docs = cw_cli_input_load_all (&input, argc > 1 ? argv[1] : NULL, &data, &code);
  if (docs == NULL)
    return code;
  if (input.json && docs->len > 1)
    array = cJSON_CreateArray ();
  for (guint i = 0; i < docs->len; i++)
    {
      const CwDocument *doc = g_ptr_array_index (docs, i);
      const CwMolecule *mol = cw_document_peek_molecule (doc);
      CwConditions cond;
      CwAnalysis an;

      cw_document_get_conditions (doc, &cond);
      if (!cw_analyze (data, mol, &cond, &an, &error))
        return cw_cli_error ("analyze", CW_EXIT_ANALYSIS, "%s", error->message);
      if (docs->len > 1 && !input.json)
        printf (_("%s── cis/trans isomer %u of %u ──\n"), i ? "\n" : "", i + 1, docs->len);
      if (array != NULL)
        cJSON_AddItemToArray (array, cw_cli_analysis_json (doc, mol, &an));
      else if (input.json)
        {
          g_autoptr (cJSON) o = cw_cli_analysis_json (doc, mol, &an);
          g_autofree char *s = cJSON_Print (o);
          printf ("%s\n", s);
        }
      else if (input.csv)
        print_csv (doc, mol, &an, i == 0);
      else
        print_text (doc, mol, &an);
    }
  if (array != NULL)
    {
      g_autofree char *s = cJSON_Print (array);
      printf ("%s\n", s);
    }
  if (input.csv)
    printf ("# %s\n", cw_caution_text ());
  return CW_EXIT_OK;
}
