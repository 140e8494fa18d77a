#include "stepframe/analysis/member_line.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/element_constants.hpp"
#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/material.hpp"

#include <Eigen/Geometry>

#include <algorithm>
#include <stdexcept>

namespace stepframe::analysis {

std::vector<Member> member_chains(const FrameModel& model) {
  if (!model.members.empty()) return model.members;
  std::vector<Member> chains(model.elements.size());
  for (std::size_t e = 0; e < chains.size(); ++e) chains[e].elements = {e};
  return chains;
}

std::vector<std::size_t> element_members(const FrameModel& model) {
  std::vector<std::size_t> owner(model.elements.size(), 0);
  const auto chains = member_chains(model);
  for (std::size_t m = 0; m < chains.size(); ++m)
    for (std::size_t e : chains[m].elements) owner[e] = m;
  return owner;
}

std::vector<double> member_yield_strengths(const FrameModel& model, const std::vector<Member>& chains) {
  std::vector<double> fy(chains.size());
  for (std::size_t m = 0; m < chains.size(); ++m) {
    const FrameElement& first = model.elements[chains[m].elements.front()];
    fy[m] = material_for_section(model.materials[first.material], model.sections[first.section]).fy;
  }
  return fy;
}

LocalLoads element_loads(const LoadResult& result, std::size_t element) {
  // Loads over the same stretch (or at the same point) are summed into one: the recovery then
  // evaluates one term where a combination of several cases would give several (superposition).
  LocalLoads loads;
  std::size_t most = 0;
  for (const LoadTerm& term : result.element_loads) most += (*term.loads)[element].size();
  loads.reserve(most);
  for (const LoadTerm& term : result.element_loads)
    for (const LocalLoad& load : (*term.loads)[element]) {
      auto same = std::find_if(loads.begin(), loads.end(), [&](const LocalLoad& l) {
        return l.point == load.point && l.a == load.a && l.b == load.b;
      });
      if (same == loads.end()) same = loads.insert(loads.end(), LocalLoad{load.point, load.a, load.b, {0, 0, 0}, {0, 0, 0}});
      same->q_a += term.factor * load.q_a;
      same->q_b += term.factor * load.q_b;
    }
  return loads;
}

ElementState element_state(const FrameModel& model, const LoadResult& result, std::size_t e) {
  const FrameElement& element = model.elements[e];
  ElementState es;
  es.section = &model.sections[element.section];
  if (result.element_constants && result.element_constants->size() == model.elements.size()) {
    const ElementConstants& c = (*result.element_constants)[e];
    es.properties = c.properties;
    es.axes = c.geometry.axes;
    es.flexibility = c.flexibility ? &*c.flexibility : nullptr;
  } else {
    const ElementGeometry geo = element_geometry(model, e);
    es.properties = element_properties(*es.section, model.materials[element.material], geo.length,
                                       model.settings.shear_deformation);
    es.axes = geo.axes;
  }
  es.origin = model.nodes[element.nodes[0]];
  es.end_displacements << result.displacements.segment<6>(global_dof(element.nodes[0], ux)),
      result.displacements.segment<6>(global_dof(element.nodes[1], ux));
  es.loads = element_loads(result, e);
  es.releases = element.releases;
  if (!result.second_order_axial.empty()) {
    es.second_order = true;
    es.axial_force = result.second_order_axial[e];
  }
  return es;
}

LineResult element_line(const FrameModel& model, const LoadResult& result, std::size_t element, std::size_t stations,
                        LineDetail detail) {
  return recover_element(element_state(model, result, element), stations > 0 ? stations : result.stations, detail);
}

LineResult member_line(const FrameModel& model, const LoadResult& result, const Member& member, LineDetail detail,
                       std::size_t stations) {
  // One element (most members): its line is the member's, with no copy of its stations.
  if (member.elements.size() == 1) return element_line(model, result, member.elements.front(), stations, detail);
  // Joining needs the elements' stations (the member's chord), so a summary is joined from full parts.
  const LineDetail part_detail = detail == LineDetail::summary ? LineDetail::full : detail;
  std::vector<LineResult> parts;
  parts.reserve(member.elements.size());
  for (std::size_t e : member.elements) parts.push_back(element_line(model, result, e, stations, part_detail));
  return join_elements(parts);
}

LineResult join_elements(const std::vector<LineResult>& parts) {
  if (parts.empty()) throw std::invalid_argument("join_elements: a member needs at least one element");
  if (parts.size() == 1) return parts.front();  // the element's own (local-axis) measures are the member's
  LineResult joined;
  std::size_t stations = 0;
  for (const LineResult& part : parts) stations += part.stations.size();
  joined.stations.reserve(stations);
  double offset = 0;
  bool first = true;
  for (const LineResult& part : parts) {
    for (Station s : part.stations) {
      s.x += offset;
      joined.stations.push_back(s);
    }
    for (std::size_t c = 0; c < 6; ++c) {
      const DiagramExtreme& part_extreme = part.extremes[c];
      DiagramExtreme& j = joined.extremes[c];
      if (first || part_extreme.max > j.max) j.max = part_extreme.max, j.x_max = part_extreme.x_max + offset;
      if (first || part_extreme.min < j.min) j.min = part_extreme.min, j.x_min = part_extreme.x_min + offset;
    }
    joined.max_abs_stress = std::max(joined.max_abs_stress, part.max_abs_stress);
    if (first || part.max_von_mises > joined.max_von_mises)
      joined.max_von_mises = part.max_von_mises, joined.max_von_mises_at = part.max_von_mises_at + offset;
    offset += part.length;
    first = false;
  }
  joined.length = offset;
  joined.start_forces = parts.front().start_forces;
  joined.end_forces = parts.back().end_forces;
  // Distance of each deformed axis point from the line through the deformed member ends.
  const Eigen::Vector3d a = joined.stations.front().position + joined.stations.front().displacement;
  const Eigen::Vector3d chord = joined.stations.back().position + joined.stations.back().displacement - a;
  const double chord_length = chord.norm();
  for (const Station& s : joined.stations) {
    const Eigen::Vector3d p = s.position + s.displacement - a;
    const double distance = chord_length > 0 ? chord.cross(p).norm() / chord_length : p.norm();
    if (distance > joined.max_local_deflection) {
      joined.max_local_deflection = distance;
      joined.max_local_deflection_at = s.x;
    }
  }
  return joined;
}

}  // namespace stepframe::analysis
