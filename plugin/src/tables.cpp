#include "stepframe/tables.hpp"

#include "table_helpers.hpp"

#include <fmt/compile.h>
#include <fmt/format.h>

#include <algorithm>
#include <array>
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

const analysis::FrameElement& first_element(const analysis::FrameModel& model, std::size_t member) {
  return model.elements[model.members[member].elements.front()];
}

}  // namespace

PeopleUnit people_unit(const std::string& si_unit) {
  if (si_unit == "Pa") return {"MPa", 1e-6};
  if (si_unit == "m") return {"mm", 1e3};
  if (si_unit == "N") return {"kN", 1e-3};
  if (si_unit == "N*m") return {"kN*m", 1e-3};
  if (si_unit == "kg") return {"kg", 1.0};
  return {"", 1.0};  // a ratio
}

PeopleUnit people_unit(const std::string& si_unit, const Project& project) {
  const bool kip = project.force_unit == "kip", lbf = project.force_unit == "lbf";
  if (!kip && !lbf) return people_unit(si_unit);
  // Exact factors: inch = 0.0254 m, lbf = 0.45359237 kg x 9.80665 m/s^2 (as units.cpp).
  const double inch = 0.0254, force = (kip ? 1e3 : 1.0) * 0.45359237 * 9.80665;
  const bool feet = project.length_unit == "ft" || project.length_unit == "foot";
  const std::string f = kip ? "kip" : "lbf";
  if (si_unit == "N") return {f, 1 / force};
  if (si_unit == "N*m") return {f + (feet ? "*ft" : "*in"), 1 / (force * (feet ? 12 * inch : inch))};
  if (si_unit == "Pa") return {kip ? "ksi" : "psi", inch * inch / force};
  if (si_unit == "m") return {"in", 1 / inch};
  return people_unit(si_unit);
}

std::string checks_csv(const Analysis& a) {
  const auto& model = a.built.model;
  const auto governing = governing_checks(a);

  std::string out = "member,entity,name,section,utilisation,value,limit,unit,check,clause,combination,station_m,pass\n";
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    const auto& src = a.built.member_sources[m];
    const auto& section = model.sections[first_element(model, m).section].designation;
    if (const auto* c = governing[m]) {
      const auto unit = people_unit(c->unit, a.project);
      fmt::format_to(std::back_inserter(out), FMT_COMPILE("{},{},{},{},{:.4f},{:.6g},{:.6g},{},{},{},{},{:.4f},{}\n"),
                     m, csv_field(src.entity), csv_field(src.name), csv_field(section), c->utilisation,
                     c->value * unit.factor, c->limit * unit.factor, unit.name, c->check, csv_field(c->clause),
                     csv_field(c->combination), c->station, c->pass ? "pass" : "FAIL");
    } else {
      fmt::format_to(std::back_inserter(out), FMT_COMPILE("{},{},{},{},,,,,,,,,not checked\n"), m,
                     csv_field(src.entity), csv_field(src.name), csv_field(section));
    }
  }
  return out;
}

std::string takeoff_csv(const Analysis& a) {
  const auto& model = a.built.model;
  std::string out = "member,entity,name,section,material,centreline_length_mm,kg_per_m,mass_kg\n";
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    const auto& element = first_element(model, m);
    const auto& section = model.sections[element.section];
    const auto& material = model.materials[element.material];
    const double length = member_length(model, m);
    const double per_metre = section.A * material.density;  // kg/m = A [m^2] x density [kg/m^3]
    const auto& src = a.built.member_sources[m];
    fmt::format_to(std::back_inserter(out), FMT_COMPILE("{},{},{},{},{},{:.1f},{:.2f},{:.2f}\n"), m,
                   csv_field(src.entity), csv_field(src.name), csv_field(section.designation), csv_field(material.name),
                   length * 1e3, per_metre, per_metre * length);
  }
  return out;
}

std::string takeoff_by_section_csv(const Analysis& a) {
  const auto& model = a.built.model;
  struct Total {
    std::size_t count = 0;
    double length = 0, mass = 0;
  };
  std::map<std::string, Total> per_section;
  Total overall;
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    const auto& element = first_element(model, m);
    const auto& section = model.sections[element.section];
    const double length = member_length(model, m);
    const double mass = section.A * model.materials[element.material].density * length;  // kg = A rho L
    auto& t = per_section[section.designation];
    ++t.count, t.length += length, t.mass += mass;
    ++overall.count, overall.length += length, overall.mass += mass;
  }
  std::string out = "section,members,centreline_length_m,mass_kg\n";
  for (const auto& [designation, t] : per_section)
    out += fmt::format("{},{},{:.3f},{:.2f}\n", csv_field(designation), t.count, t.length, t.mass);
  out += fmt::format("TOTAL,{},{:.3f},{:.2f}\n", overall.count, overall.length, overall.mass);
  return out;
}

std::string reactions_csv(const Analysis& a) {
  const auto& model = a.built.model;
  std::vector<bool> supported(model.nodes.size(), false);
  for (const auto& s : model.supports) supported[s.node] = true;
  std::string out = "node,x_mm,y_mm,z_mm,result,kind,Fx_kN,Fy_kN,Fz_kN,Mx_kNm,My_kNm,Mz_kNm\n";
  for (std::size_t n = 0; n < model.nodes.size(); ++n) {
    if (!supported[n]) continue;
    const auto& p = model.nodes[n];
    for (const auto& r : a.results) {
      const auto f = r.reactions.segment<6>(static_cast<Eigen::Index>(6 * n));
      // Forces of the supports on the frame, global axes; kN and kN*m for people.
      fmt::format_to(std::back_inserter(out),
                     FMT_COMPILE("{},{:.1f},{:.1f},{:.1f},{},{},{:.3f},{:.3f},{:.3f},{:.3f},{:.3f},{:.3f}\n"), n,
                     p.x() * 1e3, p.y() * 1e3, p.z() * 1e3, csv_field(r.name),
                     r.is_combination ? "combination" : "case", f(0) / 1e3, f(1) / 1e3, f(2) / 1e3, f(3) / 1e3,
                     f(4) / 1e3, f(5) / 1e3);
    }
  }
  return out;
}

std::string end_forces_csv(const Analysis& a) {
  const auto& model = a.built.model;
  const std::vector<const analysis::LoadResult*> pool = design_results(a.results);

  constexpr std::array<const char*, 6> names{"N_kN", "Vy_kN", "Vz_kN", "T_kNm", "My_kNm", "Mz_kNm"};
  std::string out = "member,entity,end,component,max,max_combination,min,min_combination\n";
  for (std::size_t m = 0; m < model.members.size(); ++m)
    for (int end = 0; end < 2; ++end)
      for (int c = 0; c < 6; ++c) {
        const EndForceEnvelope e = end_force_envelope(pool, m, end, c);
        // kN and kN*m for people: internal forces are N and N*m inside.
        fmt::format_to(std::back_inserter(out), FMT_COMPILE("{},{},{},{},{:.3f},{},{:.3f},{}\n"), m,
                       csv_field(a.built.member_sources[m].entity), end == 0 ? "start" : "end", names[c], e.high / 1e3,
                       csv_name(e.high_by), e.low / 1e3, csv_name(e.low_by));
      }
  return out;
}

}  // namespace stepframe
