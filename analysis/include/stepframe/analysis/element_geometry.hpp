#pragma once
// Length and local axes of a member of a frame model.

#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Core>

#include <cstddef>

namespace stepframe::analysis {

struct ElementGeometry {
  double length = 0;                                  ///< [m]
  Eigen::Matrix3d axes = Eigen::Matrix3d::Identity(); ///< rows: local x, y, z in global components
};

/// Geometry of model.elements[member]; the model must be valid (see validate_model).
ElementGeometry element_geometry(const FrameModel& model, std::size_t member);

}  // namespace stepframe::analysis
