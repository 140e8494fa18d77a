#include "step_quotes.hpp"

namespace stepframe::geometry::detail {

std::optional<std::string> encode_doubled_quotes(std::string_view text) {
  std::string out;
  bool changed = false;
  enum class Mode { normal, comment, string } mode = Mode::normal;
  std::size_t copied = 0;  // text before this is in `out` (only once something changed)
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    switch (mode) {
      case Mode::comment:
        if (c == '*' && i + 1 < text.size() && text[i + 1] == '/') mode = Mode::normal, ++i;
        break;
      case Mode::string:
        if (c != '\'') break;
        if (i + 1 < text.size() && text[i + 1] == '\'') {  // a doubled quote: one ' in the string
          if (!changed) out.reserve(text.size() + 64), changed = true;
          out.append(text.substr(copied, i - copied));
          out.append("\\X\\27");
          copied = i + 2;
          ++i;
        } else {
          mode = Mode::normal;
        }
        break;
      case Mode::normal:
        if (c == '\'') mode = Mode::string;
        else if (c == '/' && i + 1 < text.size() && text[i + 1] == '*') mode = Mode::comment, ++i;
        break;
    }
  }
  if (!changed) return std::nullopt;
  out.append(text.substr(copied));
  return out;
}

}  // namespace stepframe::geometry::detail
