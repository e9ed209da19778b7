#include "config.h"

#include "cw-autosave.h"

#include <errno.h>
#include <glib/gstdio.h>

char *
cw_autosave_dir (void)
{
  return g_build_filename (g_get_user_state_dir (), "chairwise", "autosave", NULL);
}

char *
cw_autosave_new_path (void)
{
  g_autofree char *dir = cw_autosave_dir ();
  g_autofree char *uuid = g_uuid_string_random ();
  g_autofree char *name = g_strconcat ("autosave-", uuid, ".json", NULL);

  return g_build_filename (dir, name, NULL);
}

static char *
info_path (const char *path)
{
  return g_strconcat (path, ".info", NULL);
}

gboolean
cw_autosave_write (const char       *path,
                   const CwDocument *doc,
                   const char       *origin,
                   GError          **error)
{
  g_autofree char *dir = g_path_get_dirname (path);
  g_autofree char *info = info_path (path);
  g_autoptr (GKeyFile) kf = g_key_file_new ();

  if (g_mkdir_with_parents (dir, 0700) != 0)
    {
      int err = errno;

      g_set_error (error, G_FILE_ERROR, g_file_error_from_errno (err), "%s: %s", dir, g_strerror (err));
      return FALSE;
    }
  g_key_file_set_string (kf, "autosave", "origin", origin ? origin : "");
  g_key_file_set_int64 (kf, "autosave", "time", g_get_real_time () / G_USEC_PER_SEC);
  if (!g_key_file_save_to_file (kf, info, error))
    return FALSE;
  return cw_document_save (doc, path, FALSE, error);
}

void
cw_autosave_remove (const char *path)
{
  g_autofree char *info = NULL;

  if (path == NULL)
    return;
  info = info_path (path);
  g_unlink (path);
  g_unlink (info);
}

static gint
compare_mtime (gconstpointer a,
               gconstpointer b)
{
  GStatBuf    sa, sb;
  const char *pa = *(const char *const *) a, *pb = *(const char *const *) b;

  if (g_stat (pa, &sa) != 0 || g_stat (pb, &sb) != 0)
    return g_strcmp0 (pa, pb);
  return (sa.st_mtime > sb.st_mtime) - (sa.st_mtime < sb.st_mtime);
}

GPtrArray *
cw_autosave_list (void)
{
  g_autofree char *dir = cw_autosave_dir ();
  g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
  GPtrArray  *out = g_ptr_array_new_with_free_func (g_free);
  const char *name;

  if (d == NULL)
    return out;
  while ((name = g_dir_read_name (d)) != NULL)
    if (g_str_has_prefix (name, "autosave-") && g_str_has_suffix (name, ".json"))
      g_ptr_array_add (out, g_build_filename (dir, name, NULL));
  g_ptr_array_sort (out, compare_mtime);
  return out;
}

char *
cw_autosave_dup_origin (const char *path)
{
  g_autofree char *info = info_path (path);
  g_autoptr (GKeyFile) kf = g_key_file_new ();
  char *origin;

  if (!g_key_file_load_from_file (kf, info, G_KEY_FILE_NONE, NULL))
    return NULL;
  origin = g_key_file_get_string (kf, "autosave", "origin", NULL);
  if (origin != NULL && *origin == '\0')
    g_clear_pointer (&origin, g_free);
  return origin;
}
