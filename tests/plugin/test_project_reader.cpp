// Project-file reading: values in SI, and errors that name the file, the line and the key.

#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/model_builder.hpp"
#include "stepframe/project_reader.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>

#include <array>
#include <numbers>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

const char* minimal = R"(model: frame.stp
units: {length: mm, force: kN, stress: MPa, line_load: kN/m}
cases:
  - name: G
    self_weight: true
)";

Project read(const test::ScratchDir& dir, const std::string& text) {
  test::write_text(dir / "p.yaml", text);
  return read_project(dir / "p.yaml");
}

std::string error_of(const test::ScratchDir& dir, const std::string& text) {
  try {
    read(dir, text);
  } catch (const InputError& e) {
    return e.what();
  }
  FAIL("no InputError for:\n" << text);
  return {};
}

}  // namespace

TEST_CASE("a full project reads into SI values") {
  test::ScratchDir dir;
  const auto p = read(dir, R"(model: frame.stp
units: {length: mm, force: kN, stress: MPa, line_load: kN/m}
merge_tolerance: 2.5
materials:
  MY_STEEL: {E: 210000, G: 81000, fy: 355, density: "7850 kg/m3"}
sections:
  GIRDER_1: {A: 12000, Iy: 9.5e8, Iz: 4.0e7, J: 2.0e6, depth: 800, width: 300}
rules:
  - where: {layer: COLUMNS}
    section: HEB200
    material: S355
    roll: 90
supports:
  - where: {z: 0}
    fix: fixed
  - where: {near: [6000, 0, 0]}
    fix: [ux, uz]
cases:
  - name: G
    self_weight: true
    member_loads:
      - where: {layer: BEAMS}
        w: [0, 0, -4.5]
  - name: Q
    node_loads:
      - near: [4000, 0, 3000]
        force: [0, 0, -20]
        moment: ["1 kN*m", 0, 0]
combinations:
  - name: ULS
    factors: {G: 1.35, Q: 1.5}
checks:
  stress: {combinations: [ULS]}
  deflection: {span_ratio: 250, combinations: [Q]}
)");
  CHECK(p.model == dir / "frame.stp");
  CHECK(p.merge_tolerance == Approx(2.5e-3));
  REQUIRE(p.materials.count("MY_STEEL") == 1);
  CHECK(p.materials.at("MY_STEEL").E == Approx(210e9));
  CHECK(p.materials.at("MY_STEEL").fy == Approx(355e6));
  CHECK(p.materials.at("MY_STEEL").density == Approx(7850));
  REQUIRE(p.sections.count("GIRDER_1") == 1);
  CHECK(p.sections.at("GIRDER_1").A == Approx(0.012));
  CHECK(p.sections.at("GIRDER_1").Iy == Approx(9.5e-4));
  CHECK(p.sections.at("GIRDER_1").depth == Approx(0.8));
  REQUIRE(p.rules.size() == 1);
  CHECK(*p.rules[0].roll == Approx(std::numbers::pi / 2));
  REQUIRE(p.supports.size() == 2);
  CHECK(p.supports[0].fixed == std::array<bool, 6>{true, true, true, true, true, true});
  CHECK(p.supports[1].fixed == std::array<bool, 6>{true, false, true, false, false, false});
  CHECK((*p.supports[1].where.near - Eigen::Vector3d(6, 0, 0)).norm() < 1e-12);
  REQUIRE(p.cases.size() == 2);
  CHECK(p.cases[0].member_loads[0].w.z() == Approx(-4500));  // 4.5 kN/m
  CHECK(p.cases[1].node_loads[0].force.z() == Approx(-20000));
  CHECK(p.cases[1].node_loads[0].moment.x() == Approx(1000));
  REQUIRE(p.combinations.size() == 1);
  CHECK(p.combinations[0].factors[1] == std::pair<std::string, double>{"Q", 1.5});
  CHECK(p.checks.stress->combinations == std::vector<std::string>{"ULS"});
  CHECK(p.checks.deflection->span_ratio == 250);
}

TEST_CASE("without units, bare numbers are millimetres and kilonewtons") {
  test::ScratchDir dir;
  const auto p = read(dir, "model: f.stp\ncases:\n  - name: Q\n    node_loads:\n      - near: [1000, 0, 0]\n        force: [0, 0, -2]\n");
  CHECK(p.cases[0].node_loads[0].where.near->x() == Approx(1.0));
  CHECK(p.cases[0].node_loads[0].force.z() == Approx(-2000));
  // Without checks, stresses are screened under every case when there are no combinations.
  CHECK(p.checks.stress->combinations == std::vector<std::string>{"Q"});
}

