// Single-span beams against handbook formulas.
// Source: W. C. Young & R. G. Budynas, Roark's Formulas for Stress and Strain,
// 7th ed. (2002), Table 8.1 "Shear, moment, slope and deflection formulas for
// elastic straight beams" (the case numbers quoted below are from memory; each
// formula is also the textbook result of integrating E I w'''' = q).
// Timoshenko deep-beam cases: S. Timoshenko, Strength of Materials, Part I,
// "Effect of shearing force on the deflection of beams" (deflection from shear
// = integral of V / (G A_s)); from memory for the article number.
// Sign conventions (results.hpp): a beam along X with local z = Z; sagging is My < 0.

#include "verification_models.hpp"

#include <catch2/catch.hpp>

#include <cmath>

using namespace stepframe::analysis;
using namespace stepframe::analysis::verification;
using V = Eigen::Vector3d;

namespace {
constexpr double exact = 1e-9;  // relative: the element is exact for these loads
}

TEST_CASE("simply supported beam, point load at a: Roark Table 8.1 case 1e", "[verification][roark]") {
  const double L = 6.0, a = 1.5, b = L - a, P = 40e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, pin), support(1, roller)};
  LoadCase lc;
  lc.name = "P";
  lc.partial_loads = {point(0, a, V(0, 0, -P))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(reaction(r, 0, uz) == Approx(P * b / L).epsilon(exact));
  CHECK(reaction(r, 1, uz) == Approx(P * a / L).epsilon(exact));
  // Deflection under the load: -P a^2 b^2 / (3 E I L).
  CHECK(station_at(r.elements[0], a).displacement.z() == Approx(-P * a * a * b * b / (3 * E * I * L)).epsilon(exact));
  // Largest moment P a b / L (sagging) under the load, located exactly.
  CHECK(r.elements[0].extremes[4].min == Approx(-P * a * b / L).epsilon(exact));
  CHECK(r.elements[0].extremes[4].x_min == Approx(a).epsilon(1e-6));
  // Shear jumps by P at the load: Vz = -R1 before (the part beyond pushes down), +R2 after.
  CHECK(r.elements[0].extremes[2].min == Approx(-P * b / L).epsilon(exact));
  CHECK(r.elements[0].extremes[2].max == Approx(P * a / L).epsilon(exact));
}

TEST_CASE("simply supported beam, uniform load: Roark Table 8.1 case 2e (w_a = w_l)", "[verification][roark]") {
  const double L = 7.0, w = 12e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, pin), support(1, roller)};
  LoadCase lc;
  lc.name = "w";
  lc.partial_loads = {distributed(0, 0, L, V(0, 0, -w), V(0, 0, -w))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(station_at(r.elements[0], L / 2).displacement.z() == Approx(-5 * w * L * L * L * L / (384 * E * I)).epsilon(exact));
  CHECK(r.elements[0].extremes[4].min == Approx(-w * L * L / 8).epsilon(exact));
  CHECK(r.elements[0].extremes[4].x_min == Approx(L / 2).epsilon(1e-9));  // where the shear crosses zero
  CHECK(r.elements[0].max_local_deflection == Approx(5 * w * L * L * L * L / (384 * E * I)).epsilon(1e-9));
}

TEST_CASE("simply supported beam, partial uniform load: statics of Roark Table 8.1 case 2e", "[verification][roark]") {
  // Load w over [a, b]; R1 = w c (L - a - c/2) / L; the moment peaks where
  // the shear crosses zero, x0 = a + R1 / w, at M = R1 x0 - w (x0 - a)^2 / 2.
  const double L = 8.0, a = 2.0, b = 5.0, c = b - a, w = 9e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, pin), support(1, roller)};
  LoadCase lc;
  lc.name = "part";
  lc.partial_loads = {distributed(0, a, b, V(0, 0, -w), V(0, 0, -w))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double R1 = w * c * (L - a - c / 2) / L;
  const double x0 = a + R1 / w;
  CHECK(reaction(r, 0, uz) == Approx(R1).epsilon(exact));
  CHECK(reaction(r, 1, uz) == Approx(w * c - R1).epsilon(exact));
  CHECK(r.elements[0].extremes[4].x_min == Approx(x0).epsilon(1e-9));
  CHECK(r.elements[0].extremes[4].min == Approx(-(R1 * x0 - w * (x0 - a) * (x0 - a) / 2)).epsilon(exact));
}

