#pragma once
// From a project and a wireframe to the structural model: sections, materials
// and roll from rules and CAD attributes; supports and loads from selectors.

#include "stepframe/analysis/area_loads.hpp"
#include "stepframe/analysis/en1993.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "stepframe/project.hpp"

#include <optional>
#include <vector>

namespace stepframe {

struct BuiltModel {
  analysis::FrameModel model;
  std::vector<geometry::SourceInfo> member_sources;  ///< one per model member
  std::vector<analysis::en1993::BucklingLengths> buckling;  ///< per member, from rules (default 1.0)
  std::vector<std::optional<double>> deflection_ratio;      ///< per member: a rule's span/ratio limit
  /// Findings about the model as built (e.g. members near, but not within, the vertical tolerance);
  /// the run adds them to the wireframe's diagnostics.
  std::vector<geometry::Diagnostic> diagnostics;
  std::vector<double> point_masses;  ///< per node: the project's `masses:` [kg]
  /// Per `checks.frequency` entry: the members its `where:` selects (empty: no selector, the whole frame).
  std::vector<std::vector<std::size_t>> frequency_members;
  /// Per case, per `area_loads` entry: the panels found and the member loads made of it.
  std::vector<std::vector<analysis::AreaLoadResult>> area_loads;
};

/// How the project turns the file's edges into a wireframe: merge tolerance,
/// curve division and crossing members, as its keys say.
geometry::WireframeOptions wireframe_options(const Project& project);

/// Each member's section is the last matching rule's `section`, else the first
/// designation recognised in its name, then its product name, then its layers;
/// its material likewise. Throws InputError listing every member (by STEP
/// entity) left without a section or material, and for selectors that match
/// nothing, naming the project-file line.
BuiltModel build_frame_model(const Project& project, const geometry::Wireframe& wireframe);

/// A member the rules and its own attributes leave without a section or a material.
struct UnassignedMember {
  std::size_t member = 0;        ///< index into Wireframe::members
  bool no_section = false;
  bool no_material = false;
};

/// A member's section and material as build_frame_model gives them, and what set each.
struct MemberProperties {
  std::optional<std::string> section;   ///< the section's designation; empty when none is found
  std::optional<std::string> material;  ///< the material's name; empty when none is found
  /// "rules[2] (line 12)" or the attribute the designation was found in ("name 'IPE 300'").
  std::string section_from, material_from;
};

/// Each wireframe member's section and material, by the rules and the members'
/// own attributes as build_frame_model reads them. Throws InputError when a
/// rule names an unknown section or material.
std::vector<MemberProperties> member_properties(const Project& project, const geometry::Wireframe& wireframe);

/// The catalogue designation a CAD attribute value names, read as members' own
/// attributes are ("HE 200 B beam" -> "HEB200"); empty when it names none.
std::optional<std::string> designation_in(const std::string& value);

/// The standard material grade a CAD attribute value names ("S355 plate" -> "S355").
std::optional<std::string> material_in(const std::string& value);

/// One message (naming the project-file line) per rule, member load, node load
/// or settlement whose selector matches nothing; `run` stops at the loads,
/// while a rule matching nothing is only suspicious. Supports: support_nodes.
std::vector<std::string> selectors_matching_nothing(const Project& project, const geometry::Wireframe& wireframe);

/// The nodes one support of the project selects, or why it selects none.
struct SupportNodes {
  std::vector<std::size_t> nodes;  ///< indices into Wireframe::nodes
  std::string problem;             ///< the message `run` would stop with; empty when nodes were found
};

/// What each of the project's supports selects, in the project's order.
std::vector<SupportNodes> support_nodes(const Project& project, const geometry::Wireframe& wireframe);

/// The members build_frame_model would refuse for want of a section or a
/// material, by the same rules, without building the model. Throws InputError
/// when a rule names an unknown section or material, as build_frame_model does.
std::vector<UnassignedMember> members_without_properties(const Project& project, const geometry::Wireframe& wireframe);

}  // namespace stepframe
