// Continuous beams against the three-moment equation (Clapeyron, 1857):
//   M_{i-1} L_i + 2 M_i (L_i + L_{i+1}) + M_{i+1} L_{i+1} = -(w_i L_i^3 + w_{i+1} L_{i+1}^3) / 4
// for uniform loads w on spans of equal E I (e.g. Timoshenko, Strength of
// Materials, Part I, "continuous beams"; the closed forms below solve it).
// Sign conventions (results.hpp): hogging over a support is My > 0.

#include "verification_models.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using namespace stepframe::analysis::verification;
using V = Eigen::Vector3d;

namespace {

constexpr double exact = 1e-9;

stepframe::testing::Recovered continuous(const std::vector<double>& xs, double w) {
  FrameModel m = beam_along_x(xs);
  m.supports.push_back(support(0, pin));
  for (std::size_t i = 1; i < xs.size(); ++i) m.supports.push_back(support(i, roller));
  LoadCase lc;
  lc.name = "w";
  for (std::size_t e = 0; e + 1 < xs.size(); ++e) lc.element_loads.push_back({e, V(0, 0, -w)});
  m.cases = {lc};
  return solve_one(m);
}

}  // namespace

TEST_CASE("two equal spans, uniform load: three-moment equation", "[verification][three-moment]") {
  // M_B = w L^2 / 8; middle reaction 5 w L / 4, end reactions 3 w L / 8.
  const double L = 5.0, w = 10e3;
  const auto r = continuous({0, L, 2 * L}, w);
  CHECK(r.elements[0].end_forces(4) == Approx(w * L * L / 8).epsilon(exact));
  CHECK(reaction(r, 1, uz) == Approx(5 * w * L / 4).epsilon(exact));
  CHECK(reaction(r, 0, uz) == Approx(3 * w * L / 8).epsilon(exact));
  // Span moment peaks where the shear crosses zero, 3L/8 from the end support: 9 w L^2 / 128.
  CHECK(r.elements[0].extremes[4].min == Approx(-9 * w * L * L / 128).epsilon(exact));
  CHECK(r.elements[0].extremes[4].x_min == Approx(3 * L / 8).epsilon(1e-9));
}

TEST_CASE("three equal spans, uniform load: three-moment equation", "[verification][three-moment]") {
  // M_B = M_C = w L^2 / 10; reactions 0.4 w L at the ends, 1.1 w L inside.
  const double L = 4.0, w = 7e3;
  const auto r = continuous({0, L, 2 * L, 3 * L}, w);
  CHECK(r.elements[0].end_forces(4) == Approx(w * L * L / 10).epsilon(exact));
  CHECK(r.elements[2].start_forces(4) == Approx(w * L * L / 10).epsilon(exact));
  CHECK(reaction(r, 0, uz) == Approx(0.4 * w * L).epsilon(exact));
  CHECK(reaction(r, 1, uz) == Approx(1.1 * w * L).epsilon(exact));
  // The middle span: constant hogging wL^2/10 less the free moment wL^2/8 at midspan.
  CHECK(station_at(r.elements[1], L / 2).forces(4) == Approx(w * L * L / 10 - w * L * L / 8).epsilon(exact));
}

TEST_CASE("two unequal spans, uniform load: three-moment equation", "[verification][three-moment]") {
  // With M_A = M_C = 0: M_B = w (L1^3 + L2^3) / (8 (L1 + L2)).
  const double L1 = 4.0, L2 = 6.5, w = 12e3;
  const auto r = continuous({0, L1, L1 + L2}, w);
  const double mb = w * (L1 * L1 * L1 + L2 * L2 * L2) / (8 * (L1 + L2));
  CHECK(r.elements[0].end_forces(4) == Approx(mb).epsilon(exact));
  CHECK(r.elements[1].start_forces(4) == Approx(mb).epsilon(exact));
  CHECK(reaction(r, 0, uz) == Approx(w * L1 / 2 - mb / L1).epsilon(exact));
}
