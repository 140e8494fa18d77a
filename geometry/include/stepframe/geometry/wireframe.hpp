#pragma once
// Turning loose edges into a connected wireframe: nodes and members.

#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/source_info.hpp"
#include "stepframe/geometry/step_reader.hpp"

#include <Eigen/Core>

#include <array>
#include <cstddef>
#include <vector>

namespace stepframe::geometry {

/// A member: the path of merged nodes along one CAD edge, from its start to its
/// end. A straight edge gives two nodes; inner nodes appear where the member is
/// split into elements (another member's end lands on it, or a curve is divided).
struct WireMember {
  std::vector<std::size_t> nodes;  ///< start, inner nodes, end (the edge's own direction)
  SourceInfo source;
};

struct Wireframe {
  std::vector<Eigen::Vector3d> nodes;  ///< metres
  std::vector<WireMember> members;
  std::vector<Diagnostic> diagnostics;  ///< the reader's, then the merge's own
};

/// Length of a member along its path of nodes [m] (its cut length when straight).
double path_length(const Wireframe& frame, const WireMember& member);

/// Merges edge end points closer than `tolerance` (metres) into nodes using a
/// spatial hash (expected O(n)); drops edges whose ends merge into one node,
/// reporting each.
///
/// - A node sits at the first end point that created it; a later point joins
///   the nearest node within `tolerance` (the lower index on a tie).
/// - Nodes are numbered in order of first appearance; members keep edge order.
/// - Diagnostics: "zero-length-edge" for each dropped edge (entity, location);
///   "duplicate-member" when a member joins the same two nodes as an earlier
///   one (both entities; both members are kept).
/// Throws std::invalid_argument for a tolerance that is not a positive length,
/// or one so small that coordinates / tolerance exceeds 1e15.
Wireframe build_wireframe(const StepModel& model, double tolerance);

}  // namespace stepframe::geometry
