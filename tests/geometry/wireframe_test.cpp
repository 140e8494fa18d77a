// build_wireframe: end points merged into nodes within a tolerance, with the
// edges that collapse or repeat reported.

#include "stepframe/geometry/wireframe.hpp"

#include "test_support.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;

namespace {

using stepframe::geometry::test::edge;
using stepframe::geometry::test::model_of;

std::size_t count_code(const sg::Wireframe& frame, const std::string& code) {
  std::size_t n = 0;
  for (const auto& d : frame.diagnostics) n += d.code == code ? 1 : 0;
  return n;
}

constexpr double tol = 0.01;  // m

}  // namespace

TEST_CASE("end points closer than the tolerance share a node, farther ones do not", "[wireframe]") {
  // Gaps are chosen as fractions of the tolerance, so the expected outcome
  // follows from the definition of the merge alone.
  SECTION("a gap of 0.4 tolerance is closed, and the node stays at the first point seen") {
    const auto frame = sg::build_wireframe(
        model_of({edge({0, 0, 0}, {1, 0, 0}, "#1"), edge({1 + 0.4 * tol, 0, 0}, {1, 1, 0}, "#2")}), tol);
    REQUIRE(frame.nodes.size() == 3);
    REQUIRE(frame.members.size() == 2);
    CHECK(frame.members[0].nodes == std::vector<std::size_t>{0, 1});
    CHECK(frame.members[1].nodes == std::vector<std::size_t>{1, 2});
    CHECK(frame.nodes[1].isApprox(Eigen::Vector3d(1, 0, 0)));
    // The only finding is the note that #2's start was moved by 0.4 tolerance.
    REQUIRE(frame.diagnostics.size() == 1);
    CHECK(frame.diagnostics[0].code == "endpoints-merged");
    CHECK(frame.diagnostics[0].severity == sg::Severity::info);
    CHECK(frame.diagnostics[0].entities == std::vector<std::string>{"#2"});
    CHECK_THAT(frame.diagnostics[0].message, Catch::Contains("0.004 m"));
  }
  SECTION("a gap of 1.5 tolerance stays open") {
    const auto frame = sg::build_wireframe(
        model_of({edge({0, 0, 0}, {1, 0, 0}, "#1"), edge({1 + 1.5 * tol, 0, 0}, {1, 1, 0}, "#2")}), tol);
    CHECK(frame.nodes.size() == 4);
    CHECK(frame.members[1].nodes == std::vector<std::size_t>{2, 3});
  }
  SECTION("points on either side of a grid cell corner still merge") {
    // 0.0099 and 0.0101 lie in different cells along every axis (cell = tol).
    const Eigen::Vector3d a(0.0099, 0.0099, 0.0099), b(0.0101, 0.0101, 0.0101);
    const auto frame =
        sg::build_wireframe(model_of({edge({-1, -1, -1}, a, "#1"), edge(b, {1, 1, 1}, "#2")}), tol);
    CHECK(frame.nodes.size() == 3);
    CHECK(frame.members[1].nodes[0] == frame.members[0].nodes[1]);
  }
  SECTION("a point within tolerance of two nodes joins the nearer") {
    const auto frame = sg::build_wireframe(model_of({edge({0, 0, 0}, {0, 0, 1}, "#1"),
                                                     edge({0.016, 0, 0}, {0.016, 0, 1}, "#2"),
                                                     edge({0.010, 0, 0}, {0.010, 1, 0}, "#3")}),
                                           tol);
    // (0.010, 0, 0) is 0.010 from node 0 and 0.006 from node 2.
    CHECK(frame.members[2].nodes[0] == 2);
  }
}

TEST_CASE("an edge whose ends merge into one node is dropped and reported", "[wireframe]") {
  const auto frame = sg::build_wireframe(model_of({edge({0, 0, 0}, {2, 0, 0}, "#10"),
                                                   edge({2, 0, 0}, {2 + 0.5 * tol, 0, 0}, "#11"),
                                                   edge({2, 0, 0}, {2, 0, 3}, "#12")}),
                                         tol);
  REQUIRE(frame.members.size() == 2);
  CHECK(frame.members[0].source.entity == "#10");
  CHECK(frame.members[1].source.entity == "#12");
  // The dropped edge's node is not left behind: 3 nodes for two members.
  CHECK(frame.nodes.size() == 3);
  REQUIRE(frame.diagnostics.size() == 1);
  const sg::Diagnostic& d = frame.diagnostics.front();
  CHECK(d.code == "zero-length-edge");
  CHECK(d.severity == sg::Severity::warning);
  CHECK(d.entities == std::vector<std::string>{"#11"});
  REQUIRE(d.at.has_value());
  CHECK(d.at->isApprox(Eigen::Vector3d(2, 0, 0)));
  CHECK_THAT(d.message, Catch::Contains("#11"));
}

