#include "stepframe/analysis/section.hpp"

#include "section_outline.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace stepframe::analysis {

std::string_view shape_name(SectionShape shape) {
  switch (shape) {
    case SectionShape::custom: return "custom";
    case SectionShape::rolled_i: return "rolled_i";
    case SectionShape::welded_i: return "welded_i";
    case SectionShape::channel: return "channel";
    case SectionShape::angle: return "angle";
    case SectionShape::tee: return "tee";
    case SectionShape::rhs: return "rhs";
    case SectionShape::chs: return "chs";
    case SectionShape::flat: return "flat";
    case SectionShape::round_bar: return "round_bar";
  }
  return "custom";
}

double Section::iy() const { return A > 0 ? std::sqrt(Iy / A) : 0.0; }
double Section::iz() const { return A > 0 ? std::sqrt(Iz / A) : 0.0; }

namespace detail {

void require(bool ok, const std::string& kind, const std::string& designation, const std::string& what) {
  if (!ok) throw std::invalid_argument(kind + " '" + designation + "': " + what);
}

void set_t_max(Section& s) {
  s.t_max = 0;
  for (const SectionPart& p : s.parts) s.t_max = std::max(s.t_max, p.t);
}

void fill_from_outline(Section& s, const ShapeOutline& shape) {
  const AreaIntegrals g = area_integrals(shape.fine);
  // Principal axes (Mohr's circle): the major axis is turned by
  // theta = atan2(-2 Iyz, Iyy - Izz) / 2 from y; symmetric shapes keep their axes.
  const double angle = shape.principal ? 0.5 * std::atan2(-2 * g.Iyz, g.Iyy - g.Izz) : 0.0;
  const auto fine = to_axes(shape.fine, g.cy, g.cz, angle);
  const auto display = to_axes(shape.display, g.cy, g.cz, angle);
  const AreaIntegrals p = area_integrals(fine);
  s.A = p.A;
  s.Iy = p.Iyy;
  s.Iz = p.Izz;
  s.principal_angle = angle;
  double y_lo = 0, y_hi = 0, z_lo = 0, z_hi = 0;
  for (const SectionRing& ring : fine)
    for (const SectionPoint& q : ring) {
      y_lo = std::min(y_lo, q.y), y_hi = std::max(y_hi, q.y);
      z_lo = std::min(z_lo, q.z), z_hi = std::max(z_hi, q.z);
    }
  s.depth = z_hi - z_lo;
  s.width = y_hi - y_lo;
  // Elastic moduli at the extreme fibre (EN 1993-1-1 6.2.5(2): Wel,min).
  s.Wel_y = s.Iy / std::max(z_hi, -z_lo);
  s.Wel_z = s.Iz / std::max(y_hi, -y_lo);
  s.Wpl_y = plastic_modulus(fine, 0.0, 1.0);  // neutral axis parallel to y
  s.Wpl_z = plastic_modulus(fine, 1.0, 0.0);
  const auto sc = to_axes({{shape.shear_centre}}, g.cy, g.cz, angle);
  // Round-off of a symmetric shape's offset (1e-15 m) is written as exactly zero.
  const double tiny = 1e-9 * std::max(s.depth, s.width);
  s.shear_centre_y = std::abs(sc[0][0].y) < tiny ? 0.0 : sc[0][0].y;
  s.shear_centre_z = std::abs(sc[0][0].z) < tiny ? 0.0 : sc[0][0].z;
  s.outline = display;
  s.stress_points = convex_hull(display.front());
}

}  // namespace detail
}  // namespace stepframe::analysis
