// Sway imperfections (EN 1993-1-1 5.3.2) through a run: the equivalent forces
// of each ultimate combination as variants, the 5.3.2(4) verdict in
// results.json, and the project key that switches them off or sets phi.

#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/stepframe.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <cmath>
#include <set>
#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

/// A portal in the XZ plane: HEA 200 columns 4 m high at x = 0 and 6 m, an IPE 300 beam, fixed feet.
void write_portal(const test::ScratchDir& dir) {
  geometry::LineToWrite left{{0, 0, 0}, {0, 0, 4}, {}}, beam{{0, 0, 4}, {6, 0, 4}, {}}, right{{6, 0, 0}, {6, 0, 4}, {}};
  left.attributes.name = "HEA 200";
  right.attributes.name = "HEA 200";
  beam.attributes.name = "IPE 300";
  geometry::write_step_wireframe(dir / "portal.stp", {left, beam, right}, "mm");
}

std::string portal_project(const std::string& analysis, const std::string& push = "0") {
  return "model: portal.stp\nunits: {length: m, force: kN}\n"
         "rules: [{where: {}, material: S355}]\n"
         "supports: [{where: {z: 0}, fix: fixed}]\n"
         "cases:\n"
         "  - {name: G, node_loads: [{where: {z: 4}, force: [" + push + ", 0, -100]}]}\n"
         "combinations:\n"
         "  - {name: ULS, factors: {G: 1.35}}\n"
         "  - {name: SLS, factors: {G: 1.0}}\n"
         "checks: {stress: {}, en1993: {}}\n" + analysis;
}

}  // namespace

TEST_CASE("ultimate combinations are solved with the sway imperfection both ways along X and Y") {
  test::ScratchDir dir;
  write_portal(dir);
  const Results r = run_text(portal_project("outputs: {result_details: combinations}\n"), dir.path());
  INFO(r.message());
  REQUIRE(r.analysed());
  const auto& doc = r.json();
  // Only the ultimate combination, along X and along Y; the serviceability one gets none.
  REQUIRE(doc["sway_imperfections"].size() == 2);
  const auto& x = doc["sway_imperfections"][0];
  CHECK(x["combination"] == "ULS");
  CHECK(x["axis"] == "X");
  // EN 1993-1-1 5.3.2(3) (5.5): h = 4 m, alpha_h = 2/sqrt(4) = 1; two columns in the row along X,
  // 135 kN each: m = 2, alpha_m = sqrt(0.5 (1 + 1/2)) = 0.866; phi = 1/200 x 0.866 = 0.00433.
  CHECK(x["phi"].get<double>() == Approx(0.005 * std::sqrt(0.75)));
  CHECK(x["V_Ed"].get<double>() == Approx(270e3));
  CHECK(x["exempt"] == false);
  CHECK(x["variants"] == nlohmann::json::array({"ULS.sway+X", "ULS.sway-X"}));
  // Along Y each column is a row of its own: m = 1, phi = 1/200.
  CHECK(doc["sway_imperfections"][1]["phi"].get<double>() == Approx(0.005));

  // 5.3.2(7): phi N_Ed at each column top (N_Ed = 1.35 x 100 kN), phi N_Ed back at each foot.
  const Analysis& a = r.analysis();
  double top = 0, foot = 0;
  for (const auto& f : x["forces"]) {
    const auto node = f["node"].get<std::size_t>();
    (a.built.model.nodes[node].z() > 2 ? top : foot) += f["force"][0].get<double>();
    CHECK(f["force"][1].get<double>() == 0.0);
  }
  CHECK(top == Approx(2 * 0.005 * std::sqrt(0.75) * 135e3));
  CHECK(foot == Approx(-top));

  // The variants are results of their own, with no buckling analysis; the checks run under them too.
  std::set<std::string> names;
  for (const auto& res : doc["results"]) names.insert(res["name"].get<std::string>());
  for (const char* v : {"ULS.sway+X", "ULS.sway-X", "ULS.sway+Y", "ULS.sway-Y"}) CHECK(names.count(v) == 1);
  CHECK(names.count("SLS.sway+X") == 0);
  CHECK(names.count("ULS.swayX") == 0);  // the forces' own load case is not a result
  CHECK(names.size() == 7);              // G, ULS, SLS and the four variants
  bool governed_by_variant = false;
  for (const auto& c : doc["checks"])
    governed_by_variant |= c["combination"].get<std::string>().find("ULS.sway") == 0;
  CHECK(governed_by_variant);  // the imperfection adds sway moments to the columns
}

