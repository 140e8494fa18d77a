#pragma once
// Embedding stepframe: run a project (from a file, from text or built in
// code) on a model from any source, watch and cancel it, and read its results
// as values or as the results.json document.
//
//   stepframe::RunOptions options;
//   options.control.progress = [](std::string_view stage, double f) { ... };
//   const auto results = stepframe::run_file("platform.yaml", options);
//   if (results.status() == stepframe::ExitStatus::pass) use(results.json()["results"]);

#include "stepframe/errors.hpp"
#include "stepframe/model_source.hpp"
#include "stepframe/project.hpp"
#include "stepframe/run.hpp"
#include "stepframe/run_control.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <memory>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe {

/// The library's version ("0.1.0").
std::string_view library_version();

struct RunOptions {
  /// Where results.json and vtk/*.vtu go; empty writes nothing (results stay
  /// in memory). Files appear only when the whole run succeeds.
  std::filesystem::path out_dir;
  RunControl control;  ///< progress, cancellation, log sink
};

/// What a run came to. Always holds a status and, unless the run passed or
/// failed a check, a message saying what is wrong and what to do.
class Results {
 public:
  explicit Results(RunOutcome outcome);

  ExitStatus status() const { return outcome_.status; }
  /// For bad input, an unstable frame or a cancelled run: what happened; else empty.
  const std::string& message() const { return outcome_.message; }
  /// True when the analysis ran (status pass or check_failed).
  bool analysed() const { return outcome_.analysis.has_value(); }
  /// The analysis in typed form. Throws std::logic_error when !analysed().
  const Analysis& analysis() const;
  /// The results.json document (schema stepframe-results/1) when analysed; otherwise
  /// {"schema": "stepframe-results/1", "status": "error", "exit_status": N, "message": "..."}.
  /// Made on first use (a building-sized document takes a while and much memory as a tree).
  const nlohmann::json& json() const;
  /// The same document as text (what results.json holds), made on first use.
  const std::string& json_text() const;
  /// Files written (empty when out_dir was empty or the run failed).
  const std::vector<std::filesystem::path>& files() const { return outcome_.files; }
  /// The human summary the command line prints (or the message when not analysed).
  std::string summary() const;

 private:
  RunOutcome outcome_;
  struct Documents;  // json() and json_text(), made once each, safely from any thread
  std::shared_ptr<Documents> documents_;
};

/// Runs a project file (its model: resolved beside it).
Results run_file(const std::filesystem::path& project_file, const RunOptions& options = {});

/// Runs project text (YAML or JSON) held in memory; a relative `model:` is
/// resolved against `base_dir`.
Results run_text(std::string_view project_text, const std::filesystem::path& base_dir,
                 const RunOptions& options = {});

/// Runs project text on a model from any source; the text's `model:` then
/// only names the model in messages when the source has no name of its own.
Results run_text(std::string_view project_text, const std::filesystem::path& base_dir, const ModelSource& model,
                 const RunOptions& options = {});

/// Runs a project (from ProjectBuilder or read_project) on its own `model` file.
Results run(const Project& project, const RunOptions& options = {});

/// Runs a project on a model from any source (the project's `model` is then
/// used only to name the model when the source has no name of its own).
Results run(const Project& project, const ModelSource& model, const RunOptions& options = {});

}  // namespace stepframe
