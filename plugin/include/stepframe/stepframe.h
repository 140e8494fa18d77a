/* stepframe C ABI: run steel-frame analyses from any language or plug-in host.
 *
 * Plain C: opaque handles, int status codes and message strings. No C++
 * exception or type crosses this boundary. Strings are UTF-8 and
 * NUL-terminated; strings returned by the library stay owned by it (valid
 * until the handle is run again or freed, or forever for static ones).
 *
 * Status codes are those of the `stepframe` command:
 *   0 every check passes, 1 a check fails, 2 bad input, 3 the frame is unstable,
 *   4 internal error, 5 cancelled by the caller, 6 invalid argument to a call.
 *
 * Hosts that discover plug-ins with dlopen look up `sf_plugin_descriptor`
 * and compare its abi_version with the one they were built for.
 *
 * Thread safety: every function may be called from any thread, and runs on
 * different handles may go on at once on different threads: each gives exactly
 * the result it gives alone (the test suite runs 8 threads x 5 projects and
 * compares byte for byte). One handle must not be used by two threads at once,
 * except sf_run_cancel, which any thread may call while the handle runs. The
 * steps that use libraries which are not thread-safe (OCCT's STEP reading, the
 * report's picture rendering) take a process-wide lock and so run one at a
 * time; everything else runs in parallel. Runs on several handles at once
 * share the process's log routing (see sf_run_set_log).
 *
 * Output folders: a run writes into a fresh folder beside out_dir and puts it
 * in place of out_dir in one atomic step when every file is complete, so
 * out_dir holds either the previous results or the new ones, never a mix. A
 * second run into an out_dir that a run (of this or another process) is
 * writing is refused with SF_BAD_INPUT, "in use by process N". An existing
 * out_dir that does not hold earlier results (no results.json) and is not
 * empty is refused rather than replaced.
 *
 * Logging: unless sf_run_set_log routes them, log lines go to stderr (never
 * stdout), through spdlog's default logger when the host has set one.
 */
#ifndef STEPFRAME_STEPFRAME_H
#define STEPFRAME_STEPFRAME_H

#include <stddef.h>

#if defined(_WIN32)
#define SF_API __declspec(dllexport)
#else
#define SF_API __attribute__((visibility("default")))
#endif

