#include "stepframe/analysis/stiffness_factor.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <string>

namespace stepframe::analysis {
namespace {

// Free directions whose pivot is non-positive or tiny. D is in the factor's
// (permuted) order; Pinv maps a permuted index back to the reduced index.
std::vector<FreeDirection> vanishing_pivots(const Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>, Eigen::Lower>& ldlt,
                                            double threshold, const DofNumbering& dofs) {
  const Eigen::VectorXd d = ldlt.vectorD();
  const auto& pinv = ldlt.permutationPinv().indices();
  std::vector<FreeDirection> free;
  for (Eigen::Index k = 0; k < d.size(); ++k) {
    if (d(k) > threshold && std::isfinite(d(k))) continue;
    const Eigen::Index reduced = pinv.size() > 0 ? static_cast<Eigen::Index>(pinv(k)) : k;
    const auto global = static_cast<std::size_t>(dofs.global_of_free[static_cast<std::size_t>(reduced)]);
    free.push_back(FreeDirection{global / 6, static_cast<int>(global % 6)});
  }
  std::sort(free.begin(), free.end(),
            [](const FreeDirection& a, const FreeDirection& b) { return a.node != b.node ? a.node < b.node : a.dof < b.dof; });
  return free;
}

}  // namespace

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

StiffnessFactor::StiffnessFactor(const Eigen::SparseMatrix<double>& k_free, const DofNumbering& dofs,
                                 const std::vector<Eigen::Vector3d>& nodes) {
  if (k_free.rows() == 0) return;  // every DOF is supported: nothing to factorise
  const double max_diagonal = k_free.diagonal().cwiseAbs().maxCoeff();
  const double threshold = pivot_tolerance * max_diagonal;

  ldlt_.compute(k_free);
  std::vector<FreeDirection> free;
  if (ldlt_.info() == Eigen::Success) {
    free = vanishing_pivots(ldlt_, threshold, dofs);
  } else {
    // An exactly zero pivot stops the factorisation. Factorise K + s I with a
    // shift s far below the threshold only to read off which pivots vanish.
    spdlog::debug("stiffness factorisation stopped on a zero pivot; locating the free directions");
    Eigen::SimplicialLDLT<Eigen::SparseMatrix<double>, Eigen::Lower> shifted;
    shifted.setShift(1e-3 * threshold);
    shifted.compute(k_free);
    if (shifted.info() == Eigen::Success) free = vanishing_pivots(shifted, threshold, dofs);
    if (free.empty())
      throw UnstableFrame("the frame is unstable: its stiffness matrix is singular; check the supports", {});
  }
  if (!free.empty()) {
    std::string message = instability_message(free, nodes);
    spdlog::debug("{}", message);
    throw UnstableFrame(message, std::move(free));
  }
  spdlog::debug("stiffness factorised: {} free DOFs, {} non-zeros", k_free.rows(), k_free.nonZeros());
}

Eigen::VectorXd StiffnessFactor::solve(const Eigen::VectorXd& f_free) const {
  if (f_free.size() == 0) return Eigen::VectorXd();
  return ldlt_.solve(f_free);
}

}  // namespace stepframe::analysis
