#include "stepframe/analysis/model_validation.hpp"

#include "stepframe/analysis/element_releases.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>

namespace stepframe::analysis {
namespace {

bool positive(double v) { return std::isfinite(v) && v > 0; }

std::string member_label(std::size_t m) { return "member " + std::to_string(m); }

// ", part of CAD member k" when the model groups elements into members.
std::string owning_member(const FrameModel& model, std::size_t element) {
  for (std::size_t k = 0; k < model.members.size(); ++k) {
    const auto& chain = model.members[k].elements;
    if (std::find(chain.begin(), chain.end(), element) != chain.end() && (chain.size() > 1 || k != element))
      return " (part of CAD member " + std::to_string(k) + ")";
  }
  return "";
}

void check_member(const FrameModel& model, std::size_t m) {
  const FrameElement& member = model.elements[m];
  for (std::size_t end = 0; end < 2; ++end) {
    if (member.nodes[end] >= model.nodes.size())
      throw std::invalid_argument(member_label(m) + " refers to node " + std::to_string(member.nodes[end]) +
                                  " but the model has " + std::to_string(model.nodes.size()) +
                                  " nodes; fix the member's connectivity");
  }
  if (member.section >= model.sections.size())
    throw std::invalid_argument(member_label(m) + " refers to section " + std::to_string(member.section) +
                                " but the model has " + std::to_string(model.sections.size()) +
                                " sections; assign a section to the member");
  if (member.material >= model.materials.size())
    throw std::invalid_argument(member_label(m) + " refers to material " + std::to_string(member.material) +
                                " but the model has " + std::to_string(model.materials.size()) +
                                " materials; assign a material to the member");
  if (!std::isfinite(member.roll))
    throw std::invalid_argument(member_label(m) + " has a roll angle that is not a finite number");

  const double length = (model.nodes[member.nodes[1]] - model.nodes[member.nodes[0]]).norm();
  if (!positive(length))
    throw std::invalid_argument(member_label(m) + " has zero length (nodes " + std::to_string(member.nodes[0]) +
                                " and " + std::to_string(member.nodes[1]) +
                                " coincide); merge or remove the member");

  const Section& s = model.sections[member.section];
  const auto section_error = [&](const char* what) {
    return std::invalid_argument(member_label(m) + ": section '" + s.designation + "' has a non-positive or invalid " +
                                 what + "; correct the section properties");
  };
  if (!positive(s.A)) throw section_error("area A");
  if (!positive(s.Iy)) throw section_error("second moment Iy");
  if (!positive(s.Iz)) throw section_error("second moment Iz");
  if (!positive(s.J)) throw section_error("torsion constant J");
  if (!positive(s.depth)) throw section_error("depth");
  if (!positive(s.width)) throw section_error("width");

  const Material& mat = model.materials[member.material];
  const auto material_error = [&](const char* what) {
    return std::invalid_argument(member_label(m) + ": material '" + mat.name + "' has a non-positive or invalid " +
                                 what + "; correct the material");
  };
  if (!positive(mat.E)) throw material_error("Young's modulus E");
  if (!positive(mat.G)) throw material_error("shear modulus G");
  if (!std::isfinite(mat.density) || mat.density < 0) throw material_error("density");

  if (const auto mechanism = release_mechanism(member.releases))
    throw std::invalid_argument(member_label(m) + owning_member(model, m) + " is released so that it forms a mechanism on its own (" + *mechanism +
                                "); keep at least one end fixed in that direction, e.g. release torsion (rx) or the "
                                "axial force (ux) at one end only");
}

}  // namespace

void validate_model(const FrameModel& model) {
  if (model.elements.empty()) throw std::invalid_argument("the model has no members; there is nothing to analyse");
  for (std::size_t n = 0; n < model.nodes.size(); ++n) {
    if (!model.nodes[n].allFinite())
      throw std::invalid_argument("node " + std::to_string(n) + " has a coordinate that is not a finite number");
  }
  for (std::size_t m = 0; m < model.elements.size(); ++m) check_member(model, m);

  // Members are chains: every element used once, each starting where the previous one ends.
  std::vector<bool> used(model.elements.size(), false);
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    const auto& chain = model.members[m].elements;
    if (chain.empty()) throw std::invalid_argument("member " + std::to_string(m) + " has no elements");
    for (std::size_t k = 0; k < chain.size(); ++k) {
      if (chain[k] >= model.elements.size() || used[chain[k]])
        throw std::invalid_argument("member " + std::to_string(m) + " refers to element " + std::to_string(chain[k]) +
                                    " which does not exist or belongs to another member");
      used[chain[k]] = true;
      if (k > 0 && model.elements[chain[k - 1]].nodes[1] != model.elements[chain[k]].nodes[0])
        throw std::invalid_argument("member " + std::to_string(m) + ": element " + std::to_string(chain[k]) +
                                    " does not start where element " + std::to_string(chain[k - 1]) + " ends");
    }
  }
  if (!model.members.empty() && std::find(used.begin(), used.end(), false) != used.end())
    throw std::invalid_argument("element " + std::to_string(std::find(used.begin(), used.end(), false) - used.begin()) +
                                " belongs to no member");

