#pragma once
// Comparing computed section properties with a standard's tabulated values.

#include "stepframe/analysis/section.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <string>

namespace stepframe::analysis::test {

inline constexpr double none = std::numeric_limits<double>::quiet_NaN();

/// One table row: properties in the table's units (cm or in); `none` where the
/// table gives no value. Iy and Iz are about the section's principal axes.
struct Tabulated {
  const char* designation;
  double A = none, Iy = none, Iz = none, Wel_y = none, Wel_z = none, Wpl_y = none, Wpl_z = none, It = none,
         Iw = none;
};

/// Length of the table's unit in metres: cm for the EN tables, inch for the ASTM/AISC ones.
inline constexpr double cm = 1e-2;
inline constexpr double inch = 0.0254;

/// Checks every given value within the relative tolerance `tol` (`tol_torsion` for It and Iw).
inline void check_against(const Section& s, const Tabulated& t, double unit, double tol, double tol_torsion) {
  INFO(t.designation << " (computed as " << s.designation << ")");
  const auto check = [&](const char* what, double computed, double tabulated, int power, double tolerance) {
    if (tabulated != tabulated) return;  // not tabulated
    INFO(what);
    CHECK(computed == Approx(tabulated * std::pow(unit, power)).epsilon(tolerance));
  };
  check("A", s.A, t.A, 2, tol);
  check("Iy", s.Iy, t.Iy, 4, tol);
  check("Iz", s.Iz, t.Iz, 4, tol);
  check("Wel_y", s.Wy(), t.Wel_y, 3, tol);
  check("Wel_z", s.Wz(), t.Wel_z, 3, tol);
  check("Wpl_y", s.Wpl_y, t.Wpl_y, 3, tol);
  check("Wpl_z", s.Wpl_z, t.Wpl_z, 3, tol);
  check("It", s.J, t.It, 4, tol_torsion);
  check("Iw", s.Iw, t.Iw, 6, tol_torsion);
}

/// Looks the row's designation up and checks it; fails when it is unknown.
inline void check_catalogue(const Tabulated& t, double unit, double tol, double tol_torsion) {
  const auto s = find_catalogue_section(t.designation);
  INFO(t.designation);
  REQUIRE(s.has_value());
  check_against(*s, t, unit, tol, tol_torsion);
}

}  // namespace stepframe::analysis::test
