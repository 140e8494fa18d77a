#pragma once
// Keeping the governing result of each check per member, as the code checks do.

#include "stepframe/analysis/checks.hpp"

#include <algorithm>
#include <cstddef>
#include <iterator>
#include <string>
#include <vector>

namespace stepframe::analysis {

/// One member's governing result of each check, ordered by check name (a
/// member has fewer than ten kinds of check: a sorted vector, one allocation).
using WorstByCheck = std::vector<CheckResult>;

/// Keeps each of `candidates` in `worst` where its check has no result yet or
/// it has the larger utilisation (the first of equals stays).
inline void keep_worst(WorstByCheck& worst, std::vector<CheckResult> candidates) {
  for (CheckResult& c : candidates) {
    const auto at = std::lower_bound(worst.begin(), worst.end(), c.check,
                                     [](const CheckResult& kept, const std::string& name) { return kept.check < name; });
    if (at == worst.end() || at->check != c.check) worst.insert(at, std::move(c));
    else if (c.utilisation > at->utilisation) *at = std::move(c);
  }
}

/// Every member's governing results, in member order and check-name order.
inline std::vector<CheckResult> flatten(std::vector<WorstByCheck> worst) {
  std::size_t total = 0;
  for (const auto& per_member : worst) total += per_member.size();
  std::vector<CheckResult> out;
  out.reserve(total);
  for (auto& per_member : worst) std::move(per_member.begin(), per_member.end(), std::back_inserter(out));
  return out;
}

}  // namespace stepframe::analysis
