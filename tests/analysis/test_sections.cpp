// Rolled I/H section properties computed from the nominal dimensions,
// compared with the section property tables of EN 10365 (hot rolled I and H
// sections). The reference values below are recalled from those tables
// ("from memory"), so the tolerance allows for their rounding:
// 0.5% on A, Iy, Iz, Wel,y and It.

#include "stepframe/analysis/section.hpp"

#include <catch2/catch.hpp>

#include <algorithm>

using namespace stepframe::analysis;

namespace {

constexpr double cm2 = 1e-4, cm3 = 1e-6, cm4 = 1e-8;
constexpr double tol = 0.005;

struct Tabulated {
  const char* designation;
  double A, Iy, Iz, Wy, It;  // cm^2, cm^4, cm^4, cm^3, cm^4 (EN 10365 tables, from memory)
};

void check_against(const Section& s, const Tabulated& t) {
  INFO(t.designation);
  CHECK(s.A == Approx(t.A * cm2).epsilon(tol));
  CHECK(s.Iy == Approx(t.Iy * cm4).epsilon(tol));
  CHECK(s.Iz == Approx(t.Iz * cm4).epsilon(tol));
  CHECK(s.Wy() == Approx(t.Wy * cm3).epsilon(tol));
  CHECK(s.J == Approx(t.It * cm4).epsilon(tol));
}

}  // namespace

TEST_CASE("rolled I section from its dimensions: IPE 300 and HEB 200", "[analysis][section]") {
  // Dimensions h, b, tw, tf, r [mm] of EN 10365 (from memory).
  const Section ipe300 = rolled_i_section("IPE300", {0.300, 0.150, 0.0071, 0.0107, 0.015});
  check_against(ipe300, {"IPE 300", 53.81, 8356, 603.8, 557.1, 20.12});
  CHECK(ipe300.depth == 0.300);
  CHECK(ipe300.width == 0.150);
  CHECK(ipe300.designation == "IPE300");

  const Section heb200 = rolled_i_section("HEB200", {0.200, 0.200, 0.009, 0.015, 0.018});
  check_against(heb200, {"HEB 200", 78.08, 5696, 2003, 569.6, 59.28});
}

TEST_CASE("catalogue sections match tabulated properties", "[analysis][section][catalogue]") {
  const Tabulated table[] = {
      {"IPE 200", 28.48, 1943, 142.4, 194.3, 6.98},   {"IPE 300", 53.81, 8356, 603.8, 557.1, 20.12},
      {"IPE 400", 84.46, 23130, 1318, 1156, 51.08},   {"IPE 600", 156.0, 92080, 3387, 3069, 165.4},
      {"HEB 200", 78.08, 5696, 2003, 569.6, 59.28},   {"HEB 240", 106.0, 11260, 3923, 938.3, 102.7},
      {"HEB 300", 149.1, 25170, 8563, 1678, 185.0},
  };
  for (const Tabulated& t : table) {
    const auto s = find_catalogue_section(t.designation);
    INFO(t.designation);
    REQUIRE(s.has_value());
    check_against(*s, t);
  }
}

TEST_CASE("catalogue holds the IPE and HEB series with their nominal dimensions", "[analysis][catalogue]") {
  const std::vector<std::string> names = catalogue_designations();
  CHECK(names.size() == 18 + 24);
  for (const char* n : {"IPE80", "IPE200", "IPE220", "IPE240", "IPE270", "IPE300", "IPE330", "IPE360", "IPE400",
                        "IPE600", "HEB100", "HEB200", "HEB220", "HEB240", "HEB260", "HEB280", "HEB300", "HEB1000"}) {
    INFO(n);
    CHECK(std::find(names.begin(), names.end(), n) != names.end());
  }
  for (const std::string& n : names) {
    const auto s = find_catalogue_section(n);
    INFO(n);
    REQUIRE(s.has_value());
    CHECK(s->designation == n);
    CHECK(s->A > 0);
    CHECK(s->Iy > s->Iz);  // the strong axis is y for every rolled I/H section
  }
  // Depth and width come straight from h and b of the CSV rows.
  const auto heb260 = find_catalogue_section("HEB260");
  REQUIRE(heb260);
  CHECK(heb260->depth == Approx(0.260));
  CHECK(heb260->width == Approx(0.260));
  const auto ipe550 = find_catalogue_section("IPE550");
  REQUIRE(ipe550);
  CHECK(ipe550->depth == Approx(0.550));
  CHECK(ipe550->width == Approx(0.210));
}

TEST_CASE("designation spellings", "[analysis][catalogue]") {
  CHECK(normalize_designation("IPE 300") == "IPE300");
  CHECK(normalize_designation("ipe-300") == "IPE300");
  CHECK(normalize_designation(" ipe_300 ") == "IPE300");
  CHECK(normalize_designation("I.P.E. 300") == "IPE300");
  CHECK(normalize_designation("HE 200 B") == "HEB200");
  CHECK(normalize_designation("HE200B") == "HEB200");
  CHECK(normalize_designation("HEB200") == "HEB200");
  CHECK(normalize_designation("he-200-a") == "HEA200");
  CHECK(normalize_designation("CHS 168.3x5") == "CHS168.3X5");  // decimal point kept

  const auto reference = find_catalogue_section("IPE300");
  REQUIRE(reference);
  for (const char* spelling : {"IPE 300", "ipe-300", "Ipe300"}) {
    const auto s = find_catalogue_section(spelling);
    INFO(spelling);
    REQUIRE(s);
    CHECK(s->designation == "IPE300");
    CHECK(s->Iy == reference->Iy);
  }
  for (const char* spelling : {"HE 200 B", "HE200B", "HEB200", "heb 200"}) {
    const auto s = find_catalogue_section(spelling);
    INFO(spelling);
    REQUIRE(s);
    CHECK(s->designation == "HEB200");
  }
  CHECK_FALSE(find_catalogue_section("IPE 310"));
  CHECK_FALSE(find_catalogue_section("HEA200"));  // HE A series not in the catalogue
  CHECK_FALSE(find_catalogue_section(""));
}

TEST_CASE("impossible dimensions are rejected", "[analysis][section]") {
  CHECK_THROWS_AS(rolled_i_section("bad", {0.1, 0.1, 0.006, 0.06, 0.01}), std::invalid_argument);  // 2 tf > h
  CHECK_THROWS_AS(rolled_i_section("bad", {0.1, 0.0, 0.006, 0.01, 0.01}), std::invalid_argument);
}
