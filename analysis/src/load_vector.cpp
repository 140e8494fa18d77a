#include "stepframe/analysis/load_vector.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/element_geometry.hpp"

namespace stepframe::analysis {

std::vector<Eigen::Vector3d> element_local_loads(const FrameModel& model, const LoadCase& load_case) {
  std::vector<Eigen::Vector3d> global(model.elements.size(), Eigen::Vector3d::Zero());
  for (const ElementUniformLoad& load : load_case.element_loads) global.at(load.element) += load.w;
  if (load_case.self_weight) {
    for (std::size_t m = 0; m < model.elements.size(); ++m) {
      const FrameElement& member = model.elements[m];
      // Weight per length = A rho g (common practice), acting along global -Z.
      const double weight = model.sections[member.section].A * model.materials[member.material].density * standard_gravity;
      global[m].z() -= weight;
    }
  }
  std::vector<Eigen::Vector3d> local(model.elements.size());
  for (std::size_t m = 0; m < model.elements.size(); ++m) local[m] = element_geometry(model, m).axes * global[m];
  return local;
}

Eigen::VectorXd load_vector(const FrameModel& model, const LoadCase& load_case,
                            const std::vector<Eigen::Vector3d>& member_loads_local) {
  Eigen::VectorXd f = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(6 * model.nodes.size()));
  for (const NodeLoad& load : load_case.node_loads) {
    f.segment<3>(global_dof(load.node, ux)) += load.force;
    f.segment<3>(global_dof(load.node, rx)) += load.moment;
  }
  for (std::size_t m = 0; m < model.elements.size(); ++m) {
    const Eigen::Vector3d& q = member_loads_local.at(m);
    if (q.isZero(0.0)) continue;
    const ElementGeometry geo = element_geometry(model, m);
    // Local equivalent nodal loads rotated to global axes: F = T^T f (common practice).
    const Vector12d f_global = transformation(geo.axes).transpose() * equivalent_nodal_loads(geo.length, q);
    const FrameElement& member = model.elements[m];
    f.segment<6>(global_dof(member.nodes[0], ux)) += f_global.head<6>();
    f.segment<6>(global_dof(member.nodes[1], ux)) += f_global.tail<6>();
  }
  return f;
}

}  // namespace stepframe::analysis
