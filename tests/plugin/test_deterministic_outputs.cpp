// A run's outputs do not depend on how its work was shared out: the same project run on one OpenMP thread
// and on two (the per-member recovery, checks and VTK arrays in parallel, besides the run's own threads
// for the buckling analysis and the writers) writes the same files, byte for byte. The frame is the
// benchmark's generated building (bench/building_model.hpp): columns, beams, pinned secondaries, bracing,
// three cases, two ultimate combinations with their sway variants and a buckling analysis.

#include "test_helpers.hpp"

#include "building_model.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <map>
#include <string>

using namespace stepframe::test;

namespace {

// Every regular file under `folder`, by its path relative to it, with its bytes.
std::map<std::string, std::string> folder_contents(const std::filesystem::path& folder) {
  std::map<std::string, std::string> files;
  for (const auto& entry : std::filesystem::recursive_directory_iterator(folder))
    if (entry.is_regular_file())
      files[std::filesystem::relative(entry.path(), folder).string()] = read_text(entry.path());
  return files;
}

}  // namespace

TEST_CASE("a run writes the same bytes on one thread and on two", "[plugin][cli][threads]") {
  ScratchDir scratch;
  const std::size_t members = stepframe::bench::write_building_model(scratch.path(), {4, 4, 3});
  REQUIRE(members > 200);
  const auto project = stepframe::bench::write_building_project(scratch.path(), "building");

  auto run_on = [&](int threads, const std::string& out) {
    return run_shell("env OMP_NUM_THREADS=" + std::to_string(threads) + " \"" + std::string(STEPFRAME_EXE) +
                         "\" run -q --no-progress \"" + project.string() + "\" --out \"" + (scratch / out).string() +
                         "\"",
                     scratch);
  };
  const CommandResult one = run_on(1, "one"), two = run_on(2, "two");
  // 0 or 1 (a check may fail on the generated frame): what matters is that both runs agree.
  REQUIRE((one.status == 0 || one.status == 1));
  CHECK(two.status == one.status);

  const auto a = folder_contents(scratch / "one"), b = folder_contents(scratch / "two");
  // Every kind of output: the report, results.json, the tables, line models, surfaces and buckling modes.
  for (const char* file : {"report.html", "results.json", "checks.csv", "end_forces.csv", "frame.vtm", "vtk/ULS-1.vtu"})
    CHECK(a.count(file) == 1);
  auto ending = [&](const std::string& tail) {
    return std::count_if(a.begin(), a.end(), [&](const auto& f) { return f.first.ends_with(tail); });
  };
  // Of each combination's four sway variants, the line model of the one that governs it: two in all.
  CHECK(std::count_if(a.begin(), a.end(), [](const auto& f) {
          return f.first.find(".sway") != std::string::npos && f.first.ends_with(".vtu") &&
                 f.first.find(".surface.") == std::string::npos && f.first.find(".mode") == std::string::npos;
        }) == 2);
  CHECK(ending(".surface.vtu") >= 1);
  CHECK(ending(".mode1.vtu") >= 1);
  REQUIRE(a.size() == b.size());
  for (const auto& [name, bytes] : a) {
    INFO(name);
    REQUIRE(b.count(name) == 1);
    CHECK(b.at(name).size() == bytes.size());
    CHECK(b.at(name) == bytes);
  }
}
