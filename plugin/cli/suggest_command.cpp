#include "suggest_command.hpp"

#include "progress_display.hpp"

#include "stepframe/analysis/solve.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/project_reader.hpp"

#include <spdlog/spdlog.h>

#include <iostream>

namespace stepframe::cli {
namespace {

// The suggestion for an analysed project, written into out; its files' folder is printed. The model is read
// (again: the analysis let go of it) and analysed with `control`; `display` (if any) is cleared before the
// summary is printed.
Suggestion suggest_and_write(const Analysis& first, const SuggestOptions& options, const std::filesystem::path& out,
                             bool print, const RunControl& control, ProgressDisplay* display = nullptr) {
  const auto step = geometry::read_step(first.project.model, control.step_read_options());
  const Suggestion s = suggest_sections(first.project, step, first, options, control);
  if (display) display->clear();
  write_suggestion(s, out);
  if (print) std::cout << suggestion_text(s) << "suggestion: " << (out / "suggest.yaml").string() << "\n";
  return s;
}

}  // namespace

CLI::App* add_suggest_command(CLI::App& app, SuggestCommandOptions& options) {
  auto* suggest = app.add_subcommand(
      "suggest",
      "Suggest sections: for each failing member the lightest section of its family (or of the project's "
      "suggest.sections) that makes every check pass, analysing again after each round until nothing changes. "
      "Writes suggest.yaml (project-file rules to paste, with the mass change) and suggest.json into --out "
      "(default: <project>-suggest beside it); changes neither the CAD model nor the project. Exit status: 0 "
      "with the suggested sections every check passes, 1 some still fail, 2 bad input, 3 unstable");
  suggest->add_option("PROJECT", options.project, "Project file (YAML)")->required()->check(CLI::ExistingFile);
  suggest->add_option("--out", options.out, "Output folder (default: <project>-suggest beside the project file)");
  suggest->add_option("--lighten-below", options.lighten_below,
                      "Also lighten members whose utilisation is below this, one size at a time while all passes")
      ->check(CLI::Range(0.0, 1.0));
  suggest->add_option("--max-rounds", options.suggest.max_rounds, "Analyses after the first, at most")
      ->capture_default_str()
      ->check(CLI::Range(1, 100));
  return suggest;
}

int suggest_command(SuggestCommandOptions options, const RunControl& control) {
  if (options.lighten_below > 0) options.suggest.lighten_below = options.lighten_below;
  const auto out = options.out.empty()
                       ? options.project.parent_path() / (options.project.stem().string() + "-suggest")
                       : options.out;
  ProgressDisplay display(options.progress);
  RunControl analysing = control;
  analysing.progress = display.callback();
  try {
    const Analysis first = analyse_project(options.project, analysing);
    const Suggestion s = suggest_and_write(first, options.suggest, out, true, analysing, &display);
    std::cout << "\n" << caution << "\n";
    return static_cast<int>(s.status());
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  } catch (const geometry::StepReadError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  } catch (const analysis::UnstableFrame& e) {
    spdlog::error("{}: {}", options.project.string(), e.what());
    return static_cast<int>(ExitStatus::unstable);
  }
}

int suggest_after_run(const Analysis& analysis, const std::filesystem::path& run_out, bool print,
                      const RunControl& control) {
  try {
    if (print) std::cout << "\n";
    suggest_and_write(analysis, {}, run_out / "suggest", print, control);
    return 0;
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  } catch (const geometry::StepReadError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  } catch (const analysis::UnstableFrame& e) {
    spdlog::error("suggest: a suggested section leaves the frame unstable: {}", e.what());
    return static_cast<int>(ExitStatus::unstable);
  }
}

}  // namespace stepframe::cli
