/* test-hostile-cli.c: canalwright --check on broken and hostile files
 *
 * The built program is run as a user would run it, with no display: every
 * file of tests/data/bad and a set of files made here to attack the reader
 * (size, depth, encoding, special files) must give exit status 2 within two
 * seconds, nothing on stdout, and a message that names the file and, where
 * the fault has one, its JSON path.  Nothing may be written.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <fcntl.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include <gio/gio.h>
#include <glib/gstdio.h>

#define TIME_LIMIT_US (2 * G_USEC_PER_SEC)
#define HANG_LIMIT_US (20 * G_USEC_PER_SEC)

/* The instrumented builds run slower: tools/run-sanitizers.sh and
 * tools/run-valgrind.sh set CW_TEST_TIME_SCALE to stretch the limits. */
static gint64
time_limit (gint64 us)
{
  const char *scale = g_getenv ("CW_TEST_TIME_SCALE");
  double factor = scale ? g_ascii_strtod (scale, NULL) : 1.0;

  return (gint64) (us * (factor >= 1.0 ? factor : 1.0));
}

typedef struct
{
  int      status;     /* exit status, or -1 when killed by a signal */
  int      signal;
  gboolean hung;
  gint64   elapsed_us;
  char    *out;
  char    *err;
} Run;

static void
run_clear (Run *run)
{
  g_free (run->out);
  g_free (run->err);
}

G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (Run, run_clear)

static char *
bytes_to_string (GBytes *bytes)
{
  gsize size = 0;
  const char *data = bytes ? g_bytes_get_data (bytes, &size) : NULL;

  return g_strndup (data ? data : "", size);
}

static void
collected (GObject      *source,
           GAsyncResult *result,
           gpointer      data)
{
  Run *run = data;
  g_autoptr(GBytes) out = NULL;
  g_autoptr(GBytes) err = NULL;
  g_autoptr(GError) error = NULL;

  g_subprocess_communicate_finish (G_SUBPROCESS (source), result, &out, &err, &error);
  g_assert_no_error (error);
  run->out = bytes_to_string (out);
  run->err = bytes_to_string (err);
}

/* canalwright --check PATH with DISPLAY and WAYLAND_DISPLAY unset; a run
 * that outlives HANG_LIMIT_US is killed and marked as hung. */
static void
run_check (Run        *run,
           const char *path)
{
  g_autoptr(GSubprocessLauncher) launcher = g_subprocess_launcher_new (G_SUBPROCESS_FLAGS_STDOUT_PIPE
                                                                      | G_SUBPROCESS_FLAGS_STDERR_PIPE);
  g_autoptr(GSubprocess) proc = NULL;
  g_autoptr(GError) error = NULL;
  gint64 start;

  g_subprocess_launcher_unsetenv (launcher, "DISPLAY");
  g_subprocess_launcher_unsetenv (launcher, "WAYLAND_DISPLAY");
  start = g_get_monotonic_time ();
  proc = g_subprocess_launcher_spawn (launcher, &error, g_getenv ("CW_BINARY"), "--check", path, NULL);
  g_assert_no_error (error);
  g_subprocess_communicate_async (proc, NULL, NULL, collected, run);
  while (run->err == NULL)
    {
      if (!run->hung && g_get_monotonic_time () - start > time_limit (HANG_LIMIT_US))
        {
          run->hung = TRUE;
          g_subprocess_force_exit (proc);
        }
      g_main_context_iteration (NULL, FALSE);
      g_usleep (1000);
    }
  g_subprocess_wait (proc, NULL, &error);
  g_assert_no_error (error);
  run->elapsed_us = g_get_monotonic_time () - start;
  run->status = g_subprocess_get_if_exited (proc) ? g_subprocess_get_exit_status (proc) : -1;
  run->signal = g_subprocess_get_if_signaled (proc) ? g_subprocess_get_term_sig (proc) : 0;
}

/* The file is refused: status 2, quickly, silently on stdout, and a
 * message "FILE: PATH: " (or "FILE: " when PATH is NULL). */
