// The output folder is replaced whole or not at all: a staging folder swapped in
// at the end, a lock against a second run, signals and full disks.

#include "output_folder.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>

#include <cerrno>
#include <csignal>
#include <set>
#include <string>
#include <thread>
#include <vector>

#include <fcntl.h>
#include <sys/file.h>
#include <sys/mount.h>
#include <sys/wait.h>
#include <unistd.h>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

namespace fs = std::filesystem;

/// A 6 m cantilever in `parts` edges, and a project with `cases` load cases.
void write_model(const test::ScratchDir& dir, int parts = 1) {
  std::vector<geometry::LineToWrite> lines;
  for (int i = 0; i < parts; ++i) {
    geometry::LineToWrite line{{6.0 * i / parts, 0, 0}, {6.0 * (i + 1) / parts, 0, 0}, {}};
    line.attributes.name = "HEA 200";
    lines.push_back(line);
  }
  geometry::write_step_wireframe(dir / "beam.stp", lines, "mm");
}

std::string project(int cases) {
  std::string text = "model: beam.stp\nunits: {length: m, force: kN, line_load: kN/m}\n"
                     "rules:\n  - where: {}\n    material: S355\n"
                     "supports:\n  - where: {x: 0}\n    fix: fixed\ncases:\n";
  for (int i = 0; i < cases; ++i)
    text += "  - name: C" + std::to_string(i + 1) + "\n    member_loads:\n      - where: {}\n        w: [0, 0, -" +
            std::to_string(0.1 * (i + 1)) + "]\n";
  return text;
}

std::set<std::string> names_in(const fs::path& folder) {
  std::set<std::string> names;
  for (const auto& entry : fs::recursive_directory_iterator(folder))
    names.insert(fs::relative(entry.path(), folder).string());
  return names;
}

/// The hidden staging, set-aside and lock files beside `out`.
std::vector<std::string> leftovers(const fs::path& parent) {
  std::vector<std::string> found;
  for (const auto& entry : fs::directory_iterator(parent))
    if (entry.path().filename().string().find(".stepframe-") != std::string::npos)
      found.push_back(entry.path().filename().string());
  return found;
}

std::string quoted(const fs::path& p) { return "\"" + p.string() + "\""; }

/// `stepframe run PROJECT --out OUT EXTRA...` as a child process of its own (output to /dev/null), to be
/// signalled and waited for.
pid_t start_run(const fs::path& project, const fs::path& out, std::vector<std::string> extra) {
  std::vector<std::string> args{STEPFRAME_EXE, "run", project.string(), "--out", out.string()};
  args.insert(args.end(), extra.begin(), extra.end());
  std::vector<char*> argv;
  for (auto& a : args) argv.push_back(a.data());
  argv.push_back(nullptr);
  const pid_t child = ::fork();
  REQUIRE(child >= 0);
  if (child == 0) {
    const int null = ::open("/dev/null", O_WRONLY);
    ::dup2(null, 1);
    ::dup2(null, 2);
    ::execv(STEPFRAME_EXE, argv.data());
    ::_exit(127);
  }
  return child;
}

}  // namespace

TEST_CASE("a run replaces the whole output folder: an earlier run's extra files go") {
  test::ScratchDir dir;
  write_model(dir);
  test::write_text(dir / "beam.yaml", project(3));
  const auto out = dir / "out";
  auto r = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(out) + " --vtk all", dir);
  INFO(r.err);
  REQUIRE(r.status == 0);
  CHECK(fs::exists(out / "vtk" / "C3.vtu"));

  test::write_text(dir / "beam.yaml", project(1));
  r = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(out) + " --vtk all", dir);
  REQUIRE(r.status == 0);
  const auto names = names_in(out);
  CHECK(names.count("vtk/C1.vtu") == 1);
  CHECK(names.count("vtk/C2.vtu") == 0);  // from the run before: gone with its folder
  CHECK(names.count("vtk/C3.vtu") == 0);
  CHECK(names.count("results.json") == 1);
  CHECK(leftovers(dir.path()).empty());  // no staging folder, old folder or lock left beside it
}

