// Sway imperfections (EN 1993-1-1 5.3.2) as variants of the ultimate combinations.

#include "sway_variants.hpp"

#include "stepframe/analysis/element_geometry.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <map>
#include <string>

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

// The sway variants of the ultimate combinations of `model`, from the first-order results of its cases and
// combinations (`first`, in model order); `amplification` per combination (1: none).
struct Variants {
  analysis::DerivedLoads loads;
  std::vector<SwayImperfectionRecord> records;
  std::map<std::string, std::vector<std::string>> of;  // combination -> its variants
};

Variants sway_variants(const Project& project, const analysis::FrameModel& model,
                       const std::vector<analysis::LoadResult>& first, const std::vector<double>& amplification) {
  Variants out;
  auto add_case = [&](analysis::LoadCase c) {
    out.loads.cases.push_back(std::move(c));
    return model.cases.size() + out.loads.cases.size() - 1;
  };
  std::map<std::size_t, std::size_t> horizontal_of;  // case -> the case of its horizontal part
  for (std::size_t k = 0; k < model.combinations.size(); ++k) {
    const analysis::Combination& combination = model.combinations[k];
    if (combination.serviceability) continue;
    const analysis::LoadResult& solved = first[model.cases.size() + k];
    const double a = amplification[k];
    // The variant's own factors: the combination, plus (a - 1) times its cases' horizontal parts.
    auto amplified = [&]() {
      analysis::Combination v = combination;
      v.buckling = false;
      if (a == 1.0) return v;
      for (const auto& [index, factor] : combination.factors) {
        auto it = horizontal_of.find(index);
        if (it == horizontal_of.end())
          it = horizontal_of.emplace(index, add_case(horizontal_part(model, model.cases[index]))).first;
        v.factors.emplace_back(it->second, (a - 1.0) * factor);
      }
      return v;
    };
    bool any_variant = false;
    for (const auto& s : analysis::sway_imperfections(model, solved, project.sway_imperfection.phi)) {
      SwayImperfectionRecord record{combination.name, s, {}, {}, solved.alpha_cr, a};
      const char axis = s.axis == 0 ? 'X' : 'Y';
      if (!s.exempt && !s.forces.empty()) {
        analysis::LoadCase forces;
        forces.name = fmt::format("{}.sway{}", combination.name, axis);
        forces.node_loads = s.forces;
        record.forces_case = forces.name;
        const std::size_t index = add_case(std::move(forces));
        any_variant = true;
        for (const double sign : {1.0, -1.0}) {
          analysis::Combination variant = amplified();
          variant.name = fmt::format("{}.sway{}{}", combination.name, sign > 0 ? '+' : '-', axis);
          variant.factors.emplace_back(index, sign * a);
          record.variants.push_back(variant.name);
          out.of[combination.name].push_back(variant.name);
          out.loads.combinations.push_back(std::move(variant));
        }
      }
      spdlog::info("combination '{}', sway along {}: phi = {:.5f} (EN 1993-1-1 5.3.2(3): alpha_h = {:.3f}, alpha_m = "
                   "{:.3f}, m = {}, h = {:.3g} m{}), H_Ed = {:.4g} kN, V_Ed = {:.4g} kN: {}",
                   combination.name, axis, s.phi, s.alpha_h, s.alpha_m, s.columns, s.height,
                   project.sway_imperfection.phi ? "; phi set by the project" : "", s.H_Ed / 1e3, s.V_Ed / 1e3,
                   s.exempt ? "H_Ed >= 0.15 V_Ed, disregarded (5.3.2(4))" : "equivalent forces of 5.3.2(7) both ways");
      out.records.push_back(std::move(record));
    }
    if (a > 1.0 && !any_variant) {  // exempt both ways: the horizontal loads still sway the frame
      analysis::Combination variant = amplified();
      variant.name = combination.name + ".sway";
      for (auto& r : out.records)
        if (r.combination == combination.name) r.variants.push_back(variant.name);
      out.of[combination.name].push_back(variant.name);
      out.loads.combinations.push_back(std::move(variant));
    }
    if (a > 1.0)
      spdlog::info("combination '{}': alpha_cr = {:.2f}, sway effects amplified by {:.3f} (EN 1993-1-1 5.2.2(5))",
                   combination.name, *solved.alpha_cr, a);
  }
  return out;
}

