// I, H and T shapes: rolled I/H with root radius, welded I with unequal
// flanges, tee with root radius.

#include "section_outline.hpp"
#include "stepframe/analysis/section_shapes.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <utility>

namespace stepframe::analysis {
namespace {

constexpr double pi = std::numbers::pi;

// St Venant torsion contribution of one web-flange T junction with root radius
// r after El Darwish & Johnston, "Torsion of structural shapes", J. Struct. Div.
// ASCE 91 (1965): alpha D^4 with alpha = (tw/tf)(0.145 + 0.1 r/tf) and the
// inscribed circle diameter D = ((tf + r)^2 + tw (r + tw/4)) / (2 r + tf). The
// coefficient form is from memory; it reproduces the tabulated It of EN 10365
// IPE and HEB sections within 0.5% (tests/analysis/test_sections.cpp).
double t_junction(double tw, double tf, double r) {
  const double alpha = (tw / tf) * (0.145 + 0.1 * r / tf);
  const double D = ((tf + r) * (tf + r) + tw * (r + 0.25 * tw)) / (2 * r + tf);
  return alpha * std::pow(D, 4);
}

// Thin rectangle c x t free at `free_ends` ends: c t^3 / 3 - 0.105 t^4 per free end
// (Roark's Formulas for Stress and Strain, torsion of a thin rectangle:
// K = c t^3 (1/3 - 0.21 t/c) for both ends free).
double plate_torsion(double c, double t, int free_ends) { return c * t * t * t / 3 - 0.105 * free_ends * std::pow(t, 4); }

}  // namespace

Section rolled_i_section(std::string designation, const RolledIDimensions& d) {
  const double h = d.h, b = d.b, tw = d.tw, tf = d.tf, r = d.r;
  detail::require(h > 0 && b > 0 && tw > 0 && tf > 0 && r >= 0 && 2 * tf < h && tw < b &&
                      2 * (tf + r) < h && tw + 2 * r < b,
                  "rolled section", designation,
                  "dimensions must satisfy h, b, tw, tf > 0, r >= 0, 2 (tf + r) < h and tw + 2 r < b");
  const double hw = h - 2 * tf;  // web height between the flanges

  // Spandrel fillet (square r x r minus a quarter disc), elementary geometry:
  // area (1 - pi/4) r^2; centroid (5/6 - pi/4)/(1 - pi/4) r = 0.2234 r from both
  // corner lines; second moment about a corner line (1 - 5 pi/16) r^4.
  const double a_fillet = (1 - pi / 4) * r * r;
  const double e_fillet = (5.0 / 6.0 - pi / 4) / (1 - pi / 4) * r;
  const double i_fillet = (1 - 5 * pi / 16) * r * r * r * r - a_fillet * e_fillet * e_fillet;  // own centroidal

  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::rolled_i;
  detail::ShapeOutline outline;
  for (const int n : {detail::fine_segments, detail::display_segments}) {
    const double y1 = b / 2, y0 = tw / 2, z1 = h / 2, z0 = h / 2 - tf;
    const SectionRing ring = rounded_ring({{-y1, -z1, 0}, {y1, -z1, 0}, {y1, -z0, 0}, {y0, -z0, r}, {y0, z0, r},
                                           {y1, z0, 0}, {y1, z1, 0}, {-y1, z1, 0}, {-y1, z0, 0}, {-y0, z0, r},
                                           {-y0, -z0, r}, {-y1, -z0, 0}},
                                          n);
    (n == detail::fine_segments ? outline.fine : outline.display).push_back(ring);
  }
  detail::fill_from_outline(s, outline);

  // Closed forms replace the polygon values (same geometry, exact arcs).
  // Two flanges, web and four fillets (EN 10365 notation; elementary geometry).
  s.A = 2 * b * tf + hw * tw + 4 * a_fillet;
  // Strong axis: outer rectangle minus the two voids beside the web, plus the
  // fillets with the parallel-axis theorem at h/2 - tf - 0.2234 r.
  const double ey = 0.5 * h - tf - e_fillet;
  s.Iy = (b * h * h * h - (b - tw) * hw * hw * hw) / 12 + 4 * (i_fillet + a_fillet * ey * ey);
  // Weak axis: flanges and web about their common centre line, fillets at tw/2 + 0.2234 r.
  const double ez = 0.5 * tw + e_fillet;
  s.Iz = (2 * tf * b * b * b + hw * tw * tw * tw) / 12 + 4 * (i_fillet + a_fillet * ez * ez);
  s.Wel_y = s.Iy / (0.5 * h);
  s.Wel_z = s.Iz / (0.5 * b);
  // Plastic moduli: twice the first moment of half the section about the axis
  // (elementary plastic theory; EN 10365 tables use the same geometry).
  s.Wpl_y = b * tf * (h - tf) + 0.25 * tw * hw * hw + 4 * a_fillet * ey;
  s.Wpl_z = 0.5 * tf * b * b + 0.25 * hw * tw * tw + 4 * a_fillet * ez;
  // St Venant torsion: thin-walled open section, flanges free at both ends,
  // web between the flanges, plus the two web-flange junctions.
  s.J = 2 * plate_torsion(b, tf, 2) + hw * tw * tw * tw / 3 + 2 * t_junction(tw, tf, r);
  // Warping constant of a doubly symmetric I: Iz,flange (h - tf)^2 / 2 =
  // tf b^3 (h - tf)^2 / 24 (Vlasov thin-walled theory; the EN 10365 tables' Iw).
  s.Iw = tf * b * b * b * (h - tf) * (h - tf) / 24;
  // Shear areas, EN 1993-1-1 6.2.6(3)(a): rolled I/H loaded parallel to the web,
  // A - 2 b tf + (tw + 2 r) tf, at least eta hw tw (eta = 1.0, conservative);
  // parallel to the flanges, A - hw tw (6.2.6(3)(e) applied to rolled shapes, common practice).
  s.Avz = std::max(s.A - 2 * b * tf + (tw + 2 * r) * tf, hw * tw);
  s.Avy = s.A - hw * tw;
  // c/t of EN 1993-1-1 Table 5.2: web c = h - 2 tf - 2 r; flange outstand c = (b - tw - 2 r) / 2.
  s.parts = {{"web", PartKind::internal, h - 2 * tf - 2 * r, tw},
             {"flange", PartKind::outstand, 0.5 * (b - tw - 2 * r), tf}};
  detail::set_t_max(s);
  return s;
}

Section welded_i_section(std::string designation, const WeldedIDimensions& d) {
  const double h = d.h, tw = d.tw, b1 = d.b_top, t1 = d.tf_top, b2 = d.b_bottom, t2 = d.tf_bottom;
  detail::require(h > 0 && tw > 0 && b1 > tw && b2 > tw && t1 > 0 && t2 > 0 && t1 + t2 < h, "welded section",
                  designation, "dimensions must satisfy h, tw, tf > 0, b > tw and tf_top + tf_bottom < h");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::welded_i;
  const double hw = h - t1 - t2;
  // Drawing axes: bottom of the bottom flange at z = 0, web centred on y = 0.
  const SectionRing ring{{-b2 / 2, 0},      {b2 / 2, 0},      {b2 / 2, t2},      {tw / 2, t2},
                         {tw / 2, h - t1},  {b1 / 2, h - t1}, {b1 / 2, h},       {-b1 / 2, h},
                         {-b1 / 2, h - t1}, {-tw / 2, h - t1}, {-tw / 2, t2},    {-b2 / 2, t2}};
  // Shear centre of a mono-symmetric I (Vlasov thin-walled theory): on the web at
  // hs I2 / (I1 + I2) from the top flange's centre line, hs between flange centre lines.
  const double I1 = t1 * b1 * b1 * b1 / 12, I2 = t2 * b2 * b2 * b2 / 12;
  const double hs = h - 0.5 * (t1 + t2);
  const double z_top = h - 0.5 * t1;
  detail::ShapeOutline outline{{ring}, {ring}, {0.0, z_top - hs * I2 / (I1 + I2)}, false};
  detail::fill_from_outline(s, outline);
  // Thin rectangles (Roark): flanges free at both ends, web between them.
  s.J = plate_torsion(b1, t1, 2) + plate_torsion(b2, t2, 2) + hw * tw * tw * tw / 3;
  // Warping constant of a mono-symmetric I: hs^2 I1 I2 / (I1 + I2) (Vlasov
  // thin-walled theory, web's own warping neglected).
  s.Iw = hs * hs * I1 * I2 / (I1 + I2);
  // EN 1993-1-1 6.2.6(3)(d) and (e) with eta = 1.0: web hw tw; flanges A - hw tw.
  s.Avz = hw * tw;
  s.Avy = s.A - hw * tw;
  // Table 5.2 with the welds neglected (conservative): web c = hw, outstands (b - tw) / 2.
  s.parts = {{"web", PartKind::internal, hw, tw},
             {"top flange", PartKind::outstand, 0.5 * (b1 - tw), t1},
             {"bottom flange", PartKind::outstand, 0.5 * (b2 - tw), t2}};
  detail::set_t_max(s);
  return s;
}

Section tee_section(std::string designation, const TeeDimensions& d) {
  const double h = d.h, b = d.b, tw = d.tw, tf = d.tf, r = d.r;
  detail::require(h > 0 && b > 0 && tw > 0 && tf > 0 && r >= 0 && tf + r < h && tw + 2 * r < b, "tee section",
                  designation, "dimensions must satisfy h, b, tw, tf > 0, r >= 0, tf + r < h and tw + 2 r < b");
  Section s;
  s.designation = std::move(designation);
  s.shape = SectionShape::tee;
  detail::ShapeOutline outline;
  for (const int n : {detail::fine_segments, detail::display_segments}) {
    const SectionRing ring = rounded_ring({{-tw / 2, 0, 0}, {tw / 2, 0, 0}, {tw / 2, h - tf, r}, {b / 2, h - tf, 0},
                                           {b / 2, h, 0}, {-b / 2, h, 0}, {-b / 2, h - tf, 0}, {-tw / 2, h - tf, r}},
                                          n);
    (n == detail::fine_segments ? outline.fine : outline.display).push_back(ring);
  }
  // Shear centre of a tee: where the flange and stem centre lines meet (thin-walled theory).
  outline.shear_centre = {0.0, h - 0.5 * tf};
  detail::fill_from_outline(s, outline);
  s.J = plate_torsion(b, tf, 2) + plate_torsion(h - tf, tw, 1) + t_junction(tw, tf, r);
  // Warping constant of a tee, b^3 tf^3 / 144 + (h - tf/2)^3 tw^3 / 36 (thin-walled
  // theory for two plates meeting at a point; from memory).
  s.Iw = std::pow(b * tf, 3) / 144 + std::pow((h - 0.5 * tf) * tw, 3) / 36;
  // EN 1993-1-1 6.2.6(3)(c), rolled T loaded parallel to the web, 0.9 (A - b tf) (from memory
  // of the amended clause); parallel to the flange: the flange area (common practice).
  s.Avz = 0.9 * (s.A - b * tf);
  s.Avy = b * tf;
  s.parts = {{"flange", PartKind::outstand, 0.5 * (b - tw - 2 * r), tf},
             {"stem", PartKind::outstand, h - tf - r, tw}};
  detail::set_t_max(s);
  return s;
}

}  // namespace stepframe::analysis