static void
assert_refused (const char *path,
                const char *json_path)
{
  g_auto(Run) run = { 0 };
  g_autofree char *base = g_path_get_basename (path);
  g_autofree char *expected = json_path ? g_strdup_printf ("%s: %s: ", base, json_path)
                                        : g_strdup_printf ("%s: ", base);

  run_check (&run, path);
  g_test_message ("%s (%.0f ms): %s", base, run.elapsed_us / 1000.0, g_strchomp (run.err ? run.err : ""));
  if (run.hung)
    g_error ("%s: --check still running after %d s", base,
             (int) (time_limit (HANG_LIMIT_US) / G_USEC_PER_SEC));
  if (run.signal != 0)
    g_error ("%s: --check died of signal %d (%s)", base, run.signal, g_strsignal (run.signal));
  g_assert_cmpint (run.status, ==, 2);
  g_assert_cmpstr (run.out, ==, "");
  if (strstr (run.err, expected) == NULL)
    g_error ("%s: stderr \"%s\" lacks \"%s\"", base, run.err, expected);
  g_assert_cmpint (run.elapsed_us, <, time_limit (TIME_LIMIT_US));
}

typedef struct
{
  char *file;
  char *path;   /* NULL for "-" */
} Expected;

static void
expected_free (Expected *e)
{
  g_free (e->file);
  g_free (e->path);
  g_free (e);
}

static GPtrArray *
read_expected (void)
{
  g_autofree char *table = g_test_build_filename (G_TEST_DIST, "hardening", "bad-expected.tsv", NULL);
  g_autofree char *text = NULL;
  g_auto(GStrv) lines = NULL;
  g_autoptr(GError) error = NULL;
  GPtrArray *rows = g_ptr_array_new_with_free_func ((GDestroyNotify) expected_free);

  g_assert_true (g_file_get_contents (table, &text, NULL, &error));
  g_assert_no_error (error);
  lines = g_strsplit (text, "\n", -1);
  for (guint i = 0; lines[i] != NULL; i++)
    {
      g_auto(GStrv) cells = NULL;
      Expected *e;

      if (lines[i][0] == '#' || lines[i][0] == '\0')
        continue;
      cells = g_strsplit (lines[i], "\t", 3);
      if (g_strv_length (cells) != 2)
        g_error ("bad-expected.tsv, line %u: want \"FILE<TAB>PATH\", got \"%s\"", i + 1, lines[i]);
      e = g_new0 (Expected, 1);
      e->file = g_strdup (cells[0]);
      e->path = strcmp (cells[1], "-") == 0 ? NULL : g_strdup (cells[1]);
      g_ptr_array_add (rows, e);
    }
  return rows;
}

static int
compare_strings (gconstpointer a,
                 gconstpointer b)
{
  return strcmp (*(const char * const *) a, *(const char * const *) b);
}

/* One line "NAME SIZE MTIME" a member, sorted: equal before and after
 * means nothing was written. */
static char *
snapshot_dir (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  g_autoptr(GPtrArray) names = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GString) out = g_string_new (NULL);
  const char *name;

  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);
      GStatBuf st;

      g_assert_cmpint (g_lstat (path, &st), ==, 0);
      g_ptr_array_add (names, g_strdup_printf ("%s %" G_GINT64_FORMAT " %" G_GINT64_FORMAT "\n", name,
                                               (gint64) st.st_size, (gint64) st.st_mtime));
    }
  g_ptr_array_sort (names, compare_strings);
  for (guint i = 0; i < names->len; i++)
    g_string_append (out, g_ptr_array_index (names, i));
  return g_string_free (g_steal_pointer (&out), FALSE);
}

