#include "stepframe/analysis/mass_matrix.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/element_releases.hpp"

#include <Eigen/Cholesky>

namespace stepframe::analysis {

Matrix12d local_consistent_mass(const ElementMass& mass, double length) {
  // Przemieniecki (1968) eq. 11.42: axial and torsion m L / 6 [2 1; 1 2], bending m L / 420 x
  // [156 22L 54 -13L; 22L 4L^2 13L -3L^2; 54 13L 156 -22L; -13L -3L^2 -22L 4L^2] for (v1 rz1 v2 rz2);
  // in x-z (w, ry = -dw/dx) the translation-rotation terms change sign, as in local_stiffness.
  const double L = length, m = mass.per_length;
  Matrix12d M = Matrix12d::Zero();
  const double axial = m * L / 6, torsion = mass.polar * L / 6;
  M(0, 0) = M(6, 6) = 2 * axial;
  M(0, 6) = axial;
  M(3, 3) = M(9, 9) = 2 * torsion;
  M(3, 9) = torsion;
  const double b = m * L / 420;
  // x-y plane: v1 = 1, rz1 = 5, v2 = 7, rz2 = 11.
  M(1, 1) = M(7, 7) = 156 * b;
  M(1, 7) = 54 * b;
  M(1, 5) = 22 * L * b;
  M(1, 11) = -13 * L * b;
  M(5, 7) = 13 * L * b;
  M(7, 11) = -22 * L * b;
  M(5, 5) = M(11, 11) = 4 * L * L * b;
  M(5, 11) = -3 * L * L * b;
  // x-z plane: w1 = 2, ry1 = 4, w2 = 8, ry2 = 10.
  M(2, 2) = M(8, 8) = 156 * b;
  M(2, 8) = 54 * b;
  M(2, 4) = -22 * L * b;
  M(2, 10) = 13 * L * b;
  M(4, 8) = -13 * L * b;
  M(8, 10) = 22 * L * b;
  M(4, 4) = M(10, 10) = 4 * L * L * b;
  M(4, 10) = -3 * L * L * b;
  for (int i = 0; i < 12; ++i)
    for (int j = 0; j < i; ++j) M(i, j) = M(j, i);
  return M;
}

namespace {

// The released element's shapes: u = C u_retained, with u_r = -k_rr^-1 k_rc u_c at the released DOFs
// (element_releases.hpp); the condensed mass is C^T M C (Guyan 1965).
Matrix12d condensed_mass(const Matrix12d& m, const Matrix12d& k, const EndReleases& releases) {
  std::vector<int> r, c;
  for (int i = 0; i < 12; ++i) (releases[static_cast<std::size_t>(i / 6)][static_cast<std::size_t>(i % 6)] ? r : c).push_back(i);
  Eigen::MatrixXd krr(r.size(), r.size()), krc(r.size(), c.size());
  for (std::size_t i = 0; i < r.size(); ++i) {
    for (std::size_t j = 0; j < r.size(); ++j) krr(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j)) = k(r[i], r[j]);
    for (std::size_t j = 0; j < c.size(); ++j) krc(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j)) = k(r[i], c[j]);
  }
  const Eigen::MatrixXd ur = -krr.ldlt().solve(krc);
  Matrix12d shape = Matrix12d::Zero();  // columns: retained DOFs (placed at their own index)
  for (std::size_t j = 0; j < c.size(); ++j) {
    shape(c[j], c[j]) = 1.0;
    for (std::size_t i = 0; i < r.size(); ++i) shape(r[i], c[j]) = ur(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j));
  }
  return shape.transpose() * m * shape;
}

}  // namespace

Eigen::SparseMatrix<double> assemble_mass(const FrameModel& model, const AddedMass& added) {
  const auto size = static_cast<Eigen::Index>(6 * model.nodes.size());
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(144 * model.elements.size() + 3 * model.nodes.size());
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const FrameElement& el = model.elements[e];
    const Section& s = model.sections[el.section];
    const double density = model.materials[el.material].density;
    ElementMass mass{density * s.A, density * (s.Iy + s.Iz)};
    if (e < added.per_length.size()) mass.per_length += added.per_length[e];
    const ElementGeometry geo = element_geometry(model, e);
    Matrix12d m = local_consistent_mass(mass, geo.length);
    if (any_release(el.releases)) {
      const ElementProperties props = element_properties(s, model.materials[el.material], geo.length,
                                                         model.settings.shear_deformation);
      m = condensed_mass(m, local_stiffness(props), el.releases);
    }
    const Matrix12d global = to_global(geo.axes, m);  // congruent transformation, as the stiffness
    for (int a = 0; a < 12; ++a)
      for (int b = 0; b < 12; ++b)
        if (global(a, b) != 0.0)
          triplets.emplace_back(global_dof(el.nodes[static_cast<std::size_t>(a / 6)], a % 6),
                                global_dof(el.nodes[static_cast<std::size_t>(b / 6)], b % 6), global(a, b));
  }
  for (std::size_t n = 0; n < added.at_node.size() && n < model.nodes.size(); ++n)
    if (added.at_node[n] != 0.0)
      for (int d = ux; d <= uz; ++d) triplets.emplace_back(global_dof(n, d), global_dof(n, d), added.at_node[n]);
  Eigen::SparseMatrix<double> m(size, size);
  m.setFromTriplets(triplets.begin(), triplets.end());
  return m;
}

}  // namespace stepframe::analysis
