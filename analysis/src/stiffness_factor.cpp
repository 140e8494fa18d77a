#include "stepframe/analysis/stiffness_factor.hpp"

#include "stepframe/analysis/blas_info.hpp"

#include <cholmod.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <mutex>
#include <stdexcept>
#include <string>

namespace stepframe::analysis {
namespace {

using Sparse = Eigen::SparseMatrix<double>;

// A CHOLMOD view of a compressed column-major sparse matrix (lower triangle
// used) or of a dense matrix: no copies.
cholmod_sparse view_of(const Sparse& a) {
  cholmod_sparse v{};
  v.nrow = v.ncol = static_cast<std::size_t>(a.rows());
  v.nzmax = static_cast<std::size_t>(a.nonZeros());
  v.p = const_cast<int*>(a.outerIndexPtr());
  v.i = const_cast<int*>(a.innerIndexPtr());
  v.x = const_cast<double*>(a.valuePtr());
  v.stype = -1;
  v.itype = CHOLMOD_INT;
  v.xtype = CHOLMOD_REAL;
  v.dtype = CHOLMOD_DOUBLE;
  v.sorted = 1;
  v.packed = 1;
  return v;
}

cholmod_dense view_of(const Eigen::MatrixXd& b) {
  cholmod_dense v{};
  v.nrow = static_cast<std::size_t>(b.rows());
  v.ncol = static_cast<std::size_t>(b.cols());
  v.nzmax = v.nrow * v.ncol;
  v.d = v.nrow;
  v.x = const_cast<double*>(b.data());
  v.xtype = CHOLMOD_REAL;
  v.dtype = CHOLMOD_DOUBLE;
  return v;
}

// Fill-reducing ordering of the reduced stiffness, computed on the graph of
// its nodes (the free DOFs of a node share one sparsity pattern) and expanded
// to their DOFs: nested dissection on a graph 36 times smaller than the DOF
// graph costs little and gives less fill than minimum degree on a frame in 3D.
// CHOLMOD's own nested dissection (METIS node separators, Karypis & Kumar,
// SIAM J. Sci. Comput. 20(1), 1998, then constrained minimum degree within
// them; Chen, Davis, Hager & Rajamanickam, ACM TOMS 35(3), 2008, from memory)
// leaves 10% less fill than METIS's own ordering on the 100k bench frame
// (255 against 284 million entries, 6.0e11 against 6.7e11 flops) and 9% less
// on the 1k one.
std::vector<int> node_ordering(const Sparse& k_free, const DofNumbering& dofs, cholmod_common& common) {
  const auto n = static_cast<std::size_t>(k_free.rows());
  // Nodes with free DOFs, numbered in order, and the node of each DOF.
  std::vector<int> node_of(n), first_dof;
  for (std::size_t i = 0; i < n; ++i) {
    const auto node = static_cast<std::size_t>(dofs.global_of_free[i] / 6);
    if (first_dof.empty() || static_cast<std::size_t>(dofs.global_of_free[static_cast<std::size_t>(first_dof.back())] / 6) != node)
      first_dof.push_back(static_cast<int>(i));
    node_of[i] = static_cast<int>(first_dof.size() - 1);
  }
  const auto nodes = first_dof.size();
  first_dof.push_back(static_cast<int>(n));
  // The node graph's lower triangle, column by column (one entry per node pair).
  std::vector<Eigen::Triplet<double>> pairs;
  pairs.reserve(static_cast<std::size_t>(k_free.nonZeros()) / 18 + nodes);
  for (Eigen::Index col = 0; col < k_free.outerSize(); ++col)
    for (Sparse::InnerIterator it(k_free, col); it; ++it)
      if (node_of[static_cast<std::size_t>(it.row())] >= node_of[static_cast<std::size_t>(col)])
        pairs.emplace_back(node_of[static_cast<std::size_t>(it.row())], node_of[static_cast<std::size_t>(col)], 1.0);
  Sparse graph(static_cast<Eigen::Index>(nodes), static_cast<Eigen::Index>(nodes));
  graph.setFromTriplets(pairs.begin(), pairs.end(), [](double a, double) { return a; });
  graph.makeCompressed();
  cholmod_sparse g = view_of(graph);
  g.xtype = CHOLMOD_PATTERN;
  std::vector<int> node_perm(nodes);
  std::vector<int> component_parent(nodes), component_of(nodes);
  if (cholmod_nested_dissection(&g, nullptr, 0, node_perm.data(), component_parent.data(), component_of.data(),
                                &common) < 0)
    cholmod_amd(&g, nullptr, 0, node_perm.data(), &common);
  std::vector<int> perm;
  perm.reserve(n);
  for (int node : node_perm)
    for (int d = first_dof[static_cast<std::size_t>(node)]; d < first_dof[static_cast<std::size_t>(node) + 1]; ++d) perm.push_back(d);
  return perm;
}

FreeDirection direction_of(Eigen::Index reduced, const DofNumbering& dofs) {
  const auto global = static_cast<std::size_t>(dofs.global_of_free[static_cast<std::size_t>(reduced)]);
  return FreeDirection{global / 6, static_cast<int>(global % 6)};
}

void sort_directions(std::vector<FreeDirection>& free) {
  std::sort(free.begin(), free.end(),
            [](const FreeDirection& a, const FreeDirection& b) { return a.node != b.node ? a.node < b.node : a.dof < b.dof; });
}

// Pivots D_kk = L_kk^2 of a CHOLMOD factor, with the reduced index of each
// (L->Perm maps the factor's order to the matrix's).
std::vector<FreeDirection> small_pivots(const cholmod_factor* L, double threshold, const DofNumbering& dofs) {
  std::vector<FreeDirection> free;
  const auto* perm = static_cast<const int*>(L->Perm);
  const auto* x = static_cast<const double*>(L->x);
  auto check = [&](std::size_t k, double lkk) {
    if (lkk * lkk > threshold && std::isfinite(lkk)) return;
    free.push_back(direction_of(perm ? perm[k] : static_cast<Eigen::Index>(k), dofs));
  };
  if (L->is_super) {
    const auto* super = static_cast<const int*>(L->super);
    const auto* pi = static_cast<const int*>(L->pi);
    const auto* px = static_cast<const int*>(L->px);
    for (std::size_t s = 0; s < L->nsuper; ++s) {
      const int k1 = super[s], k2 = super[s + 1];
      const int nsrow = pi[s + 1] - pi[s];
      for (int j = 0; j < k2 - k1; ++j) check(static_cast<std::size_t>(k1 + j), x[px[s] + j * nsrow + j]);
    }
  } else {
    const auto* p = static_cast<const int*>(L->p);
    for (std::size_t k = 0; k < L->n; ++k) check(k, x[p[k]]);
  }
  sort_directions(free);
  return free;
}

// Free directions whose LDL^T pivot is non-positive or tiny. D is in the
// factor's (permuted) order; Pinv maps a permuted index back to the reduced index.
std::vector<FreeDirection> vanishing_pivots(const Eigen::SimplicialLDLT<Sparse, Eigen::Lower>& ldlt, double threshold,
                                            const DofNumbering& dofs) {
  const Eigen::VectorXd d = ldlt.vectorD();
  const auto& pinv = ldlt.permutationPinv().indices();
  std::vector<FreeDirection> free;
  for (Eigen::Index k = 0; k < d.size(); ++k) {
    if (d(k) > threshold && std::isfinite(d(k))) continue;
    free.push_back(direction_of(pinv.size() > 0 ? static_cast<Eigen::Index>(pinv(k)) : k, dofs));
  }
  sort_directions(free);
  return free;
}

// Diagnosis when CHOLMOD met a non-positive pivot: an LDL^T goes on past it,
// or, on an exactly zero pivot, a tiny shift far below the threshold lets it.
std::vector<FreeDirection> diagnose(const Sparse& k_free, double threshold, const DofNumbering& dofs) {
  Eigen::SimplicialLDLT<Sparse, Eigen::Lower> ldlt(k_free);
  if (ldlt.info() == Eigen::Success) return vanishing_pivots(ldlt, threshold, dofs);
  Eigen::SimplicialLDLT<Sparse, Eigen::Lower> shifted;
  shifted.setShift(1e-3 * threshold);
  shifted.compute(k_free);
  if (shifted.info() == Eigen::Success) return vanishing_pivots(shifted, threshold, dofs);
  return {};
}

}  // namespace

struct StiffnessFactor::Impl {
  cholmod_common common{};
  cholmod_factor* factor = nullptr;
  std::mutex solving;
  Impl() { cholmod_start(&common); }
  ~Impl() {
    if (factor) cholmod_free_factor(&factor, &common);
    cholmod_finish(&common);
  }
  Impl(const Impl&) = delete;
  Impl& operator=(const Impl&) = delete;
};

std::string instability_message(const std::vector<FreeDirection>& free, const std::vector<Eigen::Vector3d>& nodes) {
  constexpr std::size_t listed_nodes = 8;  // keep the message readable on large mechanisms
  std::string message = "the frame is unstable: ";
  std::size_t nodes_listed = 0, i = 0;
  while (i < free.size() && nodes_listed < listed_nodes) {
    // One clause per node, naming all of its free directions.
    const std::size_t node = free[i].node;
    const Eigen::Vector3d p = node < nodes.size() ? nodes[node] : Eigen::Vector3d::Zero();
    char buffer[128];
    std::snprintf(buffer, sizeof buffer, "%snode %zu at (%.3f, %.3f, %.3f) m can move freely in ",
                  nodes_listed ? "; " : "", node, p.x(), p.y(), p.z());
    message += buffer;
    for (bool first = true; i < free.size() && free[i].node == node; ++i, first = false) {
      if (!first) message += ", ";
      message += dof_names[static_cast<std::size_t>(free[i].dof)];
    }
    ++nodes_listed;
  }
  if (i < free.size()) message += "; and " + std::to_string(free.size() - i) + " more free direction(s)";
  message += free.size() == 1 ? "; add a support or a member that restrains it"
                              : "; add supports or members that restrain them";
  return message;
}

StiffnessFactor::StiffnessFactor(const Sparse& k_free, const DofNumbering& dofs, const std::vector<Eigen::Vector3d>& nodes,
                                 int offered_threads, double widen_above_flops)
    : impl_(std::make_unique<Impl>()) {
  if (k_free.rows() == 0) return;  // every DOF is supported: nothing to factorise
  const double max_diagonal = k_free.diagonal().cwiseAbs().maxCoeff();
  const double threshold = pivot_tolerance * max_diagonal;

  cholmod_common& common = impl_->common;
  common.print = 0;  // CHOLMOD reports a non-positive pivot through its status; we report it ourselves
  common.supernodal = CHOLMOD_SUPERNODAL;
  common.nmethods = 1;
  common.method[0].ordering = CHOLMOD_GIVEN;
  common.postorder = 1;
  std::vector<int> perm = node_ordering(k_free, dofs, common);
  // CHOLMOD reads the lower triangle only (stype -1) of a compressed matrix.
  const Sparse compressed = k_free.isCompressed() ? Sparse() : Sparse(k_free);
  cholmod_sparse a = view_of(k_free.isCompressed() ? k_free : compressed);
  impl_->factor = cholmod_analyze_p(&a, perm.data(), nullptr, 0, &common);
  if (!impl_->factor) throw std::runtime_error("CHOLMOD could not analyse the stiffness matrix (out of memory?)");
  // The analysis counts the factorisation's flops (common.fl): a large one spends nearly all its time in
  // the dense kernels of its largest supernodes, which run on more threads where the caller offers them.
  const int threads_before = blas_threads();
  const bool widen = offered_threads > threads_before && common.fl > widen_above_flops;
  if (widen) {
    // OpenBLAS on more threads sums in another order: the results' last digits can move with the load
    // that decided the threads. Said where a user reads it.
    spdlog::info("factorising on {} BLAS threads ({:.3g} flops): the results' last digits can differ from a run "
                 "on a busier machine; OPENBLAS_NUM_THREADS=1 keeps them the same",
                 offered_threads, common.fl);
    set_blas_threads(offered_threads);
  }
  cholmod_factorize(&a, impl_->factor, &common);
  if (widen) set_blas_threads(threads_before);
  std::vector<FreeDirection> free;
  if (common.status == CHOLMOD_OK) {
    free = small_pivots(impl_->factor, threshold, dofs);
  } else if (common.status == CHOLMOD_NOT_POSDEF) {
    spdlog::debug("stiffness factorisation met a non-positive pivot; locating the free directions");
    free = diagnose(k_free, threshold, dofs);
    if (free.empty())
      throw UnstableFrame("the frame is unstable: its stiffness matrix is singular; check the supports", {});
  } else {
    throw std::runtime_error("CHOLMOD could not factorise the stiffness matrix (status " + std::to_string(common.status) +
                             "; out of memory?)");
  }
  if (!free.empty()) {
    std::string message = instability_message(free, nodes);
    spdlog::debug("{}", message);
    throw UnstableFrame(message, std::move(free));
  }
  spdlog::debug("stiffness factorised (CHOLMOD supernodal, node-graph nested dissection): {} free DOFs, {} non-zeros, "
                "{:.0f} in the factor, {:.3g} flops",
                k_free.rows(), k_free.nonZeros(), factor_nonzeros(), common.fl);
}

StiffnessFactor::~StiffnessFactor() = default;

double StiffnessFactor::factor_nonzeros() const {
  const cholmod_factor* L = impl_->factor;
  if (!L) return 0;
  if (L->is_super) return static_cast<double>(L->xsize);
  return static_cast<double>(L->nzmax);
}

Eigen::VectorXd StiffnessFactor::solve(const Eigen::VectorXd& f_free) const {
  if (f_free.size() == 0) return Eigen::VectorXd();
  return solve(Eigen::MatrixXd(f_free)).col(0);
}

Eigen::MatrixXd StiffnessFactor::solve(const Eigen::MatrixXd& f_free) const {
  if (f_free.rows() == 0) return Eigen::MatrixXd(0, f_free.cols());
  cholmod_dense b = view_of(f_free);
  // cholmod_solve allocates through the common, which is not safe from several threads at once.
  const std::lock_guard<std::mutex> lock(impl_->solving);
  cholmod_dense* x = cholmod_solve(CHOLMOD_A, impl_->factor, &b, &impl_->common);
  if (!x) throw std::runtime_error("CHOLMOD could not solve (out of memory?)");
  Eigen::MatrixXd out = Eigen::Map<const Eigen::MatrixXd>(static_cast<const double*>(x->x), f_free.rows(), f_free.cols());
  cholmod_free_dense(&x, &impl_->common);
  return out;
}

}  // namespace stepframe::analysis