static void
test_hostile_cli_bad_files (void)
{
  g_autofree char *dir = g_test_build_filename (G_TEST_DIST, "data", "bad", NULL);
  g_autoptr(GPtrArray) rows = read_expected ();
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  g_autofree char *before = snapshot_dir (dir);
  g_autofree char *after = NULL;
  const char *name;
  guint n = 0;

  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)) != NULL)
    {
      gboolean listed = FALSE;

      for (guint i = 0; i < rows->len && !listed; i++)
        listed = strcmp (((Expected *) g_ptr_array_index (rows, i))->file, name) == 0;
      if (!listed)
        g_error ("tests/data/bad/%s has no row in tests/hardening/bad-expected.tsv", name);
      n++;
    }
  g_assert_cmpuint (n, ==, rows->len);
  g_assert_cmpuint (n, >=, 60);
  for (guint i = 0; i < rows->len; i++)
    {
      Expected *e = g_ptr_array_index (rows, i);
      g_autofree char *path = g_build_filename (dir, e->file, NULL);

      assert_refused (path, e->path);
    }
  after = snapshot_dir (dir);
  g_assert_cmpstr (after, ==, before);
}

/* Files made in a folder of their own, which must be unchanged after. */

typedef struct
{
  char *dir;
  char *before;
} Scratch;

static void
scratch_setup (Scratch       *s,
               gconstpointer  data)
{
  s->dir = g_dir_make_tmp ("cw-hostile-XXXXXX", NULL);
  g_assert_nonnull (s->dir);
}

static void
remove_tree (const char *path)
{
  GStatBuf st;

  if (g_lstat (path, &st) == 0 && S_ISDIR (st.st_mode))
    {
      g_autoptr(GDir) d = g_dir_open (path, 0, NULL);
      const char *name;

      while (d && (name = g_dir_read_name (d)) != NULL)
        {
          g_autofree char *child = g_build_filename (path, name, NULL);

          remove_tree (child);
        }
      g_rmdir (path);
    }
  else
    g_unlink (path);
}

static void
scratch_teardown (Scratch       *s,
                  gconstpointer  data)
{
  remove_tree (s->dir);
  g_free (s->dir);
  g_free (s->before);
}

static char *
scratch_path (Scratch    *s,
              const char *name)
{
  return g_build_filename (s->dir, name, NULL);
}

static void
check_in_scratch (Scratch    *s,
                  const char *name,
                  const char *json_path)
{
  g_autofree char *path = scratch_path (s, name);
  g_autofree char *before = snapshot_dir (s->dir);
  g_autofree char *after = NULL;

  assert_refused (path, json_path);
  after = snapshot_dir (s->dir);
  g_assert_cmpstr (after, ==, before);
}

/* A fault the loader does not catch yet: the test is marked incomplete
 * (TAP "# TODO") rather than failed while the file still loads, and
 * passes by itself once the loader refuses it.  A crash still fails. */
static void
check_known_issue (Scratch    *s,
                   const char *name,
                   const char *json_path,
                   const char *issue)
{
  g_autofree char *path = scratch_path (s, name);
  g_autofree char *expected = json_path ? g_strdup_printf ("%s: %s: ", name, json_path)
                                        : g_strdup_printf ("%s: ", name);
  g_auto(Run) run = { 0 };

  run_check (&run, path);
  g_test_message ("%s: status %d in %.0f ms: %s", name, run.status, run.elapsed_us / 1000.0,
                  g_strchomp (run.err));
  if (run.hung || run.signal != 0)
    g_error ("%s: --check hung or died (signal %d)", name, run.signal);
  if (run.status == 2 && strstr (run.err, expected) != NULL && *run.out == '\0')
    {
      g_assert_cmpint (run.elapsed_us, <, time_limit (TIME_LIMIT_US));
      return;
    }
  g_assert_true (run.status == 0 || run.status == 3);
  g_test_incomplete (issue);
}

static void
write_file (Scratch    *s,
            const char *name,
            const char *data,
            gssize      length)
{
  g_autofree char *path = scratch_path (s, name);
  g_autoptr(GError) error = NULL;

  g_assert_true (g_file_set_contents (path, data, length, &error));
  g_assert_no_error (error);
}

