// Calculation sheets in report.html: for the governing members (and those the
// project asks for), every check with its clause, the result and place it
// governs at, value, limit and utilisation, and the chain of intermediate
// values the verdict stands on (CheckResult::details, as in results.json).

#include "report_parts.hpp"

#include <fmt/format.h>

#include <algorithm>

namespace stepframe::report {

std::string sheets_section(const Analysis& a) {
  const auto members = sheet_members(a);
  if (members.empty()) return {};
  const auto& model = a.built.model;
  std::vector<std::vector<const analysis::CheckResult*>> by_member(model.members.size());
  for (const auto& c : a.checks)
    if (c.member < by_member.size()) by_member[c.member].push_back(&c);

  std::string h = "<h2 id=\"sheets\">Calculation sheets</h2>\n<p>Failing members first, then the most utilised "
                  "ones and those <code>outputs.calculation_sheets</code> names. Intermediate values are in SI "
                  "units (N, m, Pa, N·m; ratios bare), as results.json carries them.</p>\n";
  for (std::size_t m : members) {
    auto checks = by_member[m];
    std::stable_sort(checks.begin(), checks.end(), [](const auto* x, const auto* y) { return x->utilisation > y->utilisation; });
    const auto& el = model.elements[model.members[m].elements.front()];
    const double length = member_length(model, model.members[m]);
    const auto& src = a.built.member_sources[m];
    h += fmt::format("<section class=\"sheet\" id=\"{}\"><h3>Member {}: {}</h3>\n<p>entity {}, section {}, material {}, "
                     "length {} m</p>\n",
                     sheet_anchor(m), m, esc(member_label(a, m)), esc(src.entity.empty() ? "-" : src.entity),
                     esc(model.sections[el.section].designation), esc(model.materials[el.material].name), num(length));
    for (const auto* c : checks) {
      h += fmt::format("<div class=\"check{}\"><h4>{} — utilisation {} ({})</h4>\n<p>{}<br>under {} at x = {} m: "
                       "{} against {}</p>\n",
                       c->pass ? "" : " failed", esc(c->check), num(c->utilisation, 3), c->pass ? "passes" : "FAILS",
                       esc(c->clause), esc(c->combination), num(c->station, 3), with_unit(c->value, c->unit, a.project),
                       with_unit(c->limit, c->unit, a.project));
      if (!c->details.empty()) {
        h += "<table class=\"details\"><tr><th>step</th><th>value</th></tr>";
        for (const auto& [name, value] : c->details)
          h += fmt::format("<tr><td>{}</td><td class=\"num\">{}</td></tr>", esc(name), num(value, 4));
        h += "</table>\n";
      }
      h += "</div>\n";
    }
    if (checks.empty()) h += "<p>No check applies to this member.</p>\n";
    h += "</section>\n";
  }
  return h;
}

}  // namespace stepframe::report
