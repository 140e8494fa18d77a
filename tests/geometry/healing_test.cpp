// build_wireframe healing and findings: T-junctions, near-miss gaps,
// duplicates and overlaps, zero-length edges, separate parts and named
// points, on the hand-written frame_healing_mm.stp (each fault is described
// beside its entity in the file) and on small frames built in memory.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"

#include "test_support.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;

namespace {

const std::filesystem::path data = STEPFRAME_TEST_DATA;

bool close(const Eigen::Vector3d& a, const Eigen::Vector3d& b) { return (a - b).norm() <= 1e-9 * std::max(1.0, b.norm()); }

using stepframe::geometry::test::edge;
using stepframe::geometry::test::member;
using stepframe::geometry::test::model_of;
using stepframe::geometry::test::with_code;

}  // namespace

TEST_CASE("the shed file: every fault is found, located and named by entity", "[wireframe][healing]") {
  const sg::StepModel model = sg::read_step(data / "frame_healing_mm.stp");
  REQUIRE(model.edges.size() == 10);
  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);  // 1 mm

  SECTION("the stub shorter than the tolerance is dropped") {
    const auto found = with_code(frame, "zero-length-edge");
    REQUIRE(found.size() == 1);
    CHECK(found[0]->entities == std::vector<std::string>{"#140"});
    REQUIRE(found[0]->at);
    CHECK(close(*found[0]->at, {6, 0, 0}));
    CHECK(std::none_of(frame.members.begin(), frame.members.end(),
                       [](const sg::WireMember& m) { return m.source.entity == "#140"; }));
  }
  SECTION("the post, the patch's ends and the named hoist point split the eaves beam") {
    // Beam #70 from (0,0,3) to (6,0,3) m: nodes at x = 0, 1, 2, 3, 4, 6 m.
    const sg::WireMember& beam = member(frame, "#70");
    REQUIRE(beam.nodes.size() == 6);
    const std::vector<double> xs{0, 1, 2, 3, 4, 6};
    for (std::size_t k = 0; k < xs.size(); ++k) CHECK(close(frame.nodes[beam.nodes[k]], {xs[k], 0, 3}));
    CHECK(sg::path_length(frame, beam) == Approx(6.0));
    // The post's top is the beam's node at x = 3 m.
    CHECK(member(frame, "#90").nodes.back() == beam.nodes[3]);
    const auto splits = with_code(frame, "member-split");
    REQUIRE(splits.size() == 3);  // post, and the patch's two ends; the point is a label
    CHECK(splits[0]->entities == std::vector<std::string>{"#70", "#90"});
    CHECK(splits[0]->severity == sg::Severity::info);
  }
  SECTION("near misses: the brace 20 mm below the beam, the outrigger 5 mm above the column") {
    const auto gaps = with_code(frame, "near-miss-gap");
    REQUIRE(gaps.size() == 2);
    CHECK(gaps[0]->entities == std::vector<std::string>{"#100", "#70"});
    CHECK(close(*gaps[0]->at, {4.5, 0, 2.98}));
    CHECK_THAT(gaps[0]->message, Catch::Contains("0.02 m"));
    CHECK(gaps[1]->entities == std::vector<std::string>{"#60", "#110"});
    CHECK_THAT(gaps[1]->message, Catch::Contains("0.005 m"));
    // Neither is joined.
    CHECK(std::find(member(frame, "#70").nodes.begin(), member(frame, "#70").nodes.end(),
                    member(frame, "#100").nodes.back()) == member(frame, "#70").nodes.end());
  }
  SECTION("the copy of column B is a duplicate; the patch overlaps the beam over 1 m") {
    const auto duplicates = with_code(frame, "duplicate-member");
    REQUIRE(duplicates.size() == 1);
    CHECK(duplicates[0]->entities == std::vector<std::string>{"#80", "#120"});
    CHECK(close(*duplicates[0]->at, {6, 0, 1.5}));
    const auto overlaps = with_code(frame, "overlapping-members");
    REQUIRE(overlaps.size() == 1);
    CHECK(overlaps[0]->entities == std::vector<std::string>{"#70", "#130"});
    CHECK(close(*overlaps[0]->at, {1.5, 0, 3}));
    CHECK_THAT(overlaps[0]->message, Catch::Contains("over 1 m"));
  }
  SECTION("the shed, the outrigger and the sign post are three parts") {
    const auto parts = with_code(frame, "disconnected-part");
    REQUIRE(parts.size() == 3);
    CHECK_THAT(parts[0]->message, Catch::Contains("7 members") && Catch::Contains("x 0 .. 6"));
    CHECK(parts[1]->entities == std::vector<std::string>{"#110"});
    CHECK(parts[2]->entities == std::vector<std::string>{"#150"});
    CHECK_THAT(parts[2]->message, Catch::Contains("1 members") && Catch::Contains("z 0 .. 2 m"));
    CHECK(close(*parts[2]->at, {10, 0, 1}));  // centre of its bounding box
  }
  SECTION("named and layered points label nodes; one off the frame is reported") {
    REQUIRE(frame.labels.size() == 3);
    CHECK(frame.labels[0].source.name == "BASE-A");
    CHECK(close(frame.nodes[frame.labels[0].node], {0, 0, 0}));
    CHECK(frame.labels[1].source.layers == std::vector<std::string>{"SUPPORTS"});
    CHECK(close(frame.nodes[frame.labels[1].node], {6, 0, 0}));
    CHECK(frame.labels[2].source.name == "HOIST");
    CHECK(frame.labels[2].node == member(frame, "#70").nodes[4]);
    const auto off = with_code(frame, "point-off-frame");
    REQUIRE(off.size() == 1);
    CHECK(off[0]->entities == std::vector<std::string>{"#1103"});
  }
  SECTION("nothing else is reported") {
    // 1 zero-length + 3 splits + 2 gaps + 1 duplicate + 1 overlap + 3 parts +
    // 1 point off the frame; every kept end point is exactly on its node.
    CHECK(frame.diagnostics.size() == 12);
    CHECK(with_code(frame, "endpoints-merged").empty());
  }
}

