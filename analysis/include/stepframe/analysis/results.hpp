#pragma once
// What the solver returns for each load case and combination.
//
// Internal forces are the actions of the part of the member beyond the cut
// (larger x) on the part before it, in local axes, right-hand rule:
// N > 0 is tension; the normal stress at a fibre (y, z) of the section is
// sigma = N/A + My z / Iy - Mz y / Iz.
//
// A result keeps what every member needs for checks and tables (a
// LineSummary per member) and what it takes to recover any member exactly
// (the node displacements and the loads on each element); the stations
// along a member are recomputed on demand (member_results.hpp), so a large
// frame never holds them all at once.

#include "stepframe/analysis/local_loads.hpp"

#include <Eigen/Core>

#include <array>
#include <cstddef>
#include <memory>
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

/// What the checks, tables and results.json need of a line (one element, or
/// one member: its elements joined), kept for every member of every result.
struct LineSummary {
  double length = 0;                         ///< [m] along the line
  Vector6d start_forces = Vector6d::Zero();  ///< internal forces at x = 0 (same convention as Station::forces)
  Vector6d end_forces = Vector6d::Zero();    ///< internal forces at x = L
  double max_abs_stress = 0;        ///< [Pa]
  double max_von_mises = 0;         ///< [Pa]
  double max_von_mises_at = 0;      ///< where it occurs, from the start [m]
  double max_local_deflection = 0;  ///< largest distance of the deformed axis from the chord
                                    ///< between its deformed ends [m]
  double max_local_deflection_at = 0;  ///< where it occurs, from the start [m]
  /// Extremes of N, Vy, Vz, T, My, Mz, located exactly: at the ends, where a
  /// load starts, stops or acts, and where the shear crosses zero (moments) or
  /// the load intensity does (shears); not only at the stations.
  std::array<DiagramExtreme, 6> extremes{};
};

/// Results along a line with its stations.
struct LineResult : LineSummary {
  std::vector<Station> stations;  ///< evenly spaced per element, first at 0 and last at L
};

/// One buckling mode of a combination.
struct BucklingMode {
  double alpha = 0;  ///< load factor: the combination times alpha is critical
  Eigen::VectorXd displacements;  ///< 6 per node, global, scaled so the largest translation is 1
  /// Per element: the mode (ux uy uz rx ry rz, global, same scale) at the
  /// points inside the element where the buckling analysis divided it, evenly
  /// spaced; empty for an element it did not divide. See mode_translation.
  std::vector<std::vector<Vector6d>> inner_points;
};

/// Loads on every element (local axes, one list per element) times a factor:
/// a case's loads, shared by the combinations that use it.
struct LoadTerm {
  double factor = 1.0;
  std::shared_ptr<const std::vector<LocalLoads>> loads;
};

struct ElementConstants;  // element_constants.hpp

struct LoadResult {
  std::string name;
  bool is_combination = false;
  bool serviceability = false;  ///< a serviceability combination (Combination::serviceability)
  Eigen::VectorXd displacements;  ///< 6 per node (ux uy uz rx ry rz), global [m, rad]
  Eigen::VectorXd reactions;      ///< 6 per node: at fixed DOFs R = K u - F, at springs the spring force
                                  ///< -k u on the frame, zero elsewhere [N, N m]
  std::vector<LineSummary> members;  ///< one per member_chains(model), x measured along the member
  /// The element loads of this result: the sum of the terms (one for a case,
  /// one per case for a combination).
  std::vector<LoadTerm> element_loads;
  /// Each element's geometry, properties and flexibility, shared by the results
  /// of one solve and valid for the model solved (element_constants.hpp);
  /// empty: worked out for each recovery.
  std::shared_ptr<const std::vector<ElementConstants>> element_constants;
  /// Stations per element when a line is recovered (member_results.hpp).
  std::size_t stations = 21;
  /// Second-order (P-Delta) result, iterated until the displacements changed
  /// by less than SolveOptions::second_order_tolerance.
  bool second_order = false;
  std::size_t second_order_iterations = 0;
  /// Second order: the axial force [N] of each element's geometric stiffness.
  std::vector<double> second_order_axial;
  /// Elastic critical load factor (EN 1993-1-1 5.2.1(3) alpha_cr) of a
  /// combination; empty for load cases, when buckling is not asked for, or
  /// when nothing in the frame is compressed.
  std::optional<double> alpha_cr;
  std::vector<BucklingMode> buckling_modes;  ///< lowest first
};

}  // namespace stepframe::analysis
