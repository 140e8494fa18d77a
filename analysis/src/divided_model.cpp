#include "divided_model.hpp"

namespace stepframe::analysis::detail {

DividedModel divide_elements(const FrameModel& model, const std::vector<std::size_t>& parts) {
  DividedModel d;
  d.parts = parts;
  FrameModel& sub = d.model;
  sub.settings = model.settings;
  sub.nodes = model.nodes;
  sub.sections = model.sections;
  sub.materials = model.materials;
  sub.supports = model.supports;
  d.points.resize(model.elements.size());
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const FrameElement& el = model.elements[e];
    const std::size_t n = parts[e];
    const Eigen::Vector3d a = model.nodes[el.nodes[0]], b = model.nodes[el.nodes[1]];
    std::vector<std::size_t>& points = d.points[e];
    points.push_back(el.nodes[0]);
    for (std::size_t k = 1; k < n; ++k) {
      points.push_back(sub.nodes.size());
      sub.nodes.push_back(a + (b - a) * (static_cast<double>(k) / static_cast<double>(n)));
    }
    points.push_back(el.nodes[1]);
    d.first_part.push_back(sub.elements.size());
    for (std::size_t k = 0; k < n; ++k) {
      FrameElement part = el;
      part.nodes = {points[k], points[k + 1]};
      part.releases = {};
      if (k == 0) part.releases[0] = el.releases[0];
      if (k + 1 == n) part.releases[1] = el.releases[1];
      sub.elements.push_back(part);
      d.parent.push_back(e);
      d.part_start.push_back(static_cast<double>(k) / static_cast<double>(n));
    }
  }
  return d;
}

}  // namespace stepframe::analysis::detail
