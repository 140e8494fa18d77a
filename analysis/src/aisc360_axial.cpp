// ANSI/AISC 360-16 chapter D (tension, yielding of the gross section) and
// chapter E (compression: E3 flexural buckling, E4 torsional and
// flexural-torsional buckling, E7 slender elements). Equations as recalled
// from the Specification (from memory).

#include "stepframe/analysis/aisc360.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <numbers>

namespace stepframe::analysis::aisc360 {
namespace {

constexpr double pi = std::numbers::pi;

bool is_open(SectionShape s) {
  return s == SectionShape::rolled_i || s == SectionShape::welded_i || s == SectionShape::channel ||
         s == SectionShape::tee || s == SectionShape::angle;
}

bool doubly_symmetric(const Section& s) {
  return !en1993::shear_centre_off_centroid(s) && s.shape != SectionShape::angle;
}

}  // namespace

Strength tension(const Section& s, double Fy) {
  Strength st;
  st.factors = tension_yielding;
  st.Rn = Fy * s.A;  // (D2-1) Pn = Fy Ag
  st.clause = "D2(a) (D2-1), tensile yielding on the gross section; tensile rupture on the net section (D2(b), "
              "Fu Ae) is not checked: the model has no net areas or shear lag factors";
  st.details = {{"Ag", s.A}, {"Fy", Fy}, {"Pn", st.Rn}};
  return st;
}

double critical_stress(double Fy, double Fe) {
  // (E3-2) Fcr = 0.658^(Fy/Fe) Fy when Fy/Fe <= 2.25 (Lc/r <= 4.71 sqrt(E/Fy)); (E3-3) Fcr = 0.877 Fe otherwise.
  return Fy / Fe <= 2.25 ? std::pow(0.658, Fy / Fe) * Fy : 0.877 * Fe;
}

Strength compression_strength(const Section& s, const Material& m, const EffectiveLengths& Lc) {
  const double E = m.E, G = m.G, Fy = m.fy, A = s.A;
  Strength st;
  st.factors = compression;  // E1: phi_c = 0.90, Omega_c = 1.67
  // E3: Fe = pi^2 E / (Lc / r)^2 (E3-4) about each axis.
  const double rx = s.iy(), ry = s.iz();
  const double slender_x = Lc.x / rx, slender_y = Lc.y / ry;
  const double Fe_x = pi * pi * E / (slender_x * slender_x), Fe_y = pi * pi * E / (slender_y * slender_y);
  double Fe = std::min(Fe_x, Fe_y);
  std::string mode = Fe_x <= Fe_y ? "flexural buckling about x (major)" : "flexural buckling about y (minor)";
  std::string section = "E3";
  st.details = {{"Lc_x", Lc.x}, {"Lc_y", Lc.y}, {"Lc_r_x", slender_x}, {"Lc_r_y", slender_y},
                {"Fe_x", Fe_x}, {"Fe_y", Fe_y}};
  // E4: singly symmetric and unsymmetric open sections always; doubly symmetric ones when the torsional
  // unbraced length exceeds the lateral one (E4 scope). The lowest root of (E4-3)/(E4-4) (E4-2 for doubly
  // symmetric sections) with Fez of (E4-9), as the critical force of the modes that twist the member.
  const bool torsion_applies =
      is_open(s.shape) && s.J > 0 && (!doubly_symmetric(s) || Lc.z > Lc.y * (1 + 1e-9));
  if (torsion_applies) {
    const double Fe_t = en1993::torsional_flexural_critical_force(s, E, G, Lc.x, Lc.y, Lc.z) / A;
    st.details.insert(st.details.end(), {{"Lc_z", Lc.z}, {"Fe_E4", Fe_t}});
    if (Fe_t < Fe) {
      Fe = Fe_t;
      section = "E4";
      mode = doubly_symmetric(s) ? "torsional buckling (E4-2)"
             : s.shape == SectionShape::angle || (std::abs(s.shear_centre_y) > 1e-9 && std::abs(s.shear_centre_z) > 1e-9)
                 ? "flexural-torsional buckling (E4-4)"
                 : "flexural-torsional buckling (E4-3)";
    }
  }
  const double Fcr = critical_stress(Fy, Fe);
  const char* curve = Fy / Fe <= 2.25 ? "E3-2" : "E3-3";
  st.details.insert(st.details.end(), {{"Fe", Fe}, {"Fcr", Fcr}});

  // E7: effective area of slender elements. An element is fully effective while
  // lambda <= lambda_r sqrt(Fy / Fcr) (E7-2); else be = b (1 - c1 sqrt(Fel/Fcr)) sqrt(Fel/Fcr) (E7-3),
  // Fel = (c2 lambda_r / lambda)^2 Fy (E7-5), c1 and c2 of Table E7.1.
  const auto els = elements(s, E, Fy);
  double Ae = A;
  bool slender = false;
  for (const Element& e : els) {
    if (e.ratio <= e.lambda_r_a) continue;
    slender = true;
    if (s.shape == SectionShape::chs) {
      // E7.2(b): round HSS, Ae = [0.038 E / (Fy D/t) + 2/3] Ag (E7-7) for D/t < 0.45 E/Fy.
      if (e.ratio >= 0.45 * E / Fy) {
        st.covered = false;
        st.clause = fmt::format("E7.2: round HSS with D/t = {:.1f} beyond 0.45 E/Fy = {:.1f}: outside this screening",
                                e.ratio, 0.45 * E / Fy);
        st.details.insert(st.details.end(), {{"D_t", e.ratio}, {"limit", 0.45 * E / Fy}});
        return st;
      }
      Ae = (0.038 * E / (Fy * e.ratio) + 2.0 / 3.0) * A;
      continue;
    }
    if (e.ratio <= e.lambda_r_a * std::sqrt(Fy / Fcr)) continue;
    const bool hss_wall = s.shape == SectionShape::rhs;
    const double c1 = hss_wall ? 0.20 : e.stiffened ? 0.18 : 0.22;  // Table E7.1 (b), (a), (c)
    const double c2 = hss_wall ? 1.38 : e.stiffened ? 1.31 : 1.49;
    const double Fel = std::pow(c2 * e.lambda_r_a / e.ratio, 2) * Fy;  // (E7-5)
    const double root = std::sqrt(Fel / Fcr);
    const double be = e.width * (1 - c1 * root) * root;  // (E7-3)
    Ae -= e.count * (e.width - be) * e.t;
    st.details.push_back({"be_" + e.name, be});
  }
  if (slender) {
    st.Rn = Fcr * Ae;  // (E7-1) Pn = Fcr Ae
    st.details.insert(st.details.end(), {{"Ae", Ae}, {"Pn", st.Rn}});
    st.clause = fmt::format("{} {} ({}) with E7 slender elements (E7-1), effective area Ae = {:.4g} of Ag = {:.4g} m2",
                            section, mode, curve, Ae, A);
  } else {
    st.Rn = Fcr * A;  // (E3-1) Pn = Fcr Ag
    st.details.push_back({"Pn", st.Rn});
    st.clause = fmt::format("{} {} ({}, {}-1), nonslender elements (Table B4.1a)", section, mode, curve, section);
  }
  if (els.empty()) st.clause += "; section given by properties: elements taken as nonslender";
  return st;
}

}  // namespace stepframe::analysis::aisc360
