#include "stepframe/project_builder.hpp"

#include "stepframe/errors.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "stepframe/suggest.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace stepframe {
namespace {

bool contains(const std::vector<std::string>& names, const std::string& name) {
  return std::find(names.begin(), names.end(), name) != names.end();
}

}  // namespace

ProjectBuilder::ProjectBuilder(std::string name) {
  project_.file = std::move(name);
  project_.length_unit = "m";
  project_.force_unit = "kN";
}

ProjectBuilder& ProjectBuilder::model(std::filesystem::path step_file) {
  project_.model = std::move(step_file);
  return *this;
}

ProjectBuilder& ProjectBuilder::merge_tolerance(double metres) {
  project_.merge_tolerance = metres;
  return *this;
}

ProjectBuilder& ProjectBuilder::curve_max_turn(double radians) {
  project_.curve_max_turn = radians;
  return *this;
}

ProjectBuilder& ProjectBuilder::join_crossings(bool join) {
  project_.join_crossings = join;
  return *this;
}

ProjectBuilder& ProjectBuilder::display_units(std::string length, std::string force) {
  project_.length_unit = std::move(length);
  project_.force_unit = std::move(force);
  return *this;
}

ProjectBuilder& ProjectBuilder::material(analysis::Material material) {
  auto name = material.name;
  project_.materials[name] = std::move(material);
  return *this;
}

ProjectBuilder& ProjectBuilder::section(analysis::Section section) {
  auto name = section.designation;
  project_.sections[name] = std::move(section);
  return *this;
}

ProjectBuilder& ProjectBuilder::rule(MemberSelector where, std::optional<std::string> section,
                                     std::optional<std::string> material, std::optional<double> roll) {
  Rule rule;
  rule.where = std::move(where);
  rule.section = std::move(section);
  rule.material = std::move(material);
  rule.roll = roll;
  return this->rule(std::move(rule));
}

ProjectBuilder& ProjectBuilder::rule(Rule rule) {
  rule.where.origin.file = project_.file;
  rule.where.origin.key = "rules[" + std::to_string(project_.rules.size()) + "].where";
  project_.rules.push_back(std::move(rule));
  return *this;
}

ProjectBuilder& ProjectBuilder::support(NodeSelector where, std::array<bool, 6> fixed) {
  where.origin.file = project_.file;
  where.origin.key = "supports[" + std::to_string(project_.supports.size()) + "].where";
  SupportSpec spec;
  spec.where = std::move(where);
  spec.fixed = fixed;
  project_.supports.push_back(std::move(spec));
  return *this;
}

ProjectBuilder& ProjectBuilder::load_case(std::string name, bool self_weight) {
  CaseSpec c;
  c.name = std::move(name);
  c.self_weight = self_weight;
  return load_case(std::move(c));
}

ProjectBuilder& ProjectBuilder::load_case(CaseSpec load_case) {
  const auto path = "cases[" + std::to_string(project_.cases.size()) + "]";
  load_case.origin = {project_.file, 0, path};
  for (std::size_t i = 0; i < load_case.member_loads.size(); ++i)
    load_case.member_loads[i].where.origin = {project_.file, 0, path + ".member_loads[" + std::to_string(i) + "].where"};
  for (std::size_t i = 0; i < load_case.node_loads.size(); ++i)
    load_case.node_loads[i].where.origin = {project_.file, 0, path + ".node_loads[" + std::to_string(i) + "]"};
  project_.cases.push_back(std::move(load_case));
  return *this;
}

ProjectBuilder& ProjectBuilder::combination(std::string name, std::vector<std::pair<std::string, double>> factors) {
  CombinationSpec c;
  c.origin = {project_.file, 0, "combinations[" + std::to_string(project_.combinations.size()) + "]"};
  c.name = std::move(name);
  c.factors = std::move(factors);
  c.serviceability = default_serviceability(c.name, c.factors);
  project_.combinations.push_back(std::move(c));
  return *this;
}

