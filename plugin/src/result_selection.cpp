// Which results an output is written for (outputs.line_models, surfaces,
// buckling_modes, result_details): the governing combinations, and the sway
// variants a `combinations` selection leaves out.

#include "stepframe/run.hpp"

#include <algorithm>
#include <map>
#include <optional>

namespace stepframe {
namespace {

// The results a `combinations` selection leaves out: every sway-imperfection variant of a
// combination but the one that governs it, i.e. carries the largest utilisation of a member check
// among the combination's variants (each check names the result that governs it; when no check names
// a variant, the variant with the largest von Mises stress of a member).
std::vector<bool> ungoverning_variants(const Analysis& analysis) {
  std::vector<bool> left_out(analysis.results.size(), false);
  std::map<std::string, std::size_t> index;
  for (std::size_t i = 0; i < analysis.results.size(); ++i) index.emplace(analysis.results[i].name, i);
  std::map<std::size_t, double> utilisation;  // of each result named by a member check
  for (const auto& c : analysis.checks)
    if (c.member != analysis::whole_frame)
      if (const auto it = index.find(c.combination); it != index.end())
        utilisation[it->second] = std::max(utilisation[it->second], c.utilisation);
  auto largest_stress = [&](std::size_t i) {
    double s = 0;
    for (const auto& m : analysis.results[i].members) s = std::max(s, m.max_von_mises);
    return s;
  };
  std::map<std::string, std::vector<std::size_t>> variants;  // of each combination
  for (const auto& record : analysis.sway_imperfections)
    for (const auto& name : record.variants)
      if (const auto it = index.find(name); it != index.end()) variants[record.combination].push_back(it->second);
  for (const auto& [combination, list] : variants) {
    const bool checked = std::any_of(list.begin(), list.end(), [&](std::size_t i) { return utilisation.count(i) > 0; });
    auto measure = [&](std::size_t i) {
      if (!checked) return largest_stress(i);
      const auto it = utilisation.find(i);
      return it != utilisation.end() ? it->second : -1.0;
    };
    std::size_t kept = list.front();
    for (std::size_t i : list)
      if (measure(i) > measure(kept)) kept = i;  // the first of equals: the order the variants were made in
    for (std::size_t i : list) left_out[i] = i != kept;
  }
  return left_out;
}

}  // namespace

std::vector<std::size_t> governing_results(const Analysis& analysis) {
  // Combinations when there are any (cases otherwise), as the checks see them.
  std::vector<std::size_t> pool;
  for (std::size_t i = 0; i < analysis.results.size(); ++i)
    if (analysis.results[i].is_combination) pool.push_back(i);
  if (pool.empty())
    for (std::size_t i = 0; i < analysis.results.size(); ++i) pool.push_back(i);
  auto index_of = [&](const std::string& name) -> std::optional<std::size_t> {
    for (std::size_t i : pool)
      if (analysis.results[i].name == name) return i;
    return std::nullopt;
  };
  std::vector<std::size_t> chosen;
  auto choose = [&](std::optional<std::size_t> i) {
    if (i && std::find(chosen.begin(), chosen.end(), *i) == chosen.end()) chosen.push_back(*i);
  };
  // The largest member utilisation, then the lowest alpha_cr.
  const analysis::CheckResult* worst = nullptr;
  for (const auto& c : analysis.checks)
    if (c.member != analysis::whole_frame && (!worst || c.utilisation > worst->utilisation)) worst = &c;
  if (worst) choose(index_of(worst->combination));
  std::optional<std::size_t> lowest;
  for (std::size_t i : pool)
    if (analysis.results[i].alpha_cr &&
        (!lowest || *analysis.results[i].alpha_cr < *analysis.results[*lowest].alpha_cr))
      lowest = i;
  choose(lowest);
  if (chosen.empty() && !pool.empty()) choose(pool.front());
  std::sort(chosen.begin(), chosen.end());
  return chosen;
}

ResultSelection::ResultSelection(const Analysis& analysis)
    : governing_(governing_results(analysis)), ungoverning_variants_(ungoverning_variants(analysis)) {}

std::vector<bool> ResultSelection::operator()(VtkSelection selection) const {
  std::vector<bool> selected(ungoverning_variants_.size(), selection == VtkSelection::all);
  if (selection == VtkSelection::all || selection == VtkSelection::none) return selected;
  if (selection == VtkSelection::combinations) {
    selected = ungoverning_variants_;
    selected.flip();
  }
  for (std::size_t i : governing_) selected[i] = true;
  return selected;
}

}  // namespace stepframe
