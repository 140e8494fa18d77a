#include "stepframe/geometry/wireframe.hpp"

#include <spdlog/fmt/fmt.h>
#include <spdlog/spdlog.h>

#include <cmath>
#include <cstdint>
#include <limits>
#include <map>
#include <stdexcept>
#include <string>
#include <unordered_map>
#include <utility>

namespace stepframe::geometry {

namespace {

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

// Nodes bucketed in cubic cells of edge `tolerance`: a point within tolerance
// of a node lies in the node's cell or one of its 26 neighbours.
class NodeGrid {
 public:
  explicit NodeGrid(double tolerance) : tolerance_(tolerance) {}

  /// Index of the node within tolerance nearest to `p` (lowest index on a
  /// tie), or a new node at `p` when there is none.
  std::size_t merge(const Eigen::Vector3d& p, std::vector<Eigen::Vector3d>& nodes) {
    const Cell home = cell_of(p);
    std::size_t best = npos;
    double best_distance = std::numeric_limits<double>::infinity();
    for (std::int64_t dx = -1; dx <= 1; ++dx) {
      for (std::int64_t dy = -1; dy <= 1; ++dy) {
        for (std::int64_t dz = -1; dz <= 1; ++dz) {
          const auto bucket = cells_.find(Cell{home[0] + dx, home[1] + dy, home[2] + dz});
          if (bucket == cells_.end()) continue;
          for (const std::size_t candidate : bucket->second) {
            const double distance = (nodes[candidate] - p).norm();
            if (distance > tolerance_) continue;
            if (distance < best_distance || (distance == best_distance && candidate < best)) {
              best = candidate;
              best_distance = distance;
            }
          }
        }
      }
    }
    if (best != npos) return best;
    nodes.push_back(p);
    cells_[home].push_back(nodes.size() - 1);
    return nodes.size() - 1;
  }

 private:
  static constexpr std::size_t npos = std::numeric_limits<std::size_t>::max();

  Cell cell_of(const Eigen::Vector3d& p) const {
    return {static_cast<std::int64_t>(std::floor(p.x() / tolerance_)),
            static_cast<std::int64_t>(std::floor(p.y() / tolerance_)),
            static_cast<std::int64_t>(std::floor(p.z() / tolerance_))};
  }

  double tolerance_;
  std::unordered_map<Cell, std::vector<std::size_t>, CellHash> cells_;
};

std::string describe(const SourceInfo& source) {
  std::string text = source.entity.empty() ? std::string("an edge with no STEP entity") : source.entity;
  if (!source.name.empty()) text += fmt::format(" ('{}')", source.name);
  return text;
}

void check_inputs(const StepModel& model, double tolerance) {
  if (!(tolerance > 0.0) || !std::isfinite(tolerance))
    throw std::invalid_argument(fmt::format("{}: the node merge tolerance must be a positive length in metres, got {}",
                                            model.file.string(), tolerance));
  // Grid cell indices must fit comfortably in 64-bit integers.
  constexpr double largest_cell_index = 1e15;
  for (const WireEdge& edge : model.edges) {
    for (const Eigen::Vector3d* p : {&edge.start, &edge.end}) {
      if (!p->allFinite())
        throw std::invalid_argument(fmt::format("{}: {} has a non-finite coordinate", model.file.string(),
                                                describe(edge.source)));
      if (p->cwiseAbs().maxCoeff() / tolerance > largest_cell_index)
        throw std::invalid_argument(fmt::format(
            "{}: tolerance {} m is too small for coordinates as large as {} m ({}); use a larger tolerance",
            model.file.string(), tolerance, p->cwiseAbs().maxCoeff(), describe(edge.source)));
    }
  }
}

}  // namespace

double path_length(const Wireframe& frame, const WireMember& member) {
  double length = 0;
  for (std::size_t k = 1; k < member.nodes.size(); ++k)
    length += (frame.nodes[member.nodes[k]] - frame.nodes[member.nodes[k - 1]]).norm();
  return length;
}

Wireframe build_wireframe(const StepModel& model, double tolerance) {
  check_inputs(model, tolerance);
  Wireframe frame;
  frame.diagnostics = model.diagnostics;
  frame.members.reserve(model.edges.size());
  NodeGrid grid(tolerance);

  // First member seen on each unordered node pair, to report later duplicates.
  std::map<std::pair<std::size_t, std::size_t>, std::size_t> first_on_pair;
  for (const WireEdge& edge : model.edges) {
    const std::size_t a = grid.merge(edge.start, frame.nodes);
    const std::size_t b = grid.merge(edge.end, frame.nodes);
    if (a == b) {
      frame.diagnostics.push_back(
          {Severity::warning, "zero-length-edge",
           fmt::format("{} is {:.3g} m long, within the merge tolerance of {:.3g} m, at ({:.6g}, {:.6g}, {:.6g}) m; "
                       "it was dropped",
                       describe(edge.source), (edge.end - edge.start).norm(), tolerance, frame.nodes[a].x(),
                       frame.nodes[a].y(), frame.nodes[a].z()),
           {edge.source.entity},
           frame.nodes[a]});
      continue;
    }
    const auto [it, first] = first_on_pair.try_emplace(std::minmax(a, b), frame.members.size());
    if (!first) {
      const SourceInfo& earlier = frame.members[it->second].source;
      const Eigen::Vector3d middle = 0.5 * (frame.nodes[a] + frame.nodes[b]);
      frame.diagnostics.push_back(
          {Severity::warning, "duplicate-member",
           fmt::format("{} joins the same two nodes as {}, around ({:.6g}, {:.6g}, {:.6g}) m; both are kept. "
                       "Delete one of them in the CAD model if it is a copy.",
                       describe(edge.source), describe(earlier), middle.x(), middle.y(), middle.z()),
           {earlier.entity, edge.source.entity},
           middle});
    }
    frame.members.push_back(WireMember{{a, b}, edge.source});
  }
  spdlog::debug("{}: {} edges merged into {} nodes and {} members (tolerance {} m)", model.file.string(),
                model.edges.size(), frame.nodes.size(), frame.members.size(), tolerance);
  return frame;
}

}  // namespace stepframe::geometry
