#include "init_command.hpp"

#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/counted.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/project.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/units.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <fstream>
#include <iostream>
#include <limits>
#include <map>

namespace stepframe::cli {
namespace {

constexpr std::size_t max_listed = 25;  // commented stubs per attribute kind; `stepframe inspect` lists them all

/// A YAML double-quoted string holding `text` exactly.
std::string yaml_quoted(const std::string& text) {
  std::string yaml = "\"";
  for (char c : text) {
    if (c == '"' || c == '\\') yaml += '\\';
    if (c == '\n') yaml += "\\n";
    else if (c == '\t') yaml += "\\t";
    else yaml += c;
  }
  return yaml + "\"";
}

/// A regular expression that matches exactly `value`.
std::string exact_pattern(const std::string& value) {
  std::string pattern;
  for (char c : value) {
    if (std::string_view(".^$|()[]{}*+?\\").find(c) != std::string_view::npos) pattern += '\\';
    pattern += c;
  }
  return pattern;
}

/// The units a project for a model drawn in `file_unit` is written in: the
/// file's own length unit, with US customary force and stress units for a
/// model drawn in feet or inches, SI ones otherwise.
struct StarterUnits {
  std::string length = "mm", force = "kN", stress = "MPa", line_load = "kN/m";
  double metres_per_length = 1e-3;
  double newtons_per_force = 1e3;
  double newtons_per_metre_per_line_load = 1e3;
  bool us_customary = false;
};

StarterUnits starter_units(const std::string& file_unit) {
  StarterUnits u;
  const auto unit = parse_unit(file_unit);
  if (!unit || !(unit->dimension == dimension::length)) return u;
  u.length = file_unit == "inch" ? "in" : file_unit == "foot" ? "ft" : file_unit;
  u.metres_per_length = unit->si;
  if (u.length == "in" || u.length == "ft") {
    u.us_customary = true;
    u.force = "kip", u.stress = "ksi", u.line_load = "kip/ft";
    u.newtons_per_force = parse_unit("kip")->si;
    u.newtons_per_metre_per_line_load = parse_unit("kip/ft")->si;
  }
  return u;
}

std::string number(double value) { return fmt::format("{:.4g}", std::abs(value) < 1e-12 ? 0.0 : value); }

/// One YAML line with its comment in a column of its own.
std::string commented(const std::string& yaml, const std::string& comment) {
  return fmt::format("{:<39} # {}\n", yaml, comment);
}

/// The same line as a stub: commented out, its comment in the same column.
std::string stub(const std::string& yaml, const std::string& comment) {
  return fmt::format("#{:<38} # {}\n", yaml, comment);
}

using Values = std::vector<std::pair<std::string, std::size_t>>;  // attribute value, member count

/// The values of one attribute kind ("layer", "product", "name"), most members first.
Values values_of(const Inspection& in, const std::string& kind) {
  const auto found = in.attribute_counts.find(kind);
  if (found == in.attribute_counts.end()) return {};
  Values values(found->second.begin(), found->second.end());
  std::stable_sort(values.begin(), values.end(), [](const auto& a, const auto& b) { return a.second > b.second; });
  return values;
}

std::string where_line(const std::string& kind, const std::string& value) {
  return fmt::format("  - where: {{{}: {}}}", kind, yaml_quoted(exact_pattern(value)));
}

constexpr const char* kinds[] = {"layer", "product", "name"};  // later rules override earlier ones: names win

/// The rules of the starter project: a material for every member, a section
/// for every value that names one, and placeholders for members without.
struct StarterRules {
  std::string material;    ///< the rule giving every member a material, YAML
  std::string recognised;  ///< the rules of the recognised designations and grades, YAML
  Project project;         ///< the same rules, to see which members they leave without a section
};

StarterRules active_rules(const Inspection& in, const StarterUnits& units) {
  StarterRules out;
  auto& rules = out.project.rules;
  const std::string grade = units.us_customary ? "A992" : "S355";
  out.material += commented("  - where: {}", "every member");
  out.material += commented(fmt::format("    material: {}", grade),
                        "CHECK: assumed for every member; put the grade you build with");
  rules.push_back({});
  rules.back().material = grade;
  for (const char* kind : kinds)
    for (const auto& [value, count] : values_of(in, kind)) {
      const auto section = designation_in(value);
      const auto material = material_in(value);
      if (!section && !material) continue;
      out.recognised += commented(where_line(kind, value), counted(count, "member"));
      if (section) out.recognised += commented("    section: " + *section, "recognised in the CAD " + std::string(kind));
      if (material)
        out.recognised += commented("    material: " + *material, "recognised in the CAD " + std::string(kind));
      Rule rule;
      (std::string(kind) == "layer" ? rule.where.layer : std::string(kind) == "product" ? rule.where.product
                                                                                        : rule.where.name) =
          exact_pattern(value);
      rule.section = section;
      rule.material = material;
      rules.push_back(rule);
    }
  return out;
}

/// Placeholder rules, put before the recognised ones, for the members that
/// neither a recognised rule nor their own attributes give a section: one per
/// layer (else product, else name) of such members.
std::string placeholder_rules(const Inspection& in, const StarterRules& rules, const StarterUnits& units) {
  std::vector<std::pair<std::string, std::string>> groups;  // (kind, value), first seen first
  std::map<std::pair<std::string, std::string>, std::size_t> counts;
  bool anonymous = false;
  for (const auto& u : members_without_properties(rules.project, in.wireframe)) {
    const auto& src = in.wireframe.members[u.member].source;
    std::pair<std::string, std::string> group;
    if (!src.layers.empty()) group = {"layer", src.layers.front()};
    else if (!src.product.empty()) group = {"product", src.product};
    else if (!src.name.empty()) group = {"name", src.name};
    else {
      anonymous = true;
      continue;
    }
    if (counts[group]++ == 0) groups.push_back(group);
  }
  const std::string placeholder = units.us_customary ? "HSS4X4X1/4" : "SHS100X100X5";
  const std::string note = "CHECK: a placeholder; no designation in the CAD attributes";
  std::string out;
  if (anonymous)
    out += commented("  - where: {}", "members with no name, layer or product") +
           commented("    section: " + placeholder, note);
  for (const auto& group : groups) {
    out += commented(where_line(group.first, group.second), counted(counts[group], "member") + " without a designation");
    out += commented("    section: " + placeholder, note);
  }
  return out;
}

/// Commented stubs, one per attribute value not used above, that uncomment into valid rules.
std::string rule_stubs(const Inspection& in, const std::string& placeholders, const StarterUnits& units) {
  const std::string example = units.us_customary ? "W12X26" : "IPE300";
  std::string out;
  for (const char* kind : kinds) {
    const auto values = values_of(in, kind);
    std::size_t listed = 0, left = 0;
    for (const auto& [value, count] : values) {
      if (designation_in(value) || material_in(value) || placeholders.find(where_line(kind, value)) != std::string::npos)
        continue;
      if (listed == max_listed) {
        ++left;
        continue;
      }
      ++listed;
      out += stub(where_line(kind, value), counted(count, "member"));
      out += stub("    section: " + example, "an example: put these members' designation");
    }
    if (left > 0) out += fmt::format("# ... and {} more {}s (`stepframe inspect` lists them all)\n", left, kind);
  }
  return out;
}

/// The value of a member selector that matches the most members, for the load stubs.
std::string busiest_selector(const Inspection& in) {
  for (const char* kind : {"layer", "name", "product"})
    if (const auto values = values_of(in, kind); !values.empty())
      return fmt::format("{{{}: {}}}", kind, yaml_quoted(exact_pattern(values.front().first)));
  return "{}";
}

}  // namespace

std::string starter_project(const Inspection& in, const std::filesystem::path& project_file) {
  const auto& wf = in.wireframe;
  const StarterUnits units = starter_units(in.length_unit);
  const double per_length = units.metres_per_length;
  const auto length = [&](double metres) { return number(metres / per_length); };

  std::error_code ec;
  auto model = std::filesystem::relative(in.file, project_file.parent_path().empty() ? "." : project_file.parent_path(), ec);
  if (ec || model.empty()) model = std::filesystem::absolute(in.file);

  std::string out;
  out += fmt::format("# stepframe project (v1), started by `stepframe init` from {}.\n", in.file.filename().string());
  out += fmt::format("# The model: {}, {}; the STEP file's length unit is {}.\n", counted(wf.members.size(), "member"),
                     counted(wf.nodes.size(), "node"), in.length_unit);
  out += "# It runs as written, under self weight only. Before the results mean anything, review every\n"
         "# line marked CHECK, check the supports and add the loads. A line that starts with '#' straight\n"
         "# before its YAML (no space, or the YAML's own indent) is a stub: delete that '#' to use it.\n"
         "# README, \"Project file\", describes every key.\n\n";
  out += "model: " + yaml_quoted(model.generic_string()) + "\n";
  out += fmt::format("units: {{length: {}, force: {}, stress: {}, line_load: {}}}\n", units.length, units.force,
                     units.stress, units.line_load);
  out += commented("merge_tolerance: " + length(in.merge_tolerance),
                   units.length + "; end points closer than this are one node");

  const StarterRules rules = active_rules(in, units);
  out += "\n# A member's section and material: the last rule that matches it, else a designation or grade\n"
         "# found in its CAD name, product or layers.\n"
         "rules:\n";
  const std::string placeholders = placeholder_rules(in, rules, units);
  out += rules.material + placeholders + rules.recognised;
  out += rule_stubs(in, placeholders, units);

  out += "\nsupports:\n";
  Eigen::Vector3d top = Eigen::Vector3d::Zero();
  if (wf.nodes.empty()) {
    out += "  []\n";
  } else {
    double low = std::numeric_limits<double>::infinity();
    for (const auto& p : wf.nodes) low = std::min(low, p.z());
    top = *std::max_element(wf.nodes.begin(), wf.nodes.end(), [](const auto& a, const auto& b) { return a.z() < b.z(); });
    const auto count = static_cast<std::size_t>(std::count_if(
        wf.nodes.begin(), wf.nodes.end(), [&](const auto& p) { return p.z() - low <= in.merge_tolerance; }));
    out += commented(fmt::format("  - where: {{z: {}}}", length(low)),
                     fmt::format("CHECK: the {} lowest {}", count, count == 1 ? "node" : "nodes"));
    // A frame drawn in one vertical plane turns about its bases' line on pins: hold it out of its plane.
    Eigen::Vector3d lo = wf.nodes.front(), hi = wf.nodes.front();
    for (const auto& p : wf.nodes) lo = lo.cwiseMin(p), hi = hi.cwiseMax(p);
    const double flat = in.merge_tolerance;
    if (hi.y() - lo.y() <= flat && hi.x() - lo.x() > flat)
      out += commented("    fix: [ux, uy, uz, rx, rz]", "CHECK: pinned in the frame's x-z plane, held out of it");
    else if (hi.x() - lo.x() <= flat && hi.y() - lo.y() > flat)
      out += commented("    fix: [ux, uy, uz, ry, rz]", "CHECK: pinned in the frame's y-z plane, held out of it");
    else
      out += commented("    fix: pinned", "fixed | pinned | [ux, uy, uz, rx, ry, rz]");
  }

  // Example loads in the project's units: 2 kN/m on the busiest group, 10 kN at the highest node.
  const std::string w = number(-2e3 / units.newtons_per_metre_per_line_load);
  const std::string force = number(-10e3 / units.newtons_per_force);
  out += "\ncases:\n";
  out += commented("  - name: G", "self weight: area x density x g along -Z");
  out += "    self_weight: true\n";
  out += "#    member_loads:\n";
  out += stub("      - where: " + busiest_selector(in), "an example: put the real loads");
  out += stub(fmt::format("        w: [0, 0, {}]", w), units.line_load + ", global axes");
  out += stub("  - name: Q", "an imposed load case");
  out += "#    node_loads:\n";
  out += stub(fmt::format("      - near: [{}, {}, {}]", length(top.x()), length(top.y()), length(top.z())),
                         "the node nearest to this point");
  out += stub(fmt::format("        force: [0, 0, {}]", force), units.force);

  out += "\n# Partial factors of EN 1990 (6.10) with G unfavourable; use those your code and project ask for.\n"
         "combinations:\n"
         "  - name: ULS\n"
         "    factors:\n"
         "      G: 1.35\n"
         "#      Q: 1.5\n" +
         commented("  - name: SLS", "serviceability, characteristic values") +
         "    factors:\n"
         "      G: 1.0\n"
         "#      Q: 1.0\n";

  out += "\nchecks:\n"
         "  stress: {combinations: [ULS]}\n"
         "  en1993: {combinations: [ULS]}\n" +
         commented("  deflection: {span_ratio: 300, combinations: [SLS]}", "CHECK: the limit the project agrees") +
         "#  stability: {alpha_cr_min: 10, combinations: [ULS]}\n"
         "#  drift: {storey_ratio: 300, combinations: [SLS]}\n";
  return out;
}

int init_command(const std::filesystem::path& model, std::filesystem::path project_file, bool force,
                 double tolerance_mm, const geometry::StepReadOptions& read) {
  if (project_file.empty()) project_file = std::filesystem::path(model).replace_extension(".yaml");
  if (std::filesystem::exists(project_file) && !force) {
    spdlog::error("{}: the file exists already; choose another name with --output or overwrite it with --force",
                  project_file.string());
    return static_cast<int>(ExitStatus::bad_input);
  }
  try {
    const auto inspection = inspect_step(model, tolerance_mm * 1e-3, read);
    const auto text = starter_project(inspection, project_file);
    const auto temporary = project_file.string() + ".tmp";
    {
      std::ofstream out(temporary);
      out << text;
      if (!out.flush()) {
        spdlog::error("{}: cannot write the project file; check the folder exists and is writable",
                      project_file.string());
        return static_cast<int>(ExitStatus::bad_input);
      }
    }
    std::filesystem::rename(temporary, project_file);
    std::cout << project_file.string() << '\n';
    spdlog::info("wrote {}: {}, {}; review the lines marked CHECK, add the loads, then `stepframe run {}`",
                 project_file.string(), counted(inspection.wireframe.members.size(), "member"),
                 counted(inspection.wireframe.nodes.size(), "node"), project_file.string());
    return 0;
  } catch (const geometry::StepReadError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  }
}

}  // namespace stepframe::cli
