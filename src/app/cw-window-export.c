/* cw-window-export.c: export the plan to a file, or print it
 *
 * Both draw through the renderer the headless export uses, so the window,
 * the files and the printed pages show the same plan.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-window"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-export.h"
#include "cw-plan-sheet.h"
#include "cw-window-private.h"

static CwPaper
preferred_paper (CwWindow *self)
{
  CwApplication *app = CW_APPLICATION (gtk_window_get_application (GTK_WINDOW (self)));
  GSettings *settings = app ? cw_application_get_settings (app) : NULL;
  g_autofree char *choice = settings ? g_settings_get_string (settings, "paper-size") : NULL;
  CwPaper paper;

  if (choice && cw_paper_from_string (choice, &paper))
    return paper;
  return cw_paper_from_locale ();
}

static char *
suggested_name (CwWindow *self)
{
  g_autofree char *title = cw_document_dup_title (self->document);

  g_strdelimit (title, "/\\:", '-');
  return g_strdup_printf ("%s.pdf", title);
}

static void
export_to (CwWindow *self,
           GFile    *file,
           gboolean  this_canal)
{
  g_autofree char *path = g_file_get_path (file);
  g_autoptr(GError) error = NULL;
  CwExportOptions options;
  CwExportFormat format;

  if (!cw_export_format_for_path (path, &format))
    {
      g_set_error (&error, G_IO_ERROR, G_IO_ERROR_INVALID_FILENAME,
                   _("Name the file with .pdf, .png or .svg at the end to choose its format."));
      _cw_window_show_error (self, _("The plan was not exported"), error);
      return;
    }
  cw_export_options_init (&options, format);
  options.paper = preferred_paper (self);
  options.dpi = 200;
  if (this_canal)
    options.canal = cw_document_get_canal (self->document)->name;
  if (!cw_export_case (cw_document_get_case (self->document), path, &options, NULL, &error))
    _cw_window_show_error (self, _("The plan was not exported"), error);
}

static void
export_response (GtkNativeDialog *dialog,
                 int              response,
                 CwWindow        *self)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      const char *which = gtk_file_chooser_get_choice (GTK_FILE_CHOOSER (dialog), "canals");

      export_to (self, file, g_strcmp0 (which, "this") == 0);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
}

static void
add_filter (GtkFileChooser *chooser,
            const char     *name,
            const char     *pattern)
{
  g_autoptr(GtkFileFilter) filter = gtk_file_filter_new ();

  gtk_file_filter_set_name (filter, name);
  gtk_file_filter_add_pattern (filter, pattern);
  gtk_file_chooser_add_filter (chooser, filter);
}

static void
export_action (GtkWidget  *widget,
               const char *name,
               GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  GtkFileChooserNative *dialog;
  g_autofree char *suggested = suggested_name (self);
  const char *ids[] = { "all", "this", NULL };
  const char *labels[] = { _("Every canal"), _("This canal only"), NULL };

  dialog = gtk_file_chooser_native_new (_("Export the Plan"), GTK_WINDOW (self), GTK_FILE_CHOOSER_ACTION_SAVE,
                                        _("_Export"), _("_Cancel"));
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (dialog), suggested);
  add_filter (GTK_FILE_CHOOSER (dialog), _("PDF plan sheet (*.pdf)"), "*.pdf");
  add_filter (GTK_FILE_CHOOSER (dialog), _("PNG picture (*.png)"), "*.png");
  add_filter (GTK_FILE_CHOOSER (dialog), _("SVG drawing (*.svg)"), "*.svg");
  gtk_file_chooser_add_choice (GTK_FILE_CHOOSER (dialog), "canals", _("Canals"), ids, labels);
  gtk_file_chooser_set_choice (GTK_FILE_CHOOSER (dialog), "canals", "all");
  g_signal_connect (dialog, "response", G_CALLBACK (export_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

typedef struct
{
  CwPlanSheet *sheet;
  GPtrArray   *results;
  CwPaper      paper;
} PrintJob;

static void
print_job_free (PrintJob *job)
{
  g_clear_pointer (&job->sheet, cw_plan_sheet_free);
  g_ptr_array_unref (job->results);
  g_free (job);
}

static void
begin_print (GtkPrintOperation *op,
             GtkPrintContext   *context,
             PrintJob          *job)
{
  gtk_print_operation_set_n_pages (op, (int) cw_plan_sheet_get_n_pages (job->sheet));
}

/* With the full page and points as the unit, the context is the paper in
 * points from its corner, as the sheet is laid out; a paper other than the
 * sheet's is fitted to its width. */
