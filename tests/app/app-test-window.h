#pragma once

/* Opening and closing the real window in app tests (needs the window's private header). */
#include "app-test-helpers.h"
#include "cw-window-private.h"

static inline CwWindow *
new_window (void)
{
  CwWindow *win = g_object_new (CW_TYPE_WINDOW, NULL);

  gtk_window_present (GTK_WINDOW (win));
  app_test_wait_mapped (GTK_WIDGET (win));
  return win;
}

static inline void
destroy_window (CwWindow *win)
{
  /* skip the unsaved-changes question: the tests decide what is saved */
  win->close_confirmed = TRUE;
  gtk_window_destroy (GTK_WINDOW (win));
  app_test_pump (20, NULL);
}
