// The browser view in report.html: the page's part (controls, panel, data)
// around viz's scripts. The data is the model's members as node paths, each
// result's forces and stress ratio per member, and each member's checks.

#include "json_writer.hpp"
#include "report_parts.hpp"
#include "significant_digits.hpp"

#include "stepframe/analysis/member_line.hpp"
#include "stepframe/viz/browser_view.hpp"

#include <fmt/compile.h>
#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <string>
#include <string_view>

namespace stepframe::report {
namespace {

/// JSON numbers: 5 significant digits (a view, not a result file), as printf's %.5g, appended to `d`.
void n5(std::string& d, double value) {
  if (!std::isfinite(value)) {
    d += "null";
    return;
  }
  char text[32];
  d.append(text, detail::significant_digits<5>(value, text));
}
std::string n5(double value) {
  std::string d;
  n5(d, value);
  return d;
}

/// Appends the view's data to `d`; its shapes are what viz/web/frame_view.js reads. Appended in place:
/// with every result's stresses and extremes it is the bulk of a large frame's report (some 60 MB for
/// 10,000 members and 62 results), and each copy of it costs as much as a tenth of its formatting.
void append_view_data(const Analysis& a, std::string& d) {
  const auto& model = a.built.model;
  const auto chains = analysis::member_chains(model);
  const auto governing = governing_checks(a);
  const auto sheets = sheet_members(a);
  std::vector<bool> has_sheet(chains.size(), false);
  for (std::size_t m : sheets)
    if (m < has_sheet.size()) has_sheet[m] = true;

  d += "{\"scales\":";
  d += viz::colour_scales_json();
  d += ",\"nodes\":[";
  auto out = std::back_inserter(d);
  for (std::size_t i = 0; i < model.nodes.size(); ++i)
    fmt::format_to(out, FMT_COMPILE("{}{:.4f},{:.4f},{:.4f}"), i ? "," : "", model.nodes[i].x(), model.nodes[i].y(),
                   model.nodes[i].z());
  d += "],\"members\":[";
  const std::vector<double> fy = analysis::member_yield_strengths(model, chains);
  for (std::size_t m = 0; m < chains.size(); ++m) {
    const auto& el = model.elements[chains[m].elements.front()];
    std::string path = std::to_string(el.nodes[0]);
    for (std::size_t e : chains[m].elements) path += "," + std::to_string(model.elements[e].nodes[1]);
    const double length = member_length(model, chains[m]);
    const auto* g = m < governing.size() ? governing[m] : nullptr;
    fmt::format_to(out,
                   FMT_COMPILE("{}{{\"id\":{},\"label\":{},\"section\":{},\"material\":{},\"length\":{},\"path\":[{}],"
                               "\"u\":{}{}}}"),
                   m ? "," : "", m, detail::json_string(m < a.built.member_sources.size() ? member_label(a, m) : ""),
                   detail::json_string(model.sections[el.section].designation),
                   detail::json_string(model.materials[el.material].name),
                   n5(length), path, g ? n5(g->utilisation) : "null",
                   has_sheet[m] ? ",\"sheet\":" + detail::json_string(sheet_anchor(m)) : "");
  }
  d += "],\"results\":[";
  for (std::size_t r = 0; r < a.results.size(); ++r) {
    const auto& result = a.results[r];
    fmt::format_to(out, "{}{{\"name\":{},\"kind\":\"{}\",\"stress\":[", r ? "," : "", detail::json_string(result.name),
                   result.is_combination ? "combination" : "case");
    for (std::size_t m = 0; m < result.members.size(); ++m) {
      if (m) d += ',';
      n5(d, result.members[m].max_von_mises / fy[m]);
    }
    d += "],\"extremes\":[";
    for (std::size_t m = 0; m < result.members.size(); ++m) {
      d += m ? ",[" : "[";
      for (std::size_t c = 0; c < 6; ++c) {
        if (c) d += ',';
        n5(d, result.members[m].extremes[c].max);
        d += ',';
        n5(d, result.members[m].extremes[c].min);
      }
      d += "]";
    }
    d += "]}";
  }
  // Per member: [check, result, value, limit, utilisation, pass], values with their units for people.
  std::vector<std::string> checks(chains.size());
  for (const auto& c : a.checks)
    if (c.member < checks.size())
      fmt::format_to(std::back_inserter(checks[c.member]), FMT_COMPILE("{}[{},{},{},{},{},{}]"),
                     checks[c.member].empty() ? "" : ",", detail::json_string(c.check),
                     detail::json_string(c.combination), detail::json_string(with_unit(c.value, c.unit, a.project)),
                     detail::json_string(with_unit(c.limit, c.unit, a.project)),
                     n5(c.utilisation), c.pass ? "true" : "false");
  d += "],\"checks\":[";
  for (std::size_t m = 0; m < checks.size(); ++m) {
    d += m ? ",[" : "[";
    d += checks[m];
    d += ']';
  }
  const auto order = members_by_utilisation(a);
  const std::string initial = !order.empty() && governing[order.front()] ? governing[order.front()]->combination : "";
  d += "],\"initial_result\":" + detail::json_string(initial) + "}";
}

/// Text inside <script>, from `from` on: "</" would end the element early (HTML 4.01 B.3.2 / the HTML
/// standard's script data state).
void make_script_safe(std::string& text, std::size_t from) {
  for (std::size_t at = text.find("</", from); at != std::string::npos; at = text.find("</", at + 3)) text.replace(at, 2, "<\\/");
}

/// Appends <script{attributes}>text</script> with the text made script-safe in place.
template <class Write>
void append_script(std::string& out, std::string_view attributes, Write write) {
  out += "<script";
  out += attributes;
  out += '>';
  const std::size_t from = out.size();
  write(out);
  make_script_safe(out, from);
  out += "</script>\n";
}

}  // namespace

void append_browser_view_section(const Analysis& a, std::string& h) {
  const auto& outputs = a.project.outputs;
  const std::size_t members = a.built.model.members.size();
  const bool wanted = outputs.browser_view.value_or(members <= OutputsSpec::browser_view_members);
  if (!wanted || a.results.empty()) {
    if (!outputs.browser_view)
      spdlog::info("report: no 3D view for {} members (over {}; outputs.browser_view: true adds it)", members,
                   OutputsSpec::browser_view_members);
    return;
  }
  h += "<h2 id=\"view\">3D view</h2>\n<p class=\"hint\">Drag to orbit, wheel to zoom, right-drag to pan; click a member "
       "for its checks and forces.</p>\n<div class=\"view-controls\"><label>Quantity <select id=\"sf-view-quantity\">"
       "</select></label> <label>Result <select id=\"sf-view-result\"></select></label></div>\n"
       "<div class=\"view-row\"><div id=\"sf-view\"></div><div id=\"sf-view-panel\"><p>Click a member.</p></div></div>\n"
       "<div id=\"sf-view-legend\" class=\"legend\"></div>\n";
  append_script(h, " type=\"application/json\" id=\"sf-view-data\"", [&](std::string& out) { append_view_data(a, out); });
  append_script(h, "", [](std::string& out) { out += viz::three_js_bundle(); });
  append_script(h, "", [](std::string& out) { out += viz::frame_view_script(); });
  h += "<details class=\"licence\"><summary>The 3D view is drawn with three.js (MIT licence)</summary><pre>" +
       esc(std::string(viz::three_js_licence())) + "</pre></details>\n";
}

}  // namespace stepframe::report
