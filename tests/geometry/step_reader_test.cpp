// read_step on STEP files written by hand in tests/data, whose entity
// numbers, coordinates, names and layers are known line by line.

#include "stepframe/geometry/step_reader.hpp"
#include "test_support.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>

#include <algorithm>
#include <fstream>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;

namespace {

const std::filesystem::path data = STEPFRAME_TEST_DATA;

bool close(const Eigen::Vector3d& a, const Eigen::Vector3d& b) {
  return (a - b).norm() <= 1e-9 * std::max(1.0, b.norm());
}

std::vector<std::string> codes_naming(const sg::StepModel& model, const std::string& entity) {
  std::vector<std::string> codes;
  for (const sg::Diagnostic& d : model.diagnostics) {
    if (std::find(d.entities.begin(), d.entities.end(), entity) != d.entities.end()) codes.push_back(d.code);
  }
  return codes;
}

}  // namespace

// Expected values are the ones written in gantry_curve_set_mm.stp (a
// GEOMETRICALLY_BOUNDED_WIREFRAME_SHAPE_REPRESENTATION of two GEOMETRIC_CURVE_SETs,
// entities as defined in ISO 10303-42 and -46), converted with 1 mm = 1e-3 m.
TEST_CASE("a hand-written geometric curve set in millimetres", "[step][reader]") {
  const sg::StepModel model = sg::read_step(data / "gantry_curve_set_mm.stp");
  CHECK(model.length_unit == "mm");
  CHECK(model.metres_per_unit == Approx(1e-3).epsilon(1e-12));
  REQUIRE(model.edges.size() == 5);

  struct Expected {
    const char* entity;
    Eigen::Vector3d start, end;
    const char* name;
    std::vector<std::string> layers;
    const char* colour;
  };
  const std::vector<Expected> expected{
      // #60 has no name of its own: it takes its curve set's name and layer.
      {"#60", {0, 0, 0}, {0, 0, 2.5}, "posts", {"S-COLS"}, ""},
      // #70 is trimmed by parameter, named itself, on its own layer and its set's,
      // and styled COLOUR_RGB(1, 0.4, 0): 255 x 0.4 = 102 = 0x66.
      {"#70", {4, 0, 0}, {4, 0, 2.5}, "post B", {"AS-BUILT", "S-COLS"}, "#ff6600"},
      // #80 is a POLYLINE through three points: two straight pieces, one entity.
      {"#80", {0, 0, 2.5}, {2, 0, 3}, "rafter", {"S-RAFTER"}, ""},
      {"#80", {2, 0, 3}, {4, 0, 2.5}, "rafter", {"S-RAFTER"}, ""},
  };
  for (std::size_t i = 0; i < expected.size(); ++i) {
    const sg::WireEdge& edge = model.edges[i];
    CAPTURE(i, edge.source.entity);
    CHECK(edge.source.entity == expected[i].entity);
    CHECK(close(edge.start, expected[i].start));
    CHECK(close(edge.end, expected[i].end));
    CHECK(edge.source.name == expected[i].name);
    CHECK(edge.source.layers == expected[i].layers);
    CHECK(edge.source.colour == expected[i].colour);
    CHECK(edge.source.product == "GANTRY-7");
  }

  // #95 is a quarter circle of radius 500 mm about (2000, 0, 3000) in the x-z
  // plane: axis y and ref_direction x give the local y direction y x x = -z
  // (ISO 10303-42, axis2_placement_3d), so the circle (ISO 10303-42, circle:
  // C + R (cos t x + sin t y)) runs from centre + 500 x down to centre - 500 z.
  const sg::WireEdge& arch = model.edges[4];
  CHECK(arch.source.entity == "#95");
  CHECK(arch.source.name == "arch");
  REQUIRE(arch.curved());
  CHECK(close(arch.start, {2.5, 0, 3}));
  CHECK(close(arch.end, {2, 0, 2.5}));
  CHECK(arch.curve.back().turn == Approx(std::numbers::pi / 2).epsilon(1e-9));
  for (const sg::CurveSample& s : arch.curve) CHECK((s.point - Eigen::Vector3d(2, 0, 3)).norm() == Approx(0.5));

  // #90 is trimmed twice at the same point; #92 is a LINE with no trimming.
  CHECK(model.diagnostics.size() == 2);
  CHECK(codes_naming(model, "#90") == std::vector<std::string>{"zero-length-edge"});
  CHECK(codes_naming(model, "#92") == std::vector<std::string>{"unbounded-curve-skipped"});
  for (const sg::Diagnostic& d : model.diagnostics) CHECK(d.severity == sg::Severity::warning);
}

