// EN 1993-1-1 (2005) buckling curves, reduction factors and critical moments.

#include "stepframe/analysis/en1993.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace stepframe::analysis::en1993 {

const char* curve_name(Curve curve) {
  switch (curve) {
    case Curve::a0: return "a0";
    case Curve::a: return "a";
    case Curve::b: return "b";
    case Curve::c: return "c";
    case Curve::d: return "d";
  }
  return "d";
}

double imperfection_factor(Curve curve) {
  // EN 1993-1-1 Table 6.1 (and Table 6.3 for lateral-torsional buckling).
  switch (curve) {
    case Curve::a0: return 0.13;
    case Curve::a: return 0.21;
    case Curve::b: return 0.34;
    case Curve::c: return 0.49;
    case Curve::d: return 0.76;
  }
  return 0.76;
}

double reduction_factor(double slenderness, Curve curve) {
  // EN 1993-1-1 6.3.1.2 (6.49): Phi = 0.5 [1 + alpha (lambda - 0.2) + lambda^2].
  const double lambda = std::max(slenderness, 0.0);
  const double phi = 0.5 * (1.0 + imperfection_factor(curve) * (lambda - 0.2) + lambda * lambda);
  const double chi = 1.0 / (phi + std::sqrt(phi * phi - lambda * lambda));
  return std::min(chi, 1.0);
}

FlexuralCurves flexural_curves(const Section& s, double fy) {
  // EN 1993-1-1 Table 6.2; the second column applies to S460.
  const bool s460 = fy >= 440e6;
  const double tf_limit_40 = 0.040, tf_limit_100 = 0.100;
  const double tf = s.t_max;
  switch (s.shape) {
    case SectionShape::rolled_i: {
      const bool slender = s.depth / s.width > 1.2;
      if (slender && tf <= tf_limit_40) return s460 ? FlexuralCurves{Curve::a0, Curve::a0} : FlexuralCurves{Curve::a, Curve::b};
      if (slender || tf <= tf_limit_100) return s460 ? FlexuralCurves{Curve::a, Curve::a} : FlexuralCurves{Curve::b, Curve::c};
      return s460 ? FlexuralCurves{Curve::c, Curve::c} : FlexuralCurves{Curve::d, Curve::d};
    }
    case SectionShape::welded_i:
      return tf <= tf_limit_40 ? FlexuralCurves{Curve::b, Curve::c} : FlexuralCurves{Curve::c, Curve::d};
    case SectionShape::rhs:
    case SectionShape::chs: {
      // Hot finished: a (a0 for S460); cold formed (EN 10219, ASTM A500): c.
      const bool cold = s.standard.find("10219") != std::string::npos || s.standard.find("A500") != std::string::npos;
      if (cold) return {Curve::c, Curve::c};
      return s460 ? FlexuralCurves{Curve::a0, Curve::a0} : FlexuralCurves{Curve::a, Curve::a};
    }
    case SectionShape::angle: return {Curve::b, Curve::b};
    default: return {Curve::c, Curve::c};  // U, T and solid sections; custom sections conservatively
  }
}

Curve lateral_torsional_curve(const Section& s) {
  // EN 1993-1-1 Table 6.4 (general case, 6.3.2.2).
  const double h_over_b = s.depth / s.width;
  switch (s.shape) {
    case SectionShape::rolled_i: return h_over_b <= 2.0 ? Curve::a : Curve::b;
    case SectionShape::welded_i: return h_over_b <= 2.0 ? Curve::c : Curve::d;
    default: return Curve::d;
  }
}

double critical_moment(double E, double G, double Iz, double Iw, double It, double L, double C1, double C2,
                       double zg) {
  const double pi2 = std::numbers::pi * std::numbers::pi;
  // Mcr = C1 pi^2 E Iz / L^2 [sqrt(Iw/Iz + L^2 G It/(pi^2 E Iz) + (C2 zg)^2) - C2 zg], k = kw = 1.
  const double c2zg = C2 * zg;
  return C1 * pi2 * E * Iz / (L * L) * (std::sqrt(Iw / Iz + L * L * G * It / (pi2 * E * Iz) + c2zg * c2zg) - c2zg);
}

double c1_linear(double psi) {
  // Common approximation for end moments M and psi M (from memory).
  return std::min(1.88 - 1.40 * psi + 0.52 * psi * psi, 2.70);
}

double cm_linear(double psi) {
  // EN 1993-1-1 Annex B Table B.3, linear moment diagram.
  return std::max(0.6 + 0.4 * psi, 0.4);
}

}  // namespace stepframe::analysis::en1993
