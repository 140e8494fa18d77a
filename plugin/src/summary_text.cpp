#include "stepframe/run.hpp"

#include <fmt/format.h>

#include <algorithm>

namespace stepframe {

// Report edge: SI inside, MPa and mm for people.
std::string summary_text(const Analysis& a) {
  const auto& model = a.built.model;
  std::string out;
  const bool pass = a.status() == ExitStatus::pass;
  out += fmt::format("stepframe: {}  ({} members, {} nodes, {} load cases, {} combinations)\n",
                     pass ? "PASS" : "FAIL", model.members.size(), model.nodes.size(), model.cases.size(),
                     model.combinations.size());

  out += fmt::format("\n{:<16} {:<12} {:>16} {:>20} {:>18}\n", "result", "kind", "max |stress| MPa",
                     "max local defl. mm", "max |u| node mm");
  for (const auto& r : a.results) {
    double stress = 0, deflection = 0, u = 0;
    for (const auto& m : r.members) stress = std::max(stress, m.max_abs_stress), deflection = std::max(deflection, m.max_local_deflection);
    for (std::size_t n = 0; n < model.nodes.size(); ++n)
      u = std::max(u, r.displacements.segment<3>(static_cast<Eigen::Index>(6 * n)).norm());
    out += fmt::format("{:<16} {:<12} {:>16.1f} {:>20.2f} {:>18.2f}\n", r.name, r.is_combination ? "combination" : "case",
                       stress / 1e6, deflection * 1e3, u * 1e3);
  }

  if (!a.checks.empty()) {
    const auto governing = std::max_element(a.checks.begin(), a.checks.end(),
                                            [](const auto& x, const auto& y) { return x.utilisation < y.utilisation; });
    const auto failed = std::count_if(a.checks.begin(), a.checks.end(), [](const auto& c) { return !c.pass; });
    const auto& src = a.built.member_sources[governing->member];
    out += fmt::format("\nchecks: {} of {} pass\n", a.checks.size() - static_cast<std::size_t>(failed), a.checks.size());
    out += fmt::format("governing: member {} ({}{}, {}) {} utilisation {:.2f} under {} at x = {:.3f} m\n",
                       governing->member, src.entity, src.name.empty() ? "" : " '" + src.name + "'",
                       model.sections[model.elements[model.members[governing->member].elements.front()].section].designation, governing->check,
                       governing->utilisation, governing->combination, governing->station);
  } else {
    out += "\nchecks: none requested\n";
  }
  const auto warnings = std::count_if(a.wireframe.diagnostics.begin(), a.wireframe.diagnostics.end(),
                                      [](const auto& d) { return d.severity == geometry::Severity::warning; });
  if (warnings > 0) out += fmt::format("model warnings: {} (see results.json \"diagnostics\")\n", warnings);
  out += fmt::format("\n{}\n", caution);
  return out;
}

}  // namespace stepframe
