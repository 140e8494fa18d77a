// Rolled I and H sections computed from their nominal dimensions, compared
// with the section property tables of EN 10365:2017 (IPE, HE A, HE B, HE M) and
// of the AISC Steel Construction Manual, Table 1-1 (W shapes). The reference
// values are recalled from those tables ("from memory"), so the tolerances
// allow for the tables' rounding (IPE A, IPE O and the W sizes of a published
// table are compared with that table in test_section_tables.cpp):
//  - EN 10365: 0.5% on A, I, Wel, Wpl and It; 1% on Iw (tabulated to 3-4 digits);
//  - W shapes: 1.5% on A, I, S, Z, 3% on J and Cw, because the AISC dimension
//    tables round d and bf to 0.1 in and the web and flange to 0.005 in.

#include "section_reference.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/analysis/section_shapes.hpp"

#include <catch2/catch.hpp>

#include <algorithm>

using namespace stepframe::analysis;
using test::cm;
using test::inch;
using test::none;
using test::Tabulated;

TEST_CASE("rolled I section from its dimensions: IPE 300 and HEB 200", "[analysis][section]") {
  // Dimensions h, b, tw, tf, r [mm] of EN 10365 (from memory).
  const Section ipe300 = rolled_i_section("IPE300", {0.300, 0.150, 0.0071, 0.0107, 0.015});
  // EN 10365 IPE 300 (from memory).
  test::check_against(ipe300, {"IPE 300", 53.81, 8356, 603.8, 557.1, 80.50, 628.4, 125.2, 20.12, 125.9e3}, cm, 0.005,
                      0.01);
  CHECK(ipe300.depth == Approx(0.300));
  CHECK(ipe300.width == Approx(0.150));
  CHECK(ipe300.designation == "IPE300");
  CHECK(ipe300.shape == SectionShape::rolled_i);
  // Shear area, EN 1993-1-1 6.2.6(3)(a): A - 2 b tf + (tw + 2 r) tf = 25.68 cm2
  // (the EN 10365 table lists Avz = 25.68 cm2, from memory).
  CHECK(ipe300.Avz == Approx(25.68e-4).epsilon(0.002));
  // Radius of gyration, EN 10365 iy = 12.46 cm, iz = 3.35 cm (from memory).
  CHECK(ipe300.iy() == Approx(0.1246).epsilon(0.002));
  CHECK(ipe300.iz() == Approx(0.0335).epsilon(0.003));
  // Mass per metre: EN 10365 lists 42.2 kg/m for IPE 300 (from memory), A x 7850 kg/m3.
  CHECK(ipe300.mass_per_metre(7850) == Approx(42.2).epsilon(0.003));
  // c/t of EN 1993-1-1 Table 5.2: web (h - 2 tf - 2 r) / tw = 248.6 / 7.1 = 35.0,
  // flange outstand (b - tw - 2 r) / 2 / tf = 56.45 / 10.7 = 5.28 (arithmetic on the dimensions).
  REQUIRE(ipe300.parts.size() == 2);
  CHECK(ipe300.parts[0].ratio() == Approx(248.6 / 7.1));
  CHECK(ipe300.parts[1].ratio() == Approx(56.45 / 10.7));
  CHECK(ipe300.t_max == Approx(0.0107));

  const Section heb200 = rolled_i_section("HEB200", {0.200, 0.200, 0.009, 0.015, 0.018});
  // EN 10365 HE 200 B (from memory).
  test::check_against(heb200, {"HEB 200", 78.08, 5696, 2003, 569.6, 200.3, 642.5, 305.8, 59.28, 171.1e3}, cm, 0.005,
                      0.01);
}

