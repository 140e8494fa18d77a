// Traps that real CAD exports set, end to end: columns drawn a little out of
// plumb, and sections given by their properties under torque.

#include "stepframe/analysis/section.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/stepframe.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <cmath>
#include <iomanip>
#include <sstream>
#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

/// A value with its unit, all its digits.
std::string si(double value, const char* unit) {
  std::ostringstream s;
  s << std::setprecision(15) << value << ' ' << unit;
  return s.str();
}

/// The diagnostics of results.json with the given code.
std::vector<nlohmann::json> diagnostics_with(const nlohmann::json& doc, const std::string& code) {
  std::vector<nlohmann::json> out;
  for (const auto& d : doc["diagnostics"])
    if (d["code"] == code) out.push_back(d);
  return out;
}

}  // namespace

TEST_CASE("columns drawn out of plumb: within 0.25 degrees they are columns, up to 5 degrees a warning") {
  // Three 3 m columns on layer COLUMNS, tops drifted by 0.01 mm and 1 mm in X and by 60 mm (1.15 degrees)
  // in Y; cantilevers under a 10 kN push along X at the top.
  test::ScratchDir dir;
  std::vector<geometry::LineToWrite> lines;
  const double drifts[] = {1e-5, 1e-3, 0.060};
  for (int k = 0; k < 3; ++k) {
    const double x = 4.0 * k;
    geometry::LineToWrite line{{x, 0, 0}, {k < 2 ? x + drifts[k] : x, k < 2 ? 0.0 : drifts[k], 3.0}, {}};
    line.attributes.name = "HEA 200 C" + std::to_string(k + 1);
    line.attributes.layers = {"COLUMNS"};
    lines.push_back(line);
  }
  geometry::write_step_wireframe(dir / "columns.stp", lines, "mm");
  const Results results = run_text(R"(model: columns.stp
units: {length: m, force: kN}
rules: [{where: {}, material: S355}]
supports: [{where: {z: 0}, fix: [ux, uy, uz, rx, ry, rz]}]
cases:
  - name: PUSH
    node_loads: [{where: {z: 3}, force: [10, 0, 0]}]
)",
                                   dir.path());
  INFO(results.message());
  REQUIRE(results.analysed());
  const nlohmann::json& doc = results.json();
  const auto near_vertical = diagnostics_with(doc, "near-vertical-member");
  REQUIRE(near_vertical.size() == 1);
  CHECK_THAT(near_vertical[0]["message"].get<std::string>(),
             Contains("C3") && Contains("1.15 degrees") && Contains("orient_to"));

  // The two columns within the tolerance sway as plumb columns bent about the strong axis (depth along
  // X): P L^3 / (3 E Iy), Roark's Formulas for Stress and Strain, Table 8.1 case 1a. The leaning one
  // is oriented as an inclined member, strong axis horizontal (y = Z x x, along X for a lean in Y), so the
  // push along X bends it about its weak axis.
  const auto hea200 = analysis::find_catalogue_section("HEA200");
  REQUIRE(hea200);
  const double P = 10e3, L = 3.0, E = 210e9;
  // Sway of each column top (the node at z = 3 nearest x = 4 k) along X.
  const Analysis& a = results.analysis();
  auto top_sway = [&](int k) {
    for (std::size_t n = 0; n < a.built.model.nodes.size(); ++n) {
      const Eigen::Vector3d& p = a.built.model.nodes[n];
      if (std::abs(p.z() - 3.0) < 1e-9 && std::abs(p.x() - 4.0 * k) < 0.1)
        return a.results[0].displacements(static_cast<Eigen::Index>(6 * n));
    }
    FAIL("no top node for column " << k + 1);
    return 0.0;
  };
  const double plumb = P * L * L * L / (3 * E * hea200->Iy);
  CHECK(top_sway(0) == Approx(plumb).epsilon(1e-4));
  CHECK(top_sway(1) == Approx(plumb).epsilon(1e-4));
  CHECK(top_sway(2) > 2 * plumb);
}

