// Action categories, the psi factors of EN 1990 Table A1.1 and the steps the
// code combination generators share.

#include "stepframe/analysis/combination_rules.hpp"

#include "combination_terms.hpp"

#include <array>
#include <utility>

namespace stepframe::analysis {
namespace {

constexpr std::array<std::pair<ActionCategory, const char*>, 15> spellings{{
    {ActionCategory::permanent, "permanent"},   {ActionCategory::imposed_A, "imposed_A"},
    {ActionCategory::imposed_B, "imposed_B"},   {ActionCategory::imposed_C, "imposed_C"},
    {ActionCategory::imposed_D, "imposed_D"},   {ActionCategory::imposed_E, "imposed_E"},
    {ActionCategory::imposed_F, "imposed_F"},   {ActionCategory::imposed_G, "imposed_G"},
    {ActionCategory::imposed_H, "imposed_H"},   {ActionCategory::snow, "snow"},
    {ActionCategory::snow_high, "snow_high"},   {ActionCategory::wind, "wind"},
    {ActionCategory::temperature, "temperature"}, {ActionCategory::rain, "rain"},
    {ActionCategory::accidental, "accidental"},
}};

}  // namespace

std::string category_name(ActionCategory category) {
  for (const auto& [c, name] : spellings)
    if (c == category) return name;
  return "?";
}

std::optional<ActionCategory> parse_category(const std::string& name) {
  for (const auto& [c, spelling] : spellings)
    if (name == spelling) return c;
  return std::nullopt;
}

std::vector<std::string> category_names() {
  std::vector<std::string> names;
  for (const auto& [c, name] : spellings) names.emplace_back(name);
  return names;
}

std::optional<PsiFactors> en1990_recommended_psi(ActionCategory category) {
  // EN 1990:2002 Annex A1, Table A1.1 (recommended values of psi factors for buildings).
  switch (category) {
    case ActionCategory::imposed_A:
    case ActionCategory::imposed_B: return PsiFactors{0.7, 0.5, 0.3};
    case ActionCategory::imposed_C:
    case ActionCategory::imposed_D: return PsiFactors{0.7, 0.7, 0.6};
    case ActionCategory::imposed_E: return PsiFactors{1.0, 0.9, 0.8};
    case ActionCategory::imposed_F: return PsiFactors{0.7, 0.7, 0.6};
    case ActionCategory::imposed_G: return PsiFactors{0.7, 0.5, 0.3};
    case ActionCategory::imposed_H: return PsiFactors{0.0, 0.0, 0.0};
    case ActionCategory::snow_high: return PsiFactors{0.7, 0.5, 0.2};
    case ActionCategory::snow: return PsiFactors{0.5, 0.2, 0.0};
    case ActionCategory::wind: return PsiFactors{0.6, 0.2, 0.0};
    case ActionCategory::temperature: return PsiFactors{0.6, 0.5, 0.0};
    case ActionCategory::permanent:
    case ActionCategory::rain:
    case ActionCategory::accidental: return std::nullopt;
  }
  return std::nullopt;
}

namespace detail {

std::vector<std::vector<std::size_t>> action_groups(const std::vector<ActionCase>& cases,
                                                    const std::function<bool(const ActionCase&)>& take) {
  std::vector<std::vector<std::size_t>> groups;
  std::map<std::string, std::size_t> by_name;
  for (std::size_t i = 0; i < cases.size(); ++i) {
    if (!take(cases[i])) continue;
    if (cases[i].group.empty()) {
      groups.push_back({i});
      continue;
    }
    const auto [it, inserted] = by_name.emplace(cases[i].group, groups.size());
    if (inserted) groups.emplace_back();
    groups[it->second].push_back(i);
  }
  return groups;
}

void for_each_choice(const std::vector<std::vector<std::size_t>>& groups, std::ptrdiff_t skip,
                     const std::function<void(const std::vector<std::ptrdiff_t>&)>& visit) {
  std::vector<std::ptrdiff_t> choice(groups.size(), -1);
  // Odometer over the groups: position k runs through -1 (absent) and each alternative.
  std::vector<std::size_t> digit(groups.size(), 0);
  while (true) {
    for (std::size_t g = 0; g < groups.size(); ++g)
      choice[g] = digit[g] == 0 ? -1 : static_cast<std::ptrdiff_t>(groups[g][digit[g] - 1]);
    visit(choice);
    std::size_t g = 0;
    for (; g < groups.size(); ++g) {
      if (static_cast<std::ptrdiff_t>(g) == skip) continue;
      if (++digit[g] <= groups[g].size()) break;
      digit[g] = 0;
    }
    if (g == groups.size()) return;
  }
}

void CombinationCollector::add(const std::string& prefix, const std::string& rule, bool serviceability,
                               const std::string& leading, const std::vector<double>& factors) {
  if (!seen_.emplace(std::pair{serviceability, factors}, true).second) return;
  GeneratedCombination c;
  c.name = prefix + "-" + std::to_string(++counters_[prefix]);
  c.rule = rule;
  c.serviceability = serviceability;
  c.leading = leading;
  for (std::size_t i = 0; i < factors.size(); ++i)
    if (factors[i] != 0.0) c.factors.emplace_back(cases_[i].name, factors[i]);
  out_.push_back(std::move(c));
}

}  // namespace detail
}  // namespace stepframe::analysis
