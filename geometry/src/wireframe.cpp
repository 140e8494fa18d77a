#include "stepframe/geometry/wireframe.hpp"

#include "crossings.hpp"
#include "spatial_grid.hpp"

#include <spdlog/fmt/fmt.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <map>
#include <numeric>
#include <stdexcept>
#include <string>
#include <unordered_set>
#include <utility>

namespace stepframe::geometry {

namespace {

using detail::Grid;
using detail::NodeGrid;

std::string describe(const SourceInfo& source) {
  std::string text = source.entity.empty() ? std::string("an edge with no STEP entity") : source.entity;
  if (!source.name.empty()) text += fmt::format(" ('{}')", source.name);
  return text;
}

std::string xyz(const Eigen::Vector3d& p) { return fmt::format("({:.6g}, {:.6g}, {:.6g}) m", p.x(), p.y(), p.z()); }

void check_point(const StepModel& model, const Eigen::Vector3d& p, const SourceInfo& source, double tolerance) {
  // Grid cell indices must fit comfortably in 64-bit integers.
  constexpr double largest_cell_index = 1e15;
  if (!p.allFinite())
    throw std::invalid_argument(
        fmt::format("{}: {} has a non-finite coordinate", model.file.string(), describe(source)));
  if (p.cwiseAbs().maxCoeff() / tolerance > largest_cell_index)
    throw std::invalid_argument(fmt::format(
        "{}: tolerance {} m is too small for coordinates as large as {} m ({}); use a larger tolerance",
        model.file.string(), tolerance, p.cwiseAbs().maxCoeff(), describe(source)));
}

void check_inputs(const StepModel& model, const WireframeOptions& options) {
  const double tolerance = options.merge_tolerance;
  if (!(tolerance > 0.0) || !std::isfinite(tolerance) || tolerance > max_merge_tolerance)
    throw std::invalid_argument(fmt::format("{}: the node merge tolerance must be a positive length of at most {} m "
                                            "(a few millimetres is usual), got {} m",
                                            model.file.string(), max_merge_tolerance, tolerance));
  if (!(options.curve_max_turn > 0.0) || !std::isfinite(options.curve_max_turn))
    throw std::invalid_argument(fmt::format("{}: the largest turn per curve element must be a positive angle, got {} rad",
                                            model.file.string(), options.curve_max_turn));
  if (!(options.gap_factor >= 1.0) || !std::isfinite(options.gap_factor))
    throw std::invalid_argument(fmt::format("{}: the near-miss gap factor must be at least 1, got {}",
                                            model.file.string(), options.gap_factor));
  for (const WireEdge& edge : model.edges) {
    check_point(model, edge.start, edge.source, tolerance);
    check_point(model, edge.end, edge.source, tolerance);
    for (const CurveSample& s : edge.curve) check_point(model, s.point, edge.source, tolerance);
  }
  for (const LabelledPoint& point : model.points) check_point(model, point.at, point.source, tolerance);
}

// A point where a member must have a node: a position along its polyline
// (segment index + fraction) and the node.
struct Stop {
  double position;
  std::size_t node;
};

// One surviving edge on its way to becoming a member. Its polyline is the
// edge's two ends, or a curved edge's samples.
struct Track {
  const WireEdge* edge;
  std::size_t first, last;  // end nodes
  std::vector<Stop> stops;  // inner nodes where other members land

  std::size_t size() const { return edge->curved() ? edge->curve.size() : 2; }
  const Eigen::Vector3d& point(std::size_t i) const {
    if (edge->curved()) return edge->curve[i].point;
    return i == 0 ? edge->start : edge->end;
  }
  double turn(std::size_t i) const { return edge->curved() ? edge->curve[i].turn : 0.0; }
  Eigen::Vector3d point_at(double position) const {
    const auto [i, f] = split(position);
    return point(i) + f * (point(i + 1) - point(i));
  }
  double turn_at(double position) const {
    const auto [i, f] = split(position);
    return turn(i) + f * (turn(i + 1) - turn(i));
  }
  double end_position() const { return static_cast<double>(size() - 1); }

