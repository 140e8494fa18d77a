#include "stepframe/analysis/assembly.hpp"

#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/element_releases.hpp"
#include "stepframe/analysis/geometric_stiffness.hpp"

#include <Eigen/Eigenvalues>

#include <algorithm>
#include <cmath>

namespace stepframe::analysis {

DofNumbering number_dofs(const FrameModel& model) {
  const std::size_t total = 6 * model.nodes.size();
  std::vector<bool> fixed(total, false);
  for (const Support& s : model.supports)
    for (int d = 0; d < 6; ++d)
      if (s.fixed[static_cast<std::size_t>(d)]) fixed[static_cast<std::size_t>(global_dof(s.node, d))] = true;

  DofNumbering dofs;
  dofs.free_index.assign(total, -1);
  for (std::size_t g = 0; g < total; ++g) {
    if (fixed[g]) continue;
    dofs.free_index[g] = static_cast<Eigen::Index>(dofs.global_of_free.size());
    dofs.global_of_free.push_back(static_cast<Eigen::Index>(g));
  }
  return dofs;
}

ElementSystem element_system(const FrameModel& model, std::size_t e, const LocalLoads& loads,
                             const double* axial_force) {
  const FrameElement& element = model.elements[e];
  const ElementGeometry geo = element_geometry(model, e);
  const ElementProperties props = element_properties(model.sections[element.section], model.materials[element.material],
                                                     geo.length, model.settings.shear_deformation);
  Matrix12d k = local_stiffness(props);
  if (axial_force) k += local_geometric_stiffness(props, *axial_force);
  const Vector12d fe = fixed_end_actions(props, loads);
  const CondensedElement c = condense_releases(k, fe, element.releases);
  // Global element stiffness K_e = T^T k T (congruent transformation) and
  // equivalent nodal loads F = -T^T f0 (common practice).
  return ElementSystem{to_global(geo.axes, c.k), -to_global(geo.axes, c.fixed_end)};
}

Eigen::SparseMatrix<double> assemble_stiffness(const FrameModel& model, const std::vector<double>* axial_forces) {
  const auto size = static_cast<Eigen::Index>(6 * model.nodes.size());
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(144 * model.elements.size() + 6 * model.supports.size());
  const LocalLoads none;

  for (std::size_t m = 0; m < model.elements.size(); ++m) {
    const FrameElement& member = model.elements[m];
    const Matrix12d k_global = element_system(model, m, none, axial_forces ? &(*axial_forces)[m] : nullptr).k;
    for (int a = 0; a < 12; ++a) {
      const Eigen::Index row = global_dof(member.nodes[static_cast<std::size_t>(a / 6)], a % 6);
      for (int b = 0; b < 12; ++b) {
        const double value = k_global(a, b);
        if (value == 0.0) continue;
        const Eigen::Index col = global_dof(member.nodes[static_cast<std::size_t>(b / 6)], b % 6);
        triplets.emplace_back(row, col, value);
      }
    }
  }
  // Elastic supports: a spring to the ground adds its stiffness to the diagonal.
  for (const Support& s : model.supports)
    for (int d = 0; d < 6; ++d) {
      const double k = s.spring[static_cast<std::size_t>(d)];
      if (k != 0.0 && !s.fixed[static_cast<std::size_t>(d)]) triplets.emplace_back(global_dof(s.node, d), global_dof(s.node, d), k);
    }

  Eigen::SparseMatrix<double> k(size, size);
  k.setFromTriplets(triplets.begin(), triplets.end());  // duplicates are summed
  return k;
}

std::vector<RotationTie> tie_released_rotations(Eigen::SparseMatrix<double>& k, const DofNumbering& dofs,
                                                const FrameModel& model) {
  std::vector<RotationTie> ties;
  std::vector<bool> has_release(model.nodes.size(), false);
  for (const FrameElement& e : model.elements)
    for (std::size_t end = 0; end < 2; ++end)
      for (int d = rx; d <= rz; ++d)
        if (e.releases[end][static_cast<std::size_t>(d)]) has_release[e.nodes[end]] = true;
  double scale = 0;
  for (Eigen::Index g = 0; g < k.rows(); ++g)
    if (g % 6 >= 3) scale = std::max(scale, std::abs(k.coeff(g, g)));
  if (scale == 0) return ties;

  std::vector<Eigen::Triplet<double>> added;
  for (std::size_t n = 0; n < model.nodes.size(); ++n) {
    if (!has_release[n]) continue;
    std::vector<Eigen::Index> free;
    for (int d = rx; d <= rz; ++d)
      if (dofs.is_free(global_dof(n, d))) free.push_back(global_dof(n, d));
    if (free.empty()) continue;
    const auto size = static_cast<Eigen::Index>(free.size());
    Eigen::MatrixXd block(size, size);
    for (Eigen::Index i = 0; i < size; ++i)
      for (Eigen::Index j = 0; j < size; ++j) block(i, j) = k.coeff(free[static_cast<std::size_t>(i)], free[static_cast<std::size_t>(j)]);
    const Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(block);
    for (Eigen::Index m = 0; m < size; ++m) {
      if (eig.eigenvalues()(m) > 1e-10 * scale) continue;
      const Eigen::VectorXd v = eig.eigenvectors().col(m);
      RotationTie tie{n, Eigen::Vector3d::Zero()};
      for (Eigen::Index i = 0; i < size; ++i) tie.axis(free[static_cast<std::size_t>(i)] % 6 - 3) = v(i);
      ties.push_back(tie);
      for (Eigen::Index i = 0; i < size; ++i)
        for (Eigen::Index j = 0; j < size; ++j)
          added.emplace_back(free[static_cast<std::size_t>(i)], free[static_cast<std::size_t>(j)], scale * v(i) * v(j));
    }
  }
  if (!added.empty()) {
    Eigen::SparseMatrix<double> extra(k.rows(), k.cols());
    extra.setFromTriplets(added.begin(), added.end());
    k += extra;
  }
  return ties;
}

Eigen::SparseMatrix<double> free_block(const Eigen::SparseMatrix<double>& full, const DofNumbering& dofs) {
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(static_cast<std::size_t>(full.nonZeros()));
  for (Eigen::Index col = 0; col < full.outerSize(); ++col) {
    const Eigen::Index c = dofs.free_index[static_cast<std::size_t>(col)];
    if (c < 0) continue;
    for (Eigen::SparseMatrix<double>::InnerIterator it(full, col); it; ++it) {
      const Eigen::Index r = dofs.free_index[static_cast<std::size_t>(it.row())];
      if (r >= 0) triplets.emplace_back(r, c, it.value());
    }
  }
  Eigen::SparseMatrix<double> reduced(dofs.free_count(), dofs.free_count());
  reduced.setFromTriplets(triplets.begin(), triplets.end());
  return reduced;
}

Eigen::VectorXd free_part(const Eigen::VectorXd& full, const DofNumbering& dofs) {
  Eigen::VectorXd reduced(dofs.free_count());
  for (Eigen::Index i = 0; i < dofs.free_count(); ++i) reduced(i) = full(dofs.global_of_free[static_cast<std::size_t>(i)]);
  return reduced;
}

Eigen::VectorXd expand_free(const Eigen::VectorXd& reduced, const DofNumbering& dofs) {
  Eigen::VectorXd full = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(dofs.free_index.size()));
  for (Eigen::Index i = 0; i < dofs.free_count(); ++i) full(dofs.global_of_free[static_cast<std::size_t>(i)]) = reduced(i);
  return full;
}

}  // namespace stepframe::analysis
