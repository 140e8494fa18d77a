#include "stepframe/analysis/buckling.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <Spectra/MatOp/SparseSymMatProd.h>
#include <Spectra/SymGEigsSolver.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <array>
#include <cmath>
#include <exception>
#include <numbers>

namespace stepframe::analysis {
namespace {

using Sparse = Eigen::SparseMatrix<double>;

// B = K for Spectra's regular-inverse mode: y = K x and y = K^-1 x through CHOLMOD.
class StiffnessOp {
 public:
  using Scalar = double;
  StiffnessOp(const Sparse& k, const StiffnessFactor& factor) : k_(k), factor_(factor) {}
  Eigen::Index rows() const { return k_.rows(); }
  Eigen::Index cols() const { return k_.cols(); }
  void solve(const double* x_in, double* y_out) const {
    Eigen::Map<Eigen::VectorXd>(y_out, rows()) = factor_.solve(Eigen::VectorXd(Eigen::Map<const Eigen::VectorXd>(x_in, rows())));
  }
  void perform_op(const double* x_in, double* y_out) const {
    Eigen::Map<Eigen::VectorXd>(y_out, rows()) = k_ * Eigen::Map<const Eigen::VectorXd>(x_in, rows());
  }

 private:
  const Sparse& k_;
  const StiffnessFactor& factor_;
};

}  // namespace

std::vector<BucklingMode> buckling_modes(const FrameModel& model, const AxialForce& axial,
                                         const BucklingOptions& options) {
  const std::size_t n_sub = std::max<std::size_t>(1, options.subdivisions);
  // The subdivided model: original nodes first, then n_sub - 1 inner nodes per element.
  FrameModel sub;
  sub.settings = model.settings;
  sub.nodes = model.nodes;
  sub.sections = model.sections;
  sub.materials = model.materials;
  sub.supports = model.supports;
  std::vector<double> forces;
  std::vector<std::vector<std::size_t>> element_points(model.elements.size());
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const FrameElement& el = model.elements[e];
    const Eigen::Vector3d a = model.nodes[el.nodes[0]], b = model.nodes[el.nodes[1]];
    const double L = (b - a).norm();
    std::vector<std::size_t>& points = element_points[e];
    points.push_back(el.nodes[0]);
    for (std::size_t k = 1; k < n_sub; ++k) {
      points.push_back(sub.nodes.size());
      sub.nodes.push_back(a + (b - a) * (static_cast<double>(k) / static_cast<double>(n_sub)));
    }
    points.push_back(el.nodes[1]);
    for (std::size_t k = 0; k < n_sub; ++k) {
      FrameElement part = el;
      part.nodes = {points[k], points[k + 1]};
      part.releases = {};
      if (k == 0) part.releases[0] = el.releases[0];
      if (k + 1 == n_sub) part.releases[1] = el.releases[1];
      sub.elements.push_back(part);
      // Axial force at the part's midpoint: exact for a constant force, and
      // the midpoint rule of a varying one (self weight in a column).
      forces.push_back(axial(e, L * (static_cast<double>(k) + 0.5) / static_cast<double>(n_sub)));
    }
  }
  // Nothing to find when no element is compressed beyond rounding: at most
  // 1e-9 of its own Euler load pi^2 E I_min / l^2 (l = the part's length).
  bool compressed = false;
  for (std::size_t e = 0; e < sub.elements.size() && !compressed; ++e) {
    const FrameElement& el = sub.elements[e];
    const double l = (sub.nodes[el.nodes[1]] - sub.nodes[el.nodes[0]]).norm();
    const Section& s = sub.sections[el.section];
    const double euler = std::numbers::pi * std::numbers::pi * sub.materials[el.material].E * std::min(s.Iy, s.Iz) / (l * l);
    compressed = -forces[e] > 1e-9 * euler;
  }
  if (!compressed) return {};