 private:
  std::pair<std::size_t, double> split(double position) const {
    const auto i = std::min(static_cast<std::size_t>(std::max(position, 0.0)), size() - 2);
    return {i, position - static_cast<double>(i)};
  }
};

// (track, segment) pairs, sorted: the segments of one track come together.
using SegmentHits = std::vector<std::pair<std::uint32_t, std::uint32_t>>;

// The nearest point to p of the track whose segments are hits[begin, end).
struct Foot {
  double distance = std::numeric_limits<double>::infinity();
  double position = 0.0;
  Eigen::Vector3d point;
};

Foot nearest_on(const Track& track, const SegmentHits& hits, std::size_t begin, std::size_t end,
                const Eigen::Vector3d& p) {
  Foot best;
  for (std::size_t h = begin; h < end; ++h) {
    const std::uint32_t s = hits[h].second;
    const Eigen::Vector3d& a = track.point(s);
    const Eigen::Vector3d& b = track.point(s + 1);
    const double t = detail::closest_parameter(a, b, p);
    const Eigen::Vector3d q = a + t * (b - a);
    const double d = (q - p).norm();
    if (d < best.distance) best = {d, s + t, q};
  }
  return best;
}

// Calls visit(track index, nearest point) for each track with a segment near p.
template <class Visit>
void for_each_track_near(const SegmentHits& hits, const std::vector<Track>& tracks, const Eigen::Vector3d& p,
                         Visit&& visit) {
  for (std::size_t begin = 0; begin < hits.size();) {
    std::size_t end = begin;
    while (end < hits.size() && hits[end].first == hits[begin].first) ++end;
    visit(hits[begin].first, nearest_on(tracks[hits[begin].first], hits, begin, end, p));
    begin = end;
  }
}

// Every segment of every track, hashed so that the segments passing within
// `reach` of a point are found from the point's cell and its neighbours.
class SegmentIndex {
 public:
  SegmentIndex(const std::vector<Track>& tracks, double reach) : grid_(cell_size(tracks, reach)) {
    grid_.reserve(2 * tracks.size());
    for (std::size_t t = 0; t < tracks.size(); ++t) {
      const Track& track = tracks[t];
      for (std::size_t s = 0; s + 1 < track.size(); ++s) {
        const std::size_t id = segments_.size();
        segments_.push_back({static_cast<std::uint32_t>(t), static_cast<std::uint32_t>(s)});
        // Samples at most half a cell apart: the nearest sample to any point
        // of the segment is within a quarter cell of it, so a point within
        // `reach` (at most half a cell) of the segment has a sample within
        // three quarters of a cell, in its own cell or a neighbour.
        const Eigen::Vector3d& a = track.point(s);
        const Eigen::Vector3d& b = track.point(s + 1);
        const std::size_t steps = detail::pieces_for((b - a).norm(), 0.5 * grid_.size());
        if (steps == 0) {
          unbucketed_.push_back(id);
          continue;
        }
        for (std::size_t k = 0; k <= steps; ++k)
          grid_.add(a + (static_cast<double>(k) / static_cast<double>(steps)) * (b - a), id);
      }
    }
  }

  /// Segments near p into `hits` (cleared first), sorted by track.
  void near(const Eigen::Vector3d& p, SegmentHits& hits) const {
    hits.clear();
    grid_.near(p, [&](std::size_t id) { hits.push_back(segments_[id]); });
    for (const std::size_t id : unbucketed_) hits.push_back(segments_[id]);
    std::sort(hits.begin(), hits.end());
    hits.erase(std::unique(hits.begin(), hits.end()), hits.end());
  }

 private:
  // At least twice the reach (see above), else the median segment length, so
  // a typical segment touches a few cells.
  static double cell_size(const std::vector<Track>& tracks, double reach) {
    std::vector<double> lengths;
    for (const Track& t : tracks)
      for (std::size_t s = 0; s + 1 < t.size(); ++s) lengths.push_back((t.point(s + 1) - t.point(s)).norm());
    double typical = 0.0;
    if (!lengths.empty()) {
      auto middle = lengths.begin() + static_cast<std::ptrdiff_t>(lengths.size() / 2);
      std::nth_element(lengths.begin(), middle, lengths.end());
      typical = *middle;
    }
    return std::max(2.0 * reach, typical);
  }

