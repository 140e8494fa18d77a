// The largest eigenvalue of a small symmetric matrix: Eigen's Householder reduction to tridiagonal form,
// then Laguerre's method and bisection on the Sturm sequence count to full precision.

#include "largest_eigenvalue.hpp"

#include <Eigen/Eigenvalues>

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

namespace stepframe::analysis::detail {

double largest_eigenvalue(const SmallMatrix& a) {
  if (a.rows() == 0) throw std::invalid_argument("largest_eigenvalue: the matrix is empty");
  const Eigen::Tridiagonalization<SmallMatrix> tri(a);
  const SmallVector d = tri.diagonal(), e = tri.subDiagonal();
  const Eigen::Index n = d.size();
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;  // Gershgorin's bounds
  for (Eigen::Index i = 0; i < n; ++i) {
    const double r = (i > 0 ? std::abs(e(i - 1)) : 0.0) + (i + 1 < n ? std::abs(e(i)) : 0.0);
    lo = std::min(lo, d(i) - r), hi = std::max(hi, d(i) + r);
  }
  // How many eigenvalues lie below x: the negative pivots of the LDL^T factors of T - x I.
  const double tiny = std::numeric_limits<double>::min();
  auto below = [&](double x) {
    Eigen::Index count = 0;
    double q = d(0) - x;
    for (Eigen::Index i = 0;; ++i) {
      if (q == 0) q = -tiny;  // an exact zero pivot: count it and step past (the usual perturbation)
      count += q < 0;
      if (i + 1 == n) break;
      q = d(i + 1) - x - e(i) * e(i) / q;
    }
    return count;
  };
  // Laguerre's method on p(x) = det(T - x I) from above the spectrum falls monotonically, and cubically
  // near it, to the largest eigenvalue (p has real roots only; Wilkinson, The Algebraic Eigenvalue
  // Problem, 1965, 7.5; from memory): a few steps instead of some fifty halvings of the Gershgorin
  // interval. The bracket it gives is confirmed by the Sturm counts, and bisection ends on the same two
  // adjacent doubles as from the whole interval (the counts change once), so the value is the same to
  // the last bit. With the pivots q_i of below() and their derivatives in x,
  //   q_i' = -1 + e^2 q'/q^2,   q_i'' = e^2 (q''/q^2 - 2 q'^2/q^3)   (q = q_(i-1), e = e_(i-1)),
  //   G = (ln p)' = sum q_i'/q_i = sum 1/(x - lambda),   H = -(ln p)'' = sum (q_i'/q_i)^2 - q_i''/q_i.
  const double m = static_cast<double>(n);
  double x = hi;
  for (int k = 0; k < 20; ++k) {
    double q = d(0) - x, dq = -1, ddq = 0;
    double G = dq / q, H = G * G;
    for (Eigen::Index i = 1; i < n; ++i) {
      const double e2 = e(i - 1) * e(i - 1), r = 1 / q;
      ddq = e2 * r * r * (ddq - 2 * dq * dq * r);
      dq = -1 + e2 * dq * r * r;
      q = d(i) - x - e2 * r;
      const double g = dq / q;
      G += g;
      H += g * g - ddq / q;
    }
    const double step = m / (G + std::sqrt(std::max(0.0, (m - 1) * (m * H - G * G))));  // x - lambda_max >= step
    if (!(step > 0) || !std::isfinite(step)) break;
    if (step <= 1e-12 * std::abs(x)) {
      const double near_lo = x - 4 * step - 1e-14 * std::abs(x), near_hi = x + 1e-14 * std::abs(x);
      if (near_lo > lo && near_hi < hi && below(near_lo) < n && below(near_hi) == n) lo = near_lo, hi = near_hi;
      break;
    }
    x -= step;
  }
  for (int k = 0; k < 200; ++k) {
    const double mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;  // adjacent doubles: as close as it gets
    (below(mid) == n ? hi : lo) = mid;
  }
  return 0.5 * (lo + hi);
}

}  // namespace stepframe::analysis::detail
