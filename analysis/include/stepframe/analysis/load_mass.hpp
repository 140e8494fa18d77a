#pragma once
// Mass from gravity loads: the downward (-Z) part of a case's or
// combination's loads divided by standard gravity, so that a floor's
// quasi-permanent load vibrates with the frame (e.g. EN 1998-1 3.2.4 combines
// gravity loads G + psi_E Q into masses this way; common practice).
//
// Uniform loads over a whole element become mass per length, distributed in
// the consistent mass matrix; partial, trapezoidal and point loads are lumped
// at the element's end nodes by the lever rule (their resultant's position);
// node loads at their nodes. Upward parts carry no mass. Self weight is left
// out: the members' own mass comes from their density (mass_matrix.hpp).

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/mass_matrix.hpp"

#include <cstddef>
#include <utility>
#include <vector>

namespace stepframe::analysis {

/// The mass of the model's cases `factors` (case index, factor) add, with
/// per_length one per element and at_node one per node [kg/m, kg].
AddedMass mass_from_loads(const FrameModel& model, const std::vector<std::pair<std::size_t, double>>& factors);

}  // namespace stepframe::analysis
