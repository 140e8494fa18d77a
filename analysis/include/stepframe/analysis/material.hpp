#pragma once
// Elastic material and strength used by the element and the checks.
//
// A standard grade carries its standard's strength table by thickness; the
// strength that applies to a member is that of its section's thickest plate
// (material_for_section). Every value is SI (Pa, kg/m^3, 1/K, m).

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::analysis {

struct Section;

/// Minimum strengths for nominal thicknesses up to t_max (one row of a
/// standard's table).
struct StrengthBand {
  double t_max = 0;  ///< upper end of the thickness range [m]
  double fy = 0;     ///< minimum yield strength [Pa]
  double fu = 0;     ///< minimum tensile strength [Pa]
};

struct Material {
  std::string name;    ///< e.g. "S355"
  double E = 0;        ///< Young's modulus [Pa]
  double G = 0;        ///< shear modulus [Pa]
  double fy = 0;       ///< yield strength [Pa]; for a standard grade: the thinnest band
  double density = 0;  ///< [kg/m^3]

  double fu = 0;                           ///< tensile strength [Pa] (0 when not given)
  double nu = 0.3;                         ///< Poisson's ratio
  double thermal_expansion = 12e-6;        ///< coefficient of linear thermal expansion [1/K]
  std::string standard{};                  ///< the standard the grade comes from, or empty
  std::vector<StrengthBand> bands{};       ///< strength by thickness, thinnest first; empty for custom materials
  std::vector<StrengthBand> round_bands{}; ///< when not empty: strengths for circular hollow sections (ASTM A500)
};

/// Standard steels, case-insensitive, quality suffixes (JR, J0, J2, K2, N, M,
/// NL, ML) dropped:
///  - EN 10025-2 S235, S275, S355, S460 (S460 from the 2019 edition);
///  - hollow-section grades S235H, S275H, S355H, S420H, S460H (EN 10210-1 hot
///    finished bands, which also cover EN 10219-1 cold formed up to 40 mm;
///    "S355J2H" and "S460NH" are accepted);
///  - ASTM A992, A36, A572 Gr. 50 ("A572-50", "A572 GR 50"), A500 Gr. B and
///    Gr. C ("A500B", "A500 GR C"; rectangular values, see material_for_section).
/// fy and fu are the values for the thinnest band. Nothing when unknown.
std::optional<Material> find_standard_material(std::string_view name);

/// Names find_standard_material knows, canonical spelling.
std::vector<std::string> standard_material_names();

/// The material with fy and fu of the band holding nominal thickness t [m].
/// Unchanged for a material without bands. Beyond the last band: the last band's values.
Material material_for_thickness(const Material& material, double t);

/// The material a member of this section uses in the checks: fy and fu for
/// the section's thickest plate (Section::t_max; EN 1993-1-1 3.2.1 takes the
/// nominal values from the product standard for that thickness); for ASTM
/// A500 the round-HSS strengths when the section is circular.
Material material_for_section(const Material& material, const Section& section);

}  // namespace stepframe::analysis