TEST_CASE("a second run into a locked output folder is refused with the owner's process id") {
  test::ScratchDir dir;
  write_model(dir);
  test::write_text(dir / "beam.yaml", project(1));
  // Another run holds the lock: the protocol of OutputFolderLock (flock on the lock file, pid inside).
  const auto lock_file = dir / ".out.stepframe-lock";
  const int fd = ::open(lock_file.c_str(), O_RDWR | O_CREAT, 0644);
  REQUIRE(fd >= 0);
  REQUIRE(::flock(fd, LOCK_EX | LOCK_NB) == 0);
  REQUIRE(::write(fd, "424242", 6) == 6);
  const auto r = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(dir / "out"), dir);
  ::close(fd);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("in use by process 424242"));
  CHECK_FALSE(fs::exists(dir / "out"));
  // Released (as when its owner dies): the next run goes ahead.
  const auto again = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(dir / "out"), dir);
  CHECK(again.status == 0);
  CHECK(fs::exists(dir / "out" / "results.json"));
}

TEST_CASE("the lock refuses a second holder in the same process, and frees on destruction") {
  test::ScratchDir dir;
  {
    const detail::OutputFolderLock first(dir / "out");
    CHECK_THROWS_WITH(detail::OutputFolderLock(dir / "out"),
                      Contains("in use by process " + std::to_string(::getpid())));
    const detail::OutputFolderLock other(dir / "other");  // another folder: no conflict
  }
  const detail::OutputFolderLock again(dir / "out");
  CHECK(fs::exists(dir / ".out.stepframe-lock"));
}

TEST_CASE("an existing folder that does not hold earlier results is never replaced") {
  test::ScratchDir dir;
  write_model(dir);
  test::write_text(dir / "beam.yaml", project(1));
  fs::create_directories(dir / "out");
  test::write_text(dir / "out" / "notes.txt", "someone's notes");
  const auto r = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(dir / "out"), dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("not stepframe results"));
  CHECK(test::read_text(dir / "out" / "notes.txt") == "someone's notes");
}

TEST_CASE("staging folders a killed run left behind are removed by the next run") {
  test::ScratchDir dir;
  write_model(dir);
  test::write_text(dir / "beam.yaml", project(1));
  fs::create_directories(dir / ".out.stepframe-tmp-99999-0" / "vtk");
  fs::create_directories(dir / ".out.stepframe-old-99999-1");
  const auto r = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(dir / "out"), dir);
  CHECK(r.status == 0);
  CHECK(leftovers(dir.path()).empty());
}

TEST_CASE("SIGINT or SIGTERM at any moment leaves the earlier results whole and no temporaries") {
  test::ScratchDir dir;
  write_model(dir, 40);  // enough members and cases for the run to take a moment
  test::write_text(dir / "beam.yaml", project(12));
  const auto out = dir / "out";
  const auto first =
      test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(out) + " --vtk all", dir);
  INFO(first.err);
  REQUIRE(first.status == 0);
  const auto before = names_in(out);
  const std::string results_before = test::read_text(out / "results.json");
  test::write_text(dir / "beam.yaml", project(11));  // a run that would change the folder

  for (int delay_ms : {30, 120, 250, 400}) {
    for (int signal_number : {SIGINT, SIGTERM}) {
      const pid_t child = start_run(dir / "beam.yaml", out, {"--vtk", "all"});
      std::this_thread::sleep_for(std::chrono::milliseconds(delay_ms));
      ::kill(child, signal_number);
      int status = 0;
      ::waitpid(child, &status, 0);
      INFO("signal " << signal_number << " after " << delay_ms << " ms");
      // Either the signal stopped it (the old results stay) or the run had already finished (all new).
      if (WIFSIGNALED(status)) {
        CHECK(WTERMSIG(status) == signal_number);
        CHECK(names_in(out) == before);
        CHECK(test::read_text(out / "results.json") == results_before);
      } else {
        CHECK(WEXITSTATUS(status) == 0);
        CHECK(names_in(out).count("vtk/C12.vtu") == 0);
      }
      CHECK(leftovers(dir.path()).empty());
      if (!WIFSIGNALED(status)) break;  // nothing to compare after a complete run
    }
  }
}

