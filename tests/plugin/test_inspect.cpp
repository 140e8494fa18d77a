// `stepframe inspect` through a project file: the members its rules leave
// without a section or material (which `run` refuses), and the project's
// wireframe keys (join_crossings) applied as `run` applies them.

#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/inspect.hpp"
#include "stepframe/project_reader.hpp"
#include "test_helpers.hpp"

#include "building_model.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <string>
#include <vector>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

const std::filesystem::path data = STEPFRAME_TEST_DATA;

// A 6 m beam named "IPE 300" (its section comes from its name) and a 4 m
// brace named "brace" on layer BRACING (no designation anywhere), in mm.
void write_beam_and_brace(const test::ScratchDir& dir) {
  geometry::LineToWrite beam{{0, 0, 0}, {6, 0, 0}, {}};
  beam.attributes.name = "IPE 300";
  beam.attributes.layers = {"BEAMS"};
  beam.attributes.product = "SHED";
  geometry::LineToWrite brace{{0, 0, 0}, {0, 0, 4}, {}};
  brace.attributes.name = "brace";
  brace.attributes.layers = {"BRACING"};
  brace.attributes.product = "SHED";
  geometry::write_step_wireframe(dir / "shed.stp", {beam, brace}, "mm");
}

const std::string shed_project =
    "model: shed.stp\n"
    "units: {length: m, force: kN}\n"
    "rules:\n  - where: {}\n    material: S355\n"
    "supports:\n  - where: {z: 0}\n    fix: fixed\n"
    "cases:\n  - name: G\n    self_weight: true\n";

}  // namespace

