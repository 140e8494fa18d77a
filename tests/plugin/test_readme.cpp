// The README's statements hold: its project-file example reads as a project,
// and its command-line claims (help, exit statuses) are what the command does.

#include "stepframe/project_reader.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

const std::filesystem::path source_dir = STEPFRAME_SOURCE_DIR;

/// The first ```yaml block after `heading` in the README.
std::string yaml_block_after(const std::string& readme, const std::string& heading) {
  const auto section = readme.find(heading);
  REQUIRE(section != std::string::npos);
  const auto open = readme.find("```yaml\n", section);
  REQUIRE(open != std::string::npos);
  const auto start = open + 8;
  return readme.substr(start, readme.find("```", start) - start);
}

}  // namespace

TEST_CASE("the README's project-file example reads as a project", "[plugin][readme]") {
  const auto readme = test::read_text(source_dir / "README.md");
  const auto yaml = yaml_block_after(readme, "## Project file");
  const Project p = read_project_text(yaml, source_dir / "data" / "demo", "README.md");
  CHECK(p.length_unit == "mm");
  CHECK(p.supports.size() == 4);
  REQUIRE(p.supports[1].where.near);  // near: beside fix:
  CHECK(p.supports[1].where.near->y() == Approx(4.0));
  REQUIRE(p.cases.size() == 3);
  CHECK(p.cases[1].node_loads.at(0).where.near);
  CHECK(p.cases[2].settlements.at(0).where.near);
  // The outputs block reads too.
  CHECK_NOTHROW(read_project_text("model: platform.stp\ncases: [{name: G, self_weight: true}]\n" +
                                      yaml_block_after(readme, "## Outputs"),
                                  source_dir / "data" / "demo", "README.md"));
}

TEST_CASE("the README's exit-status table is the one the command's help lists", "[plugin][readme]") {
  const auto readme = test::read_text(source_dir / "README.md");
  test::ScratchDir dir;
  const auto help = test::run_stepframe("--help", dir).out;
  for (const std::string status : {"0", "1", "2", "3", "4"}) {
    INFO(status);
    CHECK_THAT(readme, Contains("| " + status + " | "));
    CHECK_THAT(help, Contains((status == "0" ? "Exit status: " : "; ") + status + " "));
  }
  // What a failing run writes, whatever the line breaks.
  std::string flat;
  for (char c : readme) flat += (c == '\n' || c == ' ') ? (flat.empty() || flat.back() == ' ' ? std::string() : std::string(" ")) : std::string(1, c);
  CHECK_THAT(flat, Contains("A run whose checks fail (exit 1) writes every file"));
}
