#include "init_command.hpp"

#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/units.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <fstream>
#include <iostream>
#include <limits>

namespace stepframe::cli {
namespace {

constexpr std::size_t max_listed = 25;  // per attribute kind; `stepframe inspect` lists them all

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

/// A CAD value as a quoted regular expression that matches exactly that value.
std::string quoted_pattern(const std::string& value) {
  std::string pattern;
  for (char c : value) {
    if (std::string_view(".^$|()[]{}*+?\\").find(c) != std::string_view::npos) pattern += '\\';
    pattern += c;
  }
  return yaml_quoted(pattern);
}

/// The project's length unit: the file's own when a project file can name it, else mm.
std::pair<std::string, double> project_length_unit(const std::string& file_unit) {
  if (const auto unit = parse_unit(file_unit); unit && unit->dimension == dimension::length)
    return {file_unit == "inch" ? "in" : file_unit == "foot" ? "ft" : file_unit, unit->si};
  return {"mm", 1e-3};
}

std::string number(double value) { return fmt::format("{:.6g}", std::abs(value) < 1e-12 ? 0.0 : value); }

/// The commented rule stubs for one attribute kind ("layer", "product", "name").
std::string rule_stubs(const Inspection& in, const std::string& kind, const std::string& heading) {
  const auto found = in.attribute_counts.find(kind);
  if (found == in.attribute_counts.end() || found->second.empty()) return "";
  std::vector<std::pair<std::string, std::size_t>> values(found->second.begin(), found->second.end());
  std::stable_sort(values.begin(), values.end(), [](const auto& a, const auto& b) { return a.second > b.second; });

  // One commented line: the YAML text, then its comment in a column of its own.
  const auto line = [](const std::string& yaml, const std::string& comment) {
    return fmt::format("#   {:<38}# {}\n", yaml, comment);
  };
  std::string out = "#   # " + heading + "\n";
  for (std::size_t i = 0; i < values.size() && i < max_listed; ++i) {
    const auto& [value, count] = values[i];
    out += line(fmt::format("- where: {{{}: {}}}", kind, quoted_pattern(value)),
                fmt::format("{} member{}", count, count == 1 ? "" : "s"));
    if (const auto section = analysis::find_catalogue_section(value))
      out += line("  section: " + section->designation, "recognised in the CAD value already");
    else
      out += line("  section: ...", "a catalogue designation (IPE300, HEB200, ...) or one under sections:");
    if (const auto material = analysis::find_standard_material(value))
      out += line("  material: " + material->name, "recognised in the CAD value already");
    else
      out += line("  material: ...", "S235, S275, S355, A992, A36 or one under materials:");
  }
  if (values.size() > max_listed)
    out += fmt::format("#   # ... and {} more (`stepframe inspect` lists them all)\n", values.size() - max_listed);
  return out;
}

}  // namespace

std::string starter_project(const Inspection& in, const std::filesystem::path& project_file) {
  const auto& wf = in.wireframe;
  const auto [unit, metres_per_unit] = project_length_unit(in.length_unit);

  std::error_code ec;
  auto model = std::filesystem::relative(in.file, project_file.parent_path().empty() ? "." : project_file.parent_path(), ec);
  if (ec || model.empty()) model = std::filesystem::absolute(in.file);

  std::string out;
  out += fmt::format("# stepframe project (v1), started by `stepframe init` from {}.\n", in.file.filename().string());
  out += fmt::format("# The model: {} members, {} nodes; the STEP file's length unit is {}.\n", wf.members.size(),
                     wf.nodes.size(), in.length_unit);
  out += "# It loads as written; before the results mean anything, give every member its section and\n"
         "# material (uncomment the rules you need), check the supports and add the loads.\n"
         "# README, \"Project file\", describes every key.\n\n";
  out += "model: " + yaml_quoted(model.generic_string()) + "\n";
  out += fmt::format("units: {{length: {}, force: kN, stress: MPa, line_load: kN/m}}\n", unit);
  out += fmt::format("merge_tolerance: {}           # {}, end points closer than this are one node\n",
                     number(in.merge_tolerance / metres_per_unit), unit);

  out += "\n# Sections and materials are taken from the CAD names, then products, then layers when they\n"
         "# hold a designation; rules set them explicitly, a later match overriding an earlier one.\n"
         "# rules:                                    # uncomment this line with the rules you keep\n"
         "#   - where: {}                             # every member\n"
         "#     material: S355\n";
  out += rule_stubs(in, "layer", "layers found in the model");
  out += rule_stubs(in, "product", "products (parts) found in the model");
  out += rule_stubs(in, "name", "names found in the model");

  out += "\nsupports:\n";
  if (wf.nodes.empty()) {
    out += "  []\n";
  } else {
    double low = std::numeric_limits<double>::infinity();
    for (const auto& p : wf.nodes) low = std::min(low, p.z());
    const auto count = std::count_if(wf.nodes.begin(), wf.nodes.end(),
                                     [&](const auto& p) { return p.z() - low <= in.merge_tolerance; });
    out += fmt::format("  # suggested: the {} lowest node{} (z = {} {}); check the fixity\n", count,
                       count == 1 ? "" : "s", number(low / metres_per_unit), unit);
    out += fmt::format("  - where: {{z: {}}}\n    fix: pinned                    # fixed | pinned | [ux, uy, uz, rx, ry, rz]\n",
                       number(low / metres_per_unit));
  }

  out += "\ncases:\n"
         "  - name: G                       # self weight: area x density x g along -Z\n"
         "    self_weight: true\n"
         "#   member_loads:\n"
         "#     - where: {layer: \"...\"}\n"
         "#       w: [0, 0, -2.0]            # kN/m, global axes\n"
         "#  - name: Q\n"
         "#    node_loads:\n"
         "#      - near: [0, 0, 0]           # the node nearest to this point\n"
         "#        force: [0, 0, -10]       # kN\n"
         "\n# combinations:\n"
         "#   - name: ULS\n"
         "#     factors: {G: 1.35, Q: 1.5}\n"
         "\n# Without checks: stresses under every combination (every case when there is none).\n"
         "# checks:\n"
         "#   stress: {combinations: [ULS]}\n"
         "#   deflection: {span_ratio: 300, combinations: [G]}\n";
  return out;
}

int init_command(const std::filesystem::path& model, std::filesystem::path project_file, bool force,
                 double tolerance_mm) {
  if (project_file.empty()) project_file = std::filesystem::path(model).replace_extension(".yaml");
  if (std::filesystem::exists(project_file) && !force) {
    spdlog::error("{}: the file exists already; choose another name with --output or overwrite it with --force",
                  project_file.string());
    return static_cast<int>(ExitStatus::bad_input);
  }
  try {
    const auto inspection = inspect_step(model, tolerance_mm * 1e-3);
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
    spdlog::info("wrote {}: {} members, {} nodes; fill in sections, materials and loads, then `stepframe run {}`",
                 project_file.string(), inspection.wireframe.members.size(), inspection.wireframe.nodes.size(),
                 project_file.string());
    return 0;
  } catch (const geometry::StepReadError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  }
}

}  // namespace stepframe::cli
