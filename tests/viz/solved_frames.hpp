#pragma once
// Small frames solved for the viz tests: the writers recover every station
// from a result, so the tests give them real results and compare the files
// with the analysis' own recovery (member_line, element_line).

#include "stepframe/analysis/solve.hpp"

#include <Eigen/Core>

namespace stepframe::viz::testing {

/// A 0.3 x 0.1 m rectangle given by properties (exact A and I of the rectangle,
/// a round J), in round-valued test steel.
inline analysis::FrameModel box_model() {
  analysis::FrameModel model;
  analysis::Section box;
  box.designation = "BOX";
  box.A = 0.03, box.Iy = 2.25e-4, box.Iz = 2.5e-5, box.J = 7e-5, box.depth = 0.3, box.width = 0.1;
  model.sections = {box};
  analysis::Material steel;
  steel.name = "test steel", steel.E = 210e9, steel.G = 81e9, steel.fy = 355e6, steel.density = 7850;
  model.materials = {steel};
  return model;
}

/// An L of two 2 m members, fixed at the foot (0, 0, 0), a 2 m horizontal
/// member to (2, 0, 0) and a 2 m vertical one up to (2, 0, 2), loaded at the
/// top with a force across and a torque, so that every array varies.
inline analysis::FrameModel l_frame() {
  analysis::FrameModel model = box_model();
  model.nodes = {{0, 0, 0}, {2, 0, 0}, {2, 0, 2}};
  model.elements = {{{0, 1}, 0, 0, 0.0, {}}, {{1, 2}, 0, 0, 0.0, {}}};
  analysis::Support fixed;
  fixed.node = 0;
  fixed.fixed.fill(true);
  model.supports = {fixed};
  analysis::LoadCase load;
  load.name = "ULS";
  load.node_loads = {analysis::NodeLoad{2, Eigen::Vector3d(0, 30e3, -20e3), Eigen::Vector3d(0, 0, 4e3)}};
  load.element_loads = {analysis::ElementUniformLoad{0, Eigen::Vector3d(0, 0, -5e3)}};
  model.cases = {load};
  return model;
}

inline analysis::LoadResult solved(const analysis::FrameModel& model) {
  analysis::SolveOptions options;
  options.buckling_modes = 0;
  return analysis::solve(model, options).at(0);
}

}  // namespace stepframe::viz::testing
