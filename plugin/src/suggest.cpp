#include "stepframe/suggest.hpp"

#include "stepframe/analysis/edit_distance.hpp"

#include <algorithm>
#include <cctype>

namespace stepframe {
namespace {

std::string lower(std::string_view s) {
  std::string out(s);
  for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}

}  // namespace

std::vector<std::string> nearest_names(std::string_view word, const std::vector<std::string>& candidates,
                                       std::size_t count) {
  const std::string w = lower(word);
  const std::size_t limit = std::max<std::size_t>(2, w.size() / 2);
  std::vector<std::pair<std::size_t, std::string>> scored;
  for (const auto& c : candidates) {
    const std::size_t d = analysis::edit_distance(w, lower(c));
    if (d <= limit) scored.emplace_back(d, c);
  }
  std::stable_sort(scored.begin(), scored.end(),
                   [](const auto& a, const auto& b) { return a.first < b.first; });
  std::vector<std::string> out;
  for (std::size_t i = 0; i < scored.size() && i < count; ++i) out.push_back(scored[i].second);
  return out;
}

std::string did_you_mean(std::string_view word, const std::vector<std::string>& candidates) {
  const auto names = nearest_names(word, candidates);
  if (names.empty()) return {};
  std::string out = ", did you mean ";
  for (std::size_t i = 0; i < names.size(); ++i) {
    if (i > 0) out += i + 1 == names.size() ? " or " : ", ";
    out += "'" + names[i] + "'";
  }
  return out + "?";
}

}  // namespace stepframe
