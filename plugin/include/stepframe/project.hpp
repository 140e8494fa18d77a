#pragma once
// A stepframe project: what to analyse and how, as read from a project file
// (format: README, "Project file"). Every value is SI; the reader converts.

#include "stepframe/analysis/combination_rules.hpp"
#include "stepframe/analysis/aisc360.hpp"
#include "stepframe/analysis/en1993.hpp"
#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/viz/vtk_compression.hpp"

#include <Eigen/Core>

#include <array>
#include <cstddef>
#include <filesystem>
#include <map>
#include <numbers>
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
  /// Nodes that named or layered points of the CAD file sit on: regular
  /// expressions matched case-insensitively against the whole point name /
  /// any of its layers (both must match when both are given).
  std::optional<std::string> point_name, point_layer;
  SourceLine origin;
};

struct Rule {
  MemberSelector where;
  std::optional<std::string> section;
  std::optional<std::string> material;
  std::optional<double> roll;  ///< [rad]
  /// A point [m] the section's local z axis points towards (`orient_to: [x, y, z]`); overrides roll.
  std::optional<Eigen::Vector3d> orient_to{};
  /// End releases, local axes: [start, end] x (ux uy uz rx ry rz); set when the rule has `release:`.
  std::optional<std::array<std::array<bool, 6>, 2>> release{};
  /// Buckling lengths as factors of the member length (`buckling: {y: 1, z: 0.7, lt: 0.5}`).
  std::optional<double> buckling_y{}, buckling_z{}, buckling_lt{};
  /// Deflection limit span/ratio for the members matched (`deflection_ratio: 250`).
  std::optional<double> deflection_ratio{};
  /// Members matched are joined where they cross each other (`join_crossings: true`).
  bool join_crossings = false;
};

struct SupportSpec {
  NodeSelector where;
  std::array<bool, 6> fixed{};  ///< ux uy uz rx ry rz
  std::array<double, 6> spring{};  ///< [N/m, N m/rad] per DOF; 0 = none
};

/// The axes a member load is given in (analysis::LoadAxes).
enum class LoadAxesSpec { global, local, projected };

struct MemberLoadSpec {
  MemberSelector where;
  Eigen::Vector3d w = Eigen::Vector3d::Zero();  ///< [N/m] (at `from` when w_end is set); or the point force [N]
  std::optional<Eigen::Vector3d> w_end{};       ///< [N/m] at `to`: a trapezoidal load
  std::optional<double> from{}, to{};           ///< [m] along the member from its start; default: whole member
  std::optional<double> at{};                   ///< [m] along the member: a point load of force w
  LoadAxesSpec axes = LoadAxesSpec::global;
};

/// An enforced displacement of supported nodes.
struct SettlementSpec {
  NodeSelector where;
  std::array<std::optional<double>, 6> value{};  ///< [m or rad] per DOF
};

struct NodeLoadSpec {
  NodeSelector where;
  Eigen::Vector3d force = Eigen::Vector3d::Zero();   ///< [N]
  Eigen::Vector3d moment = Eigen::Vector3d::Zero();  ///< [N m]
};

/// A pressure on the panels of a plane (`cases[i].area_loads`, README "Area loads").
struct AreaLoadSpec {
  double pressure = 0;                              ///< [Pa]; positive along the load's direction
  std::optional<MemberSelector> where{};            ///< the members that bound panels (default: all in the plane)
  std::optional<double> plane_x{}, plane_y{}, plane_z{};  ///< `plane: {z: 3.5}` [m]
  std::vector<Eigen::Vector3d> polygon{};           ///< the region's outline [m] (gives the plane too)
  std::vector<std::vector<Eigen::Vector3d>> openings{};  ///< outlines left unloaded [m]
  bool normal = false;       ///< `direction: normal`: along the plane's normal (else `global`: -Z)
  bool two_way = true;       ///< `span: two_way` | `one_way`
  Eigen::Vector3d beams_along = Eigen::Vector3d::UnitX();  ///< one-way: the beams along this carry the load
  SourceLine origin{};
};

struct CaseSpec {
  std::string name;
  bool self_weight = false;
  std::vector<MemberLoadSpec> member_loads;
  std::vector<NodeLoadSpec> node_loads;
  std::vector<SettlementSpec> settlements{};
  SourceLine origin;
  /// `category:` the kind of action, for generated combinations (README "Generated combinations").
  std::optional<analysis::ActionCategory> category{};
  std::string group{};                            ///< `group:` cases of one group are alternatives
  std::optional<analysis::PsiFactors> psi{};      ///< `psi: [psi0, psi1, psi2]`: the case's own factors
  std::vector<AreaLoadSpec> area_loads{};
};

struct CombinationSpec {
  std::string name;
  std::vector<std::pair<std::string, double>> factors;  ///< (case name, factor), file order
  SourceLine origin;
  /// `kind: sls` (serviceability) or `uls` (ultimate). Without `kind:`, a name
  /// that says SLS or serviceability, or factors all at most 1, mean sls;
  /// anything else uls (see default_serviceability).
  bool serviceability = false;
  /// Generated combinations: the rule that wrote it ("EN 1990 6.10b") and its leading case; empty when written by hand.
  std::string rule{};
  std::string leading{};
};

