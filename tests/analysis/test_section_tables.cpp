// Every row of four published section tables against the properties the
// catalogue computes from the same nominal dimensions:
//  - ArcelorMittal, "Sales programme: Sections and Merchant Bars" (2016), tables
//    IPE A / IPE O, UPE and UPN (dimensions to EN 10365);
//  - AISC Shapes Database v15.0 (2017; the values of the AISC Steel Construction
//    Manual, 15th ed., Part 1): W, L, C, MC and HSS shapes.
// Each table is transcribed as printed (mostly three significant figures), column
// for column, under its source line; the columns left out are named at each table.
//
// Tolerances: the ArcelorMittal tables 0.5 %, It 1 % (and Iw of the channels 1 %), the Iw
// of IPE A 80 to 120 (printed to two figures) 3 % or 5 cm6: what their transcriber
// suggests for values printed to three figures. The AISC tables 1 %: three figures, from dimensions the
// database rounds to three figures too (d = 12.2 in. moves Ix by up to 0.8 %).
// Where a computed value lies further from its table, the README ("How close the
// computed properties are to published tables") states the bound and the reason,
// and the check here is that bound.
//
// St Venant J: each open section's computed J (thin plates with El Darwish &
// Johnston junction terms) is also compared with the exact solution on its outline
// (exact_torsion.hpp). That separates the formula's own error from the tables':
// AISC (W, L) and ArcelorMittal's UPE table print the exact value, ArcelorMittal's
// IPE table the same formula as stepframe, its UPN 320-400 table and AISC's C values less.

#include "exact_torsion.hpp"
#include "section_reference.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/analysis/section_shapes.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <string>
#include <string_view>
#include <vector>

using namespace stepframe::analysis;
using test::cm;
using test::inch;

namespace {

constexpr double mm = 1e-3;
// EN 10365 masses are for steel of 7850 kg/m3 (common practice).
constexpr double steel_density = 7850;

/// Allowed range of computed / reference - 1.
struct Band {
  double lo, hi;
};
constexpr Band within(double tolerance) { return {-tolerance, tolerance}; }

/// Computed and reference value in the same unit.
void check_ratio(const char* what, double computed, double reference, Band band) {
  const double deviation = computed / reference - 1;
  INFO(what << ": computed " << computed << ", reference " << reference << ", " << 100 * deviation << " %");
  CHECK(deviation >= band.lo);
  CHECK(deviation <= band.hi);
}

/// A computed value [SI] against a table's, printed in `unit` to the `power`.
void compare(const char* what, double computed, double tabulated, double unit, int power, Band band) {
  check_ratio(what, computed / std::pow(unit, power), tabulated, band);
}

/// Area and the properties about both axes that most tables print, in the table's unit:
/// y the strong axis (AISC's x), z the weak one (AISC's y). test::none where a table does
/// not print one or it is checked apart against its own bound.
struct Bending {
  double A, Iy, Wel_y, Wpl_y, iy, Iz, Wel_z, Wpl_z, iz;
};
void compare_bending(const Section& s, const Bending& t, double unit, Band band) {
  const auto check = [&](const char* what, double computed, double tabulated, int power) {
    if (!std::isnan(tabulated)) compare(what, computed, tabulated, unit, power, band);
  };
  check("A", s.A, t.A, 2);
  check("Iy", s.Iy, t.Iy, 4);
  check("Wel_y", s.Wy(), t.Wel_y, 3);
  check("Wpl_y", s.Wpl_y, t.Wpl_y, 3);
  check("iy", s.iy(), t.iy, 1);
  check("Iz", s.Iz, t.Iz, 4);
  check("Wel_z", s.Wz(), t.Wel_z, 3);
  check("Wpl_z", s.Wpl_z, t.Wpl_z, 3);
  check("iz", s.iz(), t.iz, 1);
}

/// The catalogue row of that designation (not a shape built from dimensions in the name).
Section catalogue_row(const char* designation) {
  const auto s = find_catalogue_section(designation);
  REQUIRE(s);
  const std::vector<std::string> rows = catalogue_designations();
  REQUIRE(std::find(rows.begin(), rows.end(), s->designation) != rows.end());
  return *s;
}

/// Smallest y of a section's outline: the back of a channel's web.
double outline_y_min(const Section& s) {
  double y = 0;
  for (const SectionPoint& p : s.outline.front()) y = std::min(y, p.y);
  return y;
}

}  // namespace

