#pragma once
// Building a project in code instead of a project file. Every value is SI
// (m, N, Pa, kg/m^3, rad); nothing is converted here.
//
//   auto project = stepframe::ProjectBuilder("walkway")
//                      .rule({.layer = "BEAMS"}, "IPE300", "S355")
//                      .support({.z = 0.0}, stepframe::fixity::pinned)
//                      .load_case("G", /*self_weight=*/true)
//                      .load_case(stepframe::CaseSpec{.name = "Q", .member_loads = {{{.layer = "BEAMS"}, {0, 0, -4.5e3}}}})
//                      .combination("ULS", {{"G", 1.35}, {"Q", 1.5}})
//                      .check_stress({"ULS"})
//                      .build();

#include "stepframe/project.hpp"

#include <array>
#include <filesystem>
#include <optional>
#include <string>
#include <utility>
#include <vector>

namespace stepframe {

/// Support fixities, ux uy uz rx ry rz.
namespace fixity {
inline constexpr std::array<bool, 6> fixed{true, true, true, true, true, true};
inline constexpr std::array<bool, 6> pinned{true, true, true, false, false, false};
}  // namespace fixity

class ProjectBuilder {
 public:
  /// `name` names the project in messages (it plays the part of the file name).
  explicit ProjectBuilder(std::string name = "<project>");

  /// The STEP file the project analyses (needed only when running from it;
  /// a run from another model source ignores it).
  ProjectBuilder& model(std::filesystem::path step_file);
  ProjectBuilder& merge_tolerance(double metres);
  /// Largest tangent turn per element of a curved member [rad] (default 5 degrees; above 0, at most pi/2).
  ProjectBuilder& curve_max_turn(double radians);
  /// Join members whose centrelines cross away from their ends (default: not joined, a note each).
  ProjectBuilder& join_crossings(bool join);
  /// Units for people: the ones reports use when they convert back.
  ProjectBuilder& display_units(std::string length, std::string force);
  ProjectBuilder& material(analysis::Material material);   ///< custom, by its name
  ProjectBuilder& section(analysis::Section section);      ///< custom, by its designation
  ProjectBuilder& rule(MemberSelector where, std::optional<std::string> section,
                       std::optional<std::string> material = {}, std::optional<double> roll = {});
  /// A rule with every key a project file's rule may set (releases, buckling lengths, ...).
  ProjectBuilder& rule(Rule rule);
  ProjectBuilder& support(NodeSelector where, std::array<bool, 6> fixed);
  ProjectBuilder& load_case(std::string name, bool self_weight);
  ProjectBuilder& load_case(CaseSpec load_case);
  /// Its limit state is taken as default_serviceability says (project.hpp).
  ProjectBuilder& combination(std::string name, std::vector<std::pair<std::string, double>> factors);
  /// Stress check (max |sigma| <= fy) under these cases or combinations.
  ProjectBuilder& check_stress(std::vector<std::string> names);
  /// Local member deflection <= L / span_ratio under these cases or combinations.
  ProjectBuilder& check_deflection(double span_ratio, std::vector<std::string> names);

  /// Validates as the project-file reader does (at least one case, names
  /// unique, factors and checks naming existing cases or combinations, a
  /// positive tolerance, rules setting something) and returns the project.
  /// What the reader checks only when the model is built (sections and
  /// materials that exist, selectors that match) is checked by the run.
  /// Without any check, stresses are checked under the ultimate combinations
  /// (every combination when none is ultimate, every case when there is no
  /// combination). Throws InputError naming the item.
  Project build() const;

 private:
  Project project_;
  bool checks_set_ = false;
};

}  // namespace stepframe
