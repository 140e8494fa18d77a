// End to end through the command line: STEP + project file -> results.json,
// VTK files and the exit status the README promises.

#include "stepframe/analysis/section.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <cmath>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

constexpr double span = 6.0;      // m
constexpr double E = 210e9;       // Pa, S355 (EN 1993-1-1 3.2.6)

/// One 6 m edge along X named "IPE 300" on layer BEAMS, written in millimetres.
void write_beam(const test::ScratchDir& dir, const std::string& name = "IPE 300") {
  geometry::LineToWrite line{{0, 0, 0}, {span, 0, 0}, {}};
  line.attributes.name = name;
  line.attributes.layers = {"BEAMS"};
  line.attributes.product = "TEST-BEAM";
  geometry::write_step_wireframe(dir / "beam.stp", {line}, "mm");
}

/// Simply supported (pin + roller, twist restrained at both ends) under a UDL of `w` kN/m.
std::string beam_project(double w, const std::string& end_fixity = "[uy, uz, rx]") {
  return "model: beam.stp\n"
         "units: {length: m, force: kN, stress: MPa, line_load: kN/m}\n"
         "rules:\n  - where: {}\n    material: S355\n"
         "supports:\n"
         "  - where: {x: 0}\n    fix: [ux, uy, uz, rx]\n"
         "  - where: {x: 6}\n    fix: " + end_fixity + "\n"
         "cases:\n  - name: W\n    member_loads:\n      - where: {layer: BEAMS}\n        w: [0, 0, " +
         std::to_string(-w) + "]\n"
         "checks:\n  stress: {combinations: [W]}\n  deflection: {span_ratio: 300, combinations: [W]}\n";
}

nlohmann::json read_json(const std::filesystem::path& file) { return nlohmann::json::parse(test::read_text(file)); }

}  // namespace