TEST_CASE("errors name the file, the line and the key") {
  test::ScratchDir dir;
  SECTION("unknown key, with a suggestion") {
    const auto e = error_of(dir, std::string(minimal) + "suports:\n  - where: {z: 0}\n    fix: fixed\n");
    CHECK_THAT(e, Contains("p.yaml:6") && Contains("unknown key 'suports'") && Contains("did you mean 'supports'"));
  }
  SECTION("unknown unit") {
    const auto e = error_of(dir, "model: f.stp\nunits: {length: furlong}\ncases: [{name: G}]\n");
    CHECK_THAT(e, Contains("p.yaml:2") && Contains("units.length") && Contains("furlong"));
  }
  SECTION("a quantity of the wrong kind") {
    const auto e = error_of(dir, std::string(minimal) + "materials:\n  M: {E: \"3.5 m\", G: 81000, fy: 355, density: 7850}\n");
    CHECK_THAT(e, Contains("p.yaml:7") && Contains("materials.M.E") && Contains("stress is needed"));
  }
  SECTION("an implausible value points at the units") {
    const auto e = error_of(dir, "model: f.stp\nmaterials:\n  M: {E: 210000, G: 81000, fy: 355, density: 7850}\ncases: [{name: G}]\n");
    CHECK_THAT(e, Contains("materials.M.E") && Contains("kN/mm2") && Contains("units.stress"));
  }
  SECTION("a combination of a case that does not exist") {
    const auto e = error_of(dir, std::string(minimal) + "combinations:\n  - name: ULS\n    factors: {G: 1.35, Qq: 1.5}\n");
    CHECK_THAT(e, Contains("p.yaml:8") && Contains("no load case is named 'Qq'"));
  }
  SECTION("a check naming an unknown combination") {
    const auto e = error_of(dir, std::string(minimal) + "checks:\n  stress: {combinations: [ULS]}\n");
    CHECK_THAT(e, Contains("checks.stress.combinations[0]") && Contains("'ULS'"));
  }
  SECTION("a bad regular expression") {
    const auto e = error_of(dir, std::string(minimal) + "rules:\n  - where: {layer: \"[BEAMS\"}\n    section: IPE300\n");
    CHECK_THAT(e, Contains("p.yaml:7") && Contains("rules[0].where.layer") && Contains("regular expression"));
  }
  SECTION("not YAML at all") {
    const auto e = error_of(dir, "model: [unclosed\ncases: 3\n");
    CHECK_THAT(e, Contains("p.yaml") && Contains("not valid YAML"));
  }
  SECTION("no load case") {
    const auto e = error_of(dir, "model: f.stp\n");
    CHECK_THAT(e, Contains("no load case"));
  }
}

TEST_CASE("analysis settings, releases, springs, settlements and general member loads read into SI values") {
  test::ScratchDir dir;
  const auto p = read(dir, R"(model: frame.stp
units: {length: mm, force: kN, stress: MPa, line_load: kN/m}
analysis: {shear_deformation: true, second_order: true, buckling_modes: 2}
rules:
  - where: {layer: BRACES}
    release: {start: [ry, rz], end: [rx, ry, rz]}
supports:
  - where: {z: 0}
    fix: [ux, uy]
    springs: {uz: "5000 kN/m", ry: "2000 kN*m"}
cases:
  - name: G
    member_loads:
      - where: {layer: BEAMS}
        w: [0, 0, -4]
        w_end: [0, 0, -10]
        from: 1000
        to: 2500
        axes: projected
      - where: {layer: BEAMS}
        point: [0, 0, -20]
        at: 1500
        axes: local
    settlements:
      - where: {near: [0, 0, 0]}
        displacement: {uz: -12, ry: 0.002}
)");
  CHECK(p.shear_deformation);
  CHECK(p.second_order);
  CHECK(p.buckling_modes == 2);
  REQUIRE(p.rules.size() == 1);
  REQUIRE(p.rules[0].release.has_value());
  CHECK((*p.rules[0].release)[0] == std::array<bool, 6>{false, false, false, false, true, true});
  CHECK((*p.rules[0].release)[1] == std::array<bool, 6>{false, false, false, true, true, true});
  REQUIRE(p.supports.size() == 1);
  CHECK(p.supports[0].fixed == std::array<bool, 6>{true, true, false, false, false, false});
  CHECK(p.supports[0].spring[2] == Approx(5e6));   // N/m
  CHECK(p.supports[0].spring[4] == Approx(2e6));   // N m per radian
  const auto& loads = p.cases[0].member_loads;
  REQUIRE(loads.size() == 2);
  CHECK(loads[0].w.z() == Approx(-4e3));
  CHECK(loads[0].w_end->z() == Approx(-10e3));
  CHECK(*loads[0].from == Approx(1.0));
  CHECK(*loads[0].to == Approx(2.5));
  CHECK(loads[0].axes == LoadAxesSpec::projected);
  CHECK(loads[1].w.z() == Approx(-20e3));  // N
  CHECK(*loads[1].at == Approx(1.5));
  CHECK(loads[1].axes == LoadAxesSpec::local);
  REQUIRE(p.cases[0].settlements.size() == 1);
  CHECK(*p.cases[0].settlements[0].value[2] == Approx(-0.012));
  CHECK(*p.cases[0].settlements[0].value[4] == Approx(0.002));
  CHECK_FALSE(p.cases[0].settlements[0].value[0].has_value());
}

