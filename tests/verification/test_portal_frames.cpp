// Single-bay portal frames against closed-form frame formulas of the kind
// tabulated in A. Kleinlogel, Rahmenformeln (frame formulas for rigid frames;
// the expressions below are from memory and were re-derived here by the
// unit-load method and by slope-deflection, so they stand on their own).
// Frame: columns of height h (second moment Ic), beam of span L (Ib),
// k = Ib h / (Ic L). The formulas neglect axial strain, so the test sections
// have a large area (the axial effect is below 1e-5 here).

#include "verification_models.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using namespace stepframe::analysis::verification;
using V = Eigen::Vector3d;

namespace {

constexpr double h = 4.0, L = 8.0, Ic = 8e-5, Ib = 1.6e-4;
constexpr double k = Ib * h / (Ic * L);
constexpr double tol = 1e-4;

// Nodes A(0,0,0), B(0,0,h), C(L,0,h), D(L,0,0); elements A->B, B->C, D->C.
FrameModel portal(bool fixed_bases) {
  FrameModel m;
  m.nodes = {V(0, 0, 0), V(0, 0, h), V(L, 0, h), V(L, 0, 0)};
  Section column = beam_section(), beam = beam_section();
  column.A = beam.A = 1.0;
  column.Iy = Ic;
  beam.Iy = Ib;
  m.sections = {column, beam};
  m.materials = {steel()};
  m.elements = {FrameElement{{0, 1}, 0, 0, 0.0, {}}, FrameElement{{1, 2}, 1, 0, 0.0, {}},
                FrameElement{{3, 2}, 0, 0, 0.0, {}}};
  const std::array<bool, 6> base = fixed_bases ? fixed : std::array<bool, 6>{true, true, true, true, false, true};
  m.supports = {support(0, base), support(3, base), support(1, in_plane_only), support(2, in_plane_only)};
  return m;
}

stepframe::testing::Recovered beam_udl(bool fixed_bases, double w) {
  FrameModel m = portal(fixed_bases);
  LoadCase lc;
  lc.name = "w";
  lc.element_loads = {ElementUniformLoad{1, V(0, 0, -w)}};
  m.cases = {lc};
  return solve_one(m);
}

stepframe::testing::Recovered side_load(bool fixed_bases, double F) {
  FrameModel m = portal(fixed_bases);
  LoadCase lc;
  lc.name = "F";
  lc.node_loads = {NodeLoad{1, V(F, 0, 0), V::Zero()}};
  m.cases = {lc};
  return solve_one(m);
}

}  // namespace

TEST_CASE("pinned-base portal, uniform load on the beam: Kleinlogel-type formula", "[verification][portal]") {
  // Thrust H = w L^2 / (4 h (2k + 3)); corner moment H h.
  const double w = 20e3;
  const auto r = beam_udl(false, w);
  const double H = w * L * L / (4 * h * (2 * k + 3));
  CHECK(reaction(r, 0, ux) == Approx(H).epsilon(tol));   // pushes the foot inwards (+X)
  CHECK(reaction(r, 3, ux) == Approx(-H).epsilon(tol));
  CHECK(std::abs(r.elements[1].start_forces(4)) == Approx(H * h).epsilon(tol));
  CHECK(reaction(r, 0, uz) == Approx(w * L / 2).epsilon(1e-9));
}

TEST_CASE("fixed-base portal, uniform load on the beam: Kleinlogel-type formula", "[verification][portal]") {
  // Corner moment w L^2 / (6 (k + 2)); base moment half of it (carry-over).
  const double w = 20e3;
  const auto r = beam_udl(true, w);
  const double mb = w * L * L / (6 * (k + 2));
  CHECK(r.elements[1].start_forces(4) == Approx(mb).epsilon(tol));
  CHECK(r.elements[1].end_forces(4) == Approx(mb).epsilon(tol));
  CHECK(std::abs(reaction(r, 0, ry)) == Approx(mb / 2).epsilon(tol));
}

TEST_CASE("pinned-base portal, horizontal load at beam level: statics", "[verification][portal]") {
  // Antisymmetric: each foot takes F/2; corner moments F h / 2 (common practice).
  const double F = 30e3;
  const auto r = side_load(false, F);
  CHECK(reaction(r, 0, ux) == Approx(-F / 2).epsilon(tol));
  CHECK(reaction(r, 3, ux) == Approx(-F / 2).epsilon(tol));
  CHECK(std::abs(r.elements[0].end_forces(4)) == Approx(F * h / 2).epsilon(tol));
  CHECK(reaction(r, 0, uz) == Approx(-F * h / L).epsilon(tol));  // overturning couple
}

TEST_CASE("fixed-base portal, horizontal load at beam level: Kleinlogel-type formula", "[verification][portal]") {
  // Base moments F h (3k + 1) / (2 (6k + 1)), corner moments F h 3k / (2 (6k + 1)).
  const double F = 30e3;
  const auto r = side_load(true, F);
  CHECK(std::abs(reaction(r, 0, ry)) == Approx(F * h * (3 * k + 1) / (2 * (6 * k + 1))).epsilon(tol));
  CHECK(std::abs(reaction(r, 3, ry)) == Approx(F * h * (3 * k + 1) / (2 * (6 * k + 1))).epsilon(tol));
  CHECK(std::abs(r.elements[1].start_forces(4)) == Approx(F * h * 3 * k / (2 * (6 * k + 1))).epsilon(tol));
}
