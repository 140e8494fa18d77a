// Section suggestions on a frame where the first upsizing moves forces onto
// a neighbour (invented test data): a sway load at the head of column Q1 is
// shared with column N1 through a pin-ended link A1. The link, too thin,
// fails in tension; a larger link is stiffer, so N1 receives more of the load
// and, already heavily loaded by its own vertical load, fails in the next
// analysis. The suggestion must settle with every check passing, and every
// suggested section must be the lightest that does: pasted into the project
// it passes, one size lighter it fails (each checked by its own run).

#include "stepframe/geometry/step_writer.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <algorithm>
#include <sstream>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

// The project with `extra_rules` (YAML list items) appended to its rules, which come last in the file.
std::string project_text(const std::string& extra_rules = "") {
  return R"(model: frame.stp
units: {length: m, force: kN}
supports:
  - where: {z: 0}
    fix: fixed
cases:
  - name: ULS
    node_loads:
      - near: [0, 0, 2]
        force: [450, 0, 0]
      - near: [5, 0, 2]
        force: [0, 0, -4100]
checks:
  stress: {combinations: [ULS]}
analysis:
  buckling_modes: 0
  sway_imperfection: off
suggest:
  sections: [CHS48.3X3.2HF, CHS60.3X4HF, CHS88.9X5HF, CHS114.3X6.3HF, HEB]
rules:
  - where: {}
    material: S355
  - where: {name: Q1}
    section: HEB300
  - where: {name: N1}
    section: HEB400
  - where: {name: A1}
    section: CHS48.3X3.2HF
    release: {start: [ry, rz], end: [ry, rz]}
)" + extra_rules;
}

void write_frame(const test::ScratchDir& dir) {
  auto line = [](Eigen::Vector3d a, Eigen::Vector3d b, const char* name) {
    geometry::LineToWrite l{a, b, {}};
    l.attributes.name = name;
    return l;
  };
  geometry::write_step_wireframe(dir / "frame.stp",
                                 {line({0, 0, 0}, {0, 0, 2}, "Q1"), line({5, 0, 0}, {5, 0, 2}, "N1"),
                                  line({0, 0, 2}, {5, 0, 2}, "A1")},
                                 "mm");
  test::write_text(dir / "frame.yaml", project_text());
}

// Governing utilisation per member name of a run's results.json.
std::map<std::string, double> utilisation_by_name(const nlohmann::json& results) {
  std::map<std::string, double> u;
  for (const auto& c : results["checks"]) {
    const std::string name = results["members"][c["member"].get<std::size_t>()]["source"]["name"];
    u[name] = std::max(u[name], c["utilisation"].get<double>());
  }
  return u;
}

// The suggest.yaml rules (the lines after "rules:").
std::string pasted_rules(const std::string& yaml) {
  const auto at = yaml.find("rules:\n");
  REQUIRE(at != std::string::npos);
  return yaml.substr(at + 7);
}

}  // namespace

