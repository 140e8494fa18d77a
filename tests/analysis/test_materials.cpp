// Standard steels. References:
//  - EN 10025-2:2004 Table 7: minimum yield strength by nominal thickness
//    (<= 16, 40, 63, 80, 100, 150, 200, 250 mm) and tensile strength (from memory);
//  - EN 10210-1 / EN 10219-1 hollow-section grades (from memory);
//  - E = 210 000 N/mm^2, G ~ 81 000 N/mm^2, nu = 0.3, alpha = 12e-6/K: EN 1993-1-1 3.2.6(1);
//  - ASTM A992 Fy 50 / Fu 65 ksi; A36 36 / 58 ksi; A572 Gr. 50 50 / 65 ksi; A500 Gr. B and C
//    (AISC Manual Table 2-4, from memory);
//  - E = 29 000 ksi and G = 11 200 ksi for ASTM steels: AISC 360 (from memory of its nomenclature);
//  - density 7850 kg/m^3: common practice.

#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;

namespace {
constexpr double ksi = 6.894757e6;  // Pa, 1000 lbf/in^2 (exact definition of the pound-force and inch)
}

TEST_CASE("EN 10025-2 steels", "[analysis][material]") {
  for (const auto& [name, fy, fu] : {std::tuple{"S235", 235e6, 360e6}, std::tuple{"S275", 275e6, 410e6},
                                     std::tuple{"S355", 355e6, 470e6}, std::tuple{"S460", 460e6, 540e6}}) {
    const auto m = find_standard_material(name);
    INFO(name);
    REQUIRE(m);
    CHECK(m->name == name);
    CHECK(m->fy == Approx(fy).epsilon(1e-12));
    CHECK(m->fu == Approx(fu).epsilon(1e-12));
    CHECK(m->E == Approx(210e9).epsilon(1e-12));
    CHECK(m->G == Approx(81e9).epsilon(1e-12));
    CHECK(m->nu == Approx(0.3));
    CHECK(m->thermal_expansion == Approx(12e-6));
    CHECK(m->density == Approx(7850).epsilon(1e-12));
  }
}

TEST_CASE("yield strength falls with thickness as EN 10025-2 Table 7 sets", "[analysis][material]") {
  const auto s355 = find_standard_material("S355");
  REQUIRE(s355);
  // EN 10025-2 Table 7, S355: 355 (t <= 16), 345 (16 < t <= 40), 335 (<= 63), 325 (<= 80),
  // 315 (<= 100), 295 (<= 150) MPa; Rm lower limit 470 MPa up to 100 mm, 450 above (from memory).
  for (const auto& [t, fy, fu] : {std::tuple{0.010, 355e6, 470e6}, std::tuple{0.016, 355e6, 470e6},
                                  std::tuple{0.0165, 345e6, 470e6}, std::tuple{0.040, 345e6, 470e6},
                                  std::tuple{0.050, 335e6, 470e6}, std::tuple{0.070, 325e6, 470e6},
                                  std::tuple{0.090, 315e6, 470e6}, std::tuple{0.120, 295e6, 450e6}}) {
    const Material m = material_for_thickness(*s355, t);
    INFO("t = " << t);
    CHECK(m.fy == Approx(fy));
    CHECK(m.fu == Approx(fu));
  }
  // S235 over 16 mm: 225 MPa; S275 over 40 mm: 255 MPa (same table).
  CHECK(material_for_thickness(*find_standard_material("S235"), 0.020).fy == Approx(225e6));
  CHECK(material_for_thickness(*find_standard_material("S275"), 0.045).fy == Approx(255e6));
  // A custom material has no table: unchanged.
  Material custom{"MINE", 200e9, 80e9, 300e6, 7800};
  CHECK(material_for_thickness(custom, 0.1).fy == 300e6);
}

