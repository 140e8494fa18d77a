#pragma once
// `stepframe sections [QUERY] [--json]`: the built-in section catalogue on the
// command line. Data on stdout, messages on stderr.

#include <CLI/CLI.hpp>

#include <string>

namespace stepframe::cli {

struct SectionsOptions {
  std::string query;  ///< a designation, a family ("IPE") or a prefix ("HEB2"); empty lists everything
  bool json = false;  ///< print JSON in SI units instead of a table
};

/// Registers the `sections` subcommand on `app`, storing its options in `options`.
CLI::App* add_sections_command(CLI::App& app, SectionsOptions& options);

/// Runs it: one section's full properties when the query names a section,
/// else the matching catalogue rows. Returns the exit status (0, or 2 when
/// nothing matches).
int sections_command(const SectionsOptions& options);

}  // namespace stepframe::cli
