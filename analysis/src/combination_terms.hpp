#pragma once
// Shared steps of the code combination generators (combination_rules_*.cpp):
// variable actions grouped into alternatives, every choice of them, and the
// collection of generated combinations without repeats.

#include "stepframe/analysis/combination_rules.hpp"

#include <cstddef>
#include <functional>
#include <map>
#include <string>
#include <vector>

namespace stepframe::analysis::detail {

/// The cases `take` accepts, grouped: cases sharing a non-empty group are one
/// entry (alternatives), every other case an entry of its own; in case order.
std::vector<std::vector<std::size_t>> action_groups(const std::vector<ActionCase>& cases,
                                                    const std::function<bool(const ActionCase&)>& take);

/// Calls `visit` with every choice of at most one case per group: choice[g]
/// is a case index or -1 (absent). Groups in `skip` are always absent.
void for_each_choice(const std::vector<std::vector<std::size_t>>& groups, std::ptrdiff_t skip,
                     const std::function<void(const std::vector<std::ptrdiff_t>&)>& visit);

/// Collects generated combinations, numbering them per name prefix and
/// dropping one whose kind and factors repeat an earlier one's.
class CombinationCollector {
 public:
  explicit CombinationCollector(const std::vector<ActionCase>& cases) : cases_(cases) {}
  /// `factors` holds one factor per case (0: absent).
  void add(const std::string& prefix, const std::string& rule, bool serviceability, const std::string& leading,
           const std::vector<double>& factors);
  std::vector<GeneratedCombination> take() { return std::move(out_); }

 private:
  const std::vector<ActionCase>& cases_;
  std::vector<GeneratedCombination> out_;
  std::map<std::string, int> counters_;
  std::map<std::pair<bool, std::vector<double>>, bool> seen_;
};

}  // namespace stepframe::analysis::detail
