// Command-line conventions: per-subcommand help, version, log levels, JSON on
// stdout, no progress line off a terminal, and `stepframe init`.

#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/project_reader.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

/// A portal: two 3 m columns (layer COLUMNS, "HE 200 B") standing at z = 250 mm and a
/// 5 m beam (layer BEAMS, "IPE 300", part PORTAL-1), written in millimetres.
void write_portal(const std::filesystem::path& file) {
  const double z0 = 0.25, h = 3.0, span = 5.0;
  geometry::LineToWrite left{{0, 0, z0}, {0, 0, z0 + h}, {}}, right{{span, 0, z0}, {span, 0, z0 + h}, {}},
      beam{{0, 0, z0 + h}, {span, 0, z0 + h}, {}};
  for (auto* column : {&left, &right}) {
    column->attributes.name = "HE 200 B";
    column->attributes.layers = {"COLUMNS"};
  }
  beam.attributes.name = "IPE 300";
  beam.attributes.layers = {"BEAMS"};
  beam.attributes.product = "PORTAL-1";
  geometry::write_step_wireframe(file, {left, right, beam}, "mm");
}

std::string quoted(const std::filesystem::path& p) { return "\"" + p.string() + "\""; }

}  // namespace

TEST_CASE("stepframe init writes a starter project that loads as written") {
  test::ScratchDir dir;
  write_portal(dir / "portal.stp");
  const auto r = test::run_stepframe("init " + quoted(dir / "portal.stp"), dir);
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  CHECK_THAT(r.out, Contains("portal.yaml"));
  const auto text = test::read_text(dir / "portal.yaml");

  // Valid as written: one self-weight case, the lowest nodes as supports.
  const auto project = read_project(dir / "portal.yaml");
  CHECK(project.model == dir / "portal.stp");
  CHECK(project.length_unit == "mm");
  CHECK(project.merge_tolerance == Approx(1e-3));
  REQUIRE(project.cases.size() == 1);
  CHECK(project.cases[0].name == "G");
  CHECK(project.cases[0].self_weight);
  REQUIRE(project.supports.size() == 1);
  REQUIRE(project.supports[0].where.z);
  CHECK(*project.supports[0].where.z == Approx(0.25));  // the column feet, read back in metres
  // The portal lies in the x-z plane: pinned in it, held out of it (rx, rz).
  CHECK(project.supports[0].fixed == std::array<bool, 6>{true, true, true, true, false, true});
  CHECK_THAT(text, Contains("the 2 lowest nodes"));

  // The designations recognised in the names become active rules after one material rule for every member.
  REQUIRE(project.rules.size() == 3);
  CHECK(project.rules[0].material == "S355");
  CHECK_FALSE(project.rules[0].where.name);
  CHECK(project.rules[1].where.name == "HE 200 B");
  CHECK(project.rules[1].section == "HEB200");
  CHECK(project.rules[2].where.name == "IPE 300");
  CHECK(project.rules[2].section == "IPE300");
  CHECK_THAT(text, Contains("material: S355") && Contains("CHECK: assumed for every member"));
  // The other attribute values become commented stubs with their member counts.
  CHECK_THAT(text, Contains("#  - where: {layer: \"COLUMNS\"}") && Contains("# 2 members"));
  CHECK_THAT(text, Contains("#  - where: {layer: \"BEAMS\"}") && Contains("# 1 member\n"));
  CHECK_THAT(text, Contains("#  - where: {product: \"PORTAL-1\"}"));

  SECTION("an existing file is kept unless --force") {
    test::write_text(dir / "portal.yaml", "# mine\n");
    const auto again = test::run_stepframe("init " + quoted(dir / "portal.stp"), dir);
    CHECK(again.status == 2);
    CHECK_THAT(again.err, Contains("exists already") && Contains("--force"));
    CHECK(test::read_text(dir / "portal.yaml") == "# mine\n");
    CHECK(test::run_stepframe("init " + quoted(dir / "portal.stp") + " --force", dir).status == 0);
    CHECK(test::read_text(dir / "portal.yaml") == text);
  }
  SECTION("--output names the file; the model path is written relative to it") {
    std::filesystem::create_directories(dir / "projects");
    REQUIRE(test::run_stepframe("init " + quoted(dir / "portal.stp") + " -o " + quoted(dir / "projects" / "p.yaml"), dir)
                .status == 0);
    CHECK_THAT(test::read_text(dir / "projects" / "p.yaml"), Contains("model: \"../portal.stp\""));
    CHECK(std::filesystem::equivalent(read_project(dir / "projects" / "p.yaml").model, dir / "portal.stp"));
  }
  SECTION("a file that is not STEP is bad input") {
    test::write_text(dir / "notes.stp", "not a STEP file\n");
    const auto bad = test::run_stepframe("init " + quoted(dir / "notes.stp"), dir);
    CHECK(bad.status == 2);
    CHECK_THAT(bad.err, Contains("notes.stp"));
    CHECK_FALSE(std::filesystem::exists(dir / "notes.yaml"));
  }
}

