#include "stepframe/counted.hpp"
#include "stepframe/run.hpp"
#include "stepframe/tables.hpp"

#include <fmt/format.h>

#include <algorithm>

namespace stepframe {

// What the sway variants' forces are: a US project (AISC 360 checks only) that sets phi uses them as
// the notional loads of AISC 360 C2.2b; otherwise they are EN 1993-1-1's sway imperfections.
std::string sway_words(const Project& project) {
  const bool us = project.checks.aisc360 && !project.checks.en1993 && project.sway_imperfection.phi;
  return us ? fmt::format("notional loads {:g} Yi, AISC 360 C2.2b", *project.sway_imperfection.phi)
            : "sway imperfections, EN 1993-1-1 5.3.2";
}

// Report edge: SI inside, the project's units for people (MPa and mm, or ksi and in).
std::string summary_text(const Analysis& a) {
  const auto& model = a.built.model;
  std::string out;
  const bool pass = a.status() == ExitStatus::pass;
  std::size_t variants = 0;
  for (const auto& s : a.sway_imperfections) variants += s.variants.size();
  out += fmt::format("stepframe: {}  ({}, {}, {}, {}{})\n", pass ? "PASS" : "FAIL", counted(model.members.size(), "member"),
                     counted(model.nodes.size(), "node"), counted(a.project.cases.size(), "load case"),
                     counted(a.project.combinations.size(), "combination"),
                     variants ? fmt::format(" + {} with {}", variants, sway_words(a.project)) : "");

  const PeopleUnit stress_unit = people_unit("Pa", a.project), length_unit = people_unit("m", a.project);
  out += fmt::format("\n{:<16} {:<12} {:>14} {:>14} {:>14} {:>9}\n", "case or comb.", "kind",
                     "von Mises " + stress_unit.name, "local defl. " + length_unit.name,
                     "node |u| " + length_unit.name, "alpha_cr");
  for (const auto& r : a.results) {
    double stress = 0, deflection = 0, u = 0;
    for (const auto& m : r.members)
      stress = std::max(stress, m.max_von_mises), deflection = std::max(deflection, m.max_local_deflection);
    for (std::size_t n = 0; n < model.nodes.size(); ++n)
      u = std::max(u, r.displacements.segment<3>(static_cast<Eigen::Index>(6 * n)).norm());
    out += fmt::format("{:<16} {:<12} {:>14.1f} {:>14.2f} {:>14.2f} {:>9}\n", r.name,
                       r.is_combination ? (r.second_order ? "comb. (P-D)" : "combination") : "case", stress * stress_unit.factor,
                       deflection * length_unit.factor, u * length_unit.factor, r.alpha_cr ? fmt::format("{:.2f}", *r.alpha_cr) : "-");
  }

  if (!a.checks.empty()) {
    // Every failing check, frame-level ones first, then the highest passing ones.
    std::vector<const analysis::CheckResult*> failing, passing;
    for (const auto& c : a.checks) (c.pass ? passing : failing).push_back(&c);
    const auto by_utilisation = [](auto* x, auto* y) { return x->utilisation > y->utilisation; };
    std::stable_sort(failing.begin(), failing.end(), [&](auto* x, auto* y) {
      const bool fx = x->member == analysis::whole_frame, fy = y->member == analysis::whole_frame;
      return fx != fy ? fx : by_utilisation(x, y);
    });
    std::stable_sort(passing.begin(), passing.end(), by_utilisation);
    constexpr std::size_t passing_shown = 5;
    const std::size_t shown = std::min(passing.size(), passing_shown);

    out += fmt::format("\nchecks: {} of {} pass{}\n", passing.size(), a.checks.size(),
                       failing.empty() ? std::string() : fmt::format(", {} {}", failing.size(), failing.size() == 1 ? "fails" : "fail"));
    out += fmt::format("{:>6}  {:<28} {:<10} {:<34} {:<12} {:>8}\n", "member", "source", "section", "check",
                       "combination", "util.");
    const auto row = [&](const analysis::CheckResult& c) {
      std::string member = "frame", source, section;
      if (c.member != analysis::whole_frame) {
        const auto& src = a.built.member_sources[c.member];
        member = std::to_string(c.member);
        source = src.entity + (src.name.empty() ? "" : " '" + src.name + "'");
        section = model.sections[model.elements[model.members[c.member].elements.front()].section].designation;
      }
      out += fmt::format("{:>6}  {:<28} {:<10} {:<34} {:<12} {:>8.2f}{}\n", member, source.substr(0, 28), section,
                         c.check, c.combination, c.utilisation, c.pass ? "" : "  FAIL");
    };
    for (const auto* c : failing) row(*c);
    if (!failing.empty() && shown > 0) out += fmt::format("  highest passing:\n");
    for (std::size_t i = 0; i < shown; ++i) row(*passing[i]);
    if (passing.size() > shown)
      out += fmt::format("  ... and {}: checks.csv (each member's governing check), results.json \"checks\" (every "
                         "check)\n",
                         counted(passing.size() - shown, "more passing check"));
    const auto& top = *std::max_element(a.checks.begin(), a.checks.end(),
                                        [](const auto& x, const auto& y) { return x.utilisation < y.utilisation; });
    out += fmt::format("governing: {}: {}, utilisation {:.2f} under {}\n",
                       top.member == analysis::whole_frame ? std::string("the frame") : "member " + std::to_string(top.member),
                       top.check, top.utilisation, top.combination);
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