TEST_CASE("crossing members are not joined; a member ending on another splits it", "[wireframe][healing]") {
  constexpr double tol = 0.01;
  SECTION("an X of two braces crossing mid-way stays two members of one element") {
    const auto frame = sg::build_wireframe(
        model_of({edge({0, 0, 0}, {4, 0, 4}, "#1"), edge({4, 0, 0}, {0, 0, 4}, "#2")}), tol);
    CHECK(frame.nodes.size() == 4);
    CHECK(frame.members[0].nodes.size() == 2);
    CHECK(frame.members[1].nodes.size() == 2);
    CHECK(with_code(frame, "member-split").empty());
    CHECK(with_code(frame, "near-miss-gap").empty());
    // The crossing is reported once, at (2, 0, 2).
    const auto crossings = with_code(frame, "members-cross");
    REQUIRE(crossings.size() == 1);
    CHECK(crossings[0]->entities == std::vector<std::string>{"#1", "#2"});
    CHECK(close(*crossings[0]->at, {2, 0, 2}));
  }
  SECTION("an end within the tolerance of a member's middle splits it there") {
    // #2 ends 0.6 tolerance beside #1 at x = 1.5: within tolerance, so joined.
    const auto frame = sg::build_wireframe(
        model_of({edge({0, 0, 0}, {3, 0, 0}, "#1"), edge({1.5, 0.006, 2}, {1.5, 0.006, 0}, "#2")}), tol);
    REQUIRE(frame.members[0].nodes.size() == 3);
    CHECK(frame.members[0].nodes[1] == frame.members[1].nodes[1]);
    // The node is the landing end point itself, not its foot on the member.
    CHECK(close(frame.nodes[frame.members[0].nodes[1]], {1.5, 0.006, 0}));
  }
  SECTION("an end 1.5 tolerance away is a near miss, not a joint") {
    const auto frame = sg::build_wireframe(
        model_of({edge({0, 0, 0}, {3, 0, 0}, "#1"), edge({1.5, 0.015, 2}, {1.5, 0.015, 0}, "#2")}), tol);
    CHECK(frame.members[0].nodes.size() == 2);
    const auto gaps = with_code(frame, "near-miss-gap");
    REQUIRE(gaps.size() == 1);
    CHECK(gaps[0]->entities == std::vector<std::string>{"#2", "#1"});
    CHECK_THAT(gaps[0]->message, Catch::Contains("0.015 m"));
  }
  SECTION("an end 60 tolerances away is neither") {
    const auto frame = sg::build_wireframe(
        model_of({edge({0, 0, 0}, {3, 0, 0}, "#1"), edge({1.5, 0.6, 2}, {1.5, 0.6, 0}, "#2")}), tol);
    CHECK(with_code(frame, "near-miss-gap").empty());
    CHECK(with_code(frame, "disconnected-part").size() == 2);
  }
  SECTION("a member landing on a curved member splits it between its divisions") {
    // A quarter circle of radius 2 m about the origin from (2,0,0) to (0,2,0),
    // sampled every 0.05 degree, and a post ending on it at 45 degrees.
    sg::WireEdge arc = edge({2, 0, 0}, {0, 2, 0}, "#10");
    const int samples = 1800;
    for (int i = 0; i <= samples; ++i) {
      const double t = std::numbers::pi / 2 * i / samples;
      arc.curve.push_back({Eigen::Vector3d(2 * std::cos(t), 2 * std::sin(t), 0), t});
    }
    const Eigen::Vector3d on_arc(std::sqrt(2.0), std::sqrt(2.0), 0);
    const auto frame = sg::build_wireframe(model_of({arc, edge(on_arc + Eigen::Vector3d(0, 0, 1), on_arc, "#11")}), tol);
    const auto& path = frame.members[0].nodes;
    // 45 / 5 = 9 elements each side of the junction.
    REQUIRE(path.size() == 19);
    CHECK(path[9] == frame.members[1].nodes.back());
    for (const std::size_t n : path) CHECK(frame.nodes[n].norm() == Approx(2.0).epsilon(1e-6));
  }
}
