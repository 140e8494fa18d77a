#include "step_long_strings.hpp"

#include <algorithm>

namespace stepframe::geometry::detail {
namespace {

// Length of the string element starting at content[i]: a control directive of
// ISO 10303-21 (7.3.3-7.3.4) as a whole, a doubled quote, or one character.
std::size_t element_length(std::string_view content, std::size_t i) {
  const std::string_view rest = content.substr(i);
  if (rest.starts_with("''") || rest.starts_with("\\\\")) return 2;
  if (rest.starts_with("\\X2\\") || rest.starts_with("\\X4\\")) {
    const std::size_t end = rest.find("\\X0\\", 4);
    return end == std::string_view::npos ? rest.size() : end + 4;
  }
  if (rest.starts_with("\\X\\")) return std::min<std::size_t>(5, rest.size());
  if (rest.starts_with("\\S\\") || rest.starts_with("\\P")) return std::min<std::size_t>(4, rest.size());
  return 1;
}

// The longest prefix of `content` of at most `keep` characters that ends between elements.
std::size_t cut_at(std::string_view content, std::size_t keep) {
  std::size_t at = 0;
  while (at < content.size()) {
    const std::size_t next = at + element_length(content, at);
    if (next > keep) break;
    at = next;
  }
  return at;
}

}  // namespace

std::optional<std::string> shorten_long_strings(std::string_view text, std::size_t max_length) {
  static constexpr std::string_view marker = "...";
  std::string out;
  bool changed = false;
  std::size_t copied = 0;  // text before this is in `out` (only once something changed)
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (c == '/' && i + 1 < text.size() && text[i + 1] == '*') {  // a comment
      const std::size_t close = text.find("*/", i + 2);
      if (close == std::string_view::npos) break;
      i = close + 1;
    } else if (c == '"') {  // a binary value
      const std::size_t close = text.find('"', i + 1);
      if (close == std::string_view::npos) break;
      i = close;
    } else if (c == '\'') {  // a string: find its closing quote ('' stays inside)
      std::size_t end = i + 1;
      while (end < text.size() && !(text[end] == '\'' && (end + 1 >= text.size() || text[end + 1] != '\'')))
        end += text[end] == '\'' ? 2 : 1;
      const std::string_view content = text.substr(i + 1, end - i - 1);
      if (content.size() > max_length) {
        if (!changed) out.reserve(text.size()), changed = true;
        out.append(text.substr(copied, i + 1 - copied));
        out.append(content.substr(0, cut_at(content, max_length - marker.size())));
        out.append(marker);
        copied = end;
      }
      i = end;
    }
  }
  if (!changed) return std::nullopt;
  out.append(text.substr(copied));
  return out;
}

}  // namespace stepframe::geometry::detail