/// The limit state a combination without `kind:` is taken for: sls when its
/// name contains "SLS", "serv" or "char" (characteristic), uls when it contains
/// "ULS"; otherwise sls when every factor is at most 1 (characteristic,
/// frequent and quasi-permanent combinations of EN 1990 6.5.3), else uls.
bool default_serviceability(const std::string& name, const std::vector<std::pair<std::string, double>>& factors);

struct StressCheckSpec {
  std::vector<std::string> combinations;  ///< case or combination names
};

struct DeflectionCheckSpec {
  double span_ratio = 300;
  std::vector<std::string> combinations;
};

/// EN 1993-1-1 member checks (5.5, 6.2, 6.3.1, 6.3.2, 6.3.3).
struct En1993CheckSpec {
  std::vector<std::string> combinations;
  /// checks.en1993.ltb_method (general: 6.3.2.2, rolled: 6.3.2.3) and f_modification (6.58).
  analysis::en1993::LateralTorsionalOptions ltb{};
};

/// ANSI/AISC 360-16 member checks (chapters D to H, effective length method):
/// `checks: {aisc360: {method: LRFD | ASD, combinations: [...]}}`.
struct Aisc360CheckSpec {
  std::vector<std::string> combinations;
  analysis::aisc360::Method method = analysis::aisc360::Method::lrfd;
};

/// Storey drift: relative horizontal displacement of the ends of each vertical member <= h / ratio.
struct DriftCheckSpec {
  double storey_ratio = 300;
  std::vector<std::string> combinations;
};

/// Frame stability, EN 1993-1-1 5.2.1(3): alpha_cr >= the limit, else second-order effects matter.
struct StabilityCheckSpec {
  double alpha_cr_min = 10;
  std::vector<std::string> combinations;
};

/// Natural-frequency limits (`checks.frequency`), set by the project (README "Natural frequencies"):
/// a lowest frequency, and/or a band around a machine's running frequency that no mode may enter.
struct FrequencyCheckSpec {
  std::optional<MemberSelector> where;  ///< the members (floor, walkway, machine support); none: the whole frame
  std::optional<double> min_hz;         ///< [Hz]
  std::optional<double> running_hz;     ///< [Hz]
  double band = 0.2;                    ///< half-width as a fraction of running_hz
  SourceLine origin;
};

struct ChecksSpec {
  std::optional<StressCheckSpec> stress;
  std::optional<DeflectionCheckSpec> deflection;
  std::optional<En1993CheckSpec> en1993;
  std::optional<Aisc360CheckSpec> aisc360;
  std::optional<DriftCheckSpec> drift;
  std::optional<StabilityCheckSpec> stability;
  std::vector<FrequencyCheckSpec> frequency{};
  double gamma_M0 = 1.0;  ///< EN 1993-1-1 6.1(1) NOTE 2B recommended values
  double gamma_M1 = 1.0;
};

/// Which results a kind of output is written for: a kind of VTK file, or
/// results.json's node displacements and member summaries.
enum class VtkSelection {
  all,        ///< every case and combination, and every sway-imperfection variant of a combination
  /// Every case and combination, and of a combination's sway-imperfection variants (EN 1993-1-1 5.3.2)
  /// the one that governs it (its largest member utilisation), besides the governing results.
  combinations,
  governing,  ///< the results that govern: the largest member utilisation and the lowest alpha_cr (governing_results)
  none,
};

/// Which checks carry their clause text and intermediate values (`details`)
/// in results.json. Every check keeps its member, check, result, station,
/// value, limit, utilisation and verdict whatever this says.
enum class CheckDetails {
  all,        ///< every check
  governing,  ///< each member's governing check (its largest utilisation), every failing check and the frame checks
};

/// What a run writes (the `outputs:` block). The defaults keep a
/// building-sized run's folder small (under 1 GB at 100,000 members): line
/// models for every case and combination (of a combination's sway variants
/// the governing one), seven points per element; surfaces, buckling modes and
/// results.json's node displacements and member summaries for the governing
/// results only; clause texts and intermediate values for each member's
/// governing check and every failing one.
struct OutputsSpec {
  VtkSelection line_models = VtkSelection::combinations;  ///< outputs.line_models
  VtkSelection surfaces = VtkSelection::governing;       ///< outputs.surfaces
  VtkSelection buckling_modes = VtkSelection::governing;  ///< outputs.buckling_modes
  /// outputs.result_details: the results whose node displacements and member
  /// summaries results.json holds (every result keeps its name, alpha_cr and
  /// reactions; every variant is solved and checked whatever this says).
  VtkSelection result_details = VtkSelection::governing;
  CheckDetails check_details = CheckDetails::governing;  ///< outputs.check_details
  viz::VtkCompression compression = viz::VtkCompression::lz4;  ///< outputs.compression
  /// outputs.line_model_points: points per element in line models (seven: six
  /// parts, as the buckling modes; a parabola is drawn within 1/36 of its
  /// peak, linear interpolation erring by f'' h^2 / 8: common practice).
  std::size_t line_model_points = 7;
  std::size_t surface_sections = 3;    ///< outputs.surface_sections: outlines per element in surfaces
  bool pictures = true;                                  ///< outputs.pictures: the report's pictures
  /// outputs.browser_view: the report's interactive 3D view; unset: on up to
  /// browser_view_members members (the page grows by about 1 kB per member).
  std::optional<bool> browser_view;
  static constexpr std::size_t browser_view_members = 20000;
  /// outputs.calculation_sheets: members (index, entity "#123" or CAD name)
  /// whose calculation sheets the report shows besides the governing ones.
  std::vector<std::string> calculation_sheets;
};

