#pragma once
// Splitting a large wireframe's STEP text into two texts of about half the members each, so that two
// processes can read them at once (OCCT's reader runs on one core and is not thread-safe): the read of
// a 10,000-member file then takes about as long as the read of one half.
//
// A split is made only where reading the two parts gives, joined, exactly what reading the whole gives
// (step_two_processes.hpp joins them and checks the rest):
// - one shape representation lists the members: its list of items holds at least `min_members` curve
//   sets or curves (GEOMETRIC_CURVE_SET, GEOMETRIC_SET, TRIMMED_CURVE, POLYLINE, ...), besides axis
//   placements;
//   the sets hold curves only (no loose points);
// - the members of the two halves share no entity (each point, line and name belongs to one member);
// - every other entity that names a member does so from plain lists of references (layers, the
//   representation itself: each part keeps its own members there), or names members of one half only
//   (a styled item: it goes with its half); every other entity is copied into both parts;
// - no curve or shape lies outside the members (it would be read twice), the representation is placed
//   once (at most one assembly usage, no representation maps) and the file holds one data section.
// Both parts keep every entity's id, so entity ids in attributes and messages stay those of the file.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>

namespace stepframe::geometry::detail {

/// The text of part `part` (0: the first half of the members in the representation's order, 1: the
/// rest), or nullopt when the text is not split (the reason is logged at debug level). The text has
/// passed the structure check (StepStructureCheck) and needs no rewriting other than long lists.
std::optional<std::string> step_split_part(std::string_view text, std::size_t min_members, int part);

}  // namespace stepframe::geometry::detail
