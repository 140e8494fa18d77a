// Sway imperfections (EN 1993-1-1 5.3.2) as variants of the ultimate combinations.

#include "sway_variants.hpp"

#include "stepframe/analysis/element_geometry.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <map>

namespace stepframe::detail {
namespace {

// The horizontal part of a load case (the global X and Y components of its node and member loads; self
// weight, moments and settlements left out): the H_Ed that 5.2.2(5)B amplifies.
analysis::LoadCase horizontal_part(const analysis::FrameModel& model, const analysis::LoadCase& c) {
  analysis::LoadCase h;
  h.name = c.name + ".horizontal";
  for (analysis::NodeLoad l : c.node_loads) {
    l.force.z() = 0, l.moment.setZero();
    if (!l.force.isZero(0.0)) h.node_loads.push_back(l);
  }
  for (analysis::ElementUniformLoad l : c.element_loads) {  // global axes
    l.w.z() = 0;
    if (!l.w.isZero(0.0)) h.element_loads.push_back(l);
  }
  for (analysis::ElementLoad l : c.partial_loads) {
    if (l.axes == analysis::LoadAxes::local) {  // to global: w = R^T w_local
      const Eigen::Matrix3d axes = analysis::element_geometry(model, l.element).axes;
      l.w_start = axes.transpose() * l.w_start, l.w_end = axes.transpose() * l.w_end;
      l.axes = analysis::LoadAxes::global;
    }
    l.w_start.z() = 0, l.w_end.z() = 0;
    if (!l.w_start.isZero(0.0) || !l.w_end.isZero(0.0)) h.partial_loads.push_back(l);
  }
  return h;
}

}  // namespace

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
  first_options.buckling_modes = project.sway_amplification ? 1 : 0;  // alpha_cr for 5.2.2(5)
  first_options.progress = [&](std::string_view, double f) {
    if (options.progress) options.progress("imperfections", f);
  };
  const auto results = analysis::solve(first, first_options);

  std::map<std::string, std::vector<std::string>> variants_of;
  const std::size_t cases = first.cases.size();  // results: the cases, then the ultimate combinations
  std::map<std::size_t, std::size_t> horizontal_of;  // case -> the case of its horizontal part
  for (std::size_t k = 0; k < ultimate.size(); ++k) {
    const analysis::Combination& combination = ultimate[k];
    const analysis::LoadResult& solved = results[cases + k];
    // 5.2.2(5)B: sway effects (horizontal loads and imperfection forces) times 1 / (1 - 1/alpha_cr),
    // allowed for 3 <= alpha_cr < 10 (not needed above 10; below 3 only a second-order analysis will do).
    double amplification = 1.0;
    if (project.sway_amplification && solved.alpha_cr) {
      const double a_cr = *solved.alpha_cr;
      if (a_cr >= 3 && a_cr < 10) amplification = 1.0 / (1.0 - 1.0 / a_cr);  // (5.4)
      else if (a_cr < 3)
        spdlog::warn("combination '{}': alpha_cr = {:.2f} < 3, so EN 1993-1-1 5.2.2(5) does not allow the sway "
                     "amplification; set analysis.second_order instead",
                     combination.name, a_cr);
    }
    // The variant's own factors: the combination, plus (k - 1) times its cases' horizontal parts.
    auto amplified = [&]() {
      analysis::Combination v = combination;
      v.buckling = false;
      if (amplification == 1.0) return v;
      for (const auto& [index, factor] : combination.factors) {
        auto [it, inserted] = horizontal_of.try_emplace(index, model.cases.size());
        if (inserted) model.cases.push_back(horizontal_part(model, model.cases[index]));
        v.factors.emplace_back(it->second, (amplification - 1.0) * factor);
      }
      return v;
    };
    bool any_variant = false;
    for (const auto& s : analysis::sway_imperfections(first, solved, project.sway_imperfection.phi)) {
      SwayImperfectionRecord record{combination.name, s, {}, {}, solved.alpha_cr, amplification};
      const char axis = s.axis == 0 ? 'X' : 'Y';
      if (!s.exempt && !s.forces.empty()) {
        analysis::LoadCase forces;
        forces.name = fmt::format("{}.sway{}", combination.name, axis);
        forces.node_loads = s.forces;
        record.forces_case = forces.name;
        const std::size_t index = model.cases.size();
        model.cases.push_back(std::move(forces));
        any_variant = true;
        for (const double sign : {1.0, -1.0}) {
          analysis::Combination variant = amplified();
          variant.name = fmt::format("{}.sway{}{}", combination.name, sign > 0 ? '+' : '-', axis);
          variant.factors.emplace_back(index, sign * amplification);
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
    if (amplification > 1.0 && !any_variant) {  // exempt both ways: the horizontal loads still sway the frame
      analysis::Combination variant = amplified();
      variant.name = combination.name + ".sway";
      for (auto& r : records)
        if (r.combination == combination.name) r.variants.push_back(variant.name);
      variants_of[combination.name].push_back(variant.name);
      model.combinations.push_back(std::move(variant));
    }
    if (amplification > 1.0)
      spdlog::info("combination '{}': alpha_cr = {:.2f}, sway effects amplified by {:.3f} (EN 1993-1-1 5.2.2(5))",
                   combination.name, *solved.alpha_cr, amplification);
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
  if (checks.aisc360) expand(checks.aisc360->combinations);
  if (checks.drift) expand(checks.drift->combinations);
  if (checks.stability) expand(checks.stability->combinations);
  return records;
}

}  // namespace stepframe::detail