/// EN 1993-1-1 5.3.2 sway imperfections on the ultimate combinations
/// (`analysis.sway_imperfection: auto | off | PHI`).
struct SwayImperfectionSpec {
  bool enabled = true;        ///< off: no equivalent horizontal forces
  std::optional<double> phi;  ///< the project's own phi instead of phi_0 alpha_h alpha_m
};

/// A point mass on nodes (`masses:`): equipment, tanks; translational, in every direction.
struct PointMassSpec {
  NodeSelector where;
  double mass = 0;  ///< [kg] at each node selected
};

/// Natural frequencies (`analysis.modes`, `analysis.mass_from`, `analysis.mode_parts`).
struct ModesSpec {
  std::size_t count = 0;                 ///< lowest modes wanted; 0: no modal analysis
  std::optional<std::string> mass_from;  ///< a case or combination whose gravity loads become mass (by g)
  std::size_t parts = 4;                 ///< parts every element is divided into for the modes
};

/// Precamber of beams (`fabrication.camber`): members that are not vertical and whose local deflection
/// under `load` (a case or combination of the permanent loads) exceeds `threshold` get a recommended
/// precamber: that deflection rounded down to the shop's `increment` (common practice).
struct CamberSpec {
  std::string load;
  double threshold = 0.010;  ///< [m]
  double increment = 0.005;  ///< [m]
  SourceLine origin;
};

/// The lifting check (`fabrication.lifting`) of members longer than `min_length`.
struct LiftingSpec {
  double min_length = 0;                   ///< [m]
  std::array<double, 2> points{0.2, 0.8};  ///< sling positions as fractions of the length
  double dynamic_factor = 1.25;            ///< on the self weight (common practice, from memory)
};

/// The `fabrication:` block: identical pieces, handling limits, camber, lifting.
struct FabricationSpec {
  double mark_tolerance = 0.002;      ///< [m] pieces whose lengths differ by at most this share a mark
  std::optional<double> max_length;   ///< [m] the longest piece the shop and transport take
  std::optional<double> max_mass;     ///< [kg] the heaviest
  std::optional<CamberSpec> camber;
  std::optional<LiftingSpec> lifting;
};

/// The `suggest:` block: what `stepframe suggest` may choose from (section_upsizing.hpp).
struct SuggestSpec {
  /// Families ("IPE") or designations ("HEB 240") the suggestions may use; empty: each member's own family.
  std::vector<std::string> sections;
  std::optional<double> lighten_below;  ///< also lighten groups used below this utilisation
};

struct Project {
  std::filesystem::path file;        ///< the project file itself
  std::filesystem::path model;       ///< the STEP file, resolved against the project's folder
  std::string length_unit = "mm";    ///< the project's unit for bare lengths (for reports)
  std::string force_unit = "kN";
  double merge_tolerance = 1e-3;     ///< [m]
  double curve_max_turn = 5.0 * std::numbers::pi / 180.0;  ///< [rad] largest turn per element of a curved member
  bool join_crossings = false;       ///< join members whose centrelines cross away from their ends
  std::map<std::string, analysis::Material> materials;  ///< custom, by name
  std::map<std::string, analysis::Section> sections;    ///< custom, by name
  std::vector<Rule> rules;
  std::vector<SupportSpec> supports;
  std::vector<CaseSpec> cases;
  std::vector<CombinationSpec> combinations;
  ChecksSpec checks;
  bool shear_deformation = false;   ///< analysis.shear_deformation
  bool second_order = false;        ///< analysis.second_order
  std::size_t buckling_modes = 3;   ///< analysis.buckling_modes (0: no buckling analysis)
  bool sls_buckling = false;        ///< analysis.sls_buckling: also buckling of serviceability combinations
  SwayImperfectionSpec sway_imperfection;  ///< analysis.sway_imperfection
  /// analysis.sway_amplification: EN 1993-1-1 5.2.2(5), sway effects times 1 / (1 - 1/alpha_cr) in the
  /// sway variants of combinations with 3 <= alpha_cr < 10 (an alternative to second_order).
  bool sway_amplification = false;
  ModesSpec modes;                    ///< analysis.modes, analysis.mass_from, analysis.mode_parts
  std::vector<PointMassSpec> masses;  ///< masses:
  OutputsSpec outputs;
  FabricationSpec fabrication;  ///< fabrication: (README "Shop data and fabrication checks")
  SuggestSpec suggest;          ///< suggest: (README "Suggesting sections")
};

}  // namespace stepframe
