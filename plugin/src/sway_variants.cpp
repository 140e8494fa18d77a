// Sway imperfections (EN 1993-1-1 5.3.2) as variants of the ultimate combinations.

#include "sway_variants.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <map>

namespace stepframe::detail {

std::vector<SwayImperfectionRecord> add_sway_imperfections(Project& project, analysis::FrameModel& model,
                                                           const analysis::SolveOptions& options) {
  std::vector<SwayImperfectionRecord> records;
  if (!project.sway_imperfection.enabled) return records;
  std::vector<analysis::Combination> ultimate;
  for (const auto& c : model.combinations)
    if (!c.serviceability) ultimate.push_back(c);
  if (ultimate.empty()) return records;

  // First order, the cases and the ultimate combinations only: their column forces and total loads.
  analysis::FrameModel first = model;
  first.settings.second_order = false;
  first.combinations = ultimate;
  analysis::SolveOptions first_options;
  first_options.stations = 2;
  first_options.buckling_modes = 0;
  first_options.progress = [&](std::string_view, double f) {
    if (options.progress) options.progress("imperfections", f);
  };
  const auto results = analysis::solve(first, first_options);

  std::map<std::string, std::vector<std::string>> variants_of;
  const std::size_t cases = first.cases.size();  // results: the cases, then the ultimate combinations
  for (std::size_t k = 0; k < ultimate.size(); ++k) {
    const analysis::Combination& combination = ultimate[k];
    for (const auto& s : analysis::sway_imperfections(first, results[cases + k], project.sway_imperfection.phi)) {
      SwayImperfectionRecord record{combination.name, s, {}, {}};
      const char axis = s.axis == 0 ? 'X' : 'Y';
      if (!s.exempt && !s.forces.empty()) {
        analysis::LoadCase forces;
        forces.name = fmt::format("{}.sway{}", combination.name, axis);
        forces.node_loads = s.forces;
        record.forces_case = forces.name;
        const std::size_t index = model.cases.size();
        model.cases.push_back(std::move(forces));
        for (const double sign : {1.0, -1.0}) {
          analysis::Combination variant = combination;
          variant.name = fmt::format("{}.sway{}{}", combination.name, sign > 0 ? '+' : '-', axis);
          variant.factors.emplace_back(index, sign);
          variant.buckling = false;
          record.variants.push_back(variant.name);
          variants_of[combination.name].push_back(variant.name);
          model.combinations.push_back(std::move(variant));
        }
      }
      spdlog::info("combination '{}', sway along {}: phi = {:.5f} (EN 1993-1-1 5.3.2(3): alpha_h = {:.3f}, alpha_m = "
                   "{:.3f}, m = {}, h = {:.3g} m{}), H_Ed = {:.4g} kN, V_Ed = {:.4g} kN: {}",
                   combination.name, axis, s.phi, s.alpha_h, s.alpha_m, s.columns, s.height,
                   project.sway_imperfection.phi ? "; phi set by the project" : "", s.H_Ed / 1e3, s.V_Ed / 1e3,
                   s.exempt ? "H_Ed >= 0.15 V_Ed, disregarded (5.3.2(4))" : "equivalent forces of 5.3.2(7) both ways");
      records.push_back(std::move(record));
    }
  }

  // A check naming a combination also runs under its variants.
  auto expand = [&](std::vector<std::string>& names) {
    const std::vector<std::string> given = names;
    for (const auto& name : given)
      if (const auto it = variants_of.find(name); it != variants_of.end())
        names.insert(names.end(), it->second.begin(), it->second.end());
  };
  auto& checks = project.checks;
  if (checks.stress) expand(checks.stress->combinations);
  if (checks.deflection) expand(checks.deflection->combinations);
  if (checks.en1993) expand(checks.en1993->combinations);
  if (checks.drift) expand(checks.drift->combinations);
  if (checks.stability) expand(checks.stability->combinations);
  return records;
}

}  // namespace stepframe::detail
