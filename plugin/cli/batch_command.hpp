#pragma once
// `stepframe batch PROJECTS... --out DIR [--jobs N] [--timeout S] [--force]`:
// many projects, each run as `stepframe run` in a process of its own; a
// summary table on stdout, batch.json and batch.xml (JUnit) in DIR.

#include <CLI/CLI.hpp>

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

namespace stepframe::cli {

struct BatchCommandOptions {
  std::vector<std::string> inputs;  ///< project files, glob patterns or manifests
  std::filesystem::path out;
  unsigned jobs = 2;
  std::optional<double> timeout;    ///< [s] per project
  bool force = false;
};

/// Registers the `batch` subcommand on `app`, storing its options in `options`.
CLI::App* add_batch_command(CLI::App& app, BatchCommandOptions& options);

/// Runs it; returns the batch's exit status: the worst of the projects'
/// (0 all pass, 1 a check fails, 2 bad input, 3 unstable, 4 an internal
/// error, a crash or a timeout), or 2 when the inputs name no project.
int batch_command(const BatchCommandOptions& options, bool show_progress);

}  // namespace stepframe::cli