/* A valid case whose canal's working length is WL and with EXTRA as the
 * value of an unknown member "x": one fault at a time goes in either. */
static char *
case_with (const char *wl,
           const char *extra)
{
  return g_strdup_printf ("{\"format\": \"canalwright-case\", \"version\": 1,\n"
                          " \"instruments\": [{\"id\": \"k10\", \"tip\": 10, \"taper\": 0.02,"
                          " \"alloy\": \"stainless\", \"motion\": \"hand\"}],\n"
                          " \"canals\": [{\"name\": \"MB\", \"working_length\": %s, \"orifice_depth\": 6,"
                          " \"anatomy\": {\"orifice_diameter\": 0.6, \"apical_diameter\": 0.2},"
                          " \"sequence\": [{\"instrument\": \"k10\", \"depth\": 20}]}],\n"
                          " \"x\": %s}\n", wl, extra);
}

static void
test_hostile_cli_base_of_made_files_passes (Scratch       *s,
                                            gconstpointer  data)
{
  g_autofree char *text = case_with ("21", "null");
  g_autofree char *path = scratch_path (s, "valid.cwcase");
  g_auto(Run) run = { 0 };

  write_file (s, "valid.cwcase", text, -1);
  run_check (&run, path);
  g_assert_cmpint (run.status, ==, 0);
  g_assert_cmpstr (run.err, ==, "");
}

static void
test_hostile_cli_empty (Scratch       *s,
                        gconstpointer  data)
{
  write_file (s, "empty.cwcase", "", 0);
  check_in_scratch (s, "empty.cwcase", NULL);
}

static void
test_hostile_cli_directory (Scratch       *s,
                            gconstpointer  data)
{
  g_autofree char *path = scratch_path (s, "folder.cwcase");

  g_assert_cmpint (g_mkdir (path, 0755), ==, 0);
  check_in_scratch (s, "folder.cwcase", NULL);
}

static void
test_hostile_cli_missing (Scratch       *s,
                          gconstpointer  data)
{
  check_in_scratch (s, "no-such-file.cwcase", NULL);
}

static void
test_hostile_cli_sparse_100_mib (Scratch       *s,
                                 gconstpointer  data)
{
  g_autofree char *path = scratch_path (s, "huge.cwcase");
  int fd = g_open (path, O_WRONLY | O_CREAT | O_TRUNC, 0644);

  g_assert_cmpint (fd, >=, 0);
  g_assert_cmpint (ftruncate (fd, (off_t) 100 * 1024 * 1024), ==, 0);
  g_close (fd, NULL);
  check_in_scratch (s, "huge.cwcase", NULL);
}

static char *
nested (guint depth)
{
  GString *text = g_string_new (NULL);

  for (guint i = 0; i < depth; i++)
    g_string_append_c (text, '[');
  g_string_append_c (text, '1');
  for (guint i = 0; i < depth; i++)
    g_string_append_c (text, ']');
  return g_string_free (text, FALSE);
}

static void
test_hostile_cli_nesting_10000 (Scratch       *s,
                                gconstpointer  data)
{
  g_autofree char *value = nested (10000);
  g_autofree char *text = case_with ("21", value);

  write_file (s, "deep.cwcase", text, -1);
  check_in_scratch (s, "deep.cwcase", NULL);
}

static void
test_hostile_cli_nesting_10000_bare (Scratch       *s,
                                     gconstpointer  data)
{
  g_autofree char *text = nested (10000);

  write_file (s, "deep-bare.cwcase", text, -1);
  check_in_scratch (s, "deep-bare.cwcase", NULL);
}

static void
test_hostile_cli_invalid_utf8 (Scratch       *s,
                               gconstpointer  data)
{
  g_autofree char *text = case_with ("21", "\"caf\xC3\x28\"");

  write_file (s, "latin.cwcase", text, -1);
  check_in_scratch (s, "latin.cwcase", NULL);
}

