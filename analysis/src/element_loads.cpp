#include "stepframe/analysis/element_loads.hpp"

#include <Eigen/Geometry>
#include <Eigen/LU>

#include <algorithm>
#include <array>
#include <cmath>
#include <stdexcept>
#include <string>

namespace stepframe::analysis {
namespace {

// The Macaulay brackets <x - a>^n / n! (zero for x <= a) for n = first, ..., first + N - 1 (first >= 0),
// as running products: each bracket is the product (d/1)(d/2)...(d/n), d = x - a, in that order.
template <int N>
std::array<double, N> macaulay_run(double x, double a, int first) {
  std::array<double, N> out{};
  if (x <= a) return out;
  double value = 1.0;
  const double d = x - a;
  for (int k = 1; k < first; ++k) value *= d / k;
  for (int i = 0; i < N; ++i) {
    const int n = first + i;
    if (n >= 1) value *= d / n;
    out[static_cast<std::size_t>(i)] = value;
  }
  return out;
}

// Q_j(x) for j = first, ..., first + N - 1 in one pass over the loads, each term as load_integral adds it
// (one Q_j alone is load_integral).
template <int N>
std::array<Eigen::Vector3d, N> load_integrals(const LocalLoads& loads, int first, double x) {
  std::array<Eigen::Vector3d, N> sums;
  sums.fill(Eigen::Vector3d::Zero());
  for (const LocalLoad& l : loads) {
    if (l.point) {
      const auto m = macaulay_run<N>(x, l.a, first - 1);
      for (std::size_t i = 0; i < N; ++i) sums[i] += l.q_a * m[i];
      continue;
    }
    const double span = l.b - l.a;
    if (!(span > 0)) continue;
    const Eigen::Vector3d slope = (l.q_b - l.q_a) / span;
    const auto ma = macaulay_run<N + 1>(x, l.a, first), mb = macaulay_run<N + 1>(x, l.b, first);
    for (std::size_t i = 0; i < N; ++i)
      sums[i] += l.q_a * ma[i] + slope * ma[i + 1] - l.q_b * mb[i] - slope * mb[i + 1];
  }
  return sums;
}

}  // namespace

LocalLoad uniform_local_load(double length, const Eigen::Vector3d& q_local) {
  return LocalLoad{false, 0.0, length, q_local, q_local};
}

LocalLoads scaled(const LocalLoads& loads, double factor) {
  LocalLoads out = loads;
  for (LocalLoad& l : out) {
    l.q_a *= factor;
    l.q_b *= factor;
  }
  return out;
}

Eigen::Vector3d load_integral(const LocalLoads& loads, int j, double x) {
  // The j-th integral of c <s-a>^n/n! is c <x-a>^(n+j)/(n+j)!; a Dirac term
  // (n = -1) integrates to <x-a>^(j-1)/(j-1)! (Macaulay functions, see header);
  // q(s) = q_a<s-a>^0 + k<s-a>^1 - q_b<s-b>^0 - k<s-b>^1 for a distributed load.
  return load_integrals<1>(loads, j, x)[0];
}

Eigen::Vector3d load_total(const LocalLoads& loads) {
  Eigen::Vector3d sum = Eigen::Vector3d::Zero();
  for (const LocalLoad& l : loads) sum += l.point ? l.q_a : 0.5 * (l.q_a + l.q_b) * (l.b - l.a);
  return sum;
}

Eigen::Vector3d load_intensity(const LocalLoads& loads, double x) {
  Eigen::Vector3d q = Eigen::Vector3d::Zero();
  for (const LocalLoad& l : loads) {
    if (l.point || x < l.a || x > l.b || !(l.b > l.a)) continue;
    q += l.q_a + (l.q_b - l.q_a) * (x - l.a) / (l.b - l.a);
  }
  return q;
}

std::vector<double> load_breakpoints(const LocalLoads& loads, double length) {
  std::vector<double> xs;
  xs.reserve(2 + 2 * loads.size());
  xs.assign({0.0, length});
  for (const LocalLoad& l : loads) {
    xs.push_back(std::clamp(l.a, 0.0, length));
    if (!l.point) xs.push_back(std::clamp(l.b, 0.0, length));
  }
  std::sort(xs.begin(), xs.end());
  xs.erase(std::unique(xs.begin(), xs.end(), [&](double p, double q) { return std::abs(p - q) <= 1e-12 * length; }),
           xs.end());
  return xs;
}

namespace {

// The internal forces at x from the loads' integrals Q1(x), Q2(x) (internal_forces_at).
Vector6d forces_from(const Vector6d& f0, const Eigen::Vector3d& q1, const Eigen::Vector3d& q2, double x) {
  // Equilibrium of the free body [0, x] (statics, common practice). It carries
  // the start-node action (F0, M0), the loads on [0, x) and at the cut the
  // action (R, M) of the part beyond. Forces: F0 + Q1(x) + R = 0. Moments about
  // the cut point x e_x (lever arms (s - x) e_x):
  //   M0 - x e_x x F0 - e_x x Q2(x) + M = 0,  Q2 = sum q (x - s)
  // With this sign convention N = R_x > 0 is tension and sigma = N/A + My z/Iy - Mz y/Iz.
  const Eigen::Vector3d ex = Eigen::Vector3d::UnitX();
  const Eigen::Vector3d force0 = f0.head<3>();
  const Eigen::Vector3d moment0 = f0.tail<3>();
  const Eigen::Vector3d r = -force0 - q1;
  const Eigen::Vector3d m = -moment0 + x * ex.cross(force0) + ex.cross(q2);
  Vector6d forces;
  forces << r, m;
  return forces;
}

// The state at x from the loads' integrals Q2(x), Q3(x), Q4(x) (element_state_at).
Vector6d state_from(const ElementProperties& p, const Vector6d& d0, const Vector6d& f0, const Eigen::Vector3d& q2,
                    const Eigen::Vector3d& q3, const Eigen::Vector3d& q4, double x) {
  // Moments of the free body [0, x] (forces_from):
  //   Mz(x) = -m0z + x f0y + Q2y(x),   My(x) = -m0y - x f0z - Q2z(x),
  //   Vy(x) = -f0y - Q1y(x),           Vz(x) = -f0z - Q1z(x),   N(x) = -f0x - Q1x(x).
  // Integrated once for rotations and twice for deflections (the Q_j are the
  // load_integral functions), plus the shear strain V/(G As) for Timoshenko.
  const double fx = f0(0), fy = f0(1), fz = f0(2), mx = f0(3), my = f0(4), mz = f0(5);
  const double x2 = x * x, x3 = x2 * x;
  const double eiz = p.E * p.Iz, eiy = p.E * p.Iy;
  Vector6d d;
  d(0) = d0(0) + (-fx * x - q2.x()) / (p.E * p.A);
  d(3) = d0(3) - mx * x / (p.G * p.J);
  d(5) = d0(5) + (-mz * x + fy * x2 / 2 + q3.y()) / eiz;
  d(1) = d0(1) + d0(5) * x + (-mz * x2 / 2 + fy * x3 / 6 + q4.y()) / eiz;
  d(4) = d0(4) + (-my * x - fz * x2 / 2 - q3.z()) / eiy;
  d(2) = d0(2) - d0(4) * x - (-my * x2 / 2 - fz * x3 / 6 - q4.z()) / eiy;
  if (p.Asy > 0) d(1) += (-fy * x - q2.y()) / (p.G * p.Asy);
  if (p.Asz > 0) d(2) += (-fz * x - q2.z()) / (p.G * p.Asz);
  return d;
}

}  // namespace

Vector6d internal_forces_at(const Vector6d& f0, const LocalLoads& loads, double x) {
  const auto [q1, q2] = load_integrals<2>(loads, 1, x);
  return forces_from(f0, q1, q2, x);
}

Vector6d element_state_at(const ElementProperties& p, const Vector6d& d0, const Vector6d& f0,
                          const LocalLoads& loads, double x) {
  const auto [q2, q3, q4] = load_integrals<3>(loads, 2, x);
  return state_from(p, d0, f0, q2, q3, q4, x);
}

ElementPoint element_point_at(const ElementProperties& p, const Vector6d& d0, const Vector6d& f0,
                              const LocalLoads& loads, double x) {
  // Q1 to Q4 in one pass: each Q_j is the same running product of Macaulay brackets, summed over the
  // loads in the same order, as the two functions' own passes give it.
  const auto [q1, q2, q3, q4] = load_integrals<4>(loads, 1, x);
  return {state_from(p, d0, f0, q2, q3, q4, x), forces_from(f0, q1, q2, x)};
}

Vector12d end_actions_from_start(const ElementProperties& p, const Vector6d& f0, const LocalLoads& loads) {
  // Equilibrium of the whole element: forces F0 + FL + total = 0; moments about
  // the end point: M0 + ML - L e_x x F0 - e_x x Q2(L) = 0.
  const Eigen::Vector3d ex = Eigen::Vector3d::UnitX();
  const double L = p.length;
  Vector12d f;
  f.head<6>() = f0;
  f.segment<3>(6) = -f0.head<3>() - load_total(loads);
  f.segment<3>(9) = -f0.tail<3>() + L * ex.cross(Eigen::Vector3d(f0.head<3>())) + ex.cross(load_integral(loads, 2, L));
  return f;
}

CantileverFlexibility cantilever_flexibility(const ElementProperties& p) {
  const Vector6d zero = Vector6d::Zero();
  const LocalLoads none;
  Eigen::Matrix<double, 6, 6> flexibility;
  for (int i = 0; i < 6; ++i) flexibility.col(i) = element_state_at(p, zero, Vector6d::Unit(i), none, p.length);
  return flexibility.partialPivLu();
}

Vector12d fixed_end_actions(const ElementProperties& p, const LocalLoads& loads,
                            const CantileverFlexibility& flexibility) {
  // With zero start state, the end state is F f0 + e(loads), linear in f0; the
  // fixed end needs it to vanish: f0 = -F^-1 e. F is the cantilever's
  // flexibility (its columns are the end states of unit start actions).
  if (loads.empty()) return Vector12d::Zero();
  const Vector6d e = element_state_at(p, Vector6d::Zero(), Vector6d::Zero(), loads, p.length);
  const Vector6d f0 = -flexibility.solve(e);
  return end_actions_from_start(p, f0, loads);
}

Vector12d fixed_end_actions(const ElementProperties& p, const LocalLoads& loads) {
  if (loads.empty()) return Vector12d::Zero();
  return fixed_end_actions(p, loads, cantilever_flexibility(p));
}

LocalLoad to_local(const ElementLoad& load, const Eigen::Matrix3d& axes, double length) {
  const double tol = 1e-9 * length;
  const double b = load.b < 0 ? length : load.b;
  if (!(load.a >= -tol && load.a <= length + tol) || (!load.point && !(b > load.a - tol && b <= length + tol)))
    throw std::invalid_argument("a load on element " + std::to_string(load.element) + " lies outside it (a = " +
                                std::to_string(load.a) + " m, b = " + std::to_string(b) + " m, length " +
                                std::to_string(length) + " m)");
  LocalLoad out;
  out.point = load.point;
  out.a = std::clamp(load.a, 0.0, length);
  out.b = load.point ? out.a : std::clamp(b, 0.0, length);
  Eigen::Vector3d wa = load.w_start, wb = load.point ? load.w_start : load.w_end;
  if (load.axes == LoadAxes::projected && !load.point) {
    // Per unit projected length: a component along global e_i acts on the
    // member's projection on the plane normal to e_i, of length L |x x e_i|
    // (so a vertical load on a rafter sloping at angle t carries cos t; common practice).
    const Eigen::Vector3d x = axes.row(0).transpose();
    for (int i = 0; i < 3; ++i) {
      const double f = x.cross(Eigen::Vector3d::Unit(i)).norm();
      wa(i) *= f;
      wb(i) *= f;
    }
  }
  if (load.axes == LoadAxes::local) {
    out.q_a = wa;
    out.q_b = wb;
  } else {
    out.q_a = axes * wa;
    out.q_b = axes * wb;
  }
  return out;
}

}  // namespace stepframe::analysis