TEST_CASE("a simply supported beam from STEP to results.json matches the handbook") {
  // Midspan deflection 5 w L^4 / (384 E I) and moment w L^2 / 8: simply supported beam
  // under uniform load, Roark's Formulas for Stress and Strain, Table 8.1 case 2e.
  test::ScratchDir dir;
  write_beam(dir);
  test::write_text(dir / "beam.yaml", beam_project(10.0));
  const auto r = test::run_stepframe("run \"" + (dir / "beam.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  CHECK_THAT(r.out, Contains("PASS") && Contains("competent engineer"));

  const auto ipe300 = analysis::find_catalogue_section("IPE300");
  REQUIRE(ipe300);
  const double w = 10e3, I = ipe300->Iy;
  const auto j = read_json(dir / "out" / "results.json");
  CHECK(j["schema"] == "stepframe-results/1");
  CHECK(j["status"] == "pass");
  REQUIRE(j["members"].size() == 1);
  CHECK(j["members"][0]["section"] == "IPE300");
  CHECK(j["members"][0]["material"] == "S355");
  CHECK(j["members"][0]["length"].get<double>() == Approx(span));
  CHECK(j["members"][0]["source"]["name"] == "IPE 300");
  CHECK(j["members"][0]["source"]["layers"][0] == "BEAMS");
  CHECK(j["members"][0]["source"]["entity"].get<std::string>().rfind('#', 0) == 0);

  const auto& result = j["results"][0];
  CHECK(result["kind"] == "case");
  const auto& m = result["members"][0];
  CHECK(m["max_local_deflection"].get<double>() == Approx(5 * w * std::pow(span, 4) / (384 * E * I)).epsilon(1e-6));
  CHECK(m["max_abs_stress"].get<double>() == Approx(w * span * span / 8 / ipe300->Wy()).epsilon(1e-6));
  double vertical = 0;
  for (const auto& reaction : result["reactions"]) vertical += reaction["force"][2].get<double>();
  CHECK(vertical == Approx(w * span).epsilon(1e-9));  // equilibrium: reactions carry the whole load

  const auto& checks = j["checks"];
  REQUIRE(checks.size() == 2);
  CHECK(checks[0]["check"] == "stress");
  CHECK(checks[0]["utilisation"].get<double>() == Approx(w * span * span / 8 / ipe300->Wy() / 355e6).epsilon(1e-6));
  CHECK(checks[0]["station"].get<double>() == Approx(span / 2));  // moment peak at midspan
  CHECK(checks[1]["check"] == "deflection");
  CHECK(checks[1]["station"].get<double>() == Approx(span / 2));
  CHECK(checks[1]["utilisation"].get<double>() ==
        Approx(5 * w * std::pow(span, 4) / (384 * E * I) / (span / 300)).epsilon(1e-6));
  CHECK(std::filesystem::exists(dir / "out" / "vtk" / "W.vtu"));
  CHECK_FALSE(std::filesystem::exists(dir / "out" / "results.json.tmp"));
}

TEST_CASE("an overloaded beam fails its check with exit status 1") {
  test::ScratchDir dir;
  write_beam(dir);
  test::write_text(dir / "beam.yaml", beam_project(100.0));  // ~808 MPa in an IPE 300
  const auto r = test::run_stepframe("run \"" + (dir / "beam.yaml").string() + "\"", dir);
  CHECK(r.status == 1);
  CHECK_THAT(r.out, Contains("FAIL") && Contains("governing: member 0"));
  // Default output folder: beside the project file.
  CHECK(read_json(dir / "beam-results" / "results.json")["status"] == "fail");
}

TEST_CASE("a frame free to twist is reported unstable with exit status 3") {
  test::ScratchDir dir;
  write_beam(dir);
  test::write_text(dir / "beam.yaml", beam_project(10.0, "[uy, uz]"));
  // Twist now restrained at the start only: still stable.
  auto stable = test::run_stepframe("run \"" + (dir / "beam.yaml").string() + "\" --out \"" + (dir / "a").string() + "\"", dir);
  CHECK(stable.status == 0);

  std::string free_twist = beam_project(10.0, "[uy, uz]");
  free_twist.replace(free_twist.find("[ux, uy, uz, rx]"), 16, "[ux, uy, uz]");
  test::write_text(dir / "beam.yaml", free_twist);
  const auto r = test::run_stepframe("run \"" + (dir / "beam.yaml").string() + "\" --out \"" + (dir / "b").string() + "\"", dir);
  CHECK(r.status == 3);
  CHECK_THAT(r.err, Contains("unstable") && Contains("rx"));
  CHECK_FALSE(std::filesystem::exists(dir / "b" / "results.json"));
}

TEST_CASE("bad input exits with status 2 and writes nothing") {
  test::ScratchDir dir;
  const auto run = [&](const std::string& yaml) {
    test::write_text(dir / "beam.yaml", yaml);
    return test::run_stepframe("run \"" + (dir / "beam.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  };
  SECTION("a member without section lists its STEP entity") {
    write_beam(dir, "main girder");
    const auto r = run(beam_project(10.0));
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("1 member has no section") && Contains("#") && Contains("main girder"));
  }
  SECTION("an unknown key names the line") {
    write_beam(dir);
    const auto r = run(beam_project(10.0) + "colour_scheme: blue\n");
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("beam.yaml:19") && Contains("unknown key 'colour_scheme'"));
  }
  SECTION("a bad unit names the key") {
    write_beam(dir);
    std::string yaml = beam_project(10.0);
    yaml.replace(yaml.find("line_load: kN/m"), 15, "line_load: kN/furlong");
    const auto r = run(yaml);
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("beam.yaml:2") && Contains("units.line_load"));
  }
  SECTION("a rule naming an unknown section suggests close ones") {
    write_beam(dir);
    std::string yaml = beam_project(10.0);
    yaml.replace(yaml.find("    material: S355"), 18, "    section: IPE310\n    material: S355");
    const auto r = run(yaml);
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("unknown section 'IPE310'") && Contains("did you mean"));
  }
  SECTION("a missing STEP file") {
    const auto r = run(beam_project(10.0));
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("beam.stp"));
  }
  SECTION("a STEP file that is not STEP") {
    test::write_text(dir / "beam.stp", "this is not a STEP file\n");
    const auto r = run(beam_project(10.0));
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("beam.stp"));
  }
  CHECK_FALSE(std::filesystem::exists(dir / "out" / "results.json"));
}

TEST_CASE("inspect reports unit, counts and attributes") {
  test::ScratchDir dir;
  write_beam(dir);
  auto r = test::run_stepframe("inspect \"" + (dir / "beam.stp").string() + "\" --json", dir);
  REQUIRE(r.status == 0);
  const auto j = nlohmann::json::parse(r.out);
  CHECK(j["length_unit"] == "mm");
  CHECK(j["member_count"] == 1);
  CHECK(j["node_count"] == 2);
  CHECK(j["attributes"]["layer"]["BEAMS"] == 1);
  CHECK(j["members"][0]["length"].get<double>() == Approx(span));
  CHECK(j["bounding_box"]["max"][0].get<double>() == Approx(span));

  r = test::run_stepframe("inspect \"" + (dir / "beam.stp").string() + "\"", dir);
  CHECK(r.status == 0);
  CHECK_THAT(r.out, Contains("BEAMS") && Contains("mm"));

  r = test::run_stepframe("--version", dir);
  CHECK(r.status == 0);
  CHECK_THAT(r.out, Contains("stepframe"));
  r = test::run_stepframe("run --help", dir);
  CHECK(r.status == 0);
  CHECK_THAT(r.out, Contains("--out"));
}
