#pragma once
// Sparse Cholesky factorisation of the reduced stiffness matrix (CHOLMOD,
// supernodal, fill-reducing ordering), checked for mechanisms.

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/solve.hpp"

#include <Eigen/Core>
#include <Eigen/SparseCholesky>
#include <Eigen/SparseCore>

#include <memory>
#include <string>
#include <vector>

namespace stepframe::analysis {

/// Relative pivot size below which a free direction counts as unrestrained:
/// a pivot D_ii <= pivot_tolerance * max_i K_ii (or D_ii <= 0) flags a mechanism.
inline constexpr double pivot_tolerance = 1e-9;

/// Floating-point operations (CHOLMOD's count) above which a factorisation
/// may widen OpenBLAS to the threads its caller offers: below it the
/// supernodes are too small for a second thread to pay (measured: the
/// 10,000-member bench frame, 7.9e9 flops, gained nothing).
inline constexpr double wide_factorisation_flops = 2e10;

/// Factorises the free-free stiffness once (CHOLMOD supernodal L L^T, ordered
/// by CHOLMOD's nested dissection (METIS separators) of the graph of the
/// nodes, each node's DOFs kept together) and then solves any number of
/// right-hand sides, several at once as the columns of a matrix. The pivots
/// (L_kk^2) are checked for mechanisms; when CHOLMOD stops on a non-positive
/// pivot, a simplicial L D L^T of the same matrix names the free directions.
class StiffnessFactor {
 public:
  /// Throws UnstableFrame naming each node and direction whose pivot vanishes
  /// (mapped back through the ordering); `nodes` gives the coordinates quoted in the message.
  /// A factorisation of more than `widen_above_flops` runs OpenBLAS on
  /// `offered_threads` threads when that is more than it runs on now, and sets it
  /// back afterwards (OpenBLAS' setting is the process's: a caller offers
  /// threads only when nothing else of its own computes meanwhile).
  StiffnessFactor(const Eigen::SparseMatrix<double>& k_free, const DofNumbering& dofs,
                  const std::vector<Eigen::Vector3d>& nodes, int offered_threads = 1,
                  double widen_above_flops = wide_factorisation_flops);

  StiffnessFactor(const StiffnessFactor&) = delete;
  StiffnessFactor& operator=(const StiffnessFactor&) = delete;

  ~StiffnessFactor();

  /// Solution of K_ff u = f (reduced numbering).
  Eigen::VectorXd solve(const Eigen::VectorXd& f_free) const;
  /// Solutions for every column of f (reduced numbering), in one pass.
  Eigen::MatrixXd solve(const Eigen::MatrixXd& f_free) const;

  /// Number of non-zeros of the factor L (fill-in included).
  double factor_nonzeros() const;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

/// The text UnstableFrame carries for the given free directions, e.g. "the frame is
/// unstable: node 3 at (1.000, 0.000, 3.500) m can move freely in rx; add a support
/// or a member that restrains it".
std::string instability_message(const std::vector<FreeDirection>& free, const std::vector<Eigen::Vector3d>& nodes);

}  // namespace stepframe::analysis