TEST_CASE("command-line conventions") {
  test::ScratchDir dir;
  SECTION("--help per subcommand and --version") {
    const auto help = test::run_stepframe("init --help", dir);
    CHECK(help.status == 0);
    CHECK_THAT(help.out, Contains("MODEL") && Contains("--force") && Contains("--output"));
    const auto run_help = test::run_stepframe("run --help", dir);
    CHECK(run_help.status == 0);
    CHECK_THAT(run_help.out, Contains("--json") && Contains("--out"));
    const auto version = test::run_stepframe("--version", dir);
    CHECK(version.status == 0);
    CHECK_THAT(version.out, Contains("stepframe 0."));
    CHECK(test::run_stepframe("no-such-command", dir).status == 2);
  }
  SECTION("help names the program, the exit statuses and what each subcommand writes") {
    const auto help = test::run_stepframe("--help", dir);
    CHECK(help.status == 0);
    CHECK_THAT(help.out, Contains("Usage: stepframe [OPTIONS] SUBCOMMAND"));
    CHECK(help.out.find(STEPFRAME_EXE) == std::string::npos);  // not the path it was started by
    CHECK_THAT(help.out, Contains("Exit status: 0 every check passes; 1 ") && Contains("2 bad input") &&
                             Contains("3 the frame is unstable") && Contains("4 internal error"));
    CHECK_THAT(help.out, Contains("Writes results.json, report.html, checks.csv") && Contains("writes no file") &&
                             Contains("Writes MODEL.yaml"));
    const auto run_help = test::run_stepframe("run --help", dir);
    CHECK_THAT(run_help.out, Contains("Usage: stepframe run") && Contains("also when checks fail") &&
                                 Contains("Exit status:"));
    CHECK_THAT(test::run_stepframe("sections --help", dir).out, Contains("writes no file"));
  }
  SECTION("a run off a terminal: data on stdout, no progress line, -q and -v after the subcommand") {
    write_portal(dir / "portal.stp");
    test::write_text(dir / "portal.yaml", R"(model: portal.stp
units: {length: mm, force: kN}
rules: [{where: {}, material: S355}]
supports: [{where: {z: 250}, fix: fixed}]
cases: [{name: G, self_weight: true}]
)");
    const auto out = quoted(dir / "out");
    const auto normal = test::run_stepframe("run " + quoted(dir / "portal.yaml") + " --out " + out + " --json", dir);
    INFO(normal.err);
    REQUIRE(normal.status == 0);
    const auto summary = nlohmann::json::parse(normal.out);  // stdout holds the JSON document only
    CHECK(summary["status"] == "pass");
    CHECK(summary["exit_status"] == 0);
    CHECK(summary["checks"].size() == 3);
    CHECK_THAT(normal.err, Contains("info:"));
    CHECK(normal.err.find('\r') == std::string::npos);  // no progress line when stderr is a file

    const auto quiet = test::run_stepframe("run " + quoted(dir / "portal.yaml") + " --out " + out + " -q", dir);
    CHECK(quiet.status == 0);
    CHECK(quiet.err.find("info:") == std::string::npos);
    const auto verbose = test::run_stepframe("run " + quoted(dir / "portal.yaml") + " --out " + out + " -v", dir);
    CHECK(verbose.status == 0);
    CHECK_THAT(verbose.err, Contains("debug: factorisation ..."));
  }
}
