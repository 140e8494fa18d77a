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
};

/// Each member's section is the last matching rule's `section`, else the first
/// designation recognised in its name, then its product name, then its layers;
/// its material likewise. Throws InputError listing every member (by STEP
/// entity) left without a section or material, and for selectors that match
/// nothing, naming the project-file line.
BuiltModel build_frame_model(const Project& project, const geometry::Wireframe& wireframe);

}  // namespace stepframe
