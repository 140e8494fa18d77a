#pragma once
// Private: the step every shape shares once it has drawn its outline.

#include "stepframe/analysis/section.hpp"
#include "stepframe/analysis/section_geometry.hpp"

#include <string>
#include <vector>

namespace stepframe::analysis::detail {

/// Chords per quarter circle: fine for the properties, coarser for drawing.
inline constexpr int fine_segments = 32;
inline constexpr int display_segments = 8;

/// Outline rings of one shape in the shape's own drawing axes (any origin).
struct ShapeOutline {
  std::vector<SectionRing> fine;     ///< for the integrals
  std::vector<SectionRing> display;  ///< for drawing and stress points
  SectionPoint shear_centre;         ///< in the same axes
  bool principal = false;            ///< turn to principal axes (unsymmetric shapes)
};

/// Fills A, Iy, Iz, principal_angle, Wel_y, Wel_z, Wpl_y, Wpl_z, depth, width,
/// the shear centre offset, stress points and outline of `s` from the outline.
void fill_from_outline(Section& s, const ShapeOutline& outline);

/// Sets t_max from the parts.
void set_t_max(Section& s);

/// Throws std::invalid_argument "<kind> '<designation>': <what>" unless ok.
void require(bool ok, const std::string& kind, const std::string& designation, const std::string& what);

}  // namespace stepframe::analysis::detail
