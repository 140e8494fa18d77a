#include "stepframe/inspect.hpp"

#include "json_shapes.hpp"
#include "stepframe/geometry/step_reader.hpp"

#include <fmt/format.h>

namespace stepframe {
namespace {

std::pair<Eigen::Vector3d, Eigen::Vector3d> bounding_box(const std::vector<Eigen::Vector3d>& nodes) {
  if (nodes.empty()) return {Eigen::Vector3d::Zero(), Eigen::Vector3d::Zero()};
  Eigen::Vector3d low = nodes.front(), high = nodes.front();
  for (const auto& p : nodes) low = low.cwiseMin(p), high = high.cwiseMax(p);
  return {low, high};
}

}  // namespace

Inspection inspect_step(const std::filesystem::path& file, double merge_tolerance) {
  Inspection inspection;
  const auto step = geometry::read_step(file);
  inspection.file = file;
  inspection.length_unit = step.length_unit;
  inspection.metres_per_unit = step.metres_per_unit;
  inspection.merge_tolerance = merge_tolerance;
  inspection.wireframe = geometry::build_wireframe(step, merge_tolerance);
  auto& counts = inspection.attribute_counts;
  for (const auto& m : inspection.wireframe.members) {
    if (!m.source.name.empty()) ++counts["name"][m.source.name];
    if (!m.source.product.empty()) ++counts["product"][m.source.product];
    if (!m.source.colour.empty()) ++counts["colour"][m.source.colour];
    for (const auto& layer : m.source.layers) ++counts["layer"][layer];
  }
  return inspection;
}

nlohmann::json inspection_json(const Inspection& in) {
  const auto& wf = in.wireframe;
  const auto [low, high] = bounding_box(wf.nodes);
  nlohmann::json j{{"file", in.file.string()},
                   {"length_unit", in.length_unit},
                   {"metres_per_unit", in.metres_per_unit},
                   {"merge_tolerance", in.merge_tolerance},
                   {"bounding_box", {{"min", json_shapes::vec(low)}, {"max", json_shapes::vec(high)}}},
                   {"node_count", wf.nodes.size()},
                   {"member_count", wf.members.size()},
                   {"attributes", in.attribute_counts}};
  auto& members = j["members"] = nlohmann::json::array();
  for (std::size_t i = 0; i < wf.members.size(); ++i) {
    const auto& m = wf.members[i];
    members.push_back({{"id", i},
                       {"nodes", {m.nodes.front(), m.nodes.back()}},
                       {"path", m.nodes},
                       {"length", geometry::path_length(wf, m)},
                       {"source", json_shapes::source(m.source)}});
  }
  auto& diagnostics = j["diagnostics"] = nlohmann::json::array();
  for (const auto& d : wf.diagnostics) diagnostics.push_back(json_shapes::diagnostic(d));
  return j;
}

std::string inspection_text(const Inspection& in) {
  const auto& wf = in.wireframe;
  const auto [low, high] = bounding_box(wf.nodes);
  std::string out = fmt::format("{}\n  length unit   {} (1 {} = {} m)\n", in.file.string(), in.length_unit,
                                in.length_unit, in.metres_per_unit);
  out += fmt::format("  bounding box  x {:.3f} .. {:.3f}  y {:.3f} .. {:.3f}  z {:.3f} .. {:.3f} m\n", low[0], high[0],
                     low[1], high[1], low[2], high[2]);
  out += fmt::format("  members       {}\n  nodes         {} (merge tolerance {} mm)\n", wf.members.size(),
                     wf.nodes.size(), in.merge_tolerance * 1e3);
  for (const auto& [kind, values] : in.attribute_counts) {
    out += fmt::format("\n  {:<30} members\n", kind);
    for (const auto& [value, count] : values) out += fmt::format("  {:<30} {:>7}\n", value, count);
  }
  out += fmt::format("\n  diagnostics   {}\n", wf.diagnostics.empty() ? "none" : "");
  for (const auto& d : wf.diagnostics) {
    out += fmt::format("  {:<8} {:<22} {}", geometry::to_string(d.severity), d.code, d.message);
    if (!d.entities.empty()) out += fmt::format(" [{}]", fmt::join(d.entities, " "));
    if (d.at) out += fmt::format(" at ({:.4f}, {:.4f}, {:.4f}) m", (*d.at)[0], (*d.at)[1], (*d.at)[2]);
    out += "\n";
  }
  return out;
}

}  // namespace stepframe
