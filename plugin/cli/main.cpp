// The stepframe command line: data on stdout, logs on stderr.

#include "batch_command.hpp"
#include "compare_command.hpp"
#include "suggest_command.hpp"
#include "init_command.hpp"
#include "progress_display.hpp"
#include "stepframe/analysis/blas_info.hpp"
#include "sections_command.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "stepframe/inspect.hpp"
#include "stepframe/run.hpp"

#include <CLI/CLI.hpp>
#include <spdlog/sinks/stdout_color_sinks.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <atomic>
#include <csignal>
#include <cstddef>
#include <cstdlib>
#include <cstdio>
#include <map>
#include <optional>
#include <iostream>

namespace {

constexpr int internal_error = 4;

// STEP files of this many members or more are read in two processes at once
// (geometry::StepReadOptions::two_processes_from): the 1,086-member bench frame's read gains a little
// (0.76 against 0.78 s for the whole run, medians of eight alternating runs), smaller files nothing.
constexpr std::size_t two_process_read_from = 1000;

constexpr const char* exit_statuses =
    "Exit status: 0 every check passes; 1 the analysis ran and a check fails (its files are written); "
    "2 bad input (the message names the file and line or STEP entity); 3 the frame is unstable; 4 internal error.";

// SIGINT and SIGTERM stop a run as a cancel does: the staging folder is
// removed and the previous results stay. A second signal ends the process at
// once (SA_RESETHAND). The command re-raises the signal when the run has stopped;
// a signal after the run's last moment to stop (its results already replace the
// earlier ones) stops nothing, and the command ends with the run's own status.
std::atomic<bool> stop_requested{false};
volatile std::sig_atomic_t stop_signal = 0;

extern "C" void on_stop_signal(int signal_number) {
  stop_signal = signal_number;
  stop_requested.store(true);
}

void catch_stop_signals() {
  struct sigaction action {};
  action.sa_handler = on_stop_signal;
  sigemptyset(&action.sa_mask);
  action.sa_flags = SA_RESETHAND;
  sigaction(SIGINT, &action, nullptr);
  sigaction(SIGTERM, &action, nullptr);
}

// After a run a signal stopped: end as the signal would have ended us. `results_written`: the run got past
// its last moment to stop, and its results are in place.
void finish_if_signalled(bool results_written) {
  if (stop_signal == 0) return;
  const int signal_number = stop_signal;
  if (results_written) {
    spdlog::warn("signal {} came after the results were complete and in place: they stand, and the run ends as usual",
                 signal_number);
    return;
  }
  spdlog::error("stopped by signal {}: temporary files removed; earlier results, if any, are untouched", signal_number);
  std::signal(signal_number, SIG_DFL);
  std::raise(signal_number);
}

// What every command that analyses a project runs with: a large STEP file read in two processes, and the
// factorisation on the cores the run leaves idle (unless OpenBLAS's threads are set by the user). `run`
// adds its progress display and its stop on a signal.
stepframe::RunControl analysis_control() {
  stepframe::RunControl control;
  control.idle_cores_for_factorisation = std::getenv("OPENBLAS_NUM_THREADS") == nullptr;
  control.two_process_read_from = two_process_read_from;
  return control;
}

// Each stage's wall time on stderr, as `--timings` asks.
void print_timings(stepframe::cli::ProgressDisplay& display) {
  std::string table = "stage           seconds\n";
  for (const auto& [stage, seconds] : display.timings()) table += fmt::format("{:<15} {:8.3f}\n", stage, seconds);
  table += fmt::format("{:<15} {:8.3f}\n", "total", display.elapsed());
  std::cerr << table;
}

int run_command(const std::filesystem::path& project, const std::filesystem::path& out, bool json, bool show_progress,
                bool timings, std::optional<stepframe::VtkSelection> vtk,
                std::optional<stepframe::VtkSelection> result_details,
                std::optional<stepframe::CheckDetails> check_details, const std::filesystem::path& baseline_path,
                double max_increase, bool suggest) {
  // The baseline is read first: a bad one stops the run before anything is written, and a baseline that
  // is the output folder itself (the previous run) is read before the run replaces it.
  std::optional<stepframe::Revision> baseline;
  if (!baseline_path.empty()) {
    try {
      baseline = stepframe::read_revision(baseline_path, analysis_control());
    } catch (const stepframe::InputError& e) {
      spdlog::error("--baseline {}", e.what());
      return static_cast<int>(stepframe::ExitStatus::bad_input);
    }
  }
  stepframe::cli::ProgressDisplay display(show_progress);
  stepframe::RunControl control = analysis_control();
  control.progress = display.callback();
  control.cancel_flag = &stop_requested;
  catch_stop_signals();
  const auto outcome = stepframe::run_project(project, out, control, vtk, result_details, check_details);
  display.clear();
  finish_if_signalled(outcome.analysis.has_value());  // an analysis in the outcome: its files are written
  if (timings) print_timings(display);
  const int status = static_cast<int>(outcome.status);
  if (!outcome.analysis) {
    spdlog::error("{}", outcome.message);
    if (json) std::cout << nlohmann::json{{"status", "error"}, {"exit_status", status}, {"message", outcome.message}}.dump(1) << '\n';
    else std::cerr << "\n" << stepframe::caution << "\n";
    return status;
  }
  if (json) {
    nlohmann::json summary{{"status", outcome.analysis->status() == stepframe::ExitStatus::pass ? "pass" : "fail"},
                           {"exit_status", status},
                           {"caution", stepframe::caution},
                           {"checks", stepframe::checks_json(outcome.analysis->checks)},
                           {"files", nlohmann::json::array()}};
    for (const auto& f : outcome.files) summary["files"].push_back(f.string());
    std::cout << summary.dump(1) << '\n';
  } else {
    std::cout << stepframe::summary_text(*outcome.analysis);
    std::cout << "\nresults: " << (outcome.files.empty() ? std::string("(none)") : outcome.files.back().parent_path().string()) << "\n";
  }
  const auto run_out = out.empty() ? stepframe::default_out_dir(project) : out;
  // The suggestion is advice: it leaves the run's status alone unless it could not be made.
  if (suggest) {
    const int made = stepframe::cli::suggest_after_run(*outcome.analysis, run_out, !json, analysis_control());
    if (made != 0) return made;
  }
  if (baseline) {
    const int gate = stepframe::cli::compare_with_baseline(
        *baseline, {project.string(), stepframe::results_json(*outcome.analysis)}, run_out, max_increase, !json);
    return std::max(status, gate);
  }
  return status;
}

// `input` is a STEP file or a project file; a tolerance given on the command
// line overrides the project's.
int inspect_command(const std::filesystem::path& input, std::optional<double> tolerance_mm, bool json,
                    const stepframe::geometry::StepReadOptions& read) {
  try {
    const auto inspection =
        stepframe::is_project_file(input)
            ? stepframe::inspect_project(
                  input, tolerance_mm ? std::optional<double>(*tolerance_mm * 1e-3) : std::nullopt, read)
            : stepframe::inspect_step(input, tolerance_mm.value_or(1.0) * 1e-3, read);
    if (json) std::cout << stepframe::inspection_json(inspection).dump(1) << '\n';
    else std::cout << stepframe::inspection_text(inspection) << "\n" << stepframe::caution << "\n";
    return 0;
  } catch (const stepframe::geometry::StepReadError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(stepframe::ExitStatus::bad_input);
  } catch (const stepframe::InputError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(stepframe::ExitStatus::bad_input);
  }
}

// A merge tolerance in mm: positive, finite and at most geometry::max_merge_tolerance (NaN fails too).
const CLI::Validator merge_tolerance_mm(
    [](std::string& text) -> std::string {
      char* end = nullptr;
      const double mm = std::strtod(text.c_str(), &end);
      if (end == text.c_str() || *end != '\0' || !(mm > 0 && mm <= 1000 * stepframe::geometry::max_merge_tolerance))
        return "the merge tolerance is a length in mm above 0 and at most 1000 (1 mm is usual), got '" + text + "'";
      return {};
    },
    "mm");

}  // namespace

