// `stepframe compare` and `stepframe suggest` analyse a project as `run` does: a large frame's STEP file
// read in two processes (the CLI's limit, 1,000 members), and the stages reported (a progress line on a
// terminal; elsewhere each stage's time in the debug log). Consistency tests (no published values): what
// they write is what the library gives reading the same file in one process.

#include "stepframe/analysis/blas_info.hpp"
#include "stepframe/compare.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/run.hpp"
#include "stepframe/section_upsizing.hpp"
#include "test_helpers.hpp"

#include "building_model.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <cstdlib>
#include <fstream>
#include <optional>
#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

// How many times `text` holds `what`.
std::size_t occurrences(const std::string& text, const std::string& what) {
  std::size_t n = 0;
  for (auto at = text.find(what); at != std::string::npos; at = text.find(what, at + what.size())) ++n;
  return n;
}

// The command line runs OpenBLAS on one thread unless OPENBLAS_NUM_THREADS says otherwise (its main);
// the library in this process does the same while one lives, so that both round alike (OpenBLAS on two
// threads rounds differently in the last bits). Likewise the command lines started meanwhile run the
// kernels this process runs (their launcher names the processor's best ones, which this process, started
// by ctest, may not run).
class BlasAsTheCommandLine {
 public:
  BlasAsTheCommandLine() {
    if (std::getenv("OPENBLAS_NUM_THREADS") == nullptr) analysis::set_blas_threads(1);
    if (const char* given = std::getenv("OPENBLAS_CORETYPE")) coretype_before_ = given;
    const std::string core = analysis::blas_core_name();
    if (!core.empty()) setenv("OPENBLAS_CORETYPE", core.c_str(), 1);
  }
  ~BlasAsTheCommandLine() {
    analysis::set_blas_threads(before_);
    if (coretype_before_) setenv("OPENBLAS_CORETYPE", coretype_before_->c_str(), 1);
    else unsetenv("OPENBLAS_CORETYPE");
  }
  BlasAsTheCommandLine(const BlasAsTheCommandLine&) = delete;
  BlasAsTheCommandLine& operator=(const BlasAsTheCommandLine&) = delete;

 private:
  int before_ = analysis::blas_threads();
  std::optional<std::string> coretype_before_;
};

}  // namespace

TEST_CASE("compare analyses two large project revisions, each read in two processes, as the library does in one",
          "[compare][two-processes]") {
  // The benchmark's generated building (bench/building_model.hpp), 1,000 members or more, as both sides.
  test::ScratchDir dir;
  REQUIRE(stepframe::bench::write_building_model(dir.path(), stepframe::bench::building_size_for(1200)) >= 1000);
  const std::string project = stepframe::bench::write_building_project(dir.path(), "building").string();
  // The library's defaults read in one process (RunControl::two_process_read_from = 0).
  const BlasAsTheCommandLine blas;
  const Comparison alone = compare_revisions(read_revision(project), read_revision(project), CompareOptions{});
  const auto r = test::run_stepframe("-v compare \"" + project + "\" \"" + project + "\" --json --out \"" +
                                         (dir / "cmp").string() + "\"",
                                     dir);
  CHECK(r.status == 0);  // the same revision twice: nothing got worse
  CHECK(occurrences(r.err, "read in two processes") == 2);
  CHECK(occurrences(r.err, "factorisation took") == 2);  // each side's analysis reports its stages
  CHECK(r.out == comparison_json(alone).dump(1) + "\n");
}

TEST_CASE("suggest reads a large frame in two processes and suggests what the library does reading it in one",
          "[suggest][two-processes]") {
  test::ScratchDir dir;
  REQUIRE(stepframe::bench::write_building_model(dir.path(), stepframe::bench::building_size_for(1200)) >= 1000);
  const auto project = stepframe::bench::write_building_project(dir.path(), "building");
  SuggestOptions options;
  options.max_rounds = 1;
  const BlasAsTheCommandLine blas;
  const Analysis first = analyse_project(project);
  const Suggestion alone = suggest_sections(first.project, geometry::read_step(first.project.model), first, options);
  const auto r = test::run_stepframe("-v suggest \"" + project.string() + "\" --max-rounds 1 --out \"" +
                                         (dir / "sug").string() + "\"",
                                     dir);
  CHECK(r.status == static_cast<int>(alone.status()));
  // The analysis reads the file, and so does the suggestion (the analysis let go of the model).
  CHECK(occurrences(r.err, "read in two processes") == 2);
  CHECK_THAT(r.err, Contains("factorisation took"));  // the analyses report their stages
  std::ifstream written(dir / "sug" / "suggest.json");
  REQUIRE(written);
  CHECK(nlohmann::json::parse(written) == suggestion_json(alone));
}
