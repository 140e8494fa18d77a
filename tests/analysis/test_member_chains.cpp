// Members made of several elements: results joined along the member.
// Reference: simply supported beam under uniform load w, midspan deflection
// 5 w L^4 / (384 E I), deflected shape w x (L^3 - 2 L x^2 + x^3) / (24 E I) and
// midspan moment w L^2 / 8 (standard beam theory, common practice).

#include "frame_fixtures.hpp"
#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/solve.hpp"

#include "recovered_lines.hpp"

#include <catch2/catch.hpp>

#include <stdexcept>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

/// A 6 m simply supported beam drawn as one member of three 2 m elements (as
/// when two cross members land on it), under a uniform downward load w.
FrameModel three_element_beam(double w) {
  FrameModel model;
  model.nodes = {V(0, 0, 0), V(2, 0, 0), V(4, 0, 0), V(6, 0, 0)};
  model.sections = {test::test_section()};
  model.materials = {test::test_steel()};
  model.elements = {{{0, 1}, 0, 0, 0.0}, {{1, 2}, 0, 0, 0.0}, {{2, 3}, 0, 0, 0.0}};
  model.members = {Member{{0, 1, 2}}};
  model.supports = {test::support(0, {true, true, true, true, false, false}),
                    test::support(3, {false, true, true, false, false, false})};
  LoadCase lc;
  lc.name = "uniform";
  for (std::size_t e = 0; e < 3; ++e) lc.element_loads.push_back({e, V(0, 0, -w)});
  model.cases = {lc};
  return model;
}

}  // namespace

TEST_CASE("a member of three elements reports as one member") {
  const double L = 6.0, w = 4.5e3;
  const FrameModel model = three_element_beam(w);
  SolveOptions options;
  options.stations = 7;  // per element: the middle element's station 3 is at midspan
  const auto r = stepframe::testing::recovered(model, solve(model, options)).at(0);
  REQUIRE(r.elements.size() == 3);
  REQUIRE(r.members.size() == 1);
  const LineResult& member = r.members[0];
  REQUIRE(member.stations.size() == 21);  // both stations kept at the two inner nodes
  CHECK(member.stations.front().x == 0);
  CHECK(member.stations.back().x == Approx(L));
  CHECK(member.stations[10].x == Approx(L / 2));
  CHECK(member.stations[10].position.isApprox(V(L / 2, 0, 0)));

  const double EI = test::test_steel().E * test::test_section().Iy;
  const double delta = 5 * w * std::pow(L, 4) / (384 * EI);
  CHECK(member.max_local_deflection == Approx(delta).epsilon(1e-9));
  CHECK(member.max_local_deflection_at == Approx(L / 2));
  CHECK(member.stations[10].forces(4) == Approx(-w * L * L / 8).epsilon(1e-9));
  CHECK(member.max_abs_stress == Approx(w * L * L / 8 / test::test_section().Wy()).epsilon(1e-9));
  CHECK(member.start_forces(2) == Approx(-w * L / 2).epsilon(1e-9));
  CHECK(member.end_forces(2) == Approx(w * L / 2).epsilon(1e-9));
  // The middle element alone sees only the sag between x = 2 and 3 m, from the
  // deflected shape y(x) = w x (L^3 - 2 L x^2 + x^3) / (24 E I): y(3) - y(2) = 53 w / (24 E I).
  CHECK(r.elements[1].max_local_deflection == Approx(53 * w / (24 * EI)).epsilon(1e-9));

  // Checks speak of the member: one result, at midspan, over the whole length.
  const auto stress = check_stress(model, {&r}, 1.0);
  REQUIRE(stress.size() == 1);
  CHECK(stress[0].station == Approx(L / 2));
  const auto deflection = check_deflection(model, {&r}, {300.0});
  REQUIRE(deflection.size() == 1);
  CHECK(deflection[0].limit == Approx(L / 300));
  CHECK(deflection[0].utilisation == Approx(delta / (L / 300)).epsilon(1e-9));
}

TEST_CASE("member chains must be continuous and use each element once") {
  FrameModel model = three_element_beam(1e3);
  SECTION("a gap in the chain") {
    model.members = {Member{{0, 2}}, Member{{1}}};
    CHECK_THROWS_WITH(solve(model), Catch::Matchers::Contains("does not start where element 0 ends"));
  }
  SECTION("an element used twice") {
    model.members = {Member{{0, 1, 2}}, Member{{2}}};
    CHECK_THROWS_WITH(solve(model), Catch::Matchers::Contains("belongs to another member"));
  }
  SECTION("an element left out") {
    model.members = {Member{{0, 1}}};
    CHECK_THROWS_WITH(solve(model), Catch::Matchers::Contains("element 2 belongs to no member"));
  }
}
