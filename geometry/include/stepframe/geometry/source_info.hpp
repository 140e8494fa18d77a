#pragma once
// Where a member came from in the CAD file: the attributes that rules match on.

#include <string>
#include <vector>

namespace stepframe::geometry {

/// CAD attributes of one edge, found wherever the STEP file attaches them
/// (the curve itself, its curve set, the representation or the product).
struct SourceInfo {
  std::string entity;               ///< STEP entity id of the edge or curve, e.g. "#123"
  std::string name;                 ///< item name (empty when the file gives none)
  std::vector<std::string> layers;  ///< presentation layer names
  std::string product;              ///< product (part) name
  std::string colour;               ///< "#rrggbb" when the file styles the curve, else empty
  /// Where the part sits in the assembly: the top product, then each placed
  /// instance down to the part, joined by " / " (e.g. "PLANT / bay 2 / brace 1").
  /// Empty for a part that is not inside an assembly.
  std::string assembly_path;
};

}  // namespace stepframe::geometry
