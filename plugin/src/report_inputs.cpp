// The inputs part of report.html: what the run read and used, so that a
// reviewer can tell exactly which files and assumptions a verdict stands on:
// program version and date, input files (relative to the project's folder)
// with their SHA-256, the supports found, every load with its magnitude and
// selector, the section properties used, and the rules by their selectors.

#include "file_digest.hpp"
#include "report_parts.hpp"

#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/api.hpp"

#include <fmt/format.h>

#include <chrono>
#include <cstdlib>
#include <fstream>
#include <map>
#include <numbers>

namespace stepframe::report {
namespace {

/// The run's date, UTC; SOURCE_DATE_EPOCH (reproducible-builds.org) when set, so re-runs can be byte-identical.
std::string run_date() {
  std::time_t t = std::time(nullptr);
  if (const char* epoch = std::getenv("SOURCE_DATE_EPOCH")) t = static_cast<std::time_t>(std::strtoll(epoch, nullptr, 10));
  std::tm utc{};
  gmtime_r(&t, &utc);
  return fmt::format("{:04}-{:02}-{:02}", utc.tm_year + 1900, utc.tm_mon + 1, utc.tm_mday);
}

std::string mm(double metres) { return num(metres * 1e3, 6); }

std::string describe(const MemberSelector& s) {
  std::vector<std::string> parts;
  if (s.name) parts.push_back("name ~ " + *s.name);
  if (s.layer) parts.push_back("layer ~ " + *s.layer);
  if (s.product) parts.push_back("product ~ " + *s.product);
  if (s.colour) parts.push_back("colour ~ " + *s.colour);
  return parts.empty() ? "every member" : fmt::format("{}", fmt::join(parts, ", "));
}

std::string describe(const NodeSelector& s) {
  std::vector<std::string> parts;
  if (s.x) parts.push_back("x = " + mm(*s.x) + " mm");
  if (s.y) parts.push_back("y = " + mm(*s.y) + " mm");
  if (s.z) parts.push_back("z = " + mm(*s.z) + " mm");
  if (s.near) parts.push_back(fmt::format("nearest to ({}, {}, {}) mm", mm(s.near->x()), mm(s.near->y()), mm(s.near->z())));
  if (s.point_name) parts.push_back("point name ~ " + *s.point_name);
  if (s.point_layer) parts.push_back("point layer ~ " + *s.point_layer);
  return parts.empty() ? "every node" : fmt::format("{}", fmt::join(parts, ", "));
}

std::string vector_text(const Eigen::Vector3d& v, double scale) {
  return fmt::format("({}, {}, {})", num(v.x() * scale), num(v.y() * scale), num(v.z() * scale));
}

std::string fixity(const std::array<bool, 6>& fixed, const std::array<double, 6>& spring) {
  static constexpr const char* names[6] = {"ux", "uy", "uz", "rx", "ry", "rz"};
  std::vector<std::string> parts;
  for (int d = 0; d < 6; ++d) {
    if (fixed[static_cast<std::size_t>(d)]) parts.push_back(names[d]);
    else if (spring[static_cast<std::size_t>(d)] > 0)
      parts.push_back(fmt::format("{} spring {}", names[d],
                                  d < 3 ? num(spring[static_cast<std::size_t>(d)] / 1e3) + " kN/m"
                                        : num(spring[static_cast<std::size_t>(d)] / 1e3) + " kN·m/rad"));
  }
  return parts.empty() ? "free" : fmt::format("{}", fmt::join(parts, " "));
}

std::string relative_to(const std::filesystem::path& file, const std::filesystem::path& base) {
  std::error_code ec;
  const auto rel = std::filesystem::relative(file, base, ec);
  return ec || rel.empty() ? file.filename().string() : rel.generic_string();
}

/// "platform.yaml:12 (rules[0])": the project file by its name only (no absolute paths in a report).
std::string written_at(const SourceLine& origin) {
  SourceLine shown = origin;
  shown.file = origin.file.filename();
  return shown.describe();
}

std::string loads_text(const CaseSpec& c) {
  static constexpr const char* axes[] = {"global", "local", "projected"};
  std::string h = "<ul>";
  if (c.self_weight) h += "<li>self weight (g = 9.80665 m/s², density of each member's material)</li>";
  for (const auto& l : c.member_loads) {
    std::string what;
    if (l.at) what = fmt::format("point force {} kN at {} m", vector_text(l.w, 1e-3), num(*l.at));
    else if (l.w_end)
      what = fmt::format("line load {} to {} kN/m", vector_text(l.w, 1e-3), vector_text(*l.w_end, 1e-3));
    else what = fmt::format("line load {} kN/m", vector_text(l.w, 1e-3));
    if (!l.at && (l.from || l.to))
      what += fmt::format(" from {} m to {}", num(l.from.value_or(0.0)), l.to ? num(*l.to) + " m" : "the end");
    h += fmt::format("<li>{} ({} axes) on {}</li>", what, axes[static_cast<int>(l.axes)], esc(describe(l.where)));
  }
  for (const auto& l : c.node_loads)
    h += fmt::format("<li>node force {} kN, moment {} kN·m on {} (each node selected takes it in full)</li>",
                     vector_text(l.force, 1e-3), vector_text(l.moment, 1e-3), esc(describe(l.where)));
  for (const auto& s : c.settlements) {
    static constexpr const char* names[6] = {"ux", "uy", "uz", "rx", "ry", "rz"};
    std::vector<std::string> parts;
    for (int d = 0; d < 6; ++d)
      if (const auto& v = s.value[static_cast<std::size_t>(d)]) parts.push_back(fmt::format("{} = {}{}", names[d], d < 3 ? num(*v * 1e3) : num(*v), d < 3 ? " mm" : " rad"));
    h += fmt::format("<li>settlement {} at {}</li>", fmt::join(parts, ", "), esc(describe(s.where)));
  }
  return h + "</ul>";
}

}  // namespace

std::string inputs_section(const Analysis& a) {
  const auto& p = a.project;
  const auto& model = a.built.model;
  const auto folder = p.file.parent_path();
  std::string h = "<h2 id=\"inputs\">Inputs</h2>\n<dl>\n";
  h += fmt::format("<dt>Program</dt><dd>stepframe {}, run on {}</dd>\n", library_version(), run_date());
  h += fmt::format("<dt>Project file</dt><dd>{} <span class=\"hash\">SHA-256 {}</span></dd>\n",
                   esc(p.file.filename().string()), detail::file_sha256(p.file));
  h += fmt::format("<dt>Model</dt><dd>{} <span class=\"hash\">SHA-256 {}</span> (paths relative to the project's "
                   "folder)</dd>\n",
                   esc(relative_to(p.model, folder)), detail::file_sha256(p.model));
  h += fmt::format("<dt>Units of the project file</dt><dd>length {}, force {}; results in SI (m, N, Pa), shown here in "
                   "mm, kN, MPa</dd>\n",
                   esc(p.length_unit), esc(p.force_unit));
  h += fmt::format("<dt>Merge tolerance</dt><dd>{} mm</dd>\n", num(p.merge_tolerance * 1e3));
  h += fmt::format("<dt>Partial factors</dt><dd>gamma_M0 = {}, gamma_M1 = {}</dd>\n", num(p.checks.gamma_M0, 3),
                   num(p.checks.gamma_M1, 3));
  h += "</dl>\n";

  h += "<h3>Rules, by their selectors</h3>\n<table><tr><th>#</th><th>selects</th><th>sets</th><th>written at</th></tr>\n";
  for (std::size_t i = 0; i < p.rules.size(); ++i) {
    const auto& rule = p.rules[i];
    std::vector<std::string> sets;
    if (rule.section) sets.push_back("section " + *rule.section);
    if (rule.material) sets.push_back("material " + *rule.material);
    if (rule.roll) sets.push_back(fmt::format("roll {} deg", num(*rule.roll * 180 / std::numbers::pi, 3)));
    if (rule.orient_to) sets.push_back("local z towards " + vector_text(*rule.orient_to, 1e3) + " mm");
    if (rule.release) sets.push_back("end releases");
    if (rule.buckling_y || rule.buckling_z || rule.buckling_lt)
      sets.push_back(fmt::format("buckling lengths y {} z {} LT {} x L", rule.buckling_y ? num(*rule.buckling_y, 3) : "-",
                                 rule.buckling_z ? num(*rule.buckling_z, 3) : "-", rule.buckling_lt ? num(*rule.buckling_lt, 3) : "-"));
    if (rule.deflection_ratio) sets.push_back("deflection limit L/" + num(*rule.deflection_ratio, 4));
    if (rule.join_crossings) sets.push_back("joined where they cross");
    h += fmt::format("<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>\n", i + 1, esc(describe(rule.where)),
                     esc(fmt::format("{}", fmt::join(sets, "; "))), esc(written_at(rule.where.origin)));
  }
  h += "</table>\n";

  h += fmt::format("<h3>Supports found ({} {})</h3>\n<table><tr><th>node</th><th>x mm</th><th>y mm</th><th>z mm</th>"
                   "<th>restrained</th></tr>\n",
                   model.supports.size(), model.supports.size() == 1 ? "node" : "nodes");
  for (const auto& s : model.supports) {
    const auto& x = model.nodes[s.node];
    h += fmt::format("<tr><td>{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td><td>{}</td></tr>\n",
                     s.node, mm(x.x()), mm(x.y()), mm(x.z()), fixity(s.fixed, s.spring));
  }
  h += "</table>\n";

  h += "<h3>Load cases</h3>\n<dl>\n";
  for (const auto& c : p.cases) h += fmt::format("<dt>{}</dt><dd>{}</dd>\n", esc(c.name), loads_text(c));
  h += "</dl>\n<h3>Combinations</h3>\n<ul>";
  for (const auto& c : p.combinations) {
    std::vector<std::string> terms;
    for (const auto& [name, factor] : c.factors) terms.push_back(fmt::format("{} × {}", num(factor, 3), name));
    std::string rule = c.rule.empty() ? "" : " (" + c.rule + (c.leading.empty() ? "" : ", leading " + c.leading) + ")";
    h += fmt::format("<li>{} = {}{}</li>", esc(c.name), esc(fmt::format("{}", fmt::join(terms, " + "))), esc(rule));
  }
  h += "</ul>\n";

  // Section properties as used: each (section, material) pair of the model, fy for the section's thickest plate.
  h += "<h3>Section properties used</h3>\n<p>" + esc(std::string(analysis::catalogue_caution)) + "</p>\n";
  h += "<table><tr><th>section</th><th>family</th><th>material</th><th>fy MPa</th><th>A cm²</th><th>Iy cm⁴</th>"
       "<th>Iz cm⁴</th><th>It cm⁴</th><th>Iw cm⁶</th><th>Wel,y cm³</th><th>Wel,z cm³</th><th>Wpl,y cm³</th>"
       "<th>Wpl,z cm³</th><th>kg/m</th></tr>\n";
  std::map<std::pair<std::size_t, std::size_t>, bool> used;
  for (const auto& el : model.elements) used[{el.section, el.material}] = true;
  for (const auto& [key, unused] : used) {
    const auto& s = model.sections[key.first];
    const auto& material = model.materials[key.second];
    const double fy = analysis::material_for_section(material, s).fy;
    h += fmt::format("<tr><td>{}</td><td>{}</td><td>{}</td>", esc(s.designation), esc(s.family), esc(material.name));
    for (double v : {fy / 1e6, s.A * 1e4, s.Iy * 1e8, s.Iz * 1e8, s.J * 1e8, s.Iw * 1e12, s.Wel_y * 1e6, s.Wel_z * 1e6,
                     s.Wpl_y * 1e6, s.Wpl_z * 1e6, s.mass_per_metre(material.density)})
      h += "<td class=\"num\">" + num(v) + "</td>";
    h += "</tr>\n";
  }
  return h + "</table>\n";
}

std::string reactions_section(const Analysis& a) {
  const auto& model = a.built.model;
  if (model.supports.empty()) return {};
  std::string h = "<h2 id=\"reactions\">Support reactions</h2>\n<p>Forces of the supports on the frame, global axes, "
                  "per case and combination (also in reactions.csv).</p>\n<table id=\"reactions-table\"><tr><th>node</th><th>result</th>"
                  "<th>Fx kN</th><th>Fy kN</th><th>Fz kN</th><th>Mx kN·m</th><th>My kN·m</th><th>Mz kN·m</th></tr>\n";
  for (const auto& s : model.supports)
    for (const auto& r : a.results) {
      const auto f = r.reactions.segment<6>(static_cast<Eigen::Index>(6 * s.node));
      h += fmt::format("<tr><td>{}</td><td>{}</td>", s.node, esc(r.name));
      for (int c = 0; c < 6; ++c) h += "<td class=\"num\">" + num(f(c) / 1e3) + "</td>";
      h += "</tr>\n";
    }
  return h + "</table>\n";
}

}  // namespace stepframe::report
