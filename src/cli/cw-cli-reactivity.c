#include "config.h"

#include <cjson/cJSON.h>
#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>

#include "cw-cli-nmr-private.h"
#include "cw-cli.h"
#include "cw-reactivity.h"

/* chairwise-calc reactivity: anti-periplanar β-hydrogens of each leaving group, the reactive
 * fraction, the possible E2 alkenes and anti-periplanar neighbouring pairs. */

G_DEFINE_AUTOPTR_CLEANUP_FUNC (cJSON, cJSON_Delete)

static char *
sub_name (const CwMolecule *mol, int sub)
{
  return g_strdup_printf ("%s(%d)", mol->subs[sub].group->label, mol->subs[sub].position);
}

static void
print_anti (const CwLeavingGroup *lg, int ch)
{
  printf (_("    chair %d: %s"), ch + 1, lg->axial[ch] ? _("axial") : _("equatorial"));
  if (lg->n_anti[ch] == 0)
    printf (_(", no anti-periplanar β-H on the ring"));
  for (int i = 0; i < lg->n_anti[ch]; i++)
    printf (_("%s %s-%d %s (%.0f°)"), i == 0 ? _(", anti-periplanar β-H:") : ",",
                                                   lg->anti[ch][i].deuterium ? "D" : "H", lg->anti[ch][i].position,
                                                   lg->anti[ch][i].face == CW_FACE_UP ? _("up") : _("down"), lg->anti[ch][i].torsion);
  printf ("\n");
}

static void
print_alkene (const CwAlkene *al, int n_alkenes, const CwMolecule *mol)
{
  g_autofree char *label = cw_alkene_dup_label (al, mol);
  g_autofree char *fraction = cw_cli_nmr_percent (al->fraction);
  const char      *chairs = (al->chair_ok[0] && al->chair_ok[1]) ? _("chairs 1 and 2") : al->chair_ok[0] ? _("chair 1") : _("chair 2");

  printf (_("    possible alkene: %s%s, from %s (%s %% of molecules)\n"), label,
             al->most_substituted && n_alkenes > 1 ? _(", the more substituted") : "", chairs, fraction);
}

static void
print_text (const CwCliNmrContext *ctx, const CwReactivity *r)
{
  cw_cli_nmr_print_header (ctx);
  for (int i = 0; i < r->n_groups; i++)
    {
      const CwLeavingGroup *lg = &r->groups[i];
      g_autofree char      *name = sub_name (ctx->mol, lg->sub);
      g_autofree char      *frac = cw_cli_nmr_percent (lg->reactive_fraction);

      printf (_("Leaving group %s:\n"), name);
      print_anti (lg, 0);
      print_anti (lg, 1);
      printf (_("    molecules in a chair that can undergo anti E2: %s %%\n"), frac);
      for (int k = 0; k < lg->n_alkenes; k++)
        print_alkene (&lg->alkenes[k], lg->n_alkenes, ctx->mol);
      printf ("\n");
    }
  for (int i = 0; i < r->n_pairs; i++)
    {
      const CwAntiPair *p = &r->pairs[i];
      g_autofree char  *a = sub_name (ctx->mol, p->sub_a);
      g_autofree char  *b = sub_name (ctx->mol, p->sub_b);

      printf (_("Vicinal pair %s / %s (%s): anti-periplanar in chair 1 %s, chair 2 %s; %.3g %% of molecules\n"),
                 a, b, cw_anti_pair_role_to_string (p->role), p->anti[0] ? _("yes") : _("no"), p->anti[1] ? _("yes") : _("no"), 100 * p->fraction);
    }
  if (r->n_groups == 0 && r->n_pairs == 0 && r->n_warnings == 0)
    printf (_("Nothing to report.\n"));
  if (r->n_warnings > 0)
    printf (_("%sNotes:\n"), r->n_pairs > 0 ? "\n" : "");
  for (int i = 0; i < r->n_warnings; i++)
    {
      g_autofree char *msg = cw_react_warning_dup_message (&r->warnings[i], ctx->mol);
      printf ("  [%s] %s\n", cw_react_warning_code_to_string (r->warnings[i].code), msg);
    }
  printf (_("\nRates: with fast ring inversion (Curtin–Hammett) the rate goes with the fraction of molecules "
            "in a chair that has the anti-periplanar arrangement, taking equal rate constants for those chairs.\n"));
  printf ("\n%s\n", cw_caution_text ());
}

static cJSON *
anti_json (const CwLeavingGroup *lg, int ch)
{
  cJSON *arr = cJSON_CreateArray ();

  for (int i = 0; i < lg->n_anti[ch]; i++)
    {
      cJSON *h = cJSON_CreateObject ();
      cJSON_AddNumberToObject (h, "position", lg->anti[ch][i].position);
      cJSON_AddStringToObject (h, "face", cw_face_to_string (lg->anti[ch][i].face));
      cJSON_AddNumberToObject (h, "torsion_deg", lg->anti[ch][i].torsion);
      cJSON_AddBoolToObject (h, "deuterium", lg->anti[ch][i].deuterium);
      cJSON_AddItemToArray (arr, h);
    }
  return arr;
}