TEST_CASE("simply supported beam, triangular load: Roark Table 8.1 case 2e (w_a = 0)", "[verification][roark]") {
  // q rising from 0 at the left to w at the right: R_left = wL/6, R_right = wL/3,
  // M_max = w L^2 / (9 sqrt 3) at x = L / sqrt 3.
  const double L = 6.0, w = 15e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, pin), support(1, roller)};
  LoadCase lc;
  lc.name = "tri";
  lc.partial_loads = {distributed(0, 0, L, V(0, 0, 0), V(0, 0, -w))};
  m.cases = {lc};
  const auto r = solve_one(m);
  CHECK(reaction(r, 0, uz) == Approx(w * L / 6).epsilon(exact));
  CHECK(reaction(r, 1, uz) == Approx(w * L / 3).epsilon(exact));
  CHECK(r.elements[0].extremes[4].min == Approx(-w * L * L / (9 * std::sqrt(3.0))).epsilon(exact));
  CHECK(r.elements[0].extremes[4].x_min == Approx(L / std::sqrt(3.0)).epsilon(1e-9));
}

TEST_CASE("cantilever, uniform load: Roark Table 8.1 case 2a (w_a = w_l)", "[verification][roark]") {
  const double L = 3.0, w = 8e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, fixed)};
  LoadCase lc;
  lc.name = "w";
  lc.partial_loads = {distributed(0, 0, L, V(0, 0, -w), V(0, 0, -w))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(disp_z(r, 1) == Approx(-w * std::pow(L, 4) / (8 * E * I)).epsilon(exact));
  CHECK(r.elements[0].start_forces(4) == Approx(w * L * L / 2).epsilon(exact));  // hogging at the root
  // Deflected shape w x^2 (6L^2 - 4Lx + x^2) / (24 E I) at every station.
  for (const Station& s : r.elements[0].stations) {
    const double x = s.x;
    CHECK(s.displacement.z() == Approx(-w * x * x * (6 * L * L - 4 * L * x + x * x) / (24 * E * I)).margin(1e-12));
    // Slope: the derivative, w x (3L^2 - 3Lx + x^2) / (6 E I), w L^3 / (6 E I) at the tip; a section
    // dipping towards +x turns positively about +y (right-hand rule).
    CHECK(s.rotation.y() == Approx(w * x * (3 * L * L - 3 * L * x + x * x) / (6 * E * I)).margin(1e-12));
  }
}

TEST_CASE("cantilever, point load at a from the root: Roark Table 8.1 case 1a", "[verification][roark]") {
  const double L = 4.0, a = 2.4, P = 10e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, fixed)};
  LoadCase lc;
  lc.name = "P";
  lc.partial_loads = {point(0, a, V(0, 0, -P))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  // Tip: P a^2 (3L - a) / (6 E I); under the load: P a^3 / (3 E I); beyond it the beam is straight.
  CHECK(disp_z(r, 1) == Approx(-P * a * a * (3 * L - a) / (6 * E * I)).epsilon(exact));
  CHECK(station_at(r.elements[0], a).displacement.z() == Approx(-P * a * a * a / (3 * E * I)).epsilon(exact));
  CHECK(r.elements[0].start_forces(4) == Approx(P * a).epsilon(exact));
  CHECK(r.elements[0].end_forces(4) == Approx(0).margin(1e-6));
}

TEST_CASE("cantilever, load falling from w at the root to 0 at the tip: Roark Table 8.1 case 2a", "[verification][roark]") {
  // Tip deflection w L^4 / (30 E I), root moment w L^2 / 6.
  const double L = 3.5, w = 20e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, fixed)};
  LoadCase lc;
  lc.name = "tri";
  lc.partial_loads = {distributed(0, 0, L, V(0, 0, -w), V(0, 0, 0))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(disp_z(r, 1) == Approx(-w * std::pow(L, 4) / (30 * E * I)).epsilon(exact));
  CHECK(r.elements[0].start_forces(4) == Approx(w * L * L / 6).epsilon(exact));
}

TEST_CASE("propped cantilever, uniform load: Roark Table 8.1 case 2c", "[verification][roark]") {
  // Prop reaction 3wL/8, root moment wL^2/8; the largest deflection
  // w L^4 / 185 E I (the handbook's rounded coefficient; the exact curve
  // v = w s (L^3 - 3 L s^2 + 2 s^3) / (48 E I) from the prop peaks at
  // s = L (1 + sqrt 33) / 16).
  const double L = 5.0, w = 10e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, fixed), support(1, roller)};
  LoadCase lc;
  lc.name = "w";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(reaction(r, 1, uz) == Approx(3 * w * L / 8).epsilon(exact));
  CHECK(r.elements[0].start_forces(4) == Approx(w * L * L / 8).epsilon(exact));
  const double s = L * (1 + std::sqrt(33.0)) / 16;
  const double vmax = w * s * (L * L * L - 3 * L * s * s + 2 * s * s * s) / (48 * E * I);
  // The peak lies between stations: the recovery's refinement (Brent's method) must find it, not a
  // station next to it (the nearest of the 21 stations is 0.11 m away, its deflection 0.3% lower).
  CHECK(r.elements[0].max_local_deflection == Approx(vmax).epsilon(1e-10));
  CHECK(r.elements[0].max_local_deflection == Approx(w * std::pow(L, 4) / (185 * E * I)).epsilon(3e-3));
  CHECK(r.elements[0].max_local_deflection_at == Approx(L - s).margin(1e-5));
}

