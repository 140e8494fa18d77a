#include "stepframe/viz/surface_vtu_writer.hpp"

#include "stepframe/analysis/buckling.hpp"
#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"
#include "vtk_arrays.hpp"
#include "write_grid.hpp"

#include <Eigen/Geometry>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkFieldData.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnsignedCharArray.h>

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <tuple>

namespace stepframe::viz {
namespace {

// Douglas-Peucker on a closed ring (Douglas & Peucker, Cartographica 10(2),
// 1973): keeps the points that lie farther than `tolerance` from the chord
// of the points kept around them. Fillet arcs shrink to a point or two,
// corners stay.
void keep_far_points(const analysis::SectionRing& ring, std::size_t from, std::size_t to, double tolerance,
                     std::vector<bool>& keep) {
  if (to <= from + 1) return;
  const Eigen::Vector2d a(ring[from].y, ring[from].z), b(ring[to % ring.size()].y, ring[to % ring.size()].z);
  const Eigen::Vector2d chord = b - a;
  double far = -1;
  std::size_t at = from;
  for (std::size_t i = from + 1; i < to; ++i) {
    const Eigen::Vector2d p = Eigen::Vector2d(ring[i].y, ring[i].z) - a;
    const double d = chord.norm() > 0 ? std::abs(chord.x() * p.y() - chord.y() * p.x()) / chord.norm() : p.norm();
    if (d > far) far = d, at = i;
  }
  if (far <= tolerance) return;
  keep[at] = true;
  keep_far_points(ring, from, at, tolerance, keep);
  keep_far_points(ring, at, to, tolerance, keep);
}

analysis::SectionRing simplified(const analysis::SectionRing& ring, double tolerance) {
  if (ring.size() <= 4) return ring;
  // Split the closed ring at its first point and the point farthest from it.
  std::size_t opposite = 0;
  double far = -1;
  for (std::size_t i = 1; i < ring.size(); ++i) {
    const double d = std::hypot(ring[i].y - ring[0].y, ring[i].z - ring[0].z);
    if (d > far) far = d, opposite = i;
  }
  std::vector<bool> keep(ring.size(), false);
  keep[0] = keep[opposite] = true;
  keep_far_points(ring, 0, opposite, tolerance, keep);
  keep_far_points(ring, opposite, ring.size(), tolerance, keep);
  analysis::SectionRing out;
  for (std::size_t i = 0; i < ring.size(); ++i)
    if (keep[i]) out.push_back(ring[i]);
  return out;
}

// The outline drawn for a section: its rings without the detail a picture
// cannot show (deviations under 5% of the section's smaller extent), or a
// depth x width rectangle for sections given by properties.
std::vector<analysis::SectionRing> drawn_outline(const analysis::Section& s) {
  if (s.outline.empty()) {
    const double y = 0.5 * s.width, z = 0.5 * s.depth;
    return {{{-y, -z}, {y, -z}, {y, z}, {-y, z}}};
  }
  const double tolerance = 0.05 * std::min(s.depth, s.width);
  std::vector<analysis::SectionRing> rings;
  for (const auto& ring : s.outline) rings.push_back(simplified(ring, tolerance));
  return rings;
}

}  // namespace

void write_surface_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                       const analysis::LoadResult& result, const SurfaceOptions& options) {
  if (result.displacements.size() != static_cast<Eigen::Index>(6 * model.nodes.size()))
    throw std::invalid_argument("write_surface_vtu: result does not belong to this model");
  const std::size_t stations = std::max<std::size_t>(2, options.sections_per_element);
  const auto owner = analysis::element_members(model);
  std::vector<std::vector<analysis::SectionRing>> outlines;
  for (const auto& s : model.sections) outlines.push_back(drawn_outline(s));

  // Element e owns points [first_point[e], ...) and quads [first_quad[e], ...).
  std::vector<vtkIdType> first_point(model.elements.size() + 1, 0), first_quad(model.elements.size() + 1, 0);
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    vtkIdType ring_points = 0;
    for (const auto& ring : outlines[model.elements[e].section]) ring_points += static_cast<vtkIdType>(ring.size());
    first_point[e + 1] = first_point[e] + ring_points * static_cast<vtkIdType>(stations);
    first_quad[e + 1] = first_quad[e] + ring_points * static_cast<vtkIdType>(stations - 1);
  }
  const vtkIdType points_count = first_point.back(), quads = first_quad.back();
  auto positions = detail::float_array("positions", 3, points_count);
  auto stress = detail::float_array("fibre_stress", 1, points_count);
  auto displacement = detail::float_array("displacement", 3, points_count);
  vtkNew<vtkTypeInt32Array> offsets, connectivity;
  offsets->SetNumberOfValues(quads + 1);
  connectivity->SetNumberOfValues(4 * quads);
  auto member_id = detail::int_array("member_id", quads);
  auto element_id = detail::int_array("element_id", quads);

  analysis::parallel_for(model.elements.size(), [&](std::size_t e) {
    const auto& element = model.elements[e];
    const auto& section = model.sections[element.section];
    const Eigen::Matrix3d axes =
        analysis::local_axes(model.nodes[element.nodes[0]], model.nodes[element.nodes[1]], element.roll);
    const Eigen::Vector3d y = axes.row(1).transpose(), z = axes.row(2).transpose();
    const analysis::LineResult line = analysis::element_line(model, result, e, stations, analysis::LineDetail::stations);
    vtkIdType p = first_point[e], q = first_quad[e];
    for (const auto& ring : outlines[element.section]) {
      const auto n = static_cast<vtkIdType>(ring.size());
      const vtkIdType ring_first = p;
      for (const auto& st : line.stations)
        for (const auto& pt : ring) {
          const Eigen::Vector3d arm = pt.y * y + pt.z * z;  // from the axis to the outline point, global
          detail::set(positions, p, st.position + arm);
          // sigma = N/A + My z / Iy - Mz y / Iz (results.hpp sign convention).
          stress->SetValue(p, static_cast<float>(st.forces(0) / section.A + st.forces(4) * pt.z / section.Iy -
                                                 st.forces(5) * pt.y / section.Iz));
          // Plane sections stay plane (warping left out): the outline point moves with the axis and
          // turns with the section, u_p = u + theta x arm to first order (small rotations).
          detail::set(displacement, p, st.displacement + st.rotation.cross(arm));
          ++p;
        }
      for (std::size_t k = 0; k + 1 < line.stations.size(); ++k)
        for (vtkIdType i = 0; i < n; ++i, ++q) {
          const vtkIdType a = ring_first + static_cast<vtkIdType>(k) * n, b = a + n;
          const vtkIdType quad[4] = {a + i, a + (i + 1) % n, b + (i + 1) % n, b + i};
          offsets->SetValue(q, static_cast<int>(4 * q));
          for (int c = 0; c < 4; ++c) connectivity->SetValue(4 * q + c, static_cast<int>(quad[c]));
          member_id->SetValue(q, static_cast<int>(owner[e]));
          element_id->SetValue(q, static_cast<int>(e));
        }
    }
  });
  offsets->SetValue(quads, static_cast<int>(4 * quads));

  vtkNew<vtkUnstructuredGrid> grid;
  vtkNew<vtkPoints> points;
  points->SetData(positions);
  grid->SetPoints(points);
  vtkNew<vtkCellArray> cells;
  cells->SetData(offsets, connectivity);
  grid->SetCells(VTK_QUAD, cells);
  grid->GetPointData()->AddArray(stress);
  grid->GetPointData()->SetActiveScalars("fibre_stress");
  grid->GetPointData()->AddArray(displacement);
  grid->GetPointData()->SetVectors(displacement);
  grid->GetCellData()->AddArray(member_id);
  grid->GetCellData()->AddArray(element_id);
  detail::describe(grid->GetFieldData(), {{"fibre_stress", "Pa (tension > 0)"}, {"displacement", "m"}, {"points", "m"}});
  detail::write_grid(file, grid, options.compression);
}

