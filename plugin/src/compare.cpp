// What changed between two revisions and what it did to the checks (compare.hpp).

#include "compare_parts.hpp"

#include "stepframe/viz/colour_scale.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <set>

namespace stepframe {
namespace {

using detail::CheckState;
using detail::MemberView;
using detail::RevisionView;

std::string mm(double metres) { return fmt::format("{:.0f} mm", metres * 1e3); }

std::string joined(const std::set<std::string>& items) {
  std::string out;
  for (const auto& i : items) out += (out.empty() ? "" : ", ") + i;
  return out;
}

// "ry rz at start, rz at end" for a member's released end actions; "none" when fixed both ends.
std::string releases_text(const std::array<std::array<bool, 6>, 2>& r) {
  static const std::array<const char*, 6> names{"ux", "uy", "uz", "rx", "ry", "rz"};
  std::string out;
  for (int end = 0; end < 2; ++end) {
    std::string dofs;
    for (std::size_t d = 0; d < 6; ++d)
      if (r[static_cast<std::size_t>(end)][d]) dofs += (dofs.empty() ? "" : " ") + std::string(names[d]);
    if (!dofs.empty()) out += (out.empty() ? "" : ", ") + dofs + (end == 0 ? " at start" : " at end");
  }
  return out.empty() ? "none" : out;
}

// The members' checks merged: per check the largest utilisation and whether any failed.
std::map<std::string, CheckState> merged_checks(const RevisionView& v, const std::vector<std::size_t>& ids) {
  std::map<std::string, CheckState> out;
  for (std::size_t id : ids)
    for (const auto& [check, state] : v.member_checks[id]) {
      auto& s = out[check];
      s.utilisation = std::max(s.utilisation, state.utilisation);
      s.failed = s.failed || state.failed;
    }
  return out;
}

void fill_checks(MemberDiff& d, const std::map<std::string, CheckState>& before,
                 const std::map<std::string, CheckState>& after) {
  std::set<std::string> names;
  for (const auto& [n, s] : before) names.insert(n);
  for (const auto& [n, s] : after) names.insert(n);
  for (const auto& n : names) {
    CheckDelta c;
    c.check = n;
    if (const auto it = before.find(n); it != before.end())
      c.before = it->second.utilisation, c.failed_before = it->second.failed;
    if (const auto it = after.find(n); it != after.end()) c.after = it->second.utilisation, c.fails_after = it->second.failed;
    if (c.before) d.before = std::max(d.before.value_or(0.0), *c.before);
    if (c.after) d.after = std::max(d.after.value_or(0.0), *c.after);
    d.failed_before = d.failed_before || c.failed_before;
    d.fails_after = d.fails_after || c.fails_after;
    d.checks.push_back(std::move(c));
  }
}

std::set<std::string> sections_of(const RevisionView& v, const std::vector<std::size_t>& ids) {
  std::set<std::string> s;
  for (std::size_t id : ids) s.insert(v.members[id].section);
  return s;
}
std::set<std::string> materials_of(const RevisionView& v, const std::vector<std::size_t>& ids) {
  std::set<std::string> s;
  for (std::size_t id : ids) s.insert(v.members[id].material);
  return s;
}

// What changed in a matched member or group, for people; sets kind from unchanged to modified or moved.
void describe_changes(MemberDiff& d, const RevisionView& o, const RevisionView& n, const CompareOptions& options) {
  if (d.kind == ChangeKind::split)
    d.changes.push_back(fmt::format("split into {} members", d.new_ids.size()));
  if (d.kind == ChangeKind::merged)
    d.changes.push_back(fmt::format("merged from {} members", d.old_ids.size()));
  if (d.moved > options.tolerance) d.changes.push_back("moved " + mm(d.moved));
  const auto s0 = sections_of(o, d.old_ids), s1 = sections_of(n, d.new_ids);
  if (s0 != s1) d.changes.push_back("section " + joined(s0) + " -> " + joined(s1));
  const auto m0 = materials_of(o, d.old_ids), m1 = materials_of(n, d.new_ids);
  if (m0 != m1) d.changes.push_back("material " + joined(m0) + " -> " + joined(m1));
  // Orientation: the angle between the old and the new local z axes (global components), each new part
  // against its old member(s); releases: one-to-one matches, ends swapped when drawn reversed.
  double turned = 0;
  for (std::size_t a : d.old_ids)
    for (std::size_t b : d.new_ids) {
      const auto& x = o.members[a];
      const auto& y = n.members[b];
      if (!x.has_axes || !y.has_axes) continue;
      turned = std::max(turned, std::acos(std::clamp(x.z_axis.normalized().dot(y.z_axis.normalized()), -1.0, 1.0)));
    }
  constexpr double least_turn = 1.0 * std::numbers::pi / 180.0;  // below a degree: CAD rounding (common practice)
  if (turned > least_turn) d.changes.push_back(fmt::format("re-oriented by {:.0f} degrees", turned * 180 / std::numbers::pi));
  if (d.old_ids.size() == 1 && d.new_ids.size() == 1) {
    const auto& x = o.members[d.old_ids[0]];
    const auto& y = n.members[d.new_ids[0]];
    auto r = y.releases;
    if (d.reversed) std::swap(r[0], r[1]);
    if (x.has_axes && y.has_axes && r != x.releases)
      d.changes.push_back("releases " + releases_text(x.releases) + " -> " + releases_text(y.releases));
  }
  if (d.kind == ChangeKind::unchanged && !d.changes.empty())
    d.kind = d.moved > options.tolerance ? ChangeKind::moved : ChangeKind::modified;
}

std::string fixity_text(const detail::SupportView& s) {
  static const std::array<const char*, 6> names{"ux", "uy", "uz", "rx", "ry", "rz"};
  std::string fixed, springs;
  for (std::size_t d = 0; d < 6; ++d) {
    if (s.fixed[d]) fixed += (fixed.empty() ? "" : " ") + std::string(names[d]);
    else if (s.spring[d] > 0) springs += fmt::format("{}{} spring {:.4g}", springs.empty() ? "" : ", ", names[d], s.spring[d]);
  }
  std::string out = fixed.empty() ? "free" : "fixed " + fixed;
  return springs.empty() ? out : out + ", " + springs;
}

void compare_supports(Comparison& c, const RevisionView& o, const RevisionView& n, double tol) {
  std::vector<bool> seen(n.supports.size(), false);
  for (const auto& s : o.supports) {
    std::optional<std::size_t> found;
    for (std::size_t i = 0; i < n.supports.size() && !found; ++i)
      if (!seen[i] && (n.supports[i].at - s.at).norm() <= tol) found = i;
    if (!found) {
      c.supports.push_back({s.at, "removed (was " + fixity_text(s) + ")"});
      continue;
    }
    seen[*found] = true;
    const auto& t = n.supports[*found];
    if (t.fixed != s.fixed || t.spring != s.spring)
      c.supports.push_back({t.at, fixity_text(s) + " -> " + fixity_text(t)});
  }
  for (std::size_t i = 0; i < n.supports.size(); ++i)
    if (!seen[i]) c.supports.push_back({n.supports[i].at, "added (" + fixity_text(n.supports[i]) + ")"});
}

void compare_loads(Comparison& c, const RevisionView& o, const RevisionView& n) {
  // Resultants differing by more than a millionth of the larger, and at least 1 N (1 N m) (common practice
  // for round-off of a sum of reactions).
  auto differ = [](const Eigen::Vector3d& a, const Eigen::Vector3d& b) {
    return (a - b).norm() > std::max(1.0, 1e-6 * std::max(a.norm(), b.norm()));
  };
  for (const auto& a : o.cases) {
    const auto it = std::find_if(n.cases.begin(), n.cases.end(), [&](const auto& b) { return b.name == a.name; });
    if (it == n.cases.end()) {
      c.loads.push_back({a.name, "removed", a.force, std::nullopt, a.moment, std::nullopt});
      continue;
    }
    if (differ(a.force, it->force) || differ(a.moment, it->moment))
      c.loads.push_back({a.name,
                         fmt::format("resultant {:.2f} kN -> {:.2f} kN", a.force.norm() * 1e-3, it->force.norm() * 1e-3),
                         a.force, it->force, a.moment, it->moment});
  }
  for (const auto& b : n.cases)
    if (std::none_of(o.cases.begin(), o.cases.end(), [&](const auto& a) { return a.name == b.name; }))
      c.loads.push_back({b.name, "added", std::nullopt, b.force, std::nullopt, b.moment});
}

std::string member_text(const MemberDiff& d) {
  return d.label + " (" + (d.new_ids.empty() ? "old member " + std::to_string(d.old_ids.front())
                                             : "member " + std::to_string(d.new_ids.front())) +
         ")";
}

void gate(Comparison& c) {
  const double limit = c.options.max_increase;
  for (const auto& d : c.members) {
    if (d.newly_failing())
      c.gate_failures.push_back(fmt::format("{} newly fails (governing utilisation {:.3f})", member_text(d), d.after.value_or(0)));
    for (const auto& k : d.checks)
      if (k.increase() > limit)
        c.gate_failures.push_back(fmt::format("{}: {} utilisation rose {:.3f} -> {:.3f} (+{:.3f}, more than +{:.3f})",
                                              member_text(d), k.check, *k.before, *k.after, k.increase(), limit));
  }
  for (const auto& f : c.frame_checks) {
    if (f.fails_after && !f.failed_before)
      c.gate_failures.push_back(fmt::format("frame {} under {} newly fails", f.check, f.combination));
    if (f.before && f.after && *f.after - *f.before > limit)
      c.gate_failures.push_back(fmt::format("frame {} under {}: utilisation rose {:.3f} -> {:.3f} (more than +{:.3f})",
                                            f.check, f.combination, *f.before, *f.after, limit));
  }
}

}  // namespace

std::string_view to_string(ChangeKind kind) {
  switch (kind) {
    case ChangeKind::unchanged: return "unchanged";
    case ChangeKind::modified: return "modified";
    case ChangeKind::moved: return "moved";
    case ChangeKind::split: return "split";
    case ChangeKind::merged: return "merged";
    case ChangeKind::added: return "added";
    case ChangeKind::removed: return "removed";
  }
  return "unchanged";
}

double MemberDiff::largest_increase() const {
  double most = 0;
  for (const auto& c : checks) most = std::max(most, c.increase());
  return most;
}

std::size_t Comparison::count(ChangeKind kind) const {
  return static_cast<std::size_t>(std::count_if(members.begin(), members.end(), [&](const auto& d) { return d.kind == kind; }));
}

Comparison compare_revisions(const Revision& old_revision, const Revision& new_revision, const CompareOptions& options) {
  if (!(options.tolerance > 0) || !(options.move_limit >= 0) || !(options.max_increase >= 0))
    throw InputError("compare: the tolerance must be above 0, the move limit and the largest increase at least 0");
  const RevisionView o = detail::view_of(old_revision, options.tolerance);
  const RevisionView n = detail::view_of(new_revision, options.tolerance);
  Comparison c;
  c.old_label = old_revision.label;
  c.new_label = new_revision.label;
  c.options = options;
  for (const auto& m : o.members) c.old_paths.push_back(m.path);
  for (const auto& m : n.members) c.new_paths.push_back(m.path);

  std::vector<bool> old_seen(o.members.size(), false), new_seen(n.members.size(), false);
  for (const auto& m : detail::match_members(o, n, options)) {
    MemberDiff d;
    d.old_ids = m.old_ids, d.new_ids = m.new_ids, d.kind = m.kind;
    d.by_identity = m.by_identity, d.reversed = m.reversed, d.moved = m.moved;
    d.label = n.members[d.new_ids.front()].label();
    for (std::size_t i : d.old_ids) old_seen[i] = true;
    for (std::size_t i : d.new_ids) new_seen[i] = true;
    describe_changes(d, o, n, options);
    fill_checks(d, merged_checks(o, d.old_ids), merged_checks(n, d.new_ids));
    c.members.push_back(std::move(d));
  }
  for (const auto& m : n.members)
    if (!new_seen[m.id]) {
      MemberDiff d;
      d.new_ids = {m.id}, d.kind = ChangeKind::added, d.label = m.label();
      d.changes.push_back("added (" + m.section + ", " + mm(m.length) + ")");
      fill_checks(d, {}, merged_checks(n, d.new_ids));
      c.members.push_back(std::move(d));
    }
  for (const auto& m : o.members)
    if (!old_seen[m.id]) {
      MemberDiff d;
      d.old_ids = {m.id}, d.kind = ChangeKind::removed, d.label = m.label();
      d.changes.push_back("removed (" + m.section + ", " + mm(m.length) + ")");
      fill_checks(d, merged_checks(o, d.old_ids), {});
      c.members.push_back(std::move(d));
    }
  // Failures first, then the largest rises, then the rest in the new revision's order.
  std::stable_sort(c.members.begin(), c.members.end(), [](const MemberDiff& a, const MemberDiff& b) {
    if (a.newly_failing() != b.newly_failing()) return a.newly_failing();
    return a.largest_increase() > b.largest_increase();
  });

  for (const auto& [key, state] : o.frame_checks) {
    FrameCheckDelta f{key.first, key.second, state.utilisation, std::nullopt, state.failed, false};
    if (const auto it = n.frame_checks.find(key); it != n.frame_checks.end())
      f.after = it->second.utilisation, f.fails_after = it->second.failed;
    c.frame_checks.push_back(f);
  }
  for (const auto& [key, state] : n.frame_checks)
    if (!o.frame_checks.count(key))
      c.frame_checks.push_back({key.first, key.second, std::nullopt, state.utilisation, false, state.failed});

  compare_supports(c, o, n, options.tolerance);
  compare_loads(c, o, n);
  for (const auto& m : o.members) c.old_mass += m.mass, c.mass_by_section[m.section][0] += m.mass;
  for (const auto& m : n.members) c.new_mass += m.mass, c.mass_by_section[m.section][1] += m.mass;
  gate(c);
  return c;
}

double largest_change(const Comparison& c) {
  double largest = 0.05;
  for (const auto& d : c.members)
    if (d.before && d.after) largest = std::max(largest, std::abs(*d.after - *d.before));
  return largest;
}

std::array<std::uint8_t, 3> change_colour(const MemberDiff& d, double largest) {
  if (d.newly_failing()) return viz::above_limit_colour();
  if (!d.before || !d.after) return viz::not_checked_colour();
  return viz::signed_colour((*d.after - *d.before) / largest);
}

}  // namespace stepframe
