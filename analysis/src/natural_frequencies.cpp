#include "stepframe/analysis/natural_frequencies.hpp"

#include "divided_model.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <Eigen/Cholesky>
#include <Eigen/Eigenvalues>
#include <Spectra/MatOp/SparseSymMatProd.h>
#include <Spectra/SymGEigsShiftSolver.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>

namespace stepframe::analysis {
namespace {

// K^-1 x through the CHOLMOD factor: Spectra's (A - sigma B)^-1 for sigma = 0.
struct InverseStiffness {
  using Scalar = double;
  const StiffnessFactor& factor;
  Eigen::Index n;
  Eigen::Index rows() const { return n; }
  Eigen::Index cols() const { return n; }
  void set_shift(double sigma) {
    if (sigma != 0.0) throw std::logic_error("InverseStiffness: only the shift 0 is factorised");
  }
  void perform_op(const double* x_in, double* y_out) const {
    Eigen::Map<Eigen::VectorXd>(y_out, n) = factor.solve(Eigen::VectorXd(Eigen::Map<const Eigen::VectorXd>(x_in, n)));
  }
};

struct Eigenpairs {
  Eigen::VectorXd omega2;   // ascending
  Eigen::MatrixXd vectors;  // columns, free numbering
};

// Dense: K = L L^T, C = L^-1 M L^-T, C y = mu y with mu = 1 / omega^2, phi = L^-T y.
Eigenpairs dense_pairs(const Eigen::SparseMatrix<double>& k, const Eigen::SparseMatrix<double>& m, std::size_t modes) {
  const Eigen::LLT<Eigen::MatrixXd> llt{Eigen::MatrixXd(k)};
  if (llt.info() != Eigen::Success) throw std::runtime_error("the stiffness matrix is not positive definite");
  const Eigen::MatrixXd lm = llt.matrixL().solve(Eigen::MatrixXd(m));
  Eigen::MatrixXd c = llt.matrixL().solve(lm.transpose());
  c = 0.5 * (c + c.transpose()).eval();
  const Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> es(c);
  Eigenpairs out;
  std::vector<Eigen::Index> kept;  // largest mu first; mu = 0 belongs to massless directions
  const double largest = es.eigenvalues().cwiseAbs().maxCoeff();
  for (Eigen::Index i = es.eigenvalues().size() - 1; i >= 0 && kept.size() < modes; --i)
    if (es.eigenvalues()(i) > 1e-12 * largest) kept.push_back(i);
  out.omega2.resize(static_cast<Eigen::Index>(kept.size()));
  out.vectors.resize(k.rows(), static_cast<Eigen::Index>(kept.size()));
  for (std::size_t j = 0; j < kept.size(); ++j) {
    out.omega2(static_cast<Eigen::Index>(j)) = 1.0 / es.eigenvalues()(kept[j]);
    out.vectors.col(static_cast<Eigen::Index>(j)) = llt.matrixU().solve(es.eigenvectors().col(kept[j]));
  }
  return out;
}

Eigenpairs lanczos_pairs(const Eigen::SparseMatrix<double>& m, const StiffnessFactor& factor, std::size_t modes,
                         double tolerance) {
  const Eigen::Index n = m.rows();
  InverseStiffness op{factor, n};
  Spectra::SparseSymMatProd<double> b_op(m);
  const auto nev = static_cast<Eigen::Index>(std::min<std::size_t>(modes, static_cast<std::size_t>(n - 1)));
  const Eigen::Index ncv = std::min<Eigen::Index>(n, std::max<Eigen::Index>(2 * nev + 1, 20));
  Spectra::SymGEigsShiftSolver<InverseStiffness, Spectra::SparseSymMatProd<double>, Spectra::GEigsMode::ShiftInvert>
      solver(op, b_op, nev, ncv, 0.0);
  solver.init();
  solver.compute(Spectra::SortRule::LargestMagn, 1000, tolerance);
  if (solver.info() != Spectra::CompInfo::Successful)
    throw std::runtime_error("the eigenvalue solver for natural frequencies did not converge");
  spdlog::debug("natural frequencies: {} DOFs, {} Lanczos restarts, {} operator products", n, solver.num_iterations(),
                solver.num_operations());
  // Spectra returns omega^2 in the order of nu = 1 / omega^2 descending: lowest omega first.
  Eigenpairs out{solver.eigenvalues(), solver.eigenvectors()};
  return out;
}

}  // namespace

ModalResult natural_frequencies(const FrameModel& model, const AddedMass& added, const ModalOptions& options,
                                const std::function<void(double)>& progress) {
  const std::size_t parts = std::max<std::size_t>(options.parts, 1);
  const detail::DividedModel d = detail::divide_elements(model, std::vector<std::size_t>(model.elements.size(), parts));
  const FrameModel& mesh = d.model;
  AddedMass divided_added;  // the point masses as they are, each element's line mass on each of its parts
  divided_added.at_node = added.at_node;
  for (std::size_t parent : d.parent)
    divided_added.per_length.push_back(parent < added.per_length.size() ? added.per_length[parent] : 0.0);
  const DofNumbering dofs = number_dofs(mesh);
  Eigen::SparseMatrix<double> k_full = assemble_stiffness(mesh);
  tie_released_rotations(k_full, dofs, mesh);
  const Eigen::SparseMatrix<double> k = free_block(k_full, dofs);
  const Eigen::SparseMatrix<double> m_full = assemble_mass(mesh, divided_added);
  const Eigen::SparseMatrix<double> m = free_block(m_full, dofs);
  if (progress) progress(0.1);

  ModalResult result;
  result.parts = parts;
  // Total mass: a unit translation of every node along X (all DOFs, supports included).
  Eigen::VectorXd r_all = Eigen::VectorXd::Zero(m_full.rows());
  for (std::size_t n = 0; n < mesh.nodes.size(); ++n) r_all(global_dof(n, ux)) = 1.0;
  result.total_mass = r_all.dot(m_full * r_all);
  std::array<Eigen::VectorXd, 3> r;
  for (int axis = 0; axis < 3; ++axis) {
    Eigen::VectorXd full = Eigen::VectorXd::Zero(m_full.rows());
    for (std::size_t n = 0; n < mesh.nodes.size(); ++n) full(global_dof(n, axis)) = 1.0;
    r[static_cast<std::size_t>(axis)] = free_part(full, dofs);
    result.moving_mass[static_cast<std::size_t>(axis)] = r[static_cast<std::size_t>(axis)].dot(m * r[static_cast<std::size_t>(axis)]);
  }
  if (options.modes == 0 || dofs.free_count() == 0) return result;
  if (m.norm() == 0.0) throw std::invalid_argument("natural frequencies: the frame has no mass that can move");

  const StiffnessFactor factor(k, dofs, mesh.nodes);  // throws UnstableFrame for a mechanism
  if (progress) progress(0.3);
  const bool dense = dofs.free_count() <= static_cast<Eigen::Index>(options.dense_limit) ||
                     static_cast<Eigen::Index>(options.modes) >= dofs.free_count() - 1;
  const Eigenpairs pairs = dense ? dense_pairs(k, m, options.modes) : lanczos_pairs(m, factor, options.modes, options.tolerance);
  if (progress) progress(0.9);

  for (Eigen::Index j = 0; j < pairs.omega2.size(); ++j) {
    const Eigen::VectorXd phi = pairs.vectors.col(j);
    const Eigen::VectorXd m_phi = m * phi;
    const double generalised = phi.dot(m_phi);  // phi^T M phi
    VibrationMode mode;
    mode.omega = std::sqrt(std::max(pairs.omega2(j), 0.0));
    mode.frequency = mode.omega / (2 * std::numbers::pi);
    for (std::size_t axis = 0; axis < 3; ++axis) {
      const double l = m_phi.dot(r[axis]);  // phi^T M r_d
      mode.effective_mass[axis] = l * l / generalised;
      mode.mass_ratio[axis] = result.moving_mass[axis] > 0 ? mode.effective_mass[axis] / result.moving_mass[axis] : 0.0;
    }
    // The shape at the model's nodes and the divided elements' inner nodes, largest translation 1.
    const Eigen::VectorXd full = expand_free(phi, dofs);
    double largest = 0;
    for (std::size_t n = 0; n < mesh.nodes.size(); ++n) largest = std::max(largest, full.segment<3>(global_dof(n, ux)).norm());
    const double scale = largest > 0 ? 1.0 / largest : 1.0;
    mode.shape.displacements = scale * full.head(static_cast<Eigen::Index>(6 * model.nodes.size()));
    mode.shape.inner_points.resize(model.elements.size());
    for (std::size_t e = 0; e < model.elements.size(); ++e)
      for (std::size_t i = 1; i + 1 < d.points[e].size(); ++i)
        mode.shape.inner_points[e].push_back(scale * full.segment<6>(global_dof(d.points[e][i], ux)));
    result.modes.push_back(std::move(mode));
  }
  std::sort(result.modes.begin(), result.modes.end(),
            [](const VibrationMode& a, const VibrationMode& b) { return a.omega < b.omega; });
  if (progress) progress(1.0);
  return result;
}

}  // namespace stepframe::analysis
