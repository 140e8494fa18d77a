#pragma once
// Comparing two revisions of a frame: what changed between them and what the
// change did to the checks (README "Comparing revisions: stepframe compare").
//
// Each side is a results.json document (schema stepframe-results/1), read
// from a results folder, a results.json file, or a project run on the spot.
// Members are matched across the revisions
//  1. by CAD identity: name + product + assembly path, where the name is not
//     empty and that identity is unique in both revisions;
//  2. by centreline geometry: both end points within the tolerance, either
//     way round (a reversed edge), and the same length;
//  3. split and merged members: a straight member whose centreline is covered
//     end to end by a chain of straight members of the other revision;
//  4. moved members: the closest remaining pair whose ends moved by at most
//     the move limit (and half the shorter length), chords within 30 degrees.
// Whatever is left is added (new revision) or removed (old revision).
// All lengths SI [m]; utilisations are ratios.

#include "stepframe/errors.hpp"
#include "stepframe/run_control.hpp"

#include <Eigen/Core>
#include <nlohmann/json.hpp>

#include <array>
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe {

/// One side of a comparison.
struct Revision {
  std::string label;       ///< the path it was read from, for people
  nlohmann::json results;  ///< the results.json document
};

/// Reads a revision: a results folder (its results.json), a results.json
/// file, or a project file (.yaml/.yml), analysed on the spot without writing
/// anything. Throws InputError naming the path and what to give instead (also
/// when the project cannot be analysed: its own message follows).
Revision read_revision(const std::filesystem::path& path, const RunControl& control = {});

struct CompareOptions {
  double tolerance = 0.01;     ///< [m] end points this close are the same point
  double move_limit = 1.0;     ///< [m] the farthest a member's end may move and still be the same member
  double max_increase = 0.05;  ///< the largest rise of a utilisation that passes the gate
};

/// What happened to a member (or a group of members) between the revisions;
/// the values are those of the VTK array `change_kind`.
enum class ChangeKind : int {
  unchanged = 0,  ///< matched, nothing listed changed
  modified = 1,   ///< matched in place; section, material, orientation or releases changed
  moved = 2,      ///< matched; an end moved by more than the tolerance
  split = 3,      ///< one old member became several new ones along the same centreline
  merged = 4,     ///< several old members became one
  added = 5,      ///< only in the new revision
  removed = 6,    ///< only in the old revision
};
std::string_view to_string(ChangeKind kind);

/// One check of a member before and after: the largest utilisation of that check over its combinations.
struct CheckDelta {
  std::string check;
  std::optional<double> before, after;
  bool failed_before = false, fails_after = false;
  /// after - before, or 0 when the check exists on one side only.
  double increase() const { return before && after ? *after - *before : 0.0; }
};

/// A member, or a group of them (split, merged), across the revisions.
struct MemberDiff {
  std::vector<std::size_t> old_ids, new_ids;  ///< member ids of each results.json
  ChangeKind kind = ChangeKind::unchanged;
  bool by_identity = false;  ///< matched by CAD identity rather than geometry
  bool reversed = false;     ///< drawn the other way round (local x reversed)
  double moved = 0;          ///< [m] the largest movement of an end (one-to-one matches)
  std::vector<std::string> changes;  ///< for people: "moved 300 mm", "section IPE300 -> IPE360", ...
  std::string label;                 ///< name (or entity) of the member in the new revision, else the old
  std::vector<CheckDelta> checks;    ///< every check either side has, by name
  std::optional<double> before, after;  ///< governing utilisation on each side
  bool failed_before = false, fails_after = false;
  /// Fails now and did not before (an added member that fails counts too).
  bool newly_failing() const { return fails_after && !failed_before; }
  /// The largest rise of any one check's utilisation (0 when none rose or nothing compares).
  double largest_increase() const;
};

/// A whole-frame check (stability) by check and combination name.
struct FrameCheckDelta {
  std::string check, combination;
  std::optional<double> before, after;
  bool failed_before = false, fails_after = false;
};

/// A support added, removed or changed, at its node's position [m] in the new revision (old when removed).
struct SupportDiff {
  Eigen::Vector3d at = Eigen::Vector3d::Zero();
  std::string change;
};

/// A load case added, removed, or whose resultant changed (self weight included). The resultant is
/// taken from the reactions (force [N], moment about the origin [N m]), global axes.
struct LoadDiff {
  std::string name;
  std::string change;
  std::optional<Eigen::Vector3d> old_force, new_force, old_moment, new_moment;
};

struct Comparison {
  std::string old_label, new_label;
  CompareOptions options;
  std::vector<MemberDiff> members;  ///< newly failing first, then by largest increase, then the rest
  std::vector<FrameCheckDelta> frame_checks;
  std::vector<SupportDiff> supports;
  std::vector<LoadDiff> loads;
  double old_mass = 0, new_mass = 0;  ///< [kg]
  std::map<std::string, std::array<double, 2>> mass_by_section;  ///< designation -> [old, new] [kg]
  /// Member centrelines of each revision [m], by member id (for pictures and the VTK file).
  std::vector<std::vector<Eigen::Vector3d>> old_paths, new_paths;
  /// Why the gate fails: one line per newly failing member or utilisation risen past max_increase.
  std::vector<std::string> gate_failures;

  /// 0 nothing got worse beyond the threshold, 1 otherwise (ExitStatus pass / check_failed).
  ExitStatus status() const { return gate_failures.empty() ? ExitStatus::pass : ExitStatus::check_failed; }
  std::size_t count(ChangeKind kind) const;
};

/// Compares two results.json documents. Throws InputError when either is not one (naming its label).
Comparison compare_revisions(const Revision& old_revision, const Revision& new_revision,
                             const CompareOptions& options = {});

/// compare.json (schema stepframe-compare/1; README "Comparing revisions").
nlohmann::json comparison_json(const Comparison& comparison);

/// compare.html: verdict, failures first, pictures coloured by utilisation change, what changed.
std::string comparison_html(const Comparison& comparison);

/// A few lines for the terminal: verdict, counts, newly failing, largest increases, mass change.
std::string comparison_text(const Comparison& comparison);

/// The colour a member is drawn in, in compare.html and the VTK file's `change_colour`: the flag colour
/// when it newly fails, else the utilisation change on the signed scale as a fraction of `largest`
/// (the largest magnitude of change shown), the not-checked grey when it has nothing to compare.
std::array<std::uint8_t, 3> change_colour(const MemberDiff& diff, double largest);

/// The largest magnitude of governing-utilisation change among the members (at least 0.05).
double largest_change(const Comparison& comparison);

/// Writes compare.json, compare.html and compare.vtu into `out_dir`, replaced whole (a staging
/// folder, as a run's). Returns the files written. Throws InputError when the folder is unusable.
std::vector<std::filesystem::path> write_comparison(const Comparison& comparison, const std::filesystem::path& out_dir);

}  // namespace stepframe
