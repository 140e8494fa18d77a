// Which results an output is written for (outputs.line_models, surfaces,
// buckling_modes, result_details): the governing results, and the sway
// variants a `combinations` selection leaves out.

#include "stepframe/run.hpp"

#include <algorithm>
#include <map>
#include <optional>

namespace stepframe {
namespace {

constexpr std::size_t no_result = static_cast<std::size_t>(-1);

// The sway-imperfection variants of the analysis, per result: the combination a variant belongs to
// (no_result for a case or combination), and per combination the variant that governs it, i.e. carries
// the largest utilisation of a member check among the combination's variants (each check names the
// result that governs it; when no check names a variant, the variant with the largest von Mises stress
// of a member; the first of equals, in the order the variants were made in).
struct SwayVariants {
  std::vector<std::size_t> combination_of;
  std::vector<std::size_t> governing_variant;  // per result: of a combination with variants, else no_result
};

SwayVariants sway_variants(const Analysis& analysis) {
  const std::size_t count = analysis.results.size();
  SwayVariants out{std::vector<std::size_t>(count, no_result), std::vector<std::size_t>(count, no_result)};
  std::map<std::string, std::size_t> index;
  for (std::size_t i = 0; i < count; ++i) index.emplace(analysis.results[i].name, i);
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
  std::map<std::size_t, std::vector<std::size_t>> of;  // each combination's variants (a record per axis)
  for (const auto& record : analysis.sway_imperfections)
    if (const auto combination = index.find(record.combination); combination != index.end())
      for (const auto& name : record.variants)
        if (const auto it = index.find(name); it != index.end()) of[combination->second].push_back(it->second);
  for (const auto& [combination, list] : of) {
    const bool checked = std::any_of(list.begin(), list.end(), [&](std::size_t i) { return utilisation.count(i) > 0; });
    auto measure = [&](std::size_t i) {
      if (!checked) return largest_stress(i);
      const auto it = utilisation.find(i);
      return it != utilisation.end() ? it->second : -1.0;
    };
    std::size_t kept = list.front();
    for (std::size_t i : list) {
      out.combination_of[i] = combination;
      if (measure(i) > measure(kept)) kept = i;
    }
    out.governing_variant[combination] = kept;
  }
  return out;
}

std::vector<std::size_t> governing_results(const Analysis& analysis, const SwayVariants& variants) {
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
  // A combination with sway variants (EN 1993-1-1 5.3.2) is designed for with its imperfections: its
  // governing variant stands for it (alpha_cr is the combination's, the variants add no axial force).
  if (lowest && variants.governing_variant[*lowest] != no_result) lowest = variants.governing_variant[*lowest];
  choose(lowest);
  if (chosen.empty() && !pool.empty()) choose(pool.front());
  std::sort(chosen.begin(), chosen.end());
  return chosen;
}

}  // namespace

std::vector<std::size_t> governing_results(const Analysis& analysis) {
  return governing_results(analysis, sway_variants(analysis));
}

ResultSelection::ResultSelection(const Analysis& analysis) {
  const SwayVariants variants = sway_variants(analysis);
  governing_ = governing_results(analysis, variants);
  combination_of_ = variants.combination_of;
  ungoverning_variants_.assign(analysis.results.size(), false);
  for (std::size_t i = 0; i < analysis.results.size(); ++i)
    ungoverning_variants_[i] = variants.combination_of[i] != no_result &&
                               variants.governing_variant[variants.combination_of[i]] != i;
}

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

std::vector<bool> ResultSelection::with_combinations(std::vector<bool> selected) const {
  for (std::size_t i = 0; i < selected.size() && i < combination_of_.size(); ++i)
    if (selected[i] && combination_of_[i] != no_result) selected[combination_of_[i]] = true;
  return selected;
}

}  // namespace stepframe
