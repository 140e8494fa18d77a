#include "stepframe/analysis/solve.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/run.hpp"

#include <spdlog/spdlog.h>

namespace stepframe {

RunOutcome run_project(const std::filesystem::path& project_file, const std::filesystem::path& out_dir,
                       const ProgressCallback& progress) {
  RunOutcome outcome;
  try {
    outcome.analysis = analyse_project(project_file, progress);
    outcome.files = write_outputs(*outcome.analysis, out_dir.empty() ? default_out_dir(project_file) : out_dir);
    outcome.status = outcome.analysis->status();
  } catch (const InputError& e) {
    outcome = {ExitStatus::bad_input, e.what(), std::nullopt, {}};
  } catch (const geometry::StepReadError& e) {
    outcome = {ExitStatus::bad_input, e.what(), std::nullopt, {}};
  } catch (const analysis::UnstableFrame& e) {
    outcome = {ExitStatus::unstable, project_file.string() + ": " + e.what(), std::nullopt, {}};
  } catch (const std::invalid_argument& e) {
    outcome = {ExitStatus::bad_input, project_file.string() + ": " + e.what(), std::nullopt, {}};
  }
  return outcome;
}

}  // namespace stepframe
