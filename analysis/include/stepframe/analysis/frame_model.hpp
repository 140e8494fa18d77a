#pragma once
// The structural model: what the solver sees. All quantities SI (m, N, Pa, kg).

#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"

#include <Eigen/Core>

#include <array>
#include <cstddef>
#include <string>
#include <utility>
#include <vector>

namespace stepframe::analysis {

/// Standard gravity [m/s^2] (ISO 80000-3); self weight acts along -Z.
inline constexpr double standard_gravity = 9.80665;

/// A straight 12-DOF frame element between two nodes.
struct FrameElement {
  std::array<std::size_t, 2> nodes{};  ///< start, end: local x runs start -> end
  std::size_t section = 0;             ///< index into FrameModel::sections
  std::size_t material = 0;            ///< index into FrameModel::materials
  double roll = 0;                     ///< rotation of the section about local x [rad]
};

/// Degrees of freedom of a node, in this order everywhere.
enum Dof : int { ux = 0, uy, uz, rx, ry, rz };
inline constexpr std::array<const char*, 6> dof_names{"ux", "uy", "uz", "rx", "ry", "rz"};

struct Support {
  std::size_t node = 0;
  std::array<bool, 6> fixed{};  ///< indexed by Dof
};

struct NodeLoad {
  std::size_t node = 0;
  Eigen::Vector3d force = Eigen::Vector3d::Zero();   ///< [N], global axes
  Eigen::Vector3d moment = Eigen::Vector3d::Zero();  ///< [N m], global axes
};

/// Uniform load over a whole element, force per length along it [N/m], global axes.
struct ElementUniformLoad {
  std::size_t element = 0;
  Eigen::Vector3d w = Eigen::Vector3d::Zero();
};

struct LoadCase {
  std::string name;
  bool self_weight = false;  ///< A * density * g per length along -Z on every member
  std::vector<NodeLoad> node_loads;
  std::vector<ElementUniformLoad> element_loads;
};

/// A member as the CAD model draws it (one edge, or one polyline or curve):
/// a chain of elements, in order from the member's start to its end, each
/// element starting where the previous one ends. Checks, take-off and reports
/// speak of members; the solver sees elements.
struct Member {
  std::vector<std::size_t> elements;
};

/// A linear combination of load cases.
struct Combination {
  std::string name;
  std::vector<std::pair<std::size_t, double>> factors;  ///< (case index, factor)
};

struct FrameModel {
  std::vector<Eigen::Vector3d> nodes;  ///< [m]
  std::vector<FrameElement> elements;
  /// CAD members; when empty, every element is a member of its own (see member_chains).
  std::vector<Member> members;
  std::vector<Section> sections;
  std::vector<Material> materials;
  std::vector<Support> supports;
  std::vector<LoadCase> cases;
  std::vector<Combination> combinations;
};

/// The model's members, or one member per element when the model gives none.
std::vector<Member> member_chains(const FrameModel& model);

}  // namespace stepframe::analysis
