// EN 1993-1-1 (2005) screening checks against the standard's own formulas and curves.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/en1993.hpp"
#include "stepframe/analysis/solve.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <numbers>

using namespace stepframe::analysis;
using namespace stepframe::analysis::en1993;
using Catch::Matchers::Contains;

TEST_CASE("reduction factors follow the buckling curves of EN 1993-1-1 6.3.1.2") {
  // chi at lambda = 1.0 and 0.5 for each curve: values of the curves of EN 1993-1-1
  // Figure 6.4 as commonly tabulated (from memory), tolerance 1e-4.
  CHECK(reduction_factor(1.0, Curve::a0) == Approx(0.7253).margin(1e-4));
  CHECK(reduction_factor(1.0, Curve::a) == Approx(0.6656).margin(1e-4));
  CHECK(reduction_factor(1.0, Curve::b) == Approx(0.5970).margin(1e-4));
  CHECK(reduction_factor(1.0, Curve::c) == Approx(0.5399).margin(1e-4));
  CHECK(reduction_factor(1.0, Curve::d) == Approx(0.4671).margin(1e-4));
  CHECK(reduction_factor(0.5, Curve::a) == Approx(0.9243).margin(1e-4));
  CHECK(reduction_factor(2.0, Curve::b) == Approx(0.2095).margin(1e-4));
  // 6.3.1.2(4): no reduction up to lambda = 0.2.
  CHECK(reduction_factor(0.2, Curve::d) == Approx(1.0));
  CHECK(reduction_factor(0.1, Curve::c) == 1.0);
  // Table 6.1 imperfection factors.
  CHECK(imperfection_factor(Curve::a0) == 0.13);
  CHECK(imperfection_factor(Curve::d) == 0.76);
}

TEST_CASE("cross-section classes from the limits of EN 1993-1-1 Table 5.2") {
  const auto ipe300 = find_catalogue_section("IPE300");
  const auto heb200 = find_catalogue_section("HEB200");
  REQUIRE(ipe300);
  REQUIRE(heb200);
  SECTION("IPE 300 in S355: class 1 in bending; its web is slender in pure compression") {
    // Web c/t = (300 - 2 x 10.7 - 2 x 15) / 7.1 = 35.0 > 42 epsilon = 34.2 (epsilon = 0.814): class 4.
    CHECK(classify(*ipe300, 355e6, 0.0, 100e3).section_class == 1);
    const auto compressed = classify(*ipe300, 355e6, -500e3, 0.0);
    CHECK(compressed.section_class == 4);
    CHECK_THAT(compressed.governing_part, Contains("web"));
    CHECK(compressed.class3_utilisation == Approx(35.01 / (42 * std::sqrt(235.0 / 355.0))).epsilon(2e-3));
    // In S235 (epsilon = 1) the same web is class 2: 33 < 35.0 <= 38.
    CHECK(classify(*ipe300, 235e6, -500e3, 0.0).section_class == 2);
  }
  SECTION("HEB 200 in S355 is class 1 in compression") {
    // Flange c/t = (200 - 9 - 36)/2/15 = 5.2 <= 9 epsilon = 7.3; web 134/9 = 14.9 <= 33 epsilon = 26.9.
    CHECK(classify(*heb200, 355e6, -1000e3, 0.0).section_class == 1);
  }
  SECTION("limits of an internal part under bending and compression") {
    const SectionPart web{"web", PartKind::internal, 0.3, 0.01};
    const double eps = 1.0;  // S235
    // alpha = 0.5 (pure bending): class 1 limit 36 eps / 0.5 = 72 eps, as the pure-bending column.
    CHECK(part_limits(web, 235e6, 0.5, -1.0)[0] == Approx(72 * eps));
    CHECK(part_limits(web, 235e6, 0.5, -1.0)[1] == Approx(83 * eps));
    // psi = -1: 62 eps (1 - psi) sqrt(-psi) = 124 eps, the pure-bending class 3 limit.
    CHECK(part_limits(web, 235e6, 0.5, -1.0)[2] == Approx(124 * eps));
    // Uniform compression (alpha = 1, psi = 1): 396/12 = 33, 456/12 = 38, 42/1 = 42.
    CHECK(part_limits(web, 235e6, 1.0, 1.0)[0] == Approx(33 * eps));
    CHECK(part_limits(web, 235e6, 1.0, 1.0)[1] == Approx(38 * eps));
    CHECK(part_limits(web, 235e6, 1.0, 1.0)[2] == Approx(42 * eps));
    const SectionPart tube{"wall", PartKind::tube, 0.2191, 0.008};
    CHECK(part_limits(tube, 355e6)[2] == Approx(90 * 235.0 / 355.0));
  }
}

