#include "finite_results.hpp"
#include "stepframe/analysis/blas_info.hpp"
#include "stepframe/analysis/solve.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/project_reader.hpp"
#include "stepframe/run.hpp"
#include "stepframe/viz/picture.hpp"

#include "modal_run.hpp"
#include "sway_variants.hpp"
#include "usable_cores.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <iterator>
#include <map>

namespace stepframe {
namespace {

// The results a check names, in model order (cases first, then combinations).
std::vector<const analysis::LoadResult*> pick(const std::vector<analysis::LoadResult>& results,
                                              const std::vector<std::string>& names) {
  std::vector<const analysis::LoadResult*> out;
  for (const auto& r : results)
    if (std::find(names.begin(), names.end(), r.name) != names.end()) out.push_back(&r);
  return out;
}

// Logs the model's diagnostics: errors all, other kinds the first few of each
// code and then how many more (a large model can have thousands of notes;
// results.json and the report list them all).
void log_diagnostics(const std::filesystem::path& model, const std::vector<geometry::Diagnostic>& diagnostics) {
  constexpr std::size_t shown_per_code = 5;
  std::map<std::string, std::size_t> seen;
  for (const auto& d : diagnostics) {
    const auto level = d.severity == geometry::Severity::error     ? spdlog::level::err
                       : d.severity == geometry::Severity::warning ? spdlog::level::warn
                                                                   : spdlog::level::info;
    const std::size_t n = ++seen[d.code];
    if (d.severity == geometry::Severity::error || n <= shown_per_code) spdlog::log(level, "{}: {}", model.string(), d.message);
    else spdlog::debug("{}: {}", model.string(), d.message);
  }
  for (const auto& [code, n] : seen)
    if (n > shown_per_code)
      spdlog::info("{}: {} more '{}' diagnostics (all are listed in results.json and the report)", model.string(),
                   n - shown_per_code, code);
}

}  // namespace

ExitStatus Analysis::status() const {
  // A utilisation that is not a number never passes (analyse_model refuses such results anyway).
  const bool all_pass =
      std::all_of(checks.begin(), checks.end(), [](const auto& c) { return c.pass && std::isfinite(c.utilisation); });
  return all_pass ? ExitStatus::pass : ExitStatus::check_failed;
}

Analysis analyse_project(const std::filesystem::path& project_file, const RunControl& control) {
  control.report("project", 0);
  auto project = read_project(project_file);
  spdlog::info("project {}: model {}", project_file.string(), project.model.string());
  control.report("geometry", 0);
  geometry::StepModel step = geometry::read_step(project.model, control.step_read_options());
  // The report's pictures need an offscreen OpenGL context, whose first preparation takes about a third
  // of a second: it is prepared on the core the factorisation leaves idle (its BLAS gains nothing from a
  // second thread at 10,000 members), not during the read, which uses both cores for a large file (and
  // forks: no other thread of the run is then at work).
  auto pictures = project.outputs.pictures ? std::make_shared<viz::PictureRenderer>() : nullptr;
  Analysis a = analyse_model(std::move(project), std::move(step), control);
  a.pictures = std::move(pictures);
  return a;
}

namespace {

// The first part of analyse_model: the wireframe of the file's edges.
Analysis with_wireframe(Project project, const geometry::StepModel& step, const RunControl& control) {
  Analysis a;
  a.project = std::move(project);
  a.file_length_unit = step.length_unit;
  control.report("wireframe", 0);
  a.wireframe = geometry::build_wireframe(step, wireframe_options(a.project));
  spdlog::info("{}: {} members, {} nodes (file unit {})", a.project.model.string(), a.wireframe.members.size(),
               a.wireframe.nodes.size(), step.length_unit);
  log_diagnostics(a.project.model, a.wireframe.diagnostics);
  if (geometry::has_errors(a.wireframe.diagnostics))
    throw InputError(a.project.model.string() + ": the model has errors (listed above); fix them in the CAD model");
  control.report("wireframe", 1);
  return a;
}

// The rest: the frame model, its solution and the checks.
Analysis analyse_wireframe(Analysis a, const RunControl& control) {
  auto report = [&](std::string_view stage, double fraction) { control.report(stage, fraction); };
  report("model", 0);
  a.built = build_frame_model(a.project, a.wireframe);
  log_diagnostics(a.project.model, a.built.diagnostics);
  a.wireframe.diagnostics.insert(a.wireframe.diagnostics.end(), a.built.diagnostics.begin(), a.built.diagnostics.end());
  if (analysis::optimised_blas()) spdlog::info("linear algebra: CHOLMOD on {}", analysis::blas_description());
  else spdlog::warn("linear algebra: CHOLMOD on {}", analysis::blas_description());
  if (const std::string advice = analysis::blas_kernel_advice(); !advice.empty())
    spdlog::info("linear algebra: {}", advice);

  analysis::SolveOptions options;
  options.progress = [&](std::string_view stage, double f) { report(stage, f); };
  options.buckling_modes = a.project.buckling_modes;
  // Nothing else of the run computes during the factorisation; the machine's other work may.
  if (control.idle_cores_for_factorisation) options.factorisation_threads = detail::usable_cores_now();
  auto solved = detail::solve_with_sway_imperfections(a.project, a.built.model, options);
  a.results = std::move(solved.solution.results);
  a.sway_imperfections = std::move(solved.records);
  // The buckling analysis goes on beside the checks that do not need it; the first check that does (and,
  // for a large factor, the checks as a whole) waits for it here.
  auto attach_buckling = [&] {
    if (!solved.solution.buckling.pending()) return;
    report("buckling", 0);
    solved.solution.buckling.attach(a.results, [&](double f) { report("buckling", f); });
    detail::require_finite_buckling(a.results, a.project.model.string());
  };
  // The load cases the sway variants add (imperfection forces, horizontal parts to amplify) are only parts
  // of those variants (listed in a.sway_imperfections): not results of their own.
  std::erase_if(a.results, [&](const analysis::LoadResult& r) {
    return !r.is_combination && std::none_of(a.project.cases.begin(), a.project.cases.end(),
                                             [&](const CaseSpec& c) { return c.name == r.name; });
  });
  detail::require_finite_results(a.results, a.project.model.string());

  std::vector<analysis::CheckResult> frequency_checks;
  if (a.project.modes.count > 0) {
    report("natural frequencies", 0);
    frequency_checks = detail::run_natural_frequencies(a, [&](double f) { report("natural frequencies", f); });
  }

  a.shop = shop_data(a.project, a.built, a.results);
  // The checks' results take memory of their own as they go, so beside a large factor they raise the
  // peak (the 100k bench frame: 4.3 GB against 3.8 GB): above control.checks_beside_buckling_bytes the
  // checks wait for the buckling analysis, which frees the factor when it ends; the caller may use the
  // core that waits (results_solved).
  if (solved.solution.buckling.pending() &&
      solved.solution.buckling.held_bytes() > control.checks_beside_buckling_bytes) {
    if (control.results_solved) control.results_solved(a);
    attach_buckling();
  }
  report("checks", 0);
  const auto& spec = a.project.checks;
  const auto& model = a.built.model;
  // Moved, not copied: at 100,000 members the checks are some 700,000 results with their words and details.
  auto add = [&](std::vector<analysis::CheckResult> r) {
    a.checks.insert(a.checks.end(), std::make_move_iterator(r.begin()), std::make_move_iterator(r.end()));
  };
  if (spec.stress) add(analysis::check_stress(model, pick(a.results, spec.stress->combinations), spec.gamma_M0));
  if (spec.deflection) {
    // A rule's deflection_ratio sets the limit of its members; the check's span_ratio the rest.
    std::vector<double> ratios;
    for (const auto& r : a.built.deflection_ratio) ratios.push_back(r.value_or(spec.deflection->span_ratio));
    add(analysis::check_deflection(model, pick(a.results, spec.deflection->combinations), ratios));
  }
  if (spec.drift) add(analysis::check_drift(model, pick(a.results, spec.drift->combinations), spec.drift->storey_ratio));
  if (spec.en1993)
    add(analysis::en1993::check_members(model, pick(a.results, spec.en1993->combinations), a.built.buckling,
                                        {spec.gamma_M0, spec.gamma_M1}, spec.en1993->ltb));
  if (spec.aisc360) {
    attach_buckling();  // B2 of Appendix 8 from the modes
    const auto results = pick(a.results, spec.aisc360->combinations);
    add(analysis::aisc360::check_members(model, results, a.built.buckling, spec.aisc360->method));
    add(analysis::aisc360::check_effective_length_method(model, results, spec.aisc360->method));
  }
  attach_buckling();
  if (spec.stability)
    add(analysis::check_frame_stability(pick(a.results, spec.stability->combinations), spec.stability->alpha_cr_min));
  add(std::move(frequency_checks));
  add(fabrication_checks(a.project, a.built));
  detail::require_finite_checks(a.checks, a.project.model.string());
  report("checks", 1);
  return a;
}

}  // namespace

Analysis analyse_model(Project project, const geometry::StepModel& step, const RunControl& control) {
  return analyse_wireframe(with_wireframe(std::move(project), step, control), control);
}

Analysis analyse_model(Project project, geometry::StepModel&& step, const RunControl& control) {
  Analysis a = with_wireframe(std::move(project), step, control);
  step = geometry::StepModel();  // the wireframe holds what the analysis needs of it (some 60 MB at 100k members)
  return analyse_wireframe(std::move(a), control);
}

}  // namespace stepframe
