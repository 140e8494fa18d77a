// Deflection, drift and frame-stability checks on small frames with closed-form answers.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/solve.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using Catch::Matchers::Contains;
using V = Eigen::Vector3d;

TEST_CASE("a cantilever is checked by its tip against twice its length") {
  // Tip deflection P L^3 / (3 E I) of a cantilever with an end load (standard beam theory, common practice).
  const double L = 2.0, P = 5e3;
  FrameModel model = test::single_member(V(0, 0, 3), V(L, 0, 3));
  model.supports = {test::support(0, test::fixed_all)};
  LoadCase lc;
  lc.name = "P";
  lc.node_loads = {{1, V(0, 0, -P), V::Zero()}};
  model.cases = {lc};
  const auto results = solve(model);
  const auto checks = check_deflection(model, {&results[0]}, {250.0});
  REQUIRE(checks.size() == 1);
  const double tip = P * L * L * L / (3 * test::test_steel().E * test::test_section().Iy);
  CHECK(checks[0].value == Approx(tip).epsilon(1e-9));
  CHECK(checks[0].limit == Approx(2 * L / 250));
  CHECK(checks[0].station == Approx(L));
  CHECK_THAT(checks[0].clause, Contains("cantilever"));
}

TEST_CASE("storey drift of a portal's columns") {
  // Fixed-base portal with a rigid-enough beam: the columns' tops sway together; the check
  // compares each column's top-minus-bottom horizontal displacement with h / ratio.
  FrameModel model;
  const double h = 3.0;
  model.nodes = {V(0, 0, 0), V(0, 0, h), V(4, 0, h), V(4, 0, 0)};
  model.sections = {test::test_section()};
  model.materials = {test::test_steel()};
  model.elements = {{{0, 1}, 0, 0, 0.0}, {{1, 2}, 0, 0, 0.0}, {{3, 2}, 0, 0, 0.0}};
  model.supports = {test::support(0, test::fixed_all), test::support(3, test::fixed_all)};
  LoadCase lc;
  lc.name = "H";
  lc.node_loads = {{1, V(10e3, 0, 0), V::Zero()}};
  model.cases = {lc};
  const auto results = solve(model);
  const auto drift = check_drift(model, {&results[0]}, 300.0);
  REQUIRE(drift.size() == 2);  // the two columns, not the beam
  const double sway = results[0].displacements(6 * 1 + 0);
  CHECK(drift[0].value == Approx(std::abs(sway)).epsilon(1e-9));
  CHECK(drift[0].limit == Approx(h / 300));
  CHECK(drift[0].utilisation == Approx(std::abs(sway) / (h / 300)).epsilon(1e-9));
}

TEST_CASE("frame stability asks for alpha_cr >= 10 at first order") {
  LoadResult first, second;
  first.name = "ULS-1";
  first.alpha_cr = 8.0;
  second.name = "ULS-2";
  second.alpha_cr = 8.0;
  second.second_order = true;
  const auto checks = check_frame_stability({&first, &second}, 10.0);
  REQUIRE(checks.size() == 2);
  CHECK(checks[0].member == whole_frame);
  CHECK(checks[0].utilisation == Approx(10.0 / 8.0));  // EN 1993-1-1 5.2.1(3)
  CHECK_FALSE(checks[0].pass);
  CHECK(checks[1].pass);  // P-Delta results already carry the amplification
  CHECK(checks[1].utilisation == Approx(1.0 / 8.0));
}
