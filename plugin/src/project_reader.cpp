#include "stepframe/project_reader.hpp"

#include "stepframe/analysis/element_releases.hpp"
#include "stepframe/analysis/section_shapes.hpp"
#include "stepframe/geometry/wireframe.hpp"

#include "project_blocks.hpp"
#include "project_text.hpp"
#include "selector_pattern.hpp"
#include "project_yaml.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/suggest.hpp"
#include "stepframe/units.hpp"

#include <fmt/format.h>
#include <yaml-cpp/yaml.h>

#include <cmath>
#include <numbers>
#include <set>
#include <sstream>

namespace stepframe {

std::string SourceLine::describe() const {
  std::string out = file.string();
  if (line > 0) out += ":" + std::to_string(line);
  if (!key.empty()) out += " (" + key + ")";
  return out;
}

namespace {

using detail::Reader;

UnitSystem read_units(const Reader& r, const YAML::Node& node) {
  UnitSystem units;
  if (!node) return units;
  r.check_keys(node, "units", {"length", "force", "stress", "line_load"});
  auto unit_of = [&](const char* key, Dimension dim, const char* choices) -> std::pair<Unit, std::string> {
    const auto name = r.text(node[key], std::string("units.") + key);
    const auto unit = parse_unit(name);
    if (!unit || !(unit->dimension == dim))
      r.fail(node[key], std::string("units.") + key,
             "'" + name + "' is not a " + describe(dim) + " unit; use one of " + choices);
    return {*unit, name};
  };
  if (node["length"]) std::tie(units.length, units.length_name) = unit_of("length", dimension::length, "mm, cm, m, in, ft");
  if (node["force"]) std::tie(units.force, units.force_name) = unit_of("force", dimension::force, "N, kN, lbf, kip");
  if (node["stress"]) {
    auto [unit, name] = unit_of("stress", dimension::stress, "Pa, kPa, MPa, GPa, N/mm2, psi, ksi");
    units.stress = unit;
    units.stress_name = name;
  }
  if (node["line_load"]) {
    auto [unit, name] = unit_of("line_load", dimension::line_load, "N/m, kN/m, N/mm, lbf/ft, kip/ft");
    units.line_load = unit;
    units.line_load_name = name;
  }
  return units;
}

// Plausibility bounds catch a wrong unit (a factor of 1000) long before it
// reaches results: common practice for input screening.
void check_range(const Reader& r, const YAML::Node& node, const std::string& key, double value, double low,
                 double high, const std::string& unit_hint) {
  if (value >= low && value <= high) return;
  std::ostringstream what;
  what << "value " << value << " (SI) is outside the plausible range " << low << " to " << high
       << "; check the units: " << unit_hint;
  r.fail(node, key, what.str());
}

analysis::Material read_material(const Reader& r, const YAML::Node& node, const std::string& path,
                                 const std::string& name) {
  r.check_keys(node, path, {"E", "G", "fy", "density"});
  for (const char* key : {"E", "G", "fy", "density"})
    if (!node[key]) r.fail(node, path, std::string("material '") + name + "' needs " + key);
  analysis::Material m;
  m.name = name;
  m.E = r.number(node["E"], path + ".E", dimension::stress);
  m.G = r.number(node["G"], path + ".G", dimension::stress);
  m.fy = r.number(node["fy"], path + ".fy", dimension::stress);
  m.density = r.number(node["density"], path + ".density", dimension::density);
  const std::string hint = "bare stresses are read in " + r.units_.describe_bare(dimension::stress) +
                           "; write e.g. \"210 GPa\" or set units.stress";
  check_range(r, node["E"], path + ".E", m.E, 1e9, 1e12, hint);
  check_range(r, node["G"], path + ".G", m.G, 1e9, 1e12, hint);
  check_range(r, node["fy"], path + ".fy", m.fy, 1e7, 5e9, hint);
  check_range(r, node["density"], path + ".density", m.density, 500, 25000, "bare densities are kg/m3");
  return m;
}

analysis::Section read_section(const Reader& r, const YAML::Node& node, const std::string& path,
                               const std::string& name) {
  r.check_keys(node, path, {"A", "Iy", "Iz", "J", "depth", "width", "torsion_modulus", "thickest_plate"});
  analysis::Section s;
  s.designation = name;
  const std::pair<const char*, double*> fields[] = {{"A", &s.A},   {"Iy", &s.Iy},       {"Iz", &s.Iz},
                                                    {"J", &s.J},   {"depth", &s.depth}, {"width", &s.width}};
  for (const auto& [key, target] : fields) {
    if (!node[key])
      r.fail(node, path,
             "section '" + name + "' needs " + key + " (A, Iy, Iz, J, depth and width are all required)");
    const std::string k = std::string(key);
    const Dimension dim = k == "A" ? dimension::area
                          : (k == "depth" || k == "width") ? dimension::length
                                                           : dimension::second_moment;
    *target = r.number(node[key], path + "." + k, dim);
    if (!(*target > 0)) r.fail(node[key], path + "." + k, "must be positive");
    // Far beyond any rolled or built-up steel member either way: a wrong unit (common practice).
    const double low = dim == dimension::area ? 1e-8 : dim == dimension::length ? 1e-4 : 1e-16;
    const double high = dim == dimension::area ? 10.0 : dim == dimension::length ? 20.0 : 100.0;
    check_range(r, node[key], path + "." + k, *target, low, high,
                "bare values are read in " + r.units_.describe_bare(dim) + "; write e.g. " + r.example(dim));
  }
  // A depth x width outline with its corners as stress points, for the 3D view and fibre stresses.
  analysis::Section section = analysis::custom_section(name, s.A, s.Iy, s.Iz, s.J, s.depth, s.width);
  // Torsional shear stress: T / torsion_modulus, or T t / J with the thickest plate t (thin open sections).
  if (const auto wt = node["torsion_modulus"]) {
    section.Wt = r.number(wt, path + ".torsion_modulus", dimension::section_modulus);
    if (!(section.Wt > 0)) r.fail(wt, path + ".torsion_modulus", "must be positive (T / tau_max)");
  }
  if (const auto t = node["thickest_plate"]) {
    section.t_max = r.number(t, path + ".thickest_plate", dimension::length);
    if (!(section.t_max > 0 && section.t_max <= std::min(s.depth, s.width)))
      r.fail(t, path + ".thickest_plate", "must be positive and no larger than the section's depth and width");
  }
  return section;
}

// Selectors: `where:` holds the keys that choose members (rules, member loads) or nodes (supports,
// node loads, settlements); the item's other keys stand beside it. A key written on the wrong
// level gets a message with the form it belongs in.
const std::vector<std::string> member_selector_keys{"name", "layer", "product", "colour"};
const std::vector<std::string> node_selector_keys{"x", "y", "z", "near", "point_name", "point_layer"};
// The keys that stand beside `where:` in rules, loads, supports and settlements.
const std::vector<std::string> item_keys{"section", "material", "roll", "orient_to", "release", "buckling",
                                         "deflection_ratio", "join_crossings", "w", "w_end", "from", "to",
                                         "point", "at", "axes", "fix", "springs", "force", "moment", "displacement"};
enum class Selects { members, nodes };

bool one_of(const std::string& key, const std::vector<std::string>& keys) {
  return std::find(keys.begin(), keys.end(), key) != keys.end();
}

// A value as written, for messages: a scalar, or a flat list such as [0, 0, 0].
std::string as_written(const YAML::Node& value) {
  if (value.IsScalar()) return value.Scalar();
  if (!value.IsSequence()) return "...";
  std::string text;
  for (std::size_t i = 0; i < value.size(); ++i)
    text += (i ? ", " : "") + (value[i].IsScalar() ? value[i].Scalar() : std::string("..."));
  return "[" + text + "]";
}

std::string how_to_select(Selects selects) {
  return selects == Selects::nodes
             ? "choose nodes with where: {z: 0} (planes x, y, z), near: [x, y, z] or where: {point_name: ...}"
             : "choose members with where: {layer: ...} (name, layer, product, colour)";
}

// A selector key of the other kind: `layer` for a support, `z` for a rule.
[[noreturn]] void fail_wrong_kind(const Reader& r, const YAML::Node& key_node, const std::string& path,
                                  const std::string& key, Selects selects) {
  const bool nodes = selects == Selects::nodes;
  r.fail(key_node, Reader::join(path, key),
         "'" + key + "' chooses " + (nodes ? "members" : "nodes") + ", but this item applies to " +
             (nodes ? "nodes" : "members") + ": " + how_to_select(selects));
}

// check_keys for an item that selects with `where:` (a rule, a load, a support, a settlement).
void check_item_keys(const Reader& r, const YAML::Node& item, const std::string& path,
                     const std::vector<std::string>& allowed, Selects selects) {
  const auto& own = selects == Selects::nodes ? node_selector_keys : member_selector_keys;
  const auto& other = selects == Selects::nodes ? member_selector_keys : node_selector_keys;
  if (item.IsMap())
    for (const auto& entry : item) {
      const auto key = entry.first.as<std::string>();
      if (one_of(key, allowed)) continue;
      if (one_of(key, own))
        r.fail(entry.first, Reader::join(path, key),
               "'" + key + "' goes inside where: write where: {" + key + ": " + as_written(entry.second) + "}");
      if (one_of(key, other)) fail_wrong_kind(r, entry.first, path, key, selects);
    }
  r.check_keys(item, path, allowed);
}

// check_keys for a `where:` selector: an item's own key written inside it belongs beside it.
void check_selector_keys(const Reader& r, const YAML::Node& where, const std::string& path, Selects selects) {
  const auto& own = selects == Selects::nodes ? node_selector_keys : member_selector_keys;
  const auto& other = selects == Selects::nodes ? member_selector_keys : node_selector_keys;
  if (where.IsMap())
    for (const auto& entry : where) {
      const auto key = entry.first.as<std::string>();
      if (one_of(key, own)) continue;
      if (one_of(key, other)) fail_wrong_kind(r, entry.first, path, key, selects);
      if (one_of(key, item_keys))
        r.fail(entry.first, Reader::join(path, key),
               "'" + key + "' goes beside where:, not inside it: write `- where: {...}` and, on the next line at "
               "the indent of where:, `" + key + ": " + as_written(entry.second) + "`");
    }
  r.check_keys(where, path, own);
}

// The nodes a support, node load or settlement applies to: `where: {...}`, or the
// shorthand `near: [x, y, z]` beside the item's other keys, alike in all three.
NodeSelector read_node_selector(const Reader& r, const YAML::Node& node, const std::string& path);
NodeSelector read_node_target(const Reader& r, const YAML::Node& item, const std::string& path,
                              const std::string& what) {
  if (item["near"] && item["where"]) r.fail(item, path, "use either 'near' or 'where', not both");
  if (item["near"]) {
    NodeSelector sel;
    sel.origin = r.where(item["near"], path + ".near");
    sel.near = r.vector3(item["near"], path + ".near", dimension::length);
    return sel;
  }
  if (!item["where"]) r.fail(item, path, what + " needs its nodes: " + how_to_select(Selects::nodes));
  return read_node_selector(r, item["where"], path + ".where");
}

MemberSelector read_member_selector(const Reader& r, const YAML::Node& node, const std::string& path) {
  MemberSelector sel;
  sel.origin = r.where(node, path);
  if (!node) return sel;
  if (node.IsNull()) return sel;
  check_selector_keys(r, node, path, Selects::members);
  const std::pair<const char*, std::optional<std::string>*> fields[] = {
      {"name", &sel.name}, {"layer", &sel.layer}, {"product", &sel.product}, {"colour", &sel.colour}};
  for (const auto& [key, target] : fields) {
    if (!node[key]) continue;
    const auto pattern = r.text(node[key], path + "." + key);
    try {
      const detail::SelectorPattern check(pattern);
    } catch (const std::invalid_argument& e) {
      r.fail(node[key], path + "." + key, "'" + pattern + "' is not a valid regular expression (" + e.what() + ")");
    }
    *target = pattern;
  }
  return sel;
}

NodeSelector read_node_selector(const Reader& r, const YAML::Node& node, const std::string& path) {
  NodeSelector sel;
  sel.origin = r.where(node, path);
  check_selector_keys(r, node, path, Selects::nodes);
  for (const char* key : {"point_name", "point_layer"}) {
    if (!node[key]) continue;
    if (node["near"] || node["x"] || node["y"] || node["z"])
      r.fail(node, path, std::string("use either '") + key + "' or coordinates (near, x, y, z), not both");
    const auto pattern = r.text(node[key], path + "." + key);
    try {
      const detail::SelectorPattern check(pattern);
    } catch (const std::invalid_argument& e) {
      r.fail(node[key], path + "." + key, "'" + pattern + "' is not a valid regular expression (" + e.what() + ")");
    }
    (std::string(key) == "point_name" ? sel.point_name : sel.point_layer) = pattern;
  }
  if (sel.point_name || sel.point_layer) return sel;
  if (node["near"]) {
    if (node["x"] || node["y"] || node["z"])
      r.fail(node, path, "use either 'near' or planes (x, y, z), not both");
    sel.near = r.vector3(node["near"], path + ".near", dimension::length);
  }
  if (node["x"]) sel.x = r.number(node["x"], path + ".x", dimension::length);
  if (node["y"]) sel.y = r.number(node["y"], path + ".y", dimension::length);
  if (node["z"]) sel.z = r.number(node["z"], path + ".z", dimension::length);
  if (!sel.near && !sel.x && !sel.y && !sel.z)
    r.fail(node, path,
           "give a plane such as {z: 0}, a point such as {near: [0, 0, 0]} or a named point such as "
           "{point_name: BASE-A}");
  return sel;
}

std::array<bool, 6> read_fixity(const Reader& r, const YAML::Node& node, const std::string& path) {
  static const std::vector<std::string> names{"ux", "uy", "uz", "rx", "ry", "rz"};
  std::array<bool, 6> fixed{};
  if (!node) r.fail(node, path, "a support needs 'fix': fixed, pinned or a list such as [ux, uy, uz]");
  if (node.IsScalar()) {
    const auto kind = node.Scalar();
    if (kind == "fixed") fixed.fill(true);
    else if (kind == "pinned") fixed = {true, true, true, false, false, false};
    else r.fail(node, path, "'" + kind + "' is not fixed, pinned or a list such as [ux, uy, uz]");
    return fixed;
  }
  r.expect_list(node, path);
  for (std::size_t i = 0; i < node.size(); ++i) {
    const auto dof = r.text(node[i], Reader::index(path, i));
    const auto it = std::find(names.begin(), names.end(), dof);
    if (it == names.end())
      r.fail(node[i], Reader::index(path, i), "'" + dof + "' is not one of ux, uy, uz, rx, ry, rz" + did_you_mean(dof, names));
    fixed[static_cast<std::size_t>(it - names.begin())] = true;
  }
  return fixed;
}

// A list of direction names (ux uy uz rx ry rz) as flags.
std::array<bool, 6> read_directions(const Reader& r, const YAML::Node& node, const std::string& path) {
  static const std::vector<std::string> names{"ux", "uy", "uz", "rx", "ry", "rz"};
  std::array<bool, 6> flags{};
  r.expect_list(node, path);
  for (std::size_t i = 0; i < node.size(); ++i) {
    const auto dof = r.text(node[i], Reader::index(path, i));
    const auto it = std::find(names.begin(), names.end(), dof);
    if (it == names.end())
      r.fail(node[i], Reader::index(path, i), "'" + dof + "' is not one of ux, uy, uz, rx, ry, rz" + did_you_mean(dof, names));
    flags[static_cast<std::size_t>(it - names.begin())] = true;
  }
  return flags;
}

// Per-direction values {ux: ..., ry: ...}: translations in `translation`, rotations in `rotation`.
std::array<std::optional<double>, 6> read_per_direction(const Reader& r, const YAML::Node& node, const std::string& path,
                                                        Dimension translation, Dimension rotation) {
  static const std::vector<std::string> names{"ux", "uy", "uz", "rx", "ry", "rz"};
  r.check_keys(node, path, names);
  std::array<std::optional<double>, 6> values{};
  for (std::size_t d = 0; d < 6; ++d)
    if (node[names[d]]) values[d] = r.number(node[names[d]], path + "." + names[d], d < 3 ? translation : rotation);
  return values;
}

MemberLoadSpec read_member_load(const Reader& r, const YAML::Node& node, const std::string& p) {
  check_item_keys(r, node, p, {"where", "w", "w_end", "from", "to", "point", "at", "axes"}, Selects::members);
  MemberLoadSpec load;
  load.where = read_member_selector(r, node["where"], p + ".where");
  if (node["w"] && node["point"]) r.fail(node, p, "a member load is either distributed (w) or a point load (point), not both");
  if (node["point"]) {
    if (!node["at"]) r.fail(node, p, "a point load needs at: its distance from the member's start");
    if (node["w_end"] || node["from"] || node["to"])
      r.fail(node, p, "w_end, from and to belong to distributed loads; a point load has point and at");
    load.w = r.vector3(node["point"], p + ".point", dimension::force);
    load.at = r.number(node["at"], p + ".at", dimension::length);
    if (*load.at < 0) r.fail(node["at"], p + ".at", "must not be negative (a distance from the member's start)");
  } else {
    if (!node["w"])
      r.fail(node, p, "a member load needs w: [wx, wy, wz] (force per length) or point: [fx, fy, fz] with at:");
    if (node["at"]) r.fail(node["at"], p + ".at", "'at' belongs to point loads; use from/to for a distributed load");
    load.w = r.vector3(node["w"], p + ".w", dimension::line_load);
    if (node["w_end"]) load.w_end = r.vector3(node["w_end"], p + ".w_end", dimension::line_load);
    if (node["from"]) load.from = r.number(node["from"], p + ".from", dimension::length);
    if (node["to"]) load.to = r.number(node["to"], p + ".to", dimension::length);
    if (load.from && *load.from < 0) r.fail(node["from"], p + ".from", "must not be negative (a distance from the member's start)");
    if (load.from && load.to && !(*load.to > *load.from))
      r.fail(node["to"], p + ".to", "must be greater than 'from'");
  }
  if (node["axes"]) {
    const auto axes = r.text(node["axes"], p + ".axes");
    if (axes == "global") load.axes = LoadAxesSpec::global;
    else if (axes == "local") load.axes = LoadAxesSpec::local;
    else if (axes == "projected") load.axes = LoadAxesSpec::projected;
    else r.fail(node["axes"], p + ".axes", "'" + axes + "' is not global, local or projected");
    if (load.axes == LoadAxesSpec::projected && load.at)
      r.fail(node["axes"], p + ".axes", "a point load is a force, not a load per projected length; use global or local");
  }
  return load;
}

CaseSpec read_case(const Reader& r, const YAML::Node& node, const std::string& path) {
  r.check_keys(node, path,
               {"name", "self_weight", "member_loads", "node_loads", "settlements", "area_loads", "category", "group", "psi"});
  CaseSpec c;
  c.origin = r.where(node, path);
  if (!node["name"]) r.fail(node, path, "a load case needs a name");
  c.name = r.text(node["name"], path + ".name");
  if (const auto category = node["category"]) {
    const auto name = r.text(category, path + ".category");
    c.category = analysis::parse_category(name);
    if (!c.category)
      r.fail(category, path + ".category",
             "'" + name + "' is not a category" + did_you_mean(name, analysis::category_names()) +
                 " (permanent, imposed_A to imposed_H, snow, snow_high, wind, temperature, rain, accidental)");
  }
  if (node["group"]) c.group = r.text(node["group"], path + ".group");
  if (node["area_loads"]) c.area_loads = detail::read_area_loads(r, node["area_loads"], path + ".area_loads");
  if (node["psi"]) c.psi = detail::read_psi(r, node["psi"], path + ".psi");
  if (node["self_weight"]) c.self_weight = r.boolean(node["self_weight"], path + ".self_weight");
  if (const auto loads = node["member_loads"]) {
    r.expect_list(loads, path + ".member_loads");
    for (std::size_t i = 0; i < loads.size(); ++i) {
      c.member_loads.push_back(read_member_load(r, loads[i], Reader::index(path + ".member_loads", i)));
    }
  }
  if (const auto list = node["settlements"]) {
    r.expect_list(list, path + ".settlements");
    for (std::size_t i = 0; i < list.size(); ++i) {
      const auto p = Reader::index(path + ".settlements", i);
      check_item_keys(r, list[i], p, {"where", "near", "displacement"}, Selects::nodes);
      SettlementSpec s;
      s.where = read_node_target(r, list[i], p, "a settlement");
      if (!list[i]["displacement"]) r.fail(list[i], p, "a settlement needs displacement: {uz: -10} (lengths; rotations in rad)");
      s.value = read_per_direction(r, list[i]["displacement"], p + ".displacement", dimension::length, dimension::none);
      c.settlements.push_back(std::move(s));
    }
  }
  if (const auto loads = node["node_loads"]) {
    r.expect_list(loads, path + ".node_loads");
    for (std::size_t i = 0; i < loads.size(); ++i) {
      const auto p = Reader::index(path + ".node_loads", i);
      check_item_keys(r, loads[i], p, {"where", "near", "force", "moment"}, Selects::nodes);
      NodeLoadSpec load;
      load.where = read_node_target(r, loads[i], p, "a node load");
      if (!loads[i]["force"] && !loads[i]["moment"]) r.fail(loads[i], p, "a node load needs force and/or moment");
      if (loads[i]["force"]) load.force = r.vector3(loads[i]["force"], p + ".force", dimension::force);
      if (loads[i]["moment"]) load.moment = r.vector3(loads[i]["moment"], p + ".moment", dimension::moment);
      c.node_loads.push_back(std::move(load));
    }
  }
  return c;
}

// The shared core of read_project and read_project_text: `file` names the
// project in messages, `base_dir` is where a relative `model:` is found.
Project read_project_root(const YAML::Node& root, const std::filesystem::path& file,
                          const std::filesystem::path& base_dir) {
  Reader r(file);
  if (!root.IsMap()) throw InputError(file.string() + ": a project file is a YAML mapping with at least 'model:'");
  r.check_keys(root, "", {"model", "units", "merge_tolerance", "curve_max_turn", "join_crossings", "materials", "sections",
                          "rules", "supports", "cases", "combinations", "checks", "analysis", "outputs", "masses",
                          "fabrication", "suggest"});
  r.units_ = read_units(r, root["units"]);

  Project p;
  p.file = file;
  p.length_unit = r.units_.length_name;
  p.force_unit = r.units_.force_name;
  if (!root["model"]) r.fail(root, "model", "the project needs 'model:' naming the STEP file");
  p.model = base_dir / r.text(root["model"], "model");

  if (root["merge_tolerance"]) {
    p.merge_tolerance = r.number(root["merge_tolerance"], "merge_tolerance", dimension::length);
    if (!(p.merge_tolerance > 0)) r.fail(root["merge_tolerance"], "merge_tolerance", "must be positive");
    // End points closer than this are one node: beyond a metre whole members would vanish.
    if (p.merge_tolerance > geometry::max_merge_tolerance)
      r.fail(root["merge_tolerance"], "merge_tolerance",
             "must be at most 1 m: end points closer than this become one node, so whole members would vanish; "
             "a few millimetres is usual, e.g. \"1 mm\"");
  }
  if (root["curve_max_turn"]) {
    // Degrees of tangent turn per element of a curved member (arcs, splines).
    const double degrees = r.number(root["curve_max_turn"], "curve_max_turn", dimension::none);
    if (!(degrees > 0 && degrees <= 90))
      r.fail(root["curve_max_turn"], "curve_max_turn", "must be an angle in degrees above 0 and at most 90, e.g. 5");
    p.curve_max_turn = degrees * std::numbers::pi / 180.0;
  }
  if (root["join_crossings"]) p.join_crossings = r.boolean(root["join_crossings"], "join_crossings");

  if (const auto node = root["materials"]) {
    r.expect_map(node, "materials");
    for (const auto& item : node) {
      const auto name = item.first.as<std::string>();
      p.materials[name] = read_material(r, item.second, "materials." + name, name);
    }
  }
  if (const auto node = root["sections"]) {
    r.expect_map(node, "sections");
    for (const auto& item : node) {
      const auto name = item.first.as<std::string>();
      p.sections[name] = read_section(r, item.second, "sections." + name, name);
    }
  }

  if (const auto node = root["rules"]) {
    r.expect_list(node, "rules");
    for (std::size_t i = 0; i < node.size(); ++i) {
      const auto path = Reader::index("rules", i);
      check_item_keys(r, node[i], path,
                      {"where", "section", "material", "roll", "orient_to", "release", "buckling", "deflection_ratio",
                       "join_crossings"},
                      Selects::members);
      Rule rule;
      rule.where = read_member_selector(r, node[i]["where"], path + ".where");
      if (node[i]["section"]) rule.section = r.text(node[i]["section"], path + ".section");
      if (node[i]["material"]) rule.material = r.text(node[i]["material"], path + ".material");
      if (node[i]["roll"])
        rule.roll = r.number(node[i]["roll"], path + ".roll", dimension::none) * std::numbers::pi / 180.0;
      if (node[i]["orient_to"]) {
        if (node[i]["roll"]) r.fail(node[i], path, "use either roll or orient_to, not both");
        rule.orient_to = r.vector3(node[i]["orient_to"], path + ".orient_to", dimension::length);
      }
      if (const auto release = node[i]["release"]) {
        r.check_keys(release, path + ".release", {"start", "end"});
        std::array<std::array<bool, 6>, 2> ends{};
        if (release["start"]) ends[0] = read_directions(r, release["start"], path + ".release.start");
        if (release["end"]) ends[1] = read_directions(r, release["end"], path + ".release.end");
        if (const auto mechanism = analysis::release_mechanism(ends))
          r.fail(release, path + ".release",
                 "these releases leave a member free to move on its own (" + *mechanism +
                     "); keep that direction fixed at one end, e.g. release rx or ux at one end only");
        rule.release = ends;
      }
      if (const auto buckling = node[i]["buckling"]) {
        r.check_keys(buckling, path + ".buckling", {"y", "z", "lt"});
        const std::pair<const char*, std::optional<double>*> factors[] = {
            {"y", &rule.buckling_y}, {"z", &rule.buckling_z}, {"lt", &rule.buckling_lt}};
        for (const auto& [key, target] : factors) {
          if (!buckling[key]) continue;
          *target = r.number(buckling[key], path + ".buckling." + key, dimension::none);
          if (!(**target > 0)) r.fail(buckling[key], path + ".buckling." + key, "a buckling length factor is positive, e.g. 1.0");
        }
      }
      if (node[i]["deflection_ratio"]) {
        rule.deflection_ratio = r.number(node[i]["deflection_ratio"], path + ".deflection_ratio", dimension::none);
        if (!(*rule.deflection_ratio > 0)) r.fail(node[i]["deflection_ratio"], path + ".deflection_ratio", "must be positive, e.g. 250 for L/250");
      }
      if (node[i]["join_crossings"])
        rule.join_crossings = r.boolean(node[i]["join_crossings"], path + ".join_crossings");
      if (!rule.section && !rule.material && !rule.roll && !rule.orient_to && !rule.release && !rule.buckling_y &&
          !rule.buckling_z && !rule.buckling_lt && !rule.deflection_ratio && !rule.join_crossings)
        r.fail(node[i], path,
               "a rule sets at least one of section, material, roll, orient_to, release, buckling, deflection_ratio, "
               "join_crossings");
      p.rules.push_back(std::move(rule));
    }
  }

  if (const auto node = root["supports"]) {
    r.expect_list(node, "supports");
    for (std::size_t i = 0; i < node.size(); ++i) {
      const auto path = Reader::index("supports", i);
      check_item_keys(r, node[i], path, {"where", "near", "fix", "springs"}, Selects::nodes);
      SupportSpec s;
      s.where = read_node_target(r, node[i], path, "a support");
      if (node[i]["fix"] || !node[i]["springs"]) s.fixed = read_fixity(r, node[i]["fix"], path + ".fix");
      if (const auto springs = node[i]["springs"]) {
        // Translational stiffness is force per length (the line-load unit), rotational force x length per radian.
        const auto k = read_per_direction(r, springs, path + ".springs", dimension::line_load, dimension::moment);
        for (std::size_t d = 0; d < 6; ++d) {
          if (!k[d]) continue;
          if (!(*k[d] > 0)) r.fail(springs, path + ".springs", "a spring stiffness must be positive");
          // Stiffer than any foundation: the solver would lose the frame's own stiffness in round-off.
          if (*k[d] > 1e15)
            r.fail(springs, path + ".springs",
                   "a spring stiffness above 1e15 (SI) is a fixed direction; use fix: for it instead");
          s.spring[d] = *k[d];
        }
      }
      p.supports.push_back(std::move(s));
    }
  }

  std::vector<std::string> result_names;
  if (const auto node = root["cases"]) {
    r.expect_list(node, "cases");
    if (node.size() > detail::max_results)
      r.fail(node, "cases", fmt::format("{} load cases, more than the {} a project may have", node.size(),
                                        detail::max_results));
    for (std::size_t i = 0; i < node.size(); ++i) {
      auto c = read_case(r, node[i], Reader::index("cases", i));
      if (std::find(result_names.begin(), result_names.end(), c.name) != result_names.end())
        r.fail(node[i]["name"], Reader::index("cases", i) + ".name", "a second load case is named '" + c.name + "'");
      result_names.push_back(c.name);
      p.cases.push_back(std::move(c));
    }
  }
  if (p.cases.empty()) r.fail(root, "cases", "the project defines no load case; add cases: [{name: G, self_weight: true}]");
  const std::vector<std::string> case_names = result_names;

  if (const YAML::Node given = root["combinations"]) {
    // `combinations: {generate: {...}}` is the list of that one item (reset, not assignment: the latter
    // would overwrite the project's own tree).
    YAML::Node node = given;
    if (given.IsMap() && given["generate"]) {
      node.reset(YAML::Node(YAML::NodeType::Sequence));
      node.push_back(given);
    }
    r.expect_list(node, "combinations");
    if (node.size() > detail::max_results)
      r.fail(node, "combinations", fmt::format("{} combinations, more than the {} a project may have", node.size(),
                                               detail::max_results));
    auto add = [&](CombinationSpec c, const YAML::Node& at, const std::string& key) {
      if (std::find(result_names.begin(), result_names.end(), c.name) != result_names.end())
        r.fail(at, key, "the name '" + c.name + "' is already used by a case or combination");
      if (p.combinations.size() >= detail::max_results)
        r.fail(at, key, fmt::format("more than the {} combinations a project may have", detail::max_results));
      result_names.push_back(c.name);
      p.combinations.push_back(std::move(c));
    };
    for (std::size_t i = 0; i < node.size(); ++i) {
      const auto path = Reader::index("combinations", i);
      if (node[i].IsMap() && node[i]["generate"]) {
        r.check_keys(node[i], path, {"generate"});
        for (auto& c : detail::read_generated_combinations(r, node[i]["generate"], path + ".generate", p.cases))
          add(std::move(c), node[i], path + ".generate");
        continue;
      }
      r.check_keys(node[i], path, {"name", "factors", "kind"});
      CombinationSpec c;
      c.origin = r.where(node[i], path);
      if (!node[i]["name"]) r.fail(node[i], path, "a combination needs a name");
      c.name = r.text(node[i]["name"], path + ".name");
      if (!node[i]["factors"] || !node[i]["factors"].IsMap() || node[i]["factors"].size() == 0)
        r.fail(node[i], path + ".factors", "a combination needs factors: {CASE: factor, ...}");
      for (const auto& f : node[i]["factors"]) {
        const auto name = f.first.as<std::string>();
        if (std::find(case_names.begin(), case_names.end(), name) == case_names.end())
          r.fail(f.first, path + ".factors." + name, "no load case is named '" + name + "'" + did_you_mean(name, case_names));
        const double factor = r.number(f.second, path + ".factors." + name, dimension::none);
        // Partial and combination factors are of order 1 (EN 1990 A1.2): beyond 100 is a typing error.
        if (!(std::abs(factor) <= 100))
          r.fail(f.second, path + ".factors." + name, "a combination factor must be between -100 and 100, e.g. 1.35");
        c.factors.emplace_back(name, factor);
      }
      c.serviceability = default_serviceability(c.name, c.factors);
      if (const auto kind = node[i]["kind"]) {
        const std::string value = r.text(kind, path + ".kind");
        if (value != "uls" && value != "sls")
          r.fail(kind, path + ".kind", "expected uls (ultimate) or sls (serviceability), got '" + value + "'");
        c.serviceability = value == "sls";
      }
      add(std::move(c), node[i]["name"], path + ".name");
    }
  }

  p.checks = detail::read_checks(r, root["checks"], case_names, p.combinations);

  if (const auto node = root["analysis"]) {
    r.check_keys(node, "analysis",
                 {"shear_deformation", "second_order", "buckling_modes", "sls_buckling", "sway_imperfection",
                  "sway_amplification", "modes", "mass_from", "mode_parts"});
    if (node["modes"]) {
      const double n = r.number(node["modes"], "analysis.modes", dimension::none);
      if (!(n >= 0 && n <= 200 && n == std::floor(n)))
        r.fail(node["modes"], "analysis.modes", "must be a whole number from 0 (no natural frequencies) to 200");
      p.modes.count = static_cast<std::size_t>(n);
    }
    if (node["mode_parts"]) {
      const double n = r.number(node["mode_parts"], "analysis.mode_parts", dimension::none);
      if (!(n >= 1 && n <= 20 && n == std::floor(n)))
        r.fail(node["mode_parts"], "analysis.mode_parts", "must be a whole number from 1 to 20 (4 is usual)");
      p.modes.parts = static_cast<std::size_t>(n);
    }
    if (const auto from = node["mass_from"]) {
      const auto name = r.text(from, "analysis.mass_from");
      if (std::find(result_names.begin(), result_names.end(), name) == result_names.end())
        r.fail(from, "analysis.mass_from",
               "no load case or combination is named '" + name + "'" + did_you_mean(name, result_names));
      p.modes.mass_from = name;
    }
    if ((node["mass_from"] || node["mode_parts"]) && p.modes.count == 0)
      r.fail(node, "analysis", "mass_from and mode_parts belong to natural frequencies: add modes: N (e.g. 6)");
    if (node["sway_amplification"]) {
      p.sway_amplification = r.boolean(node["sway_amplification"], "analysis.sway_amplification");
      if (p.sway_amplification && node["second_order"] && r.boolean(node["second_order"], "analysis.second_order"))
        r.fail(node["sway_amplification"], "analysis.sway_amplification",
               "the amplification of EN 1993-1-1 5.2.2(5) is an alternative to second_order: choose one");
    }
    if (const auto sway = node["sway_imperfection"]) {
      const std::string key = "analysis.sway_imperfection";
      const std::string value = r.text(sway, key);
      bool on = true;
      if (value == "off" || (YAML::convert<bool>::decode(sway, on) && !on)) {
        p.sway_imperfection.enabled = false;
      } else if (value != "auto" && !(YAML::convert<bool>::decode(sway, on) && on)) {
        const double phi = r.number(sway, key, dimension::none);
        if (!(phi > 0 && phi <= 0.05))
          r.fail(sway, key, "expected auto (EN 1993-1-1 5.3.2(3)), off, or a sway angle phi such as 0.005 (1/200)");
        p.sway_imperfection.phi = phi;
      }
    }
    if (node["sls_buckling"]) p.sls_buckling = r.boolean(node["sls_buckling"], "analysis.sls_buckling");
    if (node["shear_deformation"]) p.shear_deformation = r.boolean(node["shear_deformation"], "analysis.shear_deformation");
    if (node["second_order"]) p.second_order = r.boolean(node["second_order"], "analysis.second_order");
    if (node["buckling_modes"]) {
      const double n = r.number(node["buckling_modes"], "analysis.buckling_modes", dimension::none);
      if (!(n >= 0 && n <= 20 && n == std::floor(n)))
        r.fail(node["buckling_modes"], "analysis.buckling_modes", "must be a whole number from 0 (no buckling analysis) to 20");
      p.buckling_modes = static_cast<std::size_t>(n);
    }
  }
  p.masses = detail::read_masses(r, root["masses"]);
  if (!p.checks.frequency.empty() && p.modes.count == 0)
    r.fail(root["checks"]["frequency"], "checks.frequency", "frequency checks need natural frequencies: add analysis: {modes: N}");
  p.outputs = detail::read_outputs(r, root["outputs"]);
  p.fabrication = detail::read_fabrication(r, root["fabrication"], result_names);
  p.suggest = detail::read_suggest(r, root["suggest"]);
  return p;
}

}  // namespace

namespace detail {

MemberSelector member_selector(const Reader& r, const YAML::Node& where, const std::string& path) {
  return read_member_selector(r, where, path);
}

NodeSelector node_target(const Reader& r, const YAML::Node& item, const std::string& path, const std::string& what,
                         const std::vector<std::string>& allowed) {
  check_item_keys(r, item, path, allowed, Selects::nodes);
  return read_node_target(r, item, path, what);
}

}  // namespace detail

namespace {

// Parses project text already known to be UTF-8 of a bounded size, then checks its keys.
YAML::Node parse_yaml(const std::string& text, const std::string& name) {
  YAML::Node root;
  try {
    root = YAML::Load(text);
  } catch (const YAML::ParserException& e) {
    throw InputError(name + ":" + std::to_string(e.mark.line + 1) + ": not valid YAML: " + e.msg);
  }
  detail::require_distinct_plain_keys(root, name);
  return root;
}

}  // namespace

Project read_project(const std::filesystem::path& file) {
  const std::string text = detail::read_project_bytes(file);
  detail::require_utf8_text(text, file.string());
  return read_project_root(parse_yaml(text, file.string()), file, file.parent_path());
}

Project read_project_text(std::string_view yaml, const std::filesystem::path& base_dir,
                          const std::string& display_name) {
  detail::require_utf8_text(yaml, display_name);
  return read_project_root(parse_yaml(std::string(yaml), display_name), display_name, base_dir);
}

}  // namespace stepframe
