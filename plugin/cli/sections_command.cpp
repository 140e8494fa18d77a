#include "sections_command.hpp"

#include "stepframe/analysis/section.hpp"
#include "stepframe/counted.hpp"

#include <fmt/format.h>
#include <nlohmann/json.hpp>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <iostream>
#include <map>
#include <numbers>

namespace stepframe::cli {
namespace {

constexpr int bad_input = 2;
// Mass per metre is reported for carbon steel: 7850 kg/m^3 (common practice).
constexpr double steel_density = 7850;

std::string_view part_kind(analysis::PartKind kind) {
  switch (kind) {
    case analysis::PartKind::internal: return "internal";
    case analysis::PartKind::outstand: return "outstand";
    case analysis::PartKind::angle_leg: return "angle_leg";
    case analysis::PartKind::tube: return "tube";
  }
  return "internal";
}

// What each catalogue family is, in the trade's words (common practice).
std::string family_name(const std::string& family) {
  static const std::map<std::string, std::string> names{
      {"IPE", "I beams, parallel flanges"},          {"IPEA", "I beams, light series (A)"},
      {"IPEO", "I beams, heavy series (O)"},          {"HEA", "wide flange H beams, light series (A)"},
      {"HEB", "wide flange H beams"},                 {"HEM", "wide flange H beams, heavy series (M)"},
      {"UPE", "channels, parallel flanges"},          {"UPN", "channels, tapered flanges"},
      {"L", "angles"},                                {"CHS", "circular hollow sections"},
      {"SHS", "square hollow sections"},              {"RHS", "rectangular hollow sections"},
      {"W", "wide flange shapes"},                    {"C", "channels, tapered flanges"},
      {"HSS", "hollow structural sections"},          {"PL", "flat plates"},
      {"RD", "round bars"}};
  const auto it = names.find(family);
  return it == names.end() ? family : it->second;
}

nlohmann::json section_json(const analysis::Section& s) {
  nlohmann::json parts = nlohmann::json::array();
  for (const auto& p : s.parts)
    parts.push_back({{"name", p.name}, {"kind", part_kind(p.kind)}, {"c", p.c}, {"t", p.t}, {"c_over_t", p.ratio()}});
  nlohmann::json outline = nlohmann::json::array();
  for (const auto& ring : s.outline) {
    nlohmann::json points = nlohmann::json::array();
    for (const auto& q : ring) points.push_back({q.y, q.z});
    outline.push_back(points);
  }
  nlohmann::json stress_points = nlohmann::json::array();
  for (const auto& q : s.stress_points) stress_points.push_back({q.y, q.z});
  return {{"designation", s.designation},
          {"family", s.family},
          {"family_name", family_name(s.family)},
          {"standard", s.standard},
          {"shape", analysis::shape_name(s.shape)},
          {"units", "SI: m, m^2, m^3, m^4, m^6, rad, kg/m"},
          {"note", analysis::catalogue_caution},
          {"A", s.A},
          {"Iy", s.Iy},
          {"Iz", s.Iz},
          {"J", s.J},
          {"Iw", s.Iw},
          {"Wel_y", s.Wy()},
          {"Wel_z", s.Wz()},
          {"Wpl_y", s.Wpl_y},
          {"Wpl_z", s.Wpl_z},
          {"Avy", s.Avy},
          {"Avz", s.Avz},
          {"iy", s.iy()},
          {"iz", s.iz()},
          {"mass_per_metre", s.mass_per_metre(steel_density)},
          {"density_for_mass", steel_density},
          {"depth", s.depth},
          {"width", s.width},
          {"t_max", s.t_max},
          {"principal_angle", s.principal_angle},
          {"shear_centre", {s.shear_centre_y, s.shear_centre_z}},
          {"parts", parts},
          {"stress_points", stress_points},
          {"outline", outline}};
}

/// A number with four significant digits, in fixed notation without trailing
/// zeros and with thousands set apart by a space (1 711 000, 569.6, 9.652).
std::string readable(double value) {
  if (value == 0 || !std::isfinite(value)) return fmt::format("{}", value);
  const int digits = static_cast<int>(std::floor(std::log10(std::abs(value)))) + 1;
  const double scale = std::pow(10.0, digits - 4);
  const double rounded = digits > 4 ? std::round(value / scale) * scale : value;
  std::string text = fmt::format("{:.{}f}", rounded, std::max(0, 4 - digits));
  if (text.find('.') != std::string::npos) {
    text.erase(text.find_last_not_of('0') + 1);
    if (text.back() == '.') text.pop_back();
  }
  const auto end = text.find('.') == std::string::npos ? text.size() : text.find('.');
  const std::size_t first = text.front() == '-' ? 1 : 0;
  if (end - first > 4)
    for (auto at = static_cast<std::ptrdiff_t>(end) - 3; at > static_cast<std::ptrdiff_t>(first); at -= 3)
      text.insert(static_cast<std::size_t>(at), " ");
  return text;
}

// People read sections in mm and cm: converted here, at the edge.
std::string section_text(const analysis::Section& s) {
  std::string out =
      fmt::format("{}  ({}, {}, {})\n\n", s.designation,
                  s.family.empty() ? "custom" : s.family + ": " + family_name(s.family),
                  s.standard.empty() ? "no standard" : s.standard, analysis::shape_name(s.shape));
  const auto row = [&](std::string_view name, double value, std::string_view unit, std::string_view what) {
    out += fmt::format("  {:<16}{:>12} {:<9}{}\n", name, readable(value), unit, what);
  };
  row("depth", s.depth * 1e3, "mm", "extent along z");
  row("width", s.width * 1e3, "mm", "extent along y");
  row("t_max", s.t_max * 1e3, "mm", "thickest plate (sets fy)");
  row("A", s.A * 1e4, "cm2", "area");
  row("mass", s.mass_per_metre(steel_density), "kg/m", "at 7850 kg/m3");
  row("Iy", s.Iy * 1e8, "cm4", "second moment, strong axis");
  row("Iz", s.Iz * 1e8, "cm4", "second moment, weak axis");
  row("iy", s.iy() * 1e3, "mm", "radius of gyration");
  row("iz", s.iz() * 1e3, "mm", "radius of gyration");
  row("Wel_y", s.Wy() * 1e6, "cm3", "elastic modulus");
  row("Wel_z", s.Wz() * 1e6, "cm3", "elastic modulus");
  row("Wpl_y", s.Wpl_y * 1e6, "cm3", "plastic modulus");
  row("Wpl_z", s.Wpl_z * 1e6, "cm3", "plastic modulus");
  row("J", s.J * 1e8, "cm4", "St Venant torsion constant");
  row("Iw", s.Iw * 1e9, "10^3 cm6", "warping constant");
  row("Avy", s.Avy * 1e4, "cm2", "shear area, force along y");
  row("Avz", s.Avz * 1e4, "cm2", "shear area, force along z");
  if (s.principal_angle != 0) row("principal angle", s.principal_angle * 180 / std::numbers::pi, "deg", "leg axes to y, z");
  if (s.shear_centre_y != 0 || s.shear_centre_z != 0)
    out += fmt::format("  {:<16}({:.1f}, {:.1f}) mm from the centroid (y, z)\n", "shear centre", s.shear_centre_y * 1e3,
                       s.shear_centre_z * 1e3);
  for (const auto& p : s.parts)
    out += fmt::format("  {:<16}c/t = {:.1f} ({}, c = {:.1f} mm, t = {:.1f} mm)\n", p.name, p.ratio(), part_kind(p.kind),
                       p.c * 1e3, p.t * 1e3);
  return out + fmt::format("\n{}\n", analysis::catalogue_caution);
}

std::string list_text(const std::vector<analysis::CatalogueEntry>& entries) {
  // One line per family: its standard and the designations.
  std::vector<std::pair<std::string, std::vector<const analysis::CatalogueEntry*>>> groups;
  for (const auto& e : entries) {
    const std::string key = e.family + ", " + family_name(e.family) + " (" + e.standard + ")";
    if (groups.empty() || groups.back().first != key) groups.push_back({key, {}});
    groups.back().second.push_back(&e);
  }
  std::string out;
  for (const auto& [key, members] : groups) {
    out += fmt::format("{}: {}\n", key, counted(members.size(), "section"));
    std::string line = " ";
    for (const auto* e : members) {
      std::string name = " " + e->designation + (e->alias.empty() ? "" : " [" + e->alias + "]");
      if (line.size() + name.size() > 100) {
        out += line + "\n";
        line = " ";
      }
      line += name;
    }
    out += line + "\n";
  }
  return out + fmt::format("\n{}\n", analysis::catalogue_caution);
}

}  // namespace

CLI::App* add_sections_command(CLI::App& app, SectionsOptions& options) {
  auto* cmd = app.add_subcommand(
      "sections", "List the built-in sections by family, or show one section's properties (\"IPE\", \"HE 200 B\", "
                  "\"SHS 100x100x5\") in mm and cm. Prints on stdout, writes no file");
  cmd->add_option("QUERY", options.query, "A designation, a family or the start of a designation; empty lists all");
  cmd->add_flag("--json", options.json, "Print JSON in SI units");
  return cmd;
}

int sections_command(const SectionsOptions& options) {
  if (!options.query.empty()) {
    if (const auto section = analysis::find_catalogue_section(options.query)) {
      if (options.json) std::cout << section_json(*section).dump(1) << '\n';
      else std::cout << section_text(*section);
      return 0;
    }
  }
  const auto entries = analysis::search_catalogue(options.query);
  if (entries.empty()) {
    const auto near = analysis::nearest_designations(options.query, 5);
    std::string message = fmt::format("no section matches '{}'", options.query);
    if (!near.empty()) message += fmt::format("; nearest: {}", fmt::join(near, ", "));
    message += ". Run 'stepframe sections' for the whole catalogue; hollow sections, angles and flats may also be "
               "written with their dimensions (SHS 100x100x5, CHS 219.1x8, L100x100x10, PL20x300).";
    spdlog::error("{}", message);
    if (options.json) std::cout << nlohmann::json{{"status", "error"}, {"message", message}, {"nearest", near}}.dump(1) << '\n';
    return bad_input;
  }
  if (options.json) {
    nlohmann::json list = nlohmann::json::array();
    for (const auto& e : entries)
      list.push_back({{"designation", e.designation}, {"family", e.family}, {"family_name", family_name(e.family)},
                      {"standard", e.standard}, {"alias", e.alias}});
    std::cout << nlohmann::json{{"query", options.query}, {"sections", list}, {"note", analysis::catalogue_caution}}.dump(1)
              << '\n';
  } else {
    std::cout << list_text(entries);
  }
  return 0;
}

}  // namespace stepframe::cli
