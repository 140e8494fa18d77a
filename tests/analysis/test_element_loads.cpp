// The element's load functions and stiffness agree with each other: the
// stiffness is the inverse of the cantilever flexibility the load functions
// integrate (Euler-Bernoulli and Timoshenko alike), fixed-end actions
// superpose (linear elasticity; common practice), and released end actions vanish.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/element_loads.hpp"
#include "stepframe/analysis/element_releases.hpp"

#include <catch2/catch.hpp>

#include <Eigen/LU>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

// Stiffness from the flexibility: with the start fixed, the end state
// d_L = F f0; the end actions follow from equilibrium, so k = [ ... ] from unit end states.
Matrix12d stiffness_from_flexibility(const ElementProperties& p) {
  Eigen::Matrix<double, 6, 6> F;
  for (int i = 0; i < 6; ++i) F.col(i) = element_state_at(p, Vector6d::Zero(), Vector6d::Unit(i), {}, p.length);
  const Eigen::Matrix<double, 6, 6> Finv = F.inverse();
  // Columns 6..11 of k: unit end displacements with the start fixed.
  Matrix12d k = Matrix12d::Zero();
  for (int j = 0; j < 6; ++j) {
    const Vector6d f0 = Finv.col(j);
    k.col(6 + j) = end_actions_from_start(p, f0, {});
  }
  return k;
}

}  // namespace

TEST_CASE("the stiffness is the inverse of the integrated flexibility, with and without shear deformation",
          "[analysis][element]") {
  for (bool shear : {false, true}) {
    INFO("shear deformation " << shear);
    Section s = test::test_section();
    s.Avz = 2.5e-3;
    s.Avy = 1.5e-3;
    const ElementProperties p = element_properties(s, test::test_steel(), 1.7, shear);
    const Matrix12d k = local_stiffness(p);
    const Matrix12d from_flex = stiffness_from_flexibility(p);
    CHECK((k.rightCols<6>() - from_flex.rightCols<6>()).norm() <= 1e-9 * k.norm());
  }
}

TEST_CASE("fixed-end actions superpose: a trapezoid is a uniform load plus a triangle", "[analysis][element]") {
  const ElementProperties p = element_properties(test::test_section(), test::test_steel(), 5.0);
  const V wa(0, 1e3, -2e3), wb(0, 4e3, -8e3);
  const LocalLoads trapezoid{{false, 1.0, 4.0, wa, wb}};
  const LocalLoads parts{{false, 1.0, 4.0, wa, wa}, {false, 1.0, 4.0, V::Zero(), wb - wa}};
  CHECK((fixed_end_actions(p, trapezoid) - fixed_end_actions(p, parts)).norm() <=
        1e-12 * fixed_end_actions(p, trapezoid).norm());
  // The uniform whole-length load gives the closed-form actions of equivalent_nodal_loads.
  const V q(1.5e3, -2e3, -3e3);
  CHECK((fixed_end_actions(p, {uniform_local_load(p.length, q)}) + equivalent_nodal_loads(p.length, q)).norm() <=
        1e-10 * q.norm() * p.length * p.length);
}

TEST_CASE("a condensed release leaves a zero end action and keeps equilibrium", "[analysis][element]") {
  const ElementProperties p = element_properties(test::test_section(), test::test_steel(), 4.0);
  const LocalLoads loads{{false, 0.5, 3.0, V(0, 0, -5e3), V(0, 0, -1e3)}, {true, 2.0, 2.0, V(0, 3e3, 0), V::Zero()}};
  EndReleases releases{};
  releases[1][ry] = releases[1][rz] = true;  // pinned end
  const CondensedElement c = condense_releases(local_stiffness(p), fixed_end_actions(p, loads), releases);
  CHECK(c.fixed_end(10) == Approx(0).margin(1e-9));
  CHECK(c.fixed_end(11) == Approx(0).margin(1e-9));
  // The end forces still balance the loads (the trapezoid and the point force).
  const V total = load_total(loads);
  const V forces = c.fixed_end.segment<3>(0) + c.fixed_end.segment<3>(6);
  CHECK((forces + total).norm() <= 1e-9 * total.norm());
  // Propped cantilever under the uniform part: the root moment equals w L^2 / 8 (Roark Table 8.1).
  const LocalLoads uniform{uniform_local_load(p.length, V(0, 0, -6e3))};
  const CondensedElement u = condense_releases(local_stiffness(p), fixed_end_actions(p, uniform), releases);
  CHECK(std::abs(u.fixed_end(4)) == Approx(6e3 * 16.0 / 8).epsilon(1e-12));
}

