#pragma once
// Cross-section properties used by the frame element and the stress recovery.
//
// Section axes: y is the strong (major) axis, z the weak one; the section's
// depth runs along z and its width along y (EN 1993-1-1 1.7 axis convention).

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::analysis {

struct Section {
  std::string designation;  ///< e.g. "IPE300", or the project's own name
  double A = 0;             ///< area [m^2]
  double Iy = 0;            ///< second moment about y (strong axis) [m^4]
  double Iz = 0;            ///< second moment about z (weak axis) [m^4]
  double J = 0;             ///< St Venant torsion constant [m^4]
  double depth = 0;         ///< extent along local z [m]
  double width = 0;         ///< extent along local y [m]

  /// Elastic section modulus about y: Iy / (depth / 2) [m^3].
  double Wy() const { return Iy / (0.5 * depth); }
  /// Elastic section modulus about z: Iz / (width / 2) [m^3].
  double Wz() const { return Iz / (0.5 * width); }
};

/// Rolled I or H section dimensions (EN 10365 notation) [m].
struct RolledIDimensions {
  double h = 0, b = 0, tw = 0, tf = 0, r = 0;
};

/// Properties of a rolled I/H section with root radius, computed from its
/// dimensions (formulas with their sources in the implementation).
Section rolled_i_section(std::string designation, const RolledIDimensions& d);

/// Canonical spelling of a designation: upper case; spaces, hyphens,
/// underscores and non-decimal dots removed; a European wide-flange series
/// letter written after the size moved before it ("ipe-300" -> "IPE300",
/// "HE 200 B" -> "HEB200", "HE200B" -> "HEB200").
std::string normalize_designation(std::string_view designation);

/// Looks a designation up in the built-in catalogue (data/sections/*.csv,
/// compiled in). Accepts the spellings people type ("IPE 300", "HEB200",
/// "HE 200 B"). Returns nothing when unknown.
std::optional<Section> find_catalogue_section(std::string_view designation);

/// Every designation in the built-in catalogue, canonical spelling.
std::vector<std::string> catalogue_designations();

}  // namespace stepframe::analysis
