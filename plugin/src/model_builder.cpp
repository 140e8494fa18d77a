#include "stepframe/model_builder.hpp"

#include "area_load_builder.hpp"
#include "selector_pattern.hpp"
#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/counted.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/suggest.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <map>
#include <memory>
#include <optional>
#include <tuple>

namespace stepframe {
namespace {

/// A member selector with its patterns compiled once.
class CompiledSelector {
 public:
  explicit CompiledSelector(const MemberSelector& sel)
      : name_(compile(sel.name)), layer_(compile(sel.layer)), product_(compile(sel.product)),
        colour_(compile(sel.colour)) {}

  bool matches(const geometry::SourceInfo& src) const {
    if (!matches(name_, src.name) || !matches(product_, src.product) || !matches(colour_, src.colour)) return false;
    if (!layer_) return true;
    return std::any_of(src.layers.begin(), src.layers.end(), [&](const auto& l) { return layer_->matches(l); });
  }

 private:
  static std::optional<detail::SelectorPattern> compile(const std::optional<std::string>& pattern) {
    if (!pattern) return std::nullopt;
    return detail::SelectorPattern(*pattern);
  }
  static bool matches(const std::optional<detail::SelectorPattern>& re, const std::string& value) {
    return !re || re->matches(value);
  }
  std::optional<detail::SelectorPattern> name_, layer_, product_, colour_;
};

std::string describe_member(const geometry::SourceInfo& src) {
  std::string out = src.entity.empty() ? std::string("(no entity id)") : src.entity;
  std::vector<std::string> parts;
  if (!src.name.empty()) parts.push_back("name '" + src.name + "'");
  if (!src.layers.empty()) parts.push_back("layer '" + src.layers.front() + "'");
  if (!src.product.empty()) parts.push_back("product '" + src.product + "'");
  if (!parts.empty()) out += " (" + fmt::format("{}", fmt::join(parts, ", ")) + ")";
  return out;
}

// Runs of whitespace-separated words in an attribute value, longest first, so
// "HE 200 B beam" offers "HE 200 B" before "HE".
std::vector<std::string> candidate_phrases(const std::string& value) {
  std::vector<std::string> words;
  std::string word;
  for (char c : value + " ") {
    if (std::isspace(static_cast<unsigned char>(c)) || c == ',' || c == ';' || c == '|' || c == '/') {
      if (!word.empty()) words.push_back(word);
      word.clear();
    } else {
      word += c;
    }
  }
  std::vector<std::string> phrases;
  if (!value.empty()) phrases.push_back(value);
  for (std::size_t len = std::min<std::size_t>(words.size(), 4); len >= 1; --len)
    for (std::size_t i = 0; i + len <= words.size(); ++i) {
      std::string phrase = words[i];
      for (std::size_t k = 1; k < len; ++k) phrase += " " + words[i + k];
      phrases.push_back(phrase);
    }
  return phrases;
}

/// Resolves section and material names to model indices, adding each once.
class Library {
 public:
  explicit Library(const Project& p) : project_(p) {}

  // Lookups are remembered by the text asked for: thousands of members repeat a few names.
  std::optional<std::size_t> section(const std::string& name, analysis::FrameModel& model) {
    if (auto hit = section_lookups_.find(name); hit != section_lookups_.end()) return hit->second;
    std::optional<analysis::Section> found;
    if (auto it = project_.sections.find(name); it != project_.sections.end()) found = it->second;
    else found = analysis::find_catalogue_section(name);
    std::optional<std::size_t> index;
    if (found) index = intern(model.sections, section_index_, *found, found->designation);
    return section_lookups_[name] = index;
  }

  std::optional<std::size_t> material(const std::string& name, analysis::FrameModel& model) {
    if (auto hit = material_lookups_.find(name); hit != material_lookups_.end()) return hit->second;
    std::optional<analysis::Material> found;
    if (auto it = project_.materials.find(name); it != project_.materials.end()) found = it->second;
    else found = analysis::find_standard_material(name);
    std::optional<std::size_t> index;
    if (found) index = intern(model.materials, material_index_, *found, found->name);
    return material_lookups_[name] = index;
  }