TEST_CASE("a signal after the new results replaced the old ones stops nothing: the run ends with its status") {
  // The window between the folder's swap and the process' exit (the summary, the teardown) is short:
  // the signal is sent the moment the new results.json shows, several times over.
  test::ScratchDir dir;
  write_model(dir, 40);
  const auto out = dir / "out";
  test::write_text(dir / "beam.yaml", project(2));
  REQUIRE(test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(out), dir).status == 0);
  int caught_running = 0;
  for (int attempt = 0; attempt < 12; ++attempt) {
    const std::string before = test::read_text(out / "results.json");
    test::write_text(dir / "beam.yaml", project(attempt % 2 == 0 ? 3 : 2));
    const pid_t child = start_run(dir / "beam.yaml", out, {});
    int status = 0;
    pid_t done = 0;
    std::error_code ec;
    // Poll until the folder holds the new results (the swap is one rename) or the run has ended.
    while ((done = ::waitpid(child, &status, WNOHANG)) == 0) {
      if (fs::exists(out / "results.json", ec) && test::read_text(out / "results.json") != before) break;
      std::this_thread::sleep_for(std::chrono::microseconds(200));
    }
    if (done == 0) {
      ::kill(child, attempt % 2 == 0 ? SIGTERM : SIGINT);
      ++caught_running;
      REQUIRE(::waitpid(child, &status, 0) == child);
    }
    INFO("attempt " << attempt);
    CHECK_FALSE(WIFSIGNALED(status));
    CHECK(WIFEXITED(status));
    CHECK(WEXITSTATUS(status) == 0);
    CHECK(test::read_text(out / "results.json") != before);
    CHECK(leftovers(dir.path()).empty());
  }
  INFO("runs signalled after their results were in place: " << caught_running);
  CHECK(caught_running > 0);
}

TEST_CASE("an output file that cannot be written says disk full or not writable") {
  CHECK_THAT(detail::output_failure("/x/results.json", ENOSPC).what(), Contains("disk full"));
  CHECK_THAT(detail::output_failure("/x/results.json", EROFS).what(), Contains("not writable"));
  CHECK_THAT(detail::output_failure("/x/results.json", EACCES).what(), Contains("not writable"));
  test::ScratchDir dir;
  write_model(dir);
  test::write_text(dir / "beam.yaml", project(1));

  SECTION("a folder the system refuses to create") {
    // sysfs takes no new folders, not even from root.
    const auto r = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out /sys/stepframe-test-out", dir);
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("not writable"));
  }
  SECTION("a full file system, where a small one can be mounted (root with CAP_SYS_ADMIN)") {
    const auto mount_point = dir / "small";
    fs::create_directories(mount_point);
    if (::mount("tmpfs", mount_point.c_str(), "tmpfs", 0, "size=64k") != 0) {
      WARN("cannot mount a small tmpfs here (" << std::strerror(errno) << "): the full-disk run is not tried");
      return;
    }
    test::write_text(dir / "beam.yaml", project(40));
    const auto r = test::run_stepframe("run " + quoted(dir / "beam.yaml") + " --out " + quoted(mount_point / "out") +
                                           " --vtk all",
                                       dir);
    const auto left = leftovers(mount_point);
    const bool out_exists = fs::exists(mount_point / "out");
    ::umount(mount_point.c_str());
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("disk full"));
    CHECK(left.empty());
    CHECK_FALSE(out_exists);
  }
}
