#include "stepframe/analysis/section.hpp"

#include <cctype>
#include <cstddef>
#include <string>

namespace stepframe::analysis {
namespace {

bool is_digit(char c) { return std::isdigit(static_cast<unsigned char>(c)) != 0; }
bool is_alpha(char c) { return std::isalpha(static_cast<unsigned char>(c)) != 0; }

// "HE200B" / "HE200AA" (size before the series letter) -> "HEB200" / "HEAA200".
std::string series_letter_first(const std::string& s) {
  if (s.size() < 4 || s.compare(0, 2, "HE") != 0 || !is_digit(s[2])) return s;
  std::size_t i = 2;
  while (i < s.size() && (is_digit(s[i]) || s[i] == '.')) ++i;
  if (i == s.size()) return s;
  for (std::size_t j = i; j < s.size(); ++j)
    if (!is_alpha(s[j])) return s;
  return "HE" + s.substr(i) + s.substr(2, i - 2);
}

}  // namespace

std::string normalize_designation(std::string_view designation) {
  // Upper case without separators (spaces, hyphens, underscores).
  std::string packed;
  for (const char c : designation) {
    if (std::isspace(static_cast<unsigned char>(c)) || c == '-' || c == '_') continue;
    packed += static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  }
  // A dot survives only as a decimal point between two digits ("I.P.E." -> "IPE").
  std::string out;
  for (std::size_t i = 0; i < packed.size(); ++i) {
    if (packed[i] == '.') {
      const bool decimal = i > 0 && i + 1 < packed.size() && is_digit(packed[i - 1]) && is_digit(packed[i + 1]);
      if (!decimal) continue;
    }
    out += packed[i];
  }
  return series_letter_first(out);
}

}  // namespace stepframe::analysis
