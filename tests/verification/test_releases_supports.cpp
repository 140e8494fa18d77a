// End releases, elastic supports and support settlement.
// Sources:
//  - a member released in bending at both ends is a simply supported beam:
//    5 w L^4 / (384 E I), w L^2 / 8 (Roark's Formulas, 7th ed., Table 8.1, case 2e, from memory for the case);
//  - beam on two springs: superposition of the simply supported beam,
//    P L^3 / (48 E I) (Roark Table 8.1, case 1e), and the rigid-body drop P / (2 k) (statics, common practice);
//  - settlement delta of one end of a fixed-ended beam: end moments 6 E I delta / L^2
//    and shears 12 E I delta / L^3 (the slope-deflection equations; common practice).

#include "verification_models.hpp"

#include <catch2/catch.hpp>

#include <cmath>

using namespace stepframe::analysis;
using namespace stepframe::analysis::verification;
using Catch::Matchers::Contains;
using V = Eigen::Vector3d;

namespace {
constexpr double exact = 1e-9;
constexpr std::array<bool, 6> bending_released{false, false, false, false, true, true};
}  // namespace

TEST_CASE("a member released in bending at both ends between fixed supports is simply supported",
          "[verification][releases]") {
  const double L = 6.0, w = 10e3;
  FrameModel m = beam_along_x({0, L});
  m.elements[0].releases = {bending_released, bending_released};
  m.supports = {support(0, fixed), support(1, fixed)};
  LoadCase lc;
  lc.name = "w";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  const LineResult& line = r.elements[0];
  CHECK(line.start_forces(4) == Approx(0).margin(1e-6 * w * L * L));
  CHECK(line.end_forces(4) == Approx(0).margin(1e-6 * w * L * L));
  CHECK(line.extremes[4].min == Approx(-w * L * L / 8).epsilon(exact));
  CHECK(station_at(line, L / 2).displacement.z() == Approx(-5 * w * std::pow(L, 4) / (384 * E * I)).epsilon(exact));
  CHECK(std::abs(reaction(r, 0, ry)) < 1e-6 * w * L * L);
}

TEST_CASE("pin-ended member between pinned supports: the node rotations are tied, results simply supported",
          "[verification][releases]") {
  // Both the supports and the member ends are free in rotation: the node
  // rotations meet no stiffness at all, and must not be reported as a mechanism.
  const double L = 5.0, w = 6e3;
  FrameModel m = beam_along_x({0, L});
  m.elements[0].releases = {bending_released, bending_released};
  m.supports = {support(0, pin), support(1, roller)};
  LoadCase lc;
  lc.name = "w";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(station_at(r.elements[0], L / 2).displacement.z() == Approx(-5 * w * std::pow(L, 4) / (384 * E * I)).epsilon(exact));
  CHECK(r.elements[0].extremes[4].min == Approx(-w * L * L / 8).epsilon(exact));
}

TEST_CASE("a hinge over the middle support turns a two-span beam into two simple spans", "[verification][releases]") {
  const double L = 4.0, w = 8e3;
  FrameModel m = beam_along_x({0, L, 2 * L});
  m.elements[0].releases[1] = {false, false, false, false, true, false};  // ry at the end of span 1
  m.supports = {support(0, pin), support(1, roller), support(2, roller)};
  LoadCase lc;
  lc.name = "w";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}, ElementUniformLoad{1, V(0, 0, -w)}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(r.elements[0].end_forces(4) == Approx(0).margin(1e-6 * w * L * L));
  CHECK(r.elements[1].start_forces(4) == Approx(0).margin(1e-6 * w * L * L));
  CHECK(reaction(r, 1, uz) == Approx(w * L).epsilon(exact));
  CHECK(station_at(r.elements[0], L / 2).displacement.z() == Approx(-5 * w * std::pow(L, 4) / (384 * E * I)).epsilon(exact));
}

TEST_CASE("a member released so that it is a mechanism is refused with its name", "[verification][releases]") {
  FrameModel m = beam_along_x({0, 3.0});
  m.elements[0].releases[0][rx] = true;
  m.elements[0].releases[1][rx] = true;  // free to spin about its own axis
  m.supports = {support(0, fixed), support(1, fixed)};
  LoadCase lc;
  lc.name = "none";
  m.cases = {lc};
  CHECK_THROWS_WITH(solve_one(m), Contains("member 0") && Contains("mechanism") && Contains("rx"));
}

TEST_CASE("beam on two springs, central point load", "[verification][springs]") {
  const double L = 6.0, P = 24e3, k = 3e6;
  FrameModel m = beam_along_x({0, L / 2, L});
  Support left = support(0, {true, true, false, true, false, false});
  Support right = support(2, {false, true, false, true, false, false});
  left.spring[uz] = right.spring[uz] = k;
  m.supports = {left, right};
  LoadCase lc;
  lc.name = "P";
  lc.node_loads = {NodeLoad{1, V(0, 0, -P), V::Zero()}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double I = beam_section().Iy;
  CHECK(disp_z(r, 1) == Approx(-(P * L * L * L / (48 * E * I) + P / (2 * k))).epsilon(exact));
  CHECK(disp_z(r, 0) == Approx(-P / (2 * k)).epsilon(exact));
  CHECK(reaction(r, 0, uz) == Approx(P / 2).epsilon(exact));  // the spring's force on the beam
  CHECK(reaction(r, 2, uz) == Approx(P / 2).epsilon(exact));
}

TEST_CASE("settlement of one end of a fixed-ended beam: 6 E I delta / L^2", "[verification][settlement]") {
  const double L = 5.0, delta = 0.01;
  FrameModel m = beam_along_x({0, L});
  m.supports = {support(0, fixed), support(1, fixed)};
  LoadCase lc;
  lc.name = "settle";
  lc.settlements = {Settlement{1, uz, -delta}};
  m.cases = {lc};
  const auto r = solve_one(m);
  const double EI = E * beam_section().Iy;
  CHECK(disp_z(r, 1) == Approx(-delta).epsilon(exact));
  CHECK(std::abs(r.elements[0].start_forces(4)) == Approx(6 * EI * delta / (L * L)).epsilon(exact));
  CHECK(std::abs(r.elements[0].end_forces(4)) == Approx(6 * EI * delta / (L * L)).epsilon(exact));
  CHECK(reaction(r, 1, uz) == Approx(-12 * EI * delta / (L * L * L)).epsilon(exact));  // holds the end down
  CHECK(reaction(r, 0, uz) == Approx(12 * EI * delta / (L * L * L)).epsilon(exact));
}

TEST_CASE("a settlement where no support holds the node is refused", "[verification][settlement]") {
  FrameModel m = beam_along_x({0, 5.0});
  m.supports = {support(0, fixed)};
  LoadCase lc;
  lc.name = "settle";
  lc.settlements = {Settlement{1, uz, -0.01}};
  m.cases = {lc};
  CHECK_THROWS_WITH(solve_one(m), Contains("node 1") && Contains("uz") && Contains("no support fixes"));
}
