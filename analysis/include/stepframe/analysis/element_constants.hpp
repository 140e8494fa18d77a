#pragma once
// What the recovery needs about an element that no load result changes.

#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/element_loads.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <optional>
#include <vector>

namespace stepframe::analysis {

/// An element's geometry, properties and, when a load result loads it, its
/// cantilever flexibility: worked out once per model and shared by every load
/// result's recovery (element_state), which would otherwise work them out
/// again for each result and each reader (summaries, checks, VTK files). The
/// same functions give the same numbers either way, bit for bit.
struct ElementConstants {
  ElementGeometry geometry;
  ElementProperties properties;
  std::optional<CantileverFlexibility> flexibility;  ///< for elements some case loads
};

/// The constants of every element of `model`, the elements spread over the
/// cores; the flexibility for the elements that a load term of `results` loads.
std::vector<ElementConstants> element_constants(const FrameModel& model, const std::vector<LoadResult>& results);

}  // namespace stepframe::analysis