  /// The first phrase of the member's name, product, then layers that names a section / material;
  /// `from` says which attribute it was found in ("name 'IPE 300'").
  template <class Lookup>
  std::optional<std::size_t> from_attributes(const geometry::SourceInfo& src, Lookup lookup, std::string& from) {
    std::vector<std::pair<std::string, std::string>> values{{"name", src.name}, {"product", src.product}};
    for (const auto& layer : src.layers) values.emplace_back("layer", layer);
    for (const auto& [kind, value] : values)
      for (const auto& phrase : candidate_phrases(value))
        if (auto index = lookup(phrase)) {
          from = kind + " '" + value + "'";
          return index;
        }
    return std::nullopt;
  }

  /// Catalogue designations close to `name` (same family first) and the project's own sections.
  std::vector<std::string> sections_like(const std::string& name) const {
    auto names = analysis::nearest_designations(name, 3);
    for (const auto& [custom, s] : project_.sections) names.push_back(custom);
    return names;
  }
  std::vector<std::string> known_materials() const {
    auto names = analysis::standard_material_names();
    for (const auto& [name, m] : project_.materials) names.push_back(name);
    return names;
  }

 private:
  template <class T>
  static std::size_t intern(std::vector<T>& items, std::map<std::string, std::size_t>& index, const T& item,
                            const std::string& key) {
    if (auto it = index.find(key); it != index.end()) return it->second;
    items.push_back(item);
    return index[key] = items.size() - 1;
  }

