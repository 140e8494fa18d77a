#include "stepframe/analysis/thin_walled.hpp"

#include <Eigen/Dense>

#include <algorithm>
#include <array>
#include <cmath>
#include <stdexcept>
#include <string>

namespace stepframe::analysis {

ThinWalledWarping thin_walled_warping(const std::vector<ThinWall>& path) {
  if (path.empty()) throw std::invalid_argument("thin-walled section: no walls");
  // Three-point Gauss-Legendre rule on [0, 1]: exact up to degree 5; the
  // integrands below are at most cubic along a wall (linear t times quadratics).
  const double g = std::sqrt(0.6);
  constexpr std::array<double, 3> weight{5.0 / 18, 8.0 / 18, 5.0 / 18};
  const std::array<double, 3> node{0.5 * (1 - g), 0.5, 0.5 * (1 + g)};

  // Sectorial coordinate about the origin, omega = integral of (y dz - z dy) along
  // the path (Vlasov; Timoshenko & Gere 5.6), zero at the path's start. Normal
  // equations of the least-squares fit omega ~ c0 + c1 y + c2 z with weight t ds:
  // removing that fit is moving the pole to the shear centre and the origin of
  // omega to its principal value.
  Eigen::Matrix3d M = Eigen::Matrix3d::Zero();
  Eigen::Vector3d v = Eigen::Vector3d::Zero();
  double omega_omega = 0;  // integral of omega^2 t ds
  double omega_start = 0;
  for (std::size_t k = 0; k < path.size(); ++k) {
    const ThinWall& w = path[k];
    if (k > 0 && std::hypot(w.from.y - path[k - 1].to.y, w.from.z - path[k - 1].to.z) > 1e-9)
      throw std::invalid_argument("thin-walled section: wall " + std::to_string(k) + " does not start where wall " +
                                  std::to_string(k - 1) + " ends");
    if (w.t_from < 0 || w.t_to < 0) throw std::invalid_argument("thin-walled section: negative wall thickness");
    const double dy = w.to.y - w.from.y, dz = w.to.z - w.from.z;
    const double length = std::hypot(dy, dz);
    const double swept = w.from.y * dz - w.from.z * dy;  // d omega / d lambda, constant on a straight wall
    for (std::size_t q = 0; q < 3; ++q) {
      const double lambda = node[q];
      const double t = w.t_from + lambda * (w.t_to - w.t_from);
      const double dA = weight[q] * length * t;
      const Eigen::Vector3d f(1.0, w.from.y + lambda * dy, w.from.z + lambda * dz);
      const double omega = omega_start + lambda * swept;
      M += dA * f * f.transpose();
      v += dA * omega * f;
      omega_omega += dA * omega * omega;
    }
    omega_start += swept;
  }
  if (!(M(0, 0) > 0)) throw std::invalid_argument("thin-walled section: the walls have no area");
  const Eigen::Vector3d c = M.ldlt().solve(v);
  ThinWalledWarping out;
  // Residual of the fit (Pythagoras in the t ds inner product).
  out.Iw = std::max(0.0, omega_omega - c.dot(v));
  // omega about a pole Q is omega_O - y_Q z + z_Q y + const, so the fitted
  // linear terms give the shear centre: y_S = c2, z_S = -c1.
  out.shear_centre = {c(2), -c(1)};
  return out;
}

}  // namespace stepframe::analysis
