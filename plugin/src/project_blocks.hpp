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

/// The `fabrication:` block (README "Shop data and fabrication checks"); camber.load must name one of
/// `results` (cases and combinations).
FabricationSpec read_fabrication(const Reader& r, const YAML::Node& node, const std::vector<std::string>& results);

/// The `suggest:` block (README "Suggesting sections"): every item of sections: must name a catalogue
/// family or section.
SuggestSpec read_suggest(const Reader& r, const YAML::Node& node);

}  // namespace stepframe::detail
