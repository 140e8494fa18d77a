#include "output_folder.hpp"
#include "stepframe/analysis/solve.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/model_source.hpp"
#include "stepframe/run.hpp"

#include <spdlog/spdlog.h>

#include <optional>

namespace stepframe {

RunOutcome run_guarded(const std::function<Analysis(const RunControl&)>& analyse, const std::filesystem::path& out_dir,
                       const RunControl& control, const std::string& context, std::optional<VtkSelection> vtk,
                       std::optional<VtkSelection> result_details, std::optional<CheckDetails> check_details) {
  const ScopedLogSink log_route(control.log_sink, control.log_level);
  RunOutcome outcome;
  try {
    // The output folder is taken first: a second run into it is refused before it analyses anything.
    // Its staging folder takes the tables that need no check as soon as the results are solved.
    std::optional<detail::OutputFolderLock> lock;
    std::optional<detail::StagingFolder> staging;
    std::vector<std::filesystem::path> tables;
    RunControl analysing = control;
    if (!out_dir.empty()) {
      lock.emplace(out_dir);
      staging.emplace(out_dir);
      analysing.results_solved = [&](const Analysis& a) {
        if (control.results_solved) control.results_solved(a);
        tables = detail::write_check_free_tables(a, *staging, out_dir);
      };
    }
    outcome.analysis = analyse(analysing);
    auto& outputs = outcome.analysis->project.outputs;
    if (vtk) outputs.line_models = outputs.surfaces = outputs.buckling_modes = *vtk;
    if (result_details) outputs.result_details = *result_details;
    if (check_details) outputs.check_details = *check_details;
    if (staging) outcome.files = detail::write_outputs_into(*outcome.analysis, *staging, out_dir, std::move(tables), control);
    outcome.status = outcome.analysis->status();
  } catch (const Cancelled& e) {
    outcome = {ExitStatus::cancelled, e.what(), std::nullopt, {}};
  } catch (const InputError& e) {
    outcome = {ExitStatus::bad_input, e.what(), std::nullopt, {}};
  } catch (const geometry::StepReadError& e) {
    outcome = {ExitStatus::bad_input, e.what(), std::nullopt, {}};
  } catch (const SourceNotAvailable& e) {
    outcome = {ExitStatus::bad_input, e.what(), std::nullopt, {}};
  } catch (const analysis::UnstableFrame& e) {
    outcome = {ExitStatus::unstable, context + ": " + e.what(), std::nullopt, {}};
  } catch (const std::invalid_argument& e) {
    outcome = {ExitStatus::bad_input, context + ": " + e.what(), std::nullopt, {}};
  }
  return outcome;
}

RunOutcome run_project(const std::filesystem::path& project_file, const std::filesystem::path& out_dir,
                       const RunControl& control, std::optional<VtkSelection> vtk,
                       std::optional<VtkSelection> result_details, std::optional<CheckDetails> check_details) {
  return run_guarded([&](const RunControl& c) { return analyse_project(project_file, c); },
                     out_dir.empty() ? default_out_dir(project_file) : out_dir, control, project_file.string(), vtk,
                     result_details, check_details);
}

}  // namespace stepframe