TEST_CASE("IPE series matches EN 10365 tabulated properties", "[analysis][section][catalogue]") {
  // EN 10365:2017 IPE table (from memory): A cm2, Iy cm4, Iz cm4, Wel,y cm3,
  // Wel,z cm3, Wpl,y cm3, Wpl,z cm3, It cm4, Iw cm6.
  const Tabulated table[] = {
      {"IPE 80", 7.64, 80.14, 8.49, 20.03, 3.69, 23.22, 5.82, 0.70, 0.118e3},
      {"IPE 100", 10.32, 171.0, 15.92, 34.20, 5.79, 39.41, 9.15, 1.20, 0.351e3},
      {"IPE 120", 13.21, 317.8, 27.67, 52.96, 8.65, 60.73, 13.58, 1.74, 0.890e3},
      {"IPE 140", 16.43, 541.2, 44.92, 77.32, 12.31, 88.34, 19.25, 2.45, 1.98e3},
      {"IPE 160", 20.09, 869.3, 68.31, 108.7, 16.66, 123.9, 26.10, 3.60, 3.96e3},
      {"IPE 180", 23.95, 1317, 100.9, 146.3, 22.16, 166.4, 34.60, 4.79, 7.43e3},
      {"IPE 200", 28.48, 1943, 142.4, 194.3, 28.47, 220.6, 44.61, 6.98, 12.99e3},
      {"IPE 220", 33.37, 2772, 204.9, 252.0, 37.25, 285.4, 58.11, 9.07, 22.67e3},
      {"IPE 240", 39.12, 3892, 283.6, 324.3, 47.27, 366.6, 73.92, 12.88, 37.39e3},
      {"IPE 270", 45.95, 5790, 419.9, 428.9, 62.20, 484.0, 96.95, 15.94, 70.58e3},
      {"IPE 300", 53.81, 8356, 603.8, 557.1, 80.50, 628.4, 125.2, 20.12, 125.9e3},
      {"IPE 330", 62.61, 11770, 788.1, 713.1, 98.52, 804.3, 153.7, 28.15, 199.1e3},
      {"IPE 360", 72.73, 16270, 1043, 903.6, 122.8, 1019, 191.1, 37.32, 313.6e3},
      {"IPE 400", 84.46, 23130, 1318, 1156, 146.4, 1307, 229.0, 51.08, 490.0e3},
      {"IPE 450", 98.82, 33740, 1676, 1500, 176.4, 1702, 276.4, 66.87, 791.0e3},
      {"IPE 500", 115.5, 48200, 2142, 1928, 214.2, 2194, 335.9, 89.29, 1249e3},
      {"IPE 550", 134.4, 67120, 2668, 2441, 254.1, 2787, 400.5, 123.2, 1884e3},
      {"IPE 600", 156.0, 92080, 3387, 3069, 307.9, 3512, 485.6, 165.4, 2846e3},
  };
  for (const Tabulated& t : table) test::check_catalogue(t, cm, 0.005, 0.01);
}

TEST_CASE("HE A, HE B and HE M series match EN 10365 tabulated properties", "[analysis][section][catalogue]") {
  // EN 10365:2017 HE tables (from memory), same columns as above.
  const Tabulated hea[] = {
      {"HEA 100", 21.24, 349.2, 133.8, 72.76, 26.76, 83.01, 41.14, 5.24, 2.58e3},
      {"HEA 140", 31.42, 1033, 389.3, 155.4, none, 173.5, none, 8.13, 15.06e3},
      {"HEA 160", 38.77, 1673, 615.6, 220.1, none, 245.1, none, 12.19, 31.41e3},
      {"HEA 180", 45.25, 2510, 924.6, 293.6, none, 324.9, none, 14.80, 60.21e3},
      {"HEA 200", 53.83, 3692, 1336, 388.6, 133.6, 429.5, 203.8, 20.98, 108.0e3},
      {"HEA 220", 64.34, 5410, 1955, 515.2, none, 568.5, none, 28.46, 193.3e3},
      {"HEA 240", 76.84, 7763, 2769, 675.1, 230.7, 744.6, 351.7, 41.55, 328.5e3},
      {"HEA 260", 86.82, 10450, 3668, 836.4, none, 919.8, none, 52.37, 516.4e3},
      {"HEA 280", 97.26, 13670, 4763, 1013, none, 1112, none, 62.10, 785.4e3},
      {"HEA 300", 112.5, 18260, 6310, 1260, 420.6, 1383, 641.2, 85.17, 1200e3},
      {"HEA 400", 159.0, 45070, 8564, 2311, 570.9, 2562, 872.9, 189.0, 2942e3},
      {"HEA 500", 197.5, 86970, 10370, 3550, none, 3949, none, 309.3, 5643e3},
      {"HEA 600", 226.5, 141200, 11270, 4787, none, 5350, none, 397.8, 8978e3},
  };
  for (const Tabulated& t : hea) test::check_catalogue(t, cm, 0.005, 0.01);

  const Tabulated heb[] = {
      {"HEB 100", 26.04, 449.5, 167.3, 89.91, 33.45, 104.2, 51.42, 9.25, 3.38e3},
      {"HEB 120", 34.01, 864.4, 317.5, 144.1, 52.92, 165.2, 80.97, 13.84, 9.41e3},
      {"HEB 140", 42.96, 1509, 549.7, 215.6, 78.52, 245.4, 119.8, 20.06, 22.48e3},
      {"HEB 160", 54.25, 2492, 889.2, 311.5, 111.2, 354.0, 170.0, 31.24, 47.94e3},
      {"HEB 180", 65.25, 3831, 1363, 425.7, 151.4, 481.4, 231.0, 42.16, 93.75e3},
      {"HEB 200", 78.08, 5696, 2003, 569.6, 200.3, 642.5, 305.8, 59.28, 171.1e3},
      {"HEB 220", 91.04, 8091, 2843, 735.5, 258.5, 827.0, 393.9, 76.57, 295.4e3},
      {"HEB 240", 106.0, 11260, 3923, 938.3, 326.9, 1053, 498.4, 102.7, 486.9e3},
      {"HEB 260", 118.4, 14920, 5135, 1148, 395.0, 1283, 602.2, 123.8, 753.7e3},
      {"HEB 280", 131.4, 19270, 6595, 1376, 471.0, 1534, 717.6, 143.7, 1130e3},
      {"HEB 300", 149.1, 25170, 8563, 1678, 570.9, 1869, 870.1, 185.0, 1688e3},
      {"HEB 400", 197.8, 57680, 10820, 2884, 721.3, 3232, 1104, 355.7, 3817e3},
      {"HEB 500", 238.6, 107200, 12620, 4287, 841.6, 4815, 1292, 538.4, 7018e3},
  };
  for (const Tabulated& t : heb) test::check_catalogue(t, cm, 0.005, 0.01);

  const Tabulated hem[] = {
      {"HEM 100", 53.24, 1143, 399.2, 190.4, 75.31, 235.8, 116.3, 68.21, 9.925e3},
      {"HEM 120", 66.41, 2018, 702.8, 288.2, 111.6, 350.6, 171.6, 91.66, 24.79e3},
      {"HEM 140", 80.56, 3291, 1144, 411.4, 156.8, 493.8, 240.5, 120.0, 54.33e3},
      {"HEM 160", 97.05, 5098, 1759, 566.5, 211.9, 674.6, 325.5, 162.4, 108.1e3},
      {"HEM 180", 113.3, 7483, 2580, 748.3, 277.4, 883.4, 425.2, 203.3, 199.3e3},
      {"HEM 200", 131.3, 10640, 3651, 967.4, 354.5, 1135, 543.2, 259.4, 346.3e3},
      {"HEM 220", 149.4, 14600, 5012, 1217, 443.5, 1419, 678.6, 315.3, 572.7e3},
      {"HEM 240", 199.6, 24290, 8153, 1799, 657.5, 2117, 1006, 627.9, 1152e3},
      {"HEM 260", 219.6, 31310, 10450, 2159, 779.7, 2524, 1192, 719.0, 1728e3},
      {"HEM 280", 240.2, 39550, 13160, 2551, 914.1, 2966, 1397, 807.3, 2520e3},
      {"HEM 300", 303.1, 59200, 19400, 3482, 1252, 4078, 1913, 1408, 4386e3},
  };
  for (const Tabulated& t : hem) test::check_catalogue(t, cm, 0.005, 0.01);
}

