#include "stepframe/analysis/geometric_stiffness.hpp"

namespace stepframe::analysis {

Matrix12d local_geometric_stiffness(const ElementProperties& p, double N) {
  const double L = p.length, c = N / L;
  Matrix12d g = Matrix12d::Zero();
  // x-y plane, DOFs v1=1, rz1=5, v2=7, rz2=11 (rz = dv/dx):
  // N/L [6/5, L/10, -6/5, L/10; ., 2L^2/15, -L/10, -L^2/30; ., ., 6/5, -L/10; ., ., ., 2L^2/15].
  g(1, 1) = g(7, 7) = 1.2 * c;
  g(1, 7) = -1.2 * c;
  g(1, 5) = g(1, 11) = 0.1 * L * c;
  g(5, 7) = g(7, 11) = -0.1 * L * c;
  g(5, 5) = g(11, 11) = 2.0 * L * L / 15.0 * c;
  g(5, 11) = -L * L / 30.0 * c;
  // x-z plane, DOFs w1=2, ry1=4, w2=8, ry2=10 (ry = -dw/dx flips the couplings).
  g(2, 2) = g(8, 8) = 1.2 * c;
  g(2, 8) = -1.2 * c;
  g(2, 4) = g(2, 10) = -0.1 * L * c;
  g(4, 8) = g(8, 10) = 0.1 * L * c;
  g(4, 4) = g(10, 10) = 2.0 * L * L / 15.0 * c;
  g(4, 10) = -L * L / 30.0 * c;
  for (int i = 0; i < 12; ++i)
    for (int j = 0; j < i; ++j) g(i, j) = g(j, i);
  return g;
}

}  // namespace stepframe::analysis
