#pragma once
// "Did you mean ...?" for names people mistype.

#include <string>
#include <string_view>
#include <vector>

namespace stepframe {

/// Up to `count` candidates closest to `word` by edit distance (case-insensitive),
/// nearest first; only those within a distance a typo could explain.
std::vector<std::string> nearest_names(std::string_view word, const std::vector<std::string>& candidates,
                                       std::size_t count = 3);

/// ", did you mean 'a' or 'b'?" or an empty string.
std::string did_you_mean(std::string_view word, const std::vector<std::string>& candidates);

}  // namespace stepframe
