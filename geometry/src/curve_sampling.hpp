#pragma once
// Sampling a curved edge finely enough to divide it later by the turn of its
// tangent, without OCCT at hand.

#include "stepframe/geometry/step_reader.hpp"

#include <vector>

class Adaptor3d_Curve;

namespace stepframe::geometry::detail {

/// Points of `curve` from its first to its last parameter, in model units, so
/// that the tangent turns by at most `max_step_turn` [rad] between neighbours,
/// each with the total turn of the tangent from the first point. The turn
/// between two tangents t1, t2 is atan2(|t1 x t2|, t1 . t2) (the angle between
/// two vectors, common practice).
std::vector<CurveSample> sample_curve(const Adaptor3d_Curve& curve, double max_step_turn);

/// The same samples run the other way: points reversed, turns measured from the new start.
std::vector<CurveSample> reversed(const std::vector<CurveSample>& samples);

}  // namespace stepframe::geometry::detail
