// Supports and node loads placed by the named or layered points of the CAD
// file (`where: {point_name: ...}` / `{point_layer: ...}`), `near:` alike in
// supports, node loads and settlements, messages for selector keys on the wrong
// level, and the `curve_max_turn` key, on the hand-written portal_edges_ft.stp:
// columns 15 ft high at x = 0 and 20 ft (vertices FOOT-W and FOOT-E), knees on layer KNEES.

#include "stepframe/errors.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "stepframe/model_builder.hpp"
#include "stepframe/project_reader.hpp"
#include "stepframe/run.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

const std::filesystem::path data = STEPFRAME_TEST_DATA;

std::string portal_project(const std::string& supports_where, const std::string& load_where) {
  return "model: " + (data / "portal_edges_ft.stp").string() + "\n"
         "units: {length: m, force: kN}\n"
         "rules:\n  - where: {}\n    section: IPE300\n    material: S355\n"
         "supports:\n  - where: " + supports_where + "\n    fix: fixed\n"
         "cases:\n  - name: H\n    node_loads:\n      - where: " + load_where + "\n        force: [10, 0, -5]\n";
}

struct Built {
  Project project;
  geometry::Wireframe wireframe;
  BuiltModel built;
};

Built build(const std::string& yaml) {
  Built b;
  b.project = read_project_text(yaml, data, "portal.yaml");
  const auto step = geometry::read_step(b.project.model);
  b.wireframe = geometry::build_wireframe(step, wireframe_options(b.project));
  b.built = build_frame_model(b.project, b.wireframe);
  return b;
}

std::size_t node_at(const geometry::Wireframe& frame, const Eigen::Vector3d& p) {
  for (std::size_t i = 0; i < frame.nodes.size(); ++i)
    if ((frame.nodes[i] - p).norm() < 1e-9) return i;
  FAIL("no node at " << p.transpose());
  return 0;
}

}  // namespace

TEST_CASE("supports and node loads select the nodes named points sit on", "[points]") {
  const double ft = 0.3048;  // international yard and pound agreement, 1959
  const Built b = build(portal_project("{point_name: 'FOOT-.*'}", "{point_layer: knees}"));
  const auto& supports = b.built.model.supports;
  REQUIRE(supports.size() == 2);
  std::vector<std::size_t> supported{supports[0].node, supports[1].node};
  std::sort(supported.begin(), supported.end());
  std::vector<std::size_t> feet{node_at(b.wireframe, {0, 0, 0}), node_at(b.wireframe, Eigen::Vector3d(20, 0, 0) * ft)};
  std::sort(feet.begin(), feet.end());
  CHECK(supported == feet);
  // The layer pattern matches case-insensitively: both knees get the load.
  REQUIRE(b.built.model.cases.size() == 1);
  const auto& loads = b.built.model.cases[0].node_loads;
  REQUIRE(loads.size() == 2);
  std::vector<std::size_t> loaded{loads[0].node, loads[1].node};
  std::sort(loaded.begin(), loaded.end());
  std::vector<std::size_t> knees{node_at(b.wireframe, Eigen::Vector3d(0, 0, 15) * ft),
                                 node_at(b.wireframe, Eigen::Vector3d(20, 0, 15) * ft)};
  std::sort(knees.begin(), knees.end());
  CHECK(loaded == knees);
  CHECK(loads[0].force.isApprox(Eigen::Vector3d(10e3, 0, -5e3)));
}

TEST_CASE("both point patterns must match when both are given", "[points]") {
  // FOOT-W has a name and no layer, so the pair matches nothing.
  CHECK_THROWS_WITH(build(portal_project("{point_name: 'FOOT-W', point_layer: '.*'}", "{point_name: FOOT-E}")),
                    Contains("point_name 'FOOT-W' point_layer '.*'"));
  // A knee has a layer and no name: '' matches the empty name.
  const Built b = build(portal_project("{point_name: 'FOOT-.*'}", "{point_name: '', point_layer: KNEES}"));
  CHECK(b.built.model.cases[0].node_loads.size() == 2);
}

