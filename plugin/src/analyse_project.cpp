#include "stepframe/analysis/solve.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/project_reader.hpp"
#include "stepframe/run.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>

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

}  // namespace

ExitStatus Analysis::status() const {
  const bool all_pass = std::all_of(checks.begin(), checks.end(), [](const auto& c) { return c.pass; });
  return all_pass ? ExitStatus::pass : ExitStatus::check_failed;
}

Analysis analyse_project(const std::filesystem::path& project_file, const ProgressCallback& progress) {
  auto report = [&](std::string_view stage, double fraction) {
    if (progress) progress(stage, fraction);
  };
  Analysis a;
  report("project", 0);
  a.project = read_project(project_file);
  spdlog::info("project {}: model {}", project_file.string(), a.project.model.string());

  report("geometry", 0);
  const auto step = geometry::read_step(a.project.model);
  a.file_length_unit = step.length_unit;
  a.wireframe = geometry::build_wireframe(step, a.project.merge_tolerance);
  spdlog::info("{}: {} members, {} nodes (file unit {})", a.project.model.string(), a.wireframe.members.size(),
               a.wireframe.nodes.size(), step.length_unit);
  for (const auto& d : a.wireframe.diagnostics)
    spdlog::log(d.severity == geometry::Severity::error     ? spdlog::level::err
                : d.severity == geometry::Severity::warning ? spdlog::level::warn
                                                            : spdlog::level::info,
                "{}: {}", a.project.model.string(), d.message);
  if (geometry::has_errors(a.wireframe.diagnostics))
    throw InputError(a.project.model.string() + ": the model has errors (listed above); fix them in the CAD model");
  report("geometry", 1);

  report("model", 0);
  a.built = build_frame_model(a.project, a.wireframe);

  analysis::SolveOptions options;
  options.progress = [&](double f) { report("solve", f); };
  a.results = analysis::solve(a.built.model, options);

  report("checks", 0);
  const auto& spec = a.project.checks;
  if (spec.stress) {
    auto r = analysis::check_stress(a.built.model, pick(a.results, spec.stress->combinations));
    a.checks.insert(a.checks.end(), r.begin(), r.end());
  }
  if (spec.deflection) {
    auto r = analysis::check_deflection(a.built.model, pick(a.results, spec.deflection->combinations),
                                        spec.deflection->span_ratio);
    a.checks.insert(a.checks.end(), r.begin(), r.end());
  }
  report("checks", 1);
  return a;
}

}  // namespace stepframe