TEST_CASE("errors in the analysis keys name the file, the line and the key") {
  test::ScratchDir dir;
  SECTION("an unknown release direction") {
    const auto e = error_of(dir, std::string(minimal) + "rules:\n  - where: {}\n    release: {start: [ry, rq]}\n");
    CHECK_THAT(e, Contains("p.yaml:8") && Contains("rules[0].release.start[1]") && Contains("'rq'"));
  }
  SECTION("a point load without its position") {
    const auto e = error_of(dir, "model: f.stp\ncases:\n  - name: Q\n    member_loads:\n      - where: {}\n        point: [0, 0, -5]\n");
    CHECK_THAT(e, Contains("p.yaml:5") && Contains("cases[0].member_loads[0]") && Contains("needs at:"));
  }
  SECTION("to before from") {
    const auto e = error_of(dir, "model: f.stp\ncases:\n  - name: Q\n    member_loads:\n      - where: {}\n        w: [0, 0, -5]\n        from: 3000\n        to: 1000\n");
    CHECK_THAT(e, Contains("p.yaml:8") && Contains("member_loads[0].to") && Contains("greater than 'from'"));
  }
  SECTION("an unknown load axes") {
    const auto e = error_of(dir, "model: f.stp\ncases:\n  - name: Q\n    member_loads:\n      - where: {}\n        w: [0, 0, -5]\n        axes: sideways\n");
    CHECK_THAT(e, Contains("p.yaml:7") && Contains("member_loads[0].axes") && Contains("global, local or projected"));
  }
  SECTION("a spring that is not positive") {
    const auto e = error_of(dir, std::string(minimal) + "supports:\n  - where: {z: 0}\n    springs: {uz: -5}\n");
    CHECK_THAT(e, Contains("p.yaml:8") && Contains("supports[0].springs") && Contains("positive"));
  }
  SECTION("a settlement in an unknown direction") {
    const auto e = error_of(dir, "model: f.stp\ncases:\n  - name: S\n    settlements:\n      - where: {near: [0, 0, 0]}\n        displacement: {dz: -5}\n");
    CHECK_THAT(e, Contains("p.yaml:6") && Contains("settlements[0].displacement.dz") && Contains("unknown key"));
  }
  SECTION("an analysis key that does not exist") {
    const auto e = error_of(dir, std::string(minimal) + "analysis: {second_ordre: true}\n");
    CHECK_THAT(e, Contains("p.yaml:6") && Contains("analysis.second_ordre") && Contains("did you mean 'second_order'"));
  }
}

TEST_CASE("releases that make a member a mechanism are refused at the rule") {
  test::ScratchDir dir;
  const auto e = error_of(dir, std::string(minimal) + "rules:\n  - where: {layer: TIES}\n    release: {start: [rx], end: [rx]}\n");
  CHECK_THAT(e, Contains("p.yaml:8") && Contains("rules[0].release") && Contains("rx at the start") &&
                    Contains("free to move"));
}

TEST_CASE("orient_to turns each member's local z towards a point") {
  // Local axes convention (README, "Member axes"): a roll r gives z = -sin(r) y0 + cos(r) z0.
  test::ScratchDir dir;
  const auto p = read(dir, std::string(minimal) + "rules:\n  - where: {}\n    section: IPE300\n    material: S355\n"
                                                  "    orient_to: [3000, 5000, 0]\n");
  REQUIRE(p.rules[0].orient_to);
  CHECK(p.rules[0].orient_to->isApprox(Eigen::Vector3d(3, 5, 0)));

  geometry::Wireframe frame;
  frame.nodes = {{0, 0, 0}, {6, 0, 0}, {6, 0, 4}};
  frame.members = {{{0, 1}, {}, false}, {{1, 2}, {}, false}};
  const auto built = build_frame_model(p, frame);
  for (const auto& element : built.model.elements) {
    const Eigen::Matrix3d axes = analysis::local_axes(built.model.nodes[element.nodes[0]],
                                                      built.model.nodes[element.nodes[1]], element.roll);
    // The beam along X at z = 0 points its z at +Y; the vertical column points its z at the
    // point's offset from its axis, (-3, 5, 0) normalised.
    const Eigen::Vector3d mid = 0.5 * (built.model.nodes[element.nodes[0]] + built.model.nodes[element.nodes[1]]);
    Eigen::Vector3d v = Eigen::Vector3d(3, 5, 0) - mid;
    v -= v.dot(axes.row(0).transpose()) * axes.row(0).transpose();
    CHECK(axes.row(2).transpose().isApprox(v.normalized(), 1e-12));
  }
  CHECK(built.model.elements[0].roll == Approx(-std::numbers::pi / 2));

  const auto on_axis = read(dir, std::string(minimal) + "rules:\n  - where: {}\n    section: IPE300\n    material: S355\n"
                                                        "    orient_to: [9000, 0, 0]\n");
  CHECK_THROWS_WITH(build_frame_model(on_axis, frame), Contains("p.yaml:7") && Contains("orient_to lies on the axis"));
}
