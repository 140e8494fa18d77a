#pragma once
// What the benchmarks share: OCCT's own read of a STEP file (the floor no
// import can beat) and measuring work in a child process of its own, so each
// measurement starts from the same heap and its peak memory is its own.

#include <cstddef>
#include <filesystem>
#include <string>
#include <vector>

namespace stepframe::bench {

/// Wall and processor time [s] and peak resident memory [MB] of one measured run.
struct Measurement {
  double wall = 0;
  double cpu = 0;
  double peak_mb = 0;
  std::size_t count = 0;  ///< what the run counted (shapes, members, ...)
  int status = 0;         ///< exit status of a command
};

/// OCCT alone, as a pipeline does it: STEPCAFControl_Reader::ReadFile, Transfer
/// into an XDE document (names only, or with XDE's layer and colour modes
/// when `xde_attributes`), closing the document. Run in a child process.
Measurement occt_read_and_transfer(const std::filesystem::path& file, bool xde_attributes);

/// Runs `arguments` (a program and its arguments; stdout and stderr to
/// /dev/null) in a child process and measures it.
Measurement run_command(const std::vector<std::string>& arguments);

/// Total size of the files under `folder` [MB].
double folder_mb(const std::filesystem::path& folder);

}  // namespace stepframe::bench