TEST_CASE("W shapes match the AISC tabulated properties", "[analysis][section][catalogue]") {
  // AISC Steel Construction Manual Table 1-1 (from memory): A in2, Ix in4, Iy in4,
  // Sx in3, Sy in3, Zx in3, Zy in3, J in4, Cw in6. The sizes the AISC Shapes Database
  // v15.0 table covers are compared with it in test_section_tables.cpp.
  const Tabulated table[] = {
      {"W10X49", 14.4, 272, 93.4, 54.6, none, 60.4, none, 1.39, none},
      {"W14X22", 6.49, 199, 7.00, 29.0, none, 33.2, none, none, none},
      {"W16X31", 9.13, 375, 12.4, 47.2, none, 54.0, none, 0.461, 739},
      {"W24X76", 22.4, 2100, 82.5, 176, none, 200, none, none, none},
      {"W30X99", 29.1, 3990, 128, 269, none, 312, none, none, none},
  };
  for (const Tabulated& t : table) test::check_catalogue(t, inch, 0.015, 0.03);
}

TEST_CASE("catalogue holds the EN and ASTM series", "[analysis][catalogue]") {
  const std::vector<std::string> names = catalogue_designations();
  for (const char* n : {"IPE80", "IPE600", "IPEA300", "IPEO400", "HEA100", "HEA1000", "HEB100", "HEB1000", "HEM100",
                        "HEM1000", "UPE200", "UPN200", "L100X100X10", "L150X100X10", "CHS219.1X8", "SHS100X100X5",
                        "RHS200X100X6.3", "SHS100X100X5HF", "W4X13", "W12X26", "W16X31", "W44X230", "HSS6X6X3/8",
                        "HSS6.625X0.280", "C10X15.3", "L4X4X1/2"}) {
    INFO(n);
    CHECK(std::find(names.begin(), names.end(), n) != names.end());
  }
  for (const auto& e : catalogue_entries()) {
    const auto s = find_catalogue_section(e.designation);
    INFO(e.designation);
    REQUIRE(s.has_value());
    CHECK(s->designation == e.designation);
    CHECK(s->family == e.family);
    CHECK_FALSE(s->standard.empty());
    CHECK(s->A > 0);
    CHECK(s->Iy >= s->Iz * (1 - 1e-9));  // y is the major axis of every catalogue shape
    CHECK(s->Wpl_y >= s->Wy() * (1 - 1e-9));  // shape factor >= 1 (plastic theory)
    CHECK(s->t_max > 0);
    CHECK_FALSE(s->outline.empty());
    CHECK(s->stress_points.size() >= 4);
  }
}
