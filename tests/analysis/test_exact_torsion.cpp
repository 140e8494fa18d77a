// The exact St Venant solver of exact_torsion.hpp against the closed-form
// solutions of Prandtl's stress function (Timoshenko & Goodier, Theory of
// Elasticity, 3rd ed., ch. 10): it is the reference the section tables' J
// comparisons (test_section_tables.cpp) rest on.

#include "exact_torsion.hpp"
#include "stepframe/analysis/section_geometry.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>
#include <vector>

using namespace stepframe::analysis;

namespace {
constexpr double pi = std::numbers::pi;
}

TEST_CASE("exact torsion constant of a rectangle, a triangle and a circle", "[analysis][section][torsion]") {
  // Rectangle b x t: J = b t^3 / 3 (1 - 192 t / (pi^5 b) sum over odd n of tanh(n pi b / 2 t) / n^5).
  const double b = 0.3, t = 0.1;
  double sum = 0;
  for (int n = 1; n < 100; n += 2) sum += std::tanh(n * pi * b / (2 * t)) / std::pow(n, 5);
  const double J_rectangle = b * t * t * t / 3 * (1 - 192 * t / (std::pow(pi, 5) * b) * sum);
  const std::vector<SectionRing> rectangle{{{0, 0}, {b, 0}, {b, t}, {0, t}}};
  CHECK(test::exact_torsion_constant(rectangle, t / 8) == Approx(J_rectangle).epsilon(1e-3));

  // Equilateral triangle of side a: J = sqrt(3) a^4 / 80 (boundaries oblique to the grid).
  const double a = 0.1;
  const std::vector<SectionRing> triangle{{{0, 0}, {a, 0}, {a / 2, a * std::sqrt(3.0) / 2}}};
  CHECK(test::exact_torsion_constant(triangle, a / 16) == Approx(std::sqrt(3.0) * std::pow(a, 4) / 80).epsilon(1e-3));

  // Circle of diameter d: J = pi d^4 / 32 (a 512-gon's J is 5e-5 short of the circle's).
  const double d = 0.1;
  const std::vector<SectionRing> circle{circle_ring(0, 0, d / 2, 512)};
  CHECK(test::exact_torsion_constant(circle, d / 16) == Approx(pi * std::pow(d, 4) / 32).epsilon(1e-3));
}
