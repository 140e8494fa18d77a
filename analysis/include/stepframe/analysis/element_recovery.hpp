#pragma once
// Results along one member from its end displacements and its uniform load.
//
// Internal forces follow results.hpp: actions of the part beyond the cut on the
// part before it, local axes, N > 0 tension. Between the nodes they are exact
// for a uniform load (statics of the free body [0, x]); the deflected axis is
// exact too (Hermite cubics of the end values plus the fixed-end particular solution).

#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/analysis/section.hpp"

#include <Eigen/Core>

#include <cstddef>

namespace stepframe::analysis {

/// Internal forces (N, Vy, Vz, T, My, Mz) at distance x from the start, given
/// the local end forces of member_end_forces and the local uniform load q.
Vector6d internal_forces_at(const Vector12d& end_forces_local, const Eigen::Vector3d& q_local, double x);

/// Translation of the member axis at distance x from the start, local axes,
/// from the local end displacements and the local uniform load q.
Eigen::Vector3d axis_displacement_at(const ElementProperties& p, const Vector12d& u_local,
                                     const Eigen::Vector3d& q_local, double x);

/// Largest |sigma| over the four extreme fibre corners (y = +-width/2,
/// z = +-depth/2): |N|/A + |My|/Wy + |Mz|/Wz [Pa].
double max_fibre_stress(const Section& section, const Vector6d& forces);

/// Everything the recovery needs about one member.
struct ElementState {
  ElementProperties properties;
  Section section;
  Eigen::Matrix3d axes = Eigen::Matrix3d::Identity();  ///< rows: local x, y, z (global components)
  Eigen::Vector3d origin = Eigen::Vector3d::Zero();    ///< start node position, global [m]
  Vector12d end_displacements = Vector12d::Zero();     ///< global axes, start node then end node
  Eigen::Vector3d q_local = Eigen::Vector3d::Zero();   ///< uniform load, local axes [N/m]
};

/// End forces, `stations` evenly spaced stations (both ends included, at least
/// 2), stresses and the largest deflection from the deformed chord.
LineResult recover_element(const ElementState& state, std::size_t stations);

}  // namespace stepframe::analysis
