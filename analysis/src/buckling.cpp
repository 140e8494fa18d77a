#include "stepframe/analysis/buckling.hpp"

#include "divided_model.hpp"

#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/geometric_stiffness.hpp"
#include "stepframe/analysis/parallel.hpp"

#include <Spectra/MatOp/SparseSymMatProd.h>
#include <Eigen/Cholesky>
#include <Eigen/Eigenvalues>
#include <Spectra/SymGEigsSolver.h>
#include <spdlog/spdlog.h>
#include <spdlog/stopwatch.h>

#include <algorithm>
#include <array>
#include <cmath>
#include <exception>
#include <limits>
#include <memory>
#include <numbers>
#include <optional>
#include <random>
#include <utility>

namespace stepframe::analysis {
namespace {

using Sparse = Eigen::SparseMatrix<double>;
constexpr double pi = std::numbers::pi;

// B = K for Spectra's regular-inverse mode: y = K x and y = K^-1 x, one
// vector at a time (Spectra) or a block of them (subspace iteration).
template <class Op>
struct SpectraAdapter {
  using Scalar = double;
  const Op& op;
  Eigen::Index rows() const { return op.rows(); }
  Eigen::Index cols() const { return op.rows(); }
  void solve(const double* x_in, double* y_out) const {
    Eigen::Map<Eigen::VectorXd>(y_out, rows()) = op.solve(Eigen::Map<const Eigen::MatrixXd>(x_in, rows(), 1));
  }
  void perform_op(const double* x_in, double* y_out) const {
    Eigen::Map<Eigen::VectorXd>(y_out, rows()) = op.product(Eigen::Map<const Eigen::MatrixXd>(x_in, rows(), 1));
  }
};

// The model's own stiffness and its factor.
class StiffnessOp {
 public:
  StiffnessOp(const Sparse& k, const StiffnessFactor& factor) : k_(k), factor_(factor) {}
  Eigen::Index rows() const { return k_.rows(); }
  Eigen::MatrixXd solve(const Eigen::MatrixXd& x) const { return factor_.solve(x); }
  Eigen::MatrixXd product(const Eigen::MatrixXd& x) const { return k_ * x; }

 private:
  const Sparse& k_;
  const StiffnessFactor& factor_;
};

// The divided model's stiffness K through the model's own factorisation.
// Condensing a divided element's inner nodes statically gives back the whole
// element's stiffness exactly: its shape functions solve the beam equations
// without span load, so the parts reproduce them (the substructure property
// of exact elements; e.g. Przemieniecki, Theory of Matrix Structural
// Analysis, 1968, ch. 9). With b the model's own free DOFs and i the inner
// ones, K = [K_bb K_bi; K_ib K_ii] and K_bb - K_bi K_ii^-1 K_ib = K_model, so
//   K x = f:  y_i = K_ii^-1 f_i,  K_model x_b = f_b - K_bi y_i,  x_i = y_i - K_ii^-1 K_ib x_b,
//   K x    = [K_model x_b + K_bi (K_ii^-1 K_ib x_b + x_i);  K_ib x_b + K_ii x_i],
// each K_ii local to one element: no second factorisation of the frame.
class CondensedStiffnessOp {
 public:
  // One divided element: its inner DOFs (consecutive), the reduced indices of its end DOFs
  // (-1 where supported), K_ii factorised, K_ii itself and K_ie (inner rows, end columns).
  struct Block {
    Eigen::Index inner_first = 0;
    std::array<Eigen::Index, 12> ends{};
    Eigen::LLT<Eigen::MatrixXd> kii_factor;
    Eigen::MatrixXd kii;
    Eigen::MatrixXd kie;
  };

  CondensedStiffnessOp(const Sparse& k_model, const StiffnessFactor& factor, std::vector<Block> blocks, Eigen::Index size)
      : k_(k_model), factor_(factor), blocks_(std::move(blocks)), size_(size) {}
  Eigen::Index rows() const { return size_; }

  Eigen::MatrixXd solve(const Eigen::MatrixXd& f) const {
    const Eigen::Index nb = k_.rows();
    Eigen::MatrixXd x(size_, f.cols());
    Eigen::MatrixXd g = f.topRows(nb);
    for (const Block& b : blocks_) {  // y_i = K_ii^-1 f_i; g = f_b - K_bi y_i
      const auto m = b.kie.rows();
      x.middleRows(b.inner_first, m) = b.kii_factor.solve(f.middleRows(b.inner_first, m));
      scatter(b, b.kie.transpose() * x.middleRows(b.inner_first, m), -1.0, g);
    }
    x.topRows(nb) = factor_.solve(g);
    for (const Block& b : blocks_)  // x_i = y_i - K_ii^-1 K_ib x_b
      x.middleRows(b.inner_first, b.kie.rows()) -= b.kii_factor.solve(b.kie * gather(b, x));
    return x;
  }

  Eigen::MatrixXd product(const Eigen::MatrixXd& x) const {
    const Eigen::Index nb = k_.rows();
    Eigen::MatrixXd y(size_, x.cols());
    y.topRows(nb) = k_ * x.topRows(nb);
    for (const Block& b : blocks_) {
      const auto m = b.kie.rows();
      const Eigen::MatrixXd xe = gather(b, x);
      const Eigen::MatrixXd t = b.kii_factor.solve(b.kie * xe) + x.middleRows(b.inner_first, m);
      scatter(b, b.kie.transpose() * t, 1.0, y);
      y.middleRows(b.inner_first, m) = b.kie * xe + b.kii * x.middleRows(b.inner_first, m);
    }
    return y;
  }

