#include "building_model.hpp"

#include "stepframe/geometry/step_writer.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <stdexcept>
#include <string>
#include <vector>

namespace stepframe::bench {
namespace {

constexpr double bay = 6.0, storey = 3.5;  // [m]

enum Kind { column, beam_x, beam_y, secondary, brace, kinds };
constexpr const char* names[kinds] = {"HE 300 B", "IPE 400", "IPE 360", "IPE 330", "CHS 168.3x8"};
constexpr const char* layers[kinds] = {"COLUMNS", "BEAMS", "BEAMS", "SECONDARY", "BRACING"};

struct Curve {
  long start, end;  // indices into the points
  Kind kind;
};

bool braced_bay(int bay_index, int bays) { return bay_index % 3 == 0 || bay_index == bays - 1; }

}  // namespace

std::size_t building_member_count(const BuildingSize& s) {
  const auto nx = static_cast<std::size_t>(s.bays_x), ny = static_cast<std::size_t>(s.bays_y),
             nz = static_cast<std::size_t>(s.storeys);
  std::size_t braces = 0;
  for (int i = 0; i < s.bays_x; ++i) braces += braced_bay(i, s.bays_x) ? 2 : 0;
  for (int j = 0; j < s.bays_y; ++j) braces += braced_bay(j, s.bays_y) ? 2 : 0;
  return nz * ((nx + 1) * (ny + 1) + nx * (ny + 1) + (nx + 1) * ny + nx * ny + braces);
}

BuildingSize building_size_for(std::size_t members) {
  const int storeys = std::max(2, static_cast<int>(std::lround(2 * std::log10(std::max(static_cast<double>(members), 10.0)))));
  for (int n = 1;; ++n) {
    const BuildingSize s{n, n, storeys};
    if (building_member_count(s) >= members) return s;
  }
}

std::size_t write_building_model(const std::filesystem::path& folder, const BuildingSize& s) {
  std::filesystem::create_directories(folder);
  // Points: the grid nodes (i, j, k), then the mid-points of the X beams (i + 1/2, j, k), k >= 1.
  const int nx = s.bays_x + 1, ny = s.bays_y + 1, nz = s.storeys + 1;
  const long grid_points = static_cast<long>(nx) * ny * nz;
  auto node = [&](int i, int j, int k) { return (static_cast<long>(k) * ny + j) * nx + i; };
  auto mid = [&](int i, int j, int k) { return grid_points + (static_cast<long>(k) * ny + j) * nx + i; };
  std::vector<Eigen::Vector3d> points(static_cast<std::size_t>(2 * grid_points));  // [m]
  for (int k = 0; k < nz; ++k)
    for (int j = 0; j < ny; ++j)
      for (int i = 0; i < nx; ++i) {
        points[static_cast<std::size_t>(node(i, j, k))] = {i * bay, j * bay, k * storey};
        points[static_cast<std::size_t>(mid(i, j, k))] = {(i + 0.5) * bay, j * bay, k * storey};
      }
  std::vector<Curve> curves;
  for (int k = 0; k < s.storeys; ++k)
    for (int j = 0; j < ny; ++j)
      for (int i = 0; i < nx; ++i) curves.push_back({node(i, j, k), node(i, j, k + 1), column});
  for (int k = 1; k < nz; ++k)
    for (int j = 0; j < ny; ++j)
      for (int i = 0; i < nx; ++i) {
        if (i + 1 < nx) curves.push_back({node(i, j, k), node(i + 1, j, k), beam_x});
        if (j + 1 < ny) curves.push_back({node(i, j, k), node(i, j + 1, k), beam_y});
        if (i + 1 < nx && j + 1 < ny) curves.push_back({mid(i, j, k), mid(i, j + 1, k), secondary});
      }
  for (int k = 0; k < s.storeys; ++k) {
    for (int i = 0; i < s.bays_x; ++i)
      if (braced_bay(i, s.bays_x))
        for (int j : {0, ny - 1}) curves.push_back({node(i, j, k), node(i + 1, j, k + 1), brace});
    for (int j = 0; j < s.bays_y; ++j)
      if (braced_bay(j, s.bays_y))
        for (int i : {0, nx - 1}) curves.push_back({node(i, j, k), node(i, j + 1, k + 1), brace});
  }

  // Written by OCCT's STEP writer, as an OCCT-based CAD export would be: each member a named
  // curve set holding a trimmed line, layers as presentation layers.
  std::vector<geometry::LineToWrite> lines;
  lines.reserve(curves.size());
  for (const Curve& c : curves) {
    geometry::LineToWrite line;
    line.start = points[static_cast<std::size_t>(c.start)];
    line.end = points[static_cast<std::size_t>(c.end)];
    line.attributes.name = names[c.kind];
    line.attributes.layers = {layers[c.kind]};
    line.attributes.product = "BUILDING";
    lines.push_back(std::move(line));
  }
  geometry::write_step_wireframe(folder / "building.stp", lines, "mm");

  return curves.size();
}

std::filesystem::path write_building_project(const std::filesystem::path& folder, const std::string& name,
                                             const ProjectVariant& variant) {
  const auto yaml = folder / (name + ".yaml");
  std::ofstream project(yaml);
  project << "# Generated benchmark building (an invented frame; round sizes and loads).\n"
             "model: building.stp\n"
             "units: {length: mm, force: kN, stress: MPa, line_load: kN/m}\n"
             "rules:\n"
             "  - where: {}\n    material: S355\n"
             "  - where: {layer: SECONDARY|BRACING}\n    release: {start: [ry, rz], end: [ry, rz]}\n"
             "supports:\n  - where: {z: 0}\n    fix: fixed\n"
             "cases:\n"
             "  - name: G\n    self_weight: true\n    member_loads:\n"
             "      - where: {layer: BEAMS|SECONDARY}\n        w: [0, 0, -3]\n"
             "  - name: Q\n    member_loads:\n      - where: {layer: BEAMS|SECONDARY}\n        w: [0, 0, -4]\n"
             "  - name: W\n    node_loads:\n      - where: {x: 0}\n        force: [10, 0, 0]\n";
  for (std::size_t c = 0; c < variant.extra_cases; ++c)
    project << "  - name: S" << c + 1 << "\n    member_loads:\n      - where: {layer: BEAMS}\n        w: [0, 0, "
            << -0.5 - 0.1 * static_cast<double>(c) << "]\n";
  project << "combinations:\n"
             "  - name: ULS-1\n    factors: {G: 1.35, Q: 1.5, W: 0.9}\n"
             "  - name: ULS-2\n    factors: {G: 1.35, Q: 1.05, W: 1.5}\n";
  for (std::size_t c = 0; c < variant.extra_combinations; ++c)
    project << "  - name: ULS-X" << c + 1 << "\n    factors: {G: 1.35, Q: " << 1.5 - 0.01 * static_cast<double>(c + 1)
            << ", W: " << 0.9 + 0.01 * static_cast<double>(c + 1) << "}\n";
  project << "analysis: {buckling_modes: " << (variant.buckling ? 3 : 0) << "}\n"
          << "checks:\n  stress: {}\n  en1993: {}\n" << (variant.buckling ? "  stability: {alpha_cr_min: 10}\n" : "")
          << "  deflection: {span_ratio: 300}\n  drift: {storey_ratio: 300}\n";
  if (!project.flush()) throw std::runtime_error(yaml.string() + ": cannot write");
  return yaml;
}

}  // namespace stepframe::bench
