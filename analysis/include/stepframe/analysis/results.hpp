#pragma once
// What the solver returns for each load case and combination.
//
// Internal forces are the actions of the part of the member beyond the cut
// (larger x) on the part before it, in local axes, right-hand rule:
// N > 0 is tension; the normal stress at a fibre (y, z) of the section is
// sigma = N/A + My z / Iy - Mz y / Iz.

#include <Eigen/Core>

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
  double max_abs_stress = 0;    ///< largest |sigma| over the section's extreme fibres [Pa]
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
};

struct LoadResult {
  std::string name;
  bool is_combination = false;
  Eigen::VectorXd displacements;  ///< 6 per node (ux uy uz rx ry rz), global [m, rad]
  Eigen::VectorXd reactions;      ///< 6 per node, zero where the DOF is free [N, N m]
  std::vector<LineResult> elements;  ///< one per FrameModel::elements
  std::vector<LineResult> members;   ///< one per member_chains(model): stations of its elements joined,
                                     ///< x measured along the member from its start
};

}  // namespace stepframe::analysis