#ifdef __cplusplus
extern "C" {
#endif

/** The ABI this header describes; bumped on any incompatible change. */
#define SF_ABI_VERSION 1

enum sf_status {
  SF_PASS = 0,             /**< every check passes */
  SF_CHECK_FAILED = 1,     /**< the analysis ran and at least one check fails */
  SF_BAD_INPUT = 2,        /**< project file, STEP file or model unusable; the message says why */
  SF_UNSTABLE = 3,         /**< the frame is a mechanism; the message names node and direction */
  SF_INTERNAL_ERROR = 4,   /**< a bug: please report it with the input files */
  SF_CANCELLED = 5,        /**< the progress callback or sf_run_cancel stopped the run */
  SF_INVALID_ARGUMENT = 6  /**< a null handle or path, or a call out of order */
};

/** Log levels passed to an sf_log_fn. */
enum sf_log_level { SF_LOG_DEBUG = 1, SF_LOG_INFO = 2, SF_LOG_WARNING = 3, SF_LOG_ERROR = 4 };

/** What a plug-in host needs to know before calling anything else. */
typedef struct sf_plugin_info {
  const char *name;        /**< "stepframe" */
  const char *version;     /**< library version, e.g. "0.1.0" */
  int abi_version;         /**< SF_ABI_VERSION the library was built with */
  const char *description; /**< one line for a host's plug-in list */
} sf_plugin_info;

/** Static descriptor; never NULL. */
SF_API const sf_plugin_info *sf_plugin_descriptor(void);

/** SF_ABI_VERSION of the loaded library. */
SF_API int sf_abi_version(void);

/** Library version string, e.g. "0.1.0". */
SF_API const char *sf_version(void);

/** A short name for a status code ("pass", "check failed", ...). */
SF_API const char *sf_status_name(int status);

/** Runs a project file as `stepframe run` does and writes results.json and the
 *  VTK files under out_dir (NULL or "" means "<project>-results" beside the
 *  project file). Returns the status; writes a human-readable one-line message
 *  into `message` (truncated to message_len - 1 bytes; may be NULL if
 *  message_len is 0). Logs go to the process's default logger (stderr). */
SF_API int sf_run_file(const char *project_yaml, const char *out_dir, char *message, size_t message_len);

/** A run handle: holds options, the last run's status, message and results. */
typedef struct sf_run sf_run;

/** Progress: a stage name and the fraction done in [0, 1]. Return 0 to go on,
 *  non-zero to cancel the run. Called on the thread that runs. */
typedef int (*sf_progress_fn)(const char *stage, double fraction, void *user_data);

/** A log message of the run (without a trailing newline). */
typedef void (*sf_log_fn)(int level, const char *message, void *user_data);

/** A new handle, or NULL when out of memory. Free with sf_run_free. */
SF_API sf_run *sf_run_new(void);

/** Frees the handle and every string it returned. NULL is ignored. */
SF_API void sf_run_free(sf_run *run);

/** Where the next runs write results.json and vtk/ (NULL or "": write nothing). */
SF_API int sf_run_set_out_dir(sf_run *run, const char *out_dir);

/** Progress callback for the next runs (NULL: none). */
SF_API int sf_run_set_progress(sf_run *run, sf_progress_fn progress, void *user_data);

/** Routes the next runs' log messages at or above min_level to `log` instead of
 *  stderr (NULL: default logging). While such a run goes on, the library's
 *  process-wide logger is the handle's; it is restored when the run ends. */
SF_API int sf_run_set_log(sf_run *run, sf_log_fn log, void *user_data, int min_level);

/** Asks the current or next run of this handle to stop; safe from any thread.
 *  The run returns SF_CANCELLED. The request stays until sf_run_reset_cancel,
 *  so a cancel that races the start of a run still wins. */
SF_API int sf_run_cancel(sf_run *run);

/** Clears a cancel request so the handle can run again. */
SF_API int sf_run_reset_cancel(sf_run *run);

/** Runs a project file. Returns the status (also kept in the handle). */
SF_API int sf_run_project_file(sf_run *run, const char *project_file);

/** Runs project text (YAML or JSON) held in memory; a relative `model:` is
 *  resolved against base_dir (NULL: the current directory). */
SF_API int sf_run_project_text(sf_run *run, const char *project_text, const char *base_dir);

/** Runs project text on a model held in memory as STEP text (ISO 10303-21,
 *  step_len bytes; no file is read or written for it). The project's
 *  `model:` then only names the model in messages. */
SF_API int sf_run_project_text_with_step(sf_run *run, const char *project_text, const char *base_dir,
                                         const char *step_text, size_t step_len);

/** Status of the last run (SF_INVALID_ARGUMENT before any run or for NULL). */
SF_API int sf_run_status(const sf_run *run);

/** Message of the last run: what went wrong, or "" when it passed or a check
 *  failed. Owned by the handle. */
SF_API const char *sf_run_message(const sf_run *run);

/** The last run's results.json document (schema stepframe-results/1) as a JSON
 *  string, or for a run that did not analyse {"status": "error", "exit_status":
 *  N, "message": ...}. Owned by the handle; NULL before any run. */
SF_API const char *sf_run_results_json(const sf_run *run);

/** Copies the results JSON into `buffer` (NUL-terminated, truncated to
 *  buffer_len - 1 bytes) and returns the full length without the NUL, so a
 *  caller may ask with buffer_len 0 first. Returns 0 before any run. */
SF_API size_t sf_run_copy_results_json(const sf_run *run, char *buffer, size_t buffer_len);

/** The human summary `stepframe run` prints (owned by the handle). */
SF_API const char *sf_run_summary(const sf_run *run);

#ifdef __cplusplus
}
#endif

#endif /* STEPFRAME_STEPFRAME_H */
