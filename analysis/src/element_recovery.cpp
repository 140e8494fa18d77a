#include "stepframe/analysis/element_recovery.hpp"

#include <Eigen/Geometry>

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace stepframe::analysis {

Vector6d internal_forces_at(const Vector12d& end_forces_local, const Eigen::Vector3d& q_local, double x) {
  // Equilibrium of the free body [0, x] (statics, common practice). It carries
  // the start-node action (F0, M0), the load q over [0, x] with resultant q x at
  // x/2, and at the cut the action (R, M) of the part beyond. Forces:
  //   F0 + q x + R = 0                                    ->  R = -F0 - q x
  // moments about the cut point x e_x (lever arms s e_x - x e_x):
  //   M0 - x e_x x F0 - (x^2/2) e_x x q + M = 0            ->  M = -M0 + x e_x x F0 + (x^2/2) e_x x q
  // With this sign convention N = R_x > 0 is tension and sigma = N/A + My z/Iy - Mz y/Iz.
  const Eigen::Vector3d f0 = end_forces_local.segment<3>(0);
  const Eigen::Vector3d m0 = end_forces_local.segment<3>(3);
  const Eigen::Vector3d ex = Eigen::Vector3d::UnitX();
  const Eigen::Vector3d r = -f0 - q_local * x;
  const Eigen::Vector3d m = -m0 + x * ex.cross(f0) + 0.5 * x * x * ex.cross(q_local);
  Vector6d forces;
  forces << r, m;
  return forces;
}

Eigen::Vector3d axis_displacement_at(const ElementProperties& p, const Vector12d& u, const Eigen::Vector3d& q,
                                     double x) {
  const double L = p.length, xi = x / L, xi2 = xi * xi, xi3 = xi2 * xi;
  // Cubic Hermite shape functions of the Euler-Bernoulli beam (common practice).
  const double n1 = 1 - 3 * xi2 + 2 * xi3;
  const double n2 = L * (xi - 2 * xi2 + xi3);
  const double n3 = 3 * xi2 - 2 * xi3;
  const double n4 = L * (xi3 - xi2);
  // Particular solutions with zero end values and slopes, solving E I v'''' = q
  // and E A u'' = -q_x: v_p = q x^2 (L - x)^2 / (24 E I), u_p = q_x x (L - x) / (2 E A)
  // (the fixed-fixed beam under uniform load; standard beam theory, common practice).
  const double bubble = x * x * (L - x) * (L - x) / 24.0;
  Eigen::Vector3d d;
  d.x() = (1 - xi) * u(0) + xi * u(6) + q.x() * x * (L - x) / (2 * p.E * p.A);
  // x-y plane: rz = dv/dx.
  d.y() = n1 * u(1) + n2 * u(5) + n3 * u(7) + n4 * u(11) + q.y() * bubble / (p.E * p.Iz);
  // x-z plane: ry = -dw/dx, so the rotation terms change sign.
  d.z() = n1 * u(2) - n2 * u(4) + n3 * u(8) - n4 * u(10) + q.z() * bubble / (p.E * p.Iy);
  return d;
}

double max_fibre_stress(const Section& section, const Vector6d& f) {
  // sigma = N/A + My z/Iy - Mz y/Iz is largest in magnitude at a corner where
  // all three terms share a sign (doubly symmetric bounding box; common practice).
  return std::abs(f(0)) / section.A + std::abs(f(4)) / section.Wy() + std::abs(f(5)) / section.Wz();
}

LineResult recover_element(const ElementState& s, std::size_t stations) {
  if (stations < 2) throw std::invalid_argument("recover_element: at least 2 stations are needed (both ends)");
  const double L = s.properties.length;
  const Matrix12d t = transformation(s.axes);
  const Vector12d u_local = t * s.end_displacements;
  const Vector12d end_forces = member_end_forces(s.properties, u_local, s.q_local);

  LineResult result;
  result.stations.reserve(stations);
  std::vector<Eigen::Vector3d> deformed(stations);  // deformed axis points, local axes
  for (std::size_t k = 0; k < stations; ++k) {
    // Last station exactly at L (no rounding drift).
    const double x = k + 1 == stations ? L : L * static_cast<double>(k) / static_cast<double>(stations - 1);
    Station st;
    st.x = x;
    st.position = s.origin + x * s.axes.row(0).transpose();
    st.forces = internal_forces_at(end_forces, s.q_local, x);
    const Eigen::Vector3d d_local = axis_displacement_at(s.properties, u_local, s.q_local, x);
    st.displacement = s.axes.transpose() * d_local;
    st.max_abs_stress = max_fibre_stress(s.section, st.forces);
    result.max_abs_stress = std::max(result.max_abs_stress, st.max_abs_stress);
    deformed[k] = Eigen::Vector3d(x, 0, 0) + d_local;
    result.stations.push_back(st);
  }
  result.start_forces = result.stations.front().forces;
  result.end_forces = result.stations.back().forces;

  // Distance of each deformed axis point from the line through the deformed ends.
  const Eigen::Vector3d a = deformed.front();
  const Eigen::Vector3d chord = deformed.back() - a;
  const double chord_length = chord.norm();
  for (std::size_t k = 0; k < stations; ++k) {
    const Eigen::Vector3d& p = deformed[k];
    const double distance = chord_length > 0 ? chord.cross(p - a).norm() / chord_length : (p - a).norm();
    if (distance > result.max_local_deflection) {
      result.max_local_deflection = distance;
      result.max_local_deflection_at = result.stations[k].x;
    }
  }
  return result;
}

}  // namespace stepframe::analysis