namespace {

// A mode shape as a line model: each element a polyline through seven evenly spaced points, point
// data "mode_shape", and the given field data (name, value, unit).
void write_shape_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                     const analysis::BucklingMode& m, const std::vector<std::tuple<std::string, double, std::string>>& fields,
                     VtkCompression compression) {
  if (m.inner_points.size() != model.elements.size())
    throw std::invalid_argument("write_mode_vtu: mode does not belong to this model");
  constexpr vtkIdType per_element = 7;  // six parts: the mode's curve inside each element shows
  const auto owner = analysis::element_members(model);
  const auto elements = static_cast<vtkIdType>(model.elements.size());
  auto positions = detail::float_array("positions", 3, per_element * elements);
  auto shape = detail::float_array("mode_shape", 3, per_element * elements);
  auto member_id = detail::int_array("member_id", elements);
  analysis::parallel_for(model.elements.size(), [&](std::size_t e) {
    const Eigen::Vector3d a = model.nodes[model.elements[e].nodes[0]], b = model.nodes[model.elements[e].nodes[1]];
    for (vtkIdType k = 0; k < per_element; ++k) {
      const double t = static_cast<double>(k) / static_cast<double>(per_element - 1);
      const vtkIdType p = static_cast<vtkIdType>(e) * per_element + k;
      detail::set(positions, p, a + t * (b - a));
      detail::set(shape, p, analysis::mode_translation(model, m, e, t));
    }
    member_id->SetValue(static_cast<vtkIdType>(e), static_cast<int>(owner[e]));
  });
  std::vector<vtkIdType> first(model.elements.size() + 1);
  for (std::size_t e = 0; e < first.size(); ++e) first[e] = static_cast<vtkIdType>(e) * per_element;

  vtkNew<vtkUnstructuredGrid> grid;
  vtkNew<vtkPoints> points;
  points->SetData(positions);
  grid->SetPoints(points);
  grid->SetCells(VTK_POLY_LINE, detail::consecutive_cells(first));
  grid->GetPointData()->AddArray(shape);
  grid->GetPointData()->SetVectors(shape);
  grid->GetCellData()->AddArray(member_id);
  std::vector<std::pair<std::string, std::string>> units{{"mode_shape", "1 (largest translation 1)"}, {"points", "m"}};
  for (const auto& [name, value, unit] : fields) {
    vtkNew<vtkDoubleArray> array;
    array->SetName(name.c_str());
    array->InsertNextValue(value);
    grid->GetFieldData()->AddArray(array);
    units.emplace_back(name, unit);
  }
  detail::describe(grid->GetFieldData(), units);
  detail::write_grid(file, grid, compression);
}

}  // namespace

void write_mode_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                    const analysis::LoadResult& result, std::size_t mode, VtkCompression compression) {
  write_shape_vtu(file, model, result.buckling_modes.at(mode), {{"alpha", result.buckling_modes.at(mode).alpha, "1"}},
                  compression);
}

void write_vibration_mode_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                              const analysis::VibrationMode& mode, std::size_t number, VtkCompression compression) {
  write_shape_vtu(file, model, mode.shape,
                  {{"frequency", mode.frequency, "Hz"},
                   {"period", 1.0 / mode.frequency, "s"},
                   {"mode_number", static_cast<double>(number), "1"},
                   {"mass_ratio_x", mode.mass_ratio[0], "1"},
                   {"mass_ratio_y", mode.mass_ratio[1], "1"},
                   {"mass_ratio_z", mode.mass_ratio[2], "1"}},
                  compression);
}

}  // namespace stepframe::viz
