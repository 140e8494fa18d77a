#pragma once
// Results that are not finite numbers stop a run: a NaN compares false with
// every limit, so it could otherwise slip through a check as a pass.

#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/results.hpp"

#include <string>
#include <vector>

namespace stepframe::detail {

/// Throws InputError when a displacement, reaction, end force, stress or
/// deflection of any result is NaN or infinite, naming the result, the node or
/// member and the quantity. `model` names the model.
void require_finite_results(const std::vector<analysis::LoadResult>& results, const std::string& model);

/// The same for every result's critical load factor alpha_cr.
void require_finite_buckling(const std::vector<analysis::LoadResult>& results, const std::string& model);

/// The same for every check's value, limit and utilisation.
void require_finite_checks(const std::vector<analysis::CheckResult>& checks, const std::string& model);

}  // namespace stepframe::detail
