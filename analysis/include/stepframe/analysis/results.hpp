#pragma once
// What the solver returns for each load case and combination.
//
// Internal forces are the actions of the part of the member beyond the cut
// (larger x) on the part before it, in local axes, right-hand rule:
// N > 0 is tension; the normal stress at a fibre (y, z) of the section is
// sigma = N/A + My z / Iy - Mz y / Iz.

#include <Eigen/Core>

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace stepframe::analysis {

using Vector6d = Eigen::Matrix<double, 6, 1>;

/// Internal forces and displacement at one station along a member.
struct Station {
  double x = 0;                 ///< distance from the start of the element or member [m]
  Eigen::Vector3d position = Eigen::Vector3d::Zero();  ///< undeformed position of the axis point, global [m]
  Vector6d forces = Vector6d::Zero();  ///< N, Vy, Vz, T, My, Mz [N, N m]
  Eigen::Vector3d displacement = Eigen::Vector3d::Zero();  ///< translation of the member axis at x, global axes [m]
  Eigen::Vector3d rotation = Eigen::Vector3d::Zero();  ///< small rotation of the section at x, global axes,
                                                       ///< right-hand rule [rad]
  double max_abs_stress = 0;    ///< largest |sigma| over the section's stress points [Pa]
  double max_shear_stress = 0;  ///< shear from Vy, Vz (over the shear areas) plus torsion [Pa]
  double von_mises = 0;         ///< sqrt(sigma^2 + 3 tau^2) of the two maxima above (EN 1993-1-1 6.2.1(5)) [Pa]
};

/// Largest and smallest value of one internal-force diagram and where they occur.
struct DiagramExtreme {
  double max = 0;
  double x_max = 0;  ///< [m] from the start of the element or member
  double min = 0;
  double x_min = 0;
};

/// Results along a line: one element, or one member (its elements' stations joined).
struct LineResult {
  Vector6d start_forces = Vector6d::Zero();  ///< internal forces at x = 0 (same convention as Station::forces)
  Vector6d end_forces = Vector6d::Zero();    ///< internal forces at x = L
  std::vector<Station> stations;  ///< evenly spaced, first at 0 and last at L
  double max_abs_stress = 0;        ///< [Pa]
  double max_local_deflection = 0;  ///< largest distance of the deformed axis from the chord
                                    ///< between its deformed ends [m]
  double max_local_deflection_at = 0;  ///< station where it occurs, from the start [m]
  /// Extremes of N, Vy, Vz, T, My, Mz, located exactly: at the ends, where a
  /// load starts, stops or acts, and where the shear crosses zero (moments) or
  /// the load intensity does (shears); not only at the stations.
  std::array<DiagramExtreme, 6> extremes{};
  double max_von_mises = 0;  ///< [Pa]
};

/// One buckling mode of a combination.
struct BucklingMode {
  double alpha = 0;  ///< load factor: the combination times alpha is critical
  Eigen::VectorXd displacements;  ///< 6 per node, global, scaled so the largest translation is 1
  /// Translations at the points each element was divided into for the
  /// buckling analysis (start and end included), global, same scale.
  std::vector<std::vector<Eigen::Vector3d>> element_points;
};

struct LoadResult {
  std::string name;
  bool is_combination = false;
  Eigen::VectorXd displacements;  ///< 6 per node (ux uy uz rx ry rz), global [m, rad]
  Eigen::VectorXd reactions;      ///< 6 per node: at fixed DOFs R = K u - F, at springs the spring force
                                  ///< -k u on the frame, zero elsewhere [N, N m]
  std::vector<LineResult> elements;  ///< one per FrameModel::elements
  std::vector<LineResult> members;   ///< one per member_chains(model): stations of its elements joined,
                                     ///< x measured along the member from its start
  /// Second-order (P-Delta) result, iterated until the displacements changed
  /// by less than SolveOptions::second_order_tolerance.
  bool second_order = false;
  std::size_t second_order_iterations = 0;
  /// Elastic critical load factor (EN 1993-1-1 5.2.1(3) alpha_cr) of a
  /// combination; empty for load cases, when buckling is not asked for, or
  /// when nothing in the frame is compressed.
  std::optional<double> alpha_cr;
  std::vector<BucklingMode> buckling_modes;  ///< lowest first
};

}  // namespace stepframe::analysis
