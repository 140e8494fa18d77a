#pragma once
// Reading a project file (YAML, format stepframe project v1; README "Project file").

#include "stepframe/project.hpp"

#include <filesystem>
#include <string>
#include <string_view>

namespace stepframe {

/// Reads and validates a project file. Bare numbers are read in the file's
/// `units`; strings may carry their own unit ("10 kN/m"). Throws InputError
/// whose message names the file, the line and the key, and what to do.
Project read_project(const std::filesystem::path& file);

/// The same for project text held in memory (YAML, or JSON, which is YAML
/// too): a relative `model:` is resolved against `base_dir`, and messages name
/// `display_name` as the file.
Project read_project_text(std::string_view yaml, const std::filesystem::path& base_dir,
                          const std::string& display_name = "<project text>");

}  // namespace stepframe