// 5.2.2(5)B: each combination's factor 1 / (1 - 1/alpha_cr) on its sway effects (horizontal loads and
// imperfection forces), from a first-order pass with buckling; allowed for 3 <= alpha_cr < 10 (not
// needed above 10; below 3 only a second-order analysis will do).
std::vector<double> sway_amplifications(const analysis::FrameModel& model,
                                        const std::vector<analysis::LoadResult>& first) {
  std::vector<double> out(model.combinations.size(), 1.0);
  for (std::size_t k = 0; k < model.combinations.size(); ++k) {
    const auto& alpha_cr = first[model.cases.size() + k].alpha_cr;
    if (model.combinations[k].serviceability || !alpha_cr) continue;
    if (*alpha_cr >= 3 && *alpha_cr < 10) out[k] = 1.0 / (1.0 - 1.0 / *alpha_cr);  // (5.4)
    else if (*alpha_cr < 3)
      spdlog::warn("combination '{}': alpha_cr = {:.2f} < 3, so EN 1993-1-1 5.2.2(5) does not allow the sway "
                   "amplification; set analysis.second_order instead",
                   model.combinations[k].name, *alpha_cr);
  }
  return out;
}

// A check naming a combination also runs under its variants.
void expand_checks(Project& project, const std::map<std::string, std::vector<std::string>>& variants_of) {
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
}

void append(analysis::FrameModel& model, const analysis::DerivedLoads& loads) {
  model.cases.insert(model.cases.end(), loads.cases.begin(), loads.cases.end());
  model.combinations.insert(model.combinations.end(), loads.combinations.begin(), loads.combinations.end());
}

}  // namespace

SwaySolution solve_with_sway_imperfections(Project& project, analysis::FrameModel& model,
                                           const analysis::SolveOptions& options) {
  const bool any_ultimate = std::any_of(model.combinations.begin(), model.combinations.end(),
                                        [](const analysis::Combination& c) { return !c.serviceability; });
  if (!project.sway_imperfection.enabled || !any_ultimate)
    return {analysis::solve_beside_buckling(model, options), {}};

  Variants variants;
  if (!project.sway_amplification) {
    // The forces follow from the first-order results inside the one solve.
    analysis::SolveOptions with = options;
    const std::vector<double> none(model.combinations.size(), 1.0);
    with.derive_loads = [&](const analysis::FrameModel& m, const std::vector<analysis::LoadResult>& first) {
      variants = sway_variants(project, m, first, none);
      return variants.loads;
    };
    SwaySolution solution{analysis::solve_beside_buckling(model, with), {}};
    append(model, variants.loads);
    expand_checks(project, variants.of);
    solution.records = std::move(variants.records);
    return solution;
  }

  // 5.2.2(5) needs alpha_cr of each combination before its variants exist: a first-order pass of its own.
  analysis::FrameModel first = model;
  first.settings.second_order = false;
  analysis::SolveOptions first_options;
  first_options.stations = 2;
  first_options.buckling_modes = 1;
  first_options.progress = [&](std::string_view, double f) {
    if (options.progress) options.progress("imperfections", f);
  };
  const auto first_results = analysis::solve(first, first_options);
  variants = sway_variants(project, model, first_results, sway_amplifications(model, first_results));
  append(model, variants.loads);
  expand_checks(project, variants.of);
  return {analysis::solve_beside_buckling(model, options), std::move(variants.records)};
}

}  // namespace stepframe::detail
