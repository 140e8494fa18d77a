// The thread-safety promise of stepframe.h, as a host keeps it: many threads,
// each with its own handle and output folder, running different projects
// through the C ABI at once, get exactly what serial runs get.

#include "c_plugin.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/stepframe.h"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>

#include <array>
#include <cstdio>
#include <string>
#include <thread>
#include <vector>

#include <fcntl.h>
#include <unistd.h>

using namespace stepframe;
using stepframe::test::plugin;

namespace {

using Line = geometry::LineToWrite;

Line line(Eigen::Vector3d a, Eigen::Vector3d b, const std::string& name) {
  Line l{std::move(a), std::move(b), {}};
  l.attributes.name = name;
  return l;
}

constexpr int projects = 5;

/// Five small, different frames (STEP file and project text), invented for the test.
void write_projects(const test::ScratchDir& dir) {
  const std::string head = "units: {length: m, force: kN, line_load: kN/m}\nrules:\n  - where: {}\n    material: S355\n";
  // 0: a simply supported beam under a uniform load.
  geometry::write_step_wireframe(dir / "p0.stp", {line({0, 0, 0}, {6, 0, 0}, "IPE 300")}, "mm");
  test::write_text(dir / "p0.yaml", "model: p0.stp\n" + head +
                                        "supports:\n  - where: {x: 0}\n    fix: [ux, uy, uz, rx]\n"
                                        "  - where: {x: 6}\n    fix: [uy, uz, rx]\n"
                                        "cases:\n  - name: W\n    member_loads:\n      - where: {}\n        w: [0, 0, -10]\n");
  // 1: a cantilever with a point load at its tip.
  geometry::write_step_wireframe(dir / "p1.stp", {line({0, 0, 0}, {4, 0, 0}, "HEA 200")}, "mm");
  test::write_text(dir / "p1.yaml", "model: p1.stp\n" + head +
                                        "supports:\n  - where: {x: 0}\n    fix: fixed\n"
                                        "cases:\n  - name: P\n    node_loads:\n      - near: [4, 0, 0]\n"
                                        "        force: [0, 0, -12]\n");
  // 2: a portal frame with a side load and self weight, two cases and a combination.
  geometry::write_step_wireframe(dir / "p2.stp",
                                 {line({0, 0, 0}, {0, 0, 4}, "HEB 200"), line({0, 0, 4}, {8, 0, 4}, "IPE 360"),
                                  line({8, 0, 4}, {8, 0, 0}, "HEB 200")},
                                 "mm");
  test::write_text(dir / "p2.yaml", "model: p2.stp\n" + head +
                                        "supports:\n  - where: {z: 0}\n    fix: fixed\n"
                                        "cases:\n  - name: G\n    self_weight: true\n"
                                        "  - name: H\n    node_loads:\n      - near: [0, 0, 4]\n        force: [5, 0, 0]\n"
                                        "combinations:\n  - name: ULS\n    factors: {G: 1.35, H: 1.5}\n");
  // 3: a two-span beam.
  geometry::write_step_wireframe(dir / "p3.stp",
                                 {line({0, 0, 0}, {5, 0, 0}, "IPE 240"), line({5, 0, 0}, {10, 0, 0}, "IPE 240")},
                                 "mm");
  test::write_text(dir / "p3.yaml", "model: p3.stp\n" + head +
                                        "supports:\n  - where: {x: 0}\n    fix: [ux, uy, uz, rx]\n"
                                        "  - where: {x: 5}\n    fix: [uy, uz]\n  - where: {x: 10}\n    fix: [uy, uz]\n"
                                        "cases:\n  - name: W\n    member_loads:\n      - where: {}\n        w: [0, 0, -8]\n");
  // 4: a table of four columns and four beams.
  std::vector<Line> table;
  const std::array<Eigen::Vector3d, 4> feet{Eigen::Vector3d(0, 0, 0), Eigen::Vector3d(4, 0, 0),
                                            Eigen::Vector3d(4, 3, 0), Eigen::Vector3d(0, 3, 0)};
  for (std::size_t i = 0; i < 4; ++i) {
    const Eigen::Vector3d top = feet[i] + Eigen::Vector3d(0, 0, 3), next = feet[(i + 1) % 4] + Eigen::Vector3d(0, 0, 3);
    table.push_back(line(feet[i], top, "SHS 150x8"));
    table.push_back(line(top, next, "IPE 200"));
  }
  geometry::write_step_wireframe(dir / "p4.stp", table, "mm");
  test::write_text(dir / "p4.yaml", "model: p4.stp\n" + head +
                                        "supports:\n  - where: {z: 0}\n    fix: fixed\n"
                                        "cases:\n  - name: G\n    self_weight: true\n"
                                        "  - name: W\n    member_loads:\n      - where: {name: IPE.*}\n"
                                        "        w: [0, 0, -6]\n");
}

struct Outcome {
  int status = -1;
  std::string json;
  std::string results_file;
};

/// One run through the C ABI on a handle of its own.
Outcome run_one(const std::filesystem::path& project, const std::filesystem::path& out) {
  const auto run_new = plugin().get<sf_run*()>("sf_run_new");
  const auto run_free = plugin().get<void(sf_run*)>("sf_run_free");
  const auto set_out = plugin().get<int(sf_run*, const char*)>("sf_run_set_out_dir");
  const auto run_file = plugin().get<int(sf_run*, const char*)>("sf_run_project_file");
  const auto results = plugin().get<const char*(const sf_run*)>("sf_run_results_json");
  sf_run* run = run_new();
  set_out(run, out.c_str());
  Outcome o;
  o.status = run_file(run, project.c_str());
  const char* json = results(run);
  o.json = json ? json : "";
  o.results_file = test::read_text(out / "results.json");
  run_free(run);
  return o;
}

}  // namespace

