#pragma once
// How far apart two spellings are, for "did you mean" suggestions.

#include <cstddef>
#include <string_view>

namespace stepframe::analysis {

/// Levenshtein distance: the fewest single-character insertions, deletions
/// and substitutions that turn `a` into `b` (case-sensitive).
std::size_t edit_distance(std::string_view a, std::string_view b);

}  // namespace stepframe::analysis
