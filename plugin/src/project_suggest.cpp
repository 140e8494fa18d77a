// The `suggest:` block of a project file: the sections suggestions may use.

#include "project_blocks.hpp"

#include "stepframe/analysis/section.hpp"

#include <algorithm>

namespace stepframe::detail {

SuggestSpec read_suggest(const Reader& r, const YAML::Node& node) {
  SuggestSpec spec;
  if (!node) return spec;
  r.check_keys(node, "suggest", {"sections", "lighten_below"});
  if (const auto list = node["sections"]) {
    r.expect_list(list, "suggest.sections");
    const auto& entries = analysis::catalogue_entries();
    for (std::size_t i = 0; i < list.size(); ++i) {
      const std::string key = Reader::index("suggest.sections", i);
      const std::string item = r.text(list[i], key);
      const std::string family = analysis::normalize_designation(item);
      const bool is_family =
          std::any_of(entries.begin(), entries.end(), [&](const auto& e) { return e.family == family; });
      if (!is_family && !analysis::find_catalogue_section(item))
        r.fail(list[i], key, "'" + item + "' is neither a catalogue family (IPE, HEA, SHS, ...) nor a section; "
                             "`stepframe sections` lists them");
      spec.sections.push_back(is_family ? family : analysis::normalize_designation(item));
    }
  }
  if (const auto n = node["lighten_below"]) {
    const double u = r.number(n, "suggest.lighten_below", dimension::none);
    if (!(u > 0 && u < 1)) r.fail(n, "suggest.lighten_below", "expected a utilisation between 0 and 1, e.g. 0.5");
    spec.lighten_below = u;
  }
  return spec;
}

}  // namespace stepframe::detail
