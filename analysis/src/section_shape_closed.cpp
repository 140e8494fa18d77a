// Hollow and solid shapes: RHS/SHS, CHS, flat and round bars, and sections
// given by their properties alone.

#include "section_outline.hpp"
#include "stepframe/analysis/section_shapes.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <utility>

namespace stepframe::analysis {
namespace {

constexpr double pi = std::numbers::pi;

// Points on a circle of radius r for drawing and stress points: 64 chords keep the
// extreme fibre within 0.12% of r in any direction.
constexpr int circle_points = 64;

SectionRing rect_ring(double h, double b, double r, int n, bool anticlockwise) {
  SectionRing ring = rounded_ring({{-b / 2, -h / 2, r}, {b / 2, -h / 2, r}, {b / 2, h / 2, r}, {-b / 2, h / 2, r}}, n);
  if (!anticlockwise) std::reverse(ring.begin(), ring.end());
  return ring;
}

}  // namespace

RhsDimensions rhs_dimensions(double h, double b, double t, HollowForming forming) {
  RhsDimensions d{h, b, t, 0, 0};
  if (forming == HollowForming::hot_finished) {
    // EN 10210-2 (hot finished), radii for calculation: ro = 1.5 t, ri = 1.0 t.
    d.r_out = 1.5 * t;
    d.r_in = 1.0 * t;
  } else {
    // EN 10219-2 (cold formed), radii for calculation: ro = 2 t for t <= 6 mm,
    // 2.5 t for 6 < t <= 10 mm, 3 t above; ri = ro - t.
    d.r_out = (t <= 6e-3 + 1e-9 ? 2.0 : t <= 10e-3 + 1e-9 ? 2.5 : 3.0) * t;
    d.r_in = d.r_out - t;
  }
  return d;
}

Section rhs_section(std::string designation, const RhsDimensions& d) {
  const double h = d.h, b = d.b, t = d.t, ro = d.r_out, ri = d.r_in;
  detail::require(h > 0 && b > 0 && t > 0 && 2 * t < std::min(h, b) && ro >= 0 && ri >= 0 && ro <= 0.5 * std::min(h, b) &&
                      ri <= 0.5 * std::min(h, b) - t,
                  "hollow section", designation, "dimensions must satisfy 0 < 2 t < min(h, b) and the corner radii fit");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::rhs;
  detail::ShapeOutline outline;
  outline.fine = {rect_ring(h, b, ro, detail::fine_segments, true),
                  rect_ring(h - 2 * t, b - 2 * t, ri, detail::fine_segments, false)};
  outline.display = {rect_ring(h, b, ro, detail::display_segments, true),
                     rect_ring(h - 2 * t, b - 2 * t, ri, detail::display_segments, false)};
  detail::fill_from_outline(s, outline);
  // St Venant torsion of a thin-walled closed section, EN 10219-2 Annex B
  // (Bredt with the wall's own share): It = t^3 hp / 3 + 2 K Ah, with the mean
  // radius Rc = (ro + ri) / 2, hp = 2 ((b - t) + (h - t)) - 2 Rc (4 - pi),
  // Ah = (b - t)(h - t) - Rc^2 (4 - pi), K = 2 Ah t / hp (from memory).
  const double Rc = 0.5 * (ro + ri);
  const double hp = 2 * ((b - t) + (h - t)) - 2 * Rc * (4 - pi);
  const double Ah = (b - t) * (h - t) - Rc * Rc * (4 - pi);
  const double K = 2 * Ah * t / hp;
  s.J = t * t * t * hp / 3 + 2 * K * Ah;
  s.Iw = 0;  // closed section: warping negligible (common practice)
  // EN 1993-1-1 6.2.6(3)(f): rolled RHS of uniform thickness, A h / (b + h) for a
  // shear force along the depth, A b / (b + h) along the width.
  s.Avz = s.A * h / (b + h);
  s.Avy = s.A * b / (b + h);
  // c = h - 3 t, b - 3 t (the flat width with the corner radius taken as 1.5 t; the
  // convention of hollow-section tables, common practice).
  s.parts = {{"web", PartKind::internal, h - 3 * t, t}, {"flange", PartKind::internal, b - 3 * t, t}};
  detail::set_t_max(s);
  return s;
}

Section chs_section(std::string designation, const ChsDimensions& dim) {
  const double D = dim.d, t = dim.t, di = D - 2 * t;
  detail::require(D > 0 && t > 0 && 2 * t <= D, "circular hollow section", designation,
                  "dimensions must satisfy 0 < 2 t <= d");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::chs;
  s.outline = {circle_ring(0, 0, D / 2, circle_points, true)};
  if (di > 0) s.outline.push_back(circle_ring(0, 0, di / 2, circle_points, false));
  s.stress_points = s.outline.front();
  // Annulus, elementary geometry: A = pi (D^2 - d^2) / 4, I = pi (D^4 - d^4) / 64,
  // Wel = 2 I / D, Wpl = (D^3 - d^3) / 6, It = 2 I (EN 10210-2 / 10219-2 Annex B).
  s.A = pi * (D * D - di * di) / 4;
  s.Iy = s.Iz = pi * (std::pow(D, 4) - std::pow(di, 4)) / 64;
  s.J = 2 * s.Iy;
  s.Wel_y = s.Wel_z = 2 * s.Iy / D;
  s.Wpl_y = s.Wpl_z = (D * D * D - di * di * di) / 6;
  s.depth = s.width = D;
  // EN 1993-1-1 6.2.6(3)(g): CHS and tubes of uniform thickness, Av = 2 A / pi.
  s.Avy = s.Avz = 2 * s.A / pi;
  s.parts = {{"wall", PartKind::tube, D, t}};
  detail::set_t_max(s);
  return s;
}

Section flat_section(std::string designation, const FlatDimensions& d) {
  const double t = d.t, b = d.b;
  detail::require(t > 0 && b > 0, "flat", designation, "thickness and width must be positive");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::flat;
  const SectionRing ring{{-t / 2, -b / 2}, {t / 2, -b / 2}, {t / 2, b / 2}, {-t / 2, b / 2}};
  detail::fill_from_outline(s, {{ring}, {ring}, {0, 0}, false});
  // Torsion of a rectangle, long side c and short side a (Roark, from memory):
  // K = c a^3 (1/3 - 0.21 (a/c)(1 - a^4 / (12 c^4))).
  const double c = std::max(t, b), a = std::min(t, b);
  s.J = c * a * a * a * (1.0 / 3 - 0.21 * (a / c) * (1 - std::pow(a / c, 4) / 12));
  // Warping of a thin rectangle, b^3 t^3 / 144 (thin-walled theory, from memory).
  s.Iw = std::pow(b * t, 3) / 144;
  s.Avy = s.Avz = s.A;  // solid rectangle: the whole area yields in shear (common practice)
  s.parts = {{"plate", PartKind::outstand, b, t}};
  s.t_max = std::min(t, b);
  return s;
}

Section round_bar_section(std::string designation, double D) {
  detail::require(D > 0, "round bar", designation, "the diameter must be positive");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::round_bar;
  s.outline = {circle_ring(0, 0, D / 2, circle_points, true)};
  s.stress_points = s.outline.front();
  // Solid circle, elementary geometry: A = pi D^2 / 4, I = pi D^4 / 64, J = pi D^4 / 32,
  // Wel = pi D^3 / 32, Wpl = D^3 / 6.
  s.A = pi * D * D / 4;
  s.Iy = s.Iz = pi * std::pow(D, 4) / 64;
  s.J = 2 * s.Iy;
  s.Wel_y = s.Wel_z = pi * D * D * D / 32;
  s.Wpl_y = s.Wpl_z = D * D * D / 6;
  s.depth = s.width = D;
  s.Avy = s.Avz = s.A;  // solid section (common practice)
  s.t_max = D;
  return s;
}

Section custom_section(std::string designation, double A, double Iy, double Iz, double J, double depth,
                       double width) {
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::custom;
  s.A = A, s.Iy = Iy, s.Iz = Iz, s.J = J, s.depth = depth, s.width = width;
  s.Wel_y = Iy / (0.5 * depth);
  s.Wel_z = Iz / (0.5 * width);
  const SectionRing box{{-width / 2, -depth / 2}, {width / 2, -depth / 2}, {width / 2, depth / 2}, {-width / 2, depth / 2}};
  s.outline = {box};
  s.stress_points = box;
  return s;
}

}  // namespace stepframe::analysis
