#pragma once
// Uniform spatial hashing of points and segments: neighbours of a point in
// expected O(1), so merging and junction finding stay O(n) for n end points.

#include <Eigen/Core>

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <unordered_map>
#include <vector>

namespace stepframe::geometry::detail {

using Cell = std::array<std::int64_t, 3>;

struct CellHash {
  std::size_t operator()(const Cell& c) const noexcept {
    // Large odd multipliers spread neighbouring cells over the table
    // (common practice for spatial hashing of integer grid coordinates).
    const auto h = static_cast<std::uint64_t>(c[0]) * 0x9E3779B97F4A7C15ULL ^
                   static_cast<std::uint64_t>(c[1]) * 0xC2B2AE3D27D4EB4FULL ^
                   static_cast<std::uint64_t>(c[2]) * 0x165667B19E3779F9ULL;
    return static_cast<std::size_t>(h ^ (h >> 29));
  }
};

/// A segment that would span more cells than this is not bucketed: the
/// searches compare it with everything instead. A frame has a handful at
/// most; without the cap, one member a billion times longer than the typical
/// one (a corrupt coordinate or trim parameter) would need a billion cells.
inline constexpr double max_cells_per_segment = 1024;

/// How many pieces of at most `size` a segment of `length` is cut into for
/// bucketing, or 0 when it spans more than max_cells_per_segment cells (or
/// its length is not finite).
inline std::size_t pieces_for(double length, double size) {
  const double pieces = std::ceil(length / size);
  return pieces <= max_cells_per_segment ? std::max<std::size_t>(1, static_cast<std::size_t>(pieces)) : 0;
}

inline Cell cell_of(const Eigen::Vector3d& p, double size) {
  return {static_cast<std::int64_t>(std::floor(p.x() / size)), static_cast<std::int64_t>(std::floor(p.y() / size)),
          static_cast<std::int64_t>(std::floor(p.z() / size))};
}

/// Items (indices) bucketed in cubic cells of edge `size`. Every item within
/// `size` of a point lies in the point's cell or one of its 26 neighbours.
class Grid {
 public:
  explicit Grid(double size) : size_(size) {}
  double size() const { return size_; }
  void reserve(std::size_t cells) { cells_.reserve(cells); }

  void add(const Cell& cell, std::size_t item) {
    auto& bucket = cells_[cell];
    if (bucket.empty() || bucket.back() != item) bucket.push_back(item);
  }
  void add(const Eigen::Vector3d& p, std::size_t item) { add(cell_of(p, size_), item); }

  /// Calls visit(item) for every item in the 27 cells around p (an item may
  /// come more than once when it was added to several of them).
  template <class Visit>
  void near(const Eigen::Vector3d& p, Visit&& visit) const {
    const Cell home = cell_of(p, size_);
    for (std::int64_t dx = -1; dx <= 1; ++dx)
      for (std::int64_t dy = -1; dy <= 1; ++dy)
        for (std::int64_t dz = -1; dz <= 1; ++dz) {
          const auto bucket = cells_.find(Cell{home[0] + dx, home[1] + dy, home[2] + dz});
          if (bucket == cells_.end()) continue;
          for (const std::size_t item : bucket->second) visit(item);
        }
  }

 private:
  double size_;
  std::unordered_map<Cell, std::vector<std::size_t>, CellHash> cells_;
};

/// Merges points into nodes: a point joins the nearest node within the
/// tolerance (the lower index on a tie) or becomes a new node.
class NodeGrid {
 public:
  static constexpr std::size_t npos = static_cast<std::size_t>(-1);
  explicit NodeGrid(double tolerance) : tolerance_(tolerance), grid_(tolerance) {}
  void reserve(std::size_t nodes) { grid_.reserve(nodes); }

  std::size_t find(const Eigen::Vector3d& p, const std::vector<Eigen::Vector3d>& nodes) const {
    std::size_t best = npos;
    double best_distance = 0.0;
    grid_.near(p, [&](std::size_t candidate) {
      const double distance = (nodes[candidate] - p).norm();
      if (distance > tolerance_) return;
      if (best == npos || distance < best_distance || (distance == best_distance && candidate < best)) {
        best = candidate;
        best_distance = distance;
      }
    });
    return best;
  }

  std::size_t merge(const Eigen::Vector3d& p, std::vector<Eigen::Vector3d>& nodes) {
    if (const std::size_t found = find(p, nodes); found != npos) return found;
    nodes.push_back(p);
    grid_.add(p, nodes.size() - 1);
    return nodes.size() - 1;
  }

 private:
  double tolerance_;
  Grid grid_;
};

/// Nearest point of segment [a, b] to p, as the parameter t in [0, 1]
/// (orthogonal projection clamped to the segment; common practice).
inline double closest_parameter(const Eigen::Vector3d& a, const Eigen::Vector3d& b, const Eigen::Vector3d& p) {
  const Eigen::Vector3d d = b - a;
  const double length2 = d.squaredNorm();
  if (length2 == 0.0) return 0.0;
  return std::clamp((p - a).dot(d) / length2, 0.0, 1.0);
}

}  // namespace stepframe::geometry::detail