TEST_CASE("sway imperfections: exempt by 5.3.2(4), switched off, or phi set by the project") {
  test::ScratchDir dir;
  write_portal(dir);
  SECTION("H_Ed >= 0.15 V_Ed along X: no X variants") {
    // 25 kN along X on each top: H_Ed = 2 x 1.35 x 25 = 67.5 kN >= 0.15 x 270 = 40.5 kN.
    const Results r = run_text(portal_project("", "25"), dir.path());
    INFO(r.message());
    REQUIRE(r.analysed());
    const auto& x = r.json()["sway_imperfections"][0];
    CHECK(x["H_Ed"].get<double>() == Approx(67.5e3));
    CHECK(x["exempt"] == true);
    CHECK(x["variants"].empty());
    CHECK(r.json()["sway_imperfections"][1]["exempt"] == false);
  }
  SECTION("off") {
    const Results r = run_text(portal_project("analysis: {sway_imperfection: off}\n"), dir.path());
    INFO(r.message());
    REQUIRE(r.analysed());
    CHECK(r.json()["sway_imperfections"].empty());
    CHECK(r.json()["results"].size() == 3);  // G, ULS, SLS
  }
  SECTION("phi given") {
    const Results r = run_text(portal_project("analysis: {sway_imperfection: 0.004}\n"), dir.path());
    INFO(r.message());
    REQUIRE(r.analysed());
    CHECK(r.json()["sway_imperfections"][0]["phi"].get<double>() == Approx(0.004));
  }
  SECTION("a bad value names the key") {
    const Results r = run_text(portal_project("analysis: {sway_imperfection: 0.5}\n"), dir.path());
    CHECK(r.status() == ExitStatus::bad_input);
    CHECK_THAT(r.message(), Contains("analysis.sway_imperfection"));
  }
}

TEST_CASE("sway amplification 1/(1 - 1/alpha_cr) of EN 1993-1-1 5.2.2(5)") {
  // A portal loaded near its buckling load (81 kN per column at ULS; HEA 200 columns bending about their
  // weak axis out of the frame's plane) with 10 kN wind along X at the left top: 3 <= alpha_cr
  // < 10. With the amplification, the +X variant must equal the same frame with the wind factor and phi
  // themselves multiplied by k = 1 / (1 - 1/alpha_cr) (5.2.2(5)B: horizontal loads and the equivalent
  // forces of imperfections amplified). The column forces behind the equivalent forces differ by the
  // wind's overturning (under 1 %, antisymmetric), hence the 1e-3 tolerance on the sway.
  test::ScratchDir dir;
  write_portal(dir);
  auto project = [](const std::string& wind_factor, const std::string& analysis) {
    return "model: portal.stp\nunits: {length: m, force: kN}\n"
           "rules: [{where: {}, material: S355}]\n"
           "supports: [{where: {z: 0}, fix: fixed}]\n"
           "cases:\n"
           "  - {name: G, node_loads: [{where: {z: 4}, force: [0, 0, -60]}]}\n"
           "  - {name: W, node_loads: [{near: [0, 0, 4], force: [10, 0, 0]}]}\n"
           "combinations: [{name: ULS, factors: {G: 1.35, W: " + wind_factor + "}}]\n"
           "checks: {stress: {}}\n" + analysis;
  };
  const Results amplified = run_text(project("1.5", "analysis: {sway_amplification: true}\n"), dir.path());
  INFO(amplified.message());
  REQUIRE(amplified.analysed());
  const auto& x = amplified.json()["sway_imperfections"][0];
  REQUIRE(x["alpha_cr"].is_number());
  const double alpha_cr = x["alpha_cr"].get<double>();
  REQUIRE(alpha_cr >= 3);
  REQUIRE(alpha_cr < 10);
  const double k = 1 / (1 - 1 / alpha_cr);  // (5.4)
  CHECK(x["amplification"].get<double>() == Approx(k));

  char scaled[64], phi[64];
  std::snprintf(scaled, sizeof scaled, "%.15g", 1.5 * k);
  std::snprintf(phi, sizeof phi, "%.15g", x["phi"].get<double>() * k);
  const Results by_hand = run_text(project(scaled, std::string("analysis: {sway_imperfection: ") + phi + "}\n"), dir.path());
  INFO(by_hand.message());
  REQUIRE(by_hand.analysed());
  auto top_sway = [](const Results& r, const std::string& name) {
    const Analysis& a = r.analysis();
    for (const auto& res : a.results)
      if (res.name == name)
        for (std::size_t n = 0; n < a.built.model.nodes.size(); ++n)
          if (a.built.model.nodes[n].isApprox(Eigen::Vector3d(0, 0, 4)))
            return res.displacements(static_cast<Eigen::Index>(6 * n));
    FAIL("no result " << name);
    return 0.0;
  };
  CHECK(top_sway(amplified, "ULS.sway+X") == Approx(top_sway(by_hand, "ULS.sway+X")).epsilon(1e-3));
  // Without the amplification the sway is smaller by about the factor k (wind and imperfection both amplified).
  CHECK(top_sway(amplified, "ULS.sway+X") > 1.1 * top_sway(amplified, "ULS"));
}