static void
test_hostile_cli_nul_byte (Scratch       *s,
                           gconstpointer  data)
{
  g_autofree char *text = case_with ("21", "\"a b\"");
  gsize length = strlen (text);

  *strchr (text, ' ') = '\0';
  write_file (s, "nul.cwcase", text, (gssize) length);
  check_in_scratch (s, "nul.cwcase", NULL);
}

static void
test_hostile_cli_unreadable (Scratch       *s,
                             gconstpointer  data)
{
  g_autofree char *text = case_with ("21", "null");
  g_autofree char *path = scratch_path (s, "locked.cwcase");

  if (geteuid () == 0)
    {
      g_test_skip ("running as root: a mode 000 file is still readable");
      return;
    }
  write_file (s, "locked.cwcase", text, -1);
  g_assert_cmpint (g_chmod (path, 0), ==, 0);
  check_in_scratch (s, "locked.cwcase", NULL);
}

static void
test_hostile_cli_fifo (Scratch       *s,
                       gconstpointer  data)
{
  g_autofree char *path = scratch_path (s, "pipe.cwcase");

  /* Nobody writes to it: a reader that opened it blocking would hang. */
  g_assert_cmpint (mkfifo (path, 0644), ==, 0);
  check_in_scratch (s, "pipe.cwcase", NULL);
}

static void
test_hostile_cli_symlink_loop (Scratch       *s,
                               gconstpointer  data)
{
  g_autofree char *a = scratch_path (s, "loop-a.cwcase");
  g_autofree char *b = scratch_path (s, "loop-b.cwcase");

  g_assert_cmpint (symlink (b, a), ==, 0);
  g_assert_cmpint (symlink (a, b), ==, 0);
  check_in_scratch (s, "loop-a.cwcase", NULL);
}

static void
test_hostile_cli_device (void)
{
  assert_refused ("/dev/zero", NULL);
}

static void
test_hostile_cli_nan_token (Scratch       *s,
                            gconstpointer  data)
{
  g_autofree char *text = case_with ("NaN", "null");

  write_file (s, "nan.cwcase", text, -1);
  check_in_scratch (s, "nan.cwcase", NULL);
}

static void
test_hostile_cli_infinity_token (Scratch       *s,
                                 gconstpointer  data)
{
  g_autofree char *text = case_with ("Infinity", "null");

  write_file (s, "infinity.cwcase", text, -1);
  check_in_scratch (s, "infinity.cwcase", NULL);
}

static void
test_hostile_cli_1e308 (Scratch       *s,
                        gconstpointer  data)
{
  g_autofree char *text = case_with ("1e308", "null");

  write_file (s, "1e308.cwcase", text, -1);
  check_in_scratch (s, "1e308.cwcase", "canals[0].working_length");
}

static void
test_hostile_cli_1e999 (Scratch       *s,
                        gconstpointer  data)
{
  g_autofree char *text = case_with ("1e999", "null");

  /* Past the largest double: the parser may make it infinity. */
  write_file (s, "1e999.cwcase", text, -1);
  check_in_scratch (s, "1e999.cwcase", "canals[0].working_length");
}

static void
test_hostile_cli_huge_integer (Scratch       *s,
                               gconstpointer  data)
{
  g_autofree char *text = case_with ("123456789012345678901234567890", "null");

  write_file (s, "bigint.cwcase", text, -1);
  check_in_scratch (s, "bigint.cwcase", "canals[0].working_length");
}

static void
test_hostile_cli_100000_instruments (Scratch       *s,
                                     gconstpointer  data)
{
  GString *text = g_string_new ("{\"format\": \"canalwright-case\", \"version\": 1, \"instruments\": [");
  g_autofree char *data_text = NULL;

  for (guint i = 0; i < 100000; i++)
    g_string_append (text, i > 0 ? ",{\"id\": \"k\"}" : "{\"id\": \"k\"}");
  g_string_append (text, "], \"canals\": []}");
  data_text = g_string_free (text, FALSE);
  write_file (s, "instruments.cwcase", data_text, -1);
  check_in_scratch (s, "instruments.cwcase", "instruments");
}

