#pragma once
// Turning loose edges into a connected wireframe: nodes and members, healed
// and explained.

#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/source_info.hpp"
#include "stepframe/geometry/step_reader.hpp"

#include <Eigen/Core>

#include <cstddef>
#include <functional>
#include <numbers>
#include <vector>

namespace stepframe::geometry {

/// A member: the path of merged nodes along one CAD edge, from its start to its
/// end. A straight edge gives two nodes; inner nodes appear where the member is
/// split into elements (another member's end or a named point lands on it, or
/// a curve is divided). The member stays one member for checks and take-off.
struct WireMember {
  std::vector<std::size_t> nodes;  ///< start, inner nodes, end (the edge's own direction)
  SourceInfo source;
  bool curved = false;             ///< made from a curved edge (arc, spline)
};

/// A node that a named or layered point of the file sits on.
struct NodeLabel {
  std::size_t node = 0;
  SourceInfo source;  ///< entity, name, layers, product of the point
};

struct Wireframe {
  std::vector<Eigen::Vector3d> nodes;  ///< metres
  std::vector<WireMember> members;
  std::vector<NodeLabel> labels;       ///< named / layered points, by node
  std::vector<Diagnostic> diagnostics;  ///< the reader's, then the wireframe's own
};

/// The largest merge tolerance build_wireframe accepts [m]: end points closer
/// than the tolerance become one node, so beyond a metre whole members vanish.
inline constexpr double max_merge_tolerance = 1.0;

/// How edges become members.
struct WireframeOptions {
  double merge_tolerance = 1e-3;  ///< [m] end points closer than this are one node
  /// Largest turn of a curved member's tangent over one element [rad]. The
  /// default, 5 degrees, divides a semicircular arch into 36 straight elements,
  /// whose chords lie within R (1 - cos 2.5 deg) = 0.1 % of the radius of the arc.
  double curve_max_turn = 5.0 * std::numbers::pi / 180.0;
  /// An end point farther than the tolerance but within this many tolerances
  /// of a node or a member is reported as a near-miss gap.
  double gap_factor = 50.0;
  /// Members whose centrelines cross (or pass within the tolerance) away from
  /// the ends of both are left apart and each pair reported (crossed bracing
  /// often passes by), or joined there, both split at one new node (each stays
  /// one member). Empty (the default) leaves every crossing apart; otherwise two
  /// crossing members are joined when this accepts both (`join_all_crossings`, or a
  /// choice made from the members' attributes, as a project's rules make it).
  std::function<bool(const SourceInfo&)> join_crossings{};
};

/// A WireframeOptions::join_crossings that joins every crossing.
inline bool join_all_crossings(const SourceInfo&) { return true; }

/// Length of a member along its path of nodes [m] (its cut length when straight).
double path_length(const Wireframe& frame, const WireMember& member);

/// Builds the wireframe:
///
/// - End points closer than the tolerance merge into one node (spatial hash,
///   expected O(n)). A node sits at the first end point that created it; a
///   later point joins the nearest node within tolerance (the lower index on a
///   tie). Nodes are numbered in order of first appearance; members keep edge order.
/// - A member is split into elements where another member's end point, or a
///   named point, lies on it within tolerance (a T-junction). Members that
///   cross without an end point at the crossing (centrelines within the
///   tolerance, away from the ends of both) are joined only where
///   `join_crossings` accepts both; found through a grid, never by testing all pairs.
/// - A curved edge becomes one member whose elements turn by at most
///   `curve_max_turn` each (between split points).
/// - Named and layered points label the node they sit on (`labels`).
///
/// Diagnostics, each with STEP entity ids and a location (warnings unless noted):
///   "zero-length-edge" an edge whose ends merge into one node, dropped;
///   "duplicate-member" two members over the same nodes (both kept);
///   "overlapping-members" two members sharing part of their length (both kept);
///   "near-miss-gap" an end point within gap_factor tolerances of a node or
///     a member but beyond the tolerance, with the distance;
///   "disconnected-part" one per part when the frame falls into several,
///     with its member count and bounding box;
///   "point-off-frame" a named point on no node and no member;
///   "member-split" (info) a member split at a T-junction;
///   "members-cross" (info) two members cross and are not joined, with the
///     crossing point (one per pair of members);
///   "crossing-joined" (info) the same when `join_crossings` joined them;
///   "endpoints-merged" (info) end points moved to merge, with the largest move.
/// Throws std::invalid_argument for a tolerance that is not a positive length,
/// one so small that coordinates / tolerance exceeds 1e15, or a curve turn
/// that is not positive.
Wireframe build_wireframe(const StepModel& model, const WireframeOptions& options);

/// build_wireframe with the given merge tolerance [m] and default options.
Wireframe build_wireframe(const StepModel& model, double tolerance);

}  // namespace stepframe::geometry
