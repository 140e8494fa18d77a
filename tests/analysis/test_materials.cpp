// Standard steels. References:
//  - fy for t <= 16 mm: EN 10025-2:2004 Table 7 (S235 235 MPa, S275 275 MPa, S355 355 MPa);
//  - E = 210 000 N/mm^2 and G ~ 81 000 N/mm^2: EN 1993-1-1 3.2.6(1);
//  - ASTM A992 Fy = 50 ksi [345 MPa]; ASTM A36 Fy = 36 ksi [250 MPa];
//  - E = 29 000 ksi and G = 11 200 ksi for ASTM steels: AISC 360 (from memory of its nomenclature);
//  - density 7850 kg/m^3: common practice.

#include "stepframe/analysis/material.hpp"

#include <catch2/catch.hpp>

using stepframe::analysis::find_standard_material;

TEST_CASE("EN 10025-2 steels", "[analysis][material]") {
  for (const auto& [name, fy] : {std::pair{"S235", 235e6}, std::pair{"S275", 275e6}, std::pair{"S355", 355e6}}) {
    const auto m = find_standard_material(name);
    INFO(name);
    REQUIRE(m);
    CHECK(m->name == name);
    CHECK(m->fy == Approx(fy).epsilon(1e-12));
    CHECK(m->E == Approx(210e9).epsilon(1e-12));
    CHECK(m->G == Approx(81e9).epsilon(1e-12));
    CHECK(m->density == Approx(7850).epsilon(1e-12));
  }
}

TEST_CASE("ASTM steels", "[analysis][material]") {
  constexpr double ksi = 6.894757e6;  // Pa, 1000 lbf/in^2 (exact definition of the pound-force and inch)
  const auto a992 = find_standard_material("A992");
  REQUIRE(a992);
  CHECK(a992->fy == Approx(50 * ksi).epsilon(0.002));
  CHECK(a992->E == Approx(29000 * ksi).epsilon(0.002));
  CHECK(a992->G == Approx(11200 * ksi).epsilon(0.002));
  const auto a36 = find_standard_material("A36");
  REQUIRE(a36);
  CHECK(a36->fy == Approx(36 * ksi).epsilon(0.01));  // 250 MPa is the rounded metric value
  CHECK(a36->density == Approx(7850).epsilon(1e-12));
}

TEST_CASE("material names are case-insensitive; unknown names give nothing", "[analysis][material]") {
  REQUIRE(find_standard_material("s355"));
  CHECK(find_standard_material("s355")->fy == Approx(355e6));
  CHECK(find_standard_material("S355J2")->name == "S355");
  REQUIRE(find_standard_material("a36"));
  CHECK(find_standard_material(" a992 ")->name == "A992");
  CHECK_FALSE(find_standard_material("S420"));
  CHECK_FALSE(find_standard_material("steel"));
  CHECK_FALSE(find_standard_material(""));
}
