#pragma once
// Member local axes and section orientation.
//
// Convention: local x runs from the start node to the end node. A member that
// is not vertical keeps its section's strong axis (local y) horizontal:
// y = normalize(Z x x), z = x x y, so z points upwards and a vertical load
// bends it about y. A vertical member (within vertical_tolerance of the
// vertical) has its depth (local z) along global X, taken square to the
// member: z = normalize(X - (X . x) x), y = z x x; a column drawn a little
// out of plumb is thus oriented as if it were plumb, without a jump.
// A roll angle then turns y and z about x (right-hand rule).

#include <Eigen/Core>

#include <numbers>

namespace stepframe::analysis {

/// Largest angle between a member and the vertical at which it counts as
/// vertical: 0.25 degrees (4.4 mm over 1 m). That is beyond any CAD rounding
/// and beyond the out-of-plumb tolerance of a column as erected (h/300 is
/// 0.19 degrees; EN 1090-2 allows about that, from memory), and far below the
/// slope of any brace or rafter.
inline constexpr double vertical_tolerance = 0.25 * std::numbers::pi / 180.0;

/// Members leaning more than vertical_tolerance but less than this from the
/// vertical (5 degrees) are ambiguous: maybe a column drawn out of plumb,
/// maybe a raking member. They are oriented as inclined members (strong axis
/// horizontal); the model builder warns about each one.
inline constexpr double ambiguous_inclination = 5.0 * std::numbers::pi / 180.0;

/// Angle between the chord start -> end and the vertical [rad], 0 to pi/2.
double angle_from_vertical(const Eigen::Vector3d& start, const Eigen::Vector3d& end);

/// True when the chord is within vertical_tolerance of the vertical.
bool is_vertical(const Eigen::Vector3d& start, const Eigen::Vector3d& end);

/// Rotation whose rows are the local unit vectors x, y, z in global
/// components, so that v_local = R * v_global.
Eigen::Matrix3d local_axes(const Eigen::Vector3d& start, const Eigen::Vector3d& end, double roll);

}  // namespace stepframe::analysis
