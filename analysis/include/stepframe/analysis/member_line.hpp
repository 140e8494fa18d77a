#pragma once
// A member's results as one line: its elements' stations joined in order.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <vector>

namespace stepframe::analysis {

/// Joins the results of a member's elements: stations in order with x measured
/// along the member from its start (both stations kept at an inner node, so
/// jumps in the diagrams stay visible), start forces of the first element, end
/// forces of the last, the largest stress, and the largest distance of the
/// deformed axis from the chord between the member's deformed ends.
LineResult join_elements(const Member& member, const std::vector<LineResult>& element_results);

}  // namespace stepframe::analysis
