// The buckling analysis beside the caller (solve_beside_buckling): the same
// modes as solve's, attached by name, and an analysis nobody waits for stops.

#include "frame_fixtures.hpp"

#include "stepframe/analysis/pending_buckling.hpp"
#include "stepframe/analysis/solve.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>

using namespace stepframe::analysis;
using stepframe::analysis::test::fixed_all;
using stepframe::analysis::test::single_member;
using stepframe::analysis::test::support;

namespace {

// A 4 m cantilever column (fixed at its foot, free at its head) under 100 kN of compression, and a
// lateral case that compresses nothing; two combinations that ask for buckling.
FrameModel cantilever_column() {
  FrameModel model = single_member({0, 0, 0}, {0, 0, 4});
  model.supports = {support(0, fixed_all)};
  LoadCase axial{"P", false, {NodeLoad{1, {0, 0, -100e3}, {0, 0, 0}}}, {}, {}, {}};
  LoadCase lateral{"H", false, {NodeLoad{1, {1e3, 0, 0}, {0, 0, 0}}}, {}, {}, {}};
  model.cases = {axial, lateral};
  Combination uls;
  uls.name = "ULS";
  uls.factors = {{0, 1.0}, {1, 1.0}};
  Combination twice;
  twice.name = "TWICE";
  twice.factors = {{0, 2.0}};
  model.combinations = {uls, twice};
  return model;
}

}  // namespace

TEST_CASE("solve_beside_buckling attaches the modes solve gives, by result name") {
  const FrameModel model = cantilever_column();
  const std::vector<LoadResult> reference = solve(model);
  REQUIRE(reference.size() == 4);
  REQUIRE(reference[2].alpha_cr);
  // Euler's load of a cantilever, effective length 2 L: Pcr = pi^2 E I_min / (2 L)^2 (Timoshenko & Gere,
  // Theory of Elastic Stability, 2nd ed. 1961, 2.1), I_min = Iz of the test section.
  const double pcr = std::numbers::pi * std::numbers::pi * 210e9 * 6.0e-6 / (8.0 * 8.0);
  CHECK(*reference[2].alpha_cr == Approx(pcr / 100e3).epsilon(0.01));
  CHECK(*reference[3].alpha_cr == Approx(pcr / 200e3).epsilon(0.01));

  Solution solution = solve_beside_buckling(model);
  CHECK(solution.buckling.pending());
  std::vector<LoadResult>& results = solution.results;
  for (const LoadResult& r : results) {
    CHECK_FALSE(r.alpha_cr);
    CHECK(r.buckling_modes.empty());
  }
  // A result removed before the modes arrive (as the run drops the cases sway variants add) is skipped.
  results.erase(results.begin() + 1);
  solution.buckling.attach(results);
  CHECK_FALSE(solution.buckling.pending());
  REQUIRE(results.size() == 3);
  CHECK_FALSE(results[0].alpha_cr);  // load cases get no buckling analysis when the model has combinations
  REQUIRE(results[1].alpha_cr);
  REQUIRE(results[2].alpha_cr);
  CHECK(*results[1].alpha_cr == *reference[2].alpha_cr);
  CHECK(*results[2].alpha_cr == *reference[3].alpha_cr);
  CHECK(results[1].buckling_modes.size() == reference[2].buckling_modes.size());
  solution.buckling.attach(results);  // a second call does nothing
  CHECK(*results[1].alpha_cr == *reference[2].alpha_cr);
}

TEST_CASE("a buckling analysis that nobody waits for is stopped and joined") {
  const FrameModel model = cantilever_column();
  for (int i = 0; i < 3; ++i) {
    Solution solution = solve_beside_buckling(model);
    CHECK(solution.buckling.pending());
  }  // each destructor stops the task at its next pattern and waits for it
  PendingBuckling moved = solve_beside_buckling(model).buckling;
  CHECK(moved.pending());
  moved = PendingBuckling();  // assigning over a pending analysis stops it first
  CHECK_FALSE(moved.pending());
}
