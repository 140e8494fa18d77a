#pragma once
// Global stiffness matrix of a frame model and its reduction to the free DOFs.
//
// Global DOF numbering: 6 per node in Dof order, global index = 6 * node + dof.

#include "stepframe/analysis/element_loads.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Core>
#include <Eigen/SparseCore>

#include <cstddef>
#include <vector>

namespace stepframe::analysis {

/// Index of a node's direction in the global DOF vector.
constexpr Eigen::Index global_dof(std::size_t node, int dof) {
  return static_cast<Eigen::Index>(6 * node) + dof;
}

/// Which global DOFs are free (not supported) and where they sit in the reduced system.
struct DofNumbering {
  std::vector<Eigen::Index> free_index;      ///< per global DOF: reduced index, or -1 when supported
  std::vector<Eigen::Index> global_of_free;  ///< per reduced index: its global DOF

  Eigen::Index free_count() const { return static_cast<Eigen::Index>(global_of_free.size()); }
  bool is_free(Eigen::Index global) const { return free_index[static_cast<std::size_t>(global)] >= 0; }
};

/// Numbers the free DOFs in global order; a DOF is supported when any support
/// of its node fixes it.
DofNumbering number_dofs(const FrameModel& model);

/// An element's stiffness and the nodal loads equivalent to its member loads,
/// global axes, with its releases condensed out (element_releases.hpp) and,
/// when the model asks for it, shear deformation. With `axial_force` the
/// geometric stiffness of that force is included (second order).
struct ElementSystem {
  Matrix12d k = Matrix12d::Zero();        ///< T^T k* T
  Vector12d loads = Vector12d::Zero();    ///< -T^T f0*: the equivalent nodal loads
};
ElementSystem element_system(const FrameModel& model, std::size_t element, const LocalLoads& loads,
                             const double* axial_force = nullptr);

/// Full global stiffness (6 * nodes square), summed from the elements' T^T k T
/// through triplets, plus the supports' springs at their unfixed DOFs. With
/// `axial_forces` (one per element, tension > 0) the geometric stiffness is
/// included. The model must be valid (see validate_model).
Eigen::SparseMatrix<double> assemble_stiffness(const FrameModel& model, const std::vector<double>* axial_forces = nullptr);

/// A rotation at a node that nothing resists because every member end there
/// is released in it (e.g. a pin where only pin-ended members meet).
struct RotationTie {
  std::size_t node = 0;
  Eigen::Vector3d axis = Eigen::Vector3d::Zero();  ///< unit, global
};

/// Finds the node rotations whose stiffness vanishes at free DOFs of nodes
/// reached by a member and ties each with a stiffness s axis axis^T (s = the
/// largest rotational diagonal term), which only fixes the otherwise
/// arbitrary rotation of the node itself: no member end takes a moment there.
std::vector<RotationTie> tie_released_rotations(Eigen::SparseMatrix<double>& k_full, const DofNumbering& dofs,
                                                const FrameModel& model);

/// The free-free block of a full global matrix, in reduced numbering.
Eigen::SparseMatrix<double> free_block(const Eigen::SparseMatrix<double>& full, const DofNumbering& dofs);

/// The free entries of a full global vector, in reduced numbering.
Eigen::VectorXd free_part(const Eigen::VectorXd& full, const DofNumbering& dofs);

/// Full global vector with the reduced values at the free DOFs and zero at the supported ones.
Eigen::VectorXd expand_free(const Eigen::VectorXd& reduced, const DofNumbering& dofs);

}  // namespace stepframe::analysis