int main(int argc, char** argv) {
  auto logger = spdlog::stderr_color_mt("stepframe");
  // On a terminal each log line first erases the progress line it may interrupt.
  const bool terminal = stepframe::cli::stderr_is_terminal();
  logger->set_pattern(terminal ? "\r\033[K%^%l%$: %v" : "%^%l%$: %v");
  spdlog::set_default_logger(logger);
  // OpenBLAS' threads spin-wait for one another: with the second core busy (a
  // build, another run) its two threads made the factorisation of a
  // 10,000-member frame about 5x and the buckling analysis about 19x slower
  // than one thread did (measured, README). One thread unless the user asks;
  // a large factorisation widens to the cores idle when it starts (run below).
  if (std::getenv("OPENBLAS_NUM_THREADS") == nullptr) stepframe::analysis::set_blas_threads(1);

  // Named here, so help shows `stepframe`, not the path it was started by.
  CLI::App app{"stepframe: analyse steel frames drawn as STEP wireframes.\n" + std::string(stepframe::caution), "stepframe"};
  app.footer(exit_statuses);
  app.set_version_flag("--version", std::string("stepframe ") + STEPFRAME_VERSION);
  app.require_subcommand(1);
  app.fallthrough();  // -v / -q may follow the subcommand too
  bool verbose = false, quiet = false;
  app.add_flag("-v,--verbose", verbose, "Log details (debug level)");
  app.add_flag("-q,--quiet", quiet, "Log only warnings and errors");

  auto* run = app.add_subcommand(
      "run", "Analyse a project. Writes results.json, report.html, checks.csv, takeoff.csv, takeoff_by_section.csv, "
             "reactions.csv, end_forces.csv, cutlist.csv, connections.csv, frame.vtm and vtk/*.vtu into the output "
             "folder (also when checks fail; nothing on bad input), and a summary on stdout");
  run->footer(exit_statuses);
  std::filesystem::path project, out;
  bool run_json = false;
  run->add_option("PROJECT", project, "Project file (YAML)")->required()->check(CLI::ExistingFile);
  run->add_option("--out", out, "Output folder (default: <project>-results beside the project file)");
  run->add_flag("--json", run_json, "Print the run summary as JSON on stdout");
  bool no_progress = false;
  run->add_flag("--no-progress", no_progress, "No progress line (it is shown only when stderr is a terminal anyway)");
  bool run_timings = false;
  run->add_flag("--timings", run_timings, "Print each stage's wall time on stderr after the run");
  std::optional<stepframe::VtkSelection> run_vtk;
  const std::map<std::string, stepframe::VtkSelection> selection_choices{
      {"all", stepframe::VtkSelection::all}, {"combinations", stepframe::VtkSelection::combinations},
      {"governing", stepframe::VtkSelection::governing}, {"none", stepframe::VtkSelection::none}};
  run->add_option("--vtk", run_vtk,
                  "VTK files for every result and sway variant (all), every case and combination with its governing "
                  "sway variant (combinations), the governing results (governing) or none, whatever the "
                  "project's outputs: block says")
      ->transform(CLI::CheckedTransformer(selection_choices, CLI::ignore_case));
  std::optional<stepframe::VtkSelection> run_result_details;
  run->add_option("--result-details", run_result_details,
                  "Node displacements and member summaries in results.json for every result and sway variant (all), "
                  "every case and combination with its governing sway variant (combinations), the governing "
                  "results (governing) or none, whatever the project's outputs: block says")
      ->transform(CLI::CheckedTransformer(selection_choices, CLI::ignore_case));
  std::optional<stepframe::CheckDetails> run_check_details;
  run->add_option("--check-details", run_check_details,
                  "Clause texts and intermediate values in results.json for every check (all) or for each member's "
                  "governing check and every failing one (governing), whatever the project's outputs: block says")
      ->transform(CLI::CheckedTransformer(std::map<std::string, stepframe::CheckDetails>{
                                              {"all", stepframe::CheckDetails::all},
                                              {"governing", stepframe::CheckDetails::governing}},
                                          CLI::ignore_case));

  std::filesystem::path run_baseline;
  double run_max_increase = stepframe::CompareOptions{}.max_increase;
  stepframe::cli::add_baseline_options(*run, run_baseline, run_max_increase);
  bool run_suggest = false;
  run->add_flag("--suggest", run_suggest,
                "Also suggest sections for failing members (as `stepframe suggest`) into <out>/suggest/");

  auto* inspect = app.add_subcommand("inspect", "Show what a STEP file holds: unit, extent, attributes, diagnostics; "
                                                "through a project file also each member's section and material, the "
                                                "support nodes and the rules that match nothing. Prints on stdout, "
                                                "writes no file");
  std::filesystem::path model;
  std::optional<double> tolerance_mm;
  bool inspect_json = false;
  inspect->add_option("MODEL", model, "STEP file, or project file (.yaml, .yml)")->required();
  inspect->add_option("--tolerance", tolerance_mm,
                      "Merge tolerance for end points, in mm (default: the project's, else 1 mm)")
      ->check(merge_tolerance_mm);
  inspect->add_flag("--json", inspect_json, "Print JSON (results.json shapes) instead of tables");

  auto* init = app.add_subcommand("init", "Write a starter project file for a STEP file, one that runs as written: "
                                          "rules for the designations its attributes hold, its lowest nodes as "
                                          "supports, self weight, checks. Writes MODEL.yaml (or --output) and prints "
                                          "its path");
  std::filesystem::path init_model, init_output;
  bool init_force = false;
  double init_tolerance_mm = 1.0;
  init->add_option("MODEL", init_model, "STEP file")->required();
  init->add_option("-o,--output", init_output, "Project file to write (default: MODEL with .yaml, beside it)");
  init->add_flag("--force", init_force, "Overwrite the project file if it exists");
  init->add_option("--tolerance", init_tolerance_mm, "Merge tolerance for end points, in mm")
      ->capture_default_str()
      ->check(merge_tolerance_mm);

  stepframe::cli::BatchCommandOptions batch_options;
  auto* batch = stepframe::cli::add_batch_command(app, batch_options);

  stepframe::cli::CompareCommandOptions compare_options;
  auto* compare = stepframe::cli::add_compare_command(app, compare_options);

  stepframe::cli::SuggestCommandOptions suggest_options;
  auto* suggest = stepframe::cli::add_suggest_command(app, suggest_options);

  stepframe::cli::SectionsOptions sections_options;
  auto* sections = stepframe::cli::add_sections_command(app, sections_options);

  try {
    app.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    const int code = app.exit(e);
    return code == 0 ? 0 : static_cast<int>(stepframe::ExitStatus::bad_input);
  }
  spdlog::set_level(quiet ? spdlog::level::warn : verbose ? spdlog::level::debug : spdlog::level::info);

  // The STEP read of the commands that read a model themselves, as the analysing ones read it.
  const stepframe::geometry::StepReadOptions read = analysis_control().step_read_options();
  try {
    if (*run)
      return run_command(project, out, run_json, terminal && !quiet && !no_progress, run_timings, run_vtk,
                         run_result_details, run_check_details, run_baseline, run_max_increase, run_suggest);
    compare_options.progress = suggest_options.progress = terminal && !quiet;
    if (*compare) return stepframe::cli::compare_command(compare_options, analysis_control());
    if (*suggest) return stepframe::cli::suggest_command(suggest_options, analysis_control());
    if (*sections) return stepframe::cli::sections_command(sections_options);
    if (*batch) return stepframe::cli::batch_command(batch_options, terminal && !quiet);
    if (*init) return stepframe::cli::init_command(init_model, init_output, init_force, init_tolerance_mm, read);
    return inspect_command(model, tolerance_mm, inspect_json, read);
  } catch (const std::exception& e) {
    spdlog::critical("internal error: {} (please report it with the input files)", e.what());
    return internal_error;
  }
}
