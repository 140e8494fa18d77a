#pragma once
// stepframe's colour scales, shared by every picture, the report and the
// browser view, so that a colour means the same thing everywhere:
//  - utilisation (0 to 1, the same in every picture): ivory through sand,
//    terracotta and brick to a deep plum, lightness falling steadily (CIELAB
//    L* from 95 to 27, so the scale reads in greyscale and for colour-blind
//    readers), and one flag colour, a clear blue well away from every scale
//    colour, for "above limit" (utilisation above 1);
//  - signed quantities (N, My, Mz: -1 to 1 of the largest magnitude shown):
//    deep teal (negative: compression for N) through a light grey (zero) to
//    a deep amber-brown (positive: tension for N), lightness falling equally
//    on both sides of zero.
// The scales are defined by anchor colours in CIELAB (CIE 1976 L*a*b*, D65
// white) and interpolated linearly there, then converted to 8-bit sRGB
// (IEC 61966-2-1).

#include <array>
#include <cstdint>
#include <string>

namespace stepframe::viz {

using Rgb = std::array<std::uint8_t, 3>;

/// Colour of a utilisation: 0 to 1 along the scale (below 0 as 0), above 1
/// the flag colour above_limit_colour. NaN gives the flag colour too.
Rgb utilisation_colour(double utilisation);

/// The flag colour for "above limit".
Rgb above_limit_colour();

/// A member that no check covers: a dark neutral grey, outside both scales'
/// hues (and the undeformed frame behind a deformed one: a pale grey).
Rgb not_checked_colour();
Rgb undeformed_colour();

/// Colour of a signed value as a fraction of the largest magnitude shown,
/// -1 to 1 (clamped).
Rgb signed_colour(double fraction);

/// CIELAB (L*, a*, b*; D65) of an 8-bit sRGB colour.
std::array<double, 3> cielab(const Rgb& colour);

/// "#rrggbb".
std::string hex(const Rgb& colour);

}  // namespace stepframe::viz
