// The `outputs:` block of a project file: which VTK files a run writes, and
// which results and checks carry their details in results.json.

#include "project_blocks.hpp"

#include <fmt/format.h>

#include <cmath>

namespace stepframe::detail {
namespace {

VtkSelection read_selection(const Reader& r, const YAML::Node& node, const std::string& key) {
  const std::string value = r.text(node, key);
  if (value == "all") return VtkSelection::all;
  if (value == "combinations") return VtkSelection::combinations;
  if (value == "governing") return VtkSelection::governing;
  if (value == "none") return VtkSelection::none;
  r.fail(node, key, "expected all, combinations, governing or none, got '" + value + "'");
}

}  // namespace

OutputsSpec read_outputs(const Reader& r, const YAML::Node& node) {
  OutputsSpec spec;
  if (!node) return spec;
  r.check_keys(node, "outputs", {"line_models", "surfaces", "buckling_modes", "result_details", "check_details",
                                 "compression", "pictures", "line_model_points", "surface_sections", "browser_view",
                                 "calculation_sheets"});
  if (node["line_models"]) spec.line_models = read_selection(r, node["line_models"], "outputs.line_models");
  if (node["surfaces"]) spec.surfaces = read_selection(r, node["surfaces"], "outputs.surfaces");
  if (node["buckling_modes"]) spec.buckling_modes = read_selection(r, node["buckling_modes"], "outputs.buckling_modes");
  if (node["result_details"]) spec.result_details = read_selection(r, node["result_details"], "outputs.result_details");
  if (const auto details = node["check_details"]) {
    const std::string value = r.text(details, "outputs.check_details");
    if (value == "all") spec.check_details = CheckDetails::all;
    else if (value == "governing") spec.check_details = CheckDetails::governing;
    else r.fail(details, "outputs.check_details", "expected all or governing, got '" + value + "'");
  }
  if (node["compression"]) {
    const std::string value = r.text(node["compression"], "outputs.compression");
    if (value == "lz4") spec.compression = viz::VtkCompression::lz4;
    else if (value == "zlib") spec.compression = viz::VtkCompression::zlib;
    else if (value == "none") spec.compression = viz::VtkCompression::none;
    else r.fail(node["compression"], "outputs.compression", "expected lz4, zlib or none, got '" + value + "'");
  }
  if (node["pictures"]) spec.pictures = r.boolean(node["pictures"], "outputs.pictures");
  if (node["browser_view"]) spec.browser_view = r.boolean(node["browser_view"], "outputs.browser_view");
  if (const auto sheets = node["calculation_sheets"]) {
    if (!sheets.IsSequence())
      r.fail(sheets, "outputs.calculation_sheets", "expected a list of members: indices, entities (\"#123\") or names");
    for (std::size_t i = 0; i < sheets.size(); ++i)
      spec.calculation_sheets.push_back(r.text(sheets[i], fmt::format("outputs.calculation_sheets[{}]", i)));
  }
  auto count = [&](const char* key, std::size_t& value) {
    if (!node[key]) return;
    const std::string path = std::string("outputs.") + key;
    const double n = r.number(node[key], path, dimension::none);
    if (!(n >= 2 && n <= 101 && n == std::floor(n))) r.fail(node[key], path, "must be a whole number from 2 to 101");
    value = static_cast<std::size_t>(n);
  };
  count("line_model_points", spec.line_model_points);
  count("surface_sections", spec.surface_sections);
  return spec;
}

}  // namespace stepframe::detail
