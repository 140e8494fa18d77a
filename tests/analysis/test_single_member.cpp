// One member, fixed at its start node, loaded at its free end.
// References:
//  - tip deflection P L^3 / (3 E I) and deflected shape P x^2 (3 L - x) / (6 E I):
//    Roark's Formulas for Stress and Strain, Table 8.1, case 1a (cantilever, end load);
//  - root stress M / W with M = P L: elementary bending theory, common practice;
//  - twist T L / (G J): uniform St Venant torsion, common practice;
//  - extension P L / (E A): Hooke's law for a bar, common practice.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/analysis/solve.hpp"

#include "recovered_lines.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <vector>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

constexpr double tol = 1e-9;  // relative; the element is exact for these cases

// A member's end points and roll angle.
struct Placement {
  V a, b;
  double roll;
};

struct Cantilever {
  FrameModel model;
  Eigen::Matrix3d axes;
  double length;
};

// Fixed at node 0, loaded at node 1 by a force and a moment given in LOCAL axes.
Cantilever cantilever(const V& a, const V& b, double roll, const V& force_local, const V& moment_local) {
  Cantilever c{test::single_member(a, b, roll), local_axes(a, b, roll), (b - a).norm()};
  c.model.supports = {test::support(0, test::fixed_all)};
  LoadCase lc;
  lc.name = "tip load";
  lc.node_loads = {NodeLoad{1, c.axes.transpose() * force_local, c.axes.transpose() * moment_local}};
  c.model.cases = {lc};
  return c;
}

// Tip translation and rotation in local axes.
std::pair<V, V> tip_local(const Cantilever& c, const LoadResult& r) {
  return {c.axes * r.displacements.segment<3>(6), c.axes * r.displacements.segment<3>(9)};
}

}  // namespace

TEST_CASE("cantilever with end load along local z", "[analysis][cantilever]") {
  const double P = 12e3;  // N
  const Section s = test::test_section();
  const Material m = test::test_steel();

  const std::vector<Placement> placements{{V(0, 0, 0), V(3, 0, 0), 0.0},
                                          {V(1, 2, 3), V(1, 2, 3) + 4.2 * V(2, -1, 1.5).normalized(), 0.5},
                                          {V(0, 0, 0), V(0, 0, 2.5), 0.0}};
  for (const auto& [a, b, roll] : placements) {
    INFO("member from " << a.transpose() << " to " << b.transpose() << ", roll " << roll);
    const Cantilever c = cantilever(a, b, roll, V(0, 0, -P), V::Zero());
    const auto results = stepframe::testing::recovered(c.model, solve(c.model));
    REQUIRE(results.size() == 1);
    const auto& r = results[0];
    const double L = c.length;
    const auto [u, theta] = tip_local(c, r);

    CHECK(u.z() == Approx(-P * L * L * L / (3 * m.E * s.Iy)).epsilon(tol));
    CHECK(u.y() == Approx(0).margin(1e-12));
    CHECK(u.x() == Approx(0).margin(1e-12));
    // End slope dw/dx = -P L^2 / (2 E I) (same reference), so ry = -dw/dx > 0.
    CHECK(theta.y() == Approx(P * L * L / (2 * m.E * s.Iy)).epsilon(tol));

    const LineResult& mr = r.elements[0];
    // Root: hogging moment +P L about y (top fibre, local +z, in tension) and
    // shear Vz = -P (the outer part pushes down on the root).
    CHECK(mr.start_forces(4) == Approx(P * L).epsilon(tol));
    CHECK(mr.start_forces(2) == Approx(-P).epsilon(tol));
    CHECK(mr.end_forces(4) == Approx(0).margin(1e-6));
    CHECK(mr.stations.front().max_abs_stress == Approx(P * L / s.Wy()).epsilon(tol));
    CHECK(mr.max_abs_stress == Approx(P * L / s.Wy()).epsilon(tol));

    // Deflected shape at every station, in global axes.
    for (const Station& st : mr.stations) {
      const double x = st.x;
      const double w = -P * x * x * (3 * L - x) / (6 * m.E * s.Iy);
      const V expected = c.axes.transpose() * V(0, 0, w);
      CHECK((st.displacement - expected).norm() <= tol * P * L * L * L / (3 * m.E * s.Iy));
    }
    // Reactions balance the load.
    CHECK((r.reactions.segment<3>(0) + c.axes.transpose() * V(0, 0, -P)).norm() <= 1e-8 * P);
  }
}

