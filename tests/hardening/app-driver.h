/* app-driver.h: the real program in a child process, driven with xdotool
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gio/gio.h>

G_BEGIN_DECLS

typedef struct
{
  char        *dir;        /* everything the program may write is under here */
  char        *cache;      /* XDG_CACHE_HOME: the autosave folder */
  char        *config;     /* XDG_CONFIG_HOME: the settings keyfile */
  char        *data;       /* XDG_DATA_HOME: recently used files */
  char        *err_log;    /* the last start's stderr */
  GSubprocess *proc;
} CwApp;

void       cw_app_require_display (void);
CwApp     *cw_app_new             (void);
void       cw_app_free            (CwApp       *app);
char      *cw_app_path            (CwApp       *app,
                                   const char  *name);
void       cw_app_start           (CwApp       *app,
                                   const char  *arg);
void       cw_app_kill            (CwApp       *app);
gboolean   cw_app_running         (CwApp       *app);
char      *cw_app_stderr          (CwApp       *app);
GPtrArray *cw_app_windows         (CwApp       *app,
                                   guint        at_least,
                                   guint        timeout_ms);
char      *cw_app_window_name     (const char  *window);
char      *cw_app_find_window     (CwApp       *app,
                                   const char  *name,
                                   guint        timeout_ms);
void       cw_app_keys            (const char  *window,
                                   const char  *keys);
char      *cw_app_screenshot      (const char  *name);
char      *cw_app_autosave_dir    (CwApp       *app);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwApp, cw_app_free)

G_END_DECLS
