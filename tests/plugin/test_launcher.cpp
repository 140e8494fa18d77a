// The `stepframe` launcher: it adds the allocator's settings to GLIBC_TUNABLES (the caller's own win),
// and becomes stepframe-engine beside it with the same arguments, whose exit status is the command's.
// The engine is stood in for by a shell script that reports what it was given.

#include "test_helpers.hpp"

#include <catch2/catch.hpp>

#include <filesystem>

#include <unistd.h>

using namespace stepframe::test;

namespace {

struct Launched {
  CommandResult result;
  std::string tunables, args;
};

// Runs a copy of the launcher in `scratch` (beside the stand-in engine, if any) with GLIBC_TUNABLES as given.
Launched launch(const ScratchDir& scratch, const std::string& tunables, bool with_engine, int engine_status = 0) {
  const auto launcher = scratch / "stepframe";
  std::filesystem::copy_file(STEPFRAME_EXE, launcher, std::filesystem::copy_options::overwrite_existing);
  const auto engine = scratch / "stepframe-engine";
  std::filesystem::remove(engine);
  if (with_engine) {
    write_text(engine, "#!/bin/sh\nprintf '%s\\n' \"$GLIBC_TUNABLES\" > \"" + (scratch / "tunables.txt").string() +
                           "\"\nprintf '%s|' \"$0\" \"$@\" > \"" + (scratch / "args.txt").string() + "\"\nexit " +
                           std::to_string(engine_status) + "\n");
    std::filesystem::permissions(engine, std::filesystem::perms::owner_all);
  }
  const std::string env = tunables.empty() ? "env -u GLIBC_TUNABLES " : "env GLIBC_TUNABLES='" + tunables + "' ";
  Launched l;
  l.result = run_shell(env + "\"" + launcher.string() + "\" run 'a b.yaml' --out x 2>\"" +
                           (scratch / "launcher-stderr.txt").string() + "\"",
                       scratch);
  l.result.err = read_text(scratch / "launcher-stderr.txt");
  if (with_engine) {
    l.tunables = read_text(scratch / "tunables.txt");
    l.args = read_text(scratch / "args.txt");
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
