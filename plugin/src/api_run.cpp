#include "stepframe/api.hpp"
#include "stepframe/project_reader.hpp"

#include <spdlog/spdlog.h>

#include <mutex>
#include <stdexcept>

#ifndef STEPFRAME_VERSION
#error "STEPFRAME_VERSION must be defined by the build"
#endif

namespace stepframe {
namespace {

nlohmann::json error_document(const RunOutcome& outcome) {
  return {{"schema", "stepframe-results/1"},
          {"status", outcome.status == ExitStatus::cancelled ? "cancelled" : "error"},
          {"exit_status", static_cast<int>(outcome.status)},
          {"message", outcome.message}};
}

}  // namespace

std::string_view library_version() { return STEPFRAME_VERSION; }

struct Results::Documents {
  std::once_flag text_once, json_once;
  std::string text;
  nlohmann::json json;
};

Results::Results(RunOutcome outcome) : outcome_(std::move(outcome)), documents_(std::make_shared<Documents>()) {}

const std::string& Results::json_text() const {
  std::call_once(documents_->text_once, [&] {
    // A message may quote input bytes that are not UTF-8: replaced (U+FFFD) rather than thrown on.
    documents_->text = outcome_.analysis ? results_json_text(*outcome_.analysis)
                                         : error_document(outcome_).dump(-1, ' ', false,
                                                                         nlohmann::json::error_handler_t::replace);
  });
  return documents_->text;
}

const nlohmann::json& Results::json() const {
  std::call_once(documents_->json_once, [&] {
    documents_->json = outcome_.analysis ? nlohmann::json::parse(json_text()) : error_document(outcome_);
  });
  return documents_->json;
}

const Analysis& Results::analysis() const {
  if (!outcome_.analysis) throw std::logic_error("stepframe::Results::analysis(): the run did not analyse: " + outcome_.message);
  return *outcome_.analysis;
}

std::string Results::summary() const {
  return outcome_.analysis ? summary_text(*outcome_.analysis) : outcome_.message + "\n";
}

Results run_file(const std::filesystem::path& project_file, const RunOptions& options) {
  return Results(run_guarded([&](const RunControl& c) { return analyse_project(project_file, c); }, options.out_dir,
                             options.control, project_file.string()));
}

Results run_text(std::string_view project_text, const std::filesystem::path& base_dir, const RunOptions& options) {
  const std::string name = "<project text>";
  return Results(run_guarded(
      [&](const RunControl& c) {
        c.report("project", 0);
        auto project = read_project_text(project_text, base_dir, name);
        c.report("geometry", 0);
        auto step = geometry::read_step(project.model);
        return analyse_model(std::move(project), std::move(step), c);
      },
      options.out_dir, options.control, name));
}

Results run_text(std::string_view project_text, const std::filesystem::path& base_dir, const ModelSource& model,
                 const RunOptions& options) {
  const std::string name = "<project text>";
  return Results(run_guarded(
      [&](const RunControl& c) {
        c.report("project", 0);
        auto project = read_project_text(project_text, base_dir, name);
        c.report("geometry", 0);
        auto step = read_model_source(model);
        if (!std::holds_alternative<StepFile>(model)) project.model = describe(model);
        return analyse_model(std::move(project), std::move(step), c);
      },
      options.out_dir, options.control, name));
}

Results run(const Project& project, const RunOptions& options) {
  return run(project, StepFile{project.model}, options);
}

Results run(const Project& project, const ModelSource& model, const RunOptions& options) {
  return Results(run_guarded(
      [&](const RunControl& c) {
        c.report("geometry", 0);
        auto step = read_model_source(model);
        Project p = project;
        if (!std::holds_alternative<StepFile>(model)) p.model = describe(model);
        return analyse_model(std::move(p), std::move(step), c);
      },
      options.out_dir, options.control, project.file.string()));
}

}  // namespace stepframe
