// Whole-run benchmark (not a test). For each size asked (members; default
// 1000 and 10000), writes the generated building (building_model.hpp) with
// OCCT's STEP writer and its project files, then, `repeats` times and
// alternating which goes first, runs in child processes of their own:
//  1. OCCT's own read + transfer of the STEP file (stepframe_occt_read, a
//     command started like stepframe): the floor, nothing that reads the
//     file can be faster;
//  2. `stepframe run` with the default outputs and alpha_cr;
//  3. `stepframe run` without the buckling analysis (buckling_modes: 0);
//  4. and 5., for the marginal costs, the run with ten more combinations and
//     the run with two more load cases.
// Reports the best wall time of each, the ratios to 1, peak memory, the size
// of the default output folder, and what one more combination and one more
// load case cost as a share of the default run, in wall time (best against
// best: a single run's noise was larger than the 5% a load case may cost) and
// in processor time. Prints `stepframe run --timings` of the last default run.
// Usage: stepframe_bench_run [members ...] [--repeats N] [--folder DIR]

#include "bench_support.hpp"
#include "building_model.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <string>
#include <vector>

#if !defined(STEPFRAME_CLI) || !defined(STEPFRAME_OCCT_READ)
#error "STEPFRAME_CLI and STEPFRAME_OCCT_READ (the executables) must be defined by the build"
#endif

using namespace stepframe::bench;

namespace {

struct Best {
  Measurement m{1e300, 0, 0, 0, 0};
  void keep(const Measurement& x) {
    if (x.wall < m.wall) m = x;
    m.peak_mb = std::max(m.peak_mb, x.peak_mb);
  }
};

Measurement run(const std::filesystem::path& project, const std::filesystem::path& out) {
  std::filesystem::remove_all(out);
  const Measurement m = run_command({STEPFRAME_CLI, "-q", "run", project.string(), "--out", out.string()});
  if (m.status > 1) std::fprintf(stderr, "stepframe run %s ended with status %d\n", project.string().c_str(), m.status);
  return m;
}

}  // namespace

int main(int argc, char** argv) {
  std::vector<std::size_t> sizes;
  int repeats = 3;
  std::filesystem::path folder = std::filesystem::temp_directory_path() / "stepframe_bench_run";
  for (int i = 1; i < argc; ++i) {
    const std::string a = argv[i];
    if (a == "--repeats" && i + 1 < argc) repeats = std::max(1, std::atoi(argv[++i]));
    else if (a == "--folder" && i + 1 < argc) folder = argv[++i];
    else sizes.push_back(static_cast<std::size_t>(std::strtoul(a.c_str(), nullptr, 10)));
  }
  if (sizes.empty()) sizes = {1000, 10000};

  for (const std::size_t wanted : sizes) {
    const BuildingSize size = building_size_for(wanted);
    const auto dir = folder / std::to_string(wanted);
    const std::size_t members = write_building_model(dir, size);
    const auto base = write_building_project(dir, "building");
    const auto flat = write_building_project(dir, "no-buckling", {0, 0, false});
    const auto combos = write_building_project(dir, "more-combinations", {0, 10, true});
    const auto cases = write_building_project(dir, "more-cases", {2, 0, true});
    std::printf("\n== %zu members: %d x %d bays, %d storeys; %s %.1f MB\n", members, size.bays_x, size.bays_y,
                size.storeys, (dir / "building.stp").string().c_str(),
                static_cast<double>(std::filesystem::file_size(dir / "building.stp")) / 1e6);

    Best occt, whole, no_buckling, more_combinations, more_cases;
    for (int r = 0; r < repeats; ++r) {
      // Alternate the order, so neither command always meets a warm or a cold cache first.
      if (r % 2 == 0) occt.keep(run_command({STEPFRAME_OCCT_READ, (dir / "building.stp").string()}));
      whole.keep(run(base, dir / "out"));
      no_buckling.keep(run(flat, dir / "out-flat"));
      more_combinations.keep(run(combos, dir / "out-combinations"));
      more_cases.keep(run(cases, dir / "out-cases"));
      if (r % 2 == 1) occt.keep(run_command({STEPFRAME_OCCT_READ, (dir / "building.stp").string()}));
    }
    const double output_mb = folder_mb(dir / "out");

    std::printf("%-44s %9s %9s %8s %9s\n", "", "wall s", "cpu s", "ratio", "peak MB");
    auto row = [&](const char* what, const Measurement& m) {
      std::printf("%-44s %9.2f %9.2f %7.2fx %9.0f\n", what, m.wall, m.cpu, m.wall / occt.m.wall, m.peak_mb);
    };
    row("OCCT read + transfer (the floor)", occt.m);
    row("stepframe run, default outputs, alpha_cr", whole.m);
    row("stepframe run, buckling_modes: 0", no_buckling.m);
    row("stepframe run, 10 more combinations", more_combinations.m);
    row("stepframe run, 2 more load cases", more_cases.m);
    std::printf("default output folder: %.1f MB\n", output_mb);
    // Share of the default run that one more of each costs: (run with n more - run) / n / run.
    auto share = [&](double more, double base_run, int n) { return 100 * (more - base_run) / n / base_run; };
    std::printf("one more combination: %+.1f%% of a run (processor time %+.1f%%); one more load case: %+.1f%% "
                "(processor time %+.1f%%)\n",
                share(more_combinations.m.wall, whole.m.wall, 10), share(more_combinations.m.cpu, whole.m.cpu, 10),
                share(more_cases.m.wall, whole.m.wall, 2), share(more_cases.m.cpu, whole.m.cpu, 2));
    std::fflush(stdout);
    // Where the time goes, from the run's own stage timings (stderr).
    const std::string timings = std::string(STEPFRAME_CLI) + " -q run " + base.string() + " --out " +
                                (dir / "out").string() + " --timings >/dev/null";
    std::printf("stage timings of one more default run:\n");
    std::fflush(stdout);
    if (std::system(timings.c_str()) == -1) std::perror("system");
  }
  return 0;
}
