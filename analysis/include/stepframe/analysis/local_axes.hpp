#pragma once
// Member local axes and section orientation.
//
// Convention: local x runs from the start node to the end node. A member that
// is not vertical keeps its section's strong axis (local y) horizontal:
// y = normalize(Z x x), z = x x y, so z points upwards and a vertical load
// bends it about y. A vertical member (horizontal extent below 1e-6 of its
// length) has its depth (local z) along global X: z = X, y = z x x.
// A roll angle then turns y and z about x (right-hand rule).

#include <Eigen/Core>

namespace stepframe::analysis {

/// Rotation whose rows are the local unit vectors x, y, z in global
/// components, so that v_local = R * v_global.
Eigen::Matrix3d local_axes(const Eigen::Vector3d& start, const Eigen::Vector3d& end, double roll);

}  // namespace stepframe::analysis
