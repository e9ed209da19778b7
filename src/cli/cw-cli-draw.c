#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "cw-cli.h"
#include "cw-render.h"

/* `draw` and `report`: the render layer's exports from the command line. */

static gboolean
has_extension (const char *path, const char *const *exts)
{
  const char *dot = strrchr (path, '.');

  if (dot == NULL || strchr (dot, G_DIR_SEPARATOR) != NULL)
    return FALSE;
  for (; *exts; exts++)
    if (g_ascii_strcasecmp (dot, *exts) == 0)
      return TRUE;
  return FALSE;
}

int
cw_cli_draw (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_autofree char *figure = NULL, *output = NULL;
  double           dpi = 300;
  gboolean         hydrogens = FALSE, anti = FALSE;
  GOptionEntry     entries[] = {
    { "figure", 'f', 0, G_OPTION_ARG_STRING, &figure, N_("structure, chairs, profile or scan"), "FIGURE" },
    { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, N_("Write to FILE (.png, .svg or .pdf)"), "FILE" },
    { "dpi", 0, 0, G_OPTION_ARG_DOUBLE, &dpi, N_("Resolution of a PNG (default 300)"), "DPI" },
    { "hydrogens", 0, 0, G_OPTION_ARG_NONE, &hydrogens, N_("Show the ring hydrogens on the chairs"), NULL },
    { "anti-periplanar", 0, 0, G_OPTION_ARG_NONE, &anti,
      N_("Chairs: mark each leaving group and its anti-periplanar β-hydrogens"), NULL },
    { NULL }
  };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — draw one figure to PNG, SVG or PDF"));
  static const char *const exts[] = { ".png", ".svg", ".pdf", NULL };
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autoptr (CwDocument) doc = NULL;
  CwRenderOptions opt;
  CwFigure        fig;
  int             code = CW_EXIT_OK;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_CONDITIONS);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "draw", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "draw", _("too many arguments"));
  if (figure == NULL)
    return cw_cli_usage_error (context, "draw", _("--figure is required: structure, chairs, profile or scan"));
  if (!cw_render_figure_from_string (figure, &fig))
    {
      g_autofree char *msg = g_strdup_printf (_("unknown figure “%s”: use structure, chairs, profile or scan"), figure);
      return cw_cli_usage_error (context, "draw", msg);
    }
  if (output == NULL)
    return cw_cli_usage_error (context, "draw", _("--output FILE is required"));
  if (!has_extension (output, exts))
    {
      g_autofree char *msg = g_strdup_printf (_("cannot tell the format of “%s”: the name must end in .png, .svg or .pdf"), output);
      return cw_cli_usage_error (context, "draw", msg);
    }
  if (!(isfinite (dpi) && dpi >= 10 && dpi <= 2400))
    return cw_cli_usage_error (context, "draw", _("--dpi must be between 10 and 2400"));
  doc = cw_cli_input_load (&input, argc > 1 ? argv[1] : NULL, &data, &code);
  if (doc == NULL)
    return code;
  cw_render_options_init (&opt);
  opt.unit = cw_document_get_energy_unit (doc);
  opt.temperature_unit = cw_document_get_temperature_unit (doc);
  opt.show_hydrogens = hydrogens || anti;
  opt.highlight_reactivity = anti;
  if (!cw_render_export_figure (fig, data, doc, &opt, output, dpi, &error))
    return cw_cli_error ("draw", CW_EXIT_ANALYSIS, "%s", error->message);
  return CW_EXIT_OK;
}

int
cw_cli_report (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_autofree char *output = NULL, *paper = NULL;
  GOptionEntry     entries[] = {
    { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, N_("Write the report to FILE.pdf"), "FILE" },
    { "paper", 0, 0, G_OPTION_ARG_STRING, &paper, N_("Paper size: a4 (default) or letter"), "SIZE" },
    { NULL }
  };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — a one-page PDF report"));
  static const char *const exts[] = { ".pdf", NULL };
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autoptr (CwDocument) doc = NULL;
  g_autoptr (CwGeometryData) gd = NULL;
  int code = CW_EXIT_OK;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_CONDITIONS);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "report", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "report", _("too many arguments"));
  if (output == NULL)
    return cw_cli_usage_error (context, "report", _("--output FILE.pdf is required"));
  if (!has_extension (output, exts))
    {
      g_autofree char *msg = g_strdup_printf (_("the report is a PDF: “%s” must end in .pdf"), output);
      return cw_cli_usage_error (context, "report", msg);
    }
  if (paper != NULL && g_ascii_strcasecmp (paper, "a4") != 0 && g_ascii_strcasecmp (paper, "letter") != 0)
    {
      g_autofree char *msg = g_strdup_printf (_("unknown paper size “%s”: use a4 or letter"), paper);
      return cw_cli_usage_error (context, "report", msg);
    }
  doc = cw_cli_input_load (&input, argc > 1 ? argv[1] : NULL, &data, &code);
  if (doc == NULL)
    return code;
  if (input.data_dir != NULL)
    {
      /* the geometry table comes from the same folder as the other tables */
      gd = cw_geometry_data_new_from_dir (input.data_dir, &error);
      if (gd == NULL)
        return cw_cli_error ("report", CW_EXIT_ANALYSIS, "%s", error->message);
    }
  if (!cw_render_export_report_with_geometry (data, gd, doc, paper ? paper : "a4", output, &error))
    return cw_cli_error ("report", CW_EXIT_ANALYSIS, "%s", error->message);
  return CW_EXIT_OK;
}
