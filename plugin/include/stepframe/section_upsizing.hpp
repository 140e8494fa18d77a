#pragma once
// Section suggestions (README "Suggesting sections: stepframe suggest"):
// for each failing member, the lightest section of its family (or of the
// project's `suggest.sections` list) that makes every check pass, found by
// re-analysing after every round, because a stiffer member draws forces from
// its neighbours, until nothing changes. Optionally members used below a
// threshold are lightened one size at a time while everything still passes.
// The result is a set of project-file rules to paste; nothing is changed by
// itself.
//
// Members are suggested in design groups: members with the same CAD name are
// one group (they get one section, the largest any of them needs); members
// without a name are grouped by product, layers and colour.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/project.hpp"
#include "stepframe/run.hpp"
#include "stepframe/run_control.hpp"

#include <nlohmann/json.hpp>

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace stepframe {

struct SuggestOptions {
  /// Also lighten groups whose governing utilisation is below this (none: only failing groups change).
  std::optional<double> lighten_below;
  std::size_t max_rounds = 12;  ///< analyses after the first, at most
};

/// One group's suggestion.
struct SectionChange {
  std::string group;               ///< for people: "name 'B1'" or "product 'P', layers 'L'"
  MemberSelector where;            ///< the rule's selector (regular expressions, whole value)
  std::vector<std::size_t> members;
  std::string from, to;            ///< designations
  double utilisation_before = 0;   ///< governing utilisation of the group in the first analysis
  double utilisation_after = 0;    ///< in the last
  std::size_t round = 0;           ///< the round the group last changed in (1-based)
};

struct SuggestionRound {
  std::size_t round = 0;
  std::vector<std::string> changes;  ///< "B1: IPE300 -> IPE360"
  std::size_t failing_after = 0;     ///< failing checks in the analysis after the round's changes
};

struct Suggestion {
  std::vector<SectionChange> changes;  ///< groups whose section changed, in project order of their members
  std::vector<SuggestionRound> rounds;
  bool settled = false;      ///< a round changed nothing, or no group could change further
  bool all_pass = false;     ///< every check passes with the suggested sections
  /// Failing checks no section of the candidates fixes (a group at the heaviest candidate, whole-frame
  /// checks, handling length), for people.
  std::vector<std::string> unresolved;
  double mass_before = 0, mass_after = 0;  ///< [kg]
  ExitStatus status() const { return all_pass ? ExitStatus::pass : ExitStatus::check_failed; }
};

/// Suggests sections for `project` on `step` (the model read once): the first analysis is `first` (as
/// analyse_model gives it for the project). Throws what analyse_model throws.
Suggestion suggest_sections(const Project& project, const geometry::StepModel& step, const Analysis& first,
                            const SuggestOptions& options = {}, const RunControl& control = {});

/// The suggestion as YAML rules to paste below the project's rules (a later rule wins), with comments.
std::string suggestion_yaml(const Suggestion& suggestion);

/// suggest.json (schema stepframe-suggest/1).
nlohmann::json suggestion_json(const Suggestion& suggestion);

/// A few lines for the terminal.
std::string suggestion_text(const Suggestion& suggestion);

/// Writes suggest.yaml and suggest.json into `out_dir` (replaced whole). Returns the files.
std::vector<std::filesystem::path> write_suggestion(const Suggestion& suggestion, const std::filesystem::path& out_dir);

}  // namespace stepframe
