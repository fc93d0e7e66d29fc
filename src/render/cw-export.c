/* cw-export.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "config.h"
#include "cw-error.h"
#include "cw-export.h"
#include "cw-png.h"
#include "cw-sequence-diagram.h"

void
cw_export_options_init (CwExportOptions *options,
                        CwExportFormat   format)
{
  memset (options, 0, sizeof *options);
  options->format = format;
  options->dpi = CW_EXPORT_DEFAULT_DPI;
  options->paper = cw_paper_from_locale ();
  options->theme = CW_RENDER_LIGHT;
}

gboolean
cw_export_format_for_path (const char     *path,
                           CwExportFormat *format)
{
  static const char *exts[] = { ".png", ".pdf", ".svg" };
  g_autofree char *lower = g_ascii_strdown (path, -1);

  for (guint i = 0; i < G_N_ELEMENTS (exts); i++)
    if (g_str_has_suffix (lower, exts[i]) && strlen (lower) > strlen (exts[i]))
      {
        *format = (CwExportFormat) i;
        return TRUE;
      }
  return FALSE;
}

/* "plan.png" and canal "MB" give "plan-MB.png"; characters a file name
 * should not carry become "_". */
char *
cw_export_canal_path (const char *out,
                      const char *canal)
{
  const char *dot = strrchr (out, '.');
  const char *slash = strrchr (out, G_DIR_SEPARATOR);
  g_autofree char *name = g_strdup (canal);

  if (dot == NULL || (slash && dot < slash))
    dot = out + strlen (out);
  g_strcanon (name, G_CSET_A_2_Z G_CSET_a_2_z G_CSET_DIGITS "-_+.", '_');
  if (name[0] == '.')
    name[0] = '_';
  return g_strdup_printf ("%.*s-%s%s", (int) (dot - out), out, name, dot);
}

static cairo_status_t
append_bytes (void                *closure,
              const unsigned char *data,
              unsigned int         length)
{
  g_byte_array_append (closure, data, length);
  return CAIRO_STATUS_SUCCESS;
}

static gboolean
check_status (cairo_status_t   status,
              const char      *path,
              GError         **error)
{
  if (status == CAIRO_STATUS_SUCCESS)
    return TRUE;
  g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not draw the export: %s"),
               path, cairo_status_to_string (status));
  return FALSE;
}

static gboolean
save (GByteArray  *bytes,
      const char  *path,
      GPtrArray   *written,
      GError     **error)
{
  g_autoptr(GError) local = NULL;

  if (!g_file_set_contents_full (path, (const char *) bytes->data, bytes->len,
                                 G_FILE_SET_CONTENTS_CONSISTENT, 0644, &local))
    {
      g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not write: %s"), path, local->message);
      return FALSE;
    }
  if (written)
    g_ptr_array_add (written, g_strdup (path));
  return TRUE;
}

static gboolean
write_png (CwSequenceDiagram *d,
           double             dpi,
           const char        *path,
           GPtrArray         *written,
           GError           **error)
{
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  double w, h, k = dpi / 72.0;
  cairo_surface_t *surface;
  cairo_status_t status;
  cairo_t *cr;

  cw_sequence_diagram_get_size (d, &w, &h);
  surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, (int) ceil (w * k), (int) ceil (h * k));
  cr = cairo_create (surface);
  cairo_scale (cr, k, k);
  cw_sequence_diagram_draw (d, cr);
  status = cairo_status (cr);
  cairo_destroy (cr);
  if (!check_status (status, path, error) || !cw_png_write (surface, dpi, bytes, error))
    {
      cairo_surface_destroy (surface);
      return FALSE;
    }
  cairo_surface_destroy (surface);
  return save (bytes, path, written, error);
}

typedef cairo_surface_t *(*SurfaceNew) (cairo_write_func_t func,
                                        void              *closure,
                                        double             width,
                                        double             height);

static gboolean
write_vector (CwSequenceDiagram *d,
              SurfaceNew         surface_new,
              const char        *path,
              GPtrArray         *written,
              GError           **error)
{
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  cairo_surface_t *surface;
  cairo_status_t status;
  double w, h;
  cairo_t *cr;

  cw_sequence_diagram_get_size (d, &w, &h);
  surface = surface_new (append_bytes, bytes, w, h);
  cr = cairo_create (surface);
  cw_sequence_diagram_draw (d, cr);
  cairo_show_page (cr);
  status = cairo_status (cr);
  cairo_destroy (cr);
  cairo_surface_finish (surface);
  if (status == CAIRO_STATUS_SUCCESS)
    status = cairo_surface_status (surface);
  cairo_surface_destroy (surface);
  return check_status (status, path, error) && save (bytes, path, written, error);
}

static cairo_surface_t *
pdf_surface (cairo_write_func_t  func,
             void               *closure,
             double              width,
             double              height)
{
  cairo_surface_t *surface = cairo_pdf_surface_create_for_stream (func, closure, width, height);

  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_CREATOR, "Canalwright " PACKAGE_VERSION);
  return surface;
}

