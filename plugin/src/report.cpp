#include "stepframe/report.hpp"

#include "report_parts.hpp"
#include "stepframe/viz/colour_scale.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <future>

namespace stepframe {
namespace {

using report::esc;
using report::num;
using report::with_unit;

/// The page's style: the colours of the utilisation scale and its flag, nothing borrowed.
std::string style() {
  const auto flag = viz::above_limit_colour();
  viz::Rgb tint{};  // 12% of the flag colour over white: failing rows
  for (std::size_t c = 0; c < 3; ++c) tint[c] = static_cast<std::uint8_t>(255 - 0.12 * (255 - flag[c]));
  return fmt::format(
      "body{{font-family:system-ui,sans-serif;margin:0 auto;max-width:1180px;padding:1em;color:#222}}\n"
      ".verdict{{font-size:1.5em;padding:.5em 1em;border-radius:3px}}.pass{{background:{sand};color:#222}}"
      ".fail{{background:{flag};color:#fff}}\n"
      ".caution{{border:1px solid #999;border-left:6px solid #555;padding:.5em 1em;margin:.6em 0 1em}}\n"
      "table{{border-collapse:collapse;width:100%;font-size:.88em;margin:.4em 0}}td,th{{border-bottom:1px solid #ddd;"
      "padding:3px 6px;text-align:left;vertical-align:top}}td.num{{text-align:right;font-variant-numeric:tabular-nums}}"
      "tr.failed td,.check.failed{{background:{tint}}}\n"
      "figure{{margin:1em 0}}.picture{{position:relative;display:inline-block}}.picture img{{max-width:100%;"
      "border:1px solid #ccc;display:block}}.label{{position:absolute;transform:translate(-50%,-130%);font-size:.75em;"
      "background:#fffe;border:1px solid #555;padding:0 3px;white-space:nowrap}}\n"
      ".legend{{display:flex;align-items:center;gap:.5em;flex-wrap:wrap;font-size:.85em;margin:.3em 0}}"
      ".legend .bar,.sf-bar{{display:inline-block;width:300px;height:12px;border:1px solid #888}}"
      ".ticks{{display:inline-flex;flex-direction:column}}.tick-labels{{display:flex;justify-content:space-between;"
      "width:302px;font-size:.85em}}.swatch,.sf-swatch{{display:inline-block;width:18px;height:12px;border:1px solid #888}}\n"
      "dl{{display:grid;grid-template-columns:max-content auto;gap:2px 1em}}dt{{font-weight:bold}}.hash{{font-family:"
      "monospace;font-size:.8em;color:#555}}\n"
      ".view-row{{display:flex;gap:1em}}#sf-view{{flex:1;height:520px;border:1px solid #ccc}}#sf-view-panel{{width:330px;"
      "font-size:.85em;max-height:520px;overflow:auto}}.sheet{{border-top:2px solid #555;margin-top:1em}}"
      ".check{{padding:.2em .5em}}table.details{{width:auto}}\n",
      fmt::arg("sand", viz::hex(viz::utilisation_colour(0.25))), fmt::arg("flag", viz::hex(flag)),
      fmt::arg("tint", viz::hex(tint)));
}

std::string check_row(const Analysis& a, const analysis::CheckResult& c) {
  const std::string who = c.member == analysis::whole_frame
                              ? "whole frame"
                              : fmt::format("<a href=\"#{}\">{}</a> {}", report::sheet_anchor(c.member), c.member,
                                            esc(report::member_label(a, c.member)));
  return fmt::format("<tr{}><td>{}</td><td>{}</td><td>{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td>"
                     "<td class=\"num\">{}</td><td class=\"num\">{}</td><td>{}</td></tr>\n",
                     c.pass ? "" : " class=\"failed\"", who, esc(c.check), esc(c.combination),
                     c.member == analysis::whole_frame ? "" : num(c.station, 3), with_unit(c.value, c.unit, a.project),
                     with_unit(c.limit, c.unit, a.project), num(c.utilisation, 3), esc(c.clause));
}

constexpr const char* check_header =
    "<tr><th>member</th><th>check</th><th>result</th><th>x m</th><th>value</th><th>limit</th><th>utilisation</th>"
    "<th>clause</th></tr>\n";

/// Every failing check (frame checks first), then the highest passing ones, and where the rest are.
std::string failures_first(const Analysis& a) {
  std::vector<const analysis::CheckResult*> failing, passing;
  for (const auto& c : a.checks) (c.pass ? passing : failing).push_back(&c);
  auto order = [](const auto* x, const auto* y) {
    const bool fx = x->member == analysis::whole_frame, fy = y->member == analysis::whole_frame;
    return fx != fy ? fx : x->utilisation > y->utilisation;
  };
  std::stable_sort(failing.begin(), failing.end(), order);
  std::stable_sort(passing.begin(), passing.end(), [](const auto* x, const auto* y) { return x->utilisation > y->utilisation; });
  std::string h = fmt::format("<h2 id=\"failing\">Failing checks ({})</h2>\n", failing.size());
  if (failing.empty()) h += "<p>No check fails.</p>\n";
  else {
    h += "<table id=\"failing-checks\">" + std::string(check_header);
    for (const auto* c : failing) h += check_row(a, *c);
    h += "</table>\n";
  }
  constexpr std::size_t shown = 10;
  h += fmt::format("<h2 id=\"passing\">Highest passing checks</h2>\n<table id=\"passing-checks\">{}", check_header);
  for (std::size_t i = 0; i < std::min(shown, passing.size()); ++i) h += check_row(a, *passing[i]);
  h += "</table>\n";
  if (passing.size() > shown)
    h += fmt::format("<p>{} more passing {}: every check is in checks.csv and results.json; every member's governing "
                     "one is in the member table below.</p>\n",
                     passing.size() - shown, passing.size() - shown == 1 ? "check" : "checks");
  return h;
}

std::string frame_checks(const Analysis& a) {
  std::string rows;
  for (const auto& c : a.checks)
    if (c.member == analysis::whole_frame) rows += check_row(a, c);
  if (rows.empty()) return {};
  return "<h2 id=\"frame\">Frame checks</h2>\n<table id=\"frame-checks\">" + std::string(check_header) + rows + "</table>\n";
}

// The report lists the `members_listed` most utilised members and every failing one; checks.csv lists
// every member (a page of 100,000 rows is 27 MB that no one reads).
constexpr std::size_t members_listed = 1000;

std::string members_table(const Analysis& a) {
  const auto& model = a.built.model;
  const auto governing = governing_checks(a);
  std::string h = "<h2 id=\"members\">Members by utilisation</h2>\n<table id=\"members-table\"><tr><th>member</th><th>entity</th>"
                  "<th>name</th><th>section</th><th>material</th><th>length m</th><th>governing check</th><th>result</th>"
                  "<th>x m</th><th>value</th><th>limit</th><th>utilisation</th></tr>\n";
  const std::vector<std::size_t> order = report::members_by_utilisation(a);
  std::size_t listed = 0;
  for (std::size_t k = 0; k < order.size(); ++k) {
    const std::size_t m = order[k];
    if (k >= members_listed && (!governing[m] || governing[m]->pass)) continue;
    ++listed;
    const auto& el = model.elements[model.members[m].elements.front()];
    const auto& src = a.built.member_sources[m];
    const double length = report::member_length(model, model.members[m]);
    const auto* c = governing[m];
    h += fmt::format("<tr{}><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td class=\"num\">{}</td>",
                     c && !c->pass ? " class=\"failed\"" : "", m, esc(src.entity), esc(src.name),
                     esc(model.sections[el.section].designation), esc(model.materials[el.material].name), num(length));
    if (c)
      h += fmt::format("<td>{}</td><td>{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td>"
                       "<td class=\"num\">{}</td></tr>\n",
                       esc(c->check), esc(c->combination), num(c->station, 3), with_unit(c->value, c->unit, a.project),
                       with_unit(c->limit, c->unit, a.project), num(c->utilisation, 3));
    else
      h += "<td colspan=\"6\">not checked</td></tr>\n";
  }
  h += "</table>\n";
  if (listed < order.size())
    h += fmt::format("<p>The {} most utilised and every failing one of {} members; checks.csv lists every member "
                     "with its governing check.</p>\n",
                     members_listed, order.size());
  return h;
}

std::string diagnostics(const Analysis& a) {
  std::string h = "<h2 id=\"diagnostics\">Model diagnostics</h2>\n";
  if (a.wireframe.diagnostics.empty()) return h + "<p>None.</p>\n";
  h += "<table><tr><th>severity</th><th>code</th><th>message</th><th>entities</th></tr>\n";
  for (const auto& d : a.wireframe.diagnostics)
    h += fmt::format("<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>\n", geometry::to_string(d.severity),
                     esc(d.code), esc(d.message), esc(fmt::format("{}", fmt::join(d.entities, " "))));
  return h + "</table>\n";
}

}  // namespace

std::string report_html(const Analysis& a) {
  // The pictures (most of the report's time) are drawn on a thread of their own while the rest is written.
  auto pictures = std::async(std::launch::async, [&a] { return report::pictures_section(a); });
  const auto& model = a.built.model;
  const bool pass = a.status() == ExitStatus::pass;
  const std::string title = a.project.file.filename().string();

  double max_utilisation = 0;
  for (const auto& c : a.checks) max_utilisation = std::max(max_utilisation, c.utilisation);
  std::optional<double> alpha_cr;
  for (const auto& r : a.results)
    if (r.alpha_cr) alpha_cr = alpha_cr ? std::min(*alpha_cr, *r.alpha_cr) : *r.alpha_cr;
  double total_mass = 0;
  for (const auto& el : model.elements)  // kg = A rho L
    total_mass += model.sections[el.section].A * model.materials[el.material].density *
                  (model.nodes[el.nodes[1]] - model.nodes[el.nodes[0]]).norm();
  const auto failed = static_cast<std::size_t>(std::count_if(a.checks.begin(), a.checks.end(), [](const auto& c) { return !c.pass; }));

  std::string h = "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>stepframe report: " + esc(title) +
                  "</title>\n<style>\n" + style() + "</style></head><body>\n";
  h += fmt::format("<div class=\"verdict {0}\" id=\"verdict\" data-status=\"{0}\">{1}: {2} ({3} of {4} checks fail)</div>\n",
                   pass ? "pass" : "fail", pass ? "PASS" : "FAIL", esc(title), failed, a.checks.size());
  h += "<div class=\"caution\">" + esc(std::string(caution)) + "</div>\n";

  h += "<h2>Summary</h2>\n<dl>\n";
  h += fmt::format("<dt>Model</dt><dd>{} ({} {}, {} {}; file unit {})</dd>\n", esc(a.project.model.filename().string()),
                   model.members.size(), model.members.size() == 1 ? "member" : "members", model.nodes.size(),
                   model.nodes.size() == 1 ? "node" : "nodes", esc(a.file_length_unit));
  h += fmt::format("<dt>Largest utilisation</dt><dd id=\"max-utilisation\">{:.3f}</dd>\n", max_utilisation);
  h += fmt::format("<dt>Lowest alpha_cr</dt><dd>{}</dd>\n", alpha_cr ? num(*alpha_cr, 3) : "not computed");
  h += fmt::format("<dt>Total steel mass</dt><dd>{:.0f} kg</dd>\n", total_mass);
  h += fmt::format("<dt>Checks</dt><dd>{} of {} pass</dd>\n</dl>\n", a.checks.size() - failed, a.checks.size());
  h += "<p>Contents: <a href=\"#failing\">failing checks</a> · <a href=\"#pictures\">pictures</a> · <a href=\"#view\">3D "
       "view</a> · <a href=\"#members\">members</a> · <a href=\"#sheets\">calculation sheets</a> · <a "
       "href=\"#reactions\">reactions</a> · <a href=\"#diagnostics\">diagnostics</a> · <a href=\"#inputs\">inputs</a></p>\n";

  h += failures_first(a);
  std::string rest;  // everything after the pictures, while they are drawn
  report::append_browser_view_section(a, rest);
  rest += frame_checks(a);
  rest += members_table(a);
  rest += report::sheets_section(a);
  rest += report::reactions_section(a);
  rest += report::modes_section(a);
  rest += report::area_loads_section(a);
  rest += report::shop_section(a);
  rest += diagnostics(a);
  rest += report::inputs_section(a);
  rest += "<p class=\"caution\">" + esc(std::string(caution)) + "</p>\n</body></html>\n";
  h += pictures.get();
  rest.insert(0, h);  // in place where rest has room: rest holds the 3D view, the bulk of a large report
  return rest;
}

}  // namespace stepframe
