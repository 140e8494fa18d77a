#pragma once
// Consistent mass matrix of the 12-DOF frame element and of a frame model.
//
// The element's mass follows from the same shape functions as its stiffness
// (linear axial and torsional, cubic Hermite bending): Przemieniecki, Theory
// of Matrix Structural Analysis (1968), ch. 11, eq. 11.42. Rotary inertia of
// the cross-section in bending is left out (Euler-Bernoulli). Released ends
// are condensed with the element's static condensation (Guyan 1965; the
// shapes of the released element), so the mass matches the stiffness.
// Global DOF numbering as in assembly.hpp.

#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/SparseCore>

#include <vector>

namespace stepframe::analysis {

/// Mass per length [kg/m] and polar mass moment of inertia per length [kg m]
/// of an element (its section's density A and density (Iy + Iz), plus any added mass).
struct ElementMass {
  double per_length = 0;  ///< m = rho A (+ added) [kg/m]
  double polar = 0;       ///< rho Ip = rho (Iy + Iz) [kg m]: torsional inertia
};

/// Local consistent mass (local axes, Dof order per node, signs as local_stiffness:
/// rz = dv/dx, ry = -dw/dx).
Matrix12d local_consistent_mass(const ElementMass& mass, double length);

/// What a frame's mass is made of besides its members' own material.
struct AddedMass {
  std::vector<double> per_length;  ///< per element, [kg/m], distributed over it (empty: none)
  std::vector<double> at_node;     ///< per node, [kg], a point mass in every translation (empty: none)
};

/// Full global mass matrix (6 * nodes square): every element's consistent
/// mass of its material (density A, density Ip) and added mass, T^T m T,
/// condensed at released ends, plus point masses on the nodes' translations.
Eigen::SparseMatrix<double> assemble_mass(const FrameModel& model, const AddedMass& added = {});

}  // namespace stepframe::analysis