static gboolean
finish_pdf (cairo_t     *cr,
            GByteArray  *bytes,
            const char  *path,
            GPtrArray   *written,
            GError     **error)
{
  cairo_surface_t *surface = cairo_get_target (cr);
  cairo_status_t status = cairo_status (cr);

  cairo_surface_reference (surface);
  cairo_destroy (cr);
  cairo_surface_finish (surface);
  if (status == CAIRO_STATUS_SUCCESS)
    status = cairo_surface_status (surface);
  cairo_surface_destroy (surface);
  return check_status (status, path, error) && save (bytes, path, written, error);
}

static cairo_t *
pdf_context (GByteArray   *bytes,
             double        width,
             double        height,
             const CwCase *kase)
{
  cairo_surface_t *surface = pdf_surface (append_bytes, bytes, width, height);
  cairo_t *cr = cairo_create (surface);

  if (kase->title && *kase->title)
    cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_TITLE, kase->title);
  cairo_surface_destroy (surface);
  return cr;
}

static gboolean
write_sheet (const CwCase          *kase,
             GPtrArray             *results,
             const CwRenderStyle   *style,
             const CwExportOptions *options,
             const char            *path,
             GPtrArray             *written,
             GError               **error)
{
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  g_autoptr(CwPlanSheet) sheet = cw_plan_sheet_new (kase, results, style, options->paper, options->date);
  double w, h;
  cairo_t *cr;

  cw_paper_size (options->paper, &w, &h);
  cr = pdf_context (bytes, w, h, kase);
  for (guint i = 0; i < cw_plan_sheet_get_n_pages (sheet); i++)
    {
      cw_plan_sheet_draw_page (sheet, cr, i);
      cairo_show_page (cr);
    }
  return finish_pdf (cr, bytes, path, written, error);
}

/* One page a canal, each as large as its diagram. */
static gboolean
write_diagrams_pdf (const CwCase          *kase,
                    GPtrArray             *results,
                    const CwRenderStyle   *style,
                    const CwExportOptions *options,
                    const char            *path,
                    GPtrArray             *written,
                    GError               **error)
{
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  cairo_t *cr = pdf_context (bytes, CW_DIAGRAM_WIDTH, CW_DIAGRAM_WIDTH, kase);

  for (guint i = 0; i < results->len; i++)
    {
      g_autoptr(CwSequenceDiagram) d = cw_sequence_diagram_new (kase, g_ptr_array_index (results, i),
                                                                style, CW_DIAGRAM_WIDTH, options->date);
      double w, h;

      cw_sequence_diagram_get_size (d, &w, &h);
      cairo_pdf_surface_set_size (cairo_get_target (cr), w, h);
      cw_sequence_diagram_draw (d, cr);
      cairo_show_page (cr);
    }
  return finish_pdf (cr, bytes, path, written, error);
}

static gboolean
write_pictures (const CwCase          *kase,
                GPtrArray             *results,
                const CwRenderStyle   *style,
                const CwExportOptions *options,
                const char            *out,
                GPtrArray             *written,
                GError               **error)
{
  for (guint i = 0; i < results->len; i++)
    {
      const CwCanalResult *r = g_ptr_array_index (results, i);
      g_autoptr(CwSequenceDiagram) d = cw_sequence_diagram_new (kase, r, style, CW_DIAGRAM_WIDTH, options->date);
      g_autofree char *path = results->len > 1 ? cw_export_canal_path (out, r->canal->name) : g_strdup (out);
      gboolean ok;

      if (options->format == CW_EXPORT_PNG)
        ok = write_png (d, options->dpi, path, written, error);
      else
        ok = write_vector (d, cairo_svg_surface_create_for_stream, path, written, error);
      if (!ok)
        return FALSE;
    }
  return TRUE;
}

static GPtrArray *
evaluate (const CwCase  *kase,
          const char    *only,
          GError       **error)
{
  g_autoptr(GPtrArray) results = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_canal_result_free);

  for (guint i = 0; i < kase->canals->len; i++)
    {
      const CwCanal *canal = g_ptr_array_index (kase->canals, i);

      if (only == NULL || g_strcmp0 (only, canal->name) == 0)
        g_ptr_array_add (results, cw_evaluate_canal (kase, canal));
    }
  if (results->len == 0 && only)
    g_set_error (error, CW_ERROR, CW_ERROR_INVALID, _("The case has no canal named “%s”"), only);
  else if (results->len == 0)
    g_set_error_literal (error, CW_ERROR, CW_ERROR_INVALID, _("The case has no canals"));
  if (results->len == 0)
    return NULL;
  return g_steal_pointer (&results);
}

gboolean
cw_export_case (const CwCase          *kase,
                const char            *out,
                const CwExportOptions *options,
                GPtrArray             *written,
                GError               **error)
{
  g_autoptr(GPtrArray) results = NULL;
  CwRenderStyle style;

  g_return_val_if_fail (kase != NULL && out != NULL && options != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  results = evaluate (kase, options->canal, error);
  if (results == NULL)
    return FALSE;
  cw_render_style_init (&style, options->theme, 1.0);
  if (options->format == CW_EXPORT_PDF && options->diagrams)
    return write_diagrams_pdf (kase, results, &style, options, out, written, error);
  if (options->format == CW_EXPORT_PDF)
    return write_sheet (kase, results, &style, options, out, written, error);
  return write_pictures (kase, results, &style, options, out, written, error);
}