TEST_CASE("a point selector that matches nothing names what the model has", "[points][errors]") {
  CHECK_THROWS_AS(build(portal_project("{point_name: COLUMN-BASE}", "{point_name: FOOT-E}")), InputError);
  CHECK_THROWS_WITH(build(portal_project("{point_name: COLUMN-BASE}", "{point_name: FOOT-E}")),
                    Contains("portal.yaml") && Contains("supports[0].where") && Contains("COLUMN-BASE") &&
                        Contains("name 'FOOT-W'") && Contains("layer 'KNEES'"));
}

TEST_CASE("point selectors and curve_max_turn are checked when the project is read", "[points][errors]") {
  const std::string base = "model: frame.stp\ncases: [{name: G, self_weight: true}]\n";
  SECTION("a point name beside coordinates") {
    CHECK_THROWS_WITH(read_project_text(base + "supports: [{where: {point_name: A, z: 0}, fix: fixed}]\n", data, "p.yaml"),
                      Contains("p.yaml:3") && Contains("not both"));
  }
  SECTION("a pattern that is not a regular expression") {
    CHECK_THROWS_WITH(read_project_text(base + "supports: [{where: {point_layer: '(('}, fix: fixed}]\n", data, "p.yaml"),
                      Contains("supports[0].where.point_layer") && Contains("regular expression"));
  }
  SECTION("curve_max_turn in degrees") {
    const Project p = read_project_text(base + "curve_max_turn: 2.5\n", data, "p.yaml");
    CHECK(p.curve_max_turn == Approx(2.5 * std::numbers::pi / 180));
    CHECK(read_project_text(base, data, "p.yaml").curve_max_turn == Approx(5 * std::numbers::pi / 180));
    CHECK_THROWS_WITH(read_project_text(base + "curve_max_turn: 0\n", data, "p.yaml"),
                      Contains("p.yaml:3") && Contains("curve_max_turn") && Contains("degrees"));
  }
}

TEST_CASE("point selectors reach the vertex shells of a shell-based wireframe", "[points][shell]") {
  // bay_vertex_shells_mm.stp: vertex shells name the column bases BASE-A at
  // (0, 0, 0) and BASE-B at (5, 0, 0) m, both on layer ANCHORS.
  const std::string yaml = "model: " + (data / "bay_vertex_shells_mm.stp").string() + "\n"
                           "units: {length: m, force: kN}\n"
                           "rules:\n  - where: {}\n    section: IPE300\n    material: S355\n"
                           "supports:\n  - where: {point_name: 'BASE-B'}\n    fix: fixed\n"
                           "cases:\n  - name: H\n    node_loads:\n      - where: {point_layer: anchors}\n"
                           "        force: [0, 0, -2]\n";
  const Built b = build(yaml);
  REQUIRE(b.built.model.supports.size() == 1);
  CHECK(b.built.model.supports[0].node == node_at(b.wireframe, {5, 0, 0}));
  const auto& loads = b.built.model.cases.at(0).node_loads;
  REQUIRE(loads.size() == 2);
  std::vector<std::size_t> loaded{loads[0].node, loads[1].node};
  std::sort(loaded.begin(), loaded.end());
  std::vector<std::size_t> bases{node_at(b.wireframe, {0, 0, 0}), node_at(b.wireframe, {5, 0, 0})};
  std::sort(bases.begin(), bases.end());
  CHECK(loaded == bases);
}