TEST_CASE("the check uses fy of the section's thickest plate", "[analysis][material]") {
  const auto s355 = find_standard_material("S355");
  REQUIRE(s355);
  // HE 300 B: tf = 19 mm > 16 mm -> 345 MPa; IPE 300: tf = 10.7 mm -> 355 MPa;
  // HE 300 M: tf = 39 mm -> 345 MPa; HE 1000 M tf = 40 mm -> 345 MPa (EN 10025-2 Table 7).
  CHECK(material_for_section(*s355, *find_catalogue_section("HEB300")).fy == Approx(345e6));
  CHECK(material_for_section(*s355, *find_catalogue_section("IPE300")).fy == Approx(355e6));
  CHECK(material_for_section(*s355, *find_catalogue_section("HEM300")).fy == Approx(345e6));
  // ASTM A500 Gr. B: rectangular HSS 46 ksi, round 42 ksi (AISC Manual Table 2-4, from memory).
  const auto a500 = find_standard_material("A500 Gr. B");
  REQUIRE(a500);
  CHECK(material_for_section(*a500, *find_catalogue_section("HSS6X6X3/8")).fy == Approx(46 * ksi).epsilon(1e-6));
  CHECK(material_for_section(*a500, *find_catalogue_section("HSS6.625X0.280")).fy == Approx(42 * ksi).epsilon(1e-6));
}

TEST_CASE("hollow-section grades", "[analysis][material]") {
  for (const char* name : {"S355H", "S355J2H", "s355 j2h"}) {
    const auto m = find_standard_material(name);
    INFO(name);
    REQUIRE(m);
    CHECK(m->name == "S355H");
    CHECK(m->fy == Approx(355e6));
  }
  const auto s460 = find_standard_material("S460NH");
  REQUIRE(s460);
  CHECK(s460->name == "S460H");
  CHECK(material_for_thickness(*s460, 0.020).fy == Approx(440e6));
}

TEST_CASE("ASTM steels", "[analysis][material]") {
  const auto a992 = find_standard_material("A992");
  REQUIRE(a992);
  CHECK(a992->fy == Approx(50 * ksi).epsilon(0.002));
  CHECK(a992->fu == Approx(65 * ksi).epsilon(0.002));
  CHECK(a992->E == Approx(29000 * ksi).epsilon(0.002));
  CHECK(a992->G == Approx(11200 * ksi).epsilon(0.002));
  const auto a36 = find_standard_material("A36");
  REQUIRE(a36);
  CHECK(a36->fy == Approx(36 * ksi).epsilon(0.01));  // 250 MPa is the rounded metric value
  CHECK(a36->fu == Approx(58 * ksi).epsilon(0.01));
  CHECK(a36->density == Approx(7850).epsilon(1e-12));
  for (const char* name : {"A572 Gr. 50", "A572-50", "A572 GR 50", "a572gr50"}) {
    const auto m = find_standard_material(name);
    INFO(name);
    REQUIRE(m);
    CHECK(m->name == "A572GR50");
    CHECK(m->fy == Approx(50 * ksi).epsilon(1e-6));
  }
  const auto a500c = find_standard_material("A500C");
  REQUIRE(a500c);
  CHECK(a500c->fy == Approx(50 * ksi).epsilon(1e-6));
}

TEST_CASE("material names are case-insensitive; unknown names give nothing", "[analysis][material]") {
  REQUIRE(find_standard_material("s355"));
  CHECK(find_standard_material("s355")->fy == Approx(355e6));
  CHECK(find_standard_material("S355J2")->name == "S355");
  CHECK(find_standard_material("S275JR")->name == "S275");
  REQUIRE(find_standard_material("a36"));
  CHECK(find_standard_material(" a992 ")->name == "A992");
  CHECK_FALSE(find_standard_material("S420"));
  CHECK_FALSE(find_standard_material("S355X"));
  CHECK_FALSE(find_standard_material("steel"));
  CHECK_FALSE(find_standard_material(""));
  CHECK(standard_material_names().size() == 14);
}
