#pragma once
// Member checks: each turns results into a utilisation per member, with the
// clause it stands on. A utilisation above 1 fails.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstddef>
#include <string>
#include <vector>

namespace stepframe::analysis {

struct CheckResult {
  std::size_t member = 0;
  std::string check;        ///< "stress", "deflection"
  std::string clause;       ///< what the limit stands on
  std::string combination;  ///< the governing case or combination
  double station = 0;       ///< distance from the member's start where it governs [m]
  double value = 0;         ///< the checked quantity [Pa or m]
  double limit = 0;         ///< its limit [Pa or m]
  double utilisation = 0;   ///< value / limit
  bool pass = true;
};

/// Normal-stress screening: max |sigma| over the extreme fibres <= fy, i.e. the
/// normal-stress part of the elastic criterion of EN 1993-1-1 6.2.1(5) with
/// gamma_M0 = 1.0. One result per member: the worst of `results`.
std::vector<CheckResult> check_stress(const FrameModel& model, const std::vector<const LoadResult*>& results);

/// Local deflection relative to the chord <= L / span_ratio (EN 1993-1-1 7.2:
/// the limit is agreed for the project; span_ratio states it). One result per
/// member: the worst of `results`.
std::vector<CheckResult> check_deflection(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                          double span_ratio);

}  // namespace stepframe::analysis
