#include "stepframe/analysis/local_axes.hpp"

#include <Eigen/Geometry>

#include <cmath>
#include <stdexcept>

namespace stepframe::analysis {

Eigen::Matrix3d local_axes(const Eigen::Vector3d& start, const Eigen::Vector3d& end, double roll) {
  const Eigen::Vector3d chord = end - start;
  const double length = chord.norm();
  if (!(length > 0)) throw std::invalid_argument("local_axes: member has zero length");
  const Eigen::Vector3d x = chord / length;

  // Section orientation convention (README, "Member axes"): strong axis y horizontal
  // for non-vertical members; depth (z) along global X for vertical ones.
  const Eigen::Vector3d up = Eigen::Vector3d::UnitZ();
  const bool vertical = x.head<2>().norm() < 1e-6;
  Eigen::Vector3d y, z;
  if (vertical) {
    z = Eigen::Vector3d::UnitX();
    y = z.cross(x);
  } else {
    y = up.cross(x).normalized();
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
