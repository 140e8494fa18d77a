#include "modal_run.hpp"

#include "stepframe/analysis/frequency_checks.hpp"
#include "stepframe/analysis/load_mass.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <numeric>

namespace stepframe::detail {

std::vector<analysis::CheckResult> run_natural_frequencies(Analysis& a, const std::function<void(double)>& progress) {
  const auto& model = a.built.model;
  const ModesSpec& spec = a.project.modes;
  analysis::AddedMass added;
  if (spec.mass_from) {
    // A case, or a combination's cases with their factors.
    std::vector<std::pair<std::size_t, double>> factors;
    const auto c = std::find_if(model.cases.begin(), model.cases.end(), [&](const auto& lc) { return lc.name == *spec.mass_from; });
    if (c != model.cases.end()) {
      factors.emplace_back(static_cast<std::size_t>(c - model.cases.begin()), 1.0);
    } else {
      const auto k = std::find_if(model.combinations.begin(), model.combinations.end(),
                                  [&](const auto& comb) { return comb.name == *spec.mass_from; });
      if (k != model.combinations.end()) factors = k->factors;
    }
    added = analysis::mass_from_loads(model, factors);
  } else {
    added.at_node.assign(model.nodes.size(), 0.0);
  }
  for (std::size_t n = 0; n < a.built.point_masses.size(); ++n) added.at_node[n] += a.built.point_masses[n];
  double added_total = std::accumulate(added.at_node.begin(), added.at_node.end(), 0.0);
  for (std::size_t e = 0; e < added.per_length.size(); ++e)
    added_total += added.per_length[e] * (model.nodes[model.elements[e].nodes[1]] - model.nodes[model.elements[e].nodes[0]]).norm();
  a.added_mass = added_total;

  analysis::ModalOptions options;
  options.modes = spec.count;
  options.parts = spec.parts;
  a.modes = analysis::natural_frequencies(model, added, options, progress);
  const auto& modes = a.modes->modes;
  if (!modes.empty())
    spdlog::info("natural frequencies: {} modes, {:.3g} Hz to {:.3g} Hz; mass {:.4g} t ({:.4g} t added)", modes.size(),
                 modes.front().frequency, modes.back().frequency, a.modes->total_mass / 1e3, added_total / 1e3);

  std::vector<analysis::FrequencyLimit> limits;
  const auto& checks = a.project.checks.frequency;
  for (std::size_t i = 0; i < checks.size(); ++i)
    limits.push_back({"(" + checks[i].origin.describe() + ")", a.built.frequency_members[i], checks[i].min_hz,
                      checks[i].running_hz, checks[i].band});
  try {
    return analysis::check_frequencies(model, *a.modes, limits, spec.mass_from ? "modes, mass from " + *spec.mass_from : "modes");
  } catch (const analysis::ModesTooFew& e) {
    throw InputError(std::string(e.what()) + "; raise analysis.modes");
  }
}

}  // namespace stepframe::detail
