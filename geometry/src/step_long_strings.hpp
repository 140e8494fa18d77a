#pragma once
// OCCT's STEP lexer stops with "input buffer overflow" on a string longer than
// 16382 characters (see max_step_token). A name that long is no name anyone
// reads, so such strings are cut before OCCT sees the text.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>

namespace stepframe::geometry::detail {

/// The text with every string longer than `max_length` characters cut to at
/// most that many, ending in "..."; nothing when no string is that long. A cut
/// never splits a control directive (\X\hh, \X2\...\X0\, \S\c, \P?\, \\) or a
/// doubled quote. Comments and binary values are left as they are.
std::optional<std::string> shorten_long_strings(std::string_view step_text, std::size_t max_length);

}  // namespace stepframe::geometry::detail
