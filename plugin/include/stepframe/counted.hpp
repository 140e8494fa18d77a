#pragma once
// Counts in messages, grammatical: "1 member", "2 members".

#include <cstddef>
#include <string>
#include <string_view>

namespace stepframe {

/// "1 member", "0 members", "3 members"; `plural` defaults to `singular` + "s".
inline std::string counted(std::size_t n, std::string_view singular, std::string_view plural = {}) {
  return std::to_string(n) + " " +
         (n == 1 ? std::string(singular) : plural.empty() ? std::string(singular) + "s" : std::string(plural));
}

}  // namespace stepframe