TEST_CASE("inspect through a project lists the members left without a section", "[inspect]") {
  test::ScratchDir dir;
  write_beam_and_brace(dir);
  test::write_text(dir / "shed.yaml", shed_project);

  auto r = test::run_stepframe("inspect \"" + (dir / "shed.yaml").string() + "\" --json", dir);
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  const auto j = nlohmann::json::parse(r.out);
  CHECK(j["member_count"] == 2);
  CHECK(j["project"].get<std::string>() == (dir / "shed.yaml").string());
  REQUIRE(j["unassigned_members"].size() == 1);
  const auto& brace = j["unassigned_members"][0];
  CHECK(brace["source"]["name"] == "brace");
  CHECK(brace["missing"] == std::vector<std::string>{"section"});
  // It names the brace's own STEP entity, as the member list does.
  const std::size_t id = brace["id"].get<std::size_t>();
  const std::string entity = brace["source"]["entity"].get<std::string>();
  CHECK(entity.rfind('#', 0) == 0);
  CHECK(j["members"][id]["source"]["entity"] == entity);

  r = test::run_stepframe("inspect \"" + (dir / "shed.yaml").string() + "\"", dir);
  REQUIRE(r.status == 0);
  CHECK_THAT(r.out, Contains("members without section or material: 1") && Contains(entity) && Contains("brace") &&
                        Contains("BRACING") && Contains("competent engineer"));

  // `run` refuses the same member, by the same entity.
  r = test::run_stepframe("run \"" + (dir / "shed.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("1 member has no section") && Contains(entity));

  // A rule for the brace leaves nothing unassigned.
  const std::string fixed = shed_project.substr(0, shed_project.find("supports:")) +
                            "  - where: {layer: BRACING}\n    section: IPE100\n" +
                            shed_project.substr(shed_project.find("supports:"));
  test::write_text(dir / "shed.yaml", fixed);
  r = test::run_stepframe("inspect \"" + (dir / "shed.yaml").string() + "\" --json", dir);
  REQUIRE(r.status == 0);
  CHECK(nlohmann::json::parse(r.out)["unassigned_members"].empty());
}

TEST_CASE("inspect through a project: bad input is exit status 2 with the file named", "[inspect][errors]") {
  test::ScratchDir dir;
  write_beam_and_brace(dir);
  test::write_text(dir / "shed.yaml", shed_project.substr(0, shed_project.find("supports:")) +
                                          "  - where: {layer: BRACING}\n    section: NOPE123\n" +
                                          shed_project.substr(shed_project.find("supports:")));
  auto r = test::run_stepframe("inspect \"" + (dir / "shed.yaml").string() + "\"", dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("shed.yaml") && Contains("NOPE123"));
  test::write_text(dir / "missing.yaml", "model: nowhere.stp\ncases: [{name: G, self_weight: true}]\n");
  r = test::run_stepframe("inspect \"" + (dir / "missing.yaml").string() + "\"", dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("nowhere.stp"));
}

TEST_CASE("the project's join_crossings key joins crossed braces", "[inspect][crossings]") {
  // x_braced_wall_mm.stp: two bays of crossed braces (the file's header).
  const std::string base =
      "model: " + (data / "x_braced_wall_mm.stp").string() + "\ncases: [{name: G, self_weight: true}]\n";
  auto inspect = [&](const std::string& extra) {
    test::ScratchDir dir;
    test::write_text(dir / "wall.yaml", base + extra);
    return inspect_project(dir / "wall.yaml");
  };
  auto count = [](const Inspection& in, const std::string& code) {
    std::size_t n = 0;
    for (const auto& d : in.wireframe.diagnostics) n += d.code == code;
    return n;
  };
  const Inspection apart = inspect("");
  CHECK(apart.wireframe.nodes.size() == 6);
  CHECK(count(apart, "members-cross") == 2);
  const Inspection joined = inspect("join_crossings: true\n");
  CHECK(joined.wireframe.members.size() == 9);
  CHECK(joined.wireframe.nodes.size() == 8);
  CHECK(count(joined, "crossing-joined") == 2);
  CHECK(count(joined, "members-cross") == 0);
  // The key is a yes/no; anything else names the line.
  CHECK_THROWS_WITH(read_project_text(base + "join_crossings: sometimes\n", data, "wall.yaml"),
                    Contains("wall.yaml:3") && Contains("join_crossings"));

  // A rule joins only the crossings of the members it selects: bay 1's braces, not bay 2's.
  const Inspection by_rule = inspect("rules:\n  - where: {name: 'brace 1.*'}\n    join_crossings: true\n");
  CHECK(count(by_rule, "crossing-joined") == 1);
  CHECK(count(by_rule, "members-cross") == 1);
  CHECK(by_rule.wireframe.nodes.size() == 7);
  CHECK(by_rule.wireframe.members.size() == 9);
  // One brace of the pair is not enough.
  const Inspection one_side = inspect("rules:\n  - where: {name: 'brace 1 up'}\n    join_crossings: true\n");
  CHECK(count(one_side, "crossing-joined") == 0);
  CHECK(count(one_side, "members-cross") == 2);
  CHECK_THROWS_WITH(
      read_project_text(base + "rules:\n  - where: {layer: BRACING}\n    join_crossings: often\n", data, "wall.yaml"),
      Contains("wall.yaml:5") && Contains("rules[0].join_crossings"));
}

TEST_CASE("inspect through a project shows each member's section and material and the support nodes",
          "[inspect]") {
  test::ScratchDir dir;
  write_beam_and_brace(dir);
  test::write_text(dir / "shed.yaml",
                   "model: shed.stp\n"
                   "units: {length: m, force: kN}\n"
                   "rules:\n"
                   "  - where: {}\n    material: S355\n"
                   "  - where: {layer: BRACING}\n    section: CHS60.3X4\n"
                   "  - where: {layer: ROOF}\n    section: IPE200\n"  // matches nothing: a warning
                   "supports:\n  - near: [6, 0, 0]\n    fix: pinned\n"
                   "  - where: {point_name: BASE}\n    fix: fixed\n"  // the model has no named points
                   "cases:\n  - name: G\n    self_weight: true\n"
                   "    member_loads:\n      - where: {name: PURLIN}\n        w: [0, 0, -1]\n"  // no such member
                   "    node_loads:\n      - near: [40, 0, 0]\n        force: [0, 0, -1]\n");  // 34 m off

  auto r = test::run_stepframe("inspect \"" + (dir / "shed.yaml").string() + "\"", dir);
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  // The beam takes its section from its name, the brace from the rule at line 6; both S355 from line 4.
  CHECK_THAT(r.out, Contains("IPE300") && Contains("name 'IPE 300'"));
  CHECK_THAT(r.out, Contains("CHS60.3X4") && Contains("rules[1] (line 6)"));
  CHECK_THAT(r.out, Contains("S355") && Contains("rules[0] (line 4)"));
  // One support node, counted grammatically, with its place and fixity.
  CHECK_THAT(r.out, Contains("supports: 1 node found") && Contains("(6.000, 0.000, 0.000)") && Contains("pinned"));
  // The rule and the support that select nothing are warned about, by line.
  CHECK_THAT(r.out, Contains("warning: ") && Contains("shed.yaml:8 (rules[2].where)") && Contains("matches no member"));
  CHECK_THAT(r.out, Contains("supports[1]") && Contains("no named or layered point"));
  CHECK_THAT(r.out, Contains("shed.yaml:19 (cases[0].member_loads[0].where): this load matches no member"));
  CHECK_THAT(r.out, Contains("cases[0].node_loads[0].near): no node near (40, 0, 0) m"));
  CHECK_THAT(r.out, Contains("0 errors, 0 warnings, 0 notes"));

  r = test::run_stepframe("inspect \"" + (dir / "shed.yaml").string() + "\" --json", dir);
  REQUIRE(r.status == 0);
  const auto j = nlohmann::json::parse(r.out);
  for (const auto& m : j["members"]) {
    CHECK(m["material"] == "S355");
    CHECK(m["section"] == (m["source"]["name"] == "brace" ? "CHS60.3X4" : "IPE300"));
  }
  REQUIRE(j["supports"].size() == 2);
  CHECK(j["supports"][0]["nodes"].size() == 1);
  CHECK(j["supports"][0]["fixity"] == "pinned");
  CHECK(j["supports"][1]["nodes"].empty());
  CHECK_THAT(j["supports"][1]["problem"].get<std::string>(), Contains("point_name 'BASE'"));
  CHECK(j["warnings"].size() == 4);
}

TEST_CASE("inspecting a large frame gives the same whether its file is read in one process or in two",
          "[inspect][two-processes]") {
  // The benchmark's generated building (bench/building_model.hpp), 1,000 members or more.
  test::ScratchDir dir;
  REQUIRE(stepframe::bench::write_building_model(dir.path(), stepframe::bench::building_size_for(1200)) >= 1000);
  const auto file = dir / "building.stp";
  const std::string whole = inspection_json(inspect_step(file)).dump(1);
  geometry::StepReadOptions two;
  two.two_processes_from = 1000;
  CHECK(inspection_json(inspect_step(file, 1e-3, two)).dump(1) == whole);
  // The command line reads it in two processes (its log says so), and prints the same JSON.
  const auto r = test::run_stepframe("-v inspect --json \"" + file.string() + "\"", dir);
  CHECK(r.status == 0);
  CHECK_THAT(r.err, Contains("read in two processes"));
  CHECK(r.out == whole + "\n");
  // So does `stepframe init`; the starter project it writes reads back (in one process) to the same frame.
  const auto init = test::run_stepframe("-v init \"" + file.string() + "\"", dir);
  CHECK(init.status == 0);
  CHECK_THAT(init.err, Contains("read in two processes"));
  const Inspection back = inspect_project(dir / "building.yaml");
  const Inspection alone = inspect_step(file);
  CHECK(back.wireframe.members.size() == alone.wireframe.members.size());
  CHECK(back.wireframe.nodes.size() == alone.wireframe.nodes.size());
}