TEST_CASE("IPE A and IPE O: every row of the ArcelorMittal EN 10365 table", "[analysis][section][tables]") {
  // source: ArcelorMittal Europe - Long Products, "Sales programme: Sections and Merchant Bars" (edition current
  // in Feb 2016), tables "IPE A / IPE / IPE O" parallel flange I sections; dimensions to EN 10365 (formerly DIN
  // 1025-5 / Euronorm 19-57)
  // Units: h, b, tw, tf, r mm; mass kg/m; A cm2; I, It cm4; W cm3; i cm; Iw cm6.
  struct Row {
    const char* designation;
    double h, b, tw, tf, r, mass, A, Iy, Wel_y, Wpl_y, iy, Iz, Wel_z, Wpl_z, iz, It, Iw;
  };
  const Row table[] = {
    {"IPE A 80", 78, 46, 3.3, 4.2, 5, 5, 6.38, 64.4, 16.5, 19, 3.18, 6.85, 2.98, 4.7, 1.04, 0.42, 90},
    {"IPE A 100", 98, 55, 3.6, 4.7, 7, 6.9, 8.78, 141, 28.8, 33, 4.01, 13.1, 4.77, 7.5, 1.22, 0.77, 280},
    {"IPE A 120", 117.6, 64, 3.8, 5.1, 7, 8.7, 11, 257, 43.8, 49.9, 4.83, 22.4, 7, 11, 1.42, 1.04, 710},
    {"IPE A 140", 137.4, 73, 3.8, 5.6, 7, 10.5, 13.4, 435, 63.3, 71.6, 5.7, 36.4, 10, 15.5, 1.65, 1.36, 1580},
    {"IPE A 160", 157, 82, 4, 5.9, 9, 12.7, 16.2, 689, 87.8, 99.1, 6.53, 54.4, 13.3, 20.7, 1.83, 1.96, 3090},
    {"IPE A 180", 177, 91, 4.3, 6.5, 9, 15.4, 19.6, 1063, 120, 135, 7.37, 81.9, 18, 28, 2.05, 2.7, 5930},
    {"IPE O 180", 182, 92, 6, 9, 9, 21.3, 27.1, 1505, 165, 189, 7.45, 117, 25.5, 39.9, 2.08, 6.76, 8740},
    {"IPE A 200", 197, 100, 4.5, 7, 12, 18.4, 23.5, 1591, 162, 182, 8.23, 117, 23.4, 36.5, 2.23, 4.11, 10500},
    {"IPE O 200", 202, 102, 6.2, 9.5, 12, 25.1, 32, 2211, 219, 249, 8.32, 169, 33.1, 51.9, 2.3, 9.45, 15600},
    {"IPE A 220", 217, 110, 5, 7.7, 12, 22.2, 28.3, 2317, 214, 240, 9.05, 171, 31.2, 48.5, 2.46, 5.69, 18700},
    {"IPE O 220", 222, 112, 6.6, 10.2, 12, 29.4, 37.4, 3134, 282, 321, 9.16, 240, 42.8, 66.9, 2.53, 12.3, 26800},
    {"IPE A 240", 237, 120, 5.2, 8.3, 15, 26.2, 33.3, 3290, 278, 312, 9.94, 240, 40, 62.4, 2.68, 8.35, 31300},
    {"IPE O 240", 242, 122, 7, 10.8, 15, 34.3, 43.7, 4369, 361, 410, 10, 329, 53.9, 84.4, 2.74, 17.2, 43700},
    {"IPE A 270", 267, 135, 5.5, 8.7, 15, 30.7, 39.2, 4917, 368, 413, 11.2, 358, 53, 82.3, 3.02, 10.3, 59500},
    {"IPE O 270", 274, 136, 7.5, 12.2, 15, 42.3, 53.8, 6947, 507, 575, 11.4, 514, 75.5, 118, 3.09, 24.9, 87600},
    {"IPE A 300", 297, 150, 6.1, 9.2, 15, 36.5, 46.5, 7173, 483, 542, 12.4, 519, 69.2, 107, 3.34, 13.4, 107000},
    {"IPE O 300", 304, 152, 8, 12.7, 15, 49.3, 62.8, 9994, 658, 744, 12.6, 746, 98.1, 153, 3.45, 31.1, 158000},
    {"IPE A 330", 327, 160, 6.5, 10, 18, 43, 54.7, 10230, 626, 702, 13.7, 685, 85.6, 133, 3.54, 19.6, 172000},
    {"IPE O 330", 334, 162, 8.5, 13.5, 18, 57, 72.6, 13910, 833, 943, 13.8, 960, 119, 185, 3.64, 42.2, 246000},
    {"IPE A 360", 357.6, 170, 6.6, 11.5, 18, 50.2, 64, 14520, 812, 907, 15.1, 944, 111, 172, 3.84, 26.5, 282000},
    {"IPE O 360", 364, 172, 9.2, 14.7, 18, 66, 84.1, 19050, 1047, 1186, 15.1, 1251, 146, 227, 3.86, 55.8, 380000},
    {"IPE A 400", 397, 180, 7, 12, 21, 57.4, 73.1, 20290, 1022, 1144, 16.7, 1171, 130, 202, 4, 34.8, 432000},
    {"IPE O 400", 404, 182, 9.7, 15.5, 21, 75.7, 96.4, 26750, 1324, 1502, 16.7, 1564, 172, 269, 4.03, 73.1, 588000},
    {"IPE A 450", 447, 190, 7.6, 13.1, 21, 67.2, 85.6, 29760, 1331, 1494, 18.7, 1502, 158, 246, 4.19, 45.7, 705000},
    {"IPE O 450", 456, 192, 11, 17.6, 21, 92.4, 118, 40920, 1795, 2046, 18.7, 2085, 217, 341, 4.21, 109, 998000},
    {"IPE A 500", 497, 200, 8.4, 14.5, 21, 79.4, 101, 42930, 1728, 1946, 20.6, 1939, 194, 302, 4.38, 62.8, 1125000},
    {"IPE O 500", 506, 202, 12, 19, 21, 107, 137, 57780, 2284, 2613, 20.6, 2622, 260, 409, 4.38, 144, 1548000},
    {"IPE A 550", 547, 210, 9, 15.7, 24, 92.1, 117, 59980, 2193, 2475, 22.6, 2432, 232, 362, 4.55, 86.5, 1710000},
    {"IPE O 550", 556, 212, 12.7, 20.2, 24, 123, 156, 79160, 2847, 3263, 22.5, 3224, 304, 481, 4.55, 188, 2302000},
    {"IPE A 600", 597, 220, 9.8, 17.5, 24, 108, 137, 82920, 2778, 3141, 24.6, 3116, 283, 442, 4.77, 119, 2607000},
    {"IPE O 600", 610, 224, 15, 24, 24, 154, 197, 118300, 3879, 4471, 24.5, 4521, 404, 640, 4.79, 318, 3860000},
  };
  const Band tolerance = within(0.005);
  for (const Row& t : table) {
    INFO(t.designation);
    const Section s = catalogue_row(t.designation);
    CHECK(s.depth == Approx(t.h * mm));
    CHECK(s.width == Approx(t.b * mm));
    CHECK(s.t_max == Approx(std::max(t.tf, t.tw) * mm));
    compare("mass", s.mass_per_metre(steel_density), t.mass, 1, 0, tolerance);
    compare_bending(s, {t.A, t.Iy, t.Wel_y, t.Wpl_y, t.iy, t.Iz, t.Wel_z, t.Wpl_z, t.iz}, cm, tolerance);
    compare("It", s.J, t.It, cm, 4, within(0.01));
    // Iw up to 710 cm6 is printed to two figures (0.09, 0.28, 0.71 x 10^3 cm6).
    compare("Iw", s.Iw, t.Iw, cm, 6, t.Iw <= 710 ? within(std::max(0.03, 5 / t.Iw)) : tolerance);
    // The table's It and stepframe's J are the same formula; the exact value differs from
    // both by up to 7.5 % for IPE A 80 to 120 and by 3 % for the larger sizes.
    check_ratio("J against the exact solution", s.J, test::exact_torsion_constant(s),
                t.h < 130 ? Band{-0.03, 0.075} : Band{-0.03, 0.03});
  }
}

