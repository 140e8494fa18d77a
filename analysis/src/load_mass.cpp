#include "stepframe/analysis/load_mass.hpp"

#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/load_vector.hpp"

#include <algorithm>

namespace stepframe::analysis {

AddedMass mass_from_loads(const FrameModel& model, const std::vector<std::pair<std::size_t, double>>& factors) {
  AddedMass mass;
  mass.per_length.assign(model.elements.size(), 0.0);
  mass.at_node.assign(model.nodes.size(), 0.0);
  constexpr double g = standard_gravity;
  for (const auto& [index, factor] : factors) {
    LoadCase loads = model.cases.at(index);
    loads.self_weight = false;  // the members' own mass comes from their density
    const std::vector<LocalLoads> local = element_local_loads(model, loads);
    for (std::size_t e = 0; e < model.elements.size(); ++e) {
      const ElementGeometry geo = element_geometry(model, e);
      const auto [start, end] = model.elements[e].nodes;
      for (const LocalLoad& l : local[e]) {
        // Downward intensity (or force) along global -Z: -(R^T q).z with R the local axes (rows).
        const double down_a = -factor * (geo.axes.transpose() * l.q_a).z();
        if (l.point) {
          const double share = l.a / geo.length;  // lever rule
          mass.at_node[start] += std::max(down_a, 0.0) * (1 - share) / g;
          mass.at_node[end] += std::max(down_a, 0.0) * share / g;
          continue;
        }
        const double down_b = -factor * (geo.axes.transpose() * l.q_b).z();
        const bool whole = l.a <= 1e-9 * geo.length && l.b >= (1 - 1e-9) * geo.length;
        if (whole && down_a == down_b) {
          mass.per_length[e] += down_a / g;
          continue;
        }
        // Resultant of the trapezoid from a to b and its position (centroid of a trapezoid).
        const double total = 0.5 * (down_a + down_b) * (l.b - l.a);
        if (total == 0.0) continue;
        const double centroid = l.a + (l.b - l.a) * (down_a + 2 * down_b) / (3 * (down_a + down_b));
        const double share = std::clamp(centroid / geo.length, 0.0, 1.0);
        mass.at_node[start] += total * (1 - share) / g;
        mass.at_node[end] += total * share / g;
      }
    }
    for (const NodeLoad& n : loads.node_loads) mass.at_node[n.node] += -factor * n.force.z() / g;
  }
  // Upward loads carry no mass (they may cancel part of a downward load on the same element or node).
  for (double& m : mass.per_length) m = std::max(m, 0.0);
  for (double& m : mass.at_node) m = std::max(m, 0.0);
  return mass;
}

}  // namespace stepframe::analysis
