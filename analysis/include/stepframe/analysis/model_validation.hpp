#pragma once
// Consistency checks of a frame model before it is assembled.

#include "stepframe/analysis/frame_model.hpp"

namespace stepframe::analysis {

/// Throws std::invalid_argument naming the offending member, support, load or
/// combination when the model refers to a missing node, section, material or
/// load case, when a member has zero length, or when a member's section or
/// material has a non-positive A, Iy, Iz, J, depth, width, E or G (or a
/// negative density). Returns normally for a usable model.
void validate_model(const FrameModel& model);

}  // namespace stepframe::analysis