TEST_CASE("UPE: every row of the ArcelorMittal EN 10365 table", "[analysis][section][tables]") {
  // source: ArcelorMittal Europe - Long Products, "Sales programme: Sections and Merchant Bars" (edition current
  // in Feb 2016), table "UPE" parallel flange channels; dimensions to EN 10365 (formerly DIN 1026-2)
  // Units as the IPE table; Avz cm2. Left out: ss (stiff bearing length, not computed).
  struct Row {
    const char* designation;
    double h, b, tw, tf, r, mass, A, Iy, Wel_y, Wpl_y, iy, Avz, Iz, Wel_z, Wpl_z, iz, It, Iw;
  };
  const Row table[] = {
    {"UPE 80", 80, 50, 4, 7, 10, 7.9, 10.1, 107, 26.8, 31.2, 3.26, 4.05, 25.5, 8, 14.3, 1.59, 1.47, 220},
    {"UPE 100", 100, 55, 4.5, 7.5, 10, 9.82, 12.5, 207, 41.4, 48, 4.07, 5.34, 38.3, 10.6, 19.3, 1.75, 2.01, 530},
    {"UPE 120", 120, 60, 5, 8, 12, 12.1, 15.4, 364, 60.6, 70.3, 4.86, 7.18, 55.5, 13.8, 25.3, 1.9, 2.9, 1120},
    {"UPE 140", 140, 65, 5, 9, 12, 14.5, 18.4, 600, 85.6, 98.8, 5.71, 8.25, 78.8, 18.2, 33.2, 2.07, 4.05, 2200},
    {"UPE 160", 160, 70, 5.5, 9.5, 12, 17, 21.7, 911, 114, 132, 6.48, 10, 107, 22.6, 41.5, 2.22, 5.2, 3960},
    {"UPE 180", 180, 75, 5.5, 10.5, 12, 19.7, 25.1, 1350, 150, 173, 7.34, 11.2, 144, 28.6, 52.3, 2.39, 6.99, 6810},
    {"UPE 200", 200, 80, 6, 11, 13, 22.8, 29, 1910, 191, 220, 8.11, 13.5, 187, 34.5, 63.3, 2.54, 8.89, 11000},
    {"UPE 220", 220, 85, 6.5, 12, 13, 26.6, 33.9, 2680, 244, 281, 8.9, 15.8, 247, 42.5, 78.2, 2.7, 12.1, 17600},
    {"UPE 240", 240, 90, 7, 12.5, 15, 30.2, 38.5, 3600, 300, 347, 9.67, 18.8, 311, 50.1, 92.2, 2.84, 15.1, 26400},
    {"UPE 270", 270, 95, 7.5, 13.5, 15, 35.2, 44.8, 5250, 389, 451, 10.8, 22.2, 401, 60.7, 112, 2.99, 19.9, 43600},
    {"UPE 300", 300, 100, 9.5, 15, 15, 44.4, 56.6, 7820, 522, 613, 11.8, 30.3, 538, 75.6, 137, 3.08, 31.5, 72700},
    {"UPE 330", 330, 105, 11, 16, 18, 53.2, 67.8, 11010, 667, 792, 12.7, 38.8, 681, 89.7, 156, 3.17, 45.2, 112000},
    {"UPE 360", 360, 110, 12, 17, 18, 61.2, 77.9, 14830, 824, 982, 13.8, 45.6, 844, 105, 178, 3.29, 58.5, 166000},
    {"UPE 400", 400, 115, 13.5, 18, 18, 72.2, 91.9, 20980, 1050, 1260, 15.1, 56.2, 1045, 123, 191, 3.37, 79.1, 259000},
  };
  const Band tolerance = within(0.005);
  for (const Row& t : table) {
    INFO(t.designation);
    const Section s = catalogue_row(t.designation);
    CHECK(s.depth == Approx(t.h * mm));
    CHECK(s.width == Approx(t.b * mm));
    CHECK(s.t_max == Approx(std::max(t.tf, t.tw) * mm));
    compare("mass", s.mass_per_metre(steel_density), t.mass, 1, 0, tolerance);
    compare_bending(s, {t.A, t.Iy, t.Wel_y, t.Wpl_y, t.iy, t.Iz, t.Wel_z, test::none, t.iz}, cm, tolerance);
    compare("Avz", s.Avz, t.Avz, cm, 2, tolerance);
    // README bounds: Wpl_z is the plastic modulus about the equal-area axis, the least first
    // moment any axis gives; the table's is below that least value for UPE 330 to 400.
    compare("Wpl_z", s.Wpl_z, t.Wpl_z, cm, 3, Band{-0.03, 0.16});
    // The table's It is the exact value (within 1 %); the junction formula misses it by
    // -2.5 to +2 %. Iw by thin-walled theory on the centre lines is 2-8 % above the table.
    const double J_exact = test::exact_torsion_constant(s);
    compare("It", s.J, t.It, cm, 4, within(0.025));
    check_ratio("tabulated It against the exact solution", t.It * std::pow(cm, 4), J_exact, within(0.01));
    check_ratio("J against the exact solution", s.J, J_exact, Band{-0.025, 0.02});
    compare("Iw", s.Iw, t.Iw, cm, 6, Band{0.02, 0.08});
  }
}

