#pragma once
// A frame model with its elements divided into shorter ones, for the analyses
// that need displacements between the model's nodes (buckling, natural
// frequencies): element e becomes parts[e] equal elements through new inner
// nodes appended after the model's own; releases stay at the element's ends.

#include "stepframe/analysis/frame_model.hpp"

#include <cstddef>
#include <vector>

namespace stepframe::analysis::detail {

struct DividedModel {
  FrameModel model;                               // nodes: the original ones first, then the inner ones
  std::vector<std::size_t> parts;                 // per original element
  std::vector<std::vector<std::size_t>> points;   // per original element: node ids from start to end
  std::vector<std::size_t> parent;                // per divided element: the original element
  std::vector<double> part_start;                 // per divided element: its start, as a fraction of the parent
  std::vector<std::size_t> first_part;            // per original element: its first divided element
};

/// `model` with element e divided into parts[e] (>= 1) equal elements; one
/// part everywhere gives the model itself.
DividedModel divide_elements(const FrameModel& model, const std::vector<std::size_t>& parts);

}  // namespace stepframe::analysis::detail
