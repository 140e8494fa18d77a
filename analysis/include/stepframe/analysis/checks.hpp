#pragma once
// Member and frame checks: each turns results into a utilisation with the
// clause it stands on. A utilisation above 1 fails. The EN 1993-1-1 member
// resistance checks are in en1993.hpp.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstddef>
#include <limits>
#include <string>
#include <utility>
#include <vector>

namespace stepframe::analysis {

/// CheckResult::member of a check on the whole frame.
inline constexpr std::size_t whole_frame = std::numeric_limits<std::size_t>::max();

struct CheckResult {
  std::size_t member = 0;   ///< a member index, or whole_frame
  std::string check;        ///< "stress", "deflection", "6.3.1 flexural buckling", ...
  std::string clause;       ///< what the limit stands on
  std::string combination;  ///< the governing case or combination
  double station = 0;       ///< distance from the member's start where it governs [m]
  double value = 0;         ///< the checked quantity, in `unit`
  double limit = 0;         ///< its limit, same unit
  std::string unit = "1";   ///< SI unit of value and limit: "Pa", "m", "N", "N*m" or "1" (a ratio)
  double utilisation = 0;   ///< value / limit
  bool pass = true;
  /// The intermediate values the verdict stands on, in the order the clause
  /// works them out (e.g. "Mcr", "lambda_LT", "chi_LT"), SI units or ratios:
  /// what an engineer needs to follow the check by hand.
  std::vector<std::pair<std::string, double>> details;
};

/// Elastic fibre stress: the von Mises stress at every stress point and
/// station <= fy / gamma_M0 (EN 1993-1-1 6.2.1(5)), fy of each section's
/// thickest plate. One result per member: the worst of `results`.
std::vector<CheckResult> check_stress(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                      double gamma_M0);

/// Local deflection relative to the member's chord <= L / span_ratio, with
/// one ratio per member (EN 1993-1-1 7.2 leaves the limits to the project).
/// A cantilever (one end free: no other element and no support there) is
/// checked by its tip's movement across the member relative to its root
/// against 2 L / span_ratio (common practice). One result per member.
std::vector<CheckResult> check_deflection(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                          const std::vector<double>& span_ratios);

/// Storey drift: for every vertical member (a column), the horizontal
/// displacement of its top relative to its bottom <= h / storey_ratio
/// (limits per EN 1990 A1.4.3 and the national annex; common practice h/300).
std::vector<CheckResult> check_drift(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                     double storey_ratio);

/// Frame stability (EN 1993-1-1 5.2.1(3)): alpha_cr >= alpha_cr_min (10 for an
/// elastic analysis) or second-order effects must be accounted for. One
/// whole-frame result per combination that has an alpha_cr; utilisation is
/// alpha_cr_min / alpha_cr. A result analysed to second order passes the check.
std::vector<CheckResult> check_frame_stability(const std::vector<const LoadResult*>& results, double alpha_cr_min);

}  // namespace stepframe::analysis