TEST_CASE("fixed-ended beam, uniform load: Roark Table 8.1 case 2d", "[verification][roark]") {
  const double L = 6.0, w = 14e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, fixed), support(1, fixed)};
  LoadCase lc;
  lc.name = "w";
  lc.partial_loads = {distributed(0, 0, L, V(0, 0, -w), V(0, 0, -w))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(r.elements[0].start_forces(4) == Approx(w * L * L / 12).epsilon(exact));
  CHECK(r.elements[0].end_forces(4) == Approx(w * L * L / 12).epsilon(exact));
  CHECK(station_at(r.elements[0], L / 2).forces(4) == Approx(-w * L * L / 24).epsilon(exact));
  CHECK(station_at(r.elements[0], L / 2).displacement.z() == Approx(-w * std::pow(L, 4) / (384 * E * I)).epsilon(exact));
}

TEST_CASE("fixed-ended beam, point load at a: Roark Table 8.1 case 1d", "[verification][roark]") {
  // End moments P a b^2 / L^2 and P a^2 b / L^2; deflection under the load P a^3 b^3 / (3 E I L^3).
  const double L = 8.0, a = 2.0, b = L - a, P = 50e3;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, fixed), support(1, fixed)};
  LoadCase lc;
  lc.name = "P";
  lc.partial_loads = {point(0, a, V(0, 0, -P))};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(r.elements[0].start_forces(4) == Approx(P * a * b * b / (L * L)).epsilon(exact));
  CHECK(r.elements[0].end_forces(4) == Approx(P * a * a * b / (L * L)).epsilon(exact));
  CHECK(station_at(r.elements[0], a).displacement.z() ==
        Approx(-P * a * a * a * b * b * b / (3 * E * I * L * L * L)).epsilon(exact));
}

TEST_CASE("beam with an overhang, point load at its tip: Roark Table 8.1 (overhanging beams)", "[verification][roark]") {
  // Supports at 0 and L, overhang c: tip deflection P c^2 (L + c) / (3 E I);
  // the far support holds the beam down with P c / L.
  const double L = 6.0, c = 1.8, P = 12e3;
  FrameModel m = beam_along_x({0, L, L + c});
  m.supports = {support(0, pin), support(1, roller)};
  LoadCase lc;
  lc.name = "P";
  lc.node_loads = {NodeLoad{2, V(0, 0, -P), V::Zero()}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(disp_z(r, 2) == Approx(-P * c * c * (L + c) / (3 * E * I)).epsilon(exact));
  CHECK(reaction(r, 0, uz) == Approx(-P * c / L).epsilon(exact));
  CHECK(reaction(r, 1, uz) == Approx(P * (L + c) / L).epsilon(exact));
}

TEST_CASE("deep cantilever with shear deformation: Timoshenko, Strength of Materials, Part I", "[verification][timoshenko]") {
  // Tip deflection P L^3 / (3 E I) + P L / (G A_s).
  const double L = 1.2, P = 300e3;
  Section s = beam_section();
  s.depth = 0.9;
  s.Iy = 2.5e-3;
  s.A = 0.03;
  s.Avz = 0.015;
  s.Avy = 0.02;
  FrameModel m = beam_along_x({0, L}, s);
  m.settings.shear_deformation = true;
  m.supports = {support(0, fixed)};
  LoadCase lc;
  lc.name = "P";
  lc.node_loads = {NodeLoad{1, V(0, 0, -P), V::Zero()}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double bending = P * L * L * L / (3 * E * s.Iy), shear = P * L / (G * s.Avz);
  REQUIRE(shear > 0.3 * bending);  // a beam where shear deformation matters
  CHECK(disp_z(r, 1) == Approx(-(bending + shear)).epsilon(exact));
  // Without the setting: Euler-Bernoulli.
  m.settings.shear_deformation = false;
  CHECK(disp_z(solve_one(m), 1) == Approx(-bending).epsilon(exact));
}

TEST_CASE("deep simply supported beam, uniform load, shear deformation: Timoshenko, Strength of Materials, Part I",
          "[verification][timoshenko]") {
  // Midspan: 5 w L^4 / (384 E I) + w L^2 / (8 G A_s) (the shear term integrates V / (G A_s)).
  const double L = 2.0, w = 400e3;
  Section s = beam_section();
  s.Iy = 2.5e-3;
  s.A = 0.03;
  s.Avz = 0.015;
  FrameModel m = beam_along_x({0, L}, s);
  m.settings.shear_deformation = true;
  m.supports = {support(0, pin), support(1, roller)};
  LoadCase lc;
  lc.name = "w";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double expected = 5 * w * std::pow(L, 4) / (384 * E * s.Iy) + w * L * L / (8 * G * s.Avz);
  CHECK(station_at(r.elements[0], L / 2).displacement.z() == Approx(-expected).epsilon(exact));
}