TEST_CASE("C ABI: 8 threads x 5 runs of different projects give what serial runs give") {
  test::ScratchDir dir;
  write_projects(dir);
  std::array<Outcome, projects> serial;
  for (int p = 0; p < projects; ++p) {
    serial[p] = run_one(dir / ("p" + std::to_string(p) + ".yaml"), dir / ("serial" + std::to_string(p)));
    INFO("project " << p << ": " << serial[p].json.substr(0, 300));
    REQUIRE((serial[p].status == SF_PASS || serial[p].status == SF_CHECK_FAILED));
    REQUIRE(serial[p].json.size() > 100);
    REQUIRE(serial[p].results_file == serial[p].json);
  }

  constexpr int threads = 8;
  std::array<std::array<Outcome, projects>, threads> parallel;
  std::vector<std::thread> pool;
  for (int t = 0; t < threads; ++t)
    pool.emplace_back([&, t] {
      for (int k = 0; k < projects; ++k) {
        const int p = (t + k) % projects;  // every thread runs every project, in its own order
        parallel[t][p] = run_one(dir / ("p" + std::to_string(p) + ".yaml"),
                                 dir / ("t" + std::to_string(t) + "-" + std::to_string(p)));
      }
    });
  for (auto& thread : pool) thread.join();

  for (int t = 0; t < threads; ++t)
    for (int p = 0; p < projects; ++p) {
      INFO("thread " << t << ", project " << p << ": " << parallel[t][p].json.substr(0, 300));
      CHECK(parallel[t][p].status == serial[p].status);
      CHECK(parallel[t][p].json == serial[p].json);  // byte for byte
      CHECK(parallel[t][p].results_file == serial[p].json);
    }
}

TEST_CASE("C ABI: without a log callback the log goes to stderr, never stdout") {
  test::ScratchDir dir;
  write_projects(dir);
  const auto run_file = plugin().get<int(const char*, const char*, char*, size_t)>("sf_run_file");
  // The process's standard streams, caught in files for the length of one run.
  std::fflush(stdout);
  std::fflush(stderr);
  const int saved_out = ::dup(1), saved_err = ::dup(2);
  const int out_file = ::open((dir / "stdout.txt").c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
  const int err_file = ::open((dir / "stderr.txt").c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
  ::dup2(out_file, 1);
  ::dup2(err_file, 2);
  char message[256];
  const int status = run_file((dir / "p0.yaml").c_str(), (dir / "out").c_str(), message, sizeof message);
  std::fflush(stdout);
  std::fflush(stderr);
  ::dup2(saved_out, 1);
  ::dup2(saved_err, 2);
  ::close(out_file);
  ::close(err_file);
  ::close(saved_out);
  ::close(saved_err);
  CHECK(status == SF_PASS);
  CHECK(test::read_text(dir / "stdout.txt").empty());
  CHECK_THAT(test::read_text(dir / "stderr.txt"), Catch::Matchers::Contains("p0.stp"));
}
