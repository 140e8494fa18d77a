#pragma once
// `stepframe suggest PROJECT [--out DIR] [--lighten-below U] [--max-rounds N]`
// and the suggestion `run --suggest` makes after its run.

#include "stepframe/run.hpp"
#include "stepframe/section_upsizing.hpp"

#include <CLI/CLI.hpp>

#include <filesystem>

namespace stepframe::cli {

struct SuggestCommandOptions {
  std::filesystem::path project, out;
  SuggestOptions suggest;
  double lighten_below = 0;  ///< 0: the project's suggest.lighten_below, if any
  bool progress = false;     ///< a progress line on stderr while analysing (a terminal's)
};

/// Registers the `suggest` subcommand on `app`.
CLI::App* add_suggest_command(CLI::App& app, SuggestCommandOptions& options);

/// Runs it: 0 with the suggested sections every check passes, 1 some still fail, 2 bad input, 3 unstable.
/// Every analysis (and the model's read) runs with `control`.
int suggest_command(SuggestCommandOptions options, const RunControl& control = {});

/// After `run --suggest`: suggests sections from the run's analysis and writes <out>/suggest/. Returns
/// 0 when written, 2 or 3 when the suggestion could not be made (the message is logged). `print`: its
/// summary on stdout. The model is read again, and analysed, with `control`.
int suggest_after_run(const Analysis& analysis, const std::filesystem::path& run_out, bool print,
                      const RunControl& control = {});

}  // namespace stepframe::cli
