// Matching members across two revisions (compare.hpp: identity, geometry,
// split and merged, moved).

#include "compare_parts.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <tuple>
#include <unordered_map>

namespace stepframe::detail {
namespace {

// Member ends in cells of the tolerance's size: the ends near a point are in its cell or the 26 around it.
class EndGrid {
 public:
  EndGrid(const std::vector<MemberView>& members, double cell) : cell_(cell) {
    for (const auto& m : members) {
      cells_[key(m.start())].push_back(m.id);
      cells_[key(m.end())].push_back(m.id);
    }
  }
  /// Members with an end within `radius` (<= the cell size) of p (each once).
  template <class F>
  void near(const std::vector<MemberView>& members, const Eigen::Vector3d& p, double radius, F&& f) const {
    const auto [i, j, k] = index(p);
    std::vector<std::size_t> seen;
    for (long di = -1; di <= 1; ++di)
      for (long dj = -1; dj <= 1; ++dj)
        for (long dk = -1; dk <= 1; ++dk) {
          const auto it = cells_.find(pack(i + di, j + dj, k + dk));
          if (it == cells_.end()) continue;
          for (std::size_t id : it->second) {
            const auto& m = members[id];
            if (std::find(seen.begin(), seen.end(), id) != seen.end()) continue;
            if ((m.start() - p).norm() <= radius || (m.end() - p).norm() <= radius) {
              seen.push_back(id);
              f(id);
            }
          }
        }
  }