 private:
  // The rows of the element's end DOFs (zero where supported).
  static Eigen::MatrixXd gather(const Block& b, const Eigen::MatrixXd& x) {
    Eigen::MatrixXd e = Eigen::MatrixXd::Zero(12, x.cols());
    for (int j = 0; j < 12; ++j)
      if (b.ends[static_cast<std::size_t>(j)] >= 0) e.row(j) = x.row(b.ends[static_cast<std::size_t>(j)]);
    return e;
  }
  static void scatter(const Block& b, const Eigen::MatrixXd& rows, double sign, Eigen::MatrixXd& y) {
    for (int j = 0; j < 12; ++j)
      if (b.ends[static_cast<std::size_t>(j)] >= 0) y.row(b.ends[static_cast<std::size_t>(j)]) += sign * rows.row(j);
  }

  const Sparse& k_;
  const StiffnessFactor& factor_;
  std::vector<Block> blocks_;
  Eigen::Index size_;
};

// The model divided for the analysis (divided_model.hpp).
using Mesh = detail::DividedModel;

// Axial force of each mesh element at its midpoint: exact for a constant
// force, the midpoint rule of a varying one (self weight in a column).
std::vector<double> part_forces(const FrameModel& model, const Mesh& mesh, const AxialForce& axial) {
  std::vector<double> forces(mesh.parent.size());
  for (std::size_t p = 0; p < forces.size(); ++p) {
    const std::size_t e = mesh.parent[p];
    const double length = (model.nodes[model.elements[e].nodes[1]] - model.nodes[model.elements[e].nodes[0]]).norm();
    const double mid = mesh.part_start[p] + 0.5 / static_cast<double>(mesh.parts[e]);
    forces[p] = axial(e, mid * length);
  }
  return forces;
}

// Whether any part is compressed beyond rounding: at most 1e-9 of its own
// Euler load pi^2 E I_min / l^2 counts as nothing.
bool compresses(const Mesh& mesh, const std::vector<double>& forces) {
  const FrameModel& m = mesh.model;
  for (std::size_t p = 0; p < forces.size(); ++p) {
    const FrameElement& el = m.elements[p];
    const double l = (m.nodes[el.nodes[1]] - m.nodes[el.nodes[0]]).norm();
    const Section& s = m.sections[el.section];
    const double euler = pi * pi * m.materials[el.material].E * std::min(s.Iy, s.Iz) / (l * l);
    if (-forces[p] > 1e-9 * euler) return true;
  }
  return false;
}

// -Kg of the mesh for the given part forces, reduced to the free DOFs: its lower
// triangle only (the matrix is symmetric; every product takes it through
// selfadjointView<Lower>, as Spectra's SparseSymMatProd does), which halves
// what the largest frames hold for it and build it from.
Sparse negative_geometric_stiffness(const Mesh& mesh, const std::vector<double>& forces, const DofNumbering& dofs) {
  const FrameModel& m = mesh.model;
  std::vector<Eigen::Triplet<double>> triplets;
  triplets.reserve(40 * m.elements.size());  // 78 at most in an element's lower triangle; some 36 when axis-aligned
  for (std::size_t p = 0; p < m.elements.size(); ++p) {
    if (forces[p] == 0.0) continue;
    const FrameElement& el = m.elements[p];
    Matrix12d kg;
    const bool released = std::any_of(el.releases.begin(), el.releases.end(),
                                      [](const auto& end) { return std::find(end.begin(), end.end(), true) != end.end(); });
    if (released) {
      // The condensed k + kg minus the condensed k: first order in kg, which is small for a part.
      kg = element_system(m, p, {}, &forces[p]).k - element_system(m, p, {}).k;
    } else {
      // Global geometric stiffness T^T kg T (congruent transformation).
      const ElementGeometry geo = element_geometry(m, p);
      const ElementProperties props =
          element_properties(m.sections[el.section], m.materials[el.material], geo.length, m.settings.shear_deformation);
      kg = to_global(geo.axes, local_geometric_stiffness(props, forces[p]));
    }
    for (int i = 0; i < 12; ++i) {
      const Eigen::Index r = dofs.free_index[static_cast<std::size_t>(global_dof(el.nodes[static_cast<std::size_t>(i / 6)], i % 6))];
      if (r < 0) continue;
      for (int j = 0; j < 12; ++j) {
        const double v = -kg(i, j);
        if (v == 0.0) continue;
        const Eigen::Index c = dofs.free_index[static_cast<std::size_t>(global_dof(el.nodes[static_cast<std::size_t>(j / 6)], j % 6))];
        if (c >= 0 && c <= r) triplets.emplace_back(r, c, v);
      }
    }
  }
  Sparse g(dofs.free_count(), dofs.free_count());
  g.setFromTriplets(triplets.begin(), triplets.end());
  return g;
}

// The eigenpairs of one pattern: alphas (positive, lowest first) and their vectors (reduced numbering).
struct Eigenpairs {
  std::vector<double> alpha;
  Eigen::MatrixXd vectors;
  Eigen::MatrixXd block;  // the converged subspace (Ritz vectors, largest mu first), or the vectors alone: a start for the next pattern
};

// Columns to iterate with: the wanted modes and as many again, at least four,
// so that the slowest wanted mode converges at the rate mu_(m+1) / mu_nev.
Eigen::Index block_size(std::size_t modes) { return static_cast<Eigen::Index>(modes + std::max<std::size_t>(modes, 4)); }

// A start block: the given columns, then deterministic pseudo-random ones (a fixed seed, so
// that runs repeat exactly) up to `columns`.
Eigen::MatrixXd start_block(const Eigen::MatrixXd& given, Eigen::Index rows, Eigen::Index columns) {
  Eigen::MatrixXd v(rows, columns);
  std::mt19937_64 random(20240611);
  std::uniform_real_distribution<double> uniform(-1.0, 1.0);
  for (Eigen::Index c = 0; c < columns; ++c)
    for (Eigen::Index r = 0; r < rows; ++r) v(r, c) = uniform(random);
  const Eigen::Index kept = std::min(columns, given.cols());
  if (given.rows() == rows) v.leftCols(kept) = given.leftCols(kept);
  return v;
}

// The converged pairs of a block iteration: the first `nev` Ritz values mu (largest first) that
// are positive, as alphas = 1 / mu, their Ritz vectors, and the whole block as the next start.
Eigenpairs converged_pairs(const Eigen::VectorXd& mu, const Eigen::MatrixXd& ritz, Eigen::Index nev) {
  Eigenpairs out;
  for (Eigen::Index k = 0; k < nev && mu(k) > 0; ++k) out.alpha.push_back(1.0 / mu(k));
  out.vectors = ritz.leftCols(static_cast<Eigen::Index>(out.alpha.size()));
  out.block = ritz;
  return out;
}

// Rayleigh-Ritz on the subspace spanned by `basis`: the small pencil a y = mu b y
// (a = basis^T G basis, b = basis^T K basis, both symmetrised against rounding), its
// values mu largest first (lowest alpha first) and the Ritz vectors basis y.
struct Ritz {
  Eigen::VectorXd mu;
  Eigen::MatrixXd vectors;
};
std::optional<Ritz> rayleigh_ritz(const Eigen::MatrixXd& a, const Eigen::MatrixXd& b, const Eigen::MatrixXd& basis) {
  const Eigen::GeneralizedSelfAdjointEigenSolver<Eigen::MatrixXd> rr(0.5 * (a + a.transpose()), 0.5 * (b + b.transpose()));
  if (rr.info() != Eigen::Success) return std::nullopt;  // the basis lost rank
  return Ritz{rr.eigenvalues().reverse(), basis * rr.eigenvectors().rowwise().reverse()};
}

// Rayleigh-Ritz of a pattern on a given subspace V alone, with no solve:
// a = V^T G V, b = V^T K V (Bathe & Wilson, Numerical Methods in Finite
// Element Analysis, 1976, ch. 10). Its k-th largest mu is at most the
// pattern's k-th largest (the minimax characterisation; Parlett, The
// Symmetric Eigenvalue Problem, 1998, ch. 10 and 11), so each alpha = 1 / mu
// is an upper bound of the pattern's k-th lowest alpha.
template <class Op>
std::optional<Ritz> ritz_on(const Op& op, const Sparse& g, const Eigen::MatrixXd& v) {
  return rayleigh_ritz(v.transpose() * (g.selfadjointView<Eigen::Lower>() * v), v.transpose() * op.product(v), v);
}

// Block inverse (subspace) iteration with Rayleigh-Ritz (Bathe & Wilson
// 1976, ch. 10): W = K^-1 G V, then the small pencil (W^T G W) y = mu
// (W^T K W) y, where K W = G V needs no product with K; V = W Y. Each Ritz
// value mu_k rises towards its limit, its error shrinking by about q_k =
// (mu_(m+1) / mu_k)^2 per iteration, so the error left is about |change|
// q_k / (1 - q_k) (mu_(m+1) estimated by the last Ritz value). Converged
// when that is below `tolerance` for the lowest alpha (alpha_cr) and below
// 100 `tolerance` for the others (their factors and mode shapes are for
// showing). Started from the modes of a similar pattern it settles in a few
// block solves, each little dearer than one single solve. When the start is
// a whole converged block of another pattern (`block_start`), its own Ritz
// values for this pattern count as the iteration before the first, so a
// pattern that buckles alike settles after one block solve.
template <class Op>
std::optional<Eigenpairs> subspace_iteration(const Op& op, const Sparse& g, Eigen::MatrixXd v, std::size_t modes,
                                             double tolerance, bool block_start) {
  const spdlog::stopwatch started;
  const Eigen::Index m = v.cols(), nev = std::min<Eigen::Index>(static_cast<Eigen::Index>(modes), m - 1);
  Eigen::VectorXd previous;
  if (block_start)
    if (const auto before = ritz_on(op, g, v)) previous = before->mu;
  for (int it = 1; it <= 60; ++it) {
    const Eigen::MatrixXd gv = g.selfadjointView<Eigen::Lower>() * v;
    const Eigen::MatrixXd w = op.solve(gv);
    auto rr = rayleigh_ritz(w.transpose() * (g.selfadjointView<Eigen::Lower>() * w), w.transpose() * gv, w);
    if (!rr) return std::nullopt;  // let Lanczos do it
    const Eigen::VectorXd& mu = rr->mu;
    v = std::move(rr->vectors);
    bool converged = previous.size() == m && mu(0) > 0;
    for (Eigen::Index k = 0; k < nev && converged; ++k) {
      const double q = std::pow(std::max(mu(m - 1), 0.0) / mu(k), 2);
      const double left = q < 1 ? std::abs(mu(k) - previous(k)) / mu(k) * q / (1 - q) : 1.0;
      converged = left <= (k == 0 ? tolerance : 100 * tolerance);
    }
    previous = mu;
    if (!converged) continue;
    spdlog::debug("buckling: {} DOFs, {} block iterations of {} vectors, {:.3f} s", v.rows(), it, m,
                  started.elapsed().count());
    return converged_pairs(mu, v, nev);
  }
  return std::nullopt;
}

// Block Krylov iteration with Rayleigh-Ritz for a pattern with no similar
// one solved before: block Lanczos in exact arithmetic (Golub & Van Loan,
// Matrix Computations, 4th ed. 2013, 10.3.6), with the whole basis Q kept
// K-orthonormal (Q^T K Q = I), so that the Ritz pairs are the eigenpairs of
// H = Q^T G Q, x = Q y. A = K^-1 G is self-adjoint in the K inner product
// u^T K v; each step solves W = A X for the p Ritz vectors X with the largest
// mu at once and extends Q by their residuals S = W - X diag(mu), which
// Rayleigh-Ritz makes K-orthogonal to Q already (one pass of Gram-Schmidt
// removes the rounding). Some eigenvalue lies within min(|s|_K, |s|_K^2 / gap)
// of each mu (Parlett, The Symmetric Eigenvalue Problem, 1998, ch. 4 and 11:
// the residual and gap bounds, gap estimated from the other Ritz values);
// converged when that is below `tolerance` of mu for the lowest alpha and
// below 100 `tolerance` for the others. A block solve reads the factor once
// for all its columns, so on a large frame (memory-bound solves) a step of p
// columns costs little more than one Lanczos product. Q holds at most
// `max_columns`; then it restarts from the 2p leading Ritz vectors.
template <class Op>
std::optional<Eigenpairs> block_krylov(const Op& op, const Sparse& g, const Eigen::MatrixXd& start, std::size_t modes,
                                       double tolerance, Eigen::Index max_columns) {
  const spdlog::stopwatch started;
  const Eigen::Index n = op.rows(), p = start.cols();
  const Eigen::Index nev = std::min<Eigen::Index>(static_cast<Eigen::Index>(modes), p - 1);
  if (nev < 1 || max_columns < 3 * p) return std::nullopt;
  auto g_times = [&](const Eigen::MatrixXd& v) -> Eigen::MatrixXd { return g.selfadjointView<Eigen::Lower>() * v; };
  Eigen::MatrixXd q(n, max_columns), h(0, 0);  // the basis (its first `used` columns) and H
  Eigen::Index used = 0;
  // Appends v's part K-orthogonal to Q, K-orthonormalised; kv = K v. Directions that
  // vanish against the others (relative K-norm below 1e-7) are dropped.
  auto append = [&](Eigen::MatrixXd v, Eigen::MatrixXd kv) {
    if (used > 0) {
      v -= q.leftCols(used) * (q.leftCols(used).transpose() * kv);
      kv = op.product(v);
    }
    Eigen::VectorXd scale(v.cols());
    for (Eigen::Index c = 0; c < v.cols(); ++c) {
      const double norm2 = v.col(c).dot(kv.col(c));
      scale(c) = norm2 > 0 ? 1.0 / std::sqrt(norm2) : 0.0;
    }
    const Eigen::MatrixXd gram = scale.asDiagonal() * (0.5 * (v.transpose() * kv + kv.transpose() * v)) * scale.asDiagonal();
    const Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> split(gram);
    std::vector<Eigen::Index> kept;
    for (Eigen::Index k = gram.cols() - 1; k >= 0; --k)
      if (split.eigenvalues()(k) > 1e-14 && static_cast<Eigen::Index>(kept.size()) + used < max_columns) kept.push_back(k);
    if (kept.empty()) return false;
    Eigen::MatrixXd t(v.cols(), static_cast<Eigen::Index>(kept.size()));
    for (std::size_t k = 0; k < kept.size(); ++k)
      t.col(static_cast<Eigen::Index>(k)) = scale.asDiagonal() * split.eigenvectors().col(kept[k]) / std::sqrt(split.eigenvalues()(kept[k]));
    const Eigen::Index added = t.cols();
    q.middleCols(used, added) = v * t;
    const Eigen::MatrixXd gv = g_times(q.middleCols(used, added));
    h.conservativeResize(used + added, used + added);
    h.rightCols(added) = q.leftCols(used + added).transpose() * gv;
    h.bottomLeftCorner(added, used) = h.topRightCorner(used, added).transpose();
    used += added;
    return true;
  };
  if (!append(start, op.product(start))) return std::nullopt;
  for (int step = 1; step <= 100; ++step) {
    const Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> rr(0.5 * (h + h.transpose()));
    if (rr.info() != Eigen::Success || used < p) return std::nullopt;  // let Lanczos do it
    const Eigen::VectorXd mu = rr.eigenvalues().reverse();  // largest mu (lowest alpha) first
    const Eigen::MatrixXd y = rr.eigenvectors().rowwise().reverse();
    const Eigen::MatrixXd x = q.leftCols(used) * y.leftCols(p);
    Eigen::MatrixXd s = op.solve(g_times(x));
    s -= x * mu.head(p).asDiagonal();
    Eigen::MatrixXd ks = op.product(s);
    bool converged = mu(0) > 0;
    for (Eigen::Index k = 0; k < nev && converged; ++k) {
      const double r2 = std::max(s.col(k).dot(ks.col(k)), 0.0), r = std::sqrt(r2);
      double gap = std::numeric_limits<double>::infinity();
      for (Eigen::Index j = 0; j < mu.size(); ++j)
        if (j != k) gap = std::min(gap, std::abs(mu(k) - mu(j)));
      gap -= r;
      converged = (gap > 0 ? std::min(r, r2 / gap) : r) <= (k == 0 ? tolerance : 100 * tolerance) * std::abs(mu(k));
    }
    if (converged) {
      spdlog::debug("buckling: {} DOFs, {} block Krylov steps of {} vectors, {} in the basis, {:.3f} s", n, step, p,
                    used, started.elapsed().count());
      return converged_pairs(mu, x, nev);
    }
    if (used + p > max_columns) {  // restart from the leading Ritz vectors
      const Eigen::Index keep = std::min(used, 2 * p);
      const Eigen::MatrixXd leading = q.leftCols(used) * y.leftCols(keep);
      q.leftCols(keep) = leading;
      h = mu.head(keep).asDiagonal();
      used = keep;
    }
    if (!append(std::move(s), std::move(ks))) return std::nullopt;  // handed over: no copies of n x p blocks
  }
  return std::nullopt;
}

template <class Op>
std::optional<Eigenpairs> lowest_alphas(const Op& op, const Sparse& g_free, std::size_t modes, double tolerance,
                                        const Eigen::VectorXd* start) {
  const spdlog::stopwatch started;
  using BOp = SpectraAdapter<Op>;
  BOp b_op{op};
  const Eigen::Index n = b_op.rows();
  if (n < 2) return std::nullopt;
  Spectra::SparseSymMatProd<double, Eigen::Lower> a_op(g_free);  // g_free holds the lower triangle
  const auto nev = static_cast<Eigen::Index>(std::min<std::size_t>(modes, static_cast<std::size_t>(n - 1)));
  const Eigen::Index ncv = std::min<Eigen::Index>(n, std::max<Eigen::Index>(2 * nev + 1, 20));
  Spectra::SymGEigsSolver<Spectra::SparseSymMatProd<double, Eigen::Lower>, BOp, Spectra::GEigsMode::RegularInverse> solver(
      a_op, b_op, nev, ncv);
  try {
    if (start && start->size() == n && start->norm() > 0) solver.init(start->data());
    else solver.init();
    solver.compute(Spectra::SortRule::LargestAlge, 1000, tolerance);
  } catch (const std::exception& e) {
    spdlog::warn("the buckling eigenvalue solver failed ({}); alpha_cr is not available", e.what());
    return std::nullopt;
  }
  if (solver.info() != Spectra::CompInfo::Successful) {
    spdlog::warn("the buckling eigenvalue solver did not converge; alpha_cr is not available");
    return std::nullopt;
  }
  spdlog::debug("buckling: {} DOFs, {} Lanczos restarts, {} operator products, {:.3f} s", n,
                solver.num_iterations(), solver.num_operations(), started.elapsed().count());
  const Eigen::VectorXd mu = solver.eigenvalues();
  const Eigen::MatrixXd vectors = solver.eigenvectors();
  Eigenpairs out;
  std::vector<Eigen::Index> kept;
  for (Eigen::Index i = 0; i < mu.size(); ++i)
    if (mu(i) > 0) kept.push_back(i);
  // Spectra returns the largest mu first, i.e. the lowest alpha first.
  out.vectors.resize(n, static_cast<Eigen::Index>(kept.size()));
  for (std::size_t k = 0; k < kept.size(); ++k) {
    out.alpha.push_back(1.0 / mu(kept[k]));
    out.vectors.col(static_cast<Eigen::Index>(k)) = vectors.col(kept[k]);
  }
  out.block = out.vectors;  // not a whole converged block: the next start pads it (start_block)
  return out;
}

// The lowest alphas of one pattern: by subspace iteration from `start` when
// there is one, by Lanczos otherwise or when that does not settle. A start
// of a whole block's columns is another pattern's converged block (Eigenpairs::block).
template <class Op>
std::optional<Eigenpairs> solve_pattern(const Op& op, const Sparse& g, std::size_t modes, double tolerance,
                                        const Eigen::MatrixXd& start) {
  if (start.rows() == op.rows() && start.cols() > 0) {
    const Eigen::Index m = block_size(modes);
    if (auto pairs = subspace_iteration(op, g, start_block(start, op.rows(), m), modes, tolerance, start.cols() == m))
      return pairs;
    spdlog::debug("buckling: subspace iteration did not settle; Lanczos instead");
  } else {
    const Eigen::Index p = block_size(modes);
    if (auto pairs = block_krylov(op, g, start_block(Eigen::MatrixXd(), op.rows(), p), modes, tolerance, 6 * p))
      return pairs;
    spdlog::debug("buckling: block Krylov iteration did not settle; Lanczos instead");
  }
  const Eigen::VectorXd sum = start.rows() == op.rows() ? Eigen::VectorXd(start.rowwise().sum()) : Eigen::VectorXd();
  return lowest_alphas(op, g, modes, tolerance, sum.size() > 0 ? &sum : nullptr);
}

// Modes in the model's own terms from eigenvectors of a mesh.
std::vector<BucklingMode> to_modes(const FrameModel& model, const Mesh& mesh, const DofNumbering& dofs,
                                   const Eigenpairs& pairs) {
  std::vector<BucklingMode> modes;
  for (std::size_t i = 0; i < pairs.alpha.size(); ++i) {
    const Eigen::VectorXd full = expand_free(pairs.vectors.col(static_cast<Eigen::Index>(i)), dofs);
    double largest = 0;
    for (std::size_t p = 0; p < mesh.model.nodes.size(); ++p)
      largest = std::max(largest, full.segment<3>(global_dof(p, ux)).norm());
    const double scale = largest > 0 ? 1.0 / largest : 1.0;
    BucklingMode mode;
    mode.alpha = pairs.alpha[i];
    mode.displacements = scale * full.head(static_cast<Eigen::Index>(6 * model.nodes.size()));
    mode.inner_points.resize(model.elements.size());
    for (std::size_t e = 0; e < model.elements.size(); ++e)
      for (std::size_t k = 1; k + 1 < mesh.points[e].size(); ++k)
        mode.inner_points[e].push_back(scale * full.segment<6>(global_dof(mesh.points[e][k], ux)));
    modes.push_back(std::move(mode));
  }
  std::sort(modes.begin(), modes.end(), [](const BucklingMode& a, const BucklingMode& b) { return a.alpha < b.alpha; });
  return modes;
}

// Parts each element needs so that no part carries more than `ratio` of its
// own Euler load at `alpha`: rho = alpha |N| L^2 / (pi^2 E I_min) for the
// whole element, and n parts carry rho / n^2 each. `alpha` is capped at the
// element's own fixed-ended buckling factor, 4 pi^2 E I / (|N| L^2) (rho = 4):
// a mode inside one element (its nodes held) is not seen by the undivided
// model, so its divisions must not hang on what the undivided model found.
std::size_t parts_needed(const FrameModel& model, std::size_t e, const AxialForce& axial, double alpha,
                         const BucklingOptions& options) {
  const FrameElement& el = model.elements[e];
  const double L = (model.nodes[el.nodes[1]] - model.nodes[el.nodes[0]]).norm();
  double compression = 0;
  for (double t : {0.0, 0.25, 0.5, 0.75, 1.0}) compression = std::max(compression, -axial(e, t * L));
  if (compression <= 0) return 1;
  const Section& s = model.sections[el.section];
  const double rho =
      std::min(4.0, alpha * compression * L * L / (pi * pi * model.materials[el.material].E * std::min(s.Iy, s.Iz)));
  const double n = std::ceil(std::sqrt(rho / options.part_load_ratio) - 1e-12);
  return std::clamp<std::size_t>(static_cast<std::size_t>(std::max(n, 1.0)), 1, options.max_parts);
}

// The state (ux uy uz rx ry rz, global) at fraction xi of a straight piece of
// length h between end states a and b (global): cubic Hermite interpolation
// of the bending translations with the end rotations (frame_element.hpp
// conventions: rz = dv/dx, ry = -dw/dx), the rotations their slopes, axial
// translation and twist linear. Exact for the element's own shape functions.
Vector6d hermite_state(const Eigen::Matrix3d& axes, double h, const Vector6d& a, const Vector6d& b, double xi) {
  const Eigen::Vector3d ua = axes * a.head<3>(), ub = axes * b.head<3>();  // local translations
  const Eigen::Vector3d ra = axes * a.tail<3>(), rb = axes * b.tail<3>();  // local rotations
  const double x2 = xi * xi, x3 = x2 * xi;
  const double h1 = 1 - 3 * x2 + 2 * x3, h2 = xi - 2 * x2 + x3, h3 = 3 * x2 - 2 * x3, h4 = -x2 + x3;
  const double d1 = (-6 * xi + 6 * x2) / h, d2 = 1 - 4 * xi + 3 * x2, d3 = (6 * xi - 6 * x2) / h, d4 = -2 * xi + 3 * x2;
  const Eigen::Vector3d u((1 - xi) * ua.x() + xi * ub.x(), h1 * ua.y() + h2 * h * ra.z() + h3 * ub.y() + h4 * h * rb.z(),
                          h1 * ua.z() - h2 * h * ra.y() + h3 * ub.z() - h4 * h * rb.y());
  const Eigen::Vector3d r((1 - xi) * ra.x() + xi * rb.x(), -(d1 * ua.z() - d2 * ra.y() + d3 * ub.z() - d4 * rb.y()),
                          d1 * ua.y() + d2 * ra.z() + d3 * ub.y() + d4 * rb.z());
  Vector6d out;
  out << axes.transpose() * u, axes.transpose() * r;
  return out;
}

// Vectors of the model's own free DOFs carried to the refined mesh: the same
// values at the model's nodes, and at each element's inner nodes what the
// element's own shape functions give (the coarse solution, embedded exactly).
Eigen::MatrixXd refined(const FrameModel& model, const Mesh& fine, const DofNumbering& dofs,
                        const DofNumbering& fine_dofs, const Eigen::MatrixXd& vectors) {
  Eigen::MatrixXd out = Eigen::MatrixXd::Zero(fine_dofs.free_count(), vectors.cols());
  out.topRows(vectors.rows()) = vectors;  // the model's free DOFs come first in the refined numbering
  auto state = [&](std::size_t node, Eigen::Index column) {
    Vector6d v;
    for (int d = 0; d < 6; ++d) {
      const Eigen::Index i = dofs.free_index[static_cast<std::size_t>(global_dof(node, d))];
      v(d) = i >= 0 ? vectors(i, column) : 0.0;
    }
    return v;
  };
  for (std::size_t e = 0; e < fine.points.size(); ++e) {
    const auto& points = fine.points[e];
    if (points.size() <= 2) continue;
    const ElementGeometry geo = element_geometry(model, e);
    for (Eigen::Index c = 0; c < vectors.cols(); ++c) {
      const Vector6d a = state(points.front(), c), b = state(points.back(), c);
      for (std::size_t k = 1; k + 1 < points.size(); ++k) {
        const double xi = static_cast<double>(k) / static_cast<double>(points.size() - 1);
        const Vector6d v = hermite_state(geo.axes, geo.length, a, b, xi);
        for (int d = 0; d < 6; ++d) out(fine_dofs.free_index[static_cast<std::size_t>(global_dof(points[k], d))], c) = v(d);
      }
    }
  }
  return out;
}

// The mesh's elastic stiffness, reduced and factorised.
struct OwnStiffness {
  DofNumbering dofs;
  Sparse k_free;
  std::unique_ptr<StiffnessFactor> factor;
};

OwnStiffness factorise(const FrameModel& m) {
  OwnStiffness s;
  s.dofs = number_dofs(m);
  Sparse k_full = assemble_stiffness(m);
  tie_released_rotations(k_full, s.dofs, m);
  s.k_free = free_block(k_full, s.dofs);
  s.factor = std::make_unique<StiffnessFactor>(s.k_free, s.dofs, m.nodes);
  return s;
}

// The blocks of the condensed operator: every divided element's inner stiffness and its
// coupling to its ends, from its parts' stiffnesses (global axes).
std::vector<CondensedStiffnessOp::Block> inner_blocks(const Mesh& fine, const DofNumbering& fine_dofs) {
  std::vector<std::size_t> divided;
  for (std::size_t e = 0; e < fine.parts.size(); ++e)
    if (fine.parts[e] > 1) divided.push_back(e);
  std::vector<CondensedStiffnessOp::Block> blocks(divided.size());
  parallel_for(divided.size(), [&](std::size_t d) {
    const std::size_t e = divided[d], n = fine.parts[e];
    const auto& points = fine.points[e];
    const auto size = static_cast<Eigen::Index>(6 * (n + 1));
    Eigen::MatrixXd k = Eigen::MatrixXd::Zero(size, size);  // the element's nodes in order, 6 DOFs each
    for (std::size_t part = 0; part < n; ++part)
      k.block<12, 12>(static_cast<Eigen::Index>(6 * part), static_cast<Eigen::Index>(6 * part)) +=
          element_system(fine.model, fine.first_part[e] + part, {}).k;
    const Eigen::Index inner = 6 * static_cast<Eigen::Index>(n - 1);
    CondensedStiffnessOp::Block& b = blocks[d];
    b.inner_first = fine_dofs.free_index[static_cast<std::size_t>(global_dof(points[1], ux))];
    b.kii = k.block(6, 6, inner, inner);
    b.kii_factor.compute(b.kii);
    b.kie.resize(inner, 12);
    b.kie.leftCols<6>() = k.block(6, 0, inner, 6);
    b.kie.rightCols<6>() = k.block(6, size - 6, inner, 6);
    for (int j = 0; j < 12; ++j) {
      const std::size_t node = j < 6 ? points.front() : points.back();
      b.ends[static_cast<std::size_t>(j)] = fine_dofs.free_index[static_cast<std::size_t>(global_dof(node, j % 6))];
      if (b.ends[static_cast<std::size_t>(j)] < 0) b.kie.col(j).setZero();  // a supported end DOF stays at zero
    }
  });
  return blocks;
}

}  // namespace

std::vector<std::vector<BucklingMode>> buckling_modes(const FrameModel& model, const std::vector<AxialForce>& patterns,
                                                      const BucklingOptions& options,
                                                      const FactorisedStiffness* stiffness,
                                                      const std::function<void(double)>& progress) {
  auto report = [&](double f) {
    if (progress) progress(f);
  };
  std::vector<std::vector<BucklingMode>> result(patterns.size());
  if (options.modes == 0 || patterns.empty()) return result;

  // Pass 1: the model's own elements, its own factorised stiffness.
  const Mesh coarse = detail::divide_elements(model, std::vector<std::size_t>(model.elements.size(), 1));
  std::optional<OwnStiffness> own;
  if (!stiffness) own = factorise(model);
  const Sparse& k_free = stiffness ? stiffness->k_free : own->k_free;
  const DofNumbering& dofs = stiffness ? stiffness->dofs : own->dofs;
  const StiffnessFactor& factor = stiffness ? stiffness->factor : *own->factor;

  std::vector<std::size_t> parts(model.elements.size(), 1);
  const double steps = 2.0 * static_cast<double>(patterns.size());
  const StiffnessOp own_op(k_free, factor);
  // The first compressed pattern is solved; every later one gets only Rayleigh-Ritz bounds on that
  // pattern's subspace (combinations of one frame buckle alike), enough to divide the elements on the
  // safe side (parts_needed grows with alpha) and to start pass 2, which solves it. Where the bounds
  // fall short of the modes wanted, the pattern is solved here too. Any Ritz alpha is an upper bound,
  // so these solves need not be tight: 10 times looser than asked (a few block solves fewer); the
  // results come from pass 2, or, when no element needs dividing, from solving again from here.
  const double coarse_tolerance = 10 * options.tolerance;
  Eigen::MatrixXd start;
  std::vector<std::optional<Eigenpairs>> pass1(patterns.size());  // each pattern's pairs (or bounds) of pass 1
  std::vector<bool> compressed(patterns.size(), false);
  for (std::size_t p = 0; p < patterns.size(); ++p) {
    report(static_cast<double>(p) / steps);
    const std::vector<double> forces = part_forces(model, coarse, patterns[p]);
    compressed[p] = compresses(coarse, forces);
    if (!compressed[p]) continue;
    const Sparse g = negative_geometric_stiffness(coarse, forces, dofs);
    std::optional<Eigenpairs> pairs;
    bool bounded = false;
    if (start.cols() == block_size(options.modes))
      if (const auto ritz = ritz_on(own_op, g, start)) {
        pairs = converged_pairs(ritz->mu, ritz->vectors, static_cast<Eigen::Index>(options.modes));
        bounded = pairs->alpha.size() == options.modes;
      }
    if (!bounded) pairs = solve_pattern(own_op, g, options.modes, coarse_tolerance, start);
    // Without modes on the undivided model (a member buckling between held nodes), every
    // compressed element is divided as for its own buckling (parts_needed's cap).
    const double alpha_top = pairs && !pairs->alpha.empty() ? *std::max_element(pairs->alpha.begin(), pairs->alpha.end())
                                                            : std::numeric_limits<double>::infinity();
    for (std::size_t e = 0; e < model.elements.size(); ++e)
      parts[e] = std::max(parts[e], parts_needed(model, e, patterns[p], alpha_top, options));
    if (!pairs || pairs->alpha.empty()) continue;
    if (!bounded) start = pairs->block;
    pass1[p] = std::move(pairs);
  }
  const std::size_t divided = static_cast<std::size_t>(std::count_if(parts.begin(), parts.end(), [](std::size_t n) { return n > 1; }));
  if (divided == 0) {
    spdlog::debug("buckling: no element needs dividing; {} pattern(s) solved on the model's own elements", patterns.size());
    for (std::size_t p = 0; p < patterns.size(); ++p) {
      if (!pass1[p]) continue;  // not compressed, or no modes found
      const Sparse g = negative_geometric_stiffness(coarse, part_forces(model, coarse, patterns[p]), dofs);
      if (const auto pairs = solve_pattern(own_op, g, options.modes, options.tolerance, pass1[p]->block))
        result[p] = to_modes(model, coarse, dofs, *pairs);
    }
    report(1.0);
    return result;
  }

  // Pass 2: one refined model for every pattern, its stiffness through the model's own factor; the
  // first pattern started from its pass-1 modes carried to the inner nodes, every later one from the
  // block the pattern before converged to.
  const Mesh fine = detail::divide_elements(model, parts);
  const DofNumbering fine_dofs = number_dofs(fine.model);
  const CondensedStiffnessOp fine_op(k_free, factor, inner_blocks(fine, fine_dofs), fine_dofs.free_count());
  spdlog::debug("buckling: {} of {} elements divided, {} DOFs", divided, model.elements.size(), fine_dofs.free_count());
  Eigen::MatrixXd fine_start;
  for (std::size_t p = 0; p < patterns.size(); ++p) {
    report(0.5 + static_cast<double>(p) / steps);
    if (!compressed[p]) continue;
    const std::vector<double> forces = part_forces(model, fine, patterns[p]);
    const Eigen::MatrixXd start_p = fine_start.size() > 0 ? fine_start
                                    : pass1[p]             ? refined(model, fine, dofs, fine_dofs, pass1[p]->vectors)
                                                           : Eigen::MatrixXd();
    const auto pairs = solve_pattern(fine_op, negative_geometric_stiffness(fine, forces, fine_dofs), options.modes,
                                     options.tolerance, start_p);
    result[p] = pairs ? to_modes(model, fine, fine_dofs, *pairs) : std::vector<BucklingMode>{};
    if (pairs) fine_start = pairs->block;
  }
  report(1.0);
  return result;
}

Eigen::Vector3d mode_translation(const FrameModel& model, const BucklingMode& mode, std::size_t element, double t) {
  const FrameElement& el = model.elements[element];
  const std::vector<Vector6d>& inner = mode.inner_points.at(element);
  const std::size_t parts = inner.size() + 1;
  auto point = [&](std::size_t k) -> Vector6d {
    if (k == 0) return mode.displacements.segment<6>(global_dof(el.nodes[0], ux));
    if (k == parts) return mode.displacements.segment<6>(global_dof(el.nodes[1], ux));
    return inner[k - 1];
  };
  t = std::clamp(t, 0.0, 1.0);
  const std::size_t k = std::min(parts - 1, static_cast<std::size_t>(t * static_cast<double>(parts)));
  const double xi = t * static_cast<double>(parts) - static_cast<double>(k);
  const ElementGeometry geo = element_geometry(model, element);
  return hermite_state(geo.axes, geo.length / static_cast<double>(parts), point(k), point(k + 1), xi).head<3>();
}

}  // namespace stepframe::analysis
