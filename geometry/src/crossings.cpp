#include "crossings.hpp"

#include "spatial_grid.hpp"

#include <Eigen/Geometry>

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <tuple>
#include <utility>

namespace stepframe::geometry::detail {

namespace {

// Nearest points of segments p1 + s d1 and p2 + t d2, s, t in [0, 1]
// (Ericson, Real-Time Collision Detection, 2005, section 5.1.9, "closest
// points of two line segments"), for segments of non-zero length.
std::pair<double, double> nearest_parameters(const PathSegment& one, const PathSegment& two) {
  const Eigen::Vector3d d1 = one.b - one.a, d2 = two.b - two.a, r = one.a - two.a;
  const double a = d1.squaredNorm(), e = d2.squaredNorm(), f = d2.dot(r);
  const double c = d1.dot(r), b = d1.dot(d2);
  const double denominator = a * e - b * b;  // |d1 x d2|^2, >= 0
  double s = denominator > 0.0 ? std::clamp((b * f - c * e) / denominator, 0.0, 1.0) : 0.0;
  double t = (b * s + f) / e;
  if (t < 0.0) {
    t = 0.0;
    s = std::clamp(-c / a, 0.0, 1.0);
  } else if (t > 1.0) {
    t = 1.0;
    s = std::clamp((b - c) / a, 0.0, 1.0);
  }
  return {s, t};
}

// True when the point at parameter s of the segment lies within `tolerance`
// of an end of its path.
bool near_path_end(const PathSegment& segment, double s, double tolerance) {
  const double length = (segment.b - segment.a).norm();
  return (segment.starts_path && s * length <= tolerance) || (segment.ends_path && (1.0 - s) * length <= tolerance);
}

}  // namespace

std::vector<Crossing> find_crossings(const std::vector<PathSegment>& segments, double tolerance) {
  std::vector<Crossing> crossings;
  if (segments.size() < 2) return crossings;
  // Cells about as long as a typical segment, and at least a few tolerances.
  std::vector<double> lengths;
  lengths.reserve(segments.size());
  for (const PathSegment& s : segments) lengths.push_back((s.b - s.a).norm());
  const auto middle = lengths.begin() + static_cast<std::ptrdiff_t>(lengths.size() / 2);
  std::nth_element(lengths.begin(), middle, lengths.end());
  const double size = std::max(*middle, 4.0 * tolerance);
  // Grid corners half a cell off the origin: frames set out on round
  // coordinates then have their nodes inside cells, not on cell faces.
  const Eigen::Vector3d origin = Eigen::Vector3d::Constant(-0.5 * size);
  auto cell = [&](const Eigen::Vector3d& p) { return cell_of(p - origin, size); };

  // The crossing of two segments, if they pass within `tolerance` away from their paths' ends. With `home`,
  // only where the crossing lies in that cell (a pair met in several cells counts in one).
  auto meet = [&](const PathSegment& one, const PathSegment& two, const Cell* home) {
    if (one.path == two.path) return;
    const Eigen::Vector3d d1 = one.b - one.a, d2 = two.b - two.a;
    // Parallel segments overlap or pass alongside; the overlap check reports them.
    if (d1.cross(d2).squaredNorm() <= 1e-18 * d1.squaredNorm() * d2.squaredNorm()) return;
    const auto [s, t] = nearest_parameters(one, two);
    const Eigen::Vector3d p = one.a + s * d1, q = two.a + t * d2;
    if ((p - q).norm() > tolerance) return;
    if (near_path_end(one, s, tolerance) || near_path_end(two, t, tolerance)) return;
    const Eigen::Vector3d at = 0.5 * (p + q);
    if (home && cell(at) != *home) return;
    Crossing c{one.path, two.path, one.index + s, two.index + t, at};
    if (c.first_path > c.second_path) {
      std::swap(c.first_path, c.second_path);
      std::swap(c.first_position, c.second_position);
    }
    crossings.push_back(c);
  };

  // Each segment goes into every cell that a point within `tolerance` of it
  // can lie in: pieces of at most one cell's length, each with its box grown
  // by the tolerance. Two segments within `tolerance` of each other then share
  // the cell of the midpoint of their nearest points. A segment too long to
  // bucket (pieces_for) is compared with every other segment instead.
  std::vector<std::pair<Cell, std::uint32_t>> entries;
  std::vector<std::size_t> unbucketed;
  entries.reserve(3 * segments.size());
  for (std::size_t i = 0; i < segments.size(); ++i) {
    const PathSegment& s = segments[i];
    if (s.a == s.b) continue;
    const std::size_t pieces = pieces_for((s.b - s.a).norm(), size);
    if (pieces == 0) {
      unbucketed.push_back(i);
      continue;
    }
    for (std::size_t k = 0; k < pieces; ++k) {
      const Eigen::Vector3d p = s.a + (s.b - s.a) * (static_cast<double>(k) / static_cast<double>(pieces));
      const Eigen::Vector3d q = s.a + (s.b - s.a) * (static_cast<double>(k + 1) / static_cast<double>(pieces));
      const Cell low = cell((p.cwiseMin(q).array() - tolerance).matrix());
      const Cell high = cell((p.cwiseMax(q).array() + tolerance).matrix());
      for (std::int64_t x = low[0]; x <= high[0]; ++x)
        for (std::int64_t y = low[1]; y <= high[1]; ++y)
          for (std::int64_t z = low[2]; z <= high[2]; ++z) entries.push_back({Cell{x, y, z}, static_cast<std::uint32_t>(i)});
    }
  }
  std::sort(entries.begin(), entries.end());
  entries.erase(std::unique(entries.begin(), entries.end()), entries.end());

  // Pairs within each cell; a pair is kept only in the cell of its midpoint,
  // so a pair sharing several cells is found once.
  for (std::size_t begin = 0; begin < entries.size();) {
    std::size_t end = begin + 1;
    while (end < entries.size() && entries[end].first == entries[begin].first) ++end;
    for (std::size_t i = begin; i < end; ++i)
      for (std::size_t j = i + 1; j < end; ++j)
        meet(segments[entries[i].second], segments[entries[j].second], &entries[begin].first);
    begin = end;
  }
  // The unbucketed segments against every other (a pair of two unbucketed ones once).
  std::vector<char> bucketed(segments.size(), 1);
  for (const std::size_t i : unbucketed) bucketed[i] = 0;
  for (const std::size_t i : unbucketed)
    for (std::size_t j = 0; j < segments.size(); ++j)
      if (j != i && segments[j].a != segments[j].b && (bucketed[j] != 0 || j > i))
        meet(segments[i], segments[j], nullptr);
  std::sort(crossings.begin(), crossings.end(), [](const Crossing& x, const Crossing& y) {
    return std::tie(x.first_path, x.second_path, x.first_position) <
           std::tie(y.first_path, y.second_path, y.first_position);
  });
  return crossings;
}

}  // namespace stepframe::geometry::detail
