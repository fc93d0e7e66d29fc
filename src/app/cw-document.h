/* cw-document.h: an open case, its selection and its edit history
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gio/gio.h>

#include "cw-case.h"
#include "cw-evaluate.h"

G_BEGIN_DECLS

#define CW_TYPE_DOCUMENT (cw_document_get_type ())

G_DECLARE_FINAL_TYPE (CwDocument, cw_document, CW, DOCUMENT, GObject)

CwDocument          *cw_document_new              (void);
CwDocument          *cw_document_open             (GFile        *file,
                                                   GError      **error);
gboolean             cw_document_save             (CwDocument   *self,
                                                   GFile        *file,
                                                   GError      **error);
const CwCase        *cw_document_get_case         (CwDocument   *self);
GFile               *cw_document_get_file         (CwDocument   *self);
void                 cw_document_set_file         (CwDocument   *self,
                                                   GFile        *file);
char                *cw_document_dup_title        (CwDocument   *self);
gboolean             cw_document_get_modified     (CwDocument   *self);
void                 cw_document_set_modified     (CwDocument   *self,
                                                   gboolean      modified);

/* Selection, shared by every view of the document. */
guint                cw_document_get_canal_index  (CwDocument   *self);
void                 cw_document_set_canal_index  (CwDocument   *self,
                                                   guint         index);
const CwCanal       *cw_document_get_canal        (CwDocument   *self);
int                  cw_document_get_step_index   (CwDocument   *self);
void                 cw_document_set_step_index   (CwDocument   *self,
                                                   int           index);
const char          *cw_document_get_instrument   (CwDocument   *self);
void                 cw_document_set_instrument   (CwDocument   *self,
                                                   const char   *id);
const CwCanalResult *cw_document_get_result       (CwDocument   *self);

/* Every change goes through an edit: begin returns the case to change, end
 * records it as one undoable command.  update shows a change that is still
 * going on (a drag) without recording it yet. */
CwCase              *cw_document_begin_edit       (CwDocument   *self,
                                                   const char   *label);
void                 cw_document_update_edit      (CwDocument   *self);
void                 cw_document_end_edit         (CwDocument   *self);
void                 cw_document_cancel_edit      (CwDocument   *self);
gboolean             cw_document_in_edit          (CwDocument   *self);
gboolean             cw_document_can_undo         (CwDocument   *self);
gboolean             cw_document_can_redo         (CwDocument   *self);
const char          *cw_document_get_undo_label   (CwDocument   *self);
const char          *cw_document_get_redo_label   (CwDocument   *self);
gboolean             cw_document_undo             (CwDocument   *self);
gboolean             cw_document_redo             (CwDocument   *self);

/* Commands (cw-document-edits.c) */
double               cw_document_suggest_depth    (CwDocument   *self,
                                                   const char   *instrument_id,
                                                   guint         position);
void                 cw_document_insert_step      (CwDocument   *self,
                                                   const char   *instrument_id,
                                                   int           position);
void                 cw_document_remove_step      (CwDocument   *self,
                                                   guint         index);
void                 cw_document_move_step        (CwDocument   *self,
                                                   guint         from,
                                                   guint         to);
void                 cw_document_set_step_depth   (CwDocument   *self,
                                                   guint         index,
                                                   double        depth);
guint                cw_document_add_canal        (CwDocument   *self);
void                 cw_document_remove_canal     (CwDocument   *self,
                                                   guint         index);

G_END_DECLS
