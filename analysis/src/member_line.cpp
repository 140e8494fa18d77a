#include "stepframe/analysis/member_line.hpp"

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

LineResult join_elements(const Member& member, const std::vector<LineResult>& element_results) {
  if (member.elements.empty()) throw std::invalid_argument("join_elements: a member needs at least one element");
  LineResult joined;
  double offset = 0;
  std::size_t e_index = 0;
  for (std::size_t e : member.elements) {
    const LineResult& part = element_results.at(e);
    for (Station s : part.stations) {
      s.x += offset;
      joined.stations.push_back(s);
    }
    for (std::size_t c = 0; c < 6; ++c) {
      const DiagramExtreme& part_extreme = part.extremes[c];
      DiagramExtreme& j = joined.extremes[c];
      const bool first = e_index == 0;
      if (first || part_extreme.max > j.max) j.max = part_extreme.max, j.x_max = part_extreme.x_max + offset;
      if (first || part_extreme.min < j.min) j.min = part_extreme.min, j.x_min = part_extreme.x_min + offset;
    }
    ++e_index;
    offset += part.stations.back().x;
    joined.max_abs_stress = std::max(joined.max_abs_stress, part.max_abs_stress);
    joined.max_von_mises = std::max(joined.max_von_mises, part.max_von_mises);
  }
  joined.start_forces = element_results[member.elements.front()].start_forces;
  joined.end_forces = element_results[member.elements.back()].end_forces;

  if (member.elements.size() == 1) {  // the element's own (local-axis) measure is the member's
    const LineResult& only = element_results[member.elements.front()];
    joined.max_local_deflection = only.max_local_deflection;
    joined.max_local_deflection_at = only.max_local_deflection_at;
    return joined;
  }
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