TEST_CASE("UPN 320 to 400: every row of the ArcelorMittal EN 10365 table", "[analysis][section][tables]") {
  // source: ArcelorMittal Europe - Long Products, "Sales programme: Sections and Merchant Bars" (edition current
  // in Feb 2016), table "UPN" taper flange channels; dimensions to EN 10365 (formerly DIN 1026-1); flange slope
  // 5 % for UPN 320-400
  // Units as the IPE table; r1 root, r2 toe radius mm.
  struct Row {
    const char* designation;
    double h, b, tw, tf, r1, r2, mass, A, Iy, Wpl_y, Iz, Wpl_z, It, Iw;
  };
  const Row table[] = {
    {"UPN 320", 320, 100, 14, 17.5, 17.5, 8.75, 59.5, 75.8, 10870, 826, 597, 152, 66.7, 96100},
    {"UPN 350", 350, 100, 14, 16, 16, 8, 60.6, 77.3, 12840, 918, 570, 143, 61.2, 114000},
    {"UPN 380", 380, 102, 13.5, 16, 16, 8, 63.1, 80.4, 15760, 1010, 615, 148, 59.1, 146000},
    {"UPN 400", 400, 110, 14, 18, 18, 9, 71.8, 91.5, 20350, 1240, 846, 190, 81.6, 221000},
  };
  const Band tolerance = within(0.005);
  for (const Row& t : table) {
    INFO(t.designation);
    const Section s = catalogue_row(t.designation);
    CHECK(s.depth == Approx(t.h * mm));
    CHECK(s.width == Approx(t.b * mm));
    compare("mass", s.mass_per_metre(steel_density), t.mass, 1, 0, tolerance);
    compare("A", s.A, t.A, cm, 2, tolerance);
    compare("Iy", s.Iy, t.Iy, cm, 4, tolerance);
    // README bound: UPN 350's tabulated Wpl_y gives it a shape factor Wpl_y / Wel_y of 1.25
    // against 1.22 for UPN 320, 380 and 400; the computed value is 2 % lower.
    compare("Wpl_y", s.Wpl_y, t.Wpl_y, cm, 3, std::string_view(t.designation) == "UPN 350" ? Band{-0.025, 0} : tolerance);
    // README bound: 1.5 % (UPN 400 +0.6 % and +1.4 %; A, Iy and Iw of the same geometry agree).
    compare("Iz", s.Iz, t.Iz, cm, 4, within(0.015));
    compare("Wpl_z", s.Wpl_z, t.Wpl_z, cm, 3, within(0.015));
    compare("Iw", s.Iw, t.Iw, cm, 6, within(0.01));
    // README bound: the table's It is 1-5 % below the exact value; the junction formula is
    // within 1.5 % of it, so 2-6 % above the table.
    const double J_exact = test::exact_torsion_constant(s);
    compare("It", s.J, t.It, cm, 4, Band{0.02, 0.06});
    check_ratio("tabulated It against the exact solution", t.It * std::pow(cm, 4), J_exact, Band{-0.05, -0.01});
    check_ratio("J against the exact solution", s.J, J_exact, Band{0, 0.015});
  }
}

