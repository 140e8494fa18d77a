#include "stepframe/analysis/load_vector.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/element_geometry.hpp"

namespace stepframe::analysis {

std::vector<LocalLoads> element_local_loads(const FrameModel& model, const LoadCase& load_case) {
  std::vector<Eigen::Vector3d> uniform(model.elements.size(), Eigen::Vector3d::Zero());
  for (const ElementUniformLoad& load : load_case.element_loads) uniform.at(load.element) += load.w;
  if (load_case.self_weight) {
    for (std::size_t m = 0; m < model.elements.size(); ++m) {
      const FrameElement& member = model.elements[m];
      // Weight per length = A rho g (common practice), acting along global -Z.
      const double weight = model.sections[member.section].A * model.materials[member.material].density * standard_gravity;
      uniform[m].z() -= weight;
    }
  }
  std::vector<LocalLoads> local(model.elements.size());
  for (std::size_t m = 0; m < model.elements.size(); ++m) {
    if (uniform[m].isZero(0.0)) continue;
    const ElementGeometry geo = element_geometry(model, m);
    local[m].push_back(uniform_local_load(geo.length, geo.axes * uniform[m]));
  }
  for (const ElementLoad& load : load_case.partial_loads) {
    const ElementGeometry geo = element_geometry(model, load.element);
    local.at(load.element).push_back(to_local(load, geo.axes, geo.length));
  }
  return local;
}

Eigen::VectorXd load_vector(const FrameModel& model, const LoadCase& load_case,
                            const std::vector<LocalLoads>& element_loads) {
  Eigen::VectorXd f = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(6 * model.nodes.size()));
  for (const NodeLoad& load : load_case.node_loads) {
    f.segment<3>(global_dof(load.node, ux)) += load.force;
    f.segment<3>(global_dof(load.node, rx)) += load.moment;
  }
  for (std::size_t m = 0; m < model.elements.size(); ++m) {
    const LocalLoads& loads = element_loads.at(m);
    if (loads.empty()) continue;
    const Vector12d f_global = element_system(model, m, loads).loads;
    const FrameElement& member = model.elements[m];
    f.segment<6>(global_dof(member.nodes[0], ux)) += f_global.head<6>();
    f.segment<6>(global_dof(member.nodes[1], ux)) += f_global.tail<6>();
  }
  return f;
}

}  // namespace stepframe::analysis
