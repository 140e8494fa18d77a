#pragma once
// `stepframe init MODEL.stp`: a starter project file from what the STEP file holds.

#include "stepframe/inspect.hpp"

#include <filesystem>
#include <string>

namespace stepframe::cli {

/// The starter project text for `inspection`, to be saved as `project_file`.
/// It loads with read_project as written: one self-weight case, the lowest
/// nodes suggested as pinned supports, and every layer, product and name the
/// model holds as a commented rule to fill in.
std::string starter_project(const Inspection& inspection, const std::filesystem::path& project_file);

/// Writes the starter project for `model` to `project_file` (default: the
/// model's name with .yaml, beside it). Refuses to overwrite an existing file
/// unless `force`. Returns the exit status (0, or 2 for bad input).
int init_command(const std::filesystem::path& model, std::filesystem::path project_file, bool force,
                 double tolerance_mm);

}  // namespace stepframe::cli
