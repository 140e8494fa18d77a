#pragma once
// Where the centrelines of two members cross, or pass within a tolerance of
// each other, away from the ends of both: found through a uniform grid in
// expected O(n log n) for n segments, never by testing all pairs.

#include <Eigen/Core>

#include <cstdint>
#include <vector>

namespace stepframe::geometry::detail {

/// One straight segment of a member's path (a straight member is one segment,
/// a curved member many).
struct PathSegment {
  Eigen::Vector3d a, b;
  std::uint32_t path = 0;   ///< which path (member) it belongs to
  std::uint32_t index = 0;  ///< its place along the path: the path runs a -> b through index, index + 1, ...
  bool starts_path = false;  ///< `a` is the first point of the path
  bool ends_path = false;    ///< `b` is the last point of the path
};

/// Two paths that come within the tolerance of each other.
struct Crossing {
  std::uint32_t first_path = 0, second_path = 0;  ///< first_path < second_path
  double first_position = 0.0;   ///< along the first path: segment index + fraction of it
  double second_position = 0.0;  ///< the same along the second path
  Eigen::Vector3d at;            ///< midway between the two nearest points
};

/// Every place where segments of two different paths pass within `tolerance`
/// of each other, except near a path end (within `tolerance` of the first
/// point of a segment that starts its path, or the last of one that ends it):
/// members meeting end to end, or one ending on another, are not crossings.
/// Parallel segments (overlaps) are left out too. A pair of segments gives one
/// crossing at their nearest points; a place where a path's segments meet may
/// give the same crossing twice, which the caller merges. Sorted by paths, then
/// by position along the first.
std::vector<Crossing> find_crossings(const std::vector<PathSegment>& segments, double tolerance);

}  // namespace stepframe::geometry::detail
