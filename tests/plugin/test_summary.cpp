// The run summary on stdout: every failing check first (frame-level ones
// before members'), then the highest passing ones, how many more there are and
// where they are; columns named for what they hold; grammatical counts.

#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <sstream>
#include <vector>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

const std::filesystem::path demo = std::filesystem::path(STEPFRAME_SOURCE_DIR) / "data" / "demo";

std::string replaced(std::string text, const std::string& from, const std::string& to) {
  const auto at = text.find(from);
  REQUIRE(at != std::string::npos);
  return text.replace(at, from.size(), to);
}

/// The rows of the summary's check table: from its header to the "governing:" line.
std::vector<std::string> check_rows(const std::string& summary) {
  std::istringstream in(summary.substr(summary.find("member  source")));
  std::vector<std::string> rows;
  std::string line;
  std::getline(in, line);  // the header
  while (std::getline(in, line) && line.rfind("governing:", 0) != 0) rows.push_back(line);
  return rows;
}

}  // namespace

TEST_CASE("the summary lists every failing check first, frame-level ones before members'", "[plugin][cli][summary]") {
  // The demo with a walkway load seven times its own (the IPE 200s fail) and a stability
  // limit above the frame's alpha_cr (the frame fails).
  test::ScratchDir dir;
  std::filesystem::copy_file(demo / "platform.stp", dir / "platform.stp");
  std::string project = test::read_text(demo / "platform.yaml");
  project = replaced(project, "w: [0, 0, -4.5]", "w: [0, 0, -30]");
  project = replaced(project, "alpha_cr_min: 10", "alpha_cr_min: 40");
  test::write_text(dir / "platform.yaml", project);

  const auto r = test::run_stepframe("run \"" + (dir / "platform.yaml").string() + "\"", dir);
  INFO(r.out << r.err);
  REQUIRE(r.status == 1);
  // A run whose checks fail writes its files (README, "Exit status").
  const auto results = nlohmann::json::parse(test::read_text(dir / "platform-results" / "results.json"));
  REQUIRE(std::filesystem::exists(dir / "platform-results" / "checks.csv"));
  std::size_t failing = 0, frame_failing = 0;
  for (const auto& c : results["checks"]) {
    failing += !c["pass"].get<bool>();
    frame_failing += !c["pass"].get<bool>() && c["member"].is_null();
  }
  REQUIRE(failing > 2);
  REQUIRE(frame_failing == 2);  // ULS-1 and ULS-2

  // The columns say what they hold.
  CHECK_THAT(r.out, Contains("case or comb.") && Contains("combination     util."));
  CHECK(r.out.find("result ") == std::string::npos);
  CHECK_THAT(r.out, Contains(std::to_string(results["checks"].size() - failing) + " of " +
                             std::to_string(results["checks"].size()) + " pass, " + std::to_string(failing) + " fail"));

  const auto rows = check_rows(r.out);
  // Every failing check, the frame's first, then the five highest passing ones.
  REQUIRE(rows.size() == failing + 1 + 5 + 1);
  for (std::size_t i = 0; i < failing; ++i) {
    INFO(rows[i]);
    CHECK_THAT(rows[i], Contains("FAIL"));
    CHECK((rows[i].rfind(" frame", 0) == 0) == (i < frame_failing));
  }
  CHECK_THAT(rows[failing], Contains("highest passing"));
  for (std::size_t i = failing + 1; i < failing + 6; ++i) CHECK(rows[i].find("FAIL") == std::string::npos);
  const std::size_t more = results["checks"].size() - failing - 5;
  CHECK_THAT(rows.back(), Contains("... and " + std::to_string(more) + " more passing checks") &&
                              Contains("checks.csv") && Contains("results.json"));
  CHECK_THAT(r.out, Contains("governing: the frame: frame stability"));
  CHECK_THAT(r.out, Contains("(21 members, 16 nodes, 3 load cases, 3 combinations + 8 with sway imperfections"));
}
