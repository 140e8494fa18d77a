#pragma once
// A member's results as one line: its elements' stations joined in order,
// recovered on demand from a load result (node displacements and element
// loads), exactly as the solver's own summaries were.

#include "stepframe/analysis/element_recovery.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstddef>
#include <vector>

namespace stepframe::analysis {

/// The loads on element `element` under `result`: the sum of the result's
/// load terms (each case's loads times its factor), local axes.
LocalLoads element_loads(const LoadResult& result, std::size_t element);

/// Everything the recovery needs about one element under `result` (the
/// section is referenced, not copied: `model` must outlive the state).
ElementState element_state(const FrameModel& model, const LoadResult& result, std::size_t element);

/// The element's results: `stations` stations (0: result.stations) and, in
/// full, extremes, stresses and local deflection (recover_element).
LineResult element_line(const FrameModel& model, const LoadResult& result, std::size_t element,
                        std::size_t stations = 0, LineDetail detail = LineDetail::full);

/// The member's results: its elements' lines joined (join_elements), each
/// element with `stations` stations (0: result.stations). A summary of a
/// member of several elements is joined from their full lines (the chord's
/// distance needs their stations) and so keeps the stations.
LineResult member_line(const FrameModel& model, const LoadResult& result, const Member& member,
                       LineDetail detail = LineDetail::full, std::size_t stations = 0);

/// The yield strength each member's checks use: its first element's material
/// for its section's thickness (material_for_section; EN 1993-1-1 3.2.1) [Pa],
/// one per member of `chains`.
std::vector<double> member_yield_strengths(const FrameModel& model, const std::vector<Member>& chains);

/// Joins the results of a member's elements (in order from its start):
/// stations in order with x measured along the member from its start (both
/// stations kept at an inner node, so jumps in the diagrams stay visible),
/// start forces of the first element, end forces of the last, the largest
/// stress, and the largest distance of the deformed axis from the chord
/// between the member's deformed ends. One element is its own member.
LineResult join_elements(const std::vector<LineResult>& parts);

}  // namespace stepframe::analysis
