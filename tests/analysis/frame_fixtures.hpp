#pragma once
// Small model builders shared by the analysis tests. The section and material
// numbers are convenient round values for the tests, not catalogue data.

#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Core>
#include <Eigen/Geometry>

#include <array>
#include <cstddef>

namespace stepframe::analysis::test {

/// A doubly symmetric section with clearly different Iy, Iz and J so that
/// mixing them up shows in the results.
inline Section test_section() {
  Section s;
  s.designation = "TEST-I";
  s.A = 5.0e-3;
  s.Iy = 8.0e-5;
  s.Iz = 6.0e-6;
  s.J = 2.0e-7;
  s.depth = 0.30;
  s.width = 0.15;
  return s;
}

inline Material test_steel() {
  Material m;
  m.name = "test steel";
  m.E = 210e9;
  m.G = 81e9;
  m.fy = 355e6;
  m.density = 7850;
  return m;
}

inline Support support(std::size_t node, std::array<bool, 6> fixed) { return Support{node, fixed}; }
inline constexpr std::array<bool, 6> fixed_all{true, true, true, true, true, true};

/// One member from `a` to `b` with the test section and steel, no supports or cases yet.
inline FrameModel single_member(const Eigen::Vector3d& a, const Eigen::Vector3d& b, double roll = 0) {
  FrameModel model;
  model.nodes = {a, b};
  model.elements = {FrameElement{{0, 1}, 0, 0, roll}};
  model.sections = {test_section()};
  model.materials = {test_steel()};
  return model;
}

/// Sum over nodes of the reactions, as a force and a moment about the origin.
struct Resultant {
  Eigen::Vector3d force = Eigen::Vector3d::Zero();
  Eigen::Vector3d moment = Eigen::Vector3d::Zero();
};

inline Resultant reaction_resultant(const FrameModel& model, const Eigen::VectorXd& reactions) {
  Resultant r;
  for (std::size_t n = 0; n < model.nodes.size(); ++n) {
    const auto i = static_cast<Eigen::Index>(6 * n);
    const Eigen::Vector3d f = reactions.segment<3>(i);
    r.force += f;
    r.moment += model.nodes[n].cross(f) + reactions.segment<3>(i + 3);
  }
  return r;
}

}  // namespace stepframe::analysis::test
