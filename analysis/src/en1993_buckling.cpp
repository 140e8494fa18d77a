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

const char* method_name(LateralTorsionalMethod method) {
  return method == LateralTorsionalMethod::rolled ? "6.3.2.3 (rolled or equivalent welded)" : "6.3.2.2 (general case)";
}

std::optional<Curve> lateral_torsional_curve_rolled(const Section& s) {
  // EN 1993-1-1 Table 6.5 (6.3.2.3): rolled I h/b <= 2 b, > 2 c; welded I h/b <= 2 c, > 2 d.
  const double h_over_b = s.depth / s.width;
  switch (s.shape) {
    case SectionShape::rolled_i: return h_over_b <= 2.0 ? Curve::b : Curve::c;
    case SectionShape::welded_i: return h_over_b <= 2.0 ? Curve::c : Curve::d;
    default: return std::nullopt;
  }
}

double reduction_factor_rolled(double slenderness, Curve curve, double lambda_0, double beta) {
  const double lambda = std::max(slenderness, 0.0);
  if (lambda <= lambda_0) return 1.0;  // 6.3.2.2(4), with lambda_LT,0 of 6.3.2.3
  // EN 1993-1-1 6.3.2.3 (6.57): Phi_LT = 0.5 [1 + alpha_LT (lambda - lambda_0) + beta lambda^2].
  const double phi = 0.5 * (1.0 + imperfection_factor(curve) * (lambda - lambda_0) + beta * lambda * lambda);
  const double chi = 1.0 / (phi + std::sqrt(phi * phi - beta * lambda * lambda));
  return std::min({chi, 1.0, 1.0 / (lambda * lambda)});
}

double correction_factor_kc(bool linear, double psi, double C1) {
  // EN 1993-1-1 Table 6.6 for linear diagrams; kc = 1 / sqrt(C1) otherwise (from memory).
  const double kc = linear ? 1.0 / (1.33 - 0.33 * std::clamp(psi, -1.0, 1.0)) : 1.0 / std::sqrt(std::max(C1, 1.0));
  return std::min(kc, 1.0);
}

double modification_factor_f(double kc, double slenderness) {
  // EN 1993-1-1 6.3.2.3(2) (6.58): f = 1 - 0.5 (1 - kc) [1 - 2.0 (lambda_LT - 0.8)^2], f <= 1.
  const double d = slenderness - 0.8;
  return std::min(1.0 - 0.5 * (1.0 - kc) * (1.0 - 2.0 * d * d), 1.0);
}

double critical_moment(double E, double G, double Iz, double Iw, double It, double L, double C1, double C2,
                       double zg) {
  const double pi2 = std::numbers::pi * std::numbers::pi;
  // Mcr = C1 pi^2 E Iz / L^2 [sqrt(Iw/Iz + L^2 G It/(pi^2 E Iz) + (C2 zg)^2) - C2 zg], k = kw = 1.
  const double c2zg = C2 * zg;
  return C1 * pi2 * E * Iz / (L * L) * (std::sqrt(Iw / Iz + L * L * G * It / (pi2 * E * Iz) + c2zg * c2zg) - c2zg);
}

double cm_linear(double psi) {
  // EN 1993-1-1 Annex B Table B.3, linear moment diagram.
  return std::max(0.6 + 0.4 * psi, 0.4);
}

double cm_span(double Mh, double psi, double Ms) {
  // EN 1993-1-1 Annex B Table B.3, uniform-load column (from memory); every value at least 0.4.
  if (std::abs(Ms) <= std::abs(Mh)) {
    if (Mh == 0) return 1.0;  // no moment at all
    const double alpha_s = Ms / Mh;
    if (alpha_s >= 0) return std::max(0.2 + 0.8 * alpha_s, 0.4);
    if (psi >= 0) return std::max(0.1 - 0.8 * alpha_s, 0.4);
    return std::max(0.1 * (1 - psi) - 0.8 * alpha_s, 0.4);
  }
  const double alpha_h = Mh / Ms;
  if (alpha_h >= 0 || psi >= 0) return 0.95 + 0.05 * alpha_h;
  return 0.95 + 0.05 * alpha_h * (1 + 2 * psi);
}

namespace {

/// i0^2 = iy^2 + iz^2 + y0^2 + z0^2: polar radius of gyration about the shear centre (EN 1993-1-3 6.2.3(5)).
double polar_radius_squared(const Section& s) {
  return (s.Iy + s.Iz) / s.A + s.shear_centre_y * s.shear_centre_y + s.shear_centre_z * s.shear_centre_z;
}

/// Lower root of i0^2 (N - Nf)(N - NT) - N^2 a^2 = 0, a flexural mode coupled with twist by the shear
/// centre offset a: N = [(Nf + NT) - sqrt((Nf + NT)^2 - 4 beta Nf NT)] / (2 beta), beta = 1 - a^2 / i0^2
/// (Timoshenko & Gere 1961, 5.3; the same as EN 1993-1-3 (6.35)).
double coupled_pair(double Nf, double NT, double a, double i0sq) {
  const double beta = 1 - a * a / i0sq;
  const double sum = Nf + NT;
  return (sum - std::sqrt(sum * sum - 4 * beta * Nf * NT)) / (2 * beta);
}

/// A shear centre offset beyond rounding (a billionth of the polar radius of gyration).
bool off_axis(double offset, const Section& s) { return std::abs(offset) > 1e-9 * std::sqrt(polar_radius_squared(s)); }

}  // namespace

bool shear_centre_off_centroid(const Section& s) {
  return off_axis(s.shear_centre_y, s) || off_axis(s.shear_centre_z, s);
}

double torsional_critical_force(const Section& s, double E, double G, double lT) {
  const double pi2 = std::numbers::pi * std::numbers::pi;
  return (G * s.J + pi2 * E * s.Iw / (lT * lT)) / polar_radius_squared(s);  // EN 1993-1-3 (6.33a)
}

double torsional_flexural_critical_force(const Section& s, double E, double G, double Lcr_y, double Lcr_z, double lT) {
  const double pi2 = std::numbers::pi * std::numbers::pi;
  const double Ny = pi2 * E * s.Iy / (Lcr_y * Lcr_y), Nz = pi2 * E * s.Iz / (Lcr_z * Lcr_z);  // (6.50) Ncr
  const double NT = torsional_critical_force(s, E, G, lT);
  const double i0sq = polar_radius_squared(s);
  const double y0 = s.shear_centre_y, z0 = s.shear_centre_z;
  const bool off_y = off_axis(y0, s), off_z = off_axis(z0, s);
  if (!off_y && !off_z) return NT;                       // twist alone
  if (!off_z) return coupled_pair(Ny, NT, y0, i0sq);     // y0 couples twist with buckling about y
  if (!off_y) return coupled_pair(Nz, NT, z0, i0sq);
  // Both offsets: the lowest root of the cubic lies in (0, min(Ny, Nz, NT)], where the cubic goes from
  // negative (-i0^2 Ny Nz NT at N = 0) to non-negative; bisection keeps the bracket.
  auto cubic = [&](double N) {
    return i0sq * (N - Ny) * (N - Nz) * (N - NT) - N * N * y0 * y0 * (N - Nz) - N * N * z0 * z0 * (N - Ny);
  };
  double lo = 0, hi = std::min({Ny, Nz, NT});
  for (int k = 0; k < 200 && hi - lo > 1e-14 * hi; ++k) {
    const double mid = 0.5 * (lo + hi);
    (cubic(mid) < 0 ? lo : hi) = mid;
  }
  return 0.5 * (lo + hi);
}

}  // namespace stepframe::analysis::en1993
