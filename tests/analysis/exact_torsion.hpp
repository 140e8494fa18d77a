#pragma once
// The St Venant torsion constant of a solid region bounded by one polygon (no
// holes: a hollow section's inner boundary would need its own constant phi),
// solved rather than approximated: an independent reference for the thin-walled J
// formulas of the section shapes (and for the tables' own values).
//
// Prandtl's stress function: laplacian(phi) = -2 inside, phi = 0 on the boundary,
// J = 2 * integral of phi dA (Timoshenko & Goodier, Theory of Elasticity, 3rd ed.,
// ch. 10). Finite differences on a square grid of spacing h; at nodes next to the
// boundary the Shortley-Weller stencil uses the boundary's own distance along each
// grid line, so the error falls as h^2 and one Richardson step (h, h/2) removes
// most of it. The integral is the trapezoidal rule along the grid rows between the
// boundary crossings (phi = 0 there).

#include "stepframe/analysis/section.hpp"

#include <Eigen/Sparse>
#include <Eigen/SparseLU>

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <stdexcept>
#include <vector>

namespace stepframe::analysis::test {

namespace detail {

/// Where the grid line {z = c} (rows) or {y = c} (columns) crosses the rings' edges, sorted.
inline std::vector<double> crossings(const std::vector<SectionRing>& rings, double c, bool row) {
  std::vector<double> out;
  for (const SectionRing& ring : rings)
    for (std::size_t i = 0; i < ring.size(); ++i) {
      const SectionPoint& p = ring[i];
      const SectionPoint& q = ring[(i + 1) % ring.size()];
      const double pc = row ? p.z : p.y, qc = row ? q.z : q.y;
      const double pa = row ? p.y : p.z, qa = row ? q.y : q.z;
      if ((pc <= c) != (qc <= c)) out.push_back(pa + (c - pc) / (qc - pc) * (qa - pa));
    }
  std::sort(out.begin(), out.end());
  return out;
}

/// J on one grid of spacing h (second-order accurate).
inline double torsion_constant_on_grid(const std::vector<SectionRing>& rings, double h) {
  double y_min = 1e300, y_max = -1e300, z_min = 1e300, z_max = -1e300;
  for (const SectionRing& ring : rings)
    for (const SectionPoint& p : ring) {
      y_min = std::min(y_min, p.y);
      y_max = std::max(y_max, p.y);
      z_min = std::min(z_min, p.z);
      z_max = std::max(z_max, p.z);
    }
  // Grid lines offset by irrational fractions of h, so that none runs through a vertex.
  const double y0 = y_min - (1 + 1 / std::sqrt(2.0)) * h, z0 = z_min - (1 + 1 / std::sqrt(3.0)) * h;
  const int ny = static_cast<int>((y_max - y0) / h) + 2, nz = static_cast<int>((z_max - z0) / h) + 2;
  std::vector<std::vector<double>> rows, columns;
  for (int k = 0; k < nz; ++k) rows.push_back(crossings(rings, z0 + k * h, true));
  for (int j = 0; j < ny; ++j) columns.push_back(crossings(rings, y0 + j * h, false));
  const auto cell = [&](int j, int k) { return static_cast<std::size_t>(k) * static_cast<std::size_t>(ny) + static_cast<std::size_t>(j); };

  // Unknowns: the nodes inside (odd number of crossings before them along their row).
  std::vector<int> index(cell(0, nz), -1);
  int n = 0;
  for (int k = 0; k < nz; ++k) {
    const std::vector<double>& xs = rows[static_cast<std::size_t>(k)];
    for (int j = 0; j < ny; ++j)
      if (std::count_if(xs.begin(), xs.end(), [&](double v) { return v < y0 + j * h; }) % 2 == 1) index[cell(j, k)] = n++;
  }
  // Distance from x to the boundary along a grid line towards `direction`; h when the neighbour node comes first.
  const auto reach = [h](const std::vector<double>& xs, double x, int direction) {
    double d = h;
    for (const double v : xs)
      if (const double e = (v - x) * direction; e > 0 && e < d) d = e;
    return std::max(d, 1e-9 * h);
  };
  std::vector<Eigen::Triplet<double>> entries;
  for (int k = 0; k < nz; ++k)
    for (int j = 0; j < ny; ++j) {
      const int i = index[cell(j, k)];
      if (i < 0) continue;
      double diagonal = 0;
      for (const bool along_row : {true, false}) {
        const auto& xs = along_row ? rows[static_cast<std::size_t>(k)] : columns[static_cast<std::size_t>(j)];
        const double x = along_row ? y0 + j * h : z0 + k * h;
        const double back = reach(xs, x, -1), ahead = reach(xs, x, +1);
        // -d2phi/dx2 with unequal arms (Shortley-Weller); phi = 0 where an arm ends on the boundary.
        const double c_back = 2 / (back * (back + ahead)), c_ahead = 2 / (ahead * (back + ahead));
        diagonal += c_back + c_ahead;
        if (back == h) entries.emplace_back(i, index[along_row ? cell(j - 1, k) : cell(j, k - 1)], -c_back);
        if (ahead == h) entries.emplace_back(i, index[along_row ? cell(j + 1, k) : cell(j, k + 1)], -c_ahead);
      }
      entries.emplace_back(i, i, diagonal);
    }
  Eigen::SparseMatrix<double> A(n, n);
  A.setFromTriplets(entries.begin(), entries.end());
  const Eigen::SparseLU<Eigen::SparseMatrix<double>> lu(A);
  const Eigen::VectorXd phi = lu.solve(Eigen::VectorXd::Constant(n, 2.0));

  double integral = 0;
  for (int k = 0; k < nz; ++k) {
    const std::vector<double>& xs = rows[static_cast<std::size_t>(k)];
    for (std::size_t m = 0; m + 1 < xs.size(); m += 2) {
      double y_prev = xs[m], phi_prev = 0;
      for (int j = static_cast<int>(std::ceil((xs[m] - y0) / h)); y0 + j * h < xs[m + 1]; ++j) {
        const double phi_j = phi[index[cell(j, k)]];
        integral += 0.5 * (phi_prev + phi_j) * (y0 + j * h - y_prev) * h;
        y_prev = y0 + j * h;
        phi_prev = phi_j;
      }
      integral += 0.5 * phi_prev * (xs[m + 1] - y_prev) * h;
    }
  }
  return 2 * integral;
}

}  // namespace detail

/// St Venant torsion constant [m^4] of the region inside one ring, on grids of
/// spacing h and h/2, Richardson-extrapolated. Throws for more than one ring.
inline double exact_torsion_constant(const std::vector<SectionRing>& rings, double h) {
  if (rings.size() != 1) throw std::invalid_argument("exact_torsion_constant: one ring (a solid region) expected");
  return (4 * detail::torsion_constant_on_grid(rings, h / 2) - detail::torsion_constant_on_grid(rings, h)) / 3;
}

/// The same for an open section's drawing outline (arcs as 8 chords per quarter circle, which
/// adds a little material at the root fillets: J up to 0.5 % above that of the true arcs), with h
/// an eighth of its thinnest plate.
inline double exact_torsion_constant(const Section& s) {
  double t = s.t_max;
  for (const SectionPart& part : s.parts) t = std::min(t, part.t);
  return exact_torsion_constant(s.outline, t / 8);
}

}  // namespace stepframe::analysis::test
