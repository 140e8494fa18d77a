// The batch stage against single runs: every project's verdict and governing
// utilisation as `stepframe run` gives them, the worst status as the batch's,
// JUnit XML that counts the same, unchanged projects not run again, and a
// timeout or a crash ending only its own project.

#include "portal_project.hpp"
#include "stepframe/batch.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <regex>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

/// Three projects: a portal that passes, the same portal overloaded (its beam fails), a broken one.
void write_projects(const test::ScratchDir& dir) {
  test::write_portal(dir, 20);
  std::filesystem::rename(dir / "portal.yaml", dir / "light.yaml");
  test::write_portal(dir, 140);
  std::filesystem::rename(dir / "portal.yaml", dir / "heavy.yaml");
  test::write_text(dir / "broken.yaml", "model: portal.stp\nunits: {length: m}\n");  // no cases
  test::write_text(dir / "list.txt", "# the study\nlight.yaml\nheavy.yaml  # overloaded\n\nbroken.yaml\n");
}

std::size_t count(const std::string& text, const std::string& what) {
  std::size_t n = 0;
  for (auto at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

}  // namespace

TEST_CASE("a batch gives each project the verdict its own run gives, the worst status, and JUnit XML") {
  test::ScratchDir dir;
  write_projects(dir);
  const auto batch = test::run_stepframe("batch \"" + (dir / "list.txt").string() + "\" --out \"" + (dir / "out").string() + "\" -j 2", dir);
  CHECK(batch.status == 2);  // the worst of 0, 1 and 2
  CHECK_THAT(batch.out, Contains("competent engineer"));
  const auto j = nlohmann::json::parse(test::read_text(dir / "out" / "batch.json"));
  REQUIRE(j["projects"].size() == 3);
  CHECK(j["schema"] == "stepframe-batch/1");

  // Each against a single `stepframe run` of the same project.
  for (const auto& p : j["projects"]) {
    const std::string name = p["name"];
    const auto single = test::run_stepframe("run \"" + (dir / (name + ".yaml")).string() + "\" --out \"" + (dir / ("single-" + name)).string() + "\"", dir);
    INFO(name);
    CHECK(p["exit_status"].get<int>() == single.status);
    if (single.status > 1) {
      CHECK(p["outcome"] == "bad input");
      CHECK_THAT(p["message"].get<std::string>(), Contains("load case"));
      continue;
    }
    const auto results = nlohmann::json::parse(test::read_text(dir / ("single-" + name) / "results.json"));
    double worst = 0;
    std::size_t failing = 0;
    for (const auto& c : results["checks"]) {
      worst = std::max(worst, c["utilisation"].get<double>());
      failing += c["pass"].get<bool>() ? 0 : 1;
    }
    CHECK(p["governing_utilisation"].get<double>() == Approx(worst).epsilon(1e-9));
    CHECK(p["failing"].size() == failing);
    // The batch's own copy of the project's results is the single run's, number for number.
    const auto batch_results = nlohmann::json::parse(test::read_text(dir / "out" / name / "results.json"));
    CHECK(batch_results["checks"] == results["checks"]);
  }

  const auto xml = test::read_text(dir / "out" / "batch.xml");
  CHECK(count(xml, "<testcase ") == 3);
  CHECK_THAT(xml, Contains("tests=\"3\" failures=\"1\" errors=\"1\""));
  CHECK(count(xml, "<failure ") == 1);
  CHECK(count(xml, "<error ") == 1);
}

TEST_CASE("a batch runs again only what changed, unless forced") {
  test::ScratchDir dir;
  write_projects(dir);
  const std::string args = "batch \"" + (dir / "light.yaml").string() + "\" \"" + (dir / "heavy.yaml").string() + "\" --out \"" +
                           (dir / "out").string() + "\"";
  REQUIRE(test::run_stepframe(args, dir).status == 1);
  auto j = nlohmann::json::parse(test::read_text(dir / "out" / "batch.json"));
  CHECK_FALSE(j["projects"][0]["skipped"].get<bool>());

  test::write_text(dir / "heavy.yaml", test::read_text(dir / "heavy.yaml") + "\n# revised\n");
  REQUIRE(test::run_stepframe(args, dir).status == 1);
  j = nlohmann::json::parse(test::read_text(dir / "out" / "batch.json"));
  CHECK(j["projects"][0]["skipped"].get<bool>());        // light: unchanged
  CHECK_FALSE(j["projects"][1]["skipped"].get<bool>());  // heavy: its file changed
  CHECK(j["projects"][0]["governing_utilisation"].get<double>() > 0);

  REQUIRE(test::run_stepframe(args + " --force", dir).status == 1);
  j = nlohmann::json::parse(test::read_text(dir / "out" / "batch.json"));
  for (const auto& p : j["projects"]) CHECK_FALSE(p["skipped"].get<bool>());
}

TEST_CASE("a timeout or a crash ends only its own project") {
  test::ScratchDir dir;
  write_projects(dir);
  // A stand-in for the program that crashes on the project named heavy and runs the others.
  test::write_text(dir / "flaky.sh", std::string("#!/bin/sh\ncase \"$*\" in *heavy.yaml*) kill -SEGV $$ ;; esac\nexec \"") + STEPFRAME_EXE + "\" \"$@\"\n");
  std::filesystem::permissions(dir / "flaky.sh", std::filesystem::perms::owner_all);
  BatchOptions options;
  options.out_dir = dir / "out";
  options.executable = dir / "flaky.sh";
  options.jobs = 2;
  auto report = run_batch({dir / "light.yaml", dir / "heavy.yaml"}, options);
  REQUIRE(report.entries.size() == 2);
  CHECK(report.entries[0].outcome == "pass");
  CHECK(report.entries[1].outcome == "crashed");
  CHECK_THAT(report.entries[1].message, Contains("signal 11"));
  CHECK(report.exit_status == 4);

  options.executable = STEPFRAME_EXE;
  options.timeout = 0.05;  // no run of a STEP file finishes this soon
  options.force = true;
  report = run_batch({dir / "light.yaml"}, options);
  CHECK(report.entries[0].outcome == "timeout");
  CHECK(report.exit_status == 4);
  CHECK_FALSE(std::filesystem::exists(dir / "out" / "light" / "results.json.tmp"));
}

TEST_CASE("batch inputs: patterns and manifests, and clear refusals") {
  test::ScratchDir dir;
  write_projects(dir);
  CHECK(batch_projects({(dir / "*.yaml").string()}).size() == 3);
  CHECK(batch_projects({(dir / "list.txt").string()}).size() == 3);
  CHECK_THROWS_WITH(batch_projects({(dir / "nothing*.yaml").string()}), Contains("matches no file"));
  test::write_text(dir / "bad.txt", "light.yaml\nmissing.yaml\n");
  CHECK_THROWS_WITH(batch_projects({(dir / "bad.txt").string()}), Contains("bad.txt:2") && Contains("fix the manifest line"));
  const auto r = test::run_stepframe("batch \"" + (dir / "nothing*.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("matches no file"));
}
