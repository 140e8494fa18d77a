#pragma once
// An `area_loads` entry of a project turned into panels and member loads
// (analysis/area_loads.hpp): its plane, direction and span from the project's keys.

#include "stepframe/analysis/area_loads.hpp"
#include "stepframe/project.hpp"

#include <vector>

namespace stepframe::detail {

/// The panels and member loads of `spec` among `elements` (those its `where:`
/// selects, or all). Throws InputError naming the project-file line when no
/// panel is found or the span cannot be applied.
analysis::AreaLoadResult build_area_load(const analysis::FrameModel& model, const AreaLoadSpec& spec,
                                         std::vector<std::size_t> elements, double tolerance);

}  // namespace stepframe::detail
