#pragma once
// Units at the edge: quantities written in project files ("10 kN/m", "200 GPa")
// become SI values here and nowhere else.

#include <optional>
#include <string>
#include <string_view>

namespace stepframe {

/// Physical dimension as exponents of length, force and mass.
struct Dimension {
  int length = 0;
  int force = 0;
  int mass = 0;
  friend bool operator==(const Dimension&, const Dimension&) = default;
};

namespace dimension {
inline constexpr Dimension length{1, 0, 0};
inline constexpr Dimension area{2, 0, 0};
inline constexpr Dimension section_modulus{3, 0, 0};
inline constexpr Dimension second_moment{4, 0, 0};
inline constexpr Dimension force{0, 1, 0};
inline constexpr Dimension moment{1, 1, 0};
inline constexpr Dimension line_load{-1, 1, 0};
inline constexpr Dimension stress{-2, 1, 0};
inline constexpr Dimension density{-3, 0, 1};
inline constexpr Dimension mass{0, 0, 1};
inline constexpr Dimension none{0, 0, 0};
}  // namespace dimension

/// Human name of a dimension ("stress", "force per length", ...).
std::string describe(Dimension d);

/// A unit: its size in SI and its dimension.
struct Unit {
  double si = 1;  ///< value of one of this unit in SI (m, N, kg and their products)
  Dimension dimension;
};

/// Parses a unit expression: products and quotients of known units with
/// optional integer powers, e.g. "kN/m", "N/mm2", "kg/m^3", "kN*m", "MPa".
/// Returns nothing when a part is unknown.
std::optional<Unit> parse_unit(std::string_view text);

/// A number with its unit, parsed from "3.5 m" or "7850 kg/m3".
struct Quantity {
  double value = 0;  ///< in SI
  Dimension dimension;
};

/// Parses "number [unit]"; a bare number has dimension none and value as written.
/// Returns nothing when the text is not a number optionally followed by a known unit.
std::optional<Quantity> parse_quantity(std::string_view text);

/// The units in which a project file's bare numbers are written.
struct UnitSystem {
  Unit length{1e-3, dimension::length};  ///< default mm
  Unit force{1e3, dimension::force};     ///< default kN
  std::optional<Unit> stress;            ///< default force / length^2
  std::optional<Unit> line_load;         ///< default force / length
  /// SI value of one bare-number unit of the given dimension. Density has no
  /// project unit: bare densities are kg/m^3.
  double si_per_bare(Dimension d) const;
  /// How a bare number of that dimension is read, e.g. "kN/mm".
  std::string describe_bare(Dimension d) const;
  std::string length_name = "mm", force_name = "kN", stress_name, line_load_name;
};

}  // namespace stepframe
