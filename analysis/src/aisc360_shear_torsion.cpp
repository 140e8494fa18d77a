// ANSI/AISC 360-16 chapter G (shear: G2, G3, G4, G5, G6) and H3.1 (torsional
// strength of HSS). Equations as recalled from the Specification (from memory).

#include "stepframe/analysis/aisc360.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <numbers>

namespace stepframe::analysis::aisc360 {
namespace {

constexpr double pi = std::numbers::pi;

/// Vn = 0.6 Fy Aw Cv2 of an element of ratio h/t with buckling coefficient kv (G3-1, G4-1, G6-1).
Strength plate_shear(const std::string& clause, double Aw, double h_t, double kv, const Material& m) {
  Strength st;
  st.factors = shear;  // G1(a): phi_v = 0.90, Omega_v = 1.67
  const double Cv2 = shear_buckling_coefficient(h_t, kv, m.E, m.fy);
  st.Rn = 0.6 * m.fy * Aw * Cv2;
  st.clause = clause;
  st.details = {{"Aw", Aw}, {"h_t", h_t}, {"kv", kv}, {"Cv2", Cv2}, {"Vn", st.Rn}};
  return st;
}

/// G5 round HSS: Vn = Fcr Ag / 2 (G5-1), Fcr = max(1.60 E / (sqrt(Lv/D) (D/t)^(5/4)), 0.78 E / (D/t)^(3/2))
/// <= 0.6 Fy (G5-2a, G5-2b).
Strength round_shear(const Section& s, const Material& m, const Element& wall, double Lv) {
  Strength st;
  st.factors = shear;
  const double D = wall.width, Dt = wall.ratio, E = m.E;
  const double Fcr = std::min(std::max(1.60 * E / (std::sqrt(Lv / D) * std::pow(Dt, 1.25)), 0.78 * E / std::pow(Dt, 1.5)),
                              0.6 * m.fy);
  st.Rn = Fcr * s.A / 2;
  st.clause = "G5 round HSS (G5-1), Lv taken as the member length (conservative)";
  st.details = {{"Lv", Lv}, {"D_t", Dt}, {"Fcr", Fcr}, {"Vn", st.Rn}};
  return st;
}

Strength not_covered(const char* what) {
  Strength st;
  st.covered = false;
  st.factors = shear;
  st.clause = what;
  return st;
}

}  // namespace

double shear_buckling_coefficient(double h_t, double kv, double E, double Fy) {
  const double root = std::sqrt(kv * E / Fy);
  if (h_t <= 1.10 * root) return 1.0;                         // (G2-9)
  if (h_t <= 1.37 * root) return 1.10 * root / h_t;           // (G2-10)
  return 1.51 * kv * E / (h_t * h_t * Fy);                    // (G2-11)
}

Strength major_shear(const Section& s, const Material& m, double Lv) {
  const double E = m.E, Fy = m.fy;
  const auto els = elements(s, E, Fy);
  switch (s.shape) {
    case SectionShape::rolled_i:
    case SectionShape::welded_i:
    case SectionShape::channel: {
      const Element* web = find_element(els, "web");
      if (!web) break;
      Strength st;
      const double h_tw = web->ratio, Aw = s.depth * web->t;  // G2.1: Aw = d tw
      double Cv1 = 1.0;
      std::string clause;
      if (s.shape == SectionShape::rolled_i && h_tw <= 2.24 * std::sqrt(E / Fy)) {
        st.factors = shear_rolled_web;  // G2.1(a): phi_v = 1.00, Omega_v = 1.50, Cv1 = 1.0 (G2-2)
        clause = "G2.1(a) (G2-1), rolled I web h/tw <= 2.24 sqrt(E/Fy): Cv1 = 1.0 (G2-2), phi_v = 1.00, Omega_v = 1.50";
      } else {
        st.factors = shear;
        const double kv = 5.34;  // G2.1(b)(2): webs without transverse stiffeners
        const double limit = 1.10 * std::sqrt(kv * E / Fy);
        Cv1 = h_tw <= limit ? 1.0 : limit / h_tw;  // (G2-3), (G2-4)
        clause = fmt::format("G2.1(b) (G2-1), kv = 5.34, Cv1 = {:.3f} ({})", Cv1, h_tw <= limit ? "G2-3" : "G2-4");
      }
      st.Rn = 0.6 * Fy * Aw * Cv1;  // (G2-1)
      st.clause = clause;
      st.details = {{"Aw", Aw}, {"h_tw", h_tw}, {"Cv1", Cv1}, {"Vn", st.Rn}};
      return st;
    }
    case SectionShape::tee: {
      const Element* stem = find_element(els, "stem");
      if (!stem) break;
      // G3: tee stem, b = d, kv = 1.2 (G3-1).
      return plate_shear("G3 tee stem (G3-1), kv = 1.2", s.depth * stem->t, stem->ratio, 1.2, m);
    }
    case SectionShape::angle: {
      // G3: single angle legs, kv = 1.2 (G3-1); the shorter leg alone taken to carry the shear (conservative
      // for shear along the principal axes, which both legs share).
      const Element* leg = nullptr;
      for (const auto& e : els)
        if (!leg || e.width < leg->width) leg = &e;
      if (!leg) break;
      return plate_shear("G3 single angle (G3-1), kv = 1.2, shorter leg b t", leg->width * leg->t, leg->ratio, 1.2, m);
    }
    case SectionShape::rhs: {
      const Element* web = find_element(els, "web");
      if (!web) break;
      // G4: Aw = 2 h t with h = H - 3t, kv = 5 (G4-1).
      return plate_shear("G4 rectangular HSS (G4-1), Aw = 2 h t, kv = 5", 2 * web->width * web->t, web->ratio, 5.0, m);
    }
    case SectionShape::chs:
      if (const Element* wall = find_element(els, "wall")) return round_shear(s, m, *wall, Lv);
      break;
    default: break;
  }
  return not_covered("shear: section without Table B4.1 elements, not checked");
}

Strength minor_shear(const Section& s, const Material& m, double Lv) {
  const double E = m.E, Fy = m.fy;
  const auto els = elements(s, E, Fy);
  switch (s.shape) {
    case SectionShape::rolled_i:
    case SectionShape::welded_i:
    case SectionShape::channel:
    case SectionShape::tee: {
      const Element* flange = find_element(els, "flange");
      if (!flange) break;
      // G6 (G6-1): 0.6 Fy bf tf Cv2 per flange, h/t = b/t of Table B4.1 (bf/2tf for I and tees, bf/tf for
      // channels), kv = 1.2; the flanges' sum. A tee has one flange.
      const double bf = s.shape == SectionShape::channel ? flange->width : 2 * flange->width;
      const double flanges = s.shape == SectionShape::tee ? 1.0 : 2.0;
      return plate_shear("G6 weak-axis shear (G6-1), kv = 1.2", flanges * bf * flange->t, flange->ratio, 1.2, m);
    }
    case SectionShape::rhs: {
      const Element* flange = find_element(els, "flange");
      if (!flange) break;
      return plate_shear("G4 rectangular HSS (G4-1), Aw = 2 b t, kv = 5", 2 * flange->width * flange->t, flange->ratio,
                         5.0, m);
    }
    case SectionShape::chs:
    case SectionShape::angle: return major_shear(s, m, Lv);
    default: break;
  }
  return not_covered("shear: section without Table B4.1 elements, not checked");
}

Strength torsional_strength(const Section& s, const Material& m, double L) {
  const double E = m.E, Fy = m.fy;
  const auto els = elements(s, E, Fy);
  Strength st;
  st.factors = torsion;  // H3.1: phi_T = 0.90, Omega_T = 1.67
  if (s.shape == SectionShape::chs && !els.empty()) {
    const double D = els[0].width, t = els[0].t, Dt = els[0].ratio;
    // (H3-2a), (H3-2b), Fcr <= 0.6 Fy; C = pi (D - t)^2 t / 2 (H3.1 user note).
    const double Fcr = std::min(std::max(1.23 * E / (std::sqrt(L / D) * std::pow(Dt, 1.25)), 0.60 * E / std::pow(Dt, 1.5)),
                                0.6 * Fy);
    const double C = pi * (D - t) * (D - t) * t / 2;
    st.Rn = Fcr * C;  // (H3-1)
    st.clause = "H3.1 round HSS (H3-1, H3-2a/b)";
    st.details = {{"C", C}, {"Fcr", Fcr}, {"Tn", st.Rn}};
    return st;
  }
  if (s.shape == SectionShape::rhs && els.size() == 2) {
    const double t = els[0].t, B = s.width, H = s.depth;
    const double h_t = std::max(els[0].ratio, els[1].ratio);  // the longer wall's flat width
    const double root = std::sqrt(E / Fy);
    double Fcr = 0;
    std::string eq;
    if (h_t <= 2.45 * root) Fcr = 0.6 * Fy, eq = "H3-3";
    else if (h_t <= 3.07 * root) Fcr = 0.6 * Fy * 2.45 * root / h_t, eq = "H3-4";
    else Fcr = 0.458 * pi * pi * E / (h_t * h_t), eq = "H3-5";
    // C = 2 (B - t)(H - t) t - 4.5 (4 - pi) t^3 (H3.1 user note).
    const double C = 2 * (B - t) * (H - t) * t - 4.5 * (4 - pi) * t * t * t;
    st.Rn = Fcr * C;  // (H3-1)
    st.clause = fmt::format("H3.1 rectangular HSS (H3-1, {})", eq);
    st.details = {{"C", C}, {"h_t", h_t}, {"Fcr", Fcr}, {"Tn", st.Rn}};
    return st;
  }
  st.covered = false;
  st.clause = "H3.1 covers HSS only";
  return st;
}

double interaction(double p, double mx, double my) {
  // (H1-1a) for Pr/Pc >= 0.2: Pr/Pc + 8/9 (Mrx/Mcx + Mry/Mcy); (H1-1b) otherwise: Pr/(2 Pc) + (Mrx/Mcx + Mry/Mcy).
  return p >= 0.2 ? p + 8.0 / 9.0 * (mx + my) : 0.5 * p + mx + my;
}

}  // namespace stepframe::analysis::aisc360