TEST_CASE("W shapes: every row of the AISC Shapes Database v15.0", "[analysis][section][tables]") {
  // source: AISC Shapes Database v15.0 (American Institute of Steel Construction, 2017; dimensions per ASTM
  // A6/A6M; same values as AISC Steel Construction Manual 15th ed., Part 1 tables)
  // Units: in, in2, in3, in4, in6. Left out: W (nominal weight), rts and ho (derived).
  struct Row {
    const char* label;
    double A, d, bf, tw, tf, kdes, Ix, Zx, Sx, rx, Iy, Zy, Sy, ry, J, Cw;
  };
  const Row table[] = {
    {"W8X31", 9.13, 8, 8, 0.285, 0.435, 0.829, 110, 30.4, 27.5, 3.47, 37.1, 14.1, 9.27, 2.02, 0.536, 530},
    {"W10X33", 9.71, 9.73, 7.96, 0.29, 0.435, 0.935, 171, 38.8, 35, 4.19, 36.6, 14, 9.2, 1.94, 0.583, 791},
    {"W12X26", 7.65, 12.2, 6.49, 0.23, 0.38, 0.68, 204, 37.2, 33.4, 5.17, 17.3, 8.17, 5.34, 1.51, 0.3, 607},
    {"W12X40", 11.7, 11.9, 8.01, 0.295, 0.515, 1.02, 307, 57, 51.5, 5.13, 44.1, 16.8, 11, 1.94, 0.906, 1440},
    {"W12X65", 19.1, 12.1, 12, 0.39, 0.605, 1.2, 533, 96.8, 87.9, 5.28, 174, 44.1, 29.1, 3.02, 2.18, 5780},
    {"W14X48", 14.1, 13.8, 8.03, 0.34, 0.595, 1.19, 484, 78.4, 70.2, 5.85, 51.4, 19.6, 12.8, 1.91, 1.45, 2240},
    {"W14X90", 26.5, 14, 14.5, 0.44, 0.71, 1.31, 999, 157, 143, 6.14, 362, 75.6, 49.9, 3.7, 4.06, 16000},
    {"W14X132", 38.8, 14.7, 14.7, 0.645, 1.03, 1.63, 1530, 234, 209, 6.28, 548, 113, 74.5, 3.76, 12.3, 25500},
    {"W16X26", 7.68, 15.7, 5.5, 0.25, 0.345, 0.747, 301, 44.2, 38.4, 6.26, 9.59, 5.48, 3.49, 1.12, 0.262, 565},
    {"W18X50", 14.7, 18, 7.5, 0.355, 0.57, 0.972, 800, 101, 88.9, 7.38, 40.1, 16.6, 10.7, 1.65, 1.24, 3040},
    {"W21X44", 13, 20.7, 6.5, 0.35, 0.45, 0.95, 843, 95.4, 81.6, 8.06, 20.7, 10.2, 6.37, 1.26, 0.77, 2110},
    {"W24X55", 16.2, 23.6, 7.01, 0.395, 0.505, 1.01, 1350, 134, 114, 9.11, 29.1, 13.3, 8.3, 1.34, 1.18, 3870},
    {"W27X84", 24.7, 26.7, 10, 0.46, 0.64, 1.24, 2850, 244, 213, 10.7, 106, 33.2, 21.2, 2.07, 2.81, 17900},
    {"W33X118", 34.7, 32.9, 11.5, 0.55, 0.74, 1.44, 5900, 415, 359, 13, 187, 51.3, 32.6, 2.32, 5.3, 48300},
    {"W36X150", 44.3, 35.9, 12, 0.625, 0.94, 1.69, 9040, 581, 504, 14.3, 270, 70.9, 45.1, 2.47, 10.1, 82200},
  };
  const Band tolerance = within(0.01);
  for (const Row& t : table) {
    INFO(t.label);
    const Section s = catalogue_row(t.label);
    CHECK(s.depth == Approx(t.d * inch));
    CHECK(s.width == Approx(t.bf * inch));
    CHECK(s.t_max == Approx(std::max(t.tf, t.tw) * inch));
    compare_bending(s, {t.A, t.Ix, t.Sx, t.Zx, t.rx, t.Iy, t.Sy, t.Zy, t.ry}, inch, tolerance);
    // Cw = Iy ho^2 / 4 compounds the rounding of Iy and ho: 1.5 %.
    compare("Cw", s.Iw, t.Cw, inch, 6, within(0.015));
    // README bound: the database's J is the exact value (within 1 %); the junction formula
    // misses it by -1.5 to +3.5 %.
    const double J_exact = test::exact_torsion_constant(s);
    compare("J", s.J, t.J, inch, 4, Band{-0.01, 0.04});
    check_ratio("tabulated J against the exact solution", t.J * std::pow(inch, 4), J_exact, within(0.01));
    check_ratio("J against the exact solution", s.J, J_exact, Band{-0.015, 0.035});
  }
}

