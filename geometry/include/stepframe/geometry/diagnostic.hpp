#pragma once
// A finding about the input, carried from the stage that found it to every output.

#include <Eigen/Core>

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::geometry {

enum class Severity { info, warning, error };

std::string_view to_string(Severity severity);

/// One finding. `code` is a stable identifier (e.g. "zero-length-edge") that
/// automation may switch on; `message` is for people.
struct Diagnostic {
  Severity severity = Severity::info;
  std::string code;
  std::string message;
  std::vector<std::string> entities;   ///< STEP entity ids such as "#123"
  std::optional<Eigen::Vector3d> at;   ///< location in metres, when one applies
};

/// True when any diagnostic is an error.
bool has_errors(const std::vector<Diagnostic>& diagnostics);

}  // namespace stepframe::geometry
