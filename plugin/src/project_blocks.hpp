#pragma once
// Readers of the project file's top-level blocks that live in files of their
// own (project_<block>.cpp); project_reader.cpp calls them.

#include "project_yaml.hpp"

namespace stepframe::detail {

/// The `outputs:` block (README "Outputs").
OutputsSpec read_outputs(const Reader& r, const YAML::Node& node);

}  // namespace stepframe::detail
