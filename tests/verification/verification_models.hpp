#pragma once
// Model builders for the verification suite. Section and material values are
// round numbers chosen for the tests (not catalogue data); every reference
// value in the suite is computed from them with the published formula named
// beside the check.

#include "../analysis/frame_fixtures.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"
#include "recovered_lines.hpp"
#include "stepframe/analysis/solve.hpp"

#include <Eigen/Core>

#include <array>
#include <cstddef>
#include <vector>

namespace stepframe::analysis::verification {

inline constexpr double E = 210e9;  // Pa
inline constexpr double G = 81e9;   // Pa

// The analysis tests' round-valued section and steel (E and G as above).
inline Section beam_section() { return test::test_section(); }
inline Material steel() { return test::test_steel(); }

inline constexpr std::array<bool, 6> fixed{true, true, true, true, true, true};
/// Pinned in the x-z plane, restrained out of plane and in torsion: a "simple support"
/// of a beam along X loaded in Z.
inline constexpr std::array<bool, 6> pin{true, true, true, true, false, false};
/// Like pin but free along X (a roller), so no axial force arises.
inline constexpr std::array<bool, 6> roller{false, true, true, true, false, false};
/// Free in-plane: only out-of-plane and torsion restrained (keeps a 2D model stable).
inline constexpr std::array<bool, 6> in_plane_only{false, true, false, true, false, true};

/// A straight beam along global X through the given x coordinates [m], one
/// element between neighbours, one member per element. Local z = global Z,
/// so a load along -Z bends it about local y (Iy).
inline FrameModel beam_along_x(const std::vector<double>& xs, const Section& s = beam_section()) {
  FrameModel m;
  for (double x : xs) m.nodes.emplace_back(x, 0.0, 0.0);
  for (std::size_t i = 0; i + 1 < xs.size(); ++i) m.elements.push_back(FrameElement{{i, i + 1}, 0, 0, 0.0, {}});
  m.sections = {s};
  m.materials = {steel()};
  return m;
}

inline Support support(std::size_t node, std::array<bool, 6> f) {
  Support s;
  s.node = node;
  s.fixed = f;
  return s;
}

inline ElementLoad distributed(std::size_t element, double a, double b, const Eigen::Vector3d& wa,
                               const Eigen::Vector3d& wb, LoadAxes axes = LoadAxes::global) {
  ElementLoad l;
  l.element = element;
  l.axes = axes;
  l.a = a;
  l.b = b;
  l.w_start = wa;
  l.w_end = wb;
  return l;
}

inline ElementLoad point(std::size_t element, double a, const Eigen::Vector3d& force) {
  ElementLoad l;
  l.element = element;
  l.point = true;
  l.a = a;
  l.w_start = force;
  return l;
}

/// Solves a model with one case and no buckling analysis; returns that case's result with every line.
inline testing::Recovered solve_one(const FrameModel& model) {
  SolveOptions options;
  options.buckling_modes = 0;
  return testing::recovered(model, solve(model, options).at(0));
}

inline double disp_z(const LoadResult& r, std::size_t node) { return r.displacements(static_cast<Eigen::Index>(6 * node + 2)); }
inline double disp_x(const LoadResult& r, std::size_t node) { return r.displacements(static_cast<Eigen::Index>(6 * node)); }
inline double rot_y(const LoadResult& r, std::size_t node) { return r.displacements(static_cast<Eigen::Index>(6 * node + 4)); }
inline double reaction(const LoadResult& r, std::size_t node, int dof) {
  return r.reactions(static_cast<Eigen::Index>(6 * node) + dof);
}

/// Station of an element's result nearest to x.
inline const Station& station_at(const LineResult& line, double x) {
  const Station* best = &line.stations.front();
  for (const Station& s : line.stations)
    if (std::abs(s.x - x) < std::abs(best->x - x)) best = &s;
  return *best;
}

}  // namespace stepframe::analysis::verification