TEST_CASE("L shapes: every row of the AISC Shapes Database v15.0", "[analysis][section][tables]") {
  // source: AISC Shapes Database v15.0 (American Institute of Steel Construction, 2017; dimensions per ASTM
  // A6/A6M; same values as AISC Steel Construction Manual 15th ed., Part 1 tables)
  // b the long leg, d the short one; x, y the centroid from the back of the long and the
  // short leg; Ix, Iy about the legs (x parallel to the short leg); Iz, rz, Sz about the
  // minor principal axis, tan(a) its angle. Units as the W table. Left out: W, and Zx, Sx,
  // rx, Zy, Sy, ry, ro, H about the legs (the catalogue gives principal-axis properties).
  struct Row {
    const char* label;
    double A, b, d, t, kdes, x, y, Ix, Iy, Iz, rz, Sz, tan_a, J, Cw;
  };
  const Row table[] = {
    {"L8X8X1", 15.1, 8, 8, 1, 1.63, 2.36, 2.36, 89.1, 89.1, 36.8, 1.56, 11, 1, 5.08, 23.4},
    {"L6X6X1/2", 5.77, 6, 6, 0.5, 1, 1.67, 1.67, 19.9, 19.9, 8.06, 1.18, 3.42, 1, 0.501, 1.32},
    {"L4X4X1/2", 3.75, 4, 4, 0.5, 0.875, 1.18, 1.18, 5.52, 5.52, 2.25, 0.776, 1.35, 1, 0.322, 0.366},
    {"L4X4X1/4", 1.93, 4, 4, 0.25, 0.625, 1.08, 1.08, 3, 3, 1.19, 0.783, 0.778, 1, 0.0438, 0.0505},
    {"L3X3X1/4", 1.44, 3, 3, 0.25, 0.625, 0.836, 0.836, 1.23, 1.23, 0.49, 0.585, 0.415, 1, 0.0313, 0.0206},
    {"L6X4X1/2", 4.75, 6, 4, 0.5, 1, 0.981, 1.98, 17.3, 6.22, 3.54, 0.864, 1.72, 0.44, 0.407, 0.843},
    {"L5X3X1/2", 3.75, 5, 3, 0.5, 0.938, 0.746, 1.74, 9.43, 2.55, 1.55, 0.642, 0.957, 0.357, 0.322, 0.444},
    {"L4X3X3/8", 2.49, 4, 3, 0.375, 0.75, 0.775, 1.27, 3.94, 1.89, 1, 0.636, 0.699, 0.551, 0.123, 0.114},
  };
  const Band tolerance = within(0.01);
  for (const Row& t : table) {
    INFO(t.label);
    const Section s = catalogue_row(t.label);
    CHECK(s.t_max == Approx(t.t * inch));
    // Leg axes from the principal ones (Mohr's circle): turned back by principal_angle.
    const double a = s.principal_angle, c = std::cos(a), n = std::sin(a);
    // The heel: the shear centre (where the legs' centre lines meet) less t/2 along both legs.
    const double heel_y = c * s.shear_centre_y - n * s.shear_centre_z - 0.5 * t.t * inch;
    const double heel_z = n * s.shear_centre_y + c * s.shear_centre_z - 0.5 * t.t * inch;
    // README bounds: no toe radius in the model; A and I about the legs within 2 %, the
    // minor-axis Iz and Sz within 5 %.
    compare("A", s.A, t.A, inch, 2, within(0.02));
    compare("x", -heel_y, t.x, inch, 1, tolerance);
    compare("y", -heel_z, t.y, inch, 1, tolerance);
    compare("Ix", s.Iy * c * c + s.Iz * n * n, t.Ix, inch, 4, within(0.02));
    compare("Iy", s.Iy * n * n + s.Iz * c * c, t.Iy, inch, 4, within(0.02));
    compare("Iz", s.Iz, t.Iz, inch, 4, within(0.05));
    compare("rz", s.iz(), t.rz, inch, 1, within(0.025));
    compare("Sz", s.Wz(), t.Sz, inch, 3, within(0.05));
    compare("tan(a)", std::tan(a), t.tan_a, 1, 0, tolerance);
    compare("Cw", s.Iw, t.Cw, inch, 6, tolerance);
    // README bound: J -3 to +6 %; the junction formula is 1.5-4 % above the exact value on
    // the model's outline, whose fillet and toe radii the database does not give.
    const double J_exact = test::exact_torsion_constant(s);
    compare("J", s.J, t.J, inch, 4, Band{-0.03, 0.06});
    check_ratio("tabulated J against the exact solution", t.J * std::pow(inch, 4), J_exact, Band{-0.03, 0.05});
    check_ratio("J against the exact solution", s.J, J_exact, Band{0.015, 0.04});
  }
}

