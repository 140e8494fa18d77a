#pragma once
// Reading a project file (YAML, format stepframe project v1; README "Project file").

#include "stepframe/project.hpp"

#include <filesystem>

namespace stepframe {

/// Reads and validates a project file. Bare numbers are read in the file's
/// `units`; strings may carry their own unit ("10 kN/m"). Throws InputError
/// whose message names the file, the line and the key, and what to do.
Project read_project(const std::filesystem::path& file);

}  // namespace stepframe