TEST_CASE("members on the same pair of nodes are reported as duplicates and kept", "[wireframe]") {
  const auto frame = sg::build_wireframe(model_of({edge({0, 0, 0}, {3, 0, 0}, "#20"),
                                                   edge({3, 0, 0}, {3, 4, 0}, "#21"),
                                                   edge({3 + 0.2 * tol, 0, 0}, {0, 0, 0}, "#22")}),
                                         tol);
  CHECK(frame.members.size() == 3);
  REQUIRE(count_code(frame, "duplicate-member") == 1);
  const sg::Diagnostic& d = frame.diagnostics.front();
  CHECK(d.entities == std::vector<std::string>{"#20", "#22"});
  CHECK_THAT(d.message, Catch::Contains("#20") && Catch::Contains("#22"));
}

TEST_CASE("the reader's diagnostics come first, then the merge's own", "[wireframe]") {
  sg::StepModel model = model_of({edge({0, 0, 0}, {1e-3, 0, 0}, "#5")});
  model.diagnostics.push_back({sg::Severity::warning, "curved-edge-skipped", "from the reader", {"#4"}, {}});
  model.edges.push_back(edge({0, 0, 0}, {1, 0, 0}, "#6"));
  const auto frame = sg::build_wireframe(model, tol);
  REQUIRE(frame.diagnostics.size() == 2);
  CHECK(frame.diagnostics[0].code == "curved-edge-skipped");
  CHECK(frame.diagnostics[1].code == "zero-length-edge");
}

TEST_CASE("a lattice of several thousand jittered edges merges to its grid nodes", "[wireframe]") {
  // 20 x 20 x 5 grid points 1 m apart joined along x, y and z:
  // edges = 19*20*5 + 20*19*5 + 20*20*4 = 5400, nodes = 20*20*5 = 2000.
  // Each end point is moved by up to 0.25 tolerance along each axis, at most
  // 0.25*sqrt(3) = 0.43 tolerance in all, so two copies of a grid point are at
  // most 0.87 tolerance apart (they merge) while different grid points stay
  // about 1 m apart (they never do).
  constexpr int nx = 20, ny = 20, nz = 5;
  std::vector<sg::WireEdge> edges;
  unsigned counter = 0;
  auto jitter = [&]() {
    // Deterministic pseudo-random offsets in [-0.25, 0.25] tol.
    counter = counter * 1664525u + 1013904223u;  // LCG constants: Numerical Recipes, 2nd ed., 7.1
    return (static_cast<double>(counter >> 8) / static_cast<double>(1u << 24) - 0.5) * 0.5 * tol;
  };
  auto point = [&](int i, int j, int k) {
    return Eigen::Vector3d(i + jitter(), j + jitter(), k + jitter());
  };
  for (int k = 0; k < nz; ++k)
    for (int j = 0; j < ny; ++j)
      for (int i = 0; i < nx; ++i) {
        if (i + 1 < nx) edges.push_back(edge(point(i, j, k), point(i + 1, j, k), "x"));
        if (j + 1 < ny) edges.push_back(edge(point(i, j, k), point(i, j + 1, k), "y"));
        if (k + 1 < nz) edges.push_back(edge(point(i, j, k), point(i, j, k + 1), "z"));
      }
  REQUIRE(edges.size() == 5400);

  const auto frame = sg::build_wireframe(model_of(edges), tol);
  CHECK(frame.nodes.size() == 2000);
  CHECK(frame.members.size() == 5400);
  // Every end point was moved by the jitter: one note, nothing else (no
  // junctions, gaps, overlaps or separate parts in a jittered lattice).
  REQUIRE(frame.diagnostics.size() == 1);
  CHECK(frame.diagnostics[0].code == "endpoints-merged");
  // Every member joins grid neighbours 1 m apart (to within the jitter).
  for (const auto& m : frame.members) {
    const double length = (frame.nodes[m.nodes[1]] - frame.nodes[m.nodes[0]]).norm();
    REQUIRE(std::abs(length - 1.0) < 2 * tol);
  }
}

TEST_CASE("a tolerance that is not a positive length is refused", "[wireframe]") {
  const auto model = model_of({edge({0, 0, 0}, {1, 0, 0}, "#1")});
  CHECK_THROWS_AS(sg::build_wireframe(model, 0.0), std::invalid_argument);
  CHECK_THROWS_AS(sg::build_wireframe(model, -1e-3), std::invalid_argument);
  CHECK_THROWS_AS(sg::build_wireframe(model, std::nan("")), std::invalid_argument);
}
