#pragma once
// Length and local axes of a member of a frame model.

#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Core>

#include <cstddef>

namespace stepframe::analysis {

struct MemberGeometry {
  double length = 0;                                  ///< [m]
  Eigen::Matrix3d axes = Eigen::Matrix3d::Identity(); ///< rows: local x, y, z in global components
};

/// Geometry of model.members[member]; the model must be valid (see validate_model).
MemberGeometry member_geometry(const FrameModel& model, std::size_t member);

}  // namespace stepframe::analysis
