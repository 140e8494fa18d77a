#include "stepframe/analysis/assembly.hpp"

#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/element_geometry.hpp"

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

Eigen::SparseMatrix<double> assemble_stiffness(const FrameModel& model) {
  const auto size = static_cast<Eigen::Index>(6 * model.nodes.size());
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(144 * model.elements.size());

  for (std::size_t m = 0; m < model.elements.size(); ++m) {
    const FrameElement& member = model.elements[m];
    const ElementGeometry geo = element_geometry(model, m);
    const ElementProperties props =
        element_properties(model.sections[member.section], model.materials[member.material], geo.length);
    // Global element stiffness K_e = T^T k T (congruent transformation, common practice).
    const Matrix12d t = transformation(geo.axes);
    const Matrix12d k_global = t.transpose() * local_stiffness(props) * t;

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

  Eigen::SparseMatrix<double> k(size, size);
  k.setFromTriplets(triplets.begin(), triplets.end());  // duplicates are summed
  return k;
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
