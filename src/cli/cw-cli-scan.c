#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdio.h>

#include "cw-cli.h"

static gboolean
parse_step (const char *text, double *kelvin, GError **error)
{
  /* A step is a temperature difference: "5C" and "5K" both mean 5 kelvin. */
  g_autofree char *copy = g_strstrip (g_strdup (text));
  char *end = NULL;
  double v = g_ascii_strtod (copy, &end);

  while (end && (*end == ' ' || g_str_has_prefix (end, "°")))
    end += (*end == ' ') ? 1 : strlen ("°");
  if (end == copy || !isfinite (v) || v <= 0 ||
      !(end[0] == '\0' || ((end[0] == 'C' || end[0] == 'K') && end[1] == '\0')))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s” is not a positive temperature step, e.g. 5C or 5K"), text);
      return FALSE;
    }
  *kelvin = v;
  return TRUE;
}

int
cw_cli_scan (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_autofree char *from = NULL, *to = NULL, *step = NULL;
  GOptionEntry entries[] = {
    { "from", 0, 0, G_OPTION_ARG_STRING, &from, N_("Lowest temperature (default -100C)"), "T" },
    { "to", 0, 0, G_OPTION_ARG_STRING, &to, N_("Highest temperature (default 150C)"), "T" },
    { "step", 0, 0, G_OPTION_ARG_STRING, &step, N_("Step (default 5C)"), "DT" },
    { NULL }
  };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — CSV of chair populations against temperature"));
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autoptr (CwDocument) doc = NULL;
  double t0, t1, dt;
  CwConditions cond;
  int code = CW_EXIT_OK;
  long n;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_SOURCE);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "scan", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "scan", _("too many arguments"));
  if (!cw_parse_temperature (from ? from : "-100C", &t0, NULL, &error) ||
      !cw_parse_temperature (to ? to : "150C", &t1, NULL, &error) ||
      !parse_step (step ? step : "5C", &dt, &error))
    return cw_cli_usage_error (context, "scan", error->message);
  if (t1 < t0)
    return cw_cli_usage_error (context, "scan", _("--to is below --from"));
  n = (long) floor ((t1 - t0) / dt + 1e-9) + 1;
  if (n > 100000)
    return cw_cli_usage_error (context, "scan", _("more than 100000 steps; use a larger --step"));
  doc = cw_cli_input_load (&input, argc > 1 ? argv[1] : NULL, &data, &code);
  if (doc == NULL)
    return code;
  cw_document_get_conditions (doc, &cond);
  printf ("temperature_k,temperature_c,delta_g_kcal_mol,delta_g_sigma_kcal_mol,K,"
          "population_chair1,population_chair2,population_chair1_low,population_chair1_high\n");
  for (long i = 0; i < n; i++)
    {
      CwAnalysis an;
      cond.temperature = t0 + i * dt;
      if (!cw_analyze (data, cw_document_peek_molecule (doc), &cond, &an, &error))
        return cw_cli_error ("scan", CW_EXIT_ANALYSIS, "%s", error->message);
      printf ("%.2f,%.2f,%.4f,%.4f,%.6g,%.6f,%.6f,%.6f,%.6f\n", an.temperature,
              an.temperature - CW_ZERO_C, an.delta_g, an.sigma, an.K, an.pop[0], an.pop[1],
              an.pop_low[0], an.pop_high[0]);
    }
  printf ("# %s\n", cw_caution_text ());
  return CW_EXIT_OK;
}

int
cw_cli_groups (int argc, char **argv)
{
  g_autofree char *data_dir = NULL;
  gboolean json = FALSE;
  GOptionEntry entries[] = {
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Write JSON"), NULL },
    { "data-dir", 0, 0, G_OPTION_ARG_FILENAME, &data_dir, N_("Read the tables from DIR"), "DIR" },
    { NULL }
  };
  g_autoptr (GOptionContext) context = g_option_context_new (_("— the substituent table with A-values and sources"));
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "groups", error->message);
  data = cw_data_new_from_dir (data_dir, &error);
  if (data == NULL)
    return cw_cli_error ("groups", CW_EXIT_ANALYSIS, "%s", error->message);
  if (json)
    printf ("[\n");
  for (guint i = 0; i < cw_group_table_get_n_groups (data->groups); i++)
    {
      const CwGroup *g = cw_group_table_get (data->groups, i);
      if (json)
        printf ("  {\"id\": \"%s\", \"a_kcal_mol\": %.3f, \"sigma_kcal_mol\": %.3f}%s\n", g->id, g->a,
                g->a_sigma, i + 1 < cw_group_table_get_n_groups (data->groups) ? "," : "");
      else
        {
          printf ("%-18s %-8s A = %5.2f ± %.2f kcal/mol", g->id, g->label, g->a, g->a_sigma);
          if (g->has_protic)
            printf (_(" (protic %.2f)"), g->a_protic);
          printf ("\n    %s\n", g->source);
        }
    }
  if (json)
    printf ("]\n");
  return CW_EXIT_OK;
}
