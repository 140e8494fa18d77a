// The `stepframe` launcher: it adds the allocator's settings to GLIBC_TUNABLES (the caller's own win),
// names OpenBLAS' kernels for the processor in OPENBLAS_CORETYPE (the caller's own name wins), and becomes
// stepframe-engine beside it with the same arguments, whose exit status is the command's. The engine is
// stood in for by a shell script that reports what it was given, but in the last test, where OpenBLAS
// itself reports the kernels it runs.

#include "stepframe/analysis/blas_kernels.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>

#include <filesystem>
#include <regex>

#include <unistd.h>

using namespace stepframe::test;

namespace {

struct Launched {
  CommandResult result;
  std::string tunables, args, coretype;
};

// Runs a copy of the launcher in `scratch` (beside the stand-in engine, if any) with GLIBC_TUNABLES and
// OPENBLAS_CORETYPE as given (empty: not set).
Launched launch(const ScratchDir& scratch, const std::string& tunables, bool with_engine, int engine_status = 0,
                const std::string& coretype = "") {
  const auto launcher = scratch / "stepframe";
  std::filesystem::copy_file(STEPFRAME_EXE, launcher, std::filesystem::copy_options::overwrite_existing);
  const auto engine = scratch / "stepframe-engine";
  std::filesystem::remove(engine);
  if (with_engine) {
    write_text(engine, "#!/bin/sh\nprintf '%s\\n' \"$GLIBC_TUNABLES\" > \"" + (scratch / "tunables.txt").string() +
                           "\"\nprintf '%s' \"${OPENBLAS_CORETYPE-(unset)}\" > \"" + (scratch / "coretype.txt").string() +
                           "\"\nprintf '%s|' \"$0\" \"$@\" > \"" + (scratch / "args.txt").string() + "\"\nexit " +
                           std::to_string(engine_status) + "\n");
    std::filesystem::permissions(engine, std::filesystem::perms::owner_all);
  }
  // env's options (-u) before its NAME=VALUE pairs: the first word after a pair is the command.
  const std::string env = std::string("env ") + (tunables.empty() ? "-u GLIBC_TUNABLES " : "") +
                          (coretype.empty() ? "-u OPENBLAS_CORETYPE " : "") +
                          (tunables.empty() ? "" : "GLIBC_TUNABLES='" + tunables + "' ") +
                          (coretype.empty() ? "" : "OPENBLAS_CORETYPE='" + coretype + "' ");
  Launched l;
  l.result = run_shell(env + "\"" + launcher.string() + "\" run 'a b.yaml' --out x 2>\"" +
                           (scratch / "launcher-stderr.txt").string() + "\"",
                       scratch);
  l.result.err = read_text(scratch / "launcher-stderr.txt");
  if (with_engine) {
    l.tunables = read_text(scratch / "tunables.txt");
    l.args = read_text(scratch / "args.txt");
    l.coretype = read_text(scratch / "coretype.txt");
  }
  return l;
}

// As many heaps as cores online, at least two.
std::string arena_max() {
  const long cores = sysconf(_SC_NPROCESSORS_ONLN);
  return "glibc.malloc.arena_max=" + std::to_string(cores > 2 ? cores : 2);
}

}  // namespace