TEST_CASE("suggest: the first upsizing moves forces onto a neighbour; the suggestion settles on the lightest passing sections") {
  test::ScratchDir dir;
  write_frame(dir);
  const auto first = test::run_stepframe("run \"" + (dir / "frame.yaml").string() + "\" --out \"" + (dir / "first").string() + "\"", dir);
  REQUIRE(first.status == 1);
  const auto u0 = utilisation_by_name(nlohmann::json::parse(test::read_text(dir / "first" / "results.json")));
  CHECK(u0.at("A1") > 1);   // the link fails
  CHECK(u0.at("N1") <= 1);  // its neighbour passes, for now
  CHECK(u0.at("Q1") <= 1);

  const auto r = test::run_stepframe("suggest \"" + (dir / "frame.yaml").string() + "\" --out \"" + (dir / "sug").string() + "\"", dir);
  INFO(r.out << r.err);
  REQUIRE(r.status == 0);
  CHECK_THAT(r.out, Contains("competent engineer"));
  const auto j = nlohmann::json::parse(test::read_text(dir / "sug" / "suggest.json"));
  CHECK(j["settled"] == true);
  CHECK(j["status"] == "pass");
  REQUIRE(j["rounds"].size() >= 2);
  // Round 1 changes the link only; the neighbour changes in a later round, after the re-analysis.
  const auto round1 = j["rounds"][0]["changes"].dump();
  CHECK_THAT(round1, Contains("A1"));
  CHECK_THAT(round1, !Contains("N1"));
  CHECK(j["rounds"][0]["failing_after"].get<int>() > 0);
  std::map<std::string, std::string> to;
  for (const auto& c : j["changes"]) to[c["group"].get<std::string>()] = c["to"];
  REQUIRE(to.count("name 'N1'"));
  REQUIRE(to.count("name 'A1'"));
  CHECK(to.count("name 'Q1'") == 0);  // relieved, never failing: left alone
  for (const auto& c : j["changes"])
    if (c["group"] == "name 'N1'") CHECK(c["round"].get<int>() >= 2);

  // Pasted into the project, the rules pass; the mass change is the one reported.
  const std::string yaml = test::read_text(dir / "sug" / "suggest.yaml");
  CHECK_THAT(yaml, Contains("# was CHS48.3X3.2HF") && Contains("Mass "));
  test::write_text(dir / "frame.yaml", project_text(pasted_rules(yaml)));
  const auto pasted = test::run_stepframe("run \"" + (dir / "frame.yaml").string() + "\" --out \"" + (dir / "pasted").string() + "\"", dir);
  CHECK(pasted.status == 0);
  const auto after = nlohmann::json::parse(test::read_text(dir / "pasted" / "results.json"));
  double mass = 0;
  for (const auto& m : after["members"]) mass += m["mass"].get<double>();
  CHECK(j["mass"]["after"].get<double>() == Approx(mass).epsilon(1e-9));

  // One size lighter than suggested (in the allowed list, by mass), the others as suggested: a check fails.
  const std::vector<std::string> chs{"CHS48.3X3.2HF", "CHS60.3X4HF", "CHS88.9X5HF", "CHS114.3X6.3HF"};
  const std::vector<std::string> heb{"HEB300", "HEB320", "HEB340", "HEB360", "HEB400", "HEB450", "HEB500", "HEB550", "HEB600"};
  for (const auto& [group, designation] : to) {
    const auto& list = designation.rfind("CHS", 0) == 0 ? chs : heb;
    const auto at = std::find(list.begin(), list.end(), designation);
    REQUIRE(at != list.end());
    REQUIRE(at != list.begin());
    const std::string name = group.substr(6, 2);  // "name 'N1'" -> N1
    const std::string lighter = pasted_rules(yaml) + "  - where: {name: " + name + "}\n    section: " + *(at - 1) + "\n";
    test::write_text(dir / "frame.yaml", project_text(lighter));
    const auto light = test::run_stepframe("run \"" + (dir / "frame.yaml").string() + "\" --out \"" + (dir / ("light-" + name)).string() + "\"", dir);
    INFO(name << " at " << *(at - 1));
    CHECK(light.status == 1);
  }
}

TEST_CASE("run --suggest writes the suggestion beside the results and keeps the run's own verdict") {
  test::ScratchDir dir;
  write_frame(dir);
  const auto r = test::run_stepframe("run \"" + (dir / "frame.yaml").string() + "\" --out \"" + (dir / "out").string() + "\" --suggest", dir);
  CHECK(r.status == 1);  // the frame as modelled still fails
  CHECK(std::filesystem::exists(dir / "out" / "results.json"));
  const auto j = nlohmann::json::parse(test::read_text(dir / "out" / "suggest" / "suggest.json"));
  CHECK(j["status"] == "pass");
  CHECK_THAT(test::read_text(dir / "out" / "suggest" / "suggest.yaml"), Contains("section: "));
}

TEST_CASE("suggest: the suggest block refuses a section list item that names nothing") {
  test::ScratchDir dir;
  write_frame(dir);
  std::string text = project_text();
  text.replace(text.find("HEB]"), 4, "HEXX]");
  test::write_text(dir / "frame.yaml", text);
  const auto r = test::run_stepframe("suggest \"" + (dir / "frame.yaml").string() + "\"", dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("suggest.sections[4]") && Contains("HEXX"));
}
