// Write a small frame with write_step_wireframe, read it back with read_step,
// and compare every coordinate and attribute, in each length unit the writer offers.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "test_support.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <regex>
#include <set>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;
using sg::test::ScratchFolder;

namespace {

sg::LineToWrite line(Eigen::Vector3d a, Eigen::Vector3d b, std::string name, std::vector<std::string> layers,
                     std::string product) {
  sg::SourceInfo attributes;
  attributes.name = std::move(name);
  attributes.layers = std::move(layers);
  attributes.product = std::move(product);
  return {a, b, attributes};
}

// Two parts; coordinates with digits in every place, negative values, a line
// with two layers, one with no name, one with neither name nor layer.
std::vector<sg::LineToWrite> sample_frame() {
  return {
      line({0.125, -2.5, 0.0}, {0.125, -2.5, 3.2125}, "HE 160 A", {"COLUMNS"}, "STAIR-TOWER"),
      line({0.125, -2.5, 3.2125}, {4.375, -2.5, 3.2125}, "UPE 200", {"BEAMS", "LEVEL 1"}, "STAIR-TOWER"),
      line({4.375, -2.5, 3.2125}, {4.375, 1.0625, 3.2125}, "", {"BEAMS"}, "STAIR-TOWER"),
      line({0.125, -2.5, 0.0}, {4.375, 1.0625, 3.2125}, "L 70x7", {"BRACING"}, "STAIR-TOWER"),
      line({-1.0, 7.75, 0.5}, {-1.0, 7.75, 2.0}, "", {}, "HANDRAIL"),
      line({-1.0, 7.75, 2.0}, {2.0, 7.75, 2.0}, "CHS 48.3x3.2", {"RAILS"}, "HANDRAIL"),
  };
}

// Relative closeness with an absolute floor for zero coordinates.
bool close(const Eigen::Vector3d& a, const Eigen::Vector3d& b) {
  return (a - b).norm() <= 1e-9 * std::max(1.0, b.norm());
}

struct UnitCase {
  const char* unit;
  double metres;            // size of one unit
  const char* declaration;  // how the file must declare it
};

}  // namespace

TEST_CASE("a wireframe written in mm, m and inch reads back with its coordinates and attributes", "[step][round-trip]") {
  // One millimetre is 1e-3 m (SI prefix milli, SI Brochure 9th ed., table 7); one
  // inch is exactly 25.4 mm (international yard and pound agreement, 1959).
  const UnitCase unit_case = GENERATE(UnitCase{"mm", 1e-3, "SI_UNIT(.MILLI.,.METRE.)"},
                                      UnitCase{"m", 1.0, "SI_UNIT($,.METRE.)"},
                                      UnitCase{"inch", 0.0254, "CONVERSION_BASED_UNIT('INCH'"});
  CAPTURE(unit_case.unit);
  ScratchFolder folder;
  const auto file = folder.path() / "frame.stp";
  const std::vector<sg::LineToWrite> lines = sample_frame();

  sg::write_step_wireframe(file, lines, unit_case.unit);

  // The file itself: a wireframe in the requested unit, nothing left behind.
  const std::string text = sg::test::read_text(file);
  CHECK(text.find("GEOMETRIC_CURVE_SET") != std::string::npos);
  CHECK(text.find(unit_case.declaration) != std::string::npos);
  CHECK_FALSE(std::filesystem::exists(folder.path() / "frame.stp.tmp"));

  const sg::StepModel model = sg::read_step(file);
  CHECK(model.file == file);
  CHECK(model.length_unit == unit_case.unit);
  CHECK(model.metres_per_unit == Approx(unit_case.metres).epsilon(1e-12));
  CHECK(model.diagnostics.empty());
  REQUIRE(model.edges.size() == lines.size());

  const auto entities = sg::test::step_entities(file);
  const std::regex entity_id(R"(#[1-9][0-9]*)");
  std::set<std::string> ids;
  for (const sg::LineToWrite& written : lines) {
    CAPTURE(written.attributes.name, written.attributes.product);
    // Find the read edge with these end points, in this direction.
    const auto match = std::find_if(model.edges.begin(), model.edges.end(), [&](const sg::WireEdge& e) {
      return close(e.start, written.start) && close(e.end, written.end);
    });
    REQUIRE(match != model.edges.end());
    CHECK(std::count_if(model.edges.begin(), model.edges.end(), [&](const sg::WireEdge& e) {
            return close(e.start, written.start) && close(e.end, written.end);
          }) == 1);

    CHECK(match->source.name == written.attributes.name);
    CHECK(match->source.layers == written.attributes.layers);
    CHECK(match->source.product == written.attributes.product);
    CHECK(match->source.colour.empty());

    // The entity id names the curve this line became: a TRIMMED_CURVE whose
    // trimming points are the line's ends in the file's unit. Parts are placed
    // by translation, so the difference of the points is the line's vector.
    CHECK(std::regex_match(match->source.entity, entity_id));
    ids.insert(match->source.entity);
    REQUIRE(entities.count(match->source.entity) == 1);
    const auto [first, second] = sg::test::trimming_points(entities, match->source.entity);
    const Eigen::Vector3d expected = (written.end - written.start) / unit_case.metres;
    CHECK((second - first - expected).norm() <= 1e-9 * expected.norm());
  }
  CHECK(ids.size() == lines.size());
}

TEST_CASE("write_step_wireframe refuses bad requests with a message naming the file", "[step][writer]") {
  ScratchFolder folder;
  const auto file = folder.path() / "frame.stp";
  const std::vector<sg::LineToWrite> lines = sample_frame();

  SECTION("unknown unit") {
    CHECK_THROWS_WITH(sg::write_step_wireframe(file, lines, "furlong"),
                      Catch::Contains(file.string()) && Catch::Contains("furlong"));
    CHECK_FALSE(std::filesystem::exists(file));
  }
  SECTION("nothing to write") {
    CHECK_THROWS_WITH(sg::write_step_wireframe(file, {}, "mm"), Catch::Contains(file.string()));
  }
  SECTION("a line without length") {
    const std::vector<sg::LineToWrite> degenerate{line({1, 2, 3}, {1, 2, 3}, "stub", {}, "P")};
    CHECK_THROWS_WITH(sg::write_step_wireframe(file, degenerate, "mm"),
                      Catch::Contains(file.string()) && Catch::Contains("stub"));
  }
  SECTION("a folder that does not exist") {
    const auto nowhere = folder.path() / "missing" / "frame.stp";
    CHECK_THROWS_WITH(sg::write_step_wireframe(nowhere, lines, "mm"), Catch::Contains(nowhere.string()));
  }
}
