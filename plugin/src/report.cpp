#include "stepframe/report.hpp"

#include "stepframe/analysis/section.hpp"
#include "stepframe/viz/markup.hpp"
#include "stepframe/viz/picture.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <map>

namespace stepframe {
namespace {

std::string escaped(const std::string& text) { return viz::escape_markup(text); }

// RFC 4648 base64, for the embedded pictures.
std::string base64(const std::vector<std::uint8_t>& bytes) {
  static constexpr char table[] = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";
  std::string out;
  for (std::size_t i = 0; i < bytes.size(); i += 3) {
    const std::uint32_t n = (std::uint32_t{bytes[i]} << 16) | (i + 1 < bytes.size() ? std::uint32_t{bytes[i + 1]} << 8 : 0u) |
                            (i + 2 < bytes.size() ? std::uint32_t{bytes[i + 2]} : 0u);
    out += table[(n >> 18) & 63];
    out += table[(n >> 12) & 63];
    out += i + 1 < bytes.size() ? table[(n >> 6) & 63] : '=';
    out += i + 2 < bytes.size() ? table[n & 63] : '=';
  }
  return out;
}

std::string rgb(double fraction) {
  const auto c = viz::stress_colour(fraction);
  return fmt::format("rgb({},{},{})", c[0], c[1], c[2]);
}

// The combination a picture shows: the one with the largest stress (or local
// deflection, for the deformed shape); the first result when there are no combinations.
const analysis::LoadResult& picture_result(const Analysis& a, bool by_deflection) {
  auto peak = [&](const analysis::LoadResult& r) {
    double value = 0;
    for (const auto& m : r.members) value = std::max(value, by_deflection ? m.max_local_deflection : m.max_von_mises);
    return r.is_combination ? value : -1.0;
  };
  return *std::max_element(a.results.begin(), a.results.end(),
                           [&](const auto& x, const auto& y) { return peak(x) < peak(y); });
}

std::string figure(const viz::Picture& p, const std::string& caption) {
  std::string legend;
  for (int i = 0; i <= 10; ++i) legend += fmt::format("{}{} {}%", i ? ", " : "", rgb(i / 10.0), i * 10);
  return fmt::format(
      "<figure><img alt=\"{0}\" src=\"data:image/png;base64,{1}\"><figcaption>{0}<div class=\"scale\" "
      "style=\"background: linear-gradient(to right, {2})\"></div><div class=\"scale-labels\"><span>0</span>"
      "<span>von Mises stress, MPa</span><span>{3:.0f}</span></div></figcaption></figure>\n",
      escaped(caption), base64(p.png), legend, p.stress_max / 1e6);
}

}  // namespace

std::string report_html(const Analysis& a) {
  const auto& model = a.built.model;
  const bool pass = a.status() == ExitStatus::pass;

  // Governing check per member, the frame checks apart.
  std::vector<const analysis::CheckResult*> governing(model.members.size(), nullptr);
  std::vector<const analysis::CheckResult*> frame_checks;
  for (const auto& c : a.checks) {
    if (c.member == analysis::whole_frame) frame_checks.push_back(&c);
    else if (!governing[c.member] || c.utilisation > governing[c.member]->utilisation) governing[c.member] = &c;
  }
  double max_utilisation = 0;
  for (const auto& c : a.checks) max_utilisation = std::max(max_utilisation, c.utilisation);
  std::optional<double> alpha_cr;
  for (const auto& r : a.results)
    if (r.alpha_cr) alpha_cr = alpha_cr ? std::min(*alpha_cr, *r.alpha_cr) : *r.alpha_cr;
  double total_mass = 0;
  for (const auto& member : model.members)
    for (std::size_t e : member.elements) {
      const auto& el = model.elements[e];
      total_mass += model.sections[el.section].A * model.materials[el.material].density *
                    (model.nodes[el.nodes[1]] - model.nodes[el.nodes[0]]).norm();  // kg = A rho L
    }

  std::string h;
  h += "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>stepframe report: " +
       escaped(a.project.file.filename().string()) + "</title>\n<style>\n"
       "body{font-family:sans-serif;margin:0 auto;max-width:1100px;padding:1em;color:#222}\n"
       ".verdict{font-size:1.6em;padding:.6em 1em;color:#fff}.pass{background:#2e7d32}.fail{background:#c62828}\n"
       ".caution{background:#fff4d6;border-left:6px solid #e0a800;padding:.6em 1em;margin:.5em 0 1em}\n"
       "table{border-collapse:collapse;width:100%;font-size:.9em}td,th{border-bottom:1px solid #ddd;padding:3px 6px;"
       "text-align:left}td.num{text-align:right}tr.failed td{background:#fde7e7}\n"
       "figure{margin:1em 0}img{max-width:100%;border:1px solid #ccc}.scale{height:12px;width:320px;margin-top:4px}\n"
       ".scale-labels{display:flex;justify-content:space-between;width:320px;font-size:.8em}dl{display:grid;"
       "grid-template-columns:max-content auto;gap:2px 1em}dt{font-weight:bold}\n</style></head><body>\n";
  h += fmt::format("<div class=\"verdict {}\" id=\"verdict\" data-status=\"{}\">{}: {}</div>\n", pass ? "pass" : "fail",
                   pass ? "pass" : "fail", pass ? "PASS" : "FAIL", escaped(a.project.file.filename().string()));
  h += "<div class=\"caution\">" + escaped(std::string(caution)) + "</div>\n";

  h += "<h2>Summary</h2>\n<dl>\n";
  h += fmt::format("<dt>Model</dt><dd>{} ({} members, {} nodes; file unit {})</dd>\n",
                   escaped(a.project.model.filename().string()), model.members.size(), model.nodes.size(),
                   escaped(a.file_length_unit));
  h += fmt::format("<dt>Largest utilisation</dt><dd id=\"max-utilisation\">{:.3f}</dd>\n", max_utilisation);
  h += fmt::format("<dt>Lowest alpha_cr</dt><dd>{}</dd>\n", alpha_cr ? fmt::format("{:.2f}", *alpha_cr) : "not computed");
  h += fmt::format("<dt>Total steel mass</dt><dd>{:.0f} kg</dd>\n", total_mass);
  const auto failed = std::count_if(a.checks.begin(), a.checks.end(), [](const auto& c) { return !c.pass; });
  h += fmt::format("<dt>Checks</dt><dd>{} of {} pass</dd>\n</dl>\n", a.checks.size() - static_cast<std::size_t>(failed),
                   a.checks.size());

  if (a.project.outputs.pictures) {
    const auto& strength = picture_result(a, false);
    const auto& service = picture_result(a, true);
    h += "<h2>Pictures</h2>\n";
    h += figure(viz::draw_stress_picture(model, strength), "Stress under " + strength.name);
    viz::PictureOptions deformed;
    deformed.deformed = true;
    const auto shape = viz::draw_stress_picture(model, service, deformed);
    h += figure(shape, fmt::format("Deformed shape under {} (displacements x {:.0f})", service.name, shape.deformation_scale));
  }

  if (!frame_checks.empty()) {
    h += "<h2>Frame</h2>\n<table><tr><th>check</th><th>combination</th><th>value</th><th>utilisation</th>"
         "<th>clause</th></tr>\n";
    for (const auto* c : frame_checks)
      h += fmt::format("<tr{}><td>{}</td><td>{}</td><td class=\"num\">{:.3g}</td><td class=\"num\">{:.3f}</td><td>{}</td></tr>\n",
                       c->pass ? "" : " class=\"failed\"", escaped(c->check), escaped(c->combination), c->value,
                       c->utilisation, escaped(c->clause));
    h += "</table>\n";
  }

  h += "<h2>Members by utilisation</h2>\n<table id=\"members\"><tr><th>member</th><th>entity</th><th>name</th>"
       "<th>section</th><th>material</th><th>length m</th><th>governing check</th><th>combination</th>"
       "<th>x m</th><th>utilisation</th><th>clause</th></tr>\n";
  std::vector<std::size_t> order(model.members.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  auto util = [&](std::size_t m) { return governing[m] ? governing[m]->utilisation : -1.0; };
  std::stable_sort(order.begin(), order.end(), [&](std::size_t x, std::size_t y) { return util(x) > util(y); });
  for (std::size_t m : order) {
    const auto& el = model.elements[model.members[m].elements.front()];
    const auto& src = a.built.member_sources[m];
    double length = 0;
    for (std::size_t e : model.members[m].elements)
      length += (model.nodes[model.elements[e].nodes[1]] - model.nodes[model.elements[e].nodes[0]]).norm();
    const auto* c = governing[m];
    h += fmt::format("<tr{}><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td class=\"num\">{:.3f}</td>", c && !c->pass ? " class=\"failed\"" : "",
                     m, escaped(src.entity), escaped(src.name), escaped(model.sections[el.section].designation),
                     escaped(model.materials[el.material].name), length);
    if (c) {
      // The governing check's intermediate values (results.json "details"), SI units, for following it by hand.
      std::string details;
      for (const auto& [name, value] : c->details) details += fmt::format("{}{} = {:.4g}", details.empty() ? "" : ", ", name, value);
      if (!details.empty()) details = "<br><small class=\"details\">" + escaped(details) + "</small>";
      h += fmt::format("<td>{}</td><td>{}</td><td class=\"num\">{:.3f}</td><td class=\"num\">{:.3f}</td><td>{}{}</td></tr>\n",
                       escaped(c->check), escaped(c->combination), c->station, c->utilisation, escaped(c->clause), details);
    }
    else
      h += "<td colspan=\"5\">not checked</td></tr>\n";
  }
  h += "</table>\n";

  h += "<h2>Model diagnostics</h2>\n";
  if (a.wireframe.diagnostics.empty()) h += "<p>None.</p>\n";
  else {
    h += "<table><tr><th>severity</th><th>code</th><th>message</th><th>entities</th></tr>\n";
    for (const auto& d : a.wireframe.diagnostics)
      h += fmt::format("<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>\n", geometry::to_string(d.severity),
                       escaped(d.code), escaped(d.message), escaped(fmt::format("{}", fmt::join(d.entities, " "))));
    h += "</table>\n";
  }

  const auto& p = a.project;
  h += "<h2>Inputs</h2>\n<dl>\n";
  h += fmt::format("<dt>Project file</dt><dd>{}</dd>\n", escaped(p.file.string()));
  h += fmt::format("<dt>Units of the project file</dt><dd>length {}, force {}; results in SI (m, N, Pa)</dd>\n",
                   escaped(p.length_unit), escaped(p.force_unit));
  h += fmt::format("<dt>Merge tolerance</dt><dd>{:g} mm</dd>\n", p.merge_tolerance * 1e3);
  h += "<dt>Section properties</dt><dd>" + escaped(std::string(analysis::catalogue_caution)) + "</dd>\n";
  h += fmt::format("<dt>Partial factors</dt><dd>gamma_M0 = {:g}, gamma_M1 = {:g}</dd>\n", p.checks.gamma_M0, p.checks.gamma_M1);
  h += "<dt>Rules</dt><dd><ol>";
  for (const auto& rule : p.rules) {
    std::vector<std::string> sets;
    if (rule.section) sets.push_back("section " + *rule.section);
    if (rule.material) sets.push_back("material " + *rule.material);
    if (rule.roll) sets.push_back(fmt::format("roll {:g} deg", *rule.roll * 180 / 3.141592653589793));
    if (rule.release) sets.push_back("end releases");
    if (rule.buckling_y || rule.buckling_z || rule.buckling_lt) sets.push_back("buckling lengths");
    if (rule.deflection_ratio) sets.push_back(fmt::format("deflection L/{:g}", *rule.deflection_ratio));
    h += fmt::format("<li>{}: {}</li>", escaped(rule.where.origin.describe()), escaped(fmt::format("{}", fmt::join(sets, ", "))));
  }
  h += "</ol></dd>\n<dt>Load cases</dt><dd><ul>";
  for (const auto& c : p.cases)
    h += fmt::format("<li>{}: {}{} member load(s), {} node load(s)</li>", escaped(c.name), c.self_weight ? "self weight, " : "",
                     c.member_loads.size(), c.node_loads.size());
  h += "</ul></dd>\n<dt>Combinations</dt><dd><ul>";
  for (const auto& c : p.combinations) {
    std::vector<std::string> terms;
    for (const auto& [name, factor] : c.factors) terms.push_back(fmt::format("{:g} {}", factor, name));
    h += fmt::format("<li>{} = {}</li>", escaped(c.name), escaped(fmt::format("{}", fmt::join(terms, " + "))));
  }
  h += "</ul></dd>\n</dl>\n";
  h += "<p class=\"caution\">" + escaped(std::string(caution)) + "</p>\n</body></html>\n";
  return h;
}

}  // namespace stepframe
