// Input checking and progress reporting of solve(). These check behaviour
// the interface promises (solve.hpp, model_validation.hpp); no published
// reference applies.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/solve.hpp"

#include "recovered_lines.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using Catch::Matchers::Contains;
using V = Eigen::Vector3d;

namespace {

FrameModel two_member_cantilever() {
  FrameModel model = test::single_member(V(0, 0, 0), V(2, 0, 0));
  model.nodes.push_back(V(4, 0, 0));
  model.elements.push_back(FrameElement{{1, 2}, 0, 0, 0});
  model.supports = {test::support(0, test::fixed_all)};
  LoadCase lc;
  lc.name = "tip";
  lc.node_loads = {NodeLoad{2, V(0, 0, -1e3), V::Zero()}};
  model.cases = {lc};
  return model;
}

}  // namespace

TEST_CASE("invalid models are rejected with the member named", "[analysis][validation]") {
  REQUIRE_NOTHROW(solve(two_member_cantilever()));

  FrameModel m = two_member_cantilever();
  m.elements[1].nodes[1] = 7;
  CHECK_THROWS_WITH(solve(m), Contains("member 1") && Contains("node 7"));

  m = two_member_cantilever();
  m.elements[1].section = 3;
  CHECK_THROWS_WITH(solve(m), Contains("member 1") && Contains("section 3"));

  m = two_member_cantilever();
  m.elements[0].material = 2;
  CHECK_THROWS_WITH(solve(m), Contains("member 0") && Contains("material 2"));

  m = two_member_cantilever();
  m.nodes[2] = m.nodes[1];
  CHECK_THROWS_WITH(solve(m), Contains("member 1") && Contains("zero length"));

  for (double Section::*field : {&Section::A, &Section::Iy, &Section::Iz, &Section::J, &Section::depth}) {
    m = two_member_cantilever();
    m.sections[0].*field = 0;
    CHECK_THROWS_AS(solve(m), std::invalid_argument);
    CHECK_THROWS_WITH(solve(m), Contains("member 0") && Contains("TEST-I"));
  }
  m = two_member_cantilever();
  m.materials[0].G = -1;
  CHECK_THROWS_WITH(solve(m), Contains("member 0") && Contains("shear modulus"));

  m = two_member_cantilever();
  m.cases[0].element_loads = {ElementUniformLoad{5, V(0, 0, -1)}};
  CHECK_THROWS_WITH(solve(m), Contains("member 5") && Contains("tip"));

  m = two_member_cantilever();
  m.combinations = {Combination{"ULS", {{0, 1.35}, {4, 1.5}}}};
  CHECK_THROWS_WITH(solve(m), Contains("ULS") && Contains("load case 4"));

  SolveOptions one_station;
  one_station.stations = 1;
  CHECK_THROWS_AS(solve(two_member_cantilever(), one_station), std::invalid_argument);
}

TEST_CASE("progress names each stage in order and never goes back within one", "[analysis][progress]") {
  std::vector<std::pair<std::string, double>> seen;
  SolveOptions options;
  options.progress = [&](std::string_view stage, double f) { seen.emplace_back(stage, f); };
  FrameModel model = two_member_cantilever();
  model.combinations = {Combination{"twice", {{0, 2.0}}}};
  const auto results = solve(model, options);
  REQUIRE(results.size() == 2);
  std::vector<std::string> stages;
  for (std::size_t i = 0; i < seen.size(); ++i) {
    if (stages.empty() || stages.back() != seen[i].first) {
      stages.push_back(seen[i].first);
      CHECK(seen[i].second == 0.0);  // a stage starts at 0
    } else {
      CHECK(seen[i].second >= seen[i - 1].second);
    }
  }
  CHECK(stages == std::vector<std::string>{"assembly", "factorisation", "recovery", "buckling"});
}

TEST_CASE("results come in model order: cases, then combinations", "[analysis][solve]") {
  FrameModel model = two_member_cantilever();
  LoadCase second = model.cases[0];
  second.name = "tip doubled";
  second.node_loads[0].force *= 2;
  model.cases.push_back(second);
  model.combinations = {Combination{"sum", {{0, 1.0}, {1, 1.0}}}};
  SolveOptions options;
  options.stations = 5;
  const auto results = stepframe::testing::recovered(model, solve(model, options));
  REQUIRE(results.size() == 3);
  CHECK(results[0].name == "tip");
  CHECK(results[1].name == "tip doubled");
  CHECK(results[2].name == "sum");
  CHECK(results[2].is_combination);
  for (const auto& r : results) {
    CHECK(r.displacements.size() == 18);
    CHECK(r.reactions.size() == 18);
    REQUIRE(r.elements.size() == 2);
    CHECK(r.elements[0].stations.size() == 5);
    CHECK(r.elements[0].stations.front().x == 0.0);
    CHECK(r.elements[0].stations.back().x == 2.0);
  }
  CHECK(results[1].displacements(14) == Approx(2 * results[0].displacements(14)).epsilon(1e-12));
}
