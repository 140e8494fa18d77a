#pragma once
// Keeping the governing result of each check per member, as the code checks do.

#include "stepframe/analysis/checks.hpp"

#include <map>
#include <string>
#include <vector>

namespace stepframe::analysis {

/// One member's governing result of each check, by check name.
using WorstByCheck = std::map<std::string, CheckResult>;

/// Keeps each of `candidates` in `worst` where its check has no result yet or
/// it has the larger utilisation (the first of equals stays).
inline void keep_worst(WorstByCheck& worst, std::vector<CheckResult> candidates) {
  for (CheckResult& c : candidates) {
    auto [it, inserted] = worst.try_emplace(c.check, c);
    if (!inserted && c.utilisation > it->second.utilisation) it->second = std::move(c);
  }
}

/// Every member's governing results, in member order and check-name order.
inline std::vector<CheckResult> flatten(std::vector<WorstByCheck> worst) {
  std::vector<CheckResult> out;
  for (auto& per_member : worst)
    for (auto& [check, c] : per_member) out.push_back(std::move(c));
  return out;
}

}  // namespace stepframe::analysis
