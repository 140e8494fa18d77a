#pragma once
// The batch stage: many projects, each run by `stepframe run` in a process of
// its own (the same run function as a single run; a crash or a timeout ends
// only that project), up to `jobs` at a time. Every project's outputs go to a
// subfolder of the batch's output folder, written as a single run writes them.
// The batch writes batch.json (what each project came to, with the SHA-256 of
// its inputs and the program version) and batch.xml (JUnit XML: one test case
// per project, so a CI system shows the verdicts natively). A project whose
// inputs and program version are unchanged since the last batch into the same
// folder, and whose results are still there, is not run again unless `force`.

#include <filesystem>
#include <functional>
#include <optional>
#include <string>
#include <vector>

namespace stepframe {

struct BatchOptions {
  std::filesystem::path out_dir;        ///< the batch's folder: one subfolder per project
  std::filesystem::path executable;     ///< the stepframe executable the projects are run with
  unsigned jobs = 2;                    ///< projects run at once (at least 1)
  std::optional<double> timeout;        ///< [s] per project; a project still running then is stopped
  bool force = false;                   ///< run every project, unchanged or not
  /// Called as projects finish: (finished, total, the project just finished).
  std::function<void(std::size_t, std::size_t, const std::string&)> progress;
};

/// What one project came to.
struct BatchEntry {
  std::filesystem::path project;
  std::string name;                 ///< its subfolder's name
  int exit_status = 0;              ///< as `stepframe run` (0 pass, 1 a check fails, 2 bad input, 3 unstable, 4 internal)
  std::string outcome;              ///< "pass", "fail", "bad input", "unstable", "internal error", "timeout", "crashed"
  std::optional<double> governing_utilisation;
  std::string governing;            ///< e.g. "member 18 6.3.3 interaction under ULS-1"
  std::vector<std::string> failing; ///< one line per failing check
  std::string message;              ///< what went wrong (bad input, crash, timeout)
  double seconds = 0;               ///< wall time of its run (of the earlier run when skipped)
  bool skipped = false;             ///< unchanged since the last batch: not run again
  std::string project_sha256, model_sha256;
};

struct BatchReport {
  std::vector<BatchEntry> entries;  ///< in the order the projects were given
  int exit_status = 0;              ///< the worst: the largest of the projects' statuses (timeouts and crashes count 4)
  double seconds = 0;
};

/// The project files named by `arguments`: project files (.yaml, .yml),
/// glob patterns (POSIX glob), and manifests (any other file: one project
/// path per line, relative to the manifest, '#' starts a comment).
/// Throws InputError naming what matches nothing or cannot be read.
std::vector<std::filesystem::path> batch_projects(const std::vector<std::string>& arguments);

/// Runs the projects; writes batch.json and batch.xml into options.out_dir.
BatchReport run_batch(const std::vector<std::filesystem::path>& projects, const BatchOptions& options);

/// batch.json's text (schema stepframe-batch/1).
std::string batch_json(const BatchReport& report);

/// batch.xml's text (JUnit XML).
std::string batch_junit_xml(const BatchReport& report);

/// The summary table people read: project, outcome, governing utilisation, time.
std::string batch_summary_text(const BatchReport& report);

}  // namespace stepframe