  const Project& project_;
  std::map<std::string, std::size_t> section_index_, material_index_;
  std::map<std::string, std::optional<std::size_t>> section_lookups_, material_lookups_;
};

// Nodes that named or layered points of the CAD file sit on.
std::vector<std::size_t> select_labelled_nodes(const NodeSelector& sel, const std::vector<geometry::NodeLabel>& labels) {
  const auto compile = [](const std::optional<std::string>& p) -> std::optional<detail::SelectorPattern> {
    if (!p) return std::nullopt;
    return detail::SelectorPattern(*p);
  };
  const auto name = compile(sel.point_name);
  const auto layer = compile(sel.point_layer);
  std::vector<std::size_t> out;
  for (const auto& label : labels) {
    if (name && !name->matches(label.source.name)) continue;
    if (layer && std::none_of(label.source.layers.begin(), label.source.layers.end(),
                              [&](const std::string& l) { return layer->matches(l); }))
      continue;
    if (std::find(out.begin(), out.end(), label.node) == out.end()) out.push_back(label.node);
  }
  if (out.empty()) {
    std::vector<std::string> known;
    for (const auto& label : labels) {
      if (!label.source.name.empty()) known.push_back("name '" + label.source.name + "'");
      for (const auto& l : label.source.layers) known.push_back("layer '" + l + "'");
    }
    std::sort(known.begin(), known.end());
    known.erase(std::unique(known.begin(), known.end()), known.end());
    constexpr std::size_t shown = 12;
    std::string listed;
    for (std::size_t i = 0; i < known.size() && i < shown; ++i) listed += (i ? ", " : "") + known[i];
    if (known.size() > shown) listed += fmt::format(" and {} more", known.size() - shown);
    throw InputError(fmt::format("{}: no named or layered point of the model matches{}{}; {}", sel.origin.describe(),
                                 sel.point_name ? " point_name '" + *sel.point_name + "'" : std::string(),
                                 sel.point_layer ? " point_layer '" + *sel.point_layer + "'" : std::string(),
                                 known.empty() ? std::string("the model has no named or layered points (see `stepframe inspect`)")
                                               : "the model's points have " + listed));
  }
  return out;
}

std::vector<std::size_t> select_nodes(const NodeSelector& sel, const std::vector<Eigen::Vector3d>& nodes,
                                      const std::vector<geometry::NodeLabel>& labels, double tolerance) {
  if (sel.point_name || sel.point_layer) return select_labelled_nodes(sel, labels);
  std::vector<std::size_t> out;
  if (sel.near) {
    std::size_t best = 0;
    double best_distance = std::numeric_limits<double>::infinity();
    for (std::size_t i = 0; i < nodes.size(); ++i) {
      const double d = (nodes[i] - *sel.near).norm();
      if (d < best_distance) best_distance = d, best = i;
    }
    // A point farther than 50 tolerances from every node is a wrong coordinate, not a near miss.
    if (best_distance > 50 * tolerance)
      throw InputError(fmt::format(
          "{}: no node near ({:.4g}, {:.4g}, {:.4g}) m; the nearest, node {} at ({:.4g}, {:.4g}, {:.4g}) m, is "
          "{:.4g} m away; check the coordinates and the project's length unit",
          sel.origin.describe(), (*sel.near)[0], (*sel.near)[1], (*sel.near)[2], best, nodes[best][0], nodes[best][1],
          nodes[best][2], best_distance));
    out.push_back(best);
    return out;
  }
  for (std::size_t i = 0; i < nodes.size(); ++i) {
    const auto& p = nodes[i];
    if ((!sel.x || std::abs(p[0] - *sel.x) <= tolerance) && (!sel.y || std::abs(p[1] - *sel.y) <= tolerance) &&
        (!sel.z || std::abs(p[2] - *sel.z) <= tolerance))
      out.push_back(i);
  }
  if (out.empty()) {
    Eigen::Vector3d low = nodes.front(), high = nodes.front();
    for (const auto& p : nodes) low = low.cwiseMin(p), high = high.cwiseMax(p);
    throw InputError(fmt::format(
        "{}: no node lies on the plane(s) given; the nodes span x {:.4g}..{:.4g}, y {:.4g}..{:.4g}, z {:.4g}..{:.4g} m",
        sel.origin.describe(), low[0], high[0], low[1], high[1], low[2], high[2]));
  }
  return out;
}

analysis::LoadAxes load_axes(LoadAxesSpec axes) {
  switch (axes) {
    case LoadAxesSpec::local: return analysis::LoadAxes::local;
    case LoadAxesSpec::projected: return analysis::LoadAxes::projected;
    case LoadAxesSpec::global: break;
  }
  return analysis::LoadAxes::global;
}

// A member load given along the member (from/to/at measured from its start)
// as loads on the elements of its chain: a distributed load is cut at the
// element ends with its intensity interpolated linearly; a point load goes to
// the element that holds its position.
void add_member_load(const analysis::FrameModel& model, std::size_t m, const MemberLoadSpec& load,
                     const geometry::SourceInfo& source, analysis::LoadCase& lc) {
  const auto& chain = model.members[m].elements;
  std::vector<double> starts{0.0};
  for (std::size_t e : chain) {
    const auto& el = model.elements[e];
    starts.push_back(starts.back() + (model.nodes[el.nodes[1]] - model.nodes[el.nodes[0]]).norm());
  }
  const double length = starts.back();
  const double slack = 1e-9 * length;
  auto outside = [&](double x, const char* key) {
    return InputError(fmt::format("{}: member {} is {:.4g} m long, but the load's '{}' is {:.4g} m from its start; "
                                  "check the distance and the project's length unit",
                                  load.where.origin.describe(), describe_member(source), length, key, x));
  };
  const bool plain = !load.at && !load.from && !load.to && !load.w_end && load.axes == LoadAxesSpec::global;
  if (plain) {  // the common case: uniform global load on the whole member
    for (std::size_t e : chain) lc.element_loads.push_back({e, load.w});
    return;
  }
  if (load.at) {
    if (*load.at > length + slack) throw outside(*load.at, "at");
    std::size_t k = 0;
    while (k + 1 < chain.size() && *load.at > starts[k + 1]) ++k;
    analysis::ElementLoad point;
    point.element = chain[k];
    point.axes = load_axes(load.axes);
    point.point = true;
    point.a = std::clamp(*load.at - starts[k], 0.0, starts[k + 1] - starts[k]);
    point.w_start = load.w;
    lc.partial_loads.push_back(point);
    return;
  }
  const double from = load.from.value_or(0.0), to = load.to.value_or(length);
  if (from > length + slack) throw outside(from, "from");
  if (to > length + slack) throw outside(to, "to");
  const Eigen::Vector3d w_from = load.w, w_to = load.w_end.value_or(load.w);
  auto intensity = [&](double x) -> Eigen::Vector3d { return w_from + (w_to - w_from) * ((x - from) / (to - from)); };
  for (std::size_t k = 0; k < chain.size(); ++k) {
    const double a = std::max(from, starts[k]), b = std::min(to, starts[k + 1]);
    if (!(b > a)) continue;
    analysis::ElementLoad part;
    part.element = chain[k];
    part.axes = load_axes(load.axes);
    part.a = a - starts[k];
    part.b = b - starts[k];
    part.w_start = intensity(a);
    part.w_end = intensity(b);
    lc.partial_loads.push_back(part);
  }
}

/// The roll that turns an element's local z towards `target`: with the unrolled
/// axes y0, z0 and v the target's offset normal to the element, z = -sin(r) y0 +
/// cos(r) z0 (local_axes.hpp) is parallel to v when r = atan2(-v.y0, v.z0).
double roll_towards(const analysis::FrameModel& model, const analysis::FrameElement& element,
                    const Eigen::Vector3d& target, const Rule& rule, const geometry::SourceInfo& source) {
  const Eigen::Vector3d a = model.nodes[element.nodes[0]], b = model.nodes[element.nodes[1]];
  const Eigen::Matrix3d axes = analysis::local_axes(a, b, 0.0);
  Eigen::Vector3d v = target - 0.5 * (a + b);
  v -= v.dot(axes.row(0).transpose()) * axes.row(0).transpose();
  if (v.norm() < 1e-9 * std::max(1.0, (b - a).norm()))
    throw InputError(rule.where.origin.describe() + ": orient_to lies on the axis of member " + describe_member(source) +
                     ", so it gives no direction; choose a point off the member's line");
  return std::atan2(-v.dot(axes.row(1).transpose()), v.dot(axes.row(2).transpose()));
}

// Rules name sections and materials that must exist, whether or not they match.
void check_rule_names(const Project& project, Library& library, analysis::FrameModel& model) {
  for (const auto& rule : project.rules) {
    if (rule.section && !library.section(*rule.section, model))
      throw InputError(rule.where.origin.describe() + ": unknown section '" + *rule.section + "'" +
                       did_you_mean(*rule.section, library.sections_like(*rule.section)) +
                       " Define it under 'sections:' or use a catalogue designation such as IPE300 or HEB200.");
    if (rule.material && !library.material(*rule.material, model))
      throw InputError(rule.where.origin.describe() + ": unknown material '" + *rule.material + "'" +
                       did_you_mean(*rule.material, library.known_materials()) +
                       " Define it under 'materials:' or use a standard grade (`stepframe sections` lists sections; "
                       "grades: S235, S275, S355, S460, S355H, A992, A36, A572 Gr. 50, A500 Gr. B/C).");
  }
}

struct Assignment {
  std::optional<std::size_t> section, material;  ///< indices into the model's sections and materials
  std::string section_from, material_from;       ///< what set each (MemberProperties)
};

// The rules whose selectors match a member, in the project's order.
std::vector<const Rule*> matching_rules(const geometry::SourceInfo& source, const Project& project,
                                        const std::vector<CompiledSelector>& rule_selectors) {
  std::vector<const Rule*> matching;
  for (std::size_t r = 0; r < project.rules.size(); ++r)
    if (rule_selectors[r].matches(source)) matching.push_back(&project.rules[r]);
  return matching;
}

// A member's section is the last matching rule's, else the first designation
// found in its attributes; its material likewise.
Assignment assign(const geometry::SourceInfo& source, const std::vector<const Rule*>& matching, Library& library,
                  analysis::FrameModel& model) {
  Assignment a;
  for (const Rule* rule : matching) {
    const auto& origin = rule->where.origin;
    const std::string rule_name = origin.key.substr(0, origin.key.find('.'));
    const std::string from = origin.line > 0 ? fmt::format("{} (line {})", rule_name, origin.line) : rule_name;
    if (rule->section) a.section = library.section(*rule->section, model), a.section_from = from;
    if (rule->material) a.material = library.material(*rule->material, model), a.material_from = from;
  }
  if (!a.section)
    a.section = library.from_attributes(
        source, [&](const std::string& s) { return library.section(s, model); }, a.section_from);
  if (!a.material)
    a.material = library.from_attributes(
        source, [&](const std::string& s) { return library.material(s, model); }, a.material_from);
  return a;
}

std::vector<CompiledSelector> rule_selectors_of(const Project& project) {
  std::vector<CompiledSelector> selectors;
  for (const auto& rule : project.rules) selectors.emplace_back(rule.where);
  return selectors;
}

// A section given by its properties without a torsion modulus or thickest plate: torsional shear stress
// cannot be worked out, so the stresses leave it out (element_recovery.hpp); say so once per section used.
void note_torsion_unknown(const analysis::FrameModel& model, std::vector<geometry::Diagnostic>& diagnostics) {
  std::vector<bool> used(model.sections.size(), false);
  for (const auto& e : model.elements)
    if (e.section < used.size()) used[e.section] = true;
  for (std::size_t k = 0; k < model.sections.size(); ++k) {
    const analysis::Section& s = model.sections[k];
    if (!used[k] || s.shape != analysis::SectionShape::custom || s.Wt > 0 || s.t_max > 0) continue;
    geometry::Diagnostic d;
    d.severity = geometry::Severity::warning;
    d.code = "torsion-stress-unknown";
    d.message = fmt::format("section '{}' is given by its properties without torsion_modulus or thickest_plate: "
                            "torsional shear stress is left out of its members' stresses. Add torsion_modulus "
                            "(T / tau_max) or, for an open thin-walled section, thickest_plate to sections.{}",
                            s.designation, s.designation);
    diagnostics.push_back(std::move(d));
  }
}

// A member that leans from the vertical by more than the vertical tolerance but less than the ambiguous
// inclination (local_axes.hpp) may be a column drawn out of plumb: say how it was oriented.
void note_near_vertical(const analysis::FrameModel& model, const analysis::Member& member,
                        const geometry::SourceInfo& source, std::vector<geometry::Diagnostic>& diagnostics) {
  double lean = 0;
  for (std::size_t e : member.elements) {
    const auto& nodes = model.elements[e].nodes;
    lean = std::max(lean, analysis::angle_from_vertical(model.nodes[nodes[0]], model.nodes[nodes[1]]));
  }
  if (!(lean > analysis::vertical_tolerance && lean < analysis::ambiguous_inclination)) return;
  constexpr double degree = std::numbers::pi / 180.0;
  geometry::Diagnostic d;
  d.severity = geometry::Severity::warning;
  d.code = "near-vertical-member";
  d.message = fmt::format(
      "member {} leans {:.2f} degrees from the vertical: oriented as an inclined member (strong axis horizontal), "
      "not as a column (members within {:.2f} degrees of the vertical count as vertical, depth along X). If it is a "
      "column drawn out of plumb, straighten it in the CAD model, or give its orientation with a rule's orient_to",
      describe_member(source), lean / degree, analysis::vertical_tolerance / degree);
  if (!source.entity.empty()) d.entities = {source.entity};
  diagnostics.push_back(std::move(d));
}

}  // namespace

geometry::WireframeOptions wireframe_options(const Project& project) {
  geometry::WireframeOptions options;
  options.merge_tolerance = project.merge_tolerance;
  options.curve_max_turn = project.curve_max_turn;
  // The project's key joins every crossing; rules with join_crossings join those between members they select.
  auto joiners = std::make_shared<std::vector<CompiledSelector>>();
  for (const auto& rule : project.rules)
    if (rule.join_crossings) joiners->emplace_back(rule.where);
  if (project.join_crossings)
    options.join_crossings = geometry::join_all_crossings;
  else if (!joiners->empty())
    options.join_crossings = [joiners](const geometry::SourceInfo& source) {
      return std::any_of(joiners->begin(), joiners->end(), [&](const CompiledSelector& s) { return s.matches(source); });
    };
  return options;
}

std::optional<std::string> designation_in(const std::string& value) {
  for (const auto& phrase : candidate_phrases(value))
    if (const auto section = analysis::find_catalogue_section(phrase)) return section->designation;
  return std::nullopt;
}

std::optional<std::string> material_in(const std::string& value) {
  for (const auto& phrase : candidate_phrases(value))
    if (const auto material = analysis::find_standard_material(phrase)) return material->name;
  return std::nullopt;
}

std::vector<MemberProperties> member_properties(const Project& project, const geometry::Wireframe& wireframe) {
  analysis::FrameModel scratch;
  Library library(project);
  check_rule_names(project, library, scratch);
  const std::vector<CompiledSelector> rule_selectors = rule_selectors_of(project);
  std::vector<MemberProperties> properties;
  for (const auto& member : wireframe.members) {
    const Assignment a = assign(member.source, matching_rules(member.source, project, rule_selectors), library, scratch);
    MemberProperties p;
    if (a.section) p.section = scratch.sections[*a.section].designation, p.section_from = a.section_from;
    if (a.material) p.material = scratch.materials[*a.material].name, p.material_from = a.material_from;
    properties.push_back(std::move(p));
  }
  return properties;
}

std::vector<UnassignedMember> members_without_properties(const Project& project,
                                                         const geometry::Wireframe& wireframe) {
  const auto properties = member_properties(project, wireframe);
  std::vector<UnassignedMember> unassigned;
  for (std::size_t m = 0; m < properties.size(); ++m)
    if (!properties[m].section || !properties[m].material)
      unassigned.push_back({m, !properties[m].section, !properties[m].material});
  return unassigned;
}

std::vector<std::string> selectors_matching_nothing(const Project& project, const geometry::Wireframe& wireframe) {
  std::vector<std::string> idle;
  const auto matches_none = [&](const MemberSelector& sel) {
    const CompiledSelector where(sel);
    return std::none_of(wireframe.members.begin(), wireframe.members.end(),
                        [&](const geometry::WireMember& m) { return where.matches(m.source); });
  };
  const std::string hint = "; check its patterns against the attributes `stepframe inspect` lists";
  for (const auto& rule : project.rules)
    if (matches_none(rule.where)) idle.push_back(rule.where.origin.describe() + ": this rule matches no member" + hint);
  for (const auto& c : project.cases) {
    for (const auto& load : c.member_loads)
      if (matches_none(load.where))
        idle.push_back(load.where.origin.describe() + ": this load matches no member (`run` stops here)" + hint);
    const auto check_nodes = [&](const NodeSelector& sel) {
      try {
        select_nodes(sel, wireframe.nodes, wireframe.labels, project.merge_tolerance);
      } catch (const InputError& e) {
        idle.push_back(std::string(e.what()) + " (`run` stops here)");
      }
    };
    for (const auto& load : c.node_loads) check_nodes(load.where);
    for (const auto& settlement : c.settlements) check_nodes(settlement.where);
  }
  return idle;
}

std::vector<SupportNodes> support_nodes(const Project& project, const geometry::Wireframe& wireframe) {
  std::vector<SupportNodes> found;
  for (const auto& spec : project.supports) {
    SupportNodes s;
    try {
      s.nodes = select_nodes(spec.where, wireframe.nodes, wireframe.labels, project.merge_tolerance);
    } catch (const InputError& e) {
      s.problem = e.what();
    }
    found.push_back(std::move(s));
  }
  return found;
}

BuiltModel build_frame_model(const Project& project, const geometry::Wireframe& wireframe) {
  BuiltModel built;
  auto& model = built.model;
  model.settings.shear_deformation = project.shear_deformation;
  model.settings.second_order = project.second_order;
  model.nodes = wireframe.nodes;
  Library library(project);
  check_rule_names(project, library, model);
  const std::vector<CompiledSelector> rule_selectors = rule_selectors_of(project);

  std::vector<std::string> without_section, without_material;
  for (const auto& wm : wireframe.members) {
    const std::vector<const Rule*> matching = matching_rules(wm.source, project, rule_selectors);
    const Assignment assigned = assign(wm.source, matching, library, model);
    const auto& [section, material] = std::tie(assigned.section, assigned.material);
    double roll = 0;
    std::optional<Eigen::Vector3d> orient_to;
    const Rule* orienting_rule = nullptr;
    std::array<std::array<bool, 6>, 2> release{};
    analysis::en1993::BucklingLengths buckling;
    std::optional<double> deflection_ratio;
    for (const Rule* matched : matching) {
      const Rule& rule = *matched;
      if (rule.roll) roll = *rule.roll, orient_to.reset();
      if (rule.orient_to) orient_to = rule.orient_to, orienting_rule = &rule;
      if (rule.release) release = *rule.release;
      if (rule.buckling_y) buckling.y = *rule.buckling_y;
      if (rule.buckling_z) buckling.z = *rule.buckling_z;
      if (rule.buckling_lt) buckling.lt = *rule.buckling_lt;
      if (rule.deflection_ratio) deflection_ratio = rule.deflection_ratio;
    }
    if (!section) without_section.push_back(describe_member(wm.source));
    if (!material) without_material.push_back(describe_member(wm.source));

    // One element per step along the member's path; all share its section, material and roll.
    analysis::Member member;
    for (std::size_t k = 1; k < wm.nodes.size(); ++k) {
      member.elements.push_back(model.elements.size());
      model.elements.push_back({{wm.nodes[k - 1], wm.nodes[k]}, section.value_or(0), material.value_or(0), roll, {}});
      if (orient_to) model.elements.back().roll = roll_towards(model, model.elements.back(), *orient_to, *orienting_rule, wm.source);
    }
    if (!orient_to) note_near_vertical(model, member, wm.source, built.diagnostics);
    // Releases act at the member's ends: the start of its first element, the end of its last.
    if (!member.elements.empty()) {
      model.elements[member.elements.front()].releases[0] = release[0];
      model.elements[member.elements.back()].releases[1] = release[1];
    }
    model.members.push_back(std::move(member));
    built.member_sources.push_back(wm.source);
    built.buckling.push_back(buckling);
    built.deflection_ratio.push_back(deflection_ratio);
  }

  note_torsion_unknown(model, built.diagnostics);

  auto list = [](const std::vector<std::string>& items) {
    constexpr std::size_t shown = 20;
    std::string out;
    for (std::size_t i = 0; i < items.size() && i < shown; ++i) out += "\n  " + items[i];
    if (items.size() > shown) out += fmt::format("\n  ... and {} more", items.size() - shown);
    return out;
  };
  if (!without_section.empty() || !without_material.empty()) {
    std::string message = project.file.string() + ": ";
    if (!without_section.empty())
      message += fmt::format("{} no section (no rule sets one and no designation was found in "
                             "their name, product or layers):{}\n",
                             counted(without_section.size(), "member has", "members have"), list(without_section));
    if (!without_material.empty())
      message += fmt::format("{} no material:{}\n", counted(without_material.size(), "member has", "members have"),
                             list(without_material));
    message += "Add a rule, e.g. rules: [{where: {layer: BEAMS}, section: IPE300, material: S355}]";
    throw InputError(message);
  }

  const double tol = project.merge_tolerance;
  auto note = [&](std::string code, std::string message, std::size_t node) {
    geometry::Diagnostic d;
    d.code = std::move(code);
    d.message = std::move(message);
    d.at = model.nodes[node];
    built.diagnostics.push_back(std::move(d));
  };
  std::map<std::size_t, const SupportSpec*> first_support;  // node -> the first support entry selecting it
  for (const auto& spec : project.supports)
    for (std::size_t node : select_nodes(spec.where, model.nodes, wireframe.labels, tol)) {
      auto existing = std::find_if(model.supports.begin(), model.supports.end(),
                                   [&](const analysis::Support& s) { return s.node == node; });
      const auto [first, inserted] = first_support.try_emplace(node, &spec);
      if (!inserted)
        note("supports-combined",
             fmt::format("node {} is selected by {} and by {}: the supports are combined (a direction fixed by "
                         "either is fixed, springs add up)",
                         node, first->second->where.origin.describe(), spec.where.origin.describe()),
             node);
      if (existing == model.supports.end()) {
        analysis::Support support;
        support.node = node;
        support.fixed = spec.fixed;
        support.spring = spec.spring;
        model.supports.push_back(support);
      } else {
        for (std::size_t d = 0; d < 6; ++d) {
          existing->fixed[d] = existing->fixed[d] || spec.fixed[d];
          existing->spring[d] += spec.spring[d];
        }
      }
    }

  for (const auto& spec : project.cases) {
    analysis::LoadCase lc;
    lc.name = spec.name;
    lc.self_weight = spec.self_weight;
    for (const auto& load : spec.member_loads) {
      const CompiledSelector where(load.where);
      bool any = false;
      for (std::size_t m = 0; m < model.members.size(); ++m)
        if (where.matches(built.member_sources[m])) {
          add_member_load(model, m, load, built.member_sources[m], lc);
          any = true;
        }
      if (!any)
        throw InputError(load.where.origin.describe() +
                         ": matches no member; check the name/layer/product patterns against `stepframe inspect`");
    }
    for (const auto& load : spec.node_loads) {
      const auto nodes = select_nodes(load.where, model.nodes, wireframe.labels, tol);
      for (std::size_t node : nodes) lc.node_loads.push_back({node, load.force, load.moment});
      if (nodes.size() > 1)
        note("node-load-on-every-node",
             fmt::format("{} selects {} nodes: the full force and moment act at each of them ({} times the "
                         "given load in all); to spread a total, divide it by the number of nodes",
                         load.where.origin.describe(), nodes.size(), nodes.size()),
             nodes.front());
    }
    for (const auto& settlement : spec.settlements)
      for (std::size_t node : select_nodes(settlement.where, model.nodes, wireframe.labels, tol))
        for (int d = 0; d < 6; ++d) {
          const auto& value = settlement.value[static_cast<std::size_t>(d)];
          if (!value) continue;
          const auto support = std::find_if(model.supports.begin(), model.supports.end(),
                                            [&](const analysis::Support& s) { return s.node == node; });
          if (support == model.supports.end() || !support->fixed[static_cast<std::size_t>(d)])
            throw InputError(fmt::format("{}: node {} is not fixed in {} by any support; a settlement moves a "
                                         "support, so add one that fixes {} there",
                                         settlement.where.origin.describe(), node,
                                         analysis::dof_names[static_cast<std::size_t>(d)],
                                         analysis::dof_names[static_cast<std::size_t>(d)]));
          lc.settlements.push_back({node, d, *value});
        }
    // Area loads: panels of the plane's members, their loads added as member loads (global axes).
    std::vector<analysis::AreaLoadResult> area;
    for (const auto& spec_area : spec.area_loads) {
      const std::optional<CompiledSelector> where =
          spec_area.where ? std::optional<CompiledSelector>(*spec_area.where) : std::nullopt;
      std::vector<std::size_t> elements;
      for (std::size_t m = 0; m < model.members.size(); ++m)
        if (!where || where->matches(built.member_sources[m]))
          elements.insert(elements.end(), model.members[m].elements.begin(), model.members[m].elements.end());
      auto result = detail::build_area_load(model, spec_area, std::move(elements), tol);
      for (const auto& l : result.loads) lc.partial_loads.push_back(l.load);
      area.push_back(std::move(result));
    }
    built.area_loads.push_back(std::move(area));
    model.cases.push_back(std::move(lc));
  }

  for (const auto& spec : project.combinations) {
    analysis::Combination combination;
    combination.name = spec.name;
    combination.serviceability = spec.serviceability;
    combination.buckling = !spec.serviceability || project.sls_buckling;
    for (const auto& [case_name, factor] : spec.factors) {
      const auto it = std::find_if(project.cases.begin(), project.cases.end(),
                                   [&name = case_name](const CaseSpec& c) { return c.name == name; });
      combination.factors.emplace_back(static_cast<std::size_t>(it - project.cases.begin()), factor);
    }
    model.combinations.push_back(std::move(combination));
  }

  // Point masses for natural frequencies, and the members each frequency check looks at.
  built.point_masses.assign(model.nodes.size(), 0.0);
  for (const auto& spec : project.masses)
    for (std::size_t node : select_nodes(spec.where, model.nodes, wireframe.labels, tol)) built.point_masses[node] += spec.mass;
  for (const auto& check : project.checks.frequency) {
    std::vector<std::size_t> members;
    if (check.where) {
      const CompiledSelector where(*check.where);
      for (std::size_t m = 0; m < model.members.size(); ++m)
        if (where.matches(built.member_sources[m])) members.push_back(m);
      if (members.empty())
        throw InputError(check.where->origin.describe() +
                         ": matches no member; check the name/layer/product patterns against `stepframe inspect`");
    }
    built.frequency_members.push_back(std::move(members));
  }
  return built;
}

}  // namespace stepframe
