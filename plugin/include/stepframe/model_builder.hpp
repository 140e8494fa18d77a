#pragma once
// From a project and a wireframe to the structural model: sections, materials
// and roll from rules and CAD attributes; supports and loads from selectors.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "stepframe/project.hpp"

#include <vector>

namespace stepframe {

struct BuiltModel {
  analysis::FrameModel model;
  std::vector<geometry::SourceInfo> member_sources;  ///< one per model member
};

/// Each member's section is the last matching rule's `section`, else the first
/// designation recognised in its name, then its product name, then its layers;
/// its material likewise. Throws InputError listing every member (by STEP
/// entity) left without a section or material, and for selectors that match
/// nothing, naming the project-file line.
BuiltModel build_frame_model(const Project& project, const geometry::Wireframe& wireframe);

}  // namespace stepframe