static cJSON *
alkene_json (const CwAlkene *al, const CwMolecule *mol)
{
  cJSON           *o = cJSON_CreateObject ();
  cJSON           *chairs = cJSON_AddArrayToObject (o, "chairs");
  g_autofree char *label = cw_alkene_dup_label (al, mol);

  cJSON_AddStringToObject (o, "label", label);
  cJSON_AddNumberToObject (o, "position_a", al->position_a);
  cJSON_AddNumberToObject (o, "position_b", al->position_b);
  cJSON_AddBoolToObject (o, "exocyclic", al->position_b == 0);
  cJSON_AddNumberToObject (o, "substitution", al->substitution);
  cJSON_AddBoolToObject (o, "most_substituted", al->most_substituted);
  cJSON_AddNumberToObject (o, "fraction", al->fraction);
  for (int ch = 0; ch < 2; ch++)
    if (al->chair_ok[ch])
      cJSON_AddItemToArray (chairs, cJSON_CreateNumber (ch + 1));
  return o;
}

static cJSON *
leaving_json (const CwLeavingGroup *lg, const CwMolecule *mol)
{
  cJSON *o = cJSON_CreateObject ();
  cJSON *chairs = cJSON_AddArrayToObject (o, "chairs");
  cJSON *alkenes;

  cJSON_AddNumberToObject (o, "substituent", lg->sub);
  cJSON_AddStringToObject (o, "group", mol->subs[lg->sub].group->id);
  cJSON_AddNumberToObject (o, "position", lg->position);
  for (int ch = 0; ch < 2; ch++)
    {
      cJSON *c = cJSON_CreateObject ();
      cJSON_AddNumberToObject (c, "chair", ch + 1);
      cJSON_AddStringToObject (c, "orientation", lg->axial[ch] ? "axial" : "equatorial");
      cJSON_AddItemToObject (c, "anti_periplanar_beta_h", anti_json (lg, ch));
      cJSON_AddBoolToObject (c, "reactive", lg->reactive[ch]);
      cJSON_AddItemToArray (chairs, c);
    }
  cJSON_AddNumberToObject (o, "reactive_fraction", lg->reactive_fraction);
  cJSON_AddBoolToObject (o, "no_anti_periplanar_h", lg->no_anti_h);
  alkenes = cJSON_AddArrayToObject (o, "alkenes");
  for (int k = 0; k < lg->n_alkenes; k++)
    cJSON_AddItemToArray (alkenes, alkene_json (&lg->alkenes[k], mol));
  return o;
}

static cJSON *
reactivity_json (const CwCliNmrContext *ctx, const CwReactivity *r)
{
  cJSON *o = cJSON_CreateObject ();
  cJSON *groups, *pairs, *warnings;

  cw_cli_nmr_add_header_json (o, ctx, "chairwise-reactivity");
  cJSON_AddNumberToObject (o, "anti_periplanar_min_deg", r->anti_min);
  groups = cJSON_AddArrayToObject (o, "leaving_groups");
  for (int i = 0; i < r->n_groups; i++)
    cJSON_AddItemToArray (groups, leaving_json (&r->groups[i], ctx->mol));
  pairs = cJSON_AddArrayToObject (o, "vicinal_pairs");
  for (int i = 0; i < r->n_pairs; i++)
    {
      cJSON *p = cJSON_CreateObject ();
      cJSON *anti = cJSON_AddArrayToObject (p, "anti_periplanar_in_chairs");
      cJSON_AddNumberToObject (p, "substituent_a", r->pairs[i].sub_a);
      cJSON_AddNumberToObject (p, "substituent_b", r->pairs[i].sub_b);
      cJSON_AddStringToObject (p, "role", cw_anti_pair_role_to_string (r->pairs[i].role));
      for (int ch = 0; ch < 2; ch++)
        if (r->pairs[i].anti[ch])
          cJSON_AddItemToArray (anti, cJSON_CreateNumber (ch + 1));
      cJSON_AddNumberToObject (p, "fraction", r->pairs[i].fraction);
      cJSON_AddItemToArray (pairs, p);
    }
  warnings = cJSON_AddArrayToObject (o, "warnings");
  for (int i = 0; i < r->n_warnings; i++)
    {
      cJSON           *w = cJSON_CreateObject ();
      g_autofree char *msg = cw_react_warning_dup_message (&r->warnings[i], ctx->mol);
      cJSON_AddStringToObject (w, "code", cw_react_warning_code_to_string (r->warnings[i].code));
      cJSON_AddStringToObject (w, "message", msg);
      cJSON_AddItemToArray (warnings, w);
    }
  cJSON_AddStringToObject (o, "rate_model",
                           "Curtin-Hammett: rate proportional to the fraction of molecules in chairs with the "
                           "anti-periplanar arrangement, equal rate constants for those chairs");
  return o;
}

int
cw_cli_reactivity (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_auto (CwCliNmrContext) ctx = { 0 };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — anti-periplanar leaving groups, reactive chairs and E2 alkenes"));
  g_autoptr (GError) error = NULL;
  CwReactivity *r;
  int           code = CW_EXIT_OK;

  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_CONDITIONS | CW_CLI_OPTIONS_FORMATS);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "reactivity", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "reactivity", _("too many arguments"));
  if (input.csv)
    return cw_cli_usage_error (context, "reactivity", _("--csv is not offered here; use --json"));
  if (!cw_cli_nmr_setup (&ctx, &input, argc > 1 ? argv[1] : NULL, "reactivity", &code))
    return code;
  r = g_new0 (CwReactivity, 1);
  if (!cw_reactivity_compute (ctx.gd, ctx.mol, ctx.an.pop, ctx.an.temperature, r, &error))
    code = cw_cli_error ("reactivity", CW_EXIT_ANALYSIS, "%s", error->message);
  else if (input.json)
    {
      g_autoptr (cJSON) o = reactivity_json (&ctx, r);
      cw_cli_nmr_print_json (o);
    }
  else
    print_text (&ctx, r);
  g_free (r);
  return code;
}
