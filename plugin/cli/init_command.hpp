#pragma once
// `stepframe init MODEL.stp`: a starter project file from what the STEP file holds.

#include "stepframe/inspect.hpp"

#include <filesystem>
#include <string>

namespace stepframe::cli {

/// The starter project text for `inspection`, to be saved as `project_file`.
/// It runs as written: units following the model's (US customary for a model
/// in feet or inches), one material for every member (marked CHECK), a rule
/// for each layer, product and name that holds a designation, placeholder
/// sections (marked CHECK) for members without one, the lowest nodes as
/// pinned supports, a self-weight case, an ultimate and a serviceability
/// combination, and stress, EN 1993 and deflection checks. Commented stubs
/// (rules for the other attribute values, loads, more checks) become valid
/// YAML when the '#' at the start of their lines is deleted.
std::string starter_project(const Inspection& inspection, const std::filesystem::path& project_file);

/// Writes the starter project for `model` to `project_file` (default: the
/// model's name with .yaml, beside it). Refuses to overwrite an existing file
/// unless `force`; reads the model the way `read` says. Returns the exit status (0, or 2 for bad input).
int init_command(const std::filesystem::path& model, std::filesystem::path project_file, bool force,
                 double tolerance_mm, const geometry::StepReadOptions& read);

}  // namespace stepframe::cli