  Grid grid_;
  SegmentHits segments_;
  std::vector<std::size_t> unbucketed_;  // segments too long to bucket (pieces_for): near every point
};

std::uint64_t pair_key(std::size_t a, std::size_t b) {
  const auto [lo, hi] = std::minmax(a, b);
  return (static_cast<std::uint64_t>(lo) << 32) ^ static_cast<std::uint64_t>(hi);
}

// The nodes of a curved track between two stops, dividing the stretch into
// the fewest equal-turn pieces of at most `max_turn` each. Nodes sit on the
// track's samples nearest to the equal-turn targets.
void divide_curve(const Track& t, double from, double to, double max_turn, NodeGrid& grid,
                  std::vector<Eigen::Vector3d>& nodes, std::vector<std::size_t>& path) {
  const double start_turn = t.turn_at(from);
  const double stretch = t.turn_at(to) - start_turn;
  const auto pieces = std::max<std::size_t>(1, static_cast<std::size_t>(std::ceil(stretch / max_turn - 1e-9)));
  std::size_t previous = static_cast<std::size_t>(std::floor(from));
  for (std::size_t k = 1; k < pieces; ++k) {
    const double target = start_turn + stretch * static_cast<double>(k) / static_cast<double>(pieces);
    const auto& curve = t.edge->curve;
    auto it = std::lower_bound(curve.begin(), curve.end(), target,
                               [](const CurveSample& s, double value) { return s.turn < value; });
    if (it == curve.end()) --it;
    if (it != curve.begin() && target - (it - 1)->turn < it->turn - target) --it;
    const auto index = static_cast<std::size_t>(it - curve.begin());
    const auto position = static_cast<double>(index);
    if (position <= from || position >= to || index <= previous) continue;
    previous = index;
    const std::size_t node = grid.merge(t.point(index), nodes);
    if (node != path.back()) path.push_back(node);
  }
}

// True when both tracks already have a node within `tol` of `at` among their
// stops (a third member ends there and has split both).
bool joined_at(const Track& one, const Track& two, const Eigen::Vector3d& at, double tol,
               const std::vector<Eigen::Vector3d>& nodes) {
  for (const Stop& a : one.stops)
    for (const Stop& b : two.stops)
      if (a.node == b.node && (nodes[a.node] - at).norm() <= tol) return true;
  return false;
}

// Members that cross away from their ends (crossed bracing): one finding per
// pair of members, and with `join` a node at each crossing that splits both.
void cross_members(std::vector<Track>& tracks, const WireframeOptions& options, double tol, NodeGrid& grid,
                   Wireframe& frame) {
  std::vector<detail::PathSegment> segments;
  segments.reserve(tracks.size());
  for (std::size_t t = 0; t < tracks.size(); ++t) {
    const Track& track = tracks[t];
    for (std::size_t s = 0; s + 1 < track.size(); ++s)
      segments.push_back({track.point(s), track.point(s + 1), static_cast<std::uint32_t>(t),
                          static_cast<std::uint32_t>(s), s == 0, s + 2 == track.size()});
  }
  const std::vector<detail::Crossing> crossings = detail::find_crossings(segments, tol);
  auto near_end = [&](const Track& track, const Eigen::Vector3d& at) {
    return (frame.nodes[track.first] - at).norm() <= tol || (frame.nodes[track.last] - at).norm() <= tol;
  };
  std::vector<const detail::Crossing*> places;
  for (std::size_t begin = 0; begin < crossings.size();) {
    const detail::Crossing& head = crossings[begin];
    std::size_t end = begin;
    while (end < crossings.size() && crossings[end].first_path == head.first_path &&
           crossings[end].second_path == head.second_path)
      ++end;
    Track& one = tracks[head.first_path];
    Track& two = tracks[head.second_path];
    places.clear();
    for (std::size_t k = begin; k < end; ++k) {
      const detail::Crossing& c = crossings[k];
      // A curved member's first sample may lie within the tolerance of its end.
      if (near_end(one, c.at) || near_end(two, c.at) || joined_at(one, two, c.at, tol, frame.nodes)) continue;
      // Found again where a curve's segments meet.
      if (!places.empty() && (places.back()->at - c.at).norm() <= tol) continue;
      places.push_back(&c);
    }
    begin = end;
    if (places.empty()) continue;
    const std::string more =
        places.size() > 1 ? fmt::format(" and at {} more places", places.size() - 1) : std::string();
    const SourceInfo& a = one.edge->source;
    const SourceInfo& b = two.edge->source;
    if (options.join_crossings && options.join_crossings(a) && options.join_crossings(b)) {
      for (const detail::Crossing* c : places) {
        const std::size_t node = grid.merge(c->at, frame.nodes);
        one.stops.push_back({c->first_position, node});
        two.stops.push_back({c->second_position, node});
      }
      frame.diagnostics.push_back(
          {Severity::info, "crossing-joined",
           fmt::format("{} and {} cross at {}{}; both are split and joined there (join_crossings)", describe(a),
                       describe(b), xyz(places.front()->at), more),
           {a.entity, b.entity},
           places.front()->at});
    } else {
      frame.diagnostics.push_back(
          {Severity::info, "members-cross",
           fmt::format("{} and {} cross at {}{} but are not joined there, as neither ends at the crossing (crossed "
                       "bracing often passes by). If they are connected, set join_crossings: true in the project or in a rule "
                       "that selects both.",
                       describe(a), describe(b), xyz(places.front()->at), more),
           {a.entity, b.entity},
           places.front()->at});
    }
  }
}

struct UnionFind {
  std::vector<std::size_t> parent;
  explicit UnionFind(std::size_t n) : parent(n) { std::iota(parent.begin(), parent.end(), 0); }
  std::size_t root(std::size_t i) {
    while (parent[i] != i) i = parent[i] = parent[parent[i]];
    return i;
  }
  void join(std::size_t a, std::size_t b) { parent[root(a)] = root(b); }
};

void report_parts(Wireframe& frame) {
  if (frame.members.empty()) return;
  UnionFind sets(frame.nodes.size());
  for (const WireMember& m : frame.members)
    for (std::size_t k = 1; k < m.nodes.size(); ++k) sets.join(m.nodes[k - 1], m.nodes[k]);
  struct Part {
    std::vector<std::size_t> members;
    Eigen::Vector3d low, high;
  };
  std::map<std::size_t, Part> parts;
  for (std::size_t i = 0; i < frame.members.size(); ++i) {
    const WireMember& m = frame.members[i];
    auto [it, fresh] = parts.try_emplace(sets.root(m.nodes.front()));
    Part& part = it->second;
    if (fresh) part.low = part.high = frame.nodes[m.nodes.front()];
    part.members.push_back(i);
    for (const std::size_t n : m.nodes) {
      part.low = part.low.cwiseMin(frame.nodes[n]);
      part.high = part.high.cwiseMax(frame.nodes[n]);
    }
  }
  if (parts.size() < 2) return;
  std::vector<Part> ordered;
  for (auto& [root, part] : parts) ordered.push_back(std::move(part));
  std::stable_sort(ordered.begin(), ordered.end(),
                   [](const Part& a, const Part& b) { return a.members.size() > b.members.size(); });
  for (std::size_t p = 0; p < ordered.size(); ++p) {
    const Part& part = ordered[p];
    std::vector<std::string> entities;
    constexpr std::size_t named = 5;
    for (std::size_t k = 0; k < part.members.size() && k < named; ++k)
      entities.push_back(frame.members[part.members[k]].source.entity);
    frame.diagnostics.push_back(
        {Severity::warning, "disconnected-part",
         fmt::format("part {} of {} of the frame is not connected to the others: {} members (first {}), bounding "
                     "box x {:.6g} .. {:.6g}, y {:.6g} .. {:.6g}, z {:.6g} .. {:.6g} m. Connect it in the CAD model, "
                     "or support it on its own.",
                     p + 1, ordered.size(), part.members.size(), describe(frame.members[part.members.front()].source),
                     part.low.x(), part.high.x(), part.low.y(), part.high.y(), part.low.z(), part.high.z()),
         entities, 0.5 * (part.low + part.high)});
  }
}

void report_overlaps(Wireframe& frame) {
  std::unordered_map<std::uint64_t, std::size_t> owner;  // element -> first member on it
  struct Shared {
    std::size_t elements = 0;
    double length = 0.0;
    Eigen::Vector3d at;
  };
  std::map<std::pair<std::size_t, std::size_t>, Shared> shared;
  for (std::size_t m = 0; m < frame.members.size(); ++m) {
    const auto& path = frame.members[m].nodes;
    for (std::size_t k = 1; k < path.size(); ++k) {
      const auto [it, fresh] = owner.try_emplace(pair_key(path[k - 1], path[k]), m);
      if (fresh || it->second == m) continue;
      Shared& s = shared[{it->second, m}];
      const Eigen::Vector3d& a = frame.nodes[path[k - 1]];
      const Eigen::Vector3d& b = frame.nodes[path[k]];
      if (s.elements == 0) s.at = 0.5 * (a + b);
      ++s.elements;
      s.length += (b - a).norm();
    }
  }
  for (const auto& [members, s] : shared) {
    const WireMember& earlier = frame.members[members.first];
    const WireMember& later = frame.members[members.second];
    const bool same = s.elements + 1 == earlier.nodes.size() && s.elements + 1 == later.nodes.size();
    if (same) {
      frame.diagnostics.push_back(
          {Severity::warning, "duplicate-member",
           fmt::format("{} joins the same nodes as {}, around {}; both are kept. Delete one of them in the CAD "
                       "model if it is a copy.",
                       describe(later.source), describe(earlier.source), xyz(s.at)),
           {earlier.source.entity, later.source.entity},
           s.at});
    } else {
      frame.diagnostics.push_back(
          {Severity::warning, "overlapping-members",
           fmt::format("{} and {} overlap over {:.6g} m, around {}; both are kept and both carry load there. "
                       "Trim one of them in the CAD model if they stand for one piece of steel.",
                       describe(earlier.source), describe(later.source), s.length, xyz(s.at)),
           {earlier.source.entity, later.source.entity},
           s.at});
    }
  }
}

// Drops nodes no member or label uses and numbers the rest in their old order.
void compact(Wireframe& frame) {
  std::vector<std::size_t> renumber(frame.nodes.size(), NodeGrid::npos);
  for (const WireMember& m : frame.members)
    for (const std::size_t n : m.nodes) renumber[n] = 0;
  for (const NodeLabel& l : frame.labels) renumber[l.node] = 0;
  std::vector<Eigen::Vector3d> kept;
  for (std::size_t n = 0; n < frame.nodes.size(); ++n) {
    if (renumber[n] == NodeGrid::npos) continue;
    renumber[n] = kept.size();
    kept.push_back(frame.nodes[n]);
  }
  frame.nodes = std::move(kept);
  for (WireMember& m : frame.members)
    for (std::size_t& n : m.nodes) n = renumber[n];
  for (NodeLabel& l : frame.labels) l.node = renumber[l.node];
}

}  // namespace

double path_length(const Wireframe& frame, const WireMember& member) {
  double length = 0;
  for (std::size_t k = 1; k < member.nodes.size(); ++k)
    length += (frame.nodes[member.nodes[k]] - frame.nodes[member.nodes[k - 1]]).norm();
  return length;
}

Wireframe build_wireframe(const StepModel& model, double tolerance) {
  WireframeOptions options;
  options.merge_tolerance = tolerance;
  return build_wireframe(model, options);
}

Wireframe build_wireframe(const StepModel& model, const WireframeOptions& options) {
  check_inputs(model, options);
  const double tol = options.merge_tolerance;
  const double reach = options.gap_factor * tol;
  Wireframe frame;
  frame.diagnostics = model.diagnostics;
  NodeGrid grid(tol);
  grid.reserve(model.edges.size());

  // 1. End points merge into nodes; edges that collapse are dropped.
  std::vector<Track> tracks;
  tracks.reserve(model.edges.size());
  std::size_t moved = 0;
  double largest_move = 0.0;
  const WireEdge* moved_most = nullptr;
  Eigen::Vector3d moved_at = Eigen::Vector3d::Zero();
  // Moves smaller than a millionth of the tolerance are rounding, not healing.
  auto count_move = [&](const Eigen::Vector3d& p, std::size_t node, const WireEdge& edge) {
    const double move = (frame.nodes[node] - p).norm();
    if (move <= 1e-6 * tol) return;
    ++moved;
    if (move > largest_move) largest_move = move, moved_most = &edge, moved_at = frame.nodes[node];
  };
  for (const WireEdge& edge : model.edges) {
    const std::size_t a = grid.merge(edge.start, frame.nodes);
    const std::size_t b = grid.merge(edge.end, frame.nodes);
    if (a == b) {
      double reach_from_start = (edge.end - edge.start).norm();
      for (const CurveSample& s : edge.curve) reach_from_start = std::max(reach_from_start, (s.point - edge.start).norm());
      if (!edge.curved() || reach_from_start <= tol) {
        frame.diagnostics.push_back(
            {Severity::warning, "zero-length-edge",
             fmt::format("{} is {:.3g} m long, within the merge tolerance of {:.3g} m, at {}; it was dropped",
                         describe(edge.source), reach_from_start, tol, xyz(frame.nodes[a])),
             {edge.source.entity},
             frame.nodes[a]});
        continue;
      }
    }
    count_move(edge.start, a, edge);
    count_move(edge.end, b, edge);
    tracks.push_back(Track{&edge, a, b, {}});
  }
  std::vector<std::size_t> first_track_at(frame.nodes.size(), NodeGrid::npos);
  for (std::size_t t = 0; t < tracks.size(); ++t)
    for (const std::size_t n : {tracks[t].first, tracks[t].last})
      if (first_track_at[n] == NodeGrid::npos) first_track_at[n] = t;

  // 2. T-junctions: an end node on another member splits it; an end node
  // near a member but beyond the tolerance is a near-miss gap.
  const SegmentIndex segments(tracks, reach);
  SegmentHits hits;
  const std::size_t end_nodes = frame.nodes.size();
  for (std::size_t q = 0; q < end_nodes; ++q) {
    if (first_track_at[q] == NodeGrid::npos) continue;
    const Eigen::Vector3d& p = frame.nodes[q];
    Foot gap;
    std::size_t gap_track = NodeGrid::npos;
    segments.near(p, hits);
    for_each_track_near(hits, tracks, p, [&](std::size_t t, const Foot& foot) {
      Track& track = tracks[t];
      if (track.first == q || track.last == q) return;
      const double to_first = (frame.nodes[track.first] - p).norm();
      const double to_last = (frame.nodes[track.last] - p).norm();
      if (foot.distance <= tol) {
        if ((foot.point - frame.nodes[track.first]).norm() <= tol || (foot.point - frame.nodes[track.last]).norm() <= tol)
          return;
        track.stops.push_back({foot.position, q});
        frame.diagnostics.push_back(
            {Severity::info, "member-split",
             fmt::format("{} is split at {}, where {} ends on it", describe(track.edge->source), xyz(p),
                         describe(tracks[first_track_at[q]].edge->source)),
             {track.edge->source.entity, tracks[first_track_at[q]].edge->source.entity},
             p});
      } else if (foot.distance <= reach && to_first > reach && to_last > reach && foot.distance < gap.distance) {
        gap = foot;
        gap_track = t;
      }
    });
    if (gap_track != NodeGrid::npos) {
      const SourceInfo& lander = tracks[first_track_at[q]].edge->source;
      const SourceInfo& host = tracks[gap_track].edge->source;
      frame.diagnostics.push_back(
          {Severity::warning, "near-miss-gap",
           fmt::format("{} ends at {}, {:.4g} m from {} (the merge tolerance is {:.4g} m): they are not connected. "
                       "Extend or trim the member in the CAD model, or raise merge_tolerance if they meet.",
                       describe(lander), xyz(p), gap.distance, describe(host), tol),
           {lander.entity, host.entity},
           p});
    }
  }

  // 2b. Members crossing away from their ends: reported, or joined on request.
  cross_members(tracks, options, tol, grid, frame);

  // 3. Named and layered points label a node, making one on a member if needed.
  for (const LabelledPoint& point : model.points) {
    std::size_t node = grid.find(point.at, frame.nodes);
    if (node == NodeGrid::npos) {
      Foot best;
      std::size_t host = NodeGrid::npos;
      segments.near(point.at, hits);
      for_each_track_near(hits, tracks, point.at, [&](std::size_t t, const Foot& foot) {
        if (foot.distance <= tol && foot.distance < best.distance) best = foot, host = t;
      });
      if (host == NodeGrid::npos) {
        frame.diagnostics.push_back(
            {Severity::warning, "point-off-frame",
             fmt::format("point {} ('{}') at {} is on no member; it selects no node", point.source.entity,
                         point.source.name, xyz(point.at)),
             {point.source.entity},
             point.at});
        continue;
      }
      node = grid.merge(point.at, frame.nodes);
      tracks[host].stops.push_back({best.position, node});
    }
    frame.labels.push_back({node, point.source});
  }

  // 4. Paths: ends, landing nodes in order, and curves divided by turn.
  frame.members.reserve(tracks.size());
  for (Track& t : tracks) {
    std::sort(t.stops.begin(), t.stops.end(), [](const Stop& a, const Stop& b) { return a.position < b.position; });
    std::vector<Stop> route{{0.0, t.first}};
    for (const Stop& s : t.stops)
      if (s.node != route.back().node && s.node != t.last) route.push_back(s);
    route.push_back({t.end_position(), t.last});
    WireMember member{{t.first}, t.edge->source, t.edge->curved()};
    for (std::size_t k = 1; k < route.size(); ++k) {
      if (member.curved)
        divide_curve(t, route[k - 1].position, route[k].position, options.curve_max_turn, grid, frame.nodes,
                     member.nodes);
      if (route[k].node != member.nodes.back()) member.nodes.push_back(route[k].node);
    }
    frame.members.push_back(std::move(member));
  }

  // 5. End nodes near each other but not joined by an element: near-miss gaps.
  std::unordered_set<std::uint64_t> joined;
  for (const WireMember& m : frame.members)
    for (std::size_t k = 1; k < m.nodes.size(); ++k) joined.insert(pair_key(m.nodes[k - 1], m.nodes[k]));
  Grid near_nodes(reach);
  near_nodes.reserve(end_nodes);
  for (std::size_t i = 0; i < end_nodes; ++i) {
    if (first_track_at[i] == NodeGrid::npos) continue;
    near_nodes.near(frame.nodes[i], [&](std::size_t j) {
      const double d = (frame.nodes[i] - frame.nodes[j]).norm();
      if (d <= tol || d > reach || joined.count(pair_key(i, j)) != 0) return;
      const SourceInfo& a = tracks[first_track_at[j]].edge->source;
      const SourceInfo& b = tracks[first_track_at[i]].edge->source;
      frame.diagnostics.push_back(
          {Severity::warning, "near-miss-gap",
           fmt::format("the end of {} at {} and the end of {} at {} are {:.4g} m apart (the merge tolerance is "
                       "{:.4g} m): they are not connected. Join them in the CAD model, or raise merge_tolerance "
                       "if they meet.",
                       describe(a), xyz(frame.nodes[j]), describe(b), xyz(frame.nodes[i]), d, tol),
           {a.entity, b.entity},
           frame.nodes[j]});
    });
    near_nodes.add(frame.nodes[i], i);
  }

  // 6. Members over the same elements, parts that do not touch, merges.
  report_overlaps(frame);
  compact(frame);
  report_parts(frame);
  if (moved > 0)
    frame.diagnostics.push_back(
        {Severity::info, "endpoints-merged",
         fmt::format("{} end points were moved onto a node within the merge tolerance of {:.4g} m; the largest "
                     "move, {:.4g} m, joined {} to the node at {}",
                     moved, tol, largest_move, describe(moved_most->source), xyz(moved_at)),
         {moved_most->source.entity},
         moved_at});
  spdlog::debug("{}: {} edges became {} members on {} nodes (tolerance {} m)", model.file.string(), model.edges.size(),
                frame.members.size(), frame.nodes.size(), tol);
  return frame;
}

}  // namespace stepframe::geometry
