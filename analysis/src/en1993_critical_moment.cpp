// Elastic critical moment for lateral-torsional buckling of a member with any
// moment diagram, by the energy method with sine series.

#include "stepframe/analysis/en1993.hpp"

#include "largest_eigenvalue.hpp"

#include <Eigen/Core>

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <numbers>
#include <stdexcept>
#include <string>
#include <vector>

namespace stepframe::analysis::en1993 {

namespace {

// Small matrices and vectors, kept on the stack (largest_eigenvalue.hpp).
constexpr int most = detail::small_most;
using Matrix = detail::SmallMatrix;
using Vector = detail::SmallVector;

// sin(i theta), i = 1..n, by the recurrence sin((i+1) t) = 2 cos t sin(i t) - sin((i-1) t)
// (the Chebyshev recurrence; two library calls instead of n).
void fill_sines(double theta, Vector& sines) {
  const double c2 = 2 * std::cos(theta);
  double previous = 0, current = std::sin(theta);
  for (Eigen::Index i = 0; i < sines.size(); ++i) {
    sines(i) = current;
    const double next = c2 * current - previous;
    previous = current;
    current = next;
  }
}

}  // namespace

bool lie_at(const std::vector<DiagramPoint>& diagram, const std::vector<double>& x) {
  return diagram.size() == x.size() &&
         std::equal(x.begin(), x.end(), diagram.begin(), [](double at, const DiagramPoint& p) { return at == p.x; });
}

DiagramIntegrals diagram_integrals(std::vector<double> x, int terms) {
  if (x.size() < 2) throw std::invalid_argument("critical_moment_for_diagram: at least two points are needed");
  if (terms < 1 || 2 * terms > most)
    throw std::invalid_argument("critical_moment_for_diagram: terms must be from 1 to " + std::to_string(most / 2));
  const double L = x.back() - x.front(), x0 = x.front();
  const double pi = std::numbers::pi;
  const auto n = static_cast<Eigen::Index>(terms);
  const auto block = static_cast<std::size_t>(n * n);
  DiagramIntegrals out;
  out.terms = terms;
  out.moment.assign(x.size() * block, 0.0);
  out.load.assign((x.size() - 1) * block, 0.0);
  if (L > 0) {
    // Moment term: int M(x) (i pi / L)^2 sin_i sin_j dx, M linear between points, integrated by the 3-point
    // Gauss rule on sub-intervals: about three points per half-wave of the highest product sin_n sin_n.
    // Each Gauss point's product goes to the interval's two points, in shares (1 - t) and t.
    const auto intervals = static_cast<int>(x.size() - 1);
    const int sub = std::max(1, (2 * terms + intervals - 1) / intervals);
    const double gauss_x[3] = {-std::sqrt(0.6), 0.0, std::sqrt(0.6)}, gauss_w[3] = {5.0 / 9, 8.0 / 9, 5.0 / 9};
    Vector sines(n);  // sin_i(x) at one point
    // Per Gauss point k of an interval: its sines, and (i pi / L)^2 sin_i times its two shares' weights.
    const auto points = static_cast<std::size_t>(3 * sub), rows = static_cast<std::size_t>(n);
    std::vector<double> point_sines(points * rows), share_a(points * rows), share_b(points * rows);
    for (std::size_t p = 0; p + 1 < x.size(); ++p) {
      const double xa = x[p] - x0, xb = x[p + 1] - x0;
      if (xb - xa <= 0) continue;
      for (int s = 0; s < sub; ++s) {
        const double sa = xa + (xb - xa) * s / sub, sb = xa + (xb - xa) * (s + 1) / sub;
        for (int g = 0; g < 3; ++g) {
          const double xg = 0.5 * (sa + sb) + 0.5 * (sb - sa) * gauss_x[g], weight = 0.5 * (sb - sa) * gauss_w[g];
          const double t = (xg - xa) / (xb - xa);
          fill_sines(pi * xg / L, sines);
          const std::size_t k = static_cast<std::size_t>(3 * s + g) * rows;
          for (std::size_t i = 0; i < rows; ++i) {
            const double wi = static_cast<double>(i + 1) * pi / L;
            const double bent = wi * wi * sines(static_cast<Eigen::Index>(i));
            point_sines[k + i] = sines(static_cast<Eigen::Index>(i));
            share_a[k + i] = (weight * (1 - t)) * bent;
            share_b[k + i] = (weight * t) * bent;
          }
        }
      }
      // The blocks of the interval's two points: sum over k of share_k sines_k^T, k in order (plain loops
      // over contiguous columns: the compiler vectorises them; Eigen's outer products per point did not).
      double* at_a = out.moment.data() + p * block;
      double* at_b = out.moment.data() + (p + 1) * block;
      for (std::size_t j = 0; j < rows; ++j)
        for (std::size_t k = 0; k < points * rows; k += rows) {
          const double sj = point_sines[k + j];
          for (std::size_t i = 0; i < rows; ++i) {
            at_a[j * rows + i] += share_a[k + i] * sj;
            at_b[j * rows + i] += share_b[k + i] * sj;
          }
        }
    }
    // Load-height term: sin_i sin_j at the middle of each interval (a point load is the jump between two
    // points at the same x).
    for (std::size_t p = 0; p + 1 < x.size(); ++p) {
      fill_sines(pi * (0.5 * (x[p] + x[p + 1]) - x0) / L, sines);
      Eigen::Map<Matrix>(out.load.data() + p * block, n, n) = sines * sines.transpose();
    }
  }
  out.x = std::move(x);
  return out;
}

double critical_moment_for_diagram(const LateralTorsionalStiffness& k, const std::vector<DiagramPoint>& diagram,
                                   double load_height, int terms) {
  std::vector<double> x;
  x.reserve(diagram.size());
  for (const auto& p : diagram) x.push_back(p.x);
  return critical_moment_for_diagram(k, diagram_integrals(std::move(x), terms), diagram, load_height);
}

namespace {

// The scaled matrix S = K^-1/2 G K^-1/2 of a diagram (Mcr = max|M| / lambda_max(S)), 2 terms x 2 terms,
// and the diagram's max|M|.
struct ScaledProblem {
  Matrix s;
  double peak = 0;
  Vector r;  // K^-1/2
};

ScaledProblem scaled_problem(const LateralTorsionalStiffness& k, const DiagramIntegrals& integrals,
                             const std::vector<DiagramPoint>& diagram, double load_height) {
  if (!lie_at(diagram, integrals.x))
    throw std::invalid_argument("critical_moment_for_diagram: the diagram's points are not those of its integrals");
  const double L = integrals.x.back() - integrals.x.front();
  const double pi = std::numbers::pi;
  const auto n = static_cast<Eigen::Index>(integrals.terms);
  const auto block = static_cast<std::size_t>(n * n);
  ScaledProblem out;
  for (const auto& p : diagram) out.peak = std::max(out.peak, std::abs(p.M));
  if (out.peak <= 0 || L <= 0) return out;

  // Lateral displacement u = sum a_i sin(i pi x / L) and twist phi = sum b_i sin(i pi x / L): fork supports
  // at both ends (u = phi = u'' = phi'' = 0). Strain energy (Timoshenko & Gere 1961, 6.3; Trahair,
  // Flexural-Torsional Buckling of Structures, 1993, ch. 6):
  //   U = 1/2 int (E Iz u''^2 + G It phi'^2 + E Iw phi''^2) dx                  -> K, diagonal
  // Loss of potential under the reference loads scaled by lambda:
  //   V = int M u'' phi dx (sign free: a doubly symmetric section buckles under either sign of M)
  //     + 1/2 sum_loads Q zg phi^2 (a load above the shear centre, towards it: destabilising) -> G
  // Critical state: K x = lambda G x; Mcr = lambda_min+ * max|M|.
  Vector K(2 * n);
  for (Eigen::Index i = 0; i < n; ++i) {
    const double w = static_cast<double>(i + 1) * pi / L, w2 = w * w;
    K(i) = k.E * k.Iz * w2 * w2 * L / 2;                                  // int sin^2 = L / 2
    K(n + i) = (k.G * k.It * w2 + k.E * k.Iw * w2 * w2) * L / 2;
  }
  // Sums of the points' (or intervals') n x n blocks times their weights: the blocks side by side are a
  // matrix (one column per point, each block contiguous), so a sum is one matrix-vector product (the sums
  // on the stack: this runs for every member and result).
  std::array<double, (most / 2) * (most / 2)> c, d;
  auto sum_of = [&](std::array<double, (most / 2) * (most / 2)>& sum, auto weight_of, std::size_t count,
                    const double* blocks) {
    Eigen::VectorXd weights(static_cast<Eigen::Index>(count));
    for (std::size_t p = 0; p < count; ++p) weights(static_cast<Eigen::Index>(p)) = weight_of(p);
    Eigen::Map<Eigen::VectorXd>(sum.data(), static_cast<Eigen::Index>(block)).noalias() =
        Eigen::Map<const Eigen::MatrixXd>(blocks, static_cast<Eigen::Index>(block), static_cast<Eigen::Index>(count)) *
        weights;
  };
  // G = [0 C; C^T D]. 1/2 x^T G x = sum a_i b_j c_ij, c_ij = int M (i pi / L)^2 sin_i sin_j dx = sum_p M_p
  // (the point's block).
  sum_of(c, [&](std::size_t p) { return diagram[p].M; }, diagram.size(), integrals.moment.data());
  // Load-height term D: the transverse load on each interval is the drop of the shear across it, taken at
  // its middle.
  if (load_height != 0)
    sum_of(d, [&](std::size_t p) { return std::abs(diagram[p].V - diagram[p + 1].V) * load_height; },
           diagram.size() - 1, integrals.load.data());
  // G x = mu K x with K diagonal and positive: mu of S = K^-1/2 G K^-1/2; lambda = 1 / mu_max. S block by
  // block, each entry (r_a G_ab) r_b with r = K^-1/2.
  out.r = K.cwiseSqrt().cwiseInverse();
  const Vector& r = out.r;
  out.s.resize(2 * n, 2 * n);
  out.s.topLeftCorner(n, n).setZero();
  for (Eigen::Index j = 0; j < n; ++j)
    for (Eigen::Index i = 0; i < n; ++i) {
      const double cij = c[static_cast<std::size_t>(j * n + i)];  // column-major
      out.s(i, n + j) = (r(i) * cij) * r(n + j);
      out.s(n + j, i) = (r(n + j) * cij) * r(i);
      out.s(n + i, n + j) = load_height != 0 ? (r(n + i) * d[static_cast<std::size_t>(j * n + i)]) * r(n + j) : 0.0;
    }
  return out;
}

// lambda_max(S) of a scaled problem.
double largest_mu(const ScaledProblem& problem, bool load_height) {
  const Eigen::Index n = problem.s.rows() / 2;
  if (!load_height) {
    // S = [0 C; C^T 0]: its eigenvalues are plus and minus the singular values of C, so mu_max is
    // the square root of the largest eigenvalue of C^T C (half the size, an eighth of the work).
    const Matrix C = problem.s.topRightCorner(n, n);
    const Matrix CtC = C.transpose() * C;
    return std::sqrt(std::max(0.0, detail::largest_eigenvalue(CtC)));
  }
  return detail::largest_eigenvalue(problem.s);
}

// What S is linear in (scaled_problem's block weights): M at each point, then Q zg on each interval.
double weight(const std::vector<DiagramPoint>& diagram, double load_height, std::size_t i) {
  if (i < diagram.size()) return diagram[i].M;
  const std::size_t p = i - diagram.size();
  return load_height != 0 ? std::abs(diagram[p].V - diagram[p + 1].V) * load_height : 0.0;
}

// The Frobenius norm of S's change per unit of each weight: sqrt 2 ||R B_p R|| for a point's moment block
// (above and below the diagonal), ||R L_p R|| for an interval's load-height block.
std::vector<double> unit_changes(const Vector& r, const DiagramIntegrals& integrals) {
  const auto n = static_cast<Eigen::Index>(integrals.terms);
  const auto block = static_cast<std::size_t>(n * n);
  const std::size_t points = integrals.x.size();
  std::vector<double> out;
  out.reserve(2 * points - 1);
  auto norm = [&](const double* b, Eigen::Index row_offset) {
    double sum = 0;
    for (Eigen::Index j = 0; j < n; ++j)
      for (Eigen::Index i = 0; i < n; ++i) {
        const double v = r(row_offset + i) * b[static_cast<std::size_t>(j * n + i)] * r(n + j);
        sum += v * v;
      }
    return std::sqrt(sum);
  };
  for (std::size_t p = 0; p < points; ++p) out.push_back(std::sqrt(2.0) * norm(integrals.moment.data() + p * block, 0));
  for (std::size_t p = 0; p + 1 < points; ++p) out.push_back(norm(integrals.load.data() + p * block, n));
  return out;
}

}  // namespace

double critical_moment_for_diagram(const LateralTorsionalStiffness& k, const DiagramIntegrals& integrals,
                                   const std::vector<DiagramPoint>& diagram, double load_height) {
  CriticalMomentReference none;
  return critical_moment_or_bound(k, integrals, diagram, load_height, none, nullptr).value;
}

CriticalMomentEstimate critical_moment_or_bound(const LateralTorsionalStiffness& k, const DiagramIntegrals& integrals,
                                                const std::vector<DiagramPoint>& diagram, double load_height,
                                                CriticalMomentReference& reference,
                                                const std::function<bool(double)>& bound_suffices) {
  constexpr double infinite = std::numeric_limits<double>::infinity();
  auto lower_from = [&](double peak, double mu_above) { return mu_above > 0 ? peak / mu_above : infinite; };
  // The bounds compare S with a reference's S scaled by t = max|M| / max|M|_ref as well as with it as it is:
  // lambda_max(t S_ref) = t mu_ref for t > 0, so mu <= t mu_ref + ||S - t S_ref||_F for any t > 0, and a diagram
  // of a reference's shape at another size (a case's share in similar combinations) is bounded by its own Mcr.
  double peak = 0;
  for (const auto& p : diagram) peak = std::max(peak, std::abs(p.M));
  auto scale_to = [&](const CriticalMomentReference::Solved& ref) { return ref.peak > 0 ? peak / ref.peak : 1.0; };
  const CriticalMomentReference::Solved* closest = nullptr;  // the reference of the least first bound
  if (bound_suffices && !reference.solved.empty() && lie_at(diagram, reference.x)) {
    // Without building S: ||S - t S_ref||_F <= sum |w - t w_ref| (unit change). The margin covers the
    // rounding of both S's sums (a few units in the last place of sum |w| (unit change) each) and of
    // both eigenvalues (of ||S||).
    const std::size_t count = reference.unit_changes.size();
    std::vector<double>& weights = reference.scratch;  // this diagram's, worked out once for every reference
    weights.resize(count);
    for (std::size_t i = 0; i < count; ++i) weights[i] = weight(diagram, load_height, i);
    double least = infinite;
    for (const CriticalMomentReference::Solved& ref : reference.solved) {
      const double t = scale_to(ref), t_most = std::max(1.0, t);
      double change = 0, change_scaled = 0, scale = 0;
      for (std::size_t i = 0; i < count; ++i) {
        const double w = weights[i], w_ref = ref.weights[i], u = reference.unit_changes[i];
        change += std::abs(w - w_ref) * u;
        change_scaled += std::abs(w - t * w_ref) * u;
        scale += (std::abs(w) + t_most * std::abs(w_ref)) * u;
      }
      const double mu_above = std::min(ref.mu + change, t * ref.mu + change_scaled) +
                              1e-12 * (scale + t_most * ref.size + std::max(change, change_scaled));
      if (mu_above < least) least = mu_above, closest = &ref;
    }
    if (peak > 0 && bound_suffices(lower_from(peak, least))) return {lower_from(peak, least), false};
  }
  const ScaledProblem problem = scaled_problem(k, integrals, diagram, load_height);
  if (problem.s.size() == 0) return {infinite, true};  // no moment, or no length
  const auto entries = static_cast<std::size_t>(problem.s.size());
  if (bound_suffices && closest && closest->s.size() == entries) {
    // lambda_max(S) <= t lambda_max(S_ref) + ||S - t S_ref||_F, plus a margin far above the rounding of
    // either eigenvalue (a few units in the last place of ||S||).
    const double t = scale_to(*closest), t_most = std::max(1.0, t);
    double change = 0, change_scaled = 0, size = 0;
    for (std::size_t i = 0; i < entries; ++i) {
      const double s = problem.s.data()[i], s_ref = closest->s[i];
      change += (s - s_ref) * (s - s_ref);
      change_scaled += (s - t * s_ref) * (s - t * s_ref);
      size += s * s + t_most * t_most * s_ref * s_ref;
    }
    const double mu_above =
        std::min(closest->mu + std::sqrt(change), t * closest->mu + std::sqrt(change_scaled)) + 1e-12 * std::sqrt(size);
    const double lower = lower_from(problem.peak, mu_above);
    if (bound_suffices(lower)) return {lower, false};
  }
  const double mu = largest_mu(problem, load_height != 0);
  if (reference.x != integrals.x) {
    reference.solved.clear();  // another member's stations: its references do not apply
    reference.x = integrals.x;
    reference.unit_changes = unit_changes(problem.r, integrals);
  }
  if (reference.keep > 0) {
    // Full: the oldest leaves, its place (and its buffers) taken by this one.
    if (reference.solved.size() >= reference.keep)
      std::rotate(reference.solved.begin(), reference.solved.begin() + 1, reference.solved.end());
    else
      reference.solved.emplace_back();
    CriticalMomentReference::Solved& solved = reference.solved.back();
    solved.s.assign(problem.s.data(), problem.s.data() + entries);
    solved.mu = mu;
    solved.peak = problem.peak;
    solved.size = problem.s.norm();
    solved.weights.resize(reference.unit_changes.size());
    for (std::size_t i = 0; i < solved.weights.size(); ++i) solved.weights[i] = weight(diagram, load_height, i);
  }
  return {mu > 0 ? problem.peak / mu : infinite, true};
}

}  // namespace stepframe::analysis::en1993
