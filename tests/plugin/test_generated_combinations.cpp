// Generated combinations through the project file and a run: cases with
// categories, `combinations: {generate: ...}` for EN 1990 and ASCE/SEI 7-16,
// their kinds used by the checks, and every generated combination listed
// with its rule and factors in results.json and the report. The factors
// themselves are tested against the standards in tests/analysis/test_combination_rules.cpp.

#include "stepframe/analysis/combination_rules.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/project_reader.hpp"
#include "stepframe/stepframe.hpp"
#include "run_options.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <algorithm>
#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

using test::out_to;

// A portal in the XZ plane (invented test data): HEA 200 columns 4 m high, an IPE 300 beam 6 m long.
void write_portal(const test::ScratchDir& dir) {
  geometry::LineToWrite left{{0, 0, 0}, {0, 0, 4}, {}}, beam{{0, 0, 4}, {6, 0, 4}, {}}, right{{6, 0, 0}, {6, 0, 4}, {}};
  left.attributes.name = "HEA 200";
  right.attributes.name = "HEA 200";
  beam.attributes.name = "IPE 300";
  geometry::write_step_wireframe(dir / "portal.stp", {left, beam, right}, "mm");
}

const std::string portal_cases = R"(model: portal.stp
units: {length: m, force: kN, line_load: kN/m}
rules: [{where: {}, material: S355}]
supports: [{where: {z: 0}, fix: fixed}]
cases:
  - {name: G, category: permanent, self_weight: true}
  - {name: Q, category: imposed_B, member_loads: [{where: {name: IPE.*}, w: [0, 0, -10]}]}
  - {name: W+X, category: wind, group: wind, node_loads: [{near: [0, 0, 4], force: [5, 0, 0]}]}
  - {name: W-X, category: wind, group: wind, node_loads: [{near: [6, 0, 4], force: [-5, 0, 0]}]}
)";

std::string error_of(const test::ScratchDir& dir, const std::string& text) {
  test::write_text(dir / "p.yaml", text);
  try {
    read_project(dir / "p.yaml");
  } catch (const InputError& e) {
    return e.what();
  }
  FAIL("no InputError for:\n" << text);
  return {};
}

}  // namespace

TEST_CASE("generate: EN 1990 writes the combinations of the cases' categories", "[plugin][generated_combinations]") {
  test::ScratchDir dir;
  test::write_text(dir / "p.yaml", portal_cases + "combinations: {generate: {standard: EN 1990}}\n");
  const Project p = read_project(dir / "p.yaml");
  REQUIRE(p.cases[1].category == analysis::ActionCategory::imposed_B);
  CHECK(p.cases[2].group == "wind");
  std::vector<analysis::ActionCase> actions;
  for (const auto& c : p.cases) actions.push_back({c.name, *c.category, c.group, c.psi});
  const auto expected = analysis::en1990_combinations(actions);
  REQUIRE(p.combinations.size() == expected.size());
  for (std::size_t i = 0; i < expected.size(); ++i) {
    CHECK(p.combinations[i].name == expected[i].name);
    CHECK(p.combinations[i].rule == expected[i].rule);
    CHECK(p.combinations[i].serviceability == expected[i].serviceability);
    CHECK(p.combinations[i].factors == expected[i].factors);
  }
  // Overrides reach the generator: gamma_G,sup 1.2 and the wind's psi_0 0.5 (a national annex's choice).
  test::write_text(dir / "p.yaml", portal_cases + R"(combinations:
  - generate: {standard: EN 1990, ultimate: 6.10a/b, gamma_G_sup: 1.2, xi: 0.9, psi: {wind: [0.5, 0.2, 0]},
               serviceability: [characteristic], accidental: false}
  - {name: MINE, factors: {G: 1.0, Q: 1.0}}
)");
  const Project o = read_project(dir / "p.yaml");
  const auto mine = std::find_if(o.combinations.begin(), o.combinations.end(), [](const auto& c) { return c.name == "MINE"; });
  REQUIRE(mine != o.combinations.end());
  CHECK(mine->rule.empty());
  const auto a = std::find_if(o.combinations.begin(), o.combinations.end(), [](const CombinationSpec& c) {
    return c.rule == "EN 1990 6.10a" && c.factors.size() == 3;
  });
  REQUIRE(a != o.combinations.end());
  CHECK(a->factors == std::vector<std::pair<std::string, double>>{{"G", 1.2}, {"Q", 1.5 * 0.7}, {"W+X", 1.5 * 0.5}});
  CHECK(std::none_of(o.combinations.begin(), o.combinations.end(),
                     [](const CombinationSpec& c) { return c.name.rfind("SLS-freq", 0) == 0; }));
}

