// Torsion of open and closed sections.
// Sources:
//  - twist of a shaft under end torque, phi = T L / (G J) (St Venant torsion; common practice);
//  - thin-walled open sections: tau_max = T t_max / J (Roark's Formulas, 7th ed.,
//    Table 10.7, thin-walled open sections; from memory for the table number);
//  - circular tubes: tau = T r / J at the outer surface (Timoshenko & Goodier,
//    Theory of Elasticity, torsion of circular shafts);
//  - rectangular hollow sections: Bredt's formula tau = T / (2 A_m t) (Roark Table 10.7, thin-walled closed sections).

#include "verification_models.hpp"

#include "stepframe/analysis/element_recovery.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>

using namespace stepframe::analysis;
using namespace stepframe::analysis::verification;
using V = Eigen::Vector3d;

namespace {

Vector6d torque(double T) {
  Vector6d f = Vector6d::Zero();
  f(3) = T;
  return f;
}

}  // namespace

TEST_CASE("open I section: twist T L / (G J) and shear T t_max / J", "[verification][torsion]") {
  const auto section = find_catalogue_section("IPE300");
  REQUIRE(section.has_value());
  REQUIRE(section->t_max > 0);
  const double L = 3.0, T = 1.5e3;
  FrameModel m = beam_along_x({0, L}, *section);
  m.supports = {support(0, fixed)};
  LoadCase lc;
  lc.name = "T";
  lc.node_loads = {NodeLoad{1, V::Zero(), V(T, 0, 0)}};
  m.cases = {lc};
  const auto r = solve_one(m);
  CHECK(r.displacements(6 + rx) == Approx(T * L / (G * section->J)).epsilon(1e-9));
  // The twist grows linearly along the shaft: phi(x) = T x / (G J) at every station.
  for (const Station& st : r.elements[0].stations) {
    CHECK(st.rotation.x() == Approx(T * st.x / (G * section->J)).margin(1e-12));
    CHECK(st.rotation.tail<2>().norm() == Approx(0).margin(1e-12));
  }
  CHECK(r.elements[0].stations[5].max_shear_stress == Approx(T * section->t_max / section->J).epsilon(1e-9));
  // von Mises of pure shear: sqrt(3) tau (EN 1993-1-1 6.2.1(5)).
  CHECK(r.elements[0].stations[5].von_mises == Approx(std::sqrt(3.0) * T * section->t_max / section->J).epsilon(1e-9));
}

TEST_CASE("circular tube: tau = T r / J at the outer surface", "[verification][torsion]") {
  const auto section = find_catalogue_section("CHS 219.1x8");
  REQUIRE(section.has_value());
  REQUIRE(section->shape == SectionShape::chs);
  const double T = 20e3;
  const double D = 0.2191, d = D - 2 * 0.008;
  const double J = std::numbers::pi / 32 * (D * D * D * D - d * d * d * d);  // polar moment of the tube
  CHECK(section->J == Approx(J).epsilon(1e-3));
  CHECK(section_stress(*section, torque(T)).shear == Approx(T * (D / 2) / J).epsilon(1e-3));
}

TEST_CASE("rectangular hollow section: Bredt's formula T / (2 A_m t)", "[verification][torsion]") {
  const auto section = find_catalogue_section("SHS 100x100x5");
  REQUIRE(section.has_value());
  REQUIRE(section->shape == SectionShape::rhs);
  const double T = 4e3, t = 0.005, am = (0.1 - t) * (0.1 - t);
  CHECK(section_stress(*section, torque(T)).shear == Approx(T / (2 * am * t)).epsilon(1e-9));
  // The closed tube is far stiffer in torsion than an open section of similar area (common practice).
  const auto open = find_catalogue_section("IPE160");
  REQUIRE(open.has_value());
  CHECK(section->J > 10 * open->J);
}
