#pragma once
// Length units that STEP files declare, and their size in metres.

#include <optional>
#include <string>
#include <string_view>

namespace stepframe::geometry {

/// Size of one `unit` in metres, for the short names stepframe uses
/// ("mm", "cm", "m", "km", "um", "inch", "ft", "mile"); nullopt for anything else.
/// The inch is exactly 0.0254 m and the foot 0.3048 m (international yard and
/// pound agreement, 1959); the mile is 1609.344 m.
std::optional<double> metres_per_unit(std::string_view unit);

/// Short name for a unit name as spelt in a STEP file or by OCCT, e.g.
/// "MILLIMETRE" or ".MILLI. .METRE." -> "mm", "INCH" -> "inch", "metre" -> "m".
/// Returns nullopt when the name is not a recognised length unit.
std::optional<std::string> short_length_unit_name(std::string_view step_name);

}  // namespace stepframe::geometry