static void
test_hostile_cli_100000_steps (Scratch       *s,
                               gconstpointer  data)
{
  GString *steps = g_string_new ("[");
  g_autofree char *steps_text = NULL;
  g_autofree char *text = NULL;
  g_autofree char *base = case_with ("21", "null");
  const char *at = strstr (base, "[{\"instrument\"");
  const char *end = strstr (at, "}]") + 2;

  for (guint i = 0; i < 100000; i++)
    g_string_append (steps, i > 0 ? ",{\"instrument\": \"k10\", \"depth\": 20}"
                                  : "{\"instrument\": \"k10\", \"depth\": 20}");
  g_string_append_c (steps, ']');
  steps_text = g_string_free (steps, FALSE);
  text = g_strdup_printf ("%.*s%s%s", (int) (at - base), base, steps_text, end);
  write_file (s, "steps.cwcase", text, -1);
  check_in_scratch (s, "steps.cwcase", "canals[0].sequence");
}

static void
test_hostile_cli_two_documents (Scratch       *s,
                                gconstpointer  data)
{
  g_autofree char *one = case_with ("21", "null");
  g_autofree char *text = g_strconcat (one, one, NULL);

  write_file (s, "twice.cwcase", text, -1);
  check_in_scratch (s, "twice.cwcase", NULL);
}

static void
test_hostile_cli_binary_garbage (Scratch       *s,
                                 gconstpointer  data)
{
  guint8 bytes[4096];
  GRand *rand = g_rand_new_with_seed (8);

  for (guint i = 0; i < sizeof bytes; i++)
    bytes[i] = (guint8) g_rand_int_range (rand, 0, 256);
  g_rand_free (rand);
  write_file (s, "garbage.cwcase", (const char *) bytes, sizeof bytes);
  check_in_scratch (s, "garbage.cwcase", NULL);
}

/* Number tokens that JSON does not have but the parser reads, as values
 * other than what a reader of the file would see. */
static void
test_hostile_cli_octal (Scratch       *s,
                        gconstpointer  data)
{
  g_autofree char *text = case_with ("021", "null");

  write_file (s, "octal.cwcase", text, -1);
  check_known_issue (s, "octal.cwcase", "canals[0].working_length",
                     "a leading zero is read as octal: working length 021 loads as 17 mm");
}

static void
test_hostile_cli_hex (Scratch       *s,
                      gconstpointer  data)
{
  g_autofree char *text = case_with ("0x15", "null");

  write_file (s, "hex.cwcase", text, -1);
  check_known_issue (s, "hex.cwcase", "canals[0].working_length",
                     "a hexadecimal token loads: working length 0x15 loads as 21 mm");
}

static void
test_hostile_cli_wrapped_integer (Scratch       *s,
                                  gconstpointer  data)
{
  g_autofree char *text = case_with ("-18446744073709551595", "null");

  write_file (s, "wrapped.cwcase", text, -1);
  check_known_issue (s, "wrapped.cwcase", "canals[0].working_length",
                     "an integer past 64 bits wraps: working length -18446744073709551595 loads as 21 mm");
}

static void
test_hostile_cli_duplicate_key (Scratch       *s,
                                gconstpointer  data)
{
  g_autofree char *text = case_with ("5, \"working_length\": 21", "null");

  write_file (s, "duplicate-key.cwcase", text, -1);
  check_known_issue (s, "duplicate-key.cwcase", "canals[0].working_length",
                     "a member given twice loads with the last value, where other readers may take the first");
}

static void
test_hostile_cli_nul_escape (Scratch       *s,
                             gconstpointer  data)
{
  g_autofree char *base = case_with ("21", "null");
  g_autofree char *text = g_strdup_printf ("{\"title\": \"Lower\\u0000 left\", %s", base + 1);

  write_file (s, "nul-escape.cwcase", text, -1);
  check_known_issue (s, "nul-escape.cwcase", "title",
                     "a \\u0000 escape silently cuts a string short: the title loads as \"Lower\"");
}

