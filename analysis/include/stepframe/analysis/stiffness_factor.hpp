#pragma once
// Sparse LDL^T factorisation of the reduced stiffness matrix, checked for mechanisms.

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/solve.hpp"

#include <Eigen/Core>
#include <Eigen/SparseCholesky>
#include <Eigen/SparseCore>

#include <string>
#include <vector>

namespace stepframe::analysis {

/// Relative pivot size below which a free direction counts as unrestrained:
/// a pivot D_ii <= pivot_tolerance * max_i K_ii (or D_ii <= 0) flags a mechanism.
inline constexpr double pivot_tolerance = 1e-9;

/// Factorises the free-free stiffness once (fill-reducing AMD ordering) and
/// then solves any number of right-hand sides.
class StiffnessFactor {
 public:
  /// Throws UnstableFrame naming each node and direction whose pivot vanishes
  /// (mapped back through the ordering); `nodes` gives the coordinates quoted in the message.
  StiffnessFactor(const Eigen::SparseMatrix<double>& k_free, const DofNumbering& dofs,
                  const std::vector<Eigen::Vector3d>& nodes);

  StiffnessFactor(const StiffnessFactor&) = delete;
  StiffnessFactor& operator=(const StiffnessFactor&) = delete;

  /// Solution of K_ff u = f (reduced numbering).
  Eigen::VectorXd solve(const Eigen::VectorXd& f_free) const;

 private:
  Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>, Eigen::Lower> ldlt_;
};

/// The text UnstableFrame carries for the given free directions, e.g. "the frame is
/// unstable: node 3 at (1.000, 0.000, 3.500) m can move freely in rx; add a support
/// or a member that restrains it".
std::string instability_message(const std::vector<FreeDirection>& free, const std::vector<Eigen::Vector3d>& nodes);

}  // namespace stepframe::analysis
