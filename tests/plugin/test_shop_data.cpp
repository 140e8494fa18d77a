// Shop data and fabrication-stage checks end to end: piece marks on a
// symmetric frame, precamber against the midspan deflection 5 w L^4 / (384 E I),
// the lifting check against the statics of a beam hanging from two slings,
// handling limits as failing checks, cutlist.csv and connections.csv.

#include "stepframe/analysis/section.hpp"
#include "stepframe/project_reader.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>
#include <vtkCellData.h>
#include <vtkNew.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <map>
#include <sstream>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

void write_lines(const std::filesystem::path& file, const std::vector<std::pair<Eigen::Vector3d, Eigen::Vector3d>>& lines) {
  std::vector<geometry::LineToWrite> edges;
  for (const auto& [a, b] : lines) edges.push_back({a, b, {}});
  geometry::write_step_wireframe(file, edges, "mm");
}

// CSV rows as maps from the header's names (no quoted commas in these tests).
std::vector<std::map<std::string, std::string>> csv_rows(const std::string& text) {
  std::istringstream in(text);
  std::string line;
  std::getline(in, line);
  std::vector<std::string> header;
  std::stringstream h(line);
  for (std::string cell; std::getline(h, cell, ',');) header.push_back(cell);
  std::vector<std::map<std::string, std::string>> rows;
  while (std::getline(in, line)) {
    std::stringstream s(line);
    std::map<std::string, std::string> row;
    std::size_t i = 0;
    for (std::string cell; std::getline(s, cell, ',') && i < header.size(); ++i) row[header[i]] = cell;
    rows.push_back(row);
  }
  return rows;
}

}  // namespace