static void
draw_page (GtkPrintOperation *op,
           GtkPrintContext   *context,
           int                page,
           PrintJob          *job)
{
  cairo_t *cr = gtk_print_context_get_cairo_context (context);
  double sheet_w, sheet_h, scale;

  cw_paper_size (job->paper, &sheet_w, &sheet_h);
  scale = gtk_print_context_get_width (context) / sheet_w;
  cairo_save (cr);
  cairo_scale (cr, scale, scale);
  cw_plan_sheet_draw_page (job->sheet, cr, (guint) page);
  cairo_restore (cr);
}

static PrintJob *
print_job_new (CwWindow *self,
               CwPaper   paper)
{
  const CwCase *kase = cw_document_get_case (self->document);
  PrintJob *job = g_new0 (PrintJob, 1);
  CwRenderStyle style;

  job->results = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_canal_result_free);
  for (guint i = 0; i < kase->canals->len; i++)
    g_ptr_array_add (job->results, cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, i)));
  cw_render_style_init (&style, CW_RENDER_LIGHT, 1.0);
  job->paper = paper;
  job->sheet = cw_plan_sheet_new (kase, job->results, &style, paper, NULL);
  return job;
}

static GtkPrintOperation *
print_operation_new (CwWindow *self)
{
  CwPaper paper = preferred_paper (self);
  GtkPrintOperation *op = gtk_print_operation_new ();
  g_autoptr(GtkPageSetup) setup = gtk_page_setup_new ();
  g_autoptr(GtkPaperSize) size = gtk_paper_size_new (paper == CW_PAPER_LETTER ? GTK_PAPER_NAME_LETTER
                                                                             : GTK_PAPER_NAME_A4);
  PrintJob *job = print_job_new (self, paper);

  gtk_page_setup_set_paper_size_and_default_margins (setup, size);
  gtk_print_operation_set_default_page_setup (op, setup);
  gtk_print_operation_set_unit (op, GTK_UNIT_POINTS);
  gtk_print_operation_set_use_full_page (op, TRUE);
  g_signal_connect (op, "begin-print", G_CALLBACK (begin_print), job);
  g_signal_connect (op, "draw-page", G_CALLBACK (draw_page), job);
  g_object_set_data_full (G_OBJECT (op), "job", job, (GDestroyNotify) print_job_free);
  return op;
}

static void
print_action (GtkWidget  *widget,
              const char *name,
              GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr(GtkPrintOperation) op = print_operation_new (self);
  g_autoptr(GError) error = NULL;

  if (gtk_print_operation_run (op, GTK_PRINT_OPERATION_ACTION_PRINT_DIALOG, GTK_WINDOW (self), &error)
      == GTK_PRINT_OPERATION_RESULT_ERROR)
    _cw_window_show_error (self, _("The plan was not printed"), error);
}

/* The printed pages, to a PDF file with no dialog. */
gboolean
_cw_window_print_to_file (CwWindow    *self,
                          const char  *path,
                          GError     **error)
{
  g_autoptr(GtkPrintOperation) op = print_operation_new (self);

  gtk_print_operation_set_export_filename (op, path);
  return gtk_print_operation_run (op, GTK_PRINT_OPERATION_ACTION_EXPORT, GTK_WINDOW (self), error)
         != GTK_PRINT_OPERATION_RESULT_ERROR;
}

void
_cw_window_install_export_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.export", NULL, export_action);
  gtk_widget_class_install_action (widget_class, "win.print", NULL, print_action);
}