static void
test_hostile_cli_comment (Scratch       *s,
                          gconstpointer  data)
{
  g_autofree char *text = case_with ("/* 19 */ 21", "null");

  write_file (s, "comment.cwcase", text, -1);
  check_known_issue (s, "comment.cwcase", NULL,
                     "a /* comment */ loads, though JSON has none and other readers refuse the file");
}

static void
test_hostile_cli_single_quotes (Scratch       *s,
                                gconstpointer  data)
{
  g_autofree char *text = case_with ("21", "'single'");

  write_file (s, "quotes.cwcase", text, -1);
  check_known_issue (s, "quotes.cwcase", NULL,
                     "a 'single-quoted' string loads, though JSON has none and other readers refuse the file");
}

static void
test_hostile_cli_raw_control_characters (Scratch       *s,
                                         gconstpointer  data)
{
  g_autofree char *text = case_with ("21", "\"tab\there, bell\a\"");

  write_file (s, "control.cwcase", text, -1);
  check_known_issue (s, "control.cwcase", NULL,
                     "raw control characters in a string load (JSON has them only escaped), "
                     "and each is saved as a 6-byte escape: see /hardening/save/reopens-after-save");
}

static void
test_hostile_cli_lone_surrogate (Scratch       *s,
                                 gconstpointer  data)
{
  g_autofree char *base = case_with ("21", "null");
  g_autofree char *text = g_strdup_printf ("{\"title\": \"Lower\\ud87dt molar\", %s", base + 1);

  write_file (s, "surrogate.cwcase", text, -1);
  check_known_issue (s, "surrogate.cwcase", "title",
                     "a lone surrogate escape loads as bytes that are not UTF-8, and the case then "
                     "saves to a file that does not load (tests/fuzz/README.md, finding 1)");
}

static void
test_hostile_cli_octal_escape (Scratch       *s,
                               gconstpointer  data)
{
  g_autofree char *base = case_with ("21", "null");
  g_autofree char *text = g_strdup_printf ("{\"title\": \"Tooth \\063\\066\", %s", base + 1);

  write_file (s, "octal-escape.cwcase", text, -1);
  check_known_issue (s, "octal-escape.cwcase", "title",
                     "an octal escape, which JSON does not have, loads: \"Tooth \\063\\066\" reads as "
                     "\"Tooth 36\" (and \\377 as a byte that is not UTF-8)");
}

/* Linux file names are bytes: one that is not UTF-8 must still be named
 * in a message a window can show (g_filename_display_basename). */
static void
test_hostile_cli_name_not_utf8 (Scratch       *s,
                                gconstpointer  data)
{
  g_autofree char *path = scratch_path (s, "caf\xe9.cwcase");
  g_auto(Run) run = { 0 };

  g_assert_true (g_file_set_contents (path, "{", -1, NULL));
  run_check (&run, path);
  g_assert_cmpint (run.status, ==, 2);
  g_assert_cmpstr (run.out, ==, "");
  g_assert_nonnull (strstr (run.err, "caf"));
  if (!g_utf8_validate (run.err, -1, NULL))
    g_test_incomplete ("a file name that is not UTF-8 goes into the message as it is, "
                       "so the message is not UTF-8 (the window's dialog warns and shows less)");
}

/* Within the size limit, but a value for every two bytes: the parser
 * builds the whole tree before the loader counts anything. */
static void
test_hostile_cli_many_values (Scratch       *s,
                              gconstpointer  data)
{
  guint n = 4 * 1024 * 1024 / 3;
  GString *values = g_string_sized_new (4 * 1024 * 1024);
  g_autofree char *values_text = NULL;
  g_autofree char *text = NULL;

  g_string_append_c (values, '[');
  for (guint i = 0; i < n; i++)
    g_string_append (values, i > 0 ? ",{}" : "{}");
  g_string_append_c (values, ']');
  values_text = g_string_free (values, FALSE);
  text = case_with ("21", values_text);
  write_file (s, "many-values.cwcase", text, -1);
  check_known_issue (s, "many-values.cwcase", NULL,
                     "a 4 MiB file of 1.4 million empty objects loads (at 16 MiB: 13 s and 1.7 GB); "
                     "no bound on the number of JSON values before the parser allocates");
}

