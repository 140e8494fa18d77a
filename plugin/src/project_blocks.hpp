#pragma once
// Readers of the project file's top-level blocks that live in files of their
// own (project_<block>.cpp); project_reader.cpp calls them.

#include "project_yaml.hpp"

namespace stepframe::detail {

/// The `outputs:` block (README "Outputs").
OutputsSpec read_outputs(const Reader& r, const YAML::Node& node);

/// The `checks:` block (README "Checks"). A check may name any case or
/// combination; without `combinations:` the strength and stability checks
/// run under the ultimate combinations, deflection and drift under the
/// serviceability ones (every case and combination when there are none of
/// that kind, every case when there are no combinations). Without a block,
/// stresses are screened under the ultimate combinations so chosen.
ChecksSpec read_checks(const Reader& r, const YAML::Node& node, const std::vector<std::string>& cases,
                       const std::vector<CombinationSpec>& combinations);

/// `[psi0, psi1, psi2]`, each between 0 and 1 (a case's `psi:`, a category's in `generate: {psi: ...}`).
analysis::PsiFactors read_psi(const Reader& r, const YAML::Node& node, const std::string& path);

/// A `generate:` item of the `combinations:` block (README "Generated
/// combinations"): the combinations of EN 1990 or ASCE/SEI 7 for the cases'
/// categories, every factor overridable.
std::vector<CombinationSpec> read_generated_combinations(const Reader& r, const YAML::Node& node,
                                                         const std::string& path, const std::vector<CaseSpec>& cases);

/// The `masses:` block (README "Natural frequencies"): point masses on nodes.
std::vector<PointMassSpec> read_masses(const Reader& r, const YAML::Node& node);

/// `checks.frequency`: a list of natural-frequency limits.
std::vector<FrequencyCheckSpec> read_frequency_checks(const Reader& r, const YAML::Node& node, const std::string& path);

/// `cases[i].area_loads` (README "Area loads").
std::vector<AreaLoadSpec> read_area_loads(const Reader& r, const YAML::Node& node, const std::string& path);

/// The selectors of project_reader.cpp, for the block readers: members chosen by `where:`, and the
/// nodes of an item given by `where:` or `near:` beside its other keys (`allowed`: the item's keys).
MemberSelector member_selector(const Reader& r, const YAML::Node& where, const std::string& path);
NodeSelector node_target(const Reader& r, const YAML::Node& item, const std::string& path, const std::string& what,
                         const std::vector<std::string>& allowed);

/// The `fabrication:` block (README "Shop data and fabrication checks"); camber.load must name one of
/// `results` (cases and combinations).
FabricationSpec read_fabrication(const Reader& r, const YAML::Node& node, const std::vector<std::string>& results);

/// The `suggest:` block (README "Suggesting sections"): every item of sections: must name a catalogue
/// family or section.
SuggestSpec read_suggest(const Reader& r, const YAML::Node& node);

}  // namespace stepframe::detail
