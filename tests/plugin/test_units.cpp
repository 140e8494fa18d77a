// Unit parsing at the project-file edge.
// Reference factors: SI Brochure (BIPM, 9th ed., 2019) prefixes; inch = 0.0254 m and
// pound = 0.45359237 kg exactly (international yard and pound agreement, 1959);
// standard gravity 9.80665 m/s^2 (3rd CGPM, 1901).

#include "stepframe/units.hpp"

#include <catch2/catch.hpp>

using namespace stepframe;

TEST_CASE("quantities with their own units convert to SI") {
  CHECK(parse_quantity("3.5 m")->value == Approx(3.5));
  CHECK(parse_quantity("250 mm")->value == Approx(0.25));
  CHECK(parse_quantity("10 kN/m")->value == Approx(1e4));
  CHECK(parse_quantity("10 kN/m")->dimension == dimension::line_load);
  CHECK(parse_quantity("200 GPa")->value == Approx(2e11));
  CHECK(parse_quantity("355 N/mm2")->value == Approx(355e6));
  CHECK(parse_quantity("355 N/mm^2")->dimension == dimension::stress);
  CHECK(parse_quantity("7850 kg/m3")->value == Approx(7850));
  CHECK(parse_quantity("7850 kg/m3")->dimension == dimension::density);
  CHECK(parse_quantity("12 kN*m")->value == Approx(12e3));
  CHECK(parse_quantity("12 kN*m")->dimension == dimension::moment);
  CHECK(parse_quantity("1 in")->value == Approx(0.0254).epsilon(1e-15));
  CHECK(parse_quantity("1 ft")->value == Approx(0.3048).epsilon(1e-15));
  CHECK(parse_quantity("1 kip")->value == Approx(4448.2216152605).epsilon(1e-12));
  CHECK(parse_quantity("50 ksi")->value == Approx(344.73786e6).epsilon(1e-7));
}

TEST_CASE("bare numbers and rejects") {
  CHECK(parse_quantity("42")->dimension == dimension::none);
  CHECK_FALSE(parse_quantity("10 furlong"));
  CHECK_FALSE(parse_quantity("kN"));
  CHECK_FALSE(parse_quantity("10 kN//m"));
  CHECK_FALSE(parse_unit("parsec"));
}

TEST_CASE("a project's unit system reads bare numbers") {
  UnitSystem u;  // mm, kN
  CHECK(u.si_per_bare(dimension::length) == Approx(1e-3));
  CHECK(u.si_per_bare(dimension::line_load) == Approx(1e6));  // kN/mm
  CHECK(u.si_per_bare(dimension::stress) == Approx(1e9));     // kN/mm2
  CHECK(u.si_per_bare(dimension::second_moment) == Approx(1e-12));
  CHECK(u.si_per_bare(dimension::density) == 1.0);
  CHECK(u.describe_bare(dimension::line_load) == "kN/mm");
  u.stress = parse_unit("MPa");
  u.stress_name = "MPa";
  CHECK(u.si_per_bare(dimension::stress) == Approx(1e6));
  CHECK(u.describe_bare(dimension::stress) == "MPa");
}
