// The report's shop data: piece marks, counts and recommended precamber.

#include "report_parts.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <map>

namespace stepframe::report {

std::string shop_section(const Analysis& a) {
  if (a.shop.marks.size() != a.built.model.members.size()) return "";
  const auto& model = a.built.model;
  struct Mark {
    std::string section;
    std::size_t count = 0;
    double length = 0, camber = 0, deflection = 0;
  };
  std::map<std::string, Mark> marks;
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    auto& k = marks[a.shop.marks[m]];
    k.section = model.sections[model.elements[model.members[m].elements.front()].section].designation;
    ++k.count;
    k.length = std::max(k.length, member_length(model, model.members[m]));
    k.camber = a.shop.camber[m];
    k.deflection = std::max(k.deflection, a.shop.permanent_deflection[m]);
  }
  const auto& camber = a.project.fabrication.camber;
  std::string h = "<h2 id=\"shop\">Shop data</h2>\n<p>Identical members share a piece mark (cutlist.csv lists them with "
                  "their masses; connections.csv the forces at every member end).";
  if (camber)
    h += fmt::format(" Precamber is recommended where the deflection under {} exceeds {} mm, rounded down to {} mm "
                     "(common practice).",
                     esc(camber->load), num(camber->threshold * 1e3), num(camber->increment * 1e3));
  h += "</p>\n<table><tr><th>mark</th><th>section</th><th>count</th><th>length mm</th>";
  if (camber) h += "<th>deflection mm</th><th>precamber mm</th>";
  h += "</tr>\n";
  for (const auto& [mark, k] : marks) {
    h += fmt::format("<tr><td>{}</td><td>{}</td><td>{}</td><td>{:.0f}</td>", esc(mark), esc(k.section), k.count, k.length * 1e3);
    if (camber) h += fmt::format("<td>{:.1f}</td><td>{:.0f}</td>", k.deflection * 1e3, k.camber * 1e3);
    h += "</tr>\n";
  }
  return h + "</table>\n";
}

}  // namespace stepframe::report
