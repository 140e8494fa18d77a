#include "stepframe/analysis/element_releases.hpp"

#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Cholesky>
#include <algorithm>
#include <array>
#include <cmath>
#include <Eigen/Eigenvalues>


namespace stepframe::analysis {
namespace {

// Some of an element's DOFs (0-11, start then end), in order, on the stack: the recovery asks for them
// for every released element of every result.
class DofList {
 public:
  void push_back(int dof) { dofs_[size_++] = dof; }
  std::size_t size() const { return size_; }
  bool empty() const { return size_ == 0; }
  int operator[](std::size_t i) const { return dofs_[i]; }
  const int* begin() const { return dofs_.data(); }
  const int* end() const { return dofs_.data() + size_; }

 private:
  std::array<int, 12> dofs_{};
  std::size_t size_ = 0;
};

DofList released_dofs(const EndReleases& r) {
  DofList out;
  for (int e = 0; e < 2; ++e)
    for (int d = 0; d < 6; ++d)
      if (r[static_cast<std::size_t>(e)][static_cast<std::size_t>(d)]) out.push_back(6 * e + d);
  return out;
}

// At most 12 x 12: on the stack (this runs for every released element of every recovery).
using Small = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, 0, 12, 12>;
using SmallVector = Eigen::Matrix<double, Eigen::Dynamic, 1, 0, 12, 1>;

// The rows and columns of k that the lists name, as a matrix of type M.
template <class M = Eigen::MatrixXd>
M pick(const Matrix12d& k, const DofList& rows, const DofList& cols) {
  M out(static_cast<Eigen::Index>(rows.size()), static_cast<Eigen::Index>(cols.size()));
  for (std::size_t i = 0; i < rows.size(); ++i)
    for (std::size_t j = 0; j < cols.size(); ++j)
      out(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j)) = k(rows[i], cols[j]);
  return out;
}

DofList complement(const DofList& r) {
  DofList c;
  for (int i = 0; i < 12; ++i)
    if (std::find(r.begin(), r.end(), i) == r.end()) c.push_back(i);
  return c;
}

}  // namespace

bool any_release(const EndReleases& releases) {
  for (const auto& end : releases)
    for (bool b : end)
      if (b) return true;
  return false;
}

std::optional<std::string> release_mechanism(const EndReleases& releases) {
  const DofList r = released_dofs(releases);
  if (r.empty()) return std::nullopt;
  // A unit element (all properties 1, length 1) shares the singular pattern
  // of every real one: k_rr is singular exactly when the released directions
  // admit a strain-free motion of the element.
  ElementProperties unit{1, 1, 1, 1, 1, 1, 1, 0, 0};
  const Eigen::MatrixXd krr = pick(local_stiffness(unit), r, r);
  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(krr);
  const Eigen::VectorXd values = eig.eigenvalues();
  if (values.minCoeff() > 1e-9 * std::max(1.0, values.maxCoeff())) return std::nullopt;
  // Name the released directions taking part in the free motion.
  const Eigen::VectorXd mode = eig.eigenvectors().col(0);
  std::string out;
  for (std::size_t i = 0; i < r.size(); ++i) {
    if (std::abs(mode(static_cast<Eigen::Index>(i))) < 1e-6) continue;
    if (!out.empty()) out += ", ";
    out += std::string(dof_names[static_cast<std::size_t>(r[i] % 6)]) + (r[i] < 6 ? " at the start" : " at the end");
  }
  return out;
}

CondensedElement condense_releases(const Matrix12d& k, const Vector12d& fixed_end, const EndReleases& releases) {
  CondensedElement out{k, fixed_end};
  const DofList r = released_dofs(releases);
  if (r.empty()) return out;
  const DofList c = complement(r);
  const Eigen::LDLT<Small> krr(pick<Small>(k, r, r));
  const Small kcr = pick<Small>(k, c, r);
  SmallVector fr(static_cast<Eigen::Index>(r.size()));
  for (std::size_t i = 0; i < r.size(); ++i) fr(static_cast<Eigen::Index>(i)) = fixed_end(r[i]);
  const Small kc = pick<Small>(k, c, c) - kcr * krr.solve(kcr.transpose());
  const SmallVector fc = -kcr * krr.solve(fr);
  out.k.setZero();
  out.fixed_end.setZero();
  for (std::size_t i = 0; i < c.size(); ++i) {
    out.fixed_end(c[i]) = fixed_end(c[i]) + fc(static_cast<Eigen::Index>(i));
    for (std::size_t j = 0; j < c.size(); ++j)
      out.k(c[i], c[j]) = kc(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j));
  }
  return out;
}

Vector12d element_end_displacements(const Matrix12d& k, const Vector12d& fixed_end, const EndReleases& releases,
                                    const Vector12d& node_displacements) {
  Vector12d u = node_displacements;
  const DofList r = released_dofs(releases);
  if (r.empty()) return u;
  const DofList c = complement(r);
  SmallVector uc(static_cast<Eigen::Index>(c.size())), fr(static_cast<Eigen::Index>(r.size()));
  for (std::size_t i = 0; i < c.size(); ++i) uc(static_cast<Eigen::Index>(i)) = node_displacements(c[i]);
  for (std::size_t i = 0; i < r.size(); ++i) fr(static_cast<Eigen::Index>(i)) = fixed_end(r[i]);
  const SmallVector ur = -pick<Small>(k, r, r).ldlt().solve(pick<Small>(k, r, c) * uc + fr);
  for (std::size_t i = 0; i < r.size(); ++i) u(r[i]) = ur(static_cast<Eigen::Index>(i));
  return u;
}

}  // namespace stepframe::analysis
