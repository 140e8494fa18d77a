// Ultimate and serviceability combinations (`kind: uls|sls`): the default
// kind, buckling only for ultimate combinations unless asked, and the checks'
// default combinations.

#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/stepframe.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <set>
#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

/// A 3 m cantilever column (HEA 200, S355) with a vertical load G and Q and a small push W at its top.
std::string column_project(const std::string& combinations, const std::string& checks, const std::string& extra = "") {
  return "model: column.stp\nunits: {length: m, force: kN}\n"
         "rules: [{where: {}, section: HEA200, material: S355}]\n"
         "supports: [{where: {z: 0}, fix: fixed}]\n"
         "cases:\n"
         "  - {name: G, node_loads: [{where: {z: 3}, force: [0, 0, -100]}]}\n"
         "  - {name: Q, node_loads: [{where: {z: 3}, force: [2, 0, -50]}]}\n"
         "combinations:\n" + combinations + checks + extra;
}

void write_column(const test::ScratchDir& dir) {
  geometry::LineToWrite line{{0, 0, 0}, {0, 0, 3}, {}};
  line.attributes.name = "column";
  geometry::write_step_wireframe(dir / "column.stp", {line}, "mm");
}

const nlohmann::json& result_named(const nlohmann::json& doc, const std::string& name) {
  for (const auto& r : doc["results"])
    if (r["name"] == name) return r;
  FAIL("no result " << name);
  static const nlohmann::json none;
  return none;
}

/// The combinations each check entry of a kind governs under.
std::set<std::string> combinations_of(const nlohmann::json& doc, const std::string& check) {
  std::set<std::string> out;
  for (const auto& c : doc["checks"])
    if (c["check"] == check) out.insert(c["combination"].get<std::string>());
  return out;
}

}  // namespace

TEST_CASE("the limit state of a combination without kind: from its name, else from its factors") {
  // EN 1990 6.4.3.2 (ultimate: gamma factors above 1) and 6.5.3 (characteristic, frequent,
  // quasi-permanent: factors of at most 1).
  CHECK_FALSE(default_serviceability("ULS 1", {{"G", 1.0}}));
  CHECK(default_serviceability("SLS-char", {{"G", 1.35}}));
  CHECK(default_serviceability("Serviceability", {{"G", 1.35}}));
  CHECK_FALSE(default_serviceability("STR", {{"G", 1.35}, {"Q", 1.5}}));
  CHECK(default_serviceability("G+Q", {{"G", 1.0}, {"Q", 1.0}}));
  CHECK(default_serviceability("quasi-permanent", {{"G", 1.0}, {"Q", 0.3}}));
  CHECK_FALSE(default_serviceability("G+1.5Q", {{"G", 1.0}, {"Q", 1.5}}));
}

TEST_CASE("serviceability combinations get no buckling analysis and the deflection check by default") {
  test::ScratchDir dir;
  write_column(dir);
  const std::string combinations =
      "  - {name: STR, factors: {G: 1.35, Q: 1.5}}\n"
      "  - {name: CHAR, factors: {G: 1.0, Q: 1.0}}\n"
      "  - {name: ACC, kind: uls, factors: {G: 1.0, Q: 0.5}}\n";
  const std::string checks = "checks: {stress: {}, deflection: {span_ratio: 150}, stability: {}}\n";

  SECTION("defaults") {
    const Results r = run_text(column_project(combinations, checks), dir.path());
    INFO(r.message());
    REQUIRE(r.analysed());
    const auto& doc = r.json();
    CHECK(result_named(doc, "STR")["limit_state"] == "uls");
    CHECK(result_named(doc, "CHAR")["limit_state"] == "sls");
    CHECK(result_named(doc, "ACC")["limit_state"] == "uls");  // kind: uls overrides factors <= 1
    CHECK(result_named(doc, "STR")["alpha_cr"].is_number());
    CHECK(result_named(doc, "ACC")["alpha_cr"].is_number());
    CHECK(result_named(doc, "CHAR")["alpha_cr"].is_null());
    CHECK(result_named(doc, "CHAR")["buckling_factors"].empty());
    // Strength and stability under the ultimate combinations, deflection under the serviceability one.
    CHECK(combinations_of(doc, "deflection") == std::set<std::string>{"CHAR"});
    // Stress governs under STR or one of its sway-imperfection variants (EN 1993-1-1 5.3.2), not ACC.
    for (const auto& name : combinations_of(doc, "stress")) CHECK(name.rfind("STR", 0) == 0);
    for (const auto& c : doc["checks"])
      if (c["check"] == "frame stability") CHECK(c["combination"] != "CHAR");
  }
  SECTION("analysis.sls_buckling asks for it") {
    const Results r = run_text(column_project(combinations, checks, "analysis: {sls_buckling: true}\n"), dir.path());
    INFO(r.message());
    REQUIRE(r.analysed());
    // The same axial force pattern scaled: alpha_cr(CHAR) = alpha_cr(STR) x 1.35 x ... compared by the forces:
    // N(STR) = 1.35 x 100 + 1.5 x 50 = 210 kN, N(CHAR) = 150 kN (the 2 kN push does not change N).
    const double str = result_named(r.json(), "STR")["alpha_cr"].get<double>();
    CHECK(result_named(r.json(), "CHAR")["alpha_cr"].get<double>() == Approx(str * 210.0 / 150.0).epsilon(1e-6));
  }
  SECTION("a kind other than uls or sls is refused, naming the line") {
    const Results r = run_text(column_project("  - {name: X, kind: service, factors: {G: 1}}\n", ""), dir.path());
    CHECK(r.status() == ExitStatus::bad_input);
    CHECK_THAT(r.message(), Contains("combinations[0].kind") && Contains("uls") && Contains("sls"));
  }
}
