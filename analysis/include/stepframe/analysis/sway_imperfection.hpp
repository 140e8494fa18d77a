#pragma once
// Global (sway) imperfections of EN 1993-1-1 5.3.2: the initial sway phi of
// 5.3.2(3) and the equivalent horizontal forces of 5.3.2(7) that stand for it
// in a first- or second-order analysis, with the 5.3.2(4) exemption.
//
// Columns are the elements within 5 degrees of the vertical
// (local_axes.hpp, ambiguous_inclination). Each carries the closed system of
// 5.3.2(7): phi N at its top along the chosen direction and phi N back at its
// bottom, N its compression (tension reverses the pair: the same geometry), so
// a storey level receives phi times the vertical load its columns bring down.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <array>
#include <cstddef>
#include <optional>
#include <vector>

namespace stepframe::analysis {

/// alpha_h of 5.3.2(3): 2 / sqrt(h), h the height of the structure [m], within 2/3 <= alpha_h <= 1.
double height_reduction(double height);

/// alpha_m of 5.3.2(3): sqrt(0.5 (1 + 1/m)), m the number of columns in a row.
double column_reduction(std::size_t columns);

/// phi_0 of 5.3.2(3), the basic value 1/200.
inline constexpr double basic_sway = 1.0 / 200.0;

/// The sway imperfection of one result in one horizontal direction.
struct SwayImperfection {
  int axis = 0;            ///< 0: X, 1: Y (the forces below push towards +axis)
  double height = 0;       ///< h: height of the structure, lowest to highest column node [m]
  std::size_t columns = 0; ///< m: the fewest columns in a row (a vertical plane along the axis) carrying at
                           ///< least half the average compression of that row's columns
  double alpha_h = 1, alpha_m = 1;
  double phi = 0;          ///< phi_0 alpha_h alpha_m, or the project's own value
  double H_Ed = 0;         ///< total horizontal load along the axis (sum of reactions, size) [N]
  double V_Ed = 0;         ///< total vertical load (sum of vertical reactions, size) [N]
  bool exempt = false;     ///< 5.3.2(4): H_Ed >= 0.15 V_Ed, sway imperfections may be disregarded
  std::vector<NodeLoad> forces;  ///< the equivalent horizontal forces towards +axis
};

/// The sway imperfections of a solved result along X and along Y. `phi`
/// replaces phi_0 alpha_h alpha_m when given. Columns in a row are those whose
/// base lies within `row_tolerance` [m] of one vertical plane along the axis.
std::array<SwayImperfection, 2> sway_imperfections(const FrameModel& model, const LoadResult& result,
                                                   std::optional<double> phi = std::nullopt,
                                                   double row_tolerance = 0.01);

}  // namespace stepframe::analysis