TEST_CASE("piece marks: a symmetric two-bay frame has one mark per kind of identical member") {
  test::ScratchDir dir;
  // Columns at x = 0, 5, 10 m, beams between them, two braces mirrored about the middle column (the second
  // drawn from its top), and one longer column at x = 15 m carrying nothing but itself.
  write_lines(dir / "bays.stp", {{{0, 0, 0}, {0, 0, 3}},
                                 {{5, 0, 0}, {5, 0, 3}},
                                 {{10, 0, 0}, {10, 0, 3}},
                                 {{0, 0, 3}, {5, 0, 3}},
                                 {{5, 0, 3}, {10, 0, 3}},
                                 {{0, 0, 0}, {5, 0, 3}},
                                 {{5, 0, 3}, {10, 0, 0}},
                                 {{15, 0, 0}, {15, 0, 3.5}}});
  // Every member HEB 200: the marks tell them apart by kind (vertical, horizontal, sloping) and length.
  test::write_text(dir / "bays.yaml", R"(model: bays.stp
units: {length: m, force: kN}
rules:
  - where: {}
    material: S355
    section: HEB200
supports:
  - where: {z: 0}
    fix: fixed
cases:
  - name: G
    self_weight: true
)");
  const auto run = test::run_stepframe("run \"" + (dir / "bays.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  REQUIRE(run.status <= 1);
  const auto j = nlohmann::json::parse(test::read_text(dir / "out" / "results.json"));
  std::map<std::string, std::vector<int>> by_mark;
  for (const auto& m : j["members"]) by_mark[m["mark"].get<std::string>()].push_back(m["id"].get<int>());
  // Three 3 m columns, two beams, two mirrored braces (one drawn the other way round), one 3.5 m column.
  REQUIRE(by_mark.size() == 4);
  CHECK(by_mark.at("B1").size() == 2);
  CHECK(by_mark.at("C1").size() == 3);
  CHECK(by_mark.at("C2").size() == 1);  // the longer column: a mark of its own, numbered after the shorter
  CHECK(by_mark.at("D1").size() == 2);

  const auto cut = csv_rows(test::read_text(dir / "out" / "cutlist.csv"));
  REQUIRE(cut.size() == 5);  // four marks and the total
  for (const auto& row : cut) {
    if (row.at("mark") == "TOTAL") {
      CHECK(row.at("count") == "8");
      continue;
    }
    INFO(row.at("mark"));
    CHECK(std::stoul(row.at("count")) == by_mark.at(row.at("mark")).size());
    // kg each = kg/m x length; HEB 200 is 61.3 kg/m (EN 10365 table, from memory; our area times 7850 within 2 %).
    CHECK(std::stod(row.at("kg_per_m")) == Approx(61.3).epsilon(0.02));
    CHECK(std::stod(row.at("kg_each")) == Approx(std::stod(row.at("kg_per_m")) * std::stod(row.at("length_mm")) / 1e3).epsilon(1e-3));
  }
  // The marks also in every line model.
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName((dir / "out" / "vtk" / "G.vtu").string().c_str());
  reader->Update();
  auto* marks = vtkStringArray::SafeDownCast(reader->GetOutput()->GetCellData()->GetAbstractArray("mark"));
  REQUIRE(marks);
  REQUIRE(marks->GetNumberOfValues() == 8);
  for (vtkIdType i = 0; i < 8; ++i) CHECK(marks->GetValue(i) == j["members"][static_cast<std::size_t>(i)]["mark"].get<std::string>());
}

TEST_CASE("camber: the deflection under the permanent load is 5 w L^4 / (384 E I), rounded down to the shop increment") {
  // Source: simply supported beam under a uniform load, midspan deflection 5 w L^4 / (384 E I): W. C. Young &
  // R. G. Budynas, Roark's Formulas for Stress and Strain, 7th ed. (2002), Table 8.1 (case number from memory).
  test::ScratchDir dir;
  write_lines(dir / "beams.stp", {{{0, 0, 0}, {8, 0, 0}}, {{0, 3, 0}, {4, 3, 0}}});
  test::write_text(dir / "beams.yaml", R"(model: beams.stp
units: {length: m, force: kN, line_load: kN/m}
rules:
  - where: {}
    material: S355
    section: IPE300
supports:
  - near: [0, 0, 0]
    fix: [ux, uy, uz, rx]
  - near: [8, 0, 0]
    fix: [uy, uz, rx]
  - near: [0, 3, 0]
    fix: [ux, uy, uz, rx]
  - near: [4, 3, 0]
    fix: [uy, uz, rx]
cases:
  - name: G
    member_loads:
      - where: {}
        w: [0, 0, -10]
checks:
  stress: {combinations: [G]}
fabrication:
  camber: {load: G, threshold: 10 mm, increment: 5 mm}
)");
  const auto run = test::run_stepframe("run \"" + (dir / "beams.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  REQUIRE(run.status == 0);
  const double E = 210e9, I = analysis::find_catalogue_section("IPE300")->Iy, w = 10e3;
  const double d8 = 5 * w * std::pow(8.0, 4) / (384 * E * I);  // about 30 mm
  const double d4 = 5 * w * std::pow(4.0, 4) / (384 * E * I);  // about 2 mm: below the threshold
  const double expected = std::floor(d8 / 0.005) * 0.005;
  REQUIRE(expected > 0.02);
  const auto j = nlohmann::json::parse(test::read_text(dir / "out" / "results.json"));
  CHECK(j["members"][0]["camber"].get<double>() == Approx(expected).margin(1e-12));
  CHECK(j["members"][1]["camber"].get<double>() == 0);
  CHECK(j["results"][0]["members"][0]["max_local_deflection"].get<double>() == Approx(d8).epsilon(1e-6));
  CHECK(j["results"][0]["members"][1]["max_local_deflection"].get<double>() == Approx(d4).epsilon(1e-6));
  const auto cut = csv_rows(test::read_text(dir / "out" / "cutlist.csv"));
  bool found = false;
  for (const auto& row : cut)
    if (row.at("length_mm") == "8000") {
      found = true;
      CHECK(std::stod(row.at("camber_mm")) == Approx(expected * 1e3));
    }
  CHECK(found);
  const auto report = test::read_text(dir / "out" / "report.html");
  CHECK_THAT(report, Contains("Shop data") && Contains("precamber"));

  // connections.csv: each beam end carries half the load, w L / 2 (statics), and no moment (pinned).
  const auto ends = csv_rows(test::read_text(dir / "out" / "connections.csv"));
  REQUIRE(ends.size() == 4);
  for (const auto& row : ends) {
    INFO(row.at("member") << " " << row.at("end"));
    const double L = row.at("member") == "0" ? 8 : 4;
    CHECK(std::abs(std::stod(row.at("Vz_kN_max"))) == Approx(10 * L / 2).epsilon(1e-4));
    CHECK(std::abs(std::stod(row.at("My_kNm_max"))) < 1e-3);
    CHECK(row.at("Vz_kN_max_by") == "G");
  }
}

TEST_CASE("lifting and handling: a 12 m beam hanging from slings at 0.2 L and 0.8 L, over the shop's limits") {
  test::ScratchDir dir;
  write_lines(dir / "long.stp", {{{0, 0, 0}, {12, 0, 0}}});
  test::write_text(dir / "long.yaml", R"(model: long.stp
units: {length: m, force: kN}
rules:
  - where: {}
    material: S355
    section: IPE300
supports:
  - near: [0, 0, 0]
    fix: fixed
cases:
  - name: G
    self_weight: true
outputs: {check_details: all}  # every check with its clause and intermediate values
checks:
  stress: {combinations: [G]}
fabrication:
  max_length: 10 m
  max_mass: 1 t
  lifting: {min_length: 8 m, points: [0.2, 0.8], dynamic_factor: 1.25}
)");
  const auto run = test::run_stepframe("run \"" + (dir / "long.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  CHECK(run.status == 1);  // 12 m is longer than the shop takes
  const auto j = nlohmann::json::parse(test::read_text(dir / "out" / "results.json"));
  const auto s = *analysis::find_catalogue_section("IPE300");
  // Statics of a beam on two supports with equal overhangs a and span s = L - 2a under w (common practice):
  // hogging w a^2 / 2 at the slings, sagging w s^2 / 8 - w a^2 / 2 at midspan.
  const double w = 1.25 * s.A * 7850 * 9.80665, a = 2.4, span = 7.2;
  const double M = std::max(w * a * a / 2, w * span * span / 8 - w * a * a / 2);
  std::map<std::string, nlohmann::json> checks;
  for (const auto& c : j["checks"]) checks[c["check"].get<std::string>()] = c;
  REQUIRE(checks.count("lifting stress"));
  CHECK(checks["lifting stress"]["value"].get<double>() == Approx(M / s.Wy()).epsilon(1e-9));
  CHECK(checks["lifting stress"]["limit"].get<double>() == Approx(355e6));
  CHECK(checks["lifting stress"]["station"].get<double>() == Approx(6.0));  // midspan governs: 3.6 w > 2.88 w
  REQUIRE(checks.count("lifting lateral-torsional buckling"));
  const auto& ltb = checks["lifting lateral-torsional buckling"];
  CHECK(ltb["value"].get<double>() == Approx(w * span * span / 8 - w * a * a / 2).epsilon(1e-6));
  CHECK(ltb["details"]["chi_LT"].get<double>() > 0);
  CHECK(ltb["details"]["chi_LT"].get<double>() <= 1);
  REQUIRE(checks.count("handling length"));
  CHECK_FALSE(checks["handling length"]["pass"].get<bool>());
  CHECK(checks["handling length"]["utilisation"].get<double>() == Approx(1.2));
  // 12 m of IPE 300 is about 506 kg: under the 1 t limit.
  CHECK(checks["handling mass"]["value"].get<double>() == Approx(12 * s.A * 7850).epsilon(1e-9));
  CHECK(checks["handling mass"]["pass"].get<bool>());
}

TEST_CASE("the fabrication block refuses a camber load that is not a case or combination") {
  test::ScratchDir dir;
  write_lines(dir / "b.stp", {{{0, 0, 0}, {4, 0, 0}}});
  test::write_text(dir / "b.yaml", R"(model: b.stp
rules:
  - where: {}
    material: S355
    section: IPE300
supports:
  - near: [0, 0, 0]
    fix: fixed
cases:
  - name: G
    self_weight: true
fabrication:
  camber: {load: DEAD}
)");
  const auto r = test::run_stepframe("run \"" + (dir / "b.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("fabrication.camber.load") && Contains("DEAD") && Contains("b.yaml:13"));
}

TEST_CASE("the README's fabrication: and suggest: examples read as a project") {
  const auto readme = test::read_text(std::filesystem::path(STEPFRAME_SOURCE_DIR) / "README.md");
  auto block = [&](const std::string& first_line) {
    const auto at = readme.find("```yaml\n" + first_line);
    REQUIRE(at != std::string::npos);
    return readme.substr(at + 8, readme.find("```", at + 8) - at - 8);
  };
  test::ScratchDir dir;
  write_lines(dir / "b.stp", {{{0, 0, 0}, {4, 0, 0}}});
  test::write_text(dir / "b.yaml", "model: b.stp\ncases:\n  - name: G\n    self_weight: true\n" + block("fabrication:") +
                                       block("suggest:"));
  const auto p = read_project(dir / "b.yaml");
  CHECK(p.fabrication.max_length == Approx(16.0));
  CHECK(p.fabrication.max_mass == Approx(8000.0));
  REQUIRE(p.fabrication.camber);
  CHECK(p.fabrication.camber->increment == Approx(0.005));
  REQUIRE(p.fabrication.lifting);
  CHECK(p.fabrication.lifting->points[1] == Approx(0.8));
  CHECK(p.suggest.sections == std::vector<std::string>{"IPE", "HEA", "HEB300", "CHS"});
  CHECK(p.suggest.lighten_below == Approx(0.5));
}
