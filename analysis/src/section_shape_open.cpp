// Channels and angles: open shapes with one or no axis of symmetry.

#include "section_outline.hpp"
#include "stepframe/analysis/section_shapes.hpp"
#include "stepframe/analysis/thin_walled.hpp"

#include <algorithm>
#include <cmath>
#include <utility>

namespace stepframe::analysis {
namespace {

// St Venant torsion contribution of an L junction (two plates t1, t2 meeting at
// a corner with inner radius r) after El Darwish & Johnston, "Torsion of
// structural shapes", J. Struct. Div. ASCE 91 (1965), as given in AISC Design
// Guide 9 for channels and angles: alpha D^4 with alpha = (t/t')(0.07 + 0.076 r/t'),
// t the thinner and t' the thicker plate, and the inscribed circle diameter
// D = 2 ((3 r + t1 + t2) - sqrt(2 (2 r + t1)(2 r + t2))). From memory.
double l_junction(double t1, double t2, double r) {
  const double thin = std::min(t1, t2), thick = std::max(t1, t2);
  const double alpha = (thin / thick) * (0.07 + 0.076 * r / thick);
  const double D = 2 * ((3 * r + t1 + t2) - std::sqrt(2 * (2 * r + t1) * (2 * r + t2)));
  return alpha * std::pow(D, 4);
}

// Thin rectangle c x t: c t^3 / 3 - 0.105 t^4 per free end (Roark, thin rectangle in torsion).
double plate_torsion(double c, double t, int free_ends) { return c * t * t * t / 3 - 0.105 * free_ends * std::pow(t, 4); }

}  // namespace

Section channel_section(std::string designation, const ChannelDimensions& d) {
  const double h = d.h, b = d.b, tw = d.tw, tf = d.tf, r = d.r, r2 = d.r_toe, slope = d.flange_slope;
  detail::require(slope == 0 || (d.tf_at > tw && d.tf_at < b), "channel", designation,
                  "a tapered flange needs tf_at, where tf is measured, between the web and the toe");
  // Flange thickness at y from the back of the web: the inner face falls by
  // `slope` per unit length towards the toe (elementary geometry).
  const auto flange_t = [&](double y) { return tf + slope * (d.tf_at - y); };
  const double t_root = flange_t(tw), t_toe = flange_t(b);
  const double z_root = -h / 2 + t_root, z_toe = -h / 2 + t_toe;
  detail::require(h > 0 && b > tw && tw > 0 && tf > 0 && r >= 0 && r2 >= 0 && slope >= 0 && slope < 0.2 &&
                      t_toe > 0 && z_root + r < 0,
                  "channel", designation, "dimensions must satisfy b > tw > 0, tf > 0, r >= 0 and 2 (tf + r) < h");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::channel;
  detail::ShapeOutline outline;
  for (const int n : {detail::fine_segments, detail::display_segments}) {
    const SectionRing ring = rounded_ring({{0, -h / 2, 0}, {b, -h / 2, 0}, {b, z_toe, r2}, {tw, z_root, r},
                                           {tw, -z_root, r}, {b, -z_toe, r2}, {b, h / 2, 0}, {0, h / 2, 0}},
                                          n);
    (n == detail::fine_segments ? outline.fine : outline.display).push_back(ring);
  }
  // Shear centre and warping constant by thin-walled theory on the walls'
  // mid-thickness lines (thin_walled.hpp): the flanges run from the web's centre
  // line to the toes, tapering and inclined as the inner faces are; the web joins
  // the flanges' mid lines. For parallel flanges this is the closed form of
  // Timoshenko & Gere (e = 3 b'^2 tf / (6 b' tf + h' tw), b' = b - tw/2, h' = h - tf).
  const auto mid = [&](double y) { return SectionPoint{y, h / 2 - flange_t(y) / 2}; };
  const SectionPoint toe = mid(b), junction = mid(tw / 2);
  const ThinWalledWarping warping =
      thin_walled_warping({{toe, junction, t_toe, flange_t(tw / 2)},
                           {junction, {junction.y, -junction.z}, tw, tw},
                           {{junction.y, -junction.z}, {toe.y, -toe.z}, flange_t(tw / 2), t_toe}});
  outline.shear_centre = warping.shear_centre;
  detail::fill_from_outline(s, outline);
  s.Iw = warping.Iw;
  // St Venant torsion after El Darwish & Johnston (channel: two flanges with one
  // free end, the web between them, two L junctions), with a tapered flange
  // replaced by the parallel one of equal integral of t^3 over the outstand
  // (thin-walled torsion J = sum of t^3 ds / 3, Roark): for t linear from t_root
  // to t_toe, t_eq^3 = (t_root + t_toe)(t_root^2 + t_toe^2) / 4.
  const double t_eq = std::cbrt(0.25 * (t_root + t_toe) * (t_root * t_root + t_toe * t_toe));
  s.J = 2 * plate_torsion(b, t_eq, 1) + (h - 2 * t_eq) * tw * tw * tw / 3 + 2 * l_junction(tw, t_eq, r);
  // EN 1993-1-1 6.2.6(3)(b): rolled channel loaded parallel to the web,
  // A - 2 b tf + (tw + r) tf; parallel to the flanges A - hw tw (6.2.6(3)(e)).
  const double hw = h - 2 * tf;
  s.Avz = s.A - 2 * b * tf + (tw + r) * tf;
  s.Avy = s.A - hw * tw;
  s.parts = {{"web", PartKind::internal, h - 2 * tf - 2 * r, tw},
             {"flange", PartKind::outstand, b - tw - r, tf}};
  detail::set_t_max(s);
  return s;
}

Section angle_section(std::string designation, const AngleDimensions& d) {
  const double h = d.h, b = d.b, t = d.t, r = d.r, r2 = d.r_toe;
  detail::require(h > 0 && b > 0 && h >= b && t > 0 && r >= 0 && r2 >= 0 && t + r + r2 < b, "angle", designation,
                  "dimensions must satisfy h >= b > t + r + r_toe, t > 0 and r, r_toe >= 0");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::angle;
  detail::ShapeOutline outline;
  for (const int n : {detail::fine_segments, detail::display_segments}) {
    // Heel at the origin, leg b along y, leg h along z.
    const SectionRing ring =
        rounded_ring({{0, 0, 0}, {b, 0, 0}, {b, t, r2}, {t, t, r}, {t, h, r2}, {0, h, 0}}, n);
    (n == detail::fine_segments ? outline.fine : outline.display).push_back(ring);
  }
  // Shear centre of an angle: where the legs' centre lines meet (thin-walled theory).
  outline.shear_centre = {t / 2, t / 2};
  outline.principal = true;
  detail::fill_from_outline(s, outline);
  // Two legs meeting at a point: Iw = t^3 (b'^3 + h'^3) / 36 with centre-line
  // leg lengths (thin-walled theory, from memory); tiny, kept for completeness.
  const double bp = b - t / 2, hp = h - t / 2;
  s.Iw = t * t * t * (bp * bp * bp + hp * hp * hp) / 36;
  s.J = plate_torsion(b, t, 1) + plate_torsion(h - t, t, 1) + l_junction(t, t, r);
  // Shear areas of an angle: each leg carries the shear along it (common practice);
  // in principal axes half the area each way.
  s.Avy = 0.5 * s.A;
  s.Avz = 0.5 * s.A;
  // EN 1993-1-1 Table 5.2 sheet 3 uses h/t and (b + h) / (2 t) for angles.
  s.parts = {{"leg h", PartKind::angle_leg, h, t}, {"leg b", PartKind::angle_leg, b, t}};
  detail::set_t_max(s);
  return s;
}

}  // namespace stepframe::analysis
