#pragma once
// Natural frequencies in a run (analysis.modes): the mass of the members,
// of analysis.mass_from's gravity loads and of masses:, the modes, and the
// checks.frequency limits.

#include "stepframe/run.hpp"

#include <functional>
#include <vector>

namespace stepframe::detail {

/// Fills a.modes and a.added_mass from a.built and a.project, and returns the
/// frequency checks' results. Throws InputError when the modes found are too
/// few to decide a check (naming the check's project-file line).
std::vector<analysis::CheckResult> run_natural_frequencies(Analysis& a, const std::function<void(double)>& progress);

}  // namespace stepframe::detail
