// Sway imperfections of EN 1993-1-1 5.3.2 against hand calculations with the
// clause's own formulas: phi = phi_0 alpha_h alpha_m (5.5), the equivalent
// horizontal forces phi N_Ed of 5.3.2(7) and the exemption of 5.3.2(4).

#include "frame_fixtures.hpp"
#include "stepframe/analysis/solve.hpp"
#include "stepframe/analysis/sway_imperfection.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <map>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

/// A portal in the XZ plane: columns 4 m high at x = 0 and x = 6 m, fixed at their feet, a beam between their
/// tops (nodes 1 and 2); 100 kN down on each top and `push` along X on node 1.
FrameModel portal(double push = 0) {
  FrameModel model;
  model.nodes = {{0, 0, 0}, {0, 0, 4}, {6, 0, 4}, {6, 0, 0}};
  model.sections = {test::test_section()};
  model.materials = {test::test_steel()};
  model.elements = {{{0, 1}, 0, 0, 0.0}, {{1, 2}, 0, 0, 0.0}, {{3, 2}, 0, 0, 0.0}};
  model.supports = {test::support(0, test::fixed_all), test::support(3, test::fixed_all)};
  LoadCase lc;
  lc.name = "G";
  lc.node_loads = {{1, V(push, 0, -100e3), V::Zero()}, {2, V(0, 0, -100e3), V::Zero()}};
  model.cases = {lc};
  return model;
}

std::map<std::size_t, V> forces_by_node(const SwayImperfection& s) {
  std::map<std::size_t, V> out;
  for (const auto& f : s.forces) out.try_emplace(f.node, V::Zero()).first->second += f.force;
  return out;
}

}  // namespace

TEST_CASE("alpha_h and alpha_m of EN 1993-1-1 5.3.2(3)") {
  // (5.5): alpha_h = 2 / sqrt(h) within [2/3, 1]; alpha_m = sqrt(0.5 (1 + 1/m)).
  CHECK(height_reduction(4.0) == Approx(1.0));
  CHECK(height_reduction(2.0) == Approx(1.0));       // 2/sqrt(2) = 1.41, capped at 1
  CHECK(height_reduction(6.25) == Approx(0.8));
  CHECK(height_reduction(9.0) == Approx(2.0 / 3.0));
  CHECK(height_reduction(25.0) == Approx(2.0 / 3.0));  // 0.4, raised to 2/3
  CHECK(column_reduction(1) == Approx(1.0));
  CHECK(column_reduction(2) == Approx(std::sqrt(0.75)));
  CHECK(column_reduction(4) == Approx(std::sqrt(0.625)));
  CHECK(basic_sway == Approx(0.005));
}

TEST_CASE("equivalent horizontal forces of a portal frame (5.3.2(7))") {
  const FrameModel model = portal();
  const auto results = solve(model);
  const auto both = sway_imperfections(model, results[0]);
  const SwayImperfection& x = both[0];
  const SwayImperfection& y = both[1];
  // h = 4 m: alpha_h = 1. Along X both columns stand in one row and carry 100 kN each: m = 2,
  // phi = 0.005 x 1 x sqrt(0.75) = 0.00433. Along Y each column is a row of its own: m = 1, phi = 0.005.
  CHECK(x.height == Approx(4.0));
  CHECK(x.columns == 2);
  CHECK(x.phi == Approx(0.005 * std::sqrt(0.75)));
  CHECK(y.columns == 1);
  CHECK(y.phi == Approx(0.005));
  // No horizontal load: H_Ed = 0 < 0.15 V_Ed = 30 kN, so neither direction is exempt.
  CHECK(x.V_Ed == Approx(200e3));
  CHECK(x.H_Ed == Approx(0).margin(1e-6));
  CHECK_FALSE(x.exempt);
  CHECK_FALSE(y.exempt);
  // phi N_Ed at each column top along the axis and back at its foot (N_Ed = 100 kN in each column).
  const auto fx = forces_by_node(x);
  const double h = x.phi * 100e3;
  CHECK(fx.at(1).x() == Approx(h));
  CHECK(fx.at(2).x() == Approx(h));
  CHECK(fx.at(0).x() == Approx(-h));
  CHECK(fx.at(3).x() == Approx(-h));
  CHECK(fx.at(1).tail<2>().norm() == 0.0);
  const auto fy = forces_by_node(y);
  CHECK(fy.at(2).y() == Approx(0.005 * 100e3));
  CHECK(fy.at(2).x() == 0.0);
}

TEST_CASE("a storey level receives phi times the vertical load its columns bring down") {
  // Two stacked 3 m column elements (one CAD column through a floor at z = 3): 50 kN on the top, 80 kN at
  // the floor. Upper element N = 50 kN, lower 130 kN: the floor node gets phi (130 - 50) = phi x 80 kN,
  // the top phi x 50 kN, the foot -phi x 130 kN (the closed system of 5.3.2(7)).
  FrameModel model;
  model.nodes = {{0, 0, 0}, {0, 0, 3}, {0, 0, 6}};
  model.sections = {test::test_section()};
  model.materials = {test::test_steel()};
  model.elements = {{{0, 1}, 0, 0, 0.0}, {{1, 2}, 0, 0, 0.0}};
  model.supports = {test::support(0, test::fixed_all)};
  LoadCase lc;
  lc.name = "G";
  lc.node_loads = {{2, V(0, 0, -50e3), V::Zero()}, {1, V(0, 0, -80e3), V::Zero()}};
  model.cases = {lc};
  const auto results = solve(model);
  const SwayImperfection x = sway_imperfections(model, results[0])[0];
  // h = 6 m: alpha_h = 2 / sqrt(6) = 0.8165; one column: alpha_m = 1.
  CHECK(x.phi == Approx(0.005 * 2 / std::sqrt(6.0)));
  const auto f = forces_by_node(x);
  CHECK(f.at(2).x() == Approx(x.phi * 50e3));
  CHECK(f.at(1).x() == Approx(x.phi * 80e3));
  CHECK(f.at(0).x() == Approx(-x.phi * 130e3));
}

TEST_CASE("5.3.2(4): a direction with H_Ed >= 0.15 V_Ed is exempt; phi may be set") {
  // 31 kN along X against V_Ed = 200 kN: 31 >= 0.15 x 200 = 30, X exempt; nothing along Y.
  const FrameModel pushed = portal(31e3);
  const auto results = solve(pushed);
  const auto both = sway_imperfections(pushed, results[0]);
  CHECK(both[0].H_Ed == Approx(31e3));
  CHECK(both[0].exempt);
  CHECK_FALSE(both[1].exempt);
  const FrameModel barely = portal(29e3);  // 29 < 30: not exempt
  CHECK_FALSE(sway_imperfections(barely, solve(barely)[0])[0].exempt);
  // The project's own phi replaces phi_0 alpha_h alpha_m.
  const auto own = sway_imperfections(pushed, results[0], 1.0 / 300);
  CHECK(own[0].phi == Approx(1.0 / 300));
  CHECK(own[1].phi == Approx(1.0 / 300));
}
