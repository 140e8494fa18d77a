#include "stepframe/analysis/local_axes.hpp"

#include <Eigen/Geometry>

#include <cmath>
#include <stdexcept>

namespace stepframe::analysis {

double angle_from_vertical(const Eigen::Vector3d& start, const Eigen::Vector3d& end) {
  const Eigen::Vector3d chord = end - start;
  return std::atan2(chord.head<2>().norm(), std::abs(chord.z()));  // horizontal extent over vertical rise
}

bool is_vertical(const Eigen::Vector3d& start, const Eigen::Vector3d& end) {
  return angle_from_vertical(start, end) <= vertical_tolerance;
}

Eigen::Matrix3d local_axes(const Eigen::Vector3d& start, const Eigen::Vector3d& end, double roll) {
  const Eigen::Vector3d chord = end - start;
  const double length = chord.norm();
  if (!(length > 0)) throw std::invalid_argument("local_axes: member has zero length");
  const Eigen::Vector3d x = chord / length;

  // Section orientation convention (README, "Member axes"): strong axis y horizontal
  // for non-vertical members; depth (z) along global X, square to the member, for vertical ones.
  Eigen::Vector3d y, z;
  if (is_vertical(start, end)) {
    const Eigen::Vector3d X = Eigen::Vector3d::UnitX();
    z = (X - X.dot(x) * x).normalized();  // |X . x| <= sin(0.25 deg): well conditioned
    y = z.cross(x);
  } else {
    y = Eigen::Vector3d::UnitZ().cross(x).normalized();
    z = x.cross(y);
  }

  // Roll: right-hand rotation of (y, z) about x by `roll`.
  const double c = std::cos(roll), s = std::sin(roll);
  const Eigen::Vector3d y_rolled = c * y + s * z;
  const Eigen::Vector3d z_rolled = -s * y + c * z;

  Eigen::Matrix3d r;
  r.row(0) = x.transpose();
  r.row(1) = y_rolled.transpose();
  r.row(2) = z_rolled.transpose();
  return r;
}

}  // namespace stepframe::analysis