  for (std::size_t s = 0; s < model.supports.size(); ++s) {
    if (model.supports[s].node >= model.nodes.size())
      throw std::invalid_argument("support " + std::to_string(s) + " refers to node " +
                                  std::to_string(model.supports[s].node) + " which does not exist");
    for (double k : model.supports[s].spring)
      if (!std::isfinite(k) || k < 0)
        throw std::invalid_argument("support " + std::to_string(s) + " at node " + std::to_string(model.supports[s].node) +
                                    " has a spring stiffness that is negative or not a finite number");
  }
  auto fixed_at = [&](std::size_t node, int dof) {
    return std::any_of(model.supports.begin(), model.supports.end(), [&](const Support& s) {
      return s.node == node && s.fixed[static_cast<std::size_t>(dof)];
    });
  };
  for (std::size_t c = 0; c < model.cases.size(); ++c) {
    const LoadCase& lc = model.cases[c];
    const std::string label = "load case " + std::to_string(c) + " '" + lc.name + "'";
    for (const NodeLoad& load : lc.node_loads) {
      if (load.node >= model.nodes.size())
        throw std::invalid_argument(label + " loads node " + std::to_string(load.node) + " which does not exist");
      if (!load.force.allFinite() || !load.moment.allFinite())
        throw std::invalid_argument(label + " has a non-finite load on node " + std::to_string(load.node));
    }
    for (const ElementUniformLoad& load : lc.element_loads) {
      if (load.element >= model.elements.size())
        throw std::invalid_argument(label + " loads member " + std::to_string(load.element) + " which does not exist");
      if (!load.w.allFinite())
        throw std::invalid_argument(label + " has a non-finite load on " + member_label(load.element));
    }
    for (const ElementLoad& load : lc.partial_loads) {
      if (load.element >= model.elements.size())
        throw std::invalid_argument(label + " loads member " + std::to_string(load.element) + " which does not exist");
      if (!load.w_start.allFinite() || !load.w_end.allFinite() || !std::isfinite(load.a) || !std::isfinite(load.b))
        throw std::invalid_argument(label + " has a non-finite load on " + member_label(load.element));
      const auto& el = model.elements[load.element];
      const double length = (model.nodes[el.nodes[1]] - model.nodes[el.nodes[0]]).norm();
      const double b = load.b < 0 ? length : load.b;
      const double tol = 1e-9 * length;
      if (load.a < -tol || load.a > length + tol || (!load.point && (b < load.a - tol || b > length + tol)))
        throw std::invalid_argument(label + ": a load on " + member_label(load.element) + " lies outside it (from " +
                                    std::to_string(load.a) + " m to " + std::to_string(b) + " m on a member " +
                                    std::to_string(length) + " m long)");
    }
    for (const Settlement& d : lc.settlements) {
      if (d.node >= model.nodes.size() || d.dof < 0 || d.dof > 5)
        throw std::invalid_argument(label + " moves node " + std::to_string(d.node) + " which does not exist");
      if (!std::isfinite(d.value))
        throw std::invalid_argument(label + " has a non-finite settlement at node " + std::to_string(d.node));
      if (!fixed_at(d.node, d.dof))
        throw std::invalid_argument(label + " moves node " + std::to_string(d.node) + " in " +
                                    dof_names[static_cast<std::size_t>(d.dof)] +
                                    ", which no support fixes; a settlement needs a support fixed in that direction");
    }
  }
  for (std::size_t c = 0; c < model.combinations.size(); ++c) {
    const Combination& combo = model.combinations[c];
    for (const auto& [index, factor] : combo.factors) {
      if (index >= model.cases.size())
        throw std::invalid_argument("combination " + std::to_string(c) + " '" + combo.name + "' refers to load case " +
                                    std::to_string(index) + " which does not exist");
      if (!std::isfinite(factor))
        throw std::invalid_argument("combination " + std::to_string(c) + " '" + combo.name +
                                    "' has a factor that is not a finite number");
    }
  }
}

}  // namespace stepframe::analysis
