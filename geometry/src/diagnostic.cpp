#include "stepframe/geometry/diagnostic.hpp"

#include <algorithm>

namespace stepframe::geometry {

std::string_view to_string(Severity severity) {
  switch (severity) {
    case Severity::info: return "info";
    case Severity::warning: return "warning";
    case Severity::error: return "error";
  }
  return "info";
}

bool has_errors(const std::vector<Diagnostic>& diagnostics) {
  return std::any_of(diagnostics.begin(), diagnostics.end(),
                     [](const Diagnostic& d) { return d.severity == Severity::error; });
}

}  // namespace stepframe::geometry
