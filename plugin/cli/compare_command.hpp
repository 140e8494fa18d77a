#pragma once
// `stepframe compare OLD NEW [--out DIR] [--max-increase U] [--tolerance MM] [--json]`
// and the comparison `run --baseline DIR` makes after its run.

#include "stepframe/compare.hpp"

#include <CLI/CLI.hpp>

#include <filesystem>

namespace stepframe::cli {

struct CompareCommandOptions {
  std::filesystem::path old_side, new_side, out;
  CompareOptions compare;
  double tolerance_mm = 10;
  double move_limit_mm = 1000;
  bool json = false;
  bool progress = false;  ///< a progress line on stderr while a project file is analysed (a terminal's)
};

/// Registers the `compare` subcommand on `app`, storing its options in `options`.
CLI::App* add_compare_command(CLI::App& app, CompareCommandOptions& options);

/// Runs it: 0 nothing got worse beyond the threshold, 1 a member newly fails or a utilisation rose past
/// --max-increase, 2 bad input (nothing written). A side given as a project file is analysed with `control`.
int compare_command(CompareCommandOptions options, const RunControl& control = {});

/// The options `run --baseline` adds to `run` (the threshold).
void add_baseline_options(CLI::App& run, std::filesystem::path& baseline, double& max_increase);

/// Compares a run's results with its baseline (already read) and writes DIR/compare/; prints the summary
/// when `print`. Returns the gate's status (0 or 1), 2 when the comparison cannot be written.
int compare_with_baseline(const Revision& baseline, const Revision& run, const std::filesystem::path& run_out,
                          double max_increase, bool print);

}  // namespace stepframe::cli