 private:
  std::tuple<long, long, long> index(const Eigen::Vector3d& p) const {
    return {std::lround(std::floor(p.x() / cell_)), std::lround(std::floor(p.y() / cell_)),
            std::lround(std::floor(p.z() / cell_))};
  }
  static std::uint64_t pack(long i, long j, long k) {
    auto part = [](long v) { return static_cast<std::uint64_t>(v) & 0x1FFFFF; };
    return part(i) | part(j) << 21 | part(k) << 42;
  }
  std::uint64_t key(const Eigen::Vector3d& p) const {
    const auto [i, j, k] = index(p);
    return pack(i, j, k);
  }
  double cell_;
  std::unordered_map<std::uint64_t, std::vector<std::size_t>> cells_;
};

// The largest end distance with the ends taken as drawn and reversed; the smaller, and whether reversed.
std::pair<double, bool> end_distance(const MemberView& a, const MemberView& b) {
  const double same = std::max((a.start() - b.start()).norm(), (a.end() - b.end()).norm());
  const double reversed = std::max((a.start() - b.end()).norm(), (a.end() - b.start()).norm());
  return reversed < same ? std::pair{reversed, true} : std::pair{same, false};
}

std::string identity(const MemberView& m) { return m.name + '\x1f' + m.product + '\x1f' + m.assembly; }

// Position of p along the chord of `line` from its start [m], and its distance from the chord [m].
std::pair<double, double> along(const MemberView& line, const Eigen::Vector3d& p) {
  const Eigen::Vector3d axis = (line.end() - line.start()).normalized();
  const Eigen::Vector3d d = p - line.start();
  const double t = d.dot(axis);
  return {t, (d - t * axis).norm()};
}

// A chain of unmatched straight members of `parts` covering the straight member `whole` from its start
// to its end, in order; empty when there is none of two or more.
std::vector<std::size_t> covering_chain(const MemberView& whole, const std::vector<MemberView>& parts,
                                        const EndGrid& grid, const std::vector<bool>& taken, double tolerance) {
  std::vector<std::size_t> chain;
  Eigen::Vector3d at = whole.start();
  double reached = 0;
  const double length = (whole.end() - whole.start()).norm();
  while (reached < length - tolerance) {
    std::optional<std::size_t> next;
    double next_reach = reached;
    grid.near(parts, at, tolerance, [&](std::size_t id) {
      const auto& p = parts[id];
      if (taken[id] || !p.straight || std::find(chain.begin(), chain.end(), id) != chain.end()) return;
      const Eigen::Vector3d far = (p.start() - at).norm() <= tolerance ? p.end() : p.start();
      const auto [t, off] = along(whole, far);
      if (off <= tolerance && t > reached + tolerance && t <= length + tolerance && t > next_reach)
        next = id, next_reach = t;
    });
    if (!next) return {};
    chain.push_back(*next);
    const auto& p = parts[*next];
    at = (p.start() - at).norm() <= tolerance ? p.end() : p.start();
    reached = next_reach;
  }
  if (chain.size() < 2) return {};
  return chain;
}

}  // namespace

std::vector<Match> match_members(const RevisionView& old_view, const RevisionView& new_view,
                                 const CompareOptions& options) {
  const auto& olds = old_view.members;
  const auto& news = new_view.members;
  const double tol = options.tolerance;
  std::vector<bool> old_taken(olds.size(), false), new_taken(news.size(), false);
  std::vector<Match> matches;
  auto pair_up = [&](std::size_t o, std::size_t n, bool by_identity) {
    const auto [distance, reversed] = end_distance(olds[o], news[n]);
    matches.push_back({{o}, {n}, ChangeKind::unchanged, by_identity, reversed, distance});
    old_taken[o] = new_taken[n] = true;
  };

  // 1. CAD identity, where it is unique on both sides.
  std::unordered_map<std::string, std::pair<long, long>> ids;  // identity -> (old id or -1 when repeated, new id ...)
  auto note = [](long& slot, std::size_t id) { slot = slot == -2 ? static_cast<long>(id) : -1; };
  for (const auto& m : olds)
    if (!m.name.empty()) note(ids.try_emplace(identity(m), -2, -2).first->second.first, m.id);
  for (const auto& m : news)
    if (!m.name.empty()) note(ids.try_emplace(identity(m), -2, -2).first->second.second, m.id);
  for (const auto& m : olds) {
    if (m.name.empty()) continue;
    const auto [o, n] = ids.at(identity(m));
    if (o >= 0 && n >= 0) pair_up(static_cast<std::size_t>(o), static_cast<std::size_t>(n), true);
  }

  // 2. The same centreline (ends within the tolerance either way round, the same length).
  const EndGrid new_ends(news, tol), old_ends(olds, tol);
  for (const auto& o : olds) {
    if (old_taken[o.id]) continue;
    std::optional<std::size_t> found;
    new_ends.near(news, o.start(), tol, [&](std::size_t n) {
      if (found || new_taken[n]) return;
      if (end_distance(o, news[n]).first <= tol && std::abs(o.length - news[n].length) <= tol) found = n;
    });
    if (found) pair_up(o.id, *found, false);
  }

  // 3. Split (one old straight member covered by a chain of new ones) and merged (the other way).
  for (const auto& o : olds) {
    if (old_taken[o.id] || !o.straight) continue;
    auto chain = covering_chain(o, news, new_ends, new_taken, tol);
    if (chain.empty()) continue;
    for (std::size_t n : chain) new_taken[n] = true;
    old_taken[o.id] = true;
    matches.push_back({{o.id}, std::move(chain), ChangeKind::split});
  }
  for (const auto& n : news) {
    if (new_taken[n.id] || !n.straight) continue;
    auto chain = covering_chain(n, olds, old_ends, old_taken, tol);
    if (chain.empty()) continue;
    for (std::size_t o : chain) old_taken[o] = true;
    new_taken[n.id] = true;
    matches.push_back({std::move(chain), {n.id}, ChangeKind::merged});
  }

  // 4. Moved: the closest remaining pairs, ends within the move limit and half the shorter length, chords
  // within 30 degrees of each other.
  std::vector<std::size_t> old_left, new_left;
  for (const auto& o : olds)
    if (!old_taken[o.id]) old_left.push_back(o.id);
  for (const auto& n : news)
    if (!new_taken[n.id]) new_left.push_back(n.id);
  constexpr double largest_search = 4e7;  // pairs examined at most (beyond it the leftovers stay added/removed)
  if (static_cast<double>(old_left.size()) * static_cast<double>(new_left.size()) > largest_search) {
    spdlog::warn("compare: {} unmatched old and {} unmatched new members: too many to look for moved members; "
                 "they are listed as removed and added",
                 old_left.size(), new_left.size());
    return matches;
  }
  const double min_cos = std::cos(30.0 * std::numbers::pi / 180.0);
  std::vector<std::tuple<double, std::size_t, std::size_t>> candidates;
  for (std::size_t o : old_left)
    for (std::size_t n : new_left) {
      const auto& a = olds[o];
      const auto& b = news[n];
      const double d = end_distance(a, b).first;
      const Eigen::Vector3d ca = a.end() - a.start(), cb = b.end() - b.start();
      if (d <= options.move_limit && d <= 0.5 * std::min(a.length, b.length) &&
          std::abs(ca.dot(cb)) >= min_cos * ca.norm() * cb.norm())
        candidates.emplace_back(d, o, n);
    }
  std::sort(candidates.begin(), candidates.end());
  for (const auto& [d, o, n] : candidates)
    if (!old_taken[o] && !new_taken[n]) pair_up(o, n, false);
  return matches;
}

}  // namespace stepframe::detail
