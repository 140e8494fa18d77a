#pragma once
// A stepframe project: what to analyse and how, as read from a project file
// (format: README, "Project file"). Every value is SI; the reader converts.

#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"

#include <Eigen/Core>

#include <array>
#include <filesystem>
#include <map>
#include <optional>
#include <string>
#include <vector>

namespace stepframe {

/// Where a value came from in the project file, for messages.
struct SourceLine {
  std::filesystem::path file;
  int line = 0;  ///< 1-based; 0 when unknown
  std::string key;
  std::string describe() const;  ///< "platform.yaml:12 (rules[0].section)"
};

/// Selects members by their CAD attributes. Each present pattern is a regular
/// expression matched case-insensitively against the whole value; a member
/// matches when every present pattern matches (any layer may match `layer`).
struct MemberSelector {
  std::optional<std::string> name, layer, product, colour;
  SourceLine origin;
};

/// Selects nodes: on planes (each given coordinate within the merge
/// tolerance) or the node nearest to a point.
struct NodeSelector {
  std::optional<double> x, y, z;         ///< [m]
  std::optional<Eigen::Vector3d> near;   ///< [m]
  SourceLine origin;
};

struct Rule {
  MemberSelector where;
  std::optional<std::string> section;
  std::optional<std::string> material;
  std::optional<double> roll;  ///< [rad]
};

struct SupportSpec {
  NodeSelector where;
  std::array<bool, 6> fixed{};  ///< ux uy uz rx ry rz
};

struct MemberLoadSpec {
  MemberSelector where;
  Eigen::Vector3d w = Eigen::Vector3d::Zero();  ///< [N/m], global axes
};

struct NodeLoadSpec {
  NodeSelector where;
  Eigen::Vector3d force = Eigen::Vector3d::Zero();   ///< [N]
  Eigen::Vector3d moment = Eigen::Vector3d::Zero();  ///< [N m]
};

struct CaseSpec {
  std::string name;
  bool self_weight = false;
  std::vector<MemberLoadSpec> member_loads;
  std::vector<NodeLoadSpec> node_loads;
  SourceLine origin;
};

struct CombinationSpec {
  std::string name;
  std::vector<std::pair<std::string, double>> factors;  ///< (case name, factor), file order
  SourceLine origin;
};

struct StressCheckSpec {
  std::vector<std::string> combinations;  ///< case or combination names
};

struct DeflectionCheckSpec {
  double span_ratio = 300;
  std::vector<std::string> combinations;
};

struct ChecksSpec {
  std::optional<StressCheckSpec> stress;
  std::optional<DeflectionCheckSpec> deflection;
};

struct Project {
  std::filesystem::path file;        ///< the project file itself
  std::filesystem::path model;       ///< the STEP file, resolved against the project's folder
  std::string length_unit = "mm";    ///< the project's unit for bare lengths (for reports)
  std::string force_unit = "kN";
  double merge_tolerance = 1e-3;     ///< [m]
  std::map<std::string, analysis::Material> materials;  ///< custom, by name
  std::map<std::string, analysis::Section> sections;    ///< custom, by name
  std::vector<Rule> rules;
  std::vector<SupportSpec> supports;
  std::vector<CaseSpec> cases;
  std::vector<CombinationSpec> combinations;
  ChecksSpec checks;
};

}  // namespace stepframe
