// A run's outputs do not depend on how its work was shared out: the same project run on one OpenMP thread
// and on two (the per-member recovery, checks and VTK arrays in parallel, besides the run's own threads
// for the buckling analysis and the writers) writes the same files, byte for byte. The frame is the
// benchmark's generated building (bench/building_model.hpp): columns, beams, pinned secondaries, bracing,
// three cases, two ultimate combinations with their sway variants and a buckling analysis. Nor on how its
// STEP file was read: in this process, or in two at once (the command line's way for 1,000 members or more).

#include "test_helpers.hpp"

#include "building_model.hpp"
#include "stepframe/stepframe.hpp"

#include <catch2/catch.hpp>
#include <spdlog/sinks/ringbuffer_sink.h>

#include <algorithm>
#include <filesystem>
#include <map>
#include <memory>
#include <string>
#include <vector>

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

TEST_CASE("a run writes the same bytes whether its STEP file is read in one process or in two",
          "[plugin][threads]") {
  ScratchDir scratch;
  const std::size_t members =
      stepframe::bench::write_building_model(scratch.path(), stepframe::bench::building_size_for(1200));
  REQUIRE(members >= 1000);
  const auto project = stepframe::bench::write_building_project(scratch.path(), "building");

  // The run's status and whether its log says the file was read in two processes.
  auto run_reading = [&](std::size_t two_from, const std::string& out) {
    const auto sink = std::make_shared<spdlog::sinks::ringbuffer_sink_mt>(4000);
    stepframe::RunOptions options;
    options.out_dir = scratch / out;
    options.control.log_sink = sink;
    options.control.two_process_read_from = two_from;
    const stepframe::Results results = stepframe::run_file(project, options);
    const std::vector<std::string> log = sink->last_formatted();
    const bool two = std::any_of(log.begin(), log.end(), [](const std::string& line) {
      return line.find("read in two processes") != std::string::npos;
    });
    return std::make_pair(results.status(), two);
  };
  const auto [one_status, one_split] = run_reading(0, "one");
  const auto [two_status, two_split] = run_reading(1000, "two");
  CHECK_FALSE(one_split);
  CHECK(two_split);
  REQUIRE((one_status == stepframe::ExitStatus::pass || one_status == stepframe::ExitStatus::check_failed));
  CHECK(two_status == one_status);

  const auto a = folder_contents(scratch / "one"), b = folder_contents(scratch / "two");
  REQUIRE(a.count("results.json") == 1);
  REQUIRE(a.size() == b.size());
  for (const auto& [name, bytes] : a) {
    INFO(name);
    REQUIRE(b.count(name) == 1);
    CHECK(b.at(name) == bytes);
  }
}
