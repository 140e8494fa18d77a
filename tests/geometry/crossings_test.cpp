// Members whose centrelines cross away from their ends: reported and left
// apart by default, joined at one node with WireframeOptions::join_crossings.
// On the hand-written x_braced_wall_mm.stp (its header describes each brace)
// and on frames built in memory.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"

#include "test_support.hpp"

#include <catch2/catch.hpp>

#include <Eigen/Geometry>

#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;
using sg::test::edge;
using sg::test::member;
using sg::test::model_of;
using sg::test::with_code;

namespace {

const std::filesystem::path data = STEPFRAME_TEST_DATA;

sg::Wireframe wall(double tolerance, bool join) {
  sg::WireframeOptions options;
  options.merge_tolerance = tolerance;
  if (join) options.join_crossings = sg::join_all_crossings;
  return sg::build_wireframe(sg::read_step(data / "x_braced_wall_mm.stp"), options);
}

// Shortest distance between the lines p1 + s d1 and p2 + t d2 that are not
// parallel: |(p2 - p1) . (d1 x d2)| / |d1 x d2| (analytic geometry of skew lines).
double skew_distance(const Eigen::Vector3d& p1, const Eigen::Vector3d& d1, const Eigen::Vector3d& p2,
                     const Eigen::Vector3d& d2) {
  const Eigen::Vector3d n = d1.cross(d2);
  return std::abs((p2 - p1).dot(n)) / n.norm();
}

}  // namespace

TEST_CASE("the braced wall: crossings are reported, not joined, by default", "[wireframe][crossings]") {
  // The second bay's braces are 0.6 mm apart (see the file's header), by the skew-line distance.
  const double apart = skew_distance({5, 0, 0}, {5, 0.0012, 4}, {10, 0, 0}, {-5, 0, 4});
  REQUIRE(apart == Approx(0.0006).epsilon(1e-3));

  const sg::Wireframe frame = wall(1e-3, false);
  CHECK(frame.members.size() == 9);
  CHECK(frame.nodes.size() == 6);
  for (const char* brace : {"#201", "#202", "#203", "#204"}) CHECK(member(frame, brace).nodes.size() == 2);
  const auto crossings = with_code(frame, "members-cross");
  REQUIRE(crossings.size() == 2);
  CHECK(crossings[0]->severity == sg::Severity::info);
  CHECK(crossings[0]->entities == std::vector<std::string>{"#201", "#202"});
  REQUIRE(crossings[0]->at);
  CHECK((*crossings[0]->at - Eigen::Vector3d(2.5, 0, 2)).norm() < 1e-9);
  CHECK_THAT(crossings[0]->message, Catch::Contains("#201 ('brace 1 up')") && Catch::Contains("#202") &&
                                        Catch::Contains("(2.5, 0, 2) m") && Catch::Contains("join_crossings"));
  CHECK(crossings[1]->entities == std::vector<std::string>{"#203", "#204"});
  // Midway between the nearest points, 0.6 mm apart in y around y = 0.3 mm.
  REQUIRE(crossings[1]->at);
  CHECK((*crossings[1]->at - Eigen::Vector3d(7.5, 0.0003, 2)).norm() < 1e-6);
  CHECK(with_code(frame, "member-split").empty());
  CHECK(with_code(frame, "disconnected-part").empty());

  // With a 0.5 mm tolerance the second bay's braces pass by: only the first bay crosses.
  const sg::Wireframe finer = wall(0.5e-3, false);
  const auto finer_crossings = with_code(finer, "members-cross");
  REQUIRE(finer_crossings.size() == 1);
  CHECK(finer_crossings[0]->entities == std::vector<std::string>{"#201", "#202"});
}

TEST_CASE("the braced wall: join_crossings splits both braces at one node", "[wireframe][crossings]") {
  const sg::Wireframe frame = wall(1e-3, true);
  // Each brace stays one member, now of two elements through the crossing node.
  CHECK(frame.members.size() == 9);
  CHECK(frame.nodes.size() == 8);
  CHECK(with_code(frame, "members-cross").empty());
  CHECK(with_code(frame, "crossing-joined").size() == 2);
  for (const auto& [up, down, at] : {std::tuple{"#201", "#202", Eigen::Vector3d(2.5, 0, 2)},
                                     std::tuple{"#203", "#204", Eigen::Vector3d(7.5, 0.0003, 2)}}) {
    CAPTURE(up);
    const sg::WireMember& one = member(frame, up);
    const sg::WireMember& two = member(frame, down);
    REQUIRE(one.nodes.size() == 3);
    REQUIRE(two.nodes.size() == 3);
    CHECK(one.nodes[1] == two.nodes[1]);
    CHECK((frame.nodes[one.nodes[1]] - at).norm() < 1e-6);
    // The cut lengths are the braces' own: sqrt(5^2 + 4^2) m (the lean adds 0.14 um).
    CHECK(sg::path_length(frame, one) == Approx(std::sqrt(41.0)).margin(1e-6));
  }
  CHECK(with_code(frame, "disconnected-part").empty());
}