// brace_assembly_inch.stp: an EDGE_BASED_WIREFRAME_MODEL part used twice in an
// assembly, in a CONVERSION_BASED_UNIT 'INCH' of 25.4 mm. The second use is
// placed by ITEM_DEFINED_TRANSFORMATION onto AXIS2_PLACEMENT_3D #37: origin
// (200, 0, 0) in, axis z, ref_direction y, so (ISO 10303-42, axis2_placement_3d)
// a part point (x, y, z) lands at (200 - y, x, z) in.
TEST_CASE("a hand-written edge-based wireframe placed twice in an assembly, in inches", "[step][reader]") {
  const sg::StepModel model = sg::read_step(data / "brace_assembly_inch.stp");
  CHECK(model.length_unit == "inch");
  // 1 in = 25.4 mm exactly (international yard and pound agreement, 1959).
  CHECK(model.metres_per_unit == Approx(0.0254).epsilon(1e-12));
  CHECK(model.diagnostics.empty());
  REQUIRE(model.edges.size() == 4);

  const double in = 0.0254;
  struct Expected {
    const char* entity;
    Eigen::Vector3d start, end;
    const char* name;
  };
  // EDGE_CURVE #70 runs from vertex (0,0,0) to (50,0,100) in. #80 runs from
  // (100,0,0) to (50,0,100) in although its line points the other way
  // (same_sense .F.), and has no name, so it takes its CONNECTED_EDGE_SET's
  // name 'vee'.
  const std::vector<Expected> expected{
      {"#70", Eigen::Vector3d(0, 0, 0) * in, Eigen::Vector3d(50, 0, 100) * in, "brace left"},
      {"#80", Eigen::Vector3d(100, 0, 0) * in, Eigen::Vector3d(50, 0, 100) * in, "vee"},
      {"#70", Eigen::Vector3d(200, 0, 0) * in, Eigen::Vector3d(200, 50, 100) * in, "brace left"},
      {"#80", Eigen::Vector3d(200, 100, 0) * in, Eigen::Vector3d(200, 50, 100) * in, "vee"},
  };
  for (const Expected& e : expected) {
    CAPTURE(e.entity, e.start.transpose(), e.end.transpose());
    const auto hits = std::count_if(model.edges.begin(), model.edges.end(), [&](const sg::WireEdge& edge) {
      return edge.source.entity == e.entity && close(edge.start, e.start) && close(edge.end, e.end) &&
             edge.source.name == e.name && edge.source.product == "BRACE" &&
             edge.source.layers == std::vector<std::string>{"S-BRACING"};
    });
    CHECK(hits == 1);
  }
}

TEST_CASE("read_step refuses unusable files with a message naming the file", "[step][reader][errors]") {
  SECTION("missing file") {
    const auto missing = data / "no_such_frame.stp";
    CHECK_THROWS_AS(sg::read_step(missing), sg::StepReadError);
    CHECK_THROWS_WITH(sg::read_step(missing), Catch::Contains(missing.string()) && Catch::Contains("not found"));
  }
  SECTION("a folder instead of a file") {
    CHECK_THROWS_WITH(sg::read_step(data), Catch::Contains(data.string()) && Catch::Contains("not a regular file"));
  }
  SECTION("text that is not STEP") {
    sg::test::ScratchFolder folder;
    const auto garbage = folder.path() / "notes.stp";
    std::ofstream(garbage) << "member list\nB1 IPE 300 6.0 m\nB2 IPE 300 6.0 m\n";
    CHECK_THROWS_AS(sg::read_step(garbage), sg::StepReadError);
    CHECK_THROWS_WITH(sg::read_step(garbage),
                      Catch::Contains(garbage.string()) && Catch::Contains("not a readable STEP"));
  }
  SECTION("an empty file") {
    sg::test::ScratchFolder folder;
    const auto empty = folder.path() / "empty.stp";
    std::ofstream{empty};
    CHECK_THROWS_WITH(sg::read_step(empty), Catch::Contains(empty.string()));
  }
  SECTION("a model with a surface and no curve at all") {
    const auto plate = data / "plate_only_mm.stp";
    CHECK_THROWS_AS(sg::read_step(plate), sg::StepReadError);
    CHECK_THROWS_WITH(sg::read_step(plate), Catch::Contains(plate.string()) &&
                                                Catch::Contains("no usable edges") &&
                                                Catch::Contains("1 solid or surface bodies"));
  }
}
