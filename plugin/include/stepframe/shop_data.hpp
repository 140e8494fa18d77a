#pragma once
// Shop data of an analysed frame (README "Shop data and fabrication checks"):
// piece marks for identical members, recommended precamber, and the
// fabrication-stage checks (handling limits, lifting) of the project's
// `fabrication:` block.

#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/model_builder.hpp"
#include "stepframe/project.hpp"

#include <string>
#include <vector>

namespace stepframe {

struct ShopData {
  /// Per member: its piece mark. Members share a mark when they have the same kind (C: vertical, within
  /// analysis::vertical_tolerance; B: within 5 degrees of horizontal; D: any other slope), section,
  /// material, end releases (either way round), precamber, and lengths within fabrication.mark_tolerance
  /// of the group's shortest. Marks are numbered per kind by section, then length: "B1", "B2", "C1".
  std::vector<std::string> marks;
  /// Per member: recommended precamber [m] (0: none), see CamberSpec.
  std::vector<double> camber;
  /// Per member: local deflection under fabrication.camber.load [m] (0 without a camber block, and for
  /// vertical members).
  std::vector<double> permanent_deflection;
};

/// Marks and camber for the built model and its results (cases and combinations by name).
ShopData shop_data(const Project& project, const BuiltModel& built, const std::vector<analysis::LoadResult>& results);

/// The fabrication-stage checks: "handling length" (length <= fabrication.max_length), "handling mass"
/// (A rho L <= fabrication.max_mass), and analysis::check_lifting for members longer than
/// fabrication.lifting.min_length; combination "fabrication" or "lifting". None without the block's keys.
std::vector<analysis::CheckResult> fabrication_checks(const Project& project, const BuiltModel& built);

}  // namespace stepframe
