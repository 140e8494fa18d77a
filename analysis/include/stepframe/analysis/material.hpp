#pragma once
// Elastic material and strength used by the element and the checks.

#include <optional>
#include <string>
#include <string_view>

namespace stepframe::analysis {

struct Material {
  std::string name;    ///< e.g. "S355"
  double E = 0;        ///< Young's modulus [Pa]
  double G = 0;        ///< shear modulus [Pa]
  double fy = 0;       ///< yield strength [Pa]
  double density = 0;  ///< [kg/m^3]
};

/// Standard steels: S235, S275, S355 (EN 10025-2, nominal thickness <= 16 mm),
/// A992 and A36 (ASTM). Case-insensitive; nothing when unknown.
std::optional<Material> find_standard_material(std::string_view name);

}  // namespace stepframe::analysis
