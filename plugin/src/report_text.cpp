// Small text helpers and member orderings shared by the sections of report.html.

#include "report_parts.hpp"
#include "stepframe/tables.hpp"

#include "stepframe/viz/colour_scale.hpp"
#include "stepframe/viz/markup.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <numeric>
#include <set>

namespace stepframe::report {

std::string esc(const std::string& text) { return viz::escape_markup(text); }

std::string num(double value, int digits) {
  if (value == 0 || !std::isfinite(value)) return fmt::format("{}", value);
  const double magnitude = std::abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e7) {
    // Fixed notation with `digits` significant digits (at least none after the point).
    const int decimals = std::max(0, digits - 1 - static_cast<int>(std::floor(std::log10(magnitude))));
    return fmt::format("{:.{}f}", value, decimals);
  }
  return fmt::format("{:.{}e}", value, digits - 1);
}

std::string with_unit(double value, const std::string& unit) {
  if (unit == "Pa") return num(value / 1e6) + " MPa";
  if (unit == "N") return num(value / 1e3) + " kN";
  if (unit == "N*m") return num(value / 1e3) + " kN·m";
  if (unit == "m") return num(value * 1e3) + " mm";
  return num(value);
}

std::string with_unit(double value, const std::string& unit, const Project& project) {
  if (project.force_unit != "kip" && project.force_unit != "lbf") return with_unit(value, unit);
  const PeopleUnit u = people_unit(unit, project);
  if (u.name.empty()) return num(value);
  std::string name = u.name;  // kip*ft -> kip·ft
  if (const auto star = name.find('*'); star != std::string::npos) name.replace(star, 1, "·");
  return num(value * u.factor) + " " + name;
}

double member_length(const analysis::FrameModel& model, const analysis::Member& member) {
  double length = 0;
  for (std::size_t e : member.elements)
    length += (model.nodes[model.elements[e].nodes[1]] - model.nodes[model.elements[e].nodes[0]]).norm();
  return length;
}

std::vector<std::size_t> members_by_utilisation(const Analysis& a) {
  const auto governing = governing_checks(a);
  std::vector<std::size_t> order(governing.size());
  std::iota(order.begin(), order.end(), std::size_t{0});
  auto util = [&](std::size_t m) { return governing[m] ? governing[m]->utilisation : -1.0; };
  std::stable_sort(order.begin(), order.end(), [&](std::size_t x, std::size_t y) { return util(x) > util(y); });
  return order;
}

std::string member_label(const Analysis& a, std::size_t m) {
  const auto& src = a.built.member_sources.at(m);
  if (!src.name.empty()) return src.name;
  if (!src.entity.empty()) return src.entity;
  return fmt::format("member {}", m);
}

std::vector<std::size_t> sheet_members(const Analysis& a) {
  const auto governing = governing_checks(a);
  const auto order = members_by_utilisation(a);
  std::vector<std::size_t> chosen;
  std::set<std::size_t> seen;
  auto add = [&](std::size_t m) {
    if (seen.insert(m).second) chosen.push_back(m);
  };
  std::size_t failing = 0;
  for (std::size_t m : order)
    if (governing[m] && !governing[m]->pass && failing++ < 50) add(m);
  for (std::size_t k = 0; k < std::min<std::size_t>(5, order.size()); ++k)
    if (governing[order[k]]) add(order[k]);
  for (const auto& wanted : a.project.outputs.calculation_sheets)
    for (std::size_t m = 0; m < a.built.member_sources.size(); ++m) {
      const auto& src = a.built.member_sources[m];
      if (wanted == std::to_string(m) || wanted == src.entity || wanted == src.name) add(m);
    }
  return chosen;
}

std::string sheet_anchor(std::size_t member) { return fmt::format("sheet-{}", member); }

std::string utilisation_legend(const std::string& title, bool show_not_checked) {
  std::string stops;
  for (int i = 0; i <= 20; ++i) stops += fmt::format("{}{}", i ? "," : "", viz::hex(viz::utilisation_colour(i / 20.0)));
  std::string h = "<div class=\"legend\"><span class=\"legend-title\">" + esc(title) + "</span>";
  h += "<span class=\"ticks\"><span class=\"bar\" style=\"background:linear-gradient(to right," + stops +
       ")\"></span><span class=\"tick-labels\"><span>0</span><span>0.25</span><span>0.5</span><span>0.75</span>"
       "<span>1.0</span></span></span>";
  h += fmt::format("<span class=\"swatch\" style=\"background:{}\"></span><span>above limit (over 1.0)</span>",
                   viz::hex(viz::above_limit_colour()));
  if (show_not_checked)
    h += fmt::format("<span class=\"swatch\" style=\"background:{}\"></span><span>not checked</span>",
                     viz::hex(viz::not_checked_colour()));
  return h + "</div>\n";
}

// RFC 4648 section 4.
std::string base64(const std::vector<std::uint8_t>& bytes) {
  static constexpr char table[] = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";
  std::string out;
  out.reserve((bytes.size() + 2) / 3 * 4);
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

}  // namespace stepframe::report
