#include "stepframe/inspect.hpp"

#include "json_shapes.hpp"
#include "stepframe/counted.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/project_reader.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cctype>

namespace stepframe {
namespace {

std::pair<Eigen::Vector3d, Eigen::Vector3d> bounding_box(const std::vector<Eigen::Vector3d>& nodes) {
  if (nodes.empty()) return {Eigen::Vector3d::Zero(), Eigen::Vector3d::Zero()};
  Eigen::Vector3d low = nodes.front(), high = nodes.front();
  for (const auto& p : nodes) low = low.cwiseMin(p), high = high.cwiseMax(p);
  return {low, high};
}

// What the read file holds, merged into a wireframe with `options`.
Inspection inspect_read(const geometry::StepModel& step, const geometry::WireframeOptions& options) {
  Inspection inspection;
  inspection.file = step.file;
  inspection.length_unit = step.length_unit;
  inspection.metres_per_unit = step.metres_per_unit;
  inspection.merge_tolerance = options.merge_tolerance;
  inspection.wireframe = geometry::build_wireframe(step, options);
  auto& counts = inspection.attribute_counts;
  for (const auto& m : inspection.wireframe.members) {
    if (!m.source.name.empty()) ++counts["name"][m.source.name];
    if (!m.source.product.empty()) ++counts["product"][m.source.product];
    if (!m.source.colour.empty()) ++counts["colour"][m.source.colour];
    for (const auto& layer : m.source.layers) ++counts["layer"][layer];
  }
  return inspection;
}

std::string fixity(const SupportSpec& spec) {
  static constexpr const char* names[] = {"ux", "uy", "uz", "rx", "ry", "rz"};
  std::vector<std::string> fixed, springs;
  for (std::size_t d = 0; d < 6; ++d) {
    if (spec.fixed[d]) fixed.push_back(names[d]);
    if (spec.spring[d] > 0) springs.push_back(names[d]);
  }
  std::string out = fixed.size() == 6 ? "fixed" : fixed == std::vector<std::string>{"ux", "uy", "uz"} ? "pinned"
                                                                                               : fmt::format("{}", fmt::join(fixed, " "));
  if (!springs.empty()) out += fmt::format("{}springs {}", out.empty() ? "" : ", ", fmt::join(springs, " "));
  return out;
}

std::vector<std::string> missing(const UnassignedMember& u) {
  std::vector<std::string> out;
  if (u.no_section) out.push_back("section");
  if (u.no_material) out.push_back("material");
  return out;
}

}  // namespace

Inspection inspect_step(const std::filesystem::path& file, double merge_tolerance,
                        const geometry::StepReadOptions& read) {
  geometry::WireframeOptions options;
  options.merge_tolerance = merge_tolerance;
  return inspect_read(geometry::read_step(file, read), options);
}

Inspection inspect_project(const std::filesystem::path& project_file, std::optional<double> merge_tolerance,
                           const geometry::StepReadOptions& read) {
  Project project = read_project(project_file);
  if (merge_tolerance) project.merge_tolerance = *merge_tolerance;
  Inspection inspection = inspect_read(geometry::read_step(project.model, read), wireframe_options(project));
  inspection.project = project_file;
  inspection.properties = member_properties(project, inspection.wireframe);
  for (std::size_t m = 0; m < inspection.properties.size(); ++m) {
    const auto& p = inspection.properties[m];
    if (!p.section || !p.material) inspection.unassigned.push_back({m, !p.section, !p.material});
  }
  inspection.warnings = selectors_matching_nothing(project, inspection.wireframe);
  inspection.supports = support_nodes(project, inspection.wireframe);
  inspection.support_specs = project.supports;
  for (const auto& s : inspection.supports)
    if (!s.problem.empty()) inspection.warnings.push_back(s.problem + " (`run` stops here)");
  if (project.supports.empty())
    inspection.warnings.push_back(project_file.string() + ": no supports; `run` needs some, e.g. supports: [{where: {z: 0}, fix: pinned}]");
  return inspection;
}

bool is_project_file(const std::filesystem::path& path) {
  std::string extension = path.extension().string();
  std::transform(extension.begin(), extension.end(), extension.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return extension == ".yaml" || extension == ".yml";
}

nlohmann::json inspection_json(const Inspection& in) {
  const auto& wf = in.wireframe;
  const auto [low, high] = bounding_box(wf.nodes);
  std::string text;
  {
    detail::JsonWriter w([&](std::string_view piece) { text.append(piece); });
    w.begin_object();
    w.key("file").value(in.file.string());
    w.key("length_unit").value(in.length_unit);
    w.key("metres_per_unit").value(in.metres_per_unit);
    w.key("merge_tolerance").value(in.merge_tolerance);
    w.key("bounding_box").begin_object();
    w.key("min");
    json_shapes::vec(w, low);
    w.key("max");
    json_shapes::vec(w, high);
    w.end_object();
    w.key("node_count").value(wf.nodes.size());
    w.key("member_count").value(wf.members.size());
    w.key("attributes").begin_object();
    for (const auto& [kind, values] : in.attribute_counts) {
      w.key(kind).begin_object();
      for (const auto& [value, count] : values) w.key(value).value(count);
      w.end_object();
    }
    w.end_object();
    w.key("members").begin_array();
    for (std::size_t i = 0; i < wf.members.size(); ++i) {
      const auto& m = wf.members[i];
      w.begin_object();
      w.key("id").value(i);
      w.key("nodes").begin_array();
      w.value(m.nodes.front());
      w.value(m.nodes.back());
      w.end_array();
      w.key("path").begin_array();
      for (std::size_t n : m.nodes) w.value(n);
      w.end_array();
      w.key("length").value(geometry::path_length(wf, m));
      w.key("source");
      json_shapes::source(w, m.source);
      if (i < in.properties.size()) {
        const auto& p = in.properties[i];
        const auto optional = [&](const char* key, const std::optional<std::string>& value) {
          w.key(key);
          if (value) w.value(*value);
          else w.null();
        };
        optional("section", p.section);
        w.key("section_from").value(p.section_from);
        optional("material", p.material);
        w.key("material_from").value(p.material_from);
      }
      w.end_object();
    }
    w.end_array();
    w.key("points").begin_array();
    for (const auto& label : wf.labels) {
      w.begin_object();
      w.key("node").value(label.node);
      w.key("xyz");
      json_shapes::vec(w, wf.nodes[label.node]);
      w.key("source");
      json_shapes::source(w, label.source);
      w.end_object();
    }
    w.end_array();
    w.key("diagnostics").begin_array();
    for (const auto& d : wf.diagnostics) json_shapes::diagnostic(w, d);
    w.end_array();
    if (!in.project.empty()) {
      w.key("project").value(in.project.string());
      w.key("unassigned_members").begin_array();
      for (const auto& u : in.unassigned) {
        w.begin_object();
        w.key("id").value(u.member);
        w.key("source");
        json_shapes::source(w, wf.members[u.member].source);
        w.key("missing").strings(missing(u));
        w.end_object();
      }
      w.end_array();
      w.key("supports").begin_array();
      for (std::size_t s = 0; s < in.supports.size(); ++s) {
        w.begin_object();
        w.key("where").value(in.support_specs[s].where.origin.describe());
        w.key("nodes").begin_array();
        for (std::size_t n : in.supports[s].nodes) w.value(n);
        w.end_array();
        w.key("fixity").value(fixity(in.support_specs[s]));
        w.key("problem").value(in.supports[s].problem);
        w.end_object();
      }
      w.end_array();
      w.key("warnings").strings(in.warnings);
    }
    w.end_object();
  }
  return nlohmann::json::parse(text);
}

std::string inspection_text(const Inspection& in) {
  const auto& wf = in.wireframe;
  const auto [low, high] = bounding_box(wf.nodes);
  std::string out = in.project.empty() ? std::string() : fmt::format("project {}\n", in.project.string());
  out += fmt::format("{}\n  length unit   {} (1 {} = {} m)\n", in.file.string(), in.length_unit, in.length_unit,
                     in.metres_per_unit);
  out += fmt::format("  bounding box  x {:.3f} .. {:.3f}  y {:.3f} .. {:.3f}  z {:.3f} .. {:.3f} m\n", low[0], high[0],
                     low[1], high[1], low[2], high[2]);
  out += fmt::format("  members       {}\n  nodes         {} (merge tolerance {} mm)\n", wf.members.size(),
                     wf.nodes.size(), in.merge_tolerance * 1e3);
  for (const auto& [kind, values] : in.attribute_counts) {
    out += fmt::format("\n  {:<30} members\n", kind);
    for (const auto& [value, count] : values) out += fmt::format("  {:<30} {:>7}\n", value, count);
  }
  if (!wf.labels.empty()) {
    out += fmt::format("\n  {:<24} {:<20} {:>6}  {:<28} {}\n", "named point", "layers", "node", "at (m)", "entity");
    for (const auto& label : wf.labels) {
      const auto& p = wf.nodes[label.node];
      out += fmt::format("  {:<24} {:<20} {:>6}  {:<28} {}\n", label.source.name.empty() ? "-" : label.source.name,
                         label.source.layers.empty() ? "-" : fmt::format("{}", fmt::join(label.source.layers, ", ")),
                         label.node, fmt::format("({:.3f}, {:.3f}, {:.3f})", p[0], p[1], p[2]), label.source.entity);
    }
  }
  if (!in.project.empty()) {
    out += fmt::format("\n  {:>6}  {:<10} {:<20} {:<16} {:<14} {:<24} {:<10} {}\n", "member", "entity", "name", "layers",
                       "section", "from", "material", "from");
    for (std::size_t m = 0; m < in.properties.size() && m < wf.members.size(); ++m) {
      const auto& src = wf.members[m].source;
      const auto& p = in.properties[m];
      out += fmt::format("  {:>6}  {:<10} {:<20} {:<16} {:<14} {:<24} {:<10} {}\n", m,
                         src.entity.empty() ? "-" : src.entity, src.name.empty() ? "-" : src.name,
                         src.layers.empty() ? "-" : fmt::format("{}", fmt::join(src.layers, ", ")),
                         p.section.value_or("NONE"), p.section ? p.section_from : "-", p.material.value_or("NONE"),
                         p.material ? p.material_from : "-");
    }
    std::size_t supported = 0;
    for (const auto& s : in.supports) supported += s.nodes.size();
    out += fmt::format("\n  supports: {} found\n", counted(supported, "node"));
    if (supported > 0)
      out += fmt::format("  {:>6}  {:<28} {:<22} {}\n", "node", "at (m)", "fixity", "selected by");
    for (std::size_t s = 0; s < in.supports.size(); ++s)
      for (std::size_t n : in.supports[s].nodes) {
        const auto& p = wf.nodes[n];
        out += fmt::format("  {:>6}  {:<28} {:<22} {}\n", n, fmt::format("({:.3f}, {:.3f}, {:.3f})", p[0], p[1], p[2]),
                           fixity(in.support_specs[s]), in.support_specs[s].where.origin.describe());
      }
    for (const auto& warning : in.warnings) out += "  warning: " + warning + "\n";
    out += fmt::format("\n  members without section or material: {}{}\n", in.unassigned.size(),
                       in.unassigned.empty() ? "" : " (`run` refuses them; add rules that match them)");
    if (!in.unassigned.empty())
      out += fmt::format("  {:>6}  {:<10} {:<24} {:<20} {:<20} {}\n", "member", "entity", "name", "layers", "product",
                         "missing");
    for (const auto& u : in.unassigned) {
      const auto& src = wf.members[u.member].source;
      out += fmt::format("  {:>6}  {:<10} {:<24} {:<20} {:<20} {}\n", u.member, src.entity.empty() ? "-" : src.entity,
                         src.name.empty() ? "-" : src.name,
                         src.layers.empty() ? "-" : fmt::format("{}", fmt::join(src.layers, ", ")),
                         src.product.empty() ? "-" : src.product, fmt::format("{}", fmt::join(missing(u), ", ")));
    }
  }
  std::size_t counts[3] = {0, 0, 0};
  for (const auto& d : wf.diagnostics) ++counts[static_cast<int>(d.severity)];
  out += fmt::format("\n  diagnostics   {}, {}, {}\n", counted(counts[2], "error"), counted(counts[1], "warning"),
                     counted(counts[0], "note"));
  if (wf.diagnostics.empty()) return out;
  out += fmt::format("  {:<8} {:<22} {:<18} {:<28} {}\n", "severity", "code", "entities", "at (m)", "message");
  for (const auto& d : wf.diagnostics) {
    constexpr std::size_t shown = 3;
    std::vector<std::string> ids(d.entities.begin(),
                                 d.entities.begin() + static_cast<std::ptrdiff_t>(std::min(shown, d.entities.size())));
    std::string entities = ids.empty() ? "-" : fmt::format("{}", fmt::join(ids, " "));
    if (d.entities.size() > shown) entities += " ...";
    const std::string at = d.at ? fmt::format("({:.3f}, {:.3f}, {:.3f})", (*d.at)[0], (*d.at)[1], (*d.at)[2]) : "-";
    out += fmt::format("  {:<8} {:<22} {:<18} {:<28} {}\n", geometry::to_string(d.severity), d.code, entities, at,
                       d.message);
  }
  return out;
}

}  // namespace stepframe
