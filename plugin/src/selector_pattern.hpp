#pragma once
// The regular expressions of selectors (where: {name, layer, product, colour,
// point_name, point_layer}): RE2, whose matching time grows linearly with the
// length of the value whatever the pattern, so a pattern such as (a+)+b cannot
// hang a run on a long name.

#include <memory>
#include <string>
#include <string_view>

namespace re2 {
class RE2;
}

namespace stepframe::detail {

/// A selector's pattern, compiled once: matched case-insensitively against the
/// whole value (README "Project file"). The syntax is RE2's, which covers the
/// usual . * + ? | ( ) [ ] {n,m} \d \w \s and (?:...); back-references and
/// look-arounds, which need backtracking, are refused.
class SelectorPattern {
 public:
  /// Throws std::invalid_argument with RE2's reason when `pattern` is not valid.
  explicit SelectorPattern(const std::string& pattern);
  /// True when the whole of `value` matches.
  bool matches(std::string_view value) const;

 private:
  std::shared_ptr<const re2::RE2> re_;
};

}  // namespace stepframe::detail
