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
  /// End releases in local axes, [start, end] x Dof: a true entry makes that end
  /// action zero (e.g. ry and rz at both ends: a pin-ended member). The element
  /// is condensed statically (see release.hpp).
  std::array<std::array<bool, 6>, 2> releases{};
};

/// Degrees of freedom of a node, in this order everywhere.
enum Dof : int { ux = 0, uy, uz, rx, ry, rz };
inline constexpr std::array<const char*, 6> dof_names{"ux", "uy", "uz", "rx", "ry", "rz"};

struct Support {
  std::size_t node = 0;
  std::array<bool, 6> fixed{};  ///< indexed by Dof
  /// Elastic support stiffness per Dof, global axes [N/m for ux uy uz, N m/rad
  /// for rx ry rz]; 0 = none. A fixed DOF ignores its spring.
  std::array<double, 6> spring{};
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

/// The axes a member load's components are given in.
enum class LoadAxes {
  global,     ///< global X, Y, Z; intensity per unit length of the member
  local,      ///< the element's local x, y, z; intensity per unit length of the member
  projected,  ///< global X, Y, Z; intensity per unit length projected on the plane normal to each
              ///< component's direction (snow or roof load on a sloping rafter)
};

/// A distributed load varying linearly from w_start at distance a to w_end at
/// distance b from the element's start (0 <= a < b <= L), or, when `point` is
/// set, a concentrated force w_start [N] at distance a. Intensities [N/m].
struct ElementLoad {
  std::size_t element = 0;
  LoadAxes axes = LoadAxes::global;
  bool point = false;
  double a = 0;   ///< [m] from the element's start
  double b = -1;  ///< [m] from the element's start; negative = the element's end
  Eigen::Vector3d w_start = Eigen::Vector3d::Zero();
  Eigen::Vector3d w_end = Eigen::Vector3d::Zero();  ///< ignored for a point load
};

/// An enforced displacement of a supported (fixed) DOF, global axes [m or rad].
struct Settlement {
  std::size_t node = 0;
  int dof = 0;  ///< a Dof value; the node must be fixed in it
  double value = 0;
};

struct LoadCase {
  std::string name;
  bool self_weight = false;  ///< A * density * g per length along -Z on every member
  std::vector<NodeLoad> node_loads;
  std::vector<ElementUniformLoad> element_loads;
  std::vector<ElementLoad> partial_loads;  ///< trapezoidal, partial and point loads on elements
  std::vector<Settlement> settlements;
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
  /// A serviceability (SLS) combination rather than an ultimate one (ULS).
  bool serviceability = false;
  /// Analyse its buckling (alpha_cr and modes) when SolveOptions asks for modes.
  bool buckling = true;
};

/// How the model is analysed.
struct AnalysisSettings {
  /// Timoshenko elements: shear deformation from the sections' shear areas
  /// (Avz, Avy; a section without them uses A, see frame_element.hpp).
  bool shear_deformation = false;
  /// Every combination is also solved to second order (P-Delta, iterated);
  /// the combination's results are then the second-order ones.
  bool second_order = false;
};

struct FrameModel {
  AnalysisSettings settings;
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

/// For each element, its member's index in member_chains(model).
std::vector<std::size_t> element_members(const FrameModel& model);

}  // namespace stepframe::analysis