static void
add_scratch (const char *name,
             void      (*func) (Scratch *, gconstpointer))
{
  g_test_add (name, Scratch, NULL, scratch_setup, func, scratch_teardown);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  if (g_getenv ("CW_BINARY") == NULL)
    g_error ("CW_BINARY must name the built canalwright (meson test sets it)");
  g_test_add_func ("/hardening/cli/bad-files", test_hostile_cli_bad_files);
  g_test_add_func ("/hardening/cli/device", test_hostile_cli_device);
  add_scratch ("/hardening/cli/base-of-made-files-passes", test_hostile_cli_base_of_made_files_passes);
  add_scratch ("/hardening/cli/empty", test_hostile_cli_empty);
  add_scratch ("/hardening/cli/directory", test_hostile_cli_directory);
  add_scratch ("/hardening/cli/missing", test_hostile_cli_missing);
  add_scratch ("/hardening/cli/sparse-100-mib", test_hostile_cli_sparse_100_mib);
  add_scratch ("/hardening/cli/nesting-10000", test_hostile_cli_nesting_10000);
  add_scratch ("/hardening/cli/nesting-10000-bare", test_hostile_cli_nesting_10000_bare);
  add_scratch ("/hardening/cli/invalid-utf8", test_hostile_cli_invalid_utf8);
  add_scratch ("/hardening/cli/nul-byte", test_hostile_cli_nul_byte);
  add_scratch ("/hardening/cli/unreadable", test_hostile_cli_unreadable);
  add_scratch ("/hardening/cli/fifo", test_hostile_cli_fifo);
  add_scratch ("/hardening/cli/symlink-loop", test_hostile_cli_symlink_loop);
  add_scratch ("/hardening/cli/nan-token", test_hostile_cli_nan_token);
  add_scratch ("/hardening/cli/infinity-token", test_hostile_cli_infinity_token);
  add_scratch ("/hardening/cli/1e308", test_hostile_cli_1e308);
  add_scratch ("/hardening/cli/1e999", test_hostile_cli_1e999);
  add_scratch ("/hardening/cli/huge-integer", test_hostile_cli_huge_integer);
  add_scratch ("/hardening/cli/100000-instruments", test_hostile_cli_100000_instruments);
  add_scratch ("/hardening/cli/100000-steps", test_hostile_cli_100000_steps);
  add_scratch ("/hardening/cli/two-documents", test_hostile_cli_two_documents);
  add_scratch ("/hardening/cli/binary-garbage", test_hostile_cli_binary_garbage);
  add_scratch ("/hardening/cli/octal", test_hostile_cli_octal);
  add_scratch ("/hardening/cli/hex", test_hostile_cli_hex);
  add_scratch ("/hardening/cli/wrapped-integer", test_hostile_cli_wrapped_integer);
  add_scratch ("/hardening/cli/duplicate-key", test_hostile_cli_duplicate_key);
  add_scratch ("/hardening/cli/nul-escape", test_hostile_cli_nul_escape);
  add_scratch ("/hardening/cli/comment", test_hostile_cli_comment);
  add_scratch ("/hardening/cli/single-quotes", test_hostile_cli_single_quotes);
  add_scratch ("/hardening/cli/raw-control-characters", test_hostile_cli_raw_control_characters);
  add_scratch ("/hardening/cli/many-values", test_hostile_cli_many_values);
  add_scratch ("/hardening/cli/lone-surrogate", test_hostile_cli_lone_surrogate);
  add_scratch ("/hardening/cli/octal-escape", test_hostile_cli_octal_escape);
  add_scratch ("/hardening/cli/name-not-utf8", test_hostile_cli_name_not_utf8);
  return g_test_run ();
}
