#pragma once
// Loads of a load case: member loads in local axes and the global load vector.

#include "stepframe/analysis/element_loads.hpp"
#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Core>

#include <vector>

namespace stepframe::analysis {

/// Every load on every element for one case, local axes, one list per
/// element: the case's uniform loads (rotated from global axes), its partial,
/// trapezoidal and point loads (element_loads.hpp, to_local) and, when the case
/// includes self weight, A * density * standard_gravity along global -Z.
std::vector<LocalLoads> element_local_loads(const FrameModel& model, const LoadCase& load_case);

/// Global load vector (6 per node, forces [N] then moments [N m] in global
/// axes): the case's node loads plus the equivalent nodal loads of the given
/// local element loads (one list per element; exact fixed-end actions, with
/// the element's releases condensed out).
Eigen::VectorXd load_vector(const FrameModel& model, const LoadCase& load_case,
                            const std::vector<LocalLoads>& element_loads);

}  // namespace stepframe::analysis
