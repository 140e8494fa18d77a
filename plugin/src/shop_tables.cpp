// cutlist.csv and connections.csv: the shop's tables (tables.hpp).

#include "stepframe/tables.hpp"

#include "table_helpers.hpp"

#include <fmt/compile.h>
#include <fmt/format.h>

#include <algorithm>
#include <iterator>
#include <map>

namespace stepframe {
namespace {

using detail::csv_field;
using detail::member_length;
using detail::design_results;
using detail::csv_name;
using detail::end_force_envelope;
using detail::EndForceEnvelope;

std::string mark_of(const Analysis& a, std::size_t m) { return m < a.shop.marks.size() ? a.shop.marks[m] : ""; }
double camber_of(const Analysis& a, std::size_t m) { return m < a.shop.camber.size() ? a.shop.camber[m] : 0.0; }

}  // namespace

std::string cutlist_csv(const Analysis& a) {
  const auto& model = a.built.model;
  struct Row {
    std::string section, material;
    double length = 0, kg_per_m = 0, camber = 0;
    std::vector<std::size_t> members;
  };
  std::map<std::string, Row> rows;  // by mark
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    const auto& first = model.elements[model.members[m].elements.front()];
    const auto& section = model.sections[first.section];
    Row& r = rows[mark_of(a, m)];
    r.section = section.designation;
    r.material = model.materials[first.material].name;
    r.kg_per_m = section.A * model.materials[first.material].density;  // kg/m = A [m^2] x density [kg/m^3]
    r.length = std::max(r.length, member_length(model, m));
    r.camber = camber_of(a, m);
    r.members.push_back(m);
  }
  std::vector<std::pair<std::string, const Row*>> order;
  for (const auto& [mark, row] : rows) order.emplace_back(mark, &row);
  std::sort(order.begin(), order.end(), [](const auto& x, const auto& y) {
    return std::tie(x.second->section, x.second->length, x.first) <
           std::tie(y.second->section, y.second->length, y.first);
  });
  std::string out = "mark,section,material,length_mm,count,kg_per_m,kg_each,kg_total,camber_mm,members\n";
  std::size_t pieces = 0;
  double total = 0;
  for (const auto& [mark, r] : order) {
    std::string members;
    for (std::size_t m : r->members) members += (members.empty() ? "" : " ") + std::to_string(m);
    const double each = r->kg_per_m * r->length;
    out += fmt::format("{},{},{},{:.0f},{},{:.2f},{:.1f},{:.1f},{:.0f},{}\n", csv_field(mark), csv_field(r->section),
                       csv_field(r->material), r->length * 1e3, r->members.size(), r->kg_per_m, each,
                       each * static_cast<double>(r->members.size()), r->camber * 1e3, members);
    pieces += r->members.size();
    total += each * static_cast<double>(r->members.size());
  }
  out += fmt::format("TOTAL,,,,{},,,{:.1f},,\n", pieces, total);
  return out;
}

std::string connections_csv(const Analysis& a) {
  const auto& model = a.built.model;
  const std::vector<const analysis::LoadResult*> pool = design_results(a.results);
  // Member ends by node, in node order.
  std::map<std::size_t, std::vector<std::pair<std::size_t, int>>> ends;
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    ends[model.elements[model.members[m].elements.front()].nodes[0]].emplace_back(m, 0);
    ends[model.elements[model.members[m].elements.back()].nodes[1]].emplace_back(m, 1);
  }
  std::string out = "node,x_mm,y_mm,z_mm,member_ends,member,entity,name,mark,section,end";
  for (const char* c : {"N_kN", "Vy_kN", "Vz_kN", "T_kNm", "My_kNm", "Mz_kNm"})
    out += fmt::format(",{0}_max,{0}_max_by,{0}_min,{0}_min_by", c);
  out += "\n";
  for (const auto& [node, list] : ends) {
    const auto& p = model.nodes[node];
    for (const auto& [m, end] : list) {
      const auto& src = a.built.member_sources[m];
      fmt::format_to(std::back_inserter(out), FMT_COMPILE("{},{:.1f},{:.1f},{:.1f},{},{},{},{},{},{},{}"), node,
                     p.x() * 1e3, p.y() * 1e3, p.z() * 1e3, list.size(), m, csv_field(src.entity), csv_field(src.name),
                     csv_field(mark_of(a, m)),
                     csv_field(model.sections[model.elements[model.members[m].elements.front()].section].designation),
                     end == 0 ? "start" : "end");
      for (int c = 0; c < 6; ++c) {
        const EndForceEnvelope e = end_force_envelope(pool, m, end, c);
        // Internal forces at the member end (results.hpp convention), kN and kN*m for people.
        fmt::format_to(std::back_inserter(out), FMT_COMPILE(",{:.3f},{},{:.3f},{}"), e.high / 1e3, csv_name(e.high_by),
                       e.low / 1e3, csv_name(e.low_by));
      }
      out += "\n";
    }
  }
  return out;
}

}  // namespace stepframe