TEST_CASE("outputs.result_details: results.json details the governing results, the sway variant that governs, or every result") {
  // Every variant is solved, checked and keeps its reactions; with `combinations` only the variant with
  // the largest member utilisation among a combination's variants keeps its node displacements and
  // member summaries, the same rule as for the line models; by default only the governing results do.
  test::ScratchDir dir;
  write_portal(dir);
  auto detailed = [](const nlohmann::json& doc) {
    std::set<std::string> names;
    for (const auto& res : doc["results"]) {
      const bool has = res.contains("members") && res.contains("displacements");
      CHECK(has != res.contains("left_out"));
      if (!has) CHECK(res["left_out"] == nlohmann::json::array({"displacements", "members"}));
      CHECK(res["reactions"].size() == 2);  // both feet, detailed or not
      if (has) names.insert(res["name"].get<std::string>());
    }
    return names;
  };
  const Results r = run_text(portal_project("outputs: {result_details: combinations}\n"), dir.path());
  INFO(r.message());
  REQUIRE(r.analysed());
  // The variant whose member checks reach the largest utilisation, from the checks themselves.
  std::string worst;
  double largest = -1;
  for (const auto& c : r.json()["checks"]) {
    const auto name = c["combination"].get<std::string>();
    if (!c["member"].is_null() && name.find("ULS.sway") == 0 && c["utilisation"].get<double>() > largest) {
      largest = c["utilisation"].get<double>();
      worst = name;
    }
  }
  REQUIRE(!worst.empty());
  CHECK(detailed(r.json()) == std::set<std::string>{"G", "ULS", "SLS", worst});
  const auto& defaults = r.json()["results"];

  SECTION("all") {
    const Results all = run_text(portal_project("outputs: {result_details: all}\n"), dir.path());
    INFO(all.message());
    REQUIRE(all.analysed());
    CHECK(detailed(all.json()).size() == 7);
    // What the default keeps is written the same.
    for (std::size_t i = 0; i < defaults.size(); ++i)
      if (defaults[i].contains("members")) CHECK(all.json()["results"][i] == defaults[i]);
  }
  SECTION("governing (the default) and none") {
    const Results governing = run_text(portal_project("outputs: {result_details: governing}\n"), dir.path());
    INFO(governing.message());
    REQUIRE(governing.analysed());
    std::set<std::string> expected;
    for (std::size_t i : governing_results(governing.analysis())) expected.insert(governing.analysis().results[i].name);
    CHECK(expected.count(worst) == 1);  // the variant of the largest utilisation
    CHECK(detailed(governing.json()) == expected);
    const Results by_default = run_text(portal_project(""), dir.path());
    REQUIRE(by_default.analysed());
    CHECK(by_default.json()["results"] == governing.json()["results"]);
    const Results none = run_text(portal_project("outputs: {result_details: none}\n"), dir.path());
    REQUIRE(none.analysed());
    CHECK(detailed(none.json()).empty());
  }
  SECTION("a bad value names the key") {
    const Results bad = run_text(portal_project("outputs: {result_details: some}\n"), dir.path());
    CHECK(bad.status() == ExitStatus::bad_input);
    CHECK_THAT(bad.message(), Contains("outputs.result_details") && Contains("got 'some'"));
  }
}
