// The report's area-load section: for every case, the panels each area load
// found and the member loads it made of them, so a reviewer sees where the load went.

#include "report_parts.hpp"

#include <fmt/format.h>

namespace stepframe::report {

std::string area_loads_section(const Analysis& a) {
  const auto& model = a.built.model;
  bool any = false;
  for (const auto& per_case : a.built.area_loads) any = any || !per_case.empty();
  if (!any) return {};
  const std::vector<std::size_t> member_of = analysis::element_members(model);
  std::string h = "<h2 id=\"area-loads\">Area loads</h2>\n<p>Each area load's panels and the member loads made of "
                  "them (global axes, kN/m along the member, positions from the member's element start).</p>\n";
  for (std::size_t c = 0; c < a.built.area_loads.size(); ++c)
    for (std::size_t i = 0; i < a.built.area_loads[c].size(); ++i) {
      const auto& area = a.built.area_loads[c][i];
      h += fmt::format("<h3>{}, area load {}: {} panels, {} m², {} kN</h3>\n<table class=\"area-load\"><tr><th>panel</th>"
                       "<th>method</th><th>member</th><th>from m</th><th>to m</th><th>w start kN/m</th><th>w end kN/m</th></tr>\n",
                       esc(a.project.cases[c].name), i + 1, area.panels.size(), num(area.area), num(area.total_force / 1e3));
      for (const auto& l : area.loads)
        h += fmt::format("<tr><td>{}</td><td>{}</td><td>{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td>"
                         "<td class=\"num\">{}</td><td class=\"num\">{}</td></tr>\n",
                         l.panel + 1, esc(area.panels[l.panel].method), esc(member_label(a, member_of[l.load.element])),
                         num(l.load.a, 3), num(l.load.b, 3), num(l.load.w_start.norm() / 1e3), num(l.load.w_end.norm() / 1e3));
      h += "</table>\n";
    }
  return h;
}

}  // namespace stepframe::report