TEST_CASE("C and MC shapes: every row of the AISC Shapes Database v15.0", "[analysis][section][tables]") {
  // source: AISC Shapes Database v15.0 (American Institute of Steel Construction, 2017; dimensions per ASTM
  // A6/A6M; same values as AISC Steel Construction Manual 15th ed., Part 1 tables)
  // tf the average flange thickness; x the centroid and eo the shear centre from the back of
  // the web. Units as the W table. Left out: W, xp, ro, H, rts, ho.
  struct Row {
    const char* label;
    double A, d, bf, tw, tf, kdes, x, eo, Ix, Zx, Sx, rx, Iy, Zy, Sy, ry, J, Cw;
  };
  const Row table[] = {
    {"C6X8.2", 2.39, 6, 1.92, 0.2, 0.343, 0.813, 0.512, 0.599, 13.1, 5.16, 4.35, 2.34, 0.687, 0.987, 0.488, 0.536, 0.0736, 4.7},
    {"C8X11.5", 3.37, 8, 2.26, 0.22, 0.39, 0.938, 0.572, 0.697, 32.5, 9.63, 8.14, 3.11, 1.31, 1.57, 0.775, 0.623, 0.13, 16.5},
    {"C10X15.3", 4.48, 10, 2.6, 0.24, 0.436, 1, 0.634, 0.796, 67.3, 15.9, 13.5, 3.88, 2.27, 2.34, 1.15, 0.711, 0.209, 45.5},
    {"C12X20.7", 6.08, 12, 2.94, 0.282, 0.501, 1.13, 0.698, 0.87, 129, 25.6, 21.5, 4.61, 3.86, 3.47, 1.72, 0.797, 0.369, 112},
    {"C15X33.9", 10, 15, 3.4, 0.4, 0.65, 1.44, 0.788, 0.896, 315, 50.8, 42, 5.61, 8.07, 6.19, 3.09, 0.901, 1.01, 358},
    {"MC8X20", 5.87, 8, 3.03, 0.4, 0.5, 1.13, 0.84, 0.843, 54.4, 16.4, 13.6, 3.04, 4.42, 3.86, 2.02, 0.867, 0.441, 47.8},
  };
  for (const Row& t : table) {
    INFO(t.label);
    // The database's Cw and eo take the sloped flanges as parallel plates of thickness tf:
    // thin-walled theory on that idealisation, without radii, reproduces them within 1 %.
    const Section parallel = channel_section(t.label, {t.d * inch, t.bf * inch, t.tw * inch, t.tf * inch, 0, 0, 0});
    compare("Cw, parallel flanges", parallel.Iw, t.Cw, inch, 6, within(0.01));
    compare("eo, parallel flanges", outline_y_min(parallel) - parallel.shear_centre_y, t.eo, inch, 1, within(0.01));
    // README: the catalogue has no MC shapes (no common flange slope, and the table gives none).
    if (std::string_view(t.label).starts_with("MC")) continue;

    const Section s = catalogue_row(t.label);
    CHECK(s.depth == Approx(t.d * inch));
    CHECK(s.width == Approx(t.bf * inch));
    // README bound: r from kdes and no toe radius, 2.5 %.
    const Band tolerance = within(0.025);
    compare_bending(s, {t.A, t.Ix, t.Sx, t.Zx, t.rx, t.Iy, t.Sy, t.Zy, t.ry}, inch, tolerance);
    compare("x", -outline_y_min(s), t.x, inch, 1, tolerance);
    // README bounds: stepframe follows the 1:6 taper, which puts less material at the toes
    // than the parallel idealisation: Cw 18-23 % and eo 13-18 % below the database.
    compare("Cw", s.Iw, t.Cw, inch, 6, Band{-0.23, -0.18});
    compare("eo", outline_y_min(s) - s.shear_centre_y, t.eo, inch, 1, Band{-0.18, -0.13});
    // README bound: the database's J leaves out the fillets, 3-7.5 % below the exact value;
    // the junction formula is within 1 % of it, so 4-8 % above the database.
    const double J_exact = test::exact_torsion_constant(s);
    compare("J", s.J, t.J, inch, 4, Band{0.04, 0.08});
    check_ratio("tabulated J against the exact solution", t.J * std::pow(inch, 4), J_exact, Band{-0.075, -0.03});
    check_ratio("J against the exact solution", s.J, J_exact, Band{0, 0.01});
  }
}