TEST_CASE("cantilever with end load along local y", "[analysis][cantilever]") {
  const double P = 3e3;
  const Section s = test::test_section();
  const Material m = test::test_steel();
  const std::vector<Placement> placements{{V(0, 0, 0), V(3, 0, 0), 0.0},
                                          {V(-1, 0.5, 2), V(-1, 0.5, 2) + 2.7 * V(-0.3, 1, 0.8).normalized(), -1.1}};
  for (const auto& [a, b, roll] : placements) {
    INFO("member from " << a.transpose() << " to " << b.transpose() << ", roll " << roll);
    const Cantilever c = cantilever(a, b, roll, V(0, P, 0), V::Zero());
    const auto r = stepframe::testing::recovered(c.model, solve(c.model)).at(0);
    const double L = c.length;
    const auto [u, theta] = tip_local(c, r);
    CHECK(u.y() == Approx(P * L * L * L / (3 * m.E * s.Iz)).epsilon(tol));
    CHECK(u.z() == Approx(0).margin(1e-12));
    CHECK(theta.z() == Approx(P * L * L / (2 * m.E * s.Iz)).epsilon(tol));  // rz = dv/dx
    const LineResult& mr = r.elements[0];
    CHECK(std::abs(mr.start_forces(5)) == Approx(P * L).epsilon(tol));
    CHECK(mr.max_abs_stress == Approx(P * L / s.Wz()).epsilon(tol));
    // Largest offset of the deflected shape v(x) = P x^2 (3L - x) / (6 E I) from
    // the chord through the deformed ends (sampled finely here; the recovery
    // searches a grid four times finer than its stations).
    const double vL = P * L * L * L / (3 * m.E * s.Iz);
    double expected = 0;
    for (int k = 0; k <= 4000; ++k) {
      const double x = L * k / 4000.0;
      const double v = P * x * x * (3 * L - x) / (6 * m.E * s.Iz);
      expected = std::max(expected, std::abs(v - x / L * vL) * L / std::hypot(L, vL));
    }
    CHECK(mr.max_local_deflection == Approx(expected).epsilon(2e-4));
    CHECK(expected > 0.06 * P * L * L * L / (m.E * s.Iz));  // the shape really bows off its chord
  }
}

TEST_CASE("cantilever with end torque twists by T L / (G J)", "[analysis][cantilever]") {
  const double T = 800;  // N m
  const Section s = test::test_section();
  const Material m = test::test_steel();
  const Cantilever c = cantilever(V(0, 0, 0), V(1, 2, 2), 0.3, V::Zero(), V(T, 0, 0));
  const auto r = stepframe::testing::recovered(c.model, solve(c.model)).at(0);
  const auto [u, theta] = tip_local(c, r);
  CHECK(theta.x() == Approx(T * c.length / (m.G * s.J)).epsilon(tol));
  CHECK(theta.y() == Approx(0).margin(1e-12));
  CHECK(u.norm() == Approx(0).margin(1e-12));
  for (const Station& st : r.elements[0].stations) CHECK(st.forces(3) == Approx(T).epsilon(tol));
}

TEST_CASE("axial bar extends by P L / (E A) and carries tension N = P", "[analysis][axial]") {
  const double P = 150e3;
  const Section s = test::test_section();
  const Material m = test::test_steel();
  const Cantilever c = cantilever(V(0, 0, 0), V(0, 0, 3.5), 0, V(P, 0, 0), V::Zero());  // vertical bar pulled up
  const auto r = stepframe::testing::recovered(c.model, solve(c.model)).at(0);
  CHECK(r.displacements(6 + 2) == Approx(P * c.length / (m.E * s.A)).epsilon(tol));
  for (const Station& st : r.elements[0].stations) {
    CHECK(st.forces(0) == Approx(P).epsilon(tol));
    CHECK(st.max_abs_stress == Approx(P / s.A).epsilon(tol));
    // Linear axial displacement along the bar.
    CHECK(st.displacement.z() == Approx(P * st.x / (m.E * s.A)).margin(1e-12));
  }
  CHECK(r.reactions(2) == Approx(-P).epsilon(tol));
}

TEST_CASE("a 3 m column drawn 0.01 mm or 1 mm out of plumb sways as a plumb one", "[analysis][cantilever]") {
  // A horizontal tip load along global X on a plumb column bends it about its strong axis (depth along
  // X, README "Member axes"): tip sway P L^3 / (3 E Iy), Roark Table 8.1 case 1a. A CAD drift of the
  // top by 0.01 mm or 1 mm (within the 0.25 degree vertical tolerance) must not turn the section.
  const double P = 10e3, L = 3.0;
  const Section s = test::test_section();
  const double expected = P * L * L * L / (3 * 210e9 * s.Iy);
  for (const V& drift : {V(0, 0, 0), V(1e-5, 0, 0), V(0, 1e-5, 0), V(1e-3, 0, 0), V(0, 1e-3, 0)}) {
    INFO("top drift " << drift.transpose() << " m");
    FrameModel model = test::single_member(V::Zero(), V(0, 0, L) + drift);
    model.supports = {test::support(0, test::fixed_all)};
    LoadCase lc;
    lc.name = "sway";
    lc.node_loads = {NodeLoad{1, V(P, 0, 0), V::Zero()}};
    model.cases = {lc};
    const auto results = solve(model);
    // The drift angle (at most 3.3e-4 rad) changes the lever arm and load direction by under 1e-6.
    CHECK(results[0].displacements(6) == Approx(expected).epsilon(1e-6));
  }
}