TEST_CASE("what is not a crossing", "[wireframe][crossings]") {
  constexpr double tol = 1e-3;
  SECTION("members meeting end to end, or one ending on another") {
    const auto frame = sg::build_wireframe(model_of({edge({0, 0, 0}, {4, 0, 0}, "#1"), edge({4, 0, 0}, {4, 3, 0}, "#2"),
                                                     edge({2, 0, 0}, {2, 3, 0}, "#3")}),
                                           tol);
    CHECK(with_code(frame, "members-cross").empty());
    CHECK(with_code(frame, "member-split").size() == 1);
  }
  SECTION("a third member ending at the crossing has joined them already") {
    const auto frame = sg::build_wireframe(model_of({edge({0, 0, 0}, {4, 0, 4}, "#1"), edge({4, 0, 0}, {0, 0, 4}, "#2"),
                                                     edge({2, 0, 2}, {2, 0, 6}, "#3")}),
                                           tol);
    CHECK(with_code(frame, "members-cross").empty());
    CHECK(frame.members[0].nodes[1] == frame.members[1].nodes[1]);
  }
  SECTION("parallel members alongside each other, and skew ones passing 2 tolerances apart") {
    const auto frame = sg::build_wireframe(model_of({edge({0, 0, 0}, {4, 0, 0}, "#1"), edge({0, 0.0005, 0}, {4, 0.0005, 0}, "#2"),
                                                     edge({2, -1, 0.002}, {2, 1, 0.002}, "#3")}),
                                           tol);
    CHECK(with_code(frame, "members-cross").empty());
  }
}

TEST_CASE("a grid of long members finds every crossing, once", "[wireframe][crossings]") {
  // 15 members along x at y = 0..14 and 15 along y at x = 0..14, each
  // overhanging by 1 m: 225 crossings at the integer points, none at an end,
  // found through cells much shorter than the members (the median of a few
  // short members elsewhere sets the cell size).
  std::vector<sg::WireEdge> edges;
  for (int i = 0; i < 15; ++i) {
    edges.push_back(edge({-1, double(i), 0}, {15, double(i), 0}, "#x" + std::to_string(i)));
    edges.push_back(edge({double(i), -1, 0}, {double(i), 15, 0}, "#y" + std::to_string(i)));
  }
  for (int k = 0; k < 40; ++k) edges.push_back(edge({100.0 + k, 0, 0}, {100.5 + k, 0, 0}, "#s" + std::to_string(k)));
  sg::WireframeOptions options;
  options.merge_tolerance = 1e-3;
  const auto reported = sg::build_wireframe(model_of(edges), options);
  // One finding per pair of members: each x member crosses each y member once.
  CHECK(with_code(reported, "members-cross").size() == 225);
  options.join_crossings = sg::join_all_crossings;
  const auto joined = sg::build_wireframe(model_of(edges), options);
  CHECK(with_code(joined, "crossing-joined").size() == 225);
  CHECK(joined.members.size() == 70);
  for (std::size_t m = 0; m < 30; ++m) CHECK(joined.members[m].nodes.size() == 17);
  // 60 member ends, 225 crossings, 80 ends of the short members.
  CHECK(joined.nodes.size() == 60 + 225 + 80);
}

TEST_CASE("fuzz finding: a member a billion times longer than the others is handled without bucketing it",
          "[wireframe][crossings]") {
  // fuzz_c_api_text trimmed one line of the demo platform at 1.5E+14 mm: cutting that member into cells of
  // the typical member's length needed some 1e11 cells and the run ran out of memory. Segments that long are
  // now compared with every other segment instead (spatial_grid.hpp, max_cells_per_segment); the crossings
  // and junctions found are the same as for any other member.
  const sg::StepModel model = model_of({
      edge({0, 0, 0}, {1, 0, 0}, "#1"),
      edge({0.5, -0.5, 0}, {0.5, 0.5, 0}, "#2"),        // crosses #1
      edge({0, 2, 0}, {1e9, 2, 0}, "#3"),               // the long one
      edge({3, 1, 0}, {3, 3, 0}, "#4"),                 // crosses #3
      edge({5, 0, 0}, {5, 2, 0}, "#5"),                 // ends on #3: splits it
      edge({1e8, -1e8, 0}, {1e8, 1e8, 0}, "#6"),        // another long one, crossing #3
  });
  sg::WireframeOptions options;
  options.merge_tolerance = 1e-3;
  const sg::Wireframe frame = sg::build_wireframe(model, options);
  const auto crossings = with_code(frame, "members-cross");
  std::vector<std::vector<std::string>> pairs;
  for (const auto* c : crossings) pairs.push_back(c->entities);
  std::sort(pairs.begin(), pairs.end());
  CHECK(pairs == std::vector<std::vector<std::string>>{{"#1", "#2"}, {"#3", "#4"}, {"#3", "#6"}});
  // #3 gets a node where #5 ends on it; nothing else is split.
  CHECK(member(frame, "#3").nodes.size() == 3);
  CHECK(with_code(frame, "member-split").size() == 1);
}