TEST_CASE("HSS: every row of the AISC Shapes Database v15.0", "[analysis][section][tables]") {
  // source: AISC Shapes Database v15.0 (American Institute of Steel Construction, 2017; dimensions per ASTM
  // A6/A6M; same values as AISC Steel Construction Manual 15th ed., Part 1 tables)
  // Properties use the design wall tdes = 0.93 tnom. Units as the W table. Left out: W (from
  // the nominal wall), h and b (flat widths), C (torsional modulus, not computed).
  struct Rectangular {
    const char* label;
    double A, Ht, B, tnom, tdes, Ix, Zx, Sx, rx, Iy, Zy, Sy, ry, J;
  };
  const Rectangular rectangular[] = {
    {"HSS6X6X3/8", 7.58, 6, 6, 0.375, 0.349, 39.5, 15.8, 13.2, 2.28, 39.5, 15.8, 13.2, 2.28, 64.6},
    {"HSS8X4X1/4", 5.24, 8, 4, 0.25, 0.233, 42.5, 13.3, 10.6, 2.85, 14.4, 8.2, 7.21, 1.66, 35.3},
    {"HSS10X6X1/2", 13.5, 10, 6, 0.5, 0.465, 171, 43, 34.3, 3.57, 76.8, 30.1, 25.6, 2.39, 176},
    {"HSS4X4X1/4", 3.37, 4, 4, 0.25, 0.233, 7.8, 4.69, 3.9, 1.52, 7.8, 4.69, 3.9, 1.52, 12.8},
  };
  const Band tolerance = within(0.01);
  for (const Rectangular& t : rectangular) {
    INFO(t.label);
    const Section s = catalogue_row(t.label);
    CHECK(s.depth == Approx(t.Ht * inch));
    CHECK(s.width == Approx(t.B * inch));
    CHECK(s.t_max == Approx(t.tdes * inch).epsilon(0.005));  // tdes printed to three figures
    compare_bending(s, {t.A, t.Ix, t.Sx, t.Zx, t.rx, t.Iy, t.Sy, t.Zy, t.ry}, inch, tolerance);
    compare("J", s.J, t.J, inch, 4, tolerance);
  }

  // Round: Iy, Zy, Sy, ry equal Ix, Zx, Sx, rx (left out, compared as those); OD is printed to three
  // figures (10.8 for 10.750 in.). The catalogue spells the sizes without trailing zeros.
  struct Round {
    const char* label;
    const char* catalogue;
    double A, OD, tnom, tdes, Ix, Zx, Sx, rx, J;
  };
  const Round round[] = {
    {"HSS6.625X0.280", "HSS6.625X0.280", 5.2, 6.63, 0.28, 0.26, 26.4, 10.5, 7.96, 2.25, 52.7},
    {"HSS4.500X0.237", "HSS4.5X0.237", 2.96, 4.5, 0.237, 0.22, 6.79, 4.03, 3.02, 1.52, 13.6},
    {"HSS10.750X0.500", "HSS10.75X0.500", 15, 10.8, 0.5, 0.465, 199, 49.2, 37, 3.64, 398},
  };
  for (const Round& t : round) {
    INFO(t.label);
    const Section s = catalogue_row(t.catalogue);
    CHECK(s.depth == Approx(t.OD * inch).epsilon(0.005));
    CHECK(s.t_max == Approx(t.tdes * inch).epsilon(0.005));  // tdes printed to three figures
    compare_bending(s, {t.A, t.Ix, t.Sx, t.Zx, t.rx, t.Ix, t.Sx, t.Zx, t.rx}, inch, tolerance);
    compare("J", s.J, t.J, inch, 4, tolerance);
  }
}
