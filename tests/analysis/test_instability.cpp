// Mechanisms: a frame that can move without straining must be rejected with
// a message naming the node and the free direction (a singular stiffness
// matrix has no unique solution; common practice).

#include "frame_fixtures.hpp"
#include "stepframe/analysis/solve.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using Catch::Matchers::Contains;
using V = Eigen::Vector3d;

namespace {

FrameModel simply_supported(bool restrain_torsion) {
  FrameModel model = test::single_member(V(1, 0, 3.5), V(7, 0, 3.5));
  model.supports = {test::support(0, {true, true, true, restrain_torsion, false, false}),
                    test::support(1, {false, true, true, false, false, false})};
  LoadCase lc;
  lc.name = "uniform";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -2e3)}};
  model.cases = {lc};
  return model;
}

}  // namespace

TEST_CASE("beam free to spin about its own axis is unstable in rx", "[analysis][stability]") {
  REQUIRE_NOTHROW(solve(simply_supported(true)));
  const FrameModel model = simply_supported(false);
  try {
    solve(model);
    FAIL("an unrestrained torsional mode was not detected");
  } catch (const UnstableFrame& e) {
    INFO(e.what());
    REQUIRE(e.free_directions.size() == 1);
    const FreeDirection f = e.free_directions[0];
    CHECK(f.dof == rx);
    CHECK(f.node <= 1);
    CHECK_THAT(e.what(), Contains("can move freely in rx"));
    CHECK_THAT(e.what(), Contains("node " + std::to_string(f.node) + " at (" + (f.node == 0 ? "1.000" : "7.000") +
                                  ", 0.000, 3.500) m"));
  }
}

TEST_CASE("a node that no member reaches is named with all six directions", "[analysis][stability]") {
  FrameModel model = simply_supported(true);
  model.nodes.push_back(V(2, 2, 0));  // node 2: stray
  try {
    solve(model);
    FAIL("a stray node was not detected");
  } catch (const UnstableFrame& e) {
    INFO(e.what());
    REQUIRE(e.free_directions.size() == 6);
    for (int d = 0; d < 6; ++d) {
      CHECK(e.free_directions[static_cast<std::size_t>(d)].node == 2);
      CHECK(e.free_directions[static_cast<std::size_t>(d)].dof == d);
    }
    CHECK_THAT(e.what(), Contains("node 2 at (2.000, 2.000, 0.000) m can move freely in ux"));
    CHECK_THAT(e.what(), Contains("rz"));
  }
}

TEST_CASE("portal frame on two pins can topple about the line through them", "[analysis][stability]") {
  // Bases fixed in translation only: the whole portal can rotate as a rigid
  // body about the X line through the two pins, one mechanism.
  FrameModel model;
  model.nodes = {V(0, 0, 0), V(0, 0, 3), V(4, 0, 3), V(4, 0, 0)};
  model.sections = {test::test_section()};
  model.materials = {test::test_steel()};
  model.elements = {FrameElement{{0, 1}, 0, 0, 0}, FrameElement{{1, 2}, 0, 0, 0}, FrameElement{{3, 2}, 0, 0, 0}};
  model.supports = {test::support(0, {true, true, true, false, false, false}),
                    test::support(3, {true, true, true, false, false, false})};
  LoadCase lc;
  lc.name = "side";
  lc.node_loads = {NodeLoad{1, V(1e3, 0, 0), V::Zero()}};
  model.cases = {lc};
  try {
    solve(model);
    FAIL("the toppling mode was not detected");
  } catch (const UnstableFrame& e) {
    INFO(e.what());
    CHECK(e.free_directions.size() == 1);
    CHECK_THAT(e.what(), Contains("can move freely in"));
  }
  // Fixing one base in every direction makes it a stable (if flexible) frame.
  model.supports[0].fixed = test::fixed_all;
  REQUIRE_NOTHROW(solve(model));
}

TEST_CASE("a frame without supports is rejected", "[analysis][stability]") {
  FrameModel model = simply_supported(true);
  model.supports.clear();
  REQUIRE_THROWS_AS(solve(model), UnstableFrame);
  model.supports = {test::support(0, {})};  // a support that fixes nothing
  CHECK_THROWS_WITH(solve(model), Contains("no supports"));
}
