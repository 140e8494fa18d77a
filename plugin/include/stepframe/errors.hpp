#pragma once
// The failures a run reports to its caller, each with its exit status.

#include <stdexcept>
#include <string>

namespace stepframe {

/// Exit status of a run (CLI and C ABI alike).
enum class ExitStatus : int {
  pass = 0,          ///< every check passes
  check_failed = 1,  ///< the analysis ran and at least one check fails
  bad_input = 2,     ///< the project file, the STEP file or the model is unusable
  unstable = 3,      ///< the frame is a mechanism
  cancelled = 5,     ///< the caller cancelled the run (library and C ABI only; 4 is the CLI's internal error)
};

/// Input that cannot be used; what() names the file, the line or STEP entity,
/// and what to do.
class InputError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

}  // namespace stepframe