TEST_CASE("a section given by properties under torque: torsion modulus, thickest plate, or left out") {
  // A 2 m cantilever with an IPE 300's properties given by number, 2 kN*m torque at its tip.
  // Thin open section: tau = T t / It (Roark's Formulas for Stress and Strain, Table 10.7, thin-walled
  // open sections); given a torsion modulus, tau = T / Wt; von Mises sqrt(3) tau (EN 1993-1-1 6.2.1(5)).
  const auto ipe = analysis::find_catalogue_section("IPE300");
  REQUIRE(ipe);
  const double T = 2e3, tf = 0.0107;
  test::ScratchDir dir;
  geometry::LineToWrite line{{0, 0, 0}, {2, 0, 0}, {}};
  line.attributes.name = "shaft";
  geometry::write_step_wireframe(dir / "shaft.stp", {line}, "mm");
  auto project = [&](const std::string& extra) {
    return "model: shaft.stp\nunits: {length: m, force: kN}\n"
           "sections:\n  BEAM-300: {A: \"" + si(ipe->A, "m2") + "\", Iy: \"" + si(ipe->Iy, "m4") + "\", Iz: \"" +
           si(ipe->Iz, "m4") + "\", J: \"" + si(ipe->J, "m4") + "\", depth: 0.3, width: 0.15" + extra + "}\n"
           "rules: [{where: {}, section: BEAM-300, material: S355}]\n"
           "supports: [{where: {x: 0}, fix: [ux, uy, uz, rx, ry, rz]}]\n"
           "cases: [{name: TWIST, node_loads: [{where: {x: 2}, moment: [2, 0, 0]}]}]\n";
  };
  auto stress_of = [&](const Results& r) {
    INFO(r.message());
    REQUIRE(r.analysed());
    for (const auto& c : r.json()["checks"])
      if (c["check"] == "stress") return c["value"].get<double>();
    FAIL("no stress check");
    return 0.0;
  };

  SECTION("thickest plate: thin open section") {
    const Results r = run_text(project(", thickest_plate: 10.7 mm"), dir.path());
    CHECK(stress_of(r) == Approx(std::sqrt(3.0) * T * tf / ipe->J).epsilon(1e-3));
    CHECK(diagnostics_with(r.json(), "torsion-stress-unknown").empty());
  }
  SECTION("torsion modulus") {
    const double Wt = ipe->J / tf;
    const Results r = run_text(project(", torsion_modulus: \"" + si(Wt, "m3") + "\""), dir.path());
    CHECK(stress_of(r) == Approx(std::sqrt(3.0) * T / Wt).epsilon(1e-3));
  }
  SECTION("neither: torsion left out, with a warning naming the section") {
    const Results r = run_text(project(""), dir.path());
    CHECK(stress_of(r) < 1e3);  // pure torque, no torsional shear counted: (almost) no stress
    const auto notes = diagnostics_with(r.json(), "torsion-stress-unknown");
    REQUIRE(notes.size() == 1);
    CHECK_THAT(notes[0]["message"].get<std::string>(), Contains("BEAM-300") && Contains("torsion_modulus"));
  }
}

TEST_CASE("a member split at a T-junction reports the forces at its inner node; notes on node loads and supports") {
  // A 6 m simply supported IPE 300 beam along X with a 2 m hanger ending on it at midspan, 10 kN hung on
  // the hanger's foot: midspan moment P L / 4 = 15 kN*m and shear P / 2 either side (Roark's Formulas for
  // Stress and Strain, Table 8.1 case 1e), the shear jumping by P at the inner node.
  test::ScratchDir dir;
  geometry::LineToWrite beam{{0, 0, 0}, {6, 0, 0}, {}}, hanger{{3, 0, 0}, {3, 0, -2}, {}};
  beam.attributes.name = "IPE 300";
  hanger.attributes.name = "IPE 300";
  geometry::write_step_wireframe(dir / "tee.stp", {beam, hanger}, "mm");
  const Results r = run_text(R"(model: tee.stp
units: {length: m, force: kN}
rules: [{where: {}, material: S355}]
supports:
  - {where: {x: 0}, fix: [ux, uy, uz, rx]}
  - {where: {x: 6}, fix: [uy, uz, rx]}
  - {where: {near: [0, 0, 0]}, fix: [uy]}
cases:
  - {name: HUNG, node_loads: [{where: {z: -2}, force: [0, 0, -10]}]}
  - {name: PLANE, node_loads: [{where: {z: 0}, force: [0, 0, -1]}]}
)",
                             dir.path());
  INFO(r.message());
  REQUIRE(r.analysed());
  const auto& doc = r.json();
  const auto& members = doc["results"][0]["members"];
  const nlohmann::json* split = nullptr;
  for (const auto& m : members)
    if (m.contains("inner_nodes")) split = &m;
  REQUIRE(split != nullptr);
  REQUIRE((*split)["inner_nodes"].size() == 1);
  const auto& inner = (*split)["inner_nodes"][0];
  CHECK(inner["x"].get<double>() == Approx(3.0));
  const auto before = inner["before"].get<std::vector<double>>(), after = inner["after"].get<std::vector<double>>();
  CHECK(std::abs(before[4]) == Approx(15e3).epsilon(1e-6));  // My = P L / 4
  CHECK(std::abs(after[4]) == Approx(15e3).epsilon(1e-6));
  CHECK(std::abs(before[2]) == Approx(5e3).epsilon(1e-6));  // Vz = P / 2 either side
  CHECK(std::abs(before[2] - after[2]) == Approx(10e3).epsilon(1e-6));

  const auto plane = diagnostics_with(doc, "node-load-on-every-node");
  REQUIRE(plane.size() == 1);  // the z: -2 plane holds one node, the z: 0 plane three
  CHECK_THAT(plane[0]["message"].get<std::string>(), Contains("3 nodes") && Contains("full force"));
  const auto combined = diagnostics_with(doc, "supports-combined");
  REQUIRE(combined.size() == 1);
  CHECK_THAT(combined[0]["message"].get<std::string>(), Contains("supports[0]") && Contains("supports[2]"));
}
