#include "compare_command.hpp"

#include "progress_display.hpp"

#include "stepframe/errors.hpp"
#include "stepframe/run.hpp"

#include <spdlog/spdlog.h>

#include <iostream>

namespace stepframe::cli {

CLI::App* add_compare_command(CLI::App& app, CompareCommandOptions& options) {
  auto* compare = app.add_subcommand(
      "compare",
      "Compare two revisions: members added, removed, moved, split, merged, re-sectioned, re-materialled, re-oriented "
      "or re-released; supports, loads and mass; every member's utilisation before and after. Each side is a results "
      "folder, a results.json or a project file (analysed on the spot). Writes compare.json, compare.html and "
      "compare.vtu into --out (default: <NEW>-compare beside NEW) and a summary on stdout. Exit status: 0 nothing got "
      "worse beyond the threshold, 1 a member newly fails or a utilisation rose more than --max-increase, 2 bad input");
  compare->add_option("OLD", options.old_side, "The checked revision: results folder, results.json or project file")->required();
  compare->add_option("NEW", options.new_side, "The new revision: results folder, results.json or project file")->required();
  compare->add_option("--out", options.out, "Output folder (default: <NEW>-compare beside NEW)");
  compare->add_option("--max-increase", options.compare.max_increase,
                      "Largest rise of a member's utilisation (per check) that passes, as a ratio")
      ->capture_default_str()
      ->check(CLI::NonNegativeNumber);
  compare->add_option("--tolerance", options.tolerance_mm, "End points this close are the same point, in mm")
      ->capture_default_str()
      ->check(CLI::PositiveNumber);
  compare->add_option("--move-limit", options.move_limit_mm,
                      "The farthest a member's end may move and still count as the same member, in mm")
      ->capture_default_str()
      ->check(CLI::NonNegativeNumber);
  compare->add_flag("--json", options.json, "Print compare.json on stdout instead of the summary");
  return compare;
}

int compare_command(CompareCommandOptions options, const RunControl& control) {
  options.compare.tolerance = options.tolerance_mm * 1e-3;
  options.compare.move_limit = options.move_limit_mm * 1e-3;
  ProgressDisplay display(options.progress);
  RunControl analysing = control;
  analysing.progress = display.callback();
  try {
    const Revision old_side = read_revision(options.old_side, analysing);
    const Revision new_side = read_revision(options.new_side, analysing);
    display.clear();
    const Comparison comparison = compare_revisions(old_side, new_side, options.compare);
    std::filesystem::path out = options.out;
    if (out.empty()) {
      const auto side = std::filesystem::absolute(options.new_side).lexically_normal();
      const auto name = side.has_filename() ? side : side.parent_path();
      out = name.parent_path() / (name.stem().string() + "-compare");
    }
    write_comparison(comparison, out);
    if (options.json) std::cout << comparison_json(comparison).dump(1) << '\n';
    else std::cout << comparison_text(comparison) << "\ncomparison: " << out.string() << "\n\n" << caution << "\n";
    return static_cast<int>(comparison.status());
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  }
}

void add_baseline_options(CLI::App& run, std::filesystem::path& baseline, double& max_increase) {
  run.add_option("--baseline", baseline,
                 "Compare with an earlier revision (results folder, results.json or project file) and write "
                 "<out>/compare/ (compare.json, compare.html, compare.vtu); the exit status is 1 also when the "
                 "comparison finds something worse");
  run.add_option("--max-increase", max_increase, "With --baseline: the largest rise of a utilisation that passes")
      ->capture_default_str()
      ->check(CLI::NonNegativeNumber);
}

int compare_with_baseline(const Revision& baseline, const Revision& run, const std::filesystem::path& run_out,
                          double max_increase, bool print) {
  try {
    CompareOptions options;
    options.max_increase = max_increase;
    const Comparison comparison = compare_revisions(baseline, run, options);
    write_comparison(comparison, run_out / "compare");
    if (print)
      std::cout << "\n" << comparison_text(comparison) << "comparison: " << (run_out / "compare").string() << "\n";
    return static_cast<int>(comparison.status());
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  }
}

}  // namespace stepframe::cli