TEST_CASE("the stepframe launcher hands its arguments and the allocator's settings to the engine", "[plugin][cli]") {
  ScratchDir scratch;
  SECTION("no settings of the caller's: all five are added, the arguments pass unchanged") {
    const Launched l = launch(scratch, "", true);
    CHECK(l.result.status == 0);
    CHECK(l.tunables ==
          "glibc.malloc.hugetlb=1:glibc.malloc.mmap_threshold=33554432:glibc.malloc.trim_threshold=268435456:"
          "glibc.malloc.top_pad=67108864:" + arena_max() + "\n");
    // $0 of the script is the engine's path; then each argument as given (one with a space).
    CHECK(l.args == (scratch / "stepframe-engine").string() + "|run|a b.yaml|--out|x|");
  }
  SECTION("the caller's settings are kept, and a name the caller set is not set again") {
    const Launched l = launch(scratch, "glibc.malloc.hugetlb=0:glibc.cpu.x86_rep_movsb_threshold=4096", true);
    CHECK(l.tunables ==
          "glibc.malloc.hugetlb=0:glibc.cpu.x86_rep_movsb_threshold=4096:glibc.malloc.mmap_threshold=33554432:"
          "glibc.malloc.trim_threshold=268435456:glibc.malloc.top_pad=67108864:" + arena_max() + "\n");
  }
  SECTION("the engine's exit status is the command's") {
    CHECK(launch(scratch, "", true, 3).result.status == 3);
  }
  SECTION("without the engine beside it: status 4 and a message naming the missing file") {
    const Launched l = launch(scratch, "", false);
    CHECK(l.result.status == 4);
    CHECK(l.result.err.find((scratch / "stepframe-engine").string()) != std::string::npos);
  }
}

TEST_CASE("the stepframe launcher names OpenBLAS' kernels for the processor unless the caller did",
          "[plugin][cli]") {
  ScratchDir scratch;
  const std::string best(stepframe::analysis::openblas_core_for(stepframe::analysis::this_processor()));
  SECTION("not named by the caller: the best set this processor runs, or left unset without AVX2 and FMA") {
    CHECK(launch(scratch, "", true).coretype == (best.empty() ? "(unset)" : best));
  }
  SECTION("named by the caller: kept as given") {
    CHECK(launch(scratch, "", true, 0, "Prescott").coretype == "Prescott");
  }
}

TEST_CASE("OpenBLAS runs the kernels the launcher names, and a run on its oldest ones says what to set",
          "[plugin][cli][blas]") {
  ScratchDir scratch;
  std::filesystem::copy_file(std::string(STEPFRAME_TEST_DATA) + "/portal_edges_ft.stp", scratch / "portal.stp");
  REQUIRE(run_stepframe("init \"" + (scratch / "portal.stp").string() + "\"", scratch).status == 0);
  const std::string best(stepframe::analysis::openblas_core_for(stepframe::analysis::this_processor()));
  // The kernels OpenBLAS reports in the run's log line "linear algebra: ... core NAME)".
  auto run_with = [&](const std::string& env) {
    const auto log_file = scratch / "run-log.txt";
    const CommandResult r = run_shell("env " + env + " \"" + std::string(STEPFRAME_EXE) + "\" run -v \"" +
                                          (scratch / "portal.yaml").string() + "\" --out \"" +
                                          (scratch / "out").string() + "\" 2>\"" + log_file.string() + "\"",
                                      scratch);
    const std::string log = read_text(log_file);
    INFO(log);
    CHECK((r.status == 0 || r.status == 1));
    std::smatch core;
    REQUIRE(std::regex_search(log, core, std::regex("core ([A-Za-z0-9]+)\\)")));
    return std::pair{core[1].str(), log};
  };
  const std::string advice = "OPENBLAS_CORETYPE=" + best;
  SECTION("not named by the caller") {
    const auto [core, log] = run_with("-u OPENBLAS_CORETYPE");
    // OpenBLAS reports the names in its own case (corename[] of driver/others/dynamic.c).
    if (!best.empty()) CHECK(core == best);
    CHECK(log.find("runs its oldest kernels") == std::string::npos);
  }
  SECTION("named by the caller as OpenBLAS' oldest set: run as named, with a line saying what to set") {
    const auto [core, log] = run_with("OPENBLAS_CORETYPE=Prescott");
    CHECK(core == "Prescott");
    if (best.empty()) CHECK(log.find("runs its oldest kernels") == std::string::npos);
    else CHECK(log.find(advice) != std::string::npos);
  }
}
