// The report's natural-frequency section: every mode with its frequency,
// period and participating mass ratios per direction, and the mass behind them.

#include "report_parts.hpp"

#include <fmt/format.h>

#include <array>

namespace stepframe::report {

std::string modes_section(const Analysis& a) {
  if (!a.modes) return {};
  const auto& m = *a.modes;
  std::string h = "<h2 id=\"modes\">Natural frequencies</h2>\n";
  h += fmt::format("<p>Consistent mass of the members ({} parts per element){}{}: {} kg in all, {} kg of it added; "
                   "moving mass (not on supports) X {} kg, Y {} kg, Z {} kg. Mode shapes: vtk/natural_mode*.vtu.</p>\n",
                   m.parts,
                   a.project.modes.mass_from ? ", gravity loads of " + esc(*a.project.modes.mass_from) + " / g" : "",
                   a.project.masses.empty() ? "" : ", point masses", num(m.total_mass), num(a.added_mass),
                   num(m.moving_mass[0]), num(m.moving_mass[1]), num(m.moving_mass[2]));
  h += "<table id=\"modes-table\"><tr><th>mode</th><th>f Hz</th><th>T s</th><th>mass X %</th><th>mass Y %</th>"
       "<th>mass Z %</th><th>sum X %</th><th>sum Y %</th><th>sum Z %</th></tr>\n";
  std::array<double, 3> sum{};
  for (std::size_t i = 0; i < m.modes.size(); ++i) {
    const auto& mode = m.modes[i];
    h += fmt::format("<tr><td>{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td>", i + 1, num(mode.frequency),
                     num(1.0 / mode.frequency));
    for (std::size_t d = 0; d < 3; ++d) h += "<td class=\"num\">" + num(100 * mode.mass_ratio[d], 3) + "</td>";
    for (std::size_t d = 0; d < 3; ++d) {
      sum[d] += mode.mass_ratio[d];
      h += "<td class=\"num\">" + num(100 * sum[d], 3) + "</td>";
    }
    h += "</tr>\n";
  }
  return h + "</table>\n";
}

}  // namespace stepframe::report