  const DofNumbering dofs = number_dofs(sub);
  Sparse k_full = assemble_stiffness(sub);
  tie_released_rotations(k_full, dofs, sub);
  const Sparse k_free = free_block(k_full, dofs);
  // Geometric stiffness alone: the total of k + kg minus k, per element.
  std::vector<Eigen::Triplet<double>> triplets;
  for (std::size_t e = 0; e < sub.elements.size(); ++e) {
    const FrameElement& el = sub.elements[e];
    // Global geometric stiffness: T^T kg T; for a part with a released end,
    // the condensed k + kg minus the condensed k (first order in kg, which is
    // small for a part 1/subdivisions long).
    const Matrix12d kg = element_system(sub, e, {}, &forces[e]).k - element_system(sub, e, {}).k;
    for (int i = 0; i < 12; ++i)
      for (int j = 0; j < 12; ++j) {
        const double v = -kg(i, j);  // B = -Kg
        if (v == 0.0) continue;
        triplets.emplace_back(global_dof(el.nodes[static_cast<std::size_t>(i / 6)], i % 6),
                              global_dof(el.nodes[static_cast<std::size_t>(j / 6)], j % 6), v);
      }
  }
  Sparse g_full(k_full.rows(), k_full.cols());
  g_full.setFromTriplets(triplets.begin(), triplets.end());
  const Sparse g_free = free_block(g_full, dofs);

  const Eigen::Index n = k_free.rows();
  if (n < 2) return {};
  const StiffnessFactor factor(k_free, dofs, sub.nodes);
  StiffnessOp b_op(k_free, factor);
  Spectra::SparseSymMatProd<double> a_op(g_free);
  const auto nev = static_cast<Eigen::Index>(std::min<std::size_t>(options.modes, static_cast<std::size_t>(n - 1)));
  const Eigen::Index ncv = std::min<Eigen::Index>(n, std::max<Eigen::Index>(2 * nev + 1, 20));
  Spectra::SymGEigsSolver<Spectra::SparseSymMatProd<double>, StiffnessOp, Spectra::GEigsMode::RegularInverse> solver(
      a_op, b_op, nev, ncv);
  try {
    solver.init();
    solver.compute(Spectra::SortRule::LargestAlge, 1000, 1e-10);
  } catch (const std::exception& e) {
    spdlog::warn("the buckling eigenvalue solver failed ({}); alpha_cr is not available", e.what());
    return {};
  }
  if (solver.info() != Spectra::CompInfo::Successful) {
    spdlog::warn("the buckling eigenvalue solver did not converge; alpha_cr is not available");
    return {};
  }
  const Eigen::VectorXd mu = solver.eigenvalues();
  const Eigen::MatrixXd vectors = solver.eigenvectors();
  std::vector<BucklingMode> modes;
  for (Eigen::Index i = 0; i < mu.size(); ++i) {
    if (!(mu(i) > 0)) continue;
    BucklingMode mode;
    mode.alpha = 1.0 / mu(i);
    const Eigen::VectorXd full = expand_free(vectors.col(i), dofs);
    double largest = 0;
    for (std::size_t p = 0; p < sub.nodes.size(); ++p)
      largest = std::max(largest, full.segment<3>(global_dof(p, ux)).norm());
    const double scale = largest > 0 ? 1.0 / largest : 1.0;
    mode.displacements = scale * full.head(static_cast<Eigen::Index>(6 * model.nodes.size()));
    for (const auto& points : element_points) {
      std::vector<Eigen::Vector3d> shape;
      for (std::size_t p : points) shape.emplace_back(scale * full.segment<3>(global_dof(p, ux)));
      mode.element_points.push_back(std::move(shape));
    }
    modes.push_back(std::move(mode));
  }
  std::sort(modes.begin(), modes.end(), [](const BucklingMode& a, const BucklingMode& b) { return a.alpha < b.alpha; });
  return modes;
}

}  // namespace stepframe::analysis