TEST_CASE("near: stands beside the other keys alike in supports, node loads and settlements", "[points][selectors]") {
  // portal_edges_ft.stp: feet at (0, 0, 0) and (20, 0, 0) ft, knees at 15 ft (the file's points).
  const std::string yaml = "model: " + (data / "portal_edges_ft.stp").string() + "\n"
                           "units: {length: ft, force: kip}\n"
                           "rules:\n  - where: {}\n    section: W12X26\n    material: A992\n"
                           "supports:\n  - near: [0, 0, 0]\n    fix: fixed\n"
                           "  - where: {near: [20, 0, 0]}\n    fix: fixed\n"
                           "cases:\n  - name: S\n    node_loads:\n      - near: [20, 0, 15]\n        force: [1, 0, 0]\n"
                           "    settlements:\n      - near: [0, 0, 0]\n        displacement: {uz: -0.01}\n";
  const Built b = build(yaml);
  REQUIRE(b.built.model.supports.size() == 2);
  CHECK(b.built.model.supports[0].node == node_at(b.wireframe, {0, 0, 0}));
  CHECK(b.built.model.supports[1].node == node_at(b.wireframe, {20 * 0.3048, 0, 0}));
  const auto& lc = b.built.model.cases.at(0);
  REQUIRE(lc.node_loads.size() == 1);
  CHECK(lc.node_loads[0].node == node_at(b.wireframe, {20 * 0.3048, 0, 15 * 0.3048}));
  REQUIRE(lc.settlements.size() == 1);
  CHECK(lc.settlements[0].node == node_at(b.wireframe, {0, 0, 0}));
  CHECK(lc.settlements[0].value == Approx(-0.01 * 0.3048));
}

TEST_CASE("a selector key on the wrong level is refused with the form it belongs in", "[points][selectors][errors]") {
  const auto message = [&](const std::string& yaml) {
    const std::string cases = yaml.find("cases:") == std::string::npos ? "cases: [{name: G, self_weight: true}]\n" : "";
    try {
      read_project_text("model: frame.stp\n" + cases + yaml, data, "p.yaml");
    } catch (const InputError& e) {
      return std::string(e.what());
    }
    return std::string("(accepted)");
  };
  // A plane beside fix: belongs inside where:.
  CHECK_THAT(message("supports: [{z: 0, fix: pinned}]\n"),
             Contains("p.yaml:3 (supports[0].z)") && Contains("goes inside where:") && Contains("where: {z: 0}"));
  // fix: inside where: belongs beside it.
  CHECK_THAT(message("supports: [{where: {z: 0, fix: pinned}}]\n"),
             Contains("supports[0].where.fix") && Contains("goes beside where:") && Contains("fix: pinned"));
  // A member's attribute beside section:, and a section inside where:.
  CHECK_THAT(message("rules: [{layer: BEAMS, section: IPE300}]\n"),
             Contains("rules[0].layer") && Contains("where: {layer: BEAMS}"));
  CHECK_THAT(message("rules: [{where: {layer: BEAMS, section: IPE300}}]\n"),
             Contains("rules[0].where.section") && Contains("goes beside where:"));
  // Nodes are not chosen by layer, members not by plane.
  CHECK_THAT(message("supports: [{where: {layer: BASE}, fix: fixed}]\n"),
             Contains("supports[0].where.layer") && Contains("chooses members") && Contains("near: [x, y, z]"));
  CHECK_THAT(message("cases: [{name: Q, member_loads: [{where: {z: 0}, w: [0, 0, -1]}]}]\n"),
             Contains("where.z") && Contains("chooses nodes") && Contains("where: {layer: ...}"));
  // Both or neither of near: and where:, the same message in all three lists.
  for (const std::string list : {"supports: [{%s fix: fixed}]\n",
                                 "cases: [{name: Q, node_loads: [{%s force: [0, 0, -1]}]}]\n",
                                 "cases: [{name: Q, settlements: [{%s displacement: {uz: -1}}]}]\n"}) {
    const auto with = [&](const std::string& keys) {
      std::string yaml = list;
      return yaml.replace(yaml.find("%s"), 2, keys);
    };
    INFO(list);
    CHECK_THAT(message(with("near: [0, 0, 0], where: {z: 0},")), Contains("use either 'near' or 'where', not both"));
    CHECK_THAT(message(with("")), Contains("needs its nodes: choose nodes with") && Contains("near: [x, y, z]"));
  }
}
