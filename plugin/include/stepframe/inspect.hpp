#pragma once
// `stepframe inspect`: what a STEP file holds, before any project exists or
// through one (then also which members its rules leave without properties).

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "stepframe/model_builder.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <map>
#include <optional>
#include <string>
#include <vector>

namespace stepframe {

struct Inspection {
  std::filesystem::path project;  ///< the project file, when inspected through one; else empty
  std::filesystem::path file;     ///< the STEP file
  std::string length_unit;  ///< as the file declares it
  double metres_per_unit = 1e-3;
  double merge_tolerance = 1e-3;  ///< [m]
  geometry::Wireframe wireframe;
  /// attribute kind ("name", "layer", "product", "colour") -> value -> member count
  std::map<std::string, std::map<std::string, std::size_t>> attribute_counts;
  /// With a project: the members its rules and their attributes leave without
  /// a section or a material (`run` refuses them). Empty without a project.
  std::vector<UnassignedMember> unassigned;
  /// With a project: each member's section and material and what set them (one per wireframe member).
  std::vector<MemberProperties> properties;
  /// With a project: the nodes each support selects (one per project support) and its fixity.
  std::vector<SupportNodes> supports;
  std::vector<SupportSpec> support_specs;
  /// With a project: one line per rule, load, settlement or support that selects nothing, naming it
  /// and what to do.
  std::vector<std::string> warnings;
};

/// Reads the file (the way `read` says: geometry::StepReadOptions) and merges its nodes. Throws
/// geometry::StepReadError.
Inspection inspect_step(const std::filesystem::path& file, double merge_tolerance = 1e-3,
                        const geometry::StepReadOptions& read = {});

/// Reads a project file and its STEP file, builds the wireframe with the
/// project's options (`merge_tolerance` overrides the project's when given),
/// gives each member its section and material, finds the support nodes, and
/// notes the rules, loads and supports that select nothing. Throws
/// InputError for a bad project file or a rule naming an unknown section or
/// material, geometry::StepReadError for a bad STEP file.
Inspection inspect_project(const std::filesystem::path& project_file,
                           std::optional<double> merge_tolerance = std::nullopt,
                           const geometry::StepReadOptions& read = {});

/// True for a path that names a project file (.yaml or .yml) rather than a STEP file.
bool is_project_file(const std::filesystem::path& path);

/// {"file", "length_unit", "metres_per_unit", "bounding_box", "node_count",
///  "member_count", "attributes", "members", "diagnostics"}, and with a
/// project also "project", "unassigned_members" ([{"id", "source",
/// "missing": ["section", "material"]}]), "supports" ([{"where", "nodes",
/// "fixed", "problem"}]) and "warnings" (strings); each of "members" then also
/// has "section", "section_from", "material" and "material_from" (null when
/// none is found). "members" and "diagnostics" have the shapes of results.json.
nlohmann::json inspection_json(const Inspection& inspection);

/// The same for people: a few readable tables.
std::string inspection_text(const Inspection& inspection);

}  // namespace stepframe
