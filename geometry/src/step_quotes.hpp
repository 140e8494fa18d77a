#pragma once
// OCCT's STEP lexer mis-reads a doubled quote ('' inside a string, ISO
// 10303-21 7.3.3) when a comma follows it ('O''Neil'', east' loses the
// entity). The same character written as the control directive \X\27 (ISO
// 10303-21 7.3.4, ISO 8859-1 code 0x27) is read right, so strings are
// rewritten that way before OCCT sees them.

#include <optional>
#include <string>
#include <string_view>

namespace stepframe::geometry::detail {

/// The text with every '' inside a string written as \X\27, or nothing when
/// no string holds one. Comments and binary values are left as they are.
std::optional<std::string> encode_doubled_quotes(std::string_view step_text);

}  // namespace stepframe::geometry::detail