TEST_CASE("generate: errors name the case, the key and what to write", "[plugin][generated_combinations]") {
  test::ScratchDir dir;
  const std::string no_category = "model: m.stp\ncases: [{name: G, self_weight: true}]\ncombinations: [{generate: {standard: EN 1990}}]\n";
  CHECK_THAT(error_of(dir, no_category), Contains("load case 'G'") && Contains("needs category:"));
  CHECK_THAT(error_of(dir, "model: m.stp\ncases: [{name: G, category: permanant}]\n"),
             Contains("cases[0].category") && Contains("did you mean 'permanent'"));
  CHECK_THAT(error_of(dir, portal_cases + "combinations: [{generate: {standard: BS 5950}}]\n"),
             Contains("combinations[0].generate.standard") && Contains("EN 1990 or ASCE 7"));
  CHECK_THAT(error_of(dir, portal_cases + "combinations: [{generate: {standard: ASCE 7, gamma_Q: 1.6}}]\n"),
             Contains("unknown key 'gamma_Q'"));
  CHECK_THAT(error_of(dir, portal_cases + "combinations: [{generate: {standard: EN 1990}}, {name: ULS-6.10-1, factors: {G: 1}}]\n"),
             Contains("'ULS-6.10-1' is already used"));
  CHECK_THAT(error_of(dir, "model: m.stp\ncases: [{name: G, category: permanent}, {name: R, category: rain}]\n"
                           "combinations: [{generate: {standard: EN 1990}}]\n"),
             Contains("'R'") && Contains("psi: [psi0, psi1, psi2]"));
}

TEST_CASE("generated combinations run: checks use their kinds, results.json and the report list them",
          "[plugin][generated_combinations]") {
  test::ScratchDir dir;
  write_portal(dir);
  const std::string text = portal_cases + R"(combinations: {generate: {standard: ASCE 7}}
checks: {stress: {}, deflection: {}}
analysis: {buckling_modes: 0, sway_imperfection: off}
)";
  const Results r = run_text(text, dir.path(), out_to(dir / "out"));
  INFO(r.message());
  REQUIRE(r.analysed());
  const auto& doc = r.json();
  const auto& combos = doc["combinations"];
  REQUIRE(combos.size() == r.analysis().project.combinations.size());
  // ASCE/SEI 7-16 2.3.1 (5): 0.9D + 1.0W, with each wind direction.
  std::size_t lrfd5 = 0;
  for (const auto& c : combos)
    if (c["rule"] == "ASCE/SEI 7-16 2.3.1 (5)") {
      ++lrfd5;
      CHECK(c["limit_state"] == "uls");
      CHECK(c["factors"]["G"].get<double>() == Approx(0.9));
    }
  CHECK(lrfd5 == 2);
  // Stresses are checked under the strength (2.3.1) combinations, deflections under the 2.4.1 ones.
  for (const auto& c : doc["checks"]) {
    const std::string name = c["combination"];
    CHECK(name.rfind(c["check"] == "deflection" ? "ASD-" : "LRFD-", 0) == 0);
  }
  const std::string report = test::read_text(dir / "out" / "report.html");
  CHECK_THAT(report, Contains("ASCE/SEI 7-16 2.4.1 (6)"));
}
