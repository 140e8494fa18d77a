// Area loads through a run: a floor of four beams on four columns (invented
// test data) with a pressure on its level; the generated member loads are in
// results.json and the report, and the supports take pressure x area
// (equilibrium). The splits themselves are tested in tests/analysis/test_area_loads.cpp.

#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/stepframe.hpp"
#include "run_options.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

using test::out_to;

void write_floor(const test::ScratchDir& dir) {
  std::vector<geometry::LineToWrite> lines;
  auto line = [&](Eigen::Vector3d a, Eigen::Vector3d b, const char* name, const char* layer) {
    geometry::LineToWrite l{a, b, {}};
    l.attributes.name = name;
    l.attributes.layers = {layer};
    lines.push_back(l);
  };
  const Eigen::Vector3d corners[] = {{0, 0, 0}, {6, 0, 0}, {6, 4, 0}, {0, 4, 0}};
  for (int i = 0; i < 4; ++i) {
    line(corners[i], corners[i] + Eigen::Vector3d(0, 0, 3), "HEA 200", "COLUMNS");
    line(corners[i] + Eigen::Vector3d(0, 0, 3), corners[(i + 1) % 4] + Eigen::Vector3d(0, 0, 3), "IPE 300", "BEAMS");
  }
  geometry::write_step_wireframe(dir / "floor.stp", lines, "mm");
}

std::string project(const std::string& area_load) {
  return R"(model: floor.stp
units: {length: m, force: kN}
rules: [{where: {}, material: S355}]
supports: [{where: {z: 0}, fix: fixed}]
cases:
  - name: Q
    area_loads:
      - )" + area_load + R"(
analysis: {buckling_modes: 0, sway_imperfection: off}
)";
}

}  // namespace

TEST_CASE("an area load on a floor: member loads in results.json and the report, reactions = p x area",
          "[plugin][area_loads]") {
  test::ScratchDir dir;
  write_floor(dir);
  const Results r = run_text(project("{pressure: 2.5 kN/m2, plane: {z: 3}, where: {layer: BEAMS}}"), dir.path(),
                             out_to(dir / "out"));
  INFO(r.message());
  REQUIRE(r.analysed());
  const auto& doc = r.json();
  REQUIRE(doc["area_loads"].size() == 1);
  const auto& area = doc["area_loads"][0];
  CHECK(area["case"] == "Q");
  CHECK(area["area"].get<double>() == Approx(24.0).epsilon(1e-10));
  CHECK(area["total_force"].get<double>() == Approx(60e3).epsilon(1e-10));
  REQUIRE(area["panels"].size() == 1);
  CHECK(area["panels"][0]["method"] == "two-way, 45-degree split");
  // Long beams 3 pieces (rise, plateau, fall), short beams 2 (the triangle): 10 loads; their sum is p x area.
  CHECK(area["member_loads"].size() == 10);
  double sum = 0;
  for (const auto& l : area["member_loads"])
    sum += -0.5 * (l["w_start"][2].get<double>() + l["w_end"][2].get<double>()) * (l["to"].get<double>() - l["from"].get<double>());
  CHECK(sum == Approx(60e3).epsilon(1e-10));
  // Equilibrium: the vertical reactions of case Q add up to the pressure times the area.
  double reactions = 0;
  for (const auto& reaction : doc["results"][0]["reactions"]) reactions += reaction["force"][2].get<double>();
  CHECK(reactions == Approx(60e3).epsilon(1e-9));
  const std::string report = test::read_text(dir / "out" / "report.html");
  CHECK_THAT(report, Contains("Area loads") && Contains("two-way, 45-degree split"));
}

TEST_CASE("area loads: errors name the key and what to write", "[plugin][area_loads]") {
  test::ScratchDir dir;
  write_floor(dir);
  auto message = [&](const std::string& area_load) { return run_text(project(area_load), dir.path()).message(); };
  CHECK_THAT(message("{pressure: 2.5 kN/m2, plane: {z: 5}}"), Contains("cases[0].area_loads[0]") && Contains("no panel found"));
  CHECK_THAT(message("{pressure: 2.5, plane: {z: 3}}"), Contains("pressure") && Contains("with its unit"));
  CHECK_THAT(message("{pressure: 2.5 kN/m2}"), Contains("needs its plane"));
  CHECK_THAT(message("{pressure: 2.5 kN/m2, plane: {z: 3}, span: one_way}"), Contains("needs beams_along"));
}
