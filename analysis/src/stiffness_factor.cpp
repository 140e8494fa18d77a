#include "stepframe/analysis/stiffness_factor.hpp"

#include <Eigen/CholmodSupport>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <string>

namespace stepframe::analysis {
namespace {

using Sparse = Eigen::SparseMatrix<double>;

// CHOLMOD's supernodal L L^T with access to its factor, to read the pivots.
class Supernodal : public Eigen::CholmodSupernodalLLT<Sparse, Eigen::Lower> {
 public:
  const cholmod_factor* factor() const { return m_cholmodFactor; }
};

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
  Supernodal llt;
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

StiffnessFactor::StiffnessFactor(const Sparse& k_free, const DofNumbering& dofs, const std::vector<Eigen::Vector3d>& nodes)
    : impl_(std::make_unique<Impl>()) {
  if (k_free.rows() == 0) return;  // every DOF is supported: nothing to factorise
  const double max_diagonal = k_free.diagonal().cwiseAbs().maxCoeff();
  const double threshold = pivot_tolerance * max_diagonal;

  Supernodal& llt = impl_->llt;
  llt.cholmod().print = 0;  // CHOLMOD reports a non-positive pivot through its status; we report it ourselves
  llt.cholmod().supernodal = CHOLMOD_SUPERNODAL;
  llt.compute(k_free);
  std::vector<FreeDirection> free;
  if (llt.info() == Eigen::Success) {
    free = small_pivots(llt.factor(), threshold, dofs);
  } else {
    spdlog::debug("stiffness factorisation met a non-positive pivot; locating the free directions");
    free = diagnose(k_free, threshold, dofs);
    if (free.empty())
      throw UnstableFrame("the frame is unstable: its stiffness matrix is singular; check the supports", {});
  }
  if (!free.empty()) {
    std::string message = instability_message(free, nodes);
    spdlog::debug("{}", message);
    throw UnstableFrame(message, std::move(free));
  }
  spdlog::debug("stiffness factorised (CHOLMOD supernodal): {} free DOFs, {} non-zeros, {:.0f} in the factor",
                k_free.rows(), k_free.nonZeros(), factor_nonzeros());
}

StiffnessFactor::~StiffnessFactor() = default;

double StiffnessFactor::factor_nonzeros() const {
  const cholmod_factor* L = impl_->llt.factor();
  if (!L) return 0;
  if (L->is_super) return static_cast<double>(L->xsize);
  return static_cast<double>(L->nzmax);
}

Eigen::VectorXd StiffnessFactor::solve(const Eigen::VectorXd& f_free) const {
  if (f_free.size() == 0) return Eigen::VectorXd();
  return impl_->llt.solve(f_free);
}

Eigen::MatrixXd StiffnessFactor::solve(const Eigen::MatrixXd& f_free) const {
  if (f_free.rows() == 0) return Eigen::MatrixXd(0, f_free.cols());
  return impl_->llt.solve(f_free);
}

}  // namespace stepframe::analysis
