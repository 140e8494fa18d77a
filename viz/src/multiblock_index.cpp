#include "stepframe/viz/multiblock_index.hpp"
#include "stepframe/viz/markup.hpp"

#include <fmt/format.h>

#include <algorithm>

namespace stepframe::viz {
std::string escape_markup(std::string_view text) {
  std::string out;
  for (char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      default: out += c;
    }
  }
  return out;
}

std::string multiblock_index(const std::vector<IndexEntry>& entries) {
  std::vector<std::string> groups;
  for (const auto& e : entries)
    if (std::find(groups.begin(), groups.end(), e.group) == groups.end()) groups.push_back(e.group);

  std::string out = "<?xml version=\"1.0\"?>\n"
                    "<VTKFile type=\"vtkMultiBlockDataSet\" version=\"1.0\" byte_order=\"LittleEndian\">\n"
                    "  <vtkMultiBlockDataSet>\n";
  for (std::size_t g = 0; g < groups.size(); ++g) {
    out += fmt::format("    <Block index=\"{}\" name=\"{}\">\n", g, escape_markup(groups[g]));
    std::size_t index = 0;
    for (const auto& e : entries)
      if (e.group == groups[g])
        out += fmt::format("      <DataSet index=\"{}\" name=\"{}\" file=\"{}\"/>\n", index++, escape_markup(e.name),
                           escape_markup(e.file.generic_string()));
    out += "    </Block>\n";
  }
  out += "  </vtkMultiBlockDataSet>\n</VTKFile>\n";
  return out;
}

}  // namespace stepframe::viz
