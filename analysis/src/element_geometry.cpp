#include "stepframe/analysis/element_geometry.hpp"

#include "stepframe/analysis/local_axes.hpp"

namespace stepframe::analysis {

ElementGeometry element_geometry(const FrameModel& model, std::size_t member) {
  const FrameElement& m = model.elements.at(member);
  const Eigen::Vector3d& start = model.nodes.at(m.nodes[0]);
  const Eigen::Vector3d& end = model.nodes.at(m.nodes[1]);
  return ElementGeometry{(end - start).norm(), local_axes(start, end, m.roll)};
}

}  // namespace stepframe::analysis
