#pragma once
// From a project and a wireframe to the structural model: sections, materials
// and roll from rules and CAD attributes; supports and loads from selectors.

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

/// The members build_frame_model would refuse for want of a section or a
/// material, by the same rules, without building the model. Throws InputError
/// when a rule names an unknown section or material, as build_frame_model does.
std::vector<UnassignedMember> members_without_properties(const Project& project, const geometry::Wireframe& wireframe);

}  // namespace stepframe
