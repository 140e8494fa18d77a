#pragma once
// Private: a shape named by its kind and dimensions, as a catalogue row or a
// designation that spells out its dimensions; built into a Section on demand.

#include "stepframe/analysis/section.hpp"

#include <array>
#include <optional>
#include <string>
#include <string_view>

namespace stepframe::analysis::detail {

/// rhs_hot / rhs_cold: v = {h, b, t}, radii by the standard's rule; rhs_radii: v = {h, b, t, r_out, r_in}.
enum class SpecKind { rolled_i, channel, angle, rhs_hot, rhs_cold, rhs_radii, chs_hot, chs_cold, flat, round_bar };

struct ShapeSpec {
  std::string designation;     ///< canonical spelling
  std::string family;          ///< "IPE", "SHS", ...
  std::string standard;        ///< standard of the shape and its dimensions
  std::string alias;           ///< another accepted spelling, or empty
  SpecKind kind = SpecKind::rolled_i;
  std::array<double, 8> v{};   ///< dimensions [m], in the order of the shape's struct
};

/// The Section of a spec (section_shapes.hpp functions), with family and standard set.
Section build_section(const ShapeSpec& spec);

/// A designation that spells out a shape's dimensions ("SHS100X100X5",
/// "CHS219.1X8", "PL20X300", "L100X100X10", "HSS6X6X3/8", "HSS6.625X0.280",
/// "RD20"), already normalized. Nothing when it is not one of these forms or
/// the numbers are out of any sensible range.
std::optional<ShapeSpec> parse_dimension_designation(const std::string& normalized);

/// A metric W designation ("W310X38.7") split into nominal depth [mm] and mass [kg/m].
std::optional<std::pair<double, double>> parse_metric_w(const std::string& normalized);

/// Number as people write it in a designation: "8", "6.3", "219.1".
std::string format_number(double value);

}  // namespace stepframe::analysis::detail