namespace {

// The test section with shear areas (so that Timoshenko terms take part).
Section section_with_shear_areas() {
  Section s = test::test_section();
  s.Avz = 2.5e-3;
  s.Avy = 1.5e-3;
  return s;
}

// Loads of every kind on an element of length 4.3 m: uniform, a partial trapezoid, a point force
// inside, a point force at the start with a partial load to the end, and none.
std::vector<LocalLoads> load_kinds() {
  return {
      {uniform_local_load(4.3, V(1e3, -2e3, -3e3))},
      {{false, 0.7, 3.1, V(0, 1e3, -2e3), V(5e2, 4e3, -8e3)}},
      {{true, 1.9, 1.9, V(-4e3, 2e3, -6e4), V::Zero()}},
      {{true, 0.0, 0.0, V(0, 0, -1e4), V::Zero()}, {false, 2.0, 4.3, V(0, 0, -3e3), V(0, 0, -1e3)}},
      {},
  };
}

}  // namespace

TEST_CASE("an element's own end displacements leave its released end actions zero and keep the rest",
          "[analysis][element]") {
  // k u + fixed_end vanishes at the released DOFs; the retained ones keep the nodes' values (the
  // definition in element_releases.hpp; a consistency test).
  const ElementProperties p = element_properties(test::test_section(), test::test_steel(), 4.0);
  const Matrix12d k = local_stiffness(p);
  const LocalLoads loads{{false, 0.5, 3.0, V(0, 0, -5e3), V(0, 0, -1e3)}, {true, 2.0, 2.0, V(0, 3e3, 0), V::Zero()}};
  const Vector12d fixed_end = fixed_end_actions(p, loads);
  Vector12d nodes;
  nodes << 1e-3, -2e-3, 4e-3, 1e-3, -3e-3, 2e-3, 2e-3, 1e-3, -1e-3, -2e-3, 1e-3, 3e-3;
  EndReleases pinned_end{}, pinned_both{}, torsion_and_end{};
  pinned_end[1][ry] = pinned_end[1][rz] = true;
  pinned_both[0][ry] = pinned_both[0][rz] = pinned_both[1][ry] = pinned_both[1][rz] = true;
  torsion_and_end[0][rx] = torsion_and_end[1][rz] = true;
  for (const EndReleases& releases : {EndReleases{}, pinned_end, pinned_both, torsion_and_end}) {
    const Vector12d u = element_end_displacements(k, fixed_end, releases, nodes);
    const Vector12d actions = k * u + fixed_end;
    for (int i = 0; i < 12; ++i) {
      INFO("DOF " << i);
      if (releases[static_cast<std::size_t>(i / 6)][static_cast<std::size_t>(i % 6)])
        CHECK(std::abs(actions(i)) <= 1e-9 * k.norm() * nodes.norm());
      else
        CHECK(u(i) == nodes(i));
    }
  }
}

TEST_CASE("fixed-end actions from a flexibility worked out once are the same numbers, bit for bit",
          "[analysis][element]") {
  // The recovery works each element's cantilever flexibility out once for every load result.
  const Section s = section_with_shear_areas();
  for (bool shear : {false, true}) {
    INFO("shear deformation " << shear);
    const ElementProperties p = element_properties(s, test::test_steel(), 4.3, shear);
    const CantileverFlexibility flexibility = cantilever_flexibility(p);
    for (const LocalLoads& loads : load_kinds()) {
      const Vector12d once = fixed_end_actions(p, loads, flexibility), afresh = fixed_end_actions(p, loads);
      CHECK(once == afresh);  // operator== compares every entry exactly
      if (!loads.empty()) CHECK(afresh.norm() > 0);
    }
  }
}

TEST_CASE("the state and forces at a point in one pass are the two functions' own, bit for bit",
          "[analysis][element]") {
  // The recovery evaluates both at every station with one pass over the loads (element_point_at).
  const Section s = section_with_shear_areas();
  for (bool shear : {false, true}) {
    INFO("shear deformation " << shear);
    const ElementProperties p = element_properties(s, test::test_steel(), 4.3, shear);
    const Vector6d d0 = (Vector6d() << 1e-3, -2e-3, 3e-4, 1e-4, -5e-4, 2e-4).finished();
    const Vector6d f0 = (Vector6d() << -2e5, 3e4, -1e4, 2e2, 4e4, -3e4).finished();
    const std::vector<LocalLoads> cases = load_kinds();
    for (std::size_t c = 0; c < cases.size(); ++c)
      for (double x : {0.0, 0.3, 0.7, 1.9, 2.0, 2.5, 3.1, 4.3}) {
        INFO("loads " << c << ", x = " << x);
        const ElementPoint point = element_point_at(p, d0, f0, cases[c], x);
        CHECK(point.state == element_state_at(p, d0, f0, cases[c], x));  // every entry exactly
        CHECK(point.forces == internal_forces_at(f0, cases[c], x));
      }
  }
}