ProjectBuilder& ProjectBuilder::check_stress(std::vector<std::string> names) {
  project_.checks.stress = StressCheckSpec{std::move(names)};
  checks_set_ = true;
  return *this;
}

ProjectBuilder& ProjectBuilder::check_deflection(double span_ratio, std::vector<std::string> names) {
  project_.checks.deflection = DeflectionCheckSpec{span_ratio, std::move(names)};
  checks_set_ = true;
  return *this;
}

Project ProjectBuilder::build() const {
  const std::string where = project_.file.string() + ": ";
  auto fail = [&](const std::string& what) -> void { throw InputError(where + what); };

  if (!(project_.merge_tolerance > 0 && project_.merge_tolerance <= geometry::max_merge_tolerance))
    fail("merge_tolerance must be a positive length in metres, at most 1 m (a few millimetres is usual)");
  if (!(project_.curve_max_turn > 0 && project_.curve_max_turn <= std::numbers::pi / 2))
    fail("curve_max_turn must be an angle in radians above 0 and at most pi/2, e.g. 5 degrees = 0.0873");
  for (std::size_t i = 0; i < project_.rules.size(); ++i) {
    const auto& r = project_.rules[i];
    if (!r.section && !r.material && !r.roll && !r.release && !r.buckling_y && !r.buckling_z && !r.buckling_lt &&
        !r.deflection_ratio && !r.join_crossings)
      fail("rules[" + std::to_string(i) +
           "] sets none of section, material, roll, release, buckling, deflection_ratio");
  }
  if (project_.cases.empty()) fail("the project defines no load case; add load_case(\"G\", true)");

  std::vector<std::string> case_names, result_names;
  for (std::size_t i = 0; i < project_.cases.size(); ++i) {
    const auto& name = project_.cases[i].name;
    if (name.empty()) fail("cases[" + std::to_string(i) + "] has no name");
    if (contains(case_names, name)) fail("cases[" + std::to_string(i) + "]: a second load case is named '" + name + "'");
    case_names.push_back(name);
  }
  result_names = case_names;
  for (std::size_t i = 0; i < project_.combinations.size(); ++i) {
    const auto& c = project_.combinations[i];
    const auto path = "combinations[" + std::to_string(i) + "]";
    if (c.name.empty()) fail(path + " has no name");
    if (contains(result_names, c.name))
      fail(path + ": the name '" + c.name + "' is already used by a case or combination");
    if (c.factors.empty()) fail(path + " ('" + c.name + "') has no factors");
    for (const auto& [name, factor] : c.factors) {
      if (!contains(case_names, name))
        fail(path + " ('" + c.name + "'): no load case is named '" + name + "'" + did_you_mean(name, case_names));
      if (!std::isfinite(factor)) fail(path + " ('" + c.name + "'): the factor of '" + name + "' is not a number");
    }
    result_names.push_back(c.name);
  }

  Project p = project_;
  auto check_names = [&](const std::vector<std::string>& names, const std::string& key) {
    for (const auto& name : names)
      if (!contains(result_names, name))
        fail(key + ": no load case or combination is named '" + name + "'" + did_you_mean(name, result_names));
  };
  if (p.checks.stress) check_names(p.checks.stress->combinations, "checks.stress");
  if (p.checks.deflection) {
    check_names(p.checks.deflection->combinations, "checks.deflection");
    if (!(p.checks.deflection->span_ratio > 0)) fail("checks.deflection: span_ratio must be positive, e.g. 300 for L/300");
  }
  if (!checks_set_) {
    // As the project-file reader does: stresses under the ultimate combinations (every combination when
    // none is ultimate, every case when there is none).
    StressCheckSpec spec;
    for (const auto& c : p.combinations)
      if (!c.serviceability) spec.combinations.push_back(c.name);
    if (spec.combinations.empty())
      for (const auto& c : p.combinations) spec.combinations.push_back(c.name);
    if (spec.combinations.empty()) spec.combinations = case_names;
    p.checks.stress = spec;
  }
  return p;
}

}  // namespace stepframe
