#pragma once
// The parts of `compare` (compare.hpp): a revision's results.json read into
// plain values, and the matching of members across revisions.

#include "stepframe/compare.hpp"

#include <Eigen/Core>

#include <array>
#include <map>
#include <string>
#include <utility>
#include <vector>

namespace stepframe::detail {

/// A member as results.json describes it.
struct MemberView {
  std::size_t id = 0;
  std::vector<Eigen::Vector3d> path;  ///< [m] start, inner nodes, end
  double length = 0, mass = 0;        ///< [m], [kg]
  std::string section, material, name, product, assembly, entity;
  Eigen::Vector3d z_axis = Eigen::Vector3d::UnitZ();
  std::array<std::array<bool, 6>, 2> releases{};
  bool straight = true;  ///< every path point within the tolerance of the chord
  bool has_axes = false;  ///< the document gives z_axis and releases (results.json of this version)

  const Eigen::Vector3d& start() const { return path.front(); }
  const Eigen::Vector3d& end() const { return path.back(); }
  /// Its CAD name, else its STEP entity, else "member N".
  std::string label() const;
};

/// A check's state on one member (or the whole frame): the largest utilisation and whether any failed.
struct CheckState {
  double utilisation = 0;
  bool failed = false;
};

struct SupportView {
  Eigen::Vector3d at = Eigen::Vector3d::Zero();
  std::array<bool, 6> fixed{};
  std::array<double, 6> spring{};
};

/// A load case's resultant from its reactions: applied force = -sum of reaction forces [N], moment about
/// the origin = -sum (r x F + M) [N m].
struct CaseView {
  std::string name;
  Eigen::Vector3d force = Eigen::Vector3d::Zero(), moment = Eigen::Vector3d::Zero();
};

struct RevisionView {
  std::vector<MemberView> members;
  std::vector<std::map<std::string, CheckState>> member_checks;  ///< per member: check name -> state
  std::map<std::pair<std::string, std::string>, CheckState> frame_checks;  ///< (check, combination) -> state
  std::vector<SupportView> supports;
  std::vector<CaseView> cases;
};

/// Reads a results.json document; throws InputError naming `revision.label` when it is not one.
RevisionView view_of(const Revision& revision, double tolerance);

/// Members matched across revisions: one to one (kind unchanged, to be refined by what changed), split
/// (one old, several new, in order along the old member) or merged (several old, one new).
struct Match {
  std::vector<std::size_t> old_ids, new_ids;
  ChangeKind kind = ChangeKind::unchanged;
  bool by_identity = false;
  bool reversed = false;  ///< one-to-one: the new member runs from the old one's end to its start
  double moved = 0;       ///< [m] one-to-one: the largest distance between corresponding ends
};

/// Matches the members of two revisions as compare.hpp describes; members in no match are added/removed.
std::vector<Match> match_members(const RevisionView& old_view, const RevisionView& new_view,
                                 const CompareOptions& options);

}  // namespace stepframe::detail
