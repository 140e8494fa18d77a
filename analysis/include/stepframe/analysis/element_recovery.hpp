#pragma once
// Results along one element from its end displacements and its loads.
//
// Internal forces follow results.hpp: actions of the part beyond the cut on the
// part before it, local axes, N > 0 tension. Between the nodes they are exact
// for every load of element_loads.hpp (statics of the free body [0, x]); the
// deflected axis is exact too: the end values carried along by the beam
// equations, which is the Hermite interpolation of the end values plus the
// loads' particular solution (element_state_at).

#include "stepframe/analysis/element_loads.hpp"
#include "stepframe/analysis/element_releases.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/analysis/section.hpp"

#include <Eigen/Core>

#include <cstddef>

namespace stepframe::analysis {

/// Stresses at one cross-section under internal forces (N, Vy, Vz, T, My, Mz).
struct SectionStress {
  double max_abs_normal = 0;  ///< largest |sigma| over the stress points [Pa]
  double shear = 0;           ///< |Vy|/Avy + |Vz|/Avz + torsional shear [Pa]
  double von_mises = 0;       ///< sqrt(max_abs_normal^2 + 3 shear^2) [Pa]
};

/// sigma = N/A + My z/Iy - Mz y/Iz at each of the section's stress points
/// (its convex-hull corners; the four corners +-width/2, +-depth/2 of the
/// bounding box when the section has none). Shear: the mean shear stress over
/// the shear areas (A when they are unknown) plus the torsional shear: thin
/// open sections T t_max / J (Roark, Table 10.1 / 10.7 thin-walled open
/// sections), rectangular hollow sections T / (2 A_m t) (Bredt's formula, A_m
/// enclosed by the wall's mid-line), circular tubes and bars T r / J (exact
/// for circular shafts); sections given by properties only: T / Wt with their
/// torsion modulus Wt, else T t_max / J with their thickest plate (thin open
/// section), else no torsional shear at all (nothing about the wall is known).
SectionStress section_stress(const Section& section, const Vector6d& forces);

/// Largest |sigma| over the stress points [Pa] (section_stress().max_abs_normal).
double max_fibre_stress(const Section& section, const Vector6d& forces);

/// Everything the recovery needs about one element.
struct ElementState {
  ElementProperties properties;
  const Section* section = nullptr;  ///< not owned
  Eigen::Matrix3d axes = Eigen::Matrix3d::Identity();  ///< rows: local x, y, z (global components)
  Eigen::Vector3d origin = Eigen::Vector3d::Zero();    ///< start node position, global [m]
  Vector12d end_displacements = Vector12d::Zero();     ///< the nodes' values, global axes, start then end
  LocalLoads loads;                                    ///< local axes
  /// cantilever_flexibility(properties) when worked out beforehand (not owned); null: worked out here.
  const CantileverFlexibility* flexibility = nullptr;
  EndReleases releases{};
  /// Second order: the element's stiffness includes the geometric stiffness
  /// of this axial force [N] and moments include N times the axis' lateral
  /// displacement from its start (P-delta).
  bool second_order = false;
  double axial_force = 0;
};

/// Forces and moments the two nodes exert on the element, local axes, start then end.
Vector12d element_end_actions(const ElementState& state);

/// How much of a line to recover.
enum class LineDetail {
  full,      ///< stations, exact diagram extremes, stresses and local deflection (the summary)
  summary,   ///< what full gives except the stations themselves (none are kept): the
             ///< LineSummary every member of every result keeps (solve.hpp), same values
  stations,  ///< the stations only (forces, displacements, stresses at each; end forces and
             ///< length): what pictures and VTK files read. The extremes, the
             ///< largest stresses between stations and the local deflection are left at zero.
  forces,    ///< the stations' positions and forces only (and end forces and length): what the
             ///< member checks read. Displacements, rotations and stresses are left at zero.
};

/// End forces, `stations` evenly spaced stations (both ends included, at
/// least 2) with their stresses and, in full, the exact diagram extremes, the
/// largest stresses (at the stations and at the extremes' candidate points)
/// and the largest deflection from the deformed chord (the highest stations,
/// refined by Brent's method).
LineResult recover_element(const ElementState& state, std::size_t stations, LineDetail detail = LineDetail::full);

}  // namespace stepframe::analysis
