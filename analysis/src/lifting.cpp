#include "stepframe/analysis/lifting.hpp"

#include "stepframe/analysis/frame_model.hpp"

#include <algorithm>
#include <cmath>

namespace stepframe::analysis {
namespace {

// Reactions at a and b: sum of forces R_a + R_b = w L, moments about a: R_b (b - a) = w L (L/2 - a).
std::array<double, 2> reactions(double L, double w, double a, double b) {
  const double Rb = w * L * (L / 2 - a) / (b - a);
  return {w * L - Rb, Rb};
}

// Sagging moment at x (positive sagging).
double moment_at(double x, double w, double a, double b, const std::array<double, 2>& R) {
  return -w * x * x / 2 + (x > a ? R[0] * (x - a) : 0.0) + (x > b ? R[1] * (x - b) : 0.0);
}

}  // namespace

std::array<double, 2> lifting_moments(double L, double w, double a, double b) {
  const auto R = reactions(L, w, a, b);
  // Extremes at the supports, the ends (zero) and where the shear -w x + R_a vanishes between the supports.
  double sagging = 0, hogging = 0;
  for (const double x : {a, b, std::clamp(R[0] / w, a, b)}) {
    const double M = moment_at(x, w, a, b, R);
    sagging = std::max(sagging, M), hogging = std::max(hogging, -M);
  }
  return {sagging, hogging};
}

std::vector<CheckResult> check_lifting(const LiftingInput& in, const en1993::PartialFactors& factors) {
  const Section& s = *in.section;
  const double L = in.length, a = in.points[0] * L, b = in.points[1] * L;
  const double w = in.dynamic_factor * s.A * in.material.density * standard_gravity;  // [N/m] self weight x factor
  const auto [sagging, hogging] = lifting_moments(L, w, a, b);
  const double M_Ed = std::max(sagging, hogging);
  const double W = s.Wy();
  std::vector<CheckResult> out;
  CheckResult stress;
  stress.member = in.member;
  stress.check = "lifting stress";
  stress.clause = "EN 1993-1-1 6.2.5 (elastic), self weight x dynamic factor, slings at given points";
  stress.combination = "lifting";
  stress.station = sagging >= hogging ? std::clamp(reactions(L, w, a, b)[0] / w, a, b) : (a > L - b ? a : b);
  stress.value = M_Ed / W;  // sigma = M / Wel,y [Pa]
  stress.limit = in.material.fy / factors.gamma_M0;
  stress.unit = "Pa";
  stress.utilisation = stress.value / stress.limit;
  stress.pass = stress.utilisation <= 1;
  stress.details = {{"w", w}, {"dynamic_factor", in.dynamic_factor}, {"a", a}, {"b", b}, {"M_sagging", sagging},
                    {"M_hogging", hogging}, {"W_el_y", W}};
  out.push_back(stress);

  // I sections and channels buckle laterally; tubes, bars, angles and tees are left to the stress check.
  const bool open = s.shape == SectionShape::rolled_i || s.shape == SectionShape::welded_i || s.shape == SectionShape::channel;
  if (!open || s.Iz <= 0) return out;
  // The diagram between the slings, x from the first sling, My with dM/dx = V (only its shape matters here).
  const auto R = reactions(L, w, a, b);
  std::vector<en1993::DiagramPoint> diagram;
  constexpr int points = 40;
  double span_peak = 0;
  for (int i = 0; i <= points; ++i) {
    const double x = a + (b - a) * i / points;
    const double M = moment_at(x, w, a, b, R);
    span_peak = std::max(span_peak, std::abs(M));
    diagram.push_back({x - a, M, -w * x + R[0]});
  }
  const double Mcr = en1993::critical_moment_for_diagram({in.material.E, in.material.G, s.Iz, s.Iw, s.J}, diagram);
  const double lambda = std::sqrt(W * in.material.fy / Mcr);  // 6.3.2.2(1) with Wy = Wel,y
  const auto curve = en1993::lateral_torsional_curve(s);
  const double chi = en1993::reduction_factor(lambda, curve);  // (6.56)
  const double M_b_Rd = chi * W * in.material.fy / factors.gamma_M1;  // (6.55)
  CheckResult ltb;
  ltb.member = in.member;
  ltb.check = "lifting lateral-torsional buckling";
  ltb.clause = "EN 1993-1-1 6.3.2.2 between the slings (fork supports assumed there)";
  ltb.combination = "lifting";
  ltb.station = (a + b) / 2;
  ltb.value = span_peak;
  ltb.limit = M_b_Rd;
  ltb.unit = "N*m";
  ltb.utilisation = span_peak / M_b_Rd;
  ltb.pass = ltb.utilisation <= 1;
  ltb.details = {{"Mcr", Mcr}, {"lambda_LT", lambda}, {"alpha_LT", en1993::imperfection_factor(curve)}, {"chi_LT", chi},
                 {"M_Ed", span_peak}, {"M_b_Rd", M_b_Rd}};
  out.push_back(ltb);
  return out;
}

}  // namespace stepframe::analysis