TEST_CASE("buckling curves are chosen as EN 1993-1-1 Tables 6.2 and 6.4 say") {
  const auto ipe300 = find_catalogue_section("IPE300");  // h/b = 2.0 > 1.2, tf = 10.7 mm
  const auto heb200 = find_catalogue_section("HEB200");  // h/b = 1.0 <= 1.2
  REQUIRE(ipe300);
  REQUIRE(heb200);
  CHECK(flexural_curves(*ipe300, 355e6).y == Curve::a);
  CHECK(flexural_curves(*ipe300, 355e6).z == Curve::b);
  CHECK(flexural_curves(*heb200, 355e6).y == Curve::b);
  CHECK(flexural_curves(*heb200, 355e6).z == Curve::c);
  CHECK(flexural_curves(*ipe300, 460e6).z == Curve::a0);
  CHECK(lateral_torsional_curve(*ipe300) == Curve::a);  // rolled, h/b <= 2
  CHECK(lateral_torsional_curve(*heb200) == Curve::a);
}

TEST_CASE("critical moment of an I beam in uniform bending") {
  // Timoshenko & Gere (1961), ch. 6: Mcr = (pi / L) sqrt(E Iz G It (1 + pi^2 E Iw / (L^2 G It))),
  // an algebraically different form of the same result; C1 = 1 for uniform moment.
  const double E = 210e9, G = 81e9, Iz = 6.038e-6, Iw = 1.259e-7, It = 2.012e-7, L = 6.0;
  const double pi = std::numbers::pi;
  const double expected = pi / L * std::sqrt(E * Iz * G * It * (1 + pi * pi * E * Iw / (L * L * G * It)));
  CHECK(critical_moment(E, G, Iz, Iw, It, L, 1.0) == Approx(expected).epsilon(1e-12));
  // A destabilising load position lowers Mcr; C1 scales it.
  CHECK(critical_moment(E, G, Iz, Iw, It, L, 1.0, 0.454, 0.15) < expected);
  CHECK(critical_moment(E, G, Iz, Iw, It, L, 1.5) == Approx(1.5 * expected));
  CHECK(c1_linear(1.0) == Approx(1.0));
  CHECK(c1_linear(0.0) == Approx(1.88));
  CHECK(c1_linear(-1.0) == Approx(2.70));
  CHECK(cm_linear(1.0) == Approx(1.0));   // Annex B Table B.3
  CHECK(cm_linear(-1.0) == Approx(0.4));  // floor 0.4
}

TEST_CASE("a pinned column through the full member checks") {
  // Hand calculation to EN 1993-1-1 6.2 and 6.3.1 for the solver's own results.
  const auto heb200 = find_catalogue_section("HEB200");
  REQUIRE(heb200);
  FrameModel model;
  const double H = 4.0, P = 600e3;
  model.nodes = {{0, 0, 0}, {0, 0, H}};
  model.sections = {*heb200};
  model.materials = {*find_standard_material("S355")};
  model.elements = {{{0, 1}, 0, 0, 0.0}};
  // Pinned at both ends, twist (rz for a vertical member) restrained.
  model.supports = {test::support(0, {true, true, true, false, false, true}),
                    test::support(1, {true, true, false, false, false, true})};
  LoadCase lc;
  lc.name = "P";
  lc.node_loads = {{1, Eigen::Vector3d(0, 0, -P), Eigen::Vector3d::Zero()}};
  model.cases = {lc};
  const auto results = solve(model);
  const auto checks = check_members(model, {&results[0]}, {}, PartialFactors{});

  const Section& s = *heb200;
  const double fy = 355e6, pi = std::numbers::pi;
  const double lambda_z = std::sqrt(s.A * fy / (pi * pi * 210e9 * s.Iz / (H * H)));
  const double chi_z = reduction_factor(lambda_z, Curve::c);
  auto find = [&](const std::string& name) -> const CheckResult& {
    for (const auto& c : checks)
      if (c.check == name) return c;
    FAIL("no check " << name);
    return checks.front();
  };
  // Weak-axis slenderness about 1.03 for a 4 m HEB 200 in S355 (iz = 50.7 mm, lambda_1 = 76.4).
  CHECK(lambda_z == Approx(4.0 / s.iz() / (pi * std::sqrt(210e9 / fy))).epsilon(1e-9));
  CHECK(lambda_z == Approx(1.03).margin(0.02));
  CHECK(find("6.3.1 flexural buckling").utilisation == Approx(P / (chi_z * s.A * fy)).epsilon(1e-9));
  CHECK(find("6.2 cross-section").utilisation == Approx(P / (s.A * fy)).epsilon(1e-9));
  CHECK_THAT(find("6.2 cross-section").clause, Contains("class 1"));
  CHECK(std::none_of(checks.begin(), checks.end(), [](const CheckResult& c) { return c.check == "5.5 classification"; }));
  CHECK(find("6.3.3 interaction").utilisation >= find("6.3.1 flexural buckling").utilisation - 1e-9);
}
