#pragma once
// Loads of a load case: member loads in local axes and the global load vector.

#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Core>

#include <vector>

namespace stepframe::analysis {

/// Total uniform load on every member for one case, local axes [N/m]: the
/// case's member loads (rotated from global axes) plus, when the case includes
/// self weight, A * density * standard_gravity along global -Z. One entry per member.
std::vector<Eigen::Vector3d> element_local_loads(const FrameModel& model, const LoadCase& load_case);

/// Global load vector (6 per node, forces [N] then moments [N m] in global
/// axes): the case's node loads plus the equivalent nodal loads of the given
/// local member loads (one per member).
Eigen::VectorXd load_vector(const FrameModel& model, const LoadCase& load_case,
                            const std::vector<Eigen::Vector3d>& member_loads_local);

}  // namespace stepframe::analysis
