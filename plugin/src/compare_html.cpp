// compare.html: the verdict, failures first, pictures coloured by the change
// in utilisation (SVG, drawn here from the centrelines), and what changed.

#include "report_parts.hpp"
#include "stepframe/compare.hpp"
#include "stepframe/run.hpp"
#include "stepframe/viz/colour_scale.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>

namespace stepframe {
namespace {

using report::esc;
using report::num;

std::string optional_text(const std::optional<double>& v) { return v ? fmt::format("{:.3f}", *v) : std::string("&ndash;"); }
std::string change_text(const MemberDiff& d) {
  return d.before && d.after ? fmt::format("{:+.3f}", *d.after - *d.before) : std::string("&ndash;");
}

// A view of the frame: screen (u, v) from a global point, v upwards.
struct View {
  std::string title;
  Eigen::Vector2d (*project)(const Eigen::Vector3d&);
};

// Seen from -Y, depth drawn obliquely (cabinet projection: Y at 30 degrees, half scale), so a frame in
// an X-Z plane shows in true elevation.
Eigen::Vector2d oblique_view(const Eigen::Vector3d& p) {
  constexpr double c = 0.8660254037844386, s = 0.5;  // cos and sin of 30 degrees
  return {p.x() + 0.5 * c * p.y(), p.z() + 0.5 * s * p.y()};
}
Eigen::Vector2d plan_view(const Eigen::Vector3d& p) { return {p.x(), p.y()}; }

struct Stroke {
  const std::vector<Eigen::Vector3d>* points;
  viz::Rgb colour;
  bool dashed;
  std::string title;
};

std::string svg_picture(const View& view, const std::vector<Stroke>& strokes) {
  constexpr double width = 640, height = 400, margin = 16;
  Eigen::Vector2d lo = Eigen::Vector2d::Constant(std::numeric_limits<double>::max()), hi = -lo;
  for (const auto& s : strokes)
    for (const auto& p : *s.points) {
      const auto q = view.project(p);
      lo = lo.cwiseMin(q), hi = hi.cwiseMax(q);
    }
  if (strokes.empty()) lo = hi = Eigen::Vector2d::Zero();
  const double scale = std::min((width - 2 * margin) / std::max(hi.x() - lo.x(), 1e-9),
                                (height - 2 * margin) / std::max(hi.y() - lo.y(), 1e-9));
  auto x = [&](const Eigen::Vector2d& q) { return margin + (q.x() - lo.x()) * scale; };
  auto y = [&](const Eigen::Vector2d& q) { return height - margin - (q.y() - lo.y()) * scale; };
  std::string out = fmt::format("<figure><svg viewBox=\"0 0 {} {}\" width=\"{}\" height=\"{}\" role=\"img\" aria-label=\"{}\">",
                                width, height, width, height, esc(view.title));
  for (const auto& s : strokes) {
    std::string points;
    for (const auto& p : *s.points) {
      const auto q = view.project(p);
      points += fmt::format("{:.1f},{:.1f} ", x(q), y(q));
    }
    out += fmt::format("<polyline points=\"{}\" stroke=\"{}\" stroke-width=\"{}\"{} fill=\"none\"><title>{}</title></polyline>",
                       points, viz::hex(s.colour), s.dashed ? 2 : 4, s.dashed ? " stroke-dasharray=\"6 4\"" : "",
                       esc(s.title));
  }
  return out + "</svg><figcaption>" + esc(view.title) + "</figcaption></figure>\n";
}

std::string legend(double largest) {
  std::string stops;
  for (int i = 0; i <= 20; ++i) stops += fmt::format("{}{}", i ? "," : "", viz::hex(viz::signed_colour(-1 + i / 10.0)));
  auto chip = [](const viz::Rgb& c, const std::string& text, bool dashed = false) {
    return fmt::format("<span class=\"chip\"><span class=\"swatch\" style=\"background:{}{}\"></span>{}</span>", viz::hex(c),
                       dashed ? ";opacity:0.7" : "", text);
  };
  return fmt::format("<div class=\"legend\"><div>change of governing utilisation</div>"
                     "<div class=\"bar\" style=\"background:linear-gradient(to right,{})\"></div>"
                     "<div class=\"ends\"><span>{:+.3f} (lower)</span><span>0</span><span>{:+.3f} (higher)</span></div>",
                     stops, -largest, largest) +
         chip(viz::above_limit_colour(), "newly failing") + chip(viz::not_checked_colour(), "added or not checked before") +
         chip(viz::undeformed_colour(), "removed (where it was, dashed)", true) + "</div>\n";
}

std::string member_row(const MemberDiff& d) {
  std::string changes;
  for (const auto& c : d.changes) changes += (changes.empty() ? "" : "; ") + esc(c);
  if (d.reversed) changes += std::string(changes.empty() ? "" : "; ") + "drawn reversed";
  std::string ids;
  for (std::size_t i : d.old_ids) ids += (ids.empty() ? "" : " ") + std::to_string(i);
  ids += " &rarr; ";
  for (std::size_t i : d.new_ids) ids += std::to_string(i) + " ";
  return fmt::format("<tr{}><td>{}</td><td>{}</td><td>{}</td><td class=\"n\">{}</td><td class=\"n\">{}</td>"
                     "<td class=\"n\">{}</td><td>{}</td></tr>\n",
                     d.newly_failing() ? " class=\"fail\"" : "", esc(d.label), ids, to_string(d.kind),
                     optional_text(d.before), optional_text(d.after), change_text(d), changes);
}

const char* member_head =
    "<table><tr><th>member</th><th>ids old &rarr; new</th><th>kind</th><th>before</th><th>after</th><th>change</th>"
    "<th>what changed</th></tr>\n";

}  // namespace

std::string comparison_html(const Comparison& c) {
  const bool pass = c.status() == ExitStatus::pass;
  std::string page = fmt::format(
      "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>stepframe compare</title><style>"
      "body{{font-family:sans-serif;margin:1.5em;max-width:70em}}table{{border-collapse:collapse;margin:.5em 0}}"
      "td,th{{border:1px solid #bbb;padding:.2em .5em;text-align:left}}td.n{{text-align:right}}"
      "tr.fail td{{background:{}22}}.verdict{{font-size:1.3em;padding:.4em;border-left:.5em solid {}}}"
      ".caution{{font-style:italic}}.legend{{max-width:640px}}.bar{{height:1em}}.ends{{display:flex;justify-content:"
      "space-between}}.chip{{margin-right:1em}}.swatch{{display:inline-block;width:1.5em;height:.8em;margin-right:.3em}}"
      "figure{{display:inline-block;margin:.5em}}</style></head><body>\n"
      "<h1>Revision comparison</h1><p>old: <code>{}</code><br>new: <code>{}</code></p>\n"
      "<p class=\"caution\">{}</p>\n<p class=\"verdict\">{}</p>\n",
      viz::hex(viz::above_limit_colour()), viz::hex(pass ? viz::not_checked_colour() : viz::above_limit_colour()),
      esc(c.old_label), esc(c.new_label), esc(std::string(caution)),
      pass ? fmt::format("Nothing got worse beyond the threshold (utilisation rise at most +{:.3f}, no member newly failing).",
                         c.options.max_increase)
           : "Worse: " + std::to_string(c.gate_failures.size()) + " finding(s) fail the gate.");

  if (!c.gate_failures.empty()) {
    page += "<h2>What fails the gate</h2><ul>";
    for (const auto& g : c.gate_failures) page += "<li>" + esc(g) + "</li>";
    page += "</ul>\n";
  }
  page += "<h2>Newly failing members and the largest increases</h2>\n";
  std::string rows;
  std::size_t shown = 0;
  for (const auto& d : c.members)
    if ((d.newly_failing() || d.largest_increase() > 0) && shown++ < 30) rows += member_row(d);
  page += rows.empty() ? "<p>No member's utilisation rose.</p>\n" : member_head + rows + "</table>\n";

  // Pictures: the new revision coloured by change, removed members where they were.
  const double largest = largest_change(c);
  std::vector<Stroke> strokes;
  for (const auto& d : c.members) {
    const bool removed = d.new_ids.empty();
    for (std::size_t id : removed ? d.old_ids : d.new_ids)
      strokes.push_back({removed ? &c.old_paths[id] : &c.new_paths[id],
                         removed ? viz::undeformed_colour() : change_colour(d, largest), removed,
                         d.label + ": " + std::string(to_string(d.kind)) +
                             (d.before || d.after ? " " + optional_text(d.before) + " -> " + optional_text(d.after) : "")});
  }
  // Newly failing members drawn last, over the others.
  std::stable_partition(strokes.begin(), strokes.end(),
                        [](const Stroke& s) { return s.colour != viz::above_limit_colour(); });
  page += "<h2>Pictures: change of utilisation</h2>\n" + svg_picture({"elevation from -Y (depth Y drawn at 30 degrees, half scale)", oblique_view}, strokes) +
          svg_picture({"plan (X to the right, Y up)", plan_view}, strokes) + legend(largest);

  page += fmt::format("<h2>What changed</h2><p>{} unchanged, {} modified, {} moved, {} split, {} merged, {} added, {} removed.</p>\n",
                      c.count(ChangeKind::unchanged), c.count(ChangeKind::modified), c.count(ChangeKind::moved),
                      c.count(ChangeKind::split), c.count(ChangeKind::merged), c.count(ChangeKind::added),
                      c.count(ChangeKind::removed));
  rows.clear();
  for (const auto& d : c.members)
    if (d.kind != ChangeKind::unchanged || d.reversed) rows += member_row(d);
  page += rows.empty() ? "<p>No member changed.</p>\n" : member_head + rows + "</table>\n";

  page += "<h3>Supports</h3>";
  if (c.supports.empty()) page += "<p>No support changed.</p>\n";
  else {
    page += "<table><tr><th>at (m)</th><th>change</th></tr>";
    for (const auto& s : c.supports)
      page += fmt::format("<tr><td>{}, {}, {}</td><td>{}</td></tr>", num(s.at.x()), num(s.at.y()), num(s.at.z()), esc(s.change));
    page += "</table>\n";
  }
  page += "<h3>Load cases (resultants, self weight included)</h3>";
  if (c.loads.empty()) page += "<p>No load case changed.</p>\n";
  else {
    page += "<table><tr><th>case</th><th>change</th></tr>";
    for (const auto& l : c.loads) page += "<tr><td>" + esc(l.name) + "</td><td>" + esc(l.change) + "</td></tr>";
    page += "</table>\n";
  }
  page += fmt::format("<h3>Mass</h3><p>{:.1f} kg &rarr; {:.1f} kg ({:+.1f} kg)</p>\n<table><tr><th>section</th><th>old (kg)</th>"
                      "<th>new (kg)</th><th>change (kg)</th></tr>",
                      c.old_mass, c.new_mass, c.new_mass - c.old_mass);
  for (const auto& [section, mass] : c.mass_by_section)
    page += fmt::format("<tr><td>{}</td><td class=\"n\">{:.1f}</td><td class=\"n\">{:.1f}</td><td class=\"n\">{:+.1f}</td></tr>",
                        esc(section), mass[0], mass[1], mass[1] - mass[0]);
  page += "</table>\n";

  if (!c.frame_checks.empty()) {
    page += "<h3>Whole-frame checks</h3><table><tr><th>check</th><th>combination</th><th>before</th><th>after</th></tr>";
    for (const auto& f : c.frame_checks)
      page += fmt::format("<tr{}><td>{}</td><td>{}</td><td class=\"n\">{}</td><td class=\"n\">{}</td></tr>",
                          f.fails_after && !f.failed_before ? " class=\"fail\"" : "", esc(f.check), esc(f.combination),
                          optional_text(f.before), optional_text(f.after));
    page += "</table>\n";
  }
  page += "<details><summary>Every member, check by check</summary><table><tr><th>member</th><th>check</th><th>before</th>"
          "<th>after</th></tr>";
  for (const auto& d : c.members)
    for (const auto& k : d.checks)
      page += fmt::format("<tr{}><td>{}</td><td>{}</td><td class=\"n\">{}</td><td class=\"n\">{}</td></tr>",
                          k.fails_after && !k.failed_before ? " class=\"fail\"" : "", esc(d.label), esc(k.check),
                          optional_text(k.before), optional_text(k.after));
  return page + "</table></details>\n</body></html>\n";
}

}  // namespace stepframe
