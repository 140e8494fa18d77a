#pragma once
// `stepframe inspect`: what a STEP file holds, before any project exists.

#include "stepframe/geometry/wireframe.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <map>
#include <string>

namespace stepframe {

struct Inspection {
  std::filesystem::path file;
  std::string length_unit;  ///< as the file declares it
  double metres_per_unit = 1e-3;
  double merge_tolerance = 1e-3;  ///< [m]
  geometry::Wireframe wireframe;
  /// attribute kind ("name", "layer", "product", "colour") -> value -> member count
  std::map<std::string, std::map<std::string, std::size_t>> attribute_counts;
};

/// Reads the file and merges its nodes. Throws geometry::StepReadError.
Inspection inspect_step(const std::filesystem::path& file, double merge_tolerance = 1e-3);

/// {"file", "length_unit", "metres_per_unit", "bounding_box", "node_count",
///  "member_count", "attributes", "members", "diagnostics"}: "members" and
/// "diagnostics" have the shapes of results.json.
nlohmann::json inspection_json(const Inspection& inspection);

/// The same for people: a few readable tables.
std::string inspection_text(const Inspection& inspection);

}  // namespace stepframe
