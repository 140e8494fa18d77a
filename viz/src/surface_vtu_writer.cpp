#include "stepframe/viz/surface_vtu_writer.hpp"

#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "write_grid.hpp"

#include <Eigen/Geometry>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkFieldData.h>
#include <vtkIdList.h>
#include <vtkIntArray.h>
#include <vtkPointData.h>
#include <vtkPoints.h>

#include <stdexcept>

namespace stepframe::viz {
namespace {

std::vector<analysis::SectionRing> rings_of(const analysis::Section& s) {
  if (!s.outline.empty()) return s.outline;
  const double y = 0.5 * s.width, z = 0.5 * s.depth;  // depth x width rectangle for sections given by properties
  return {{{-y, -z}, {y, -z}, {y, z}, {-y, z}}};
}

// The member each element belongs to.
std::vector<int> element_members(const analysis::FrameModel& model) {
  std::vector<int> owner(model.elements.size(), -1);
  const auto chains = analysis::member_chains(model);
  for (std::size_t m = 0; m < chains.size(); ++m)
    for (std::size_t e : chains[m].elements) owner[e] = static_cast<int>(m);
  return owner;
}

}  // namespace

void write_surface_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                       const analysis::LoadResult& result) {
  if (result.elements.size() != model.elements.size())
    throw std::invalid_argument("write_surface_vtu: result does not belong to this model");
  const auto owner = element_members(model);

  vtkNew<vtkPoints> points;
  points->SetDataTypeToDouble();
  vtkNew<vtkDoubleArray> stress, displacement;
  stress->SetName("fibre_stress");
  displacement->SetName("displacement");
  displacement->SetNumberOfComponents(3);
  vtkNew<vtkIntArray> member_id, element_id;
  member_id->SetName("member_id");
  element_id->SetName("element_id");
  vtkNew<vtkUnstructuredGrid> grid;

  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const auto& element = model.elements[e];
    const auto& section = model.sections[element.section];
    const Eigen::Matrix3d axes =
        analysis::local_axes(model.nodes[element.nodes[0]], model.nodes[element.nodes[1]], element.roll);
    const Eigen::Vector3d y = axes.row(1).transpose(), z = axes.row(2).transpose();
    const auto& stations = result.elements[e].stations;
    for (const auto& ring : rings_of(section)) {
      const auto n = static_cast<vtkIdType>(ring.size());
      const vtkIdType first = points->GetNumberOfPoints();
      for (const auto& st : stations)
        for (const auto& p : ring) {
          const Eigen::Vector3d arm = p.y * y + p.z * z;  // from the axis to the outline point, global
          const Eigen::Vector3d at = st.position + arm;
          points->InsertNextPoint(at.data());
          // sigma = N/A + My z / Iy - Mz y / Iz (results.hpp sign convention).
          stress->InsertNextValue(st.forces(0) / section.A + st.forces(4) * p.z / section.Iy -
                                  st.forces(5) * p.y / section.Iz);
          // Plane sections stay plane (warping left out): the outline point moves with the axis and
          // turns with the section, u_p = u + theta x arm to first order (small rotations).
          const Eigen::Vector3d moved = st.displacement + st.rotation.cross(arm);
          displacement->InsertNextTuple(moved.data());
        }
      for (std::size_t k = 0; k + 1 < stations.size(); ++k)
        for (vtkIdType i = 0; i < n; ++i) {
          const vtkIdType a = first + static_cast<vtkIdType>(k) * n, b = a + n;
          const vtkIdType quad[4] = {a + i, a + (i + 1) % n, b + (i + 1) % n, b + i};
          grid->InsertNextCell(VTK_QUAD, 4, quad);
          member_id->InsertNextValue(owner[e]);
          element_id->InsertNextValue(static_cast<int>(e));
        }
    }
  }
  grid->SetPoints(points);
  grid->GetPointData()->AddArray(stress);
  grid->GetPointData()->SetActiveScalars("fibre_stress");
  grid->GetPointData()->AddArray(displacement);
  grid->GetPointData()->SetVectors(displacement);
  grid->GetCellData()->AddArray(member_id);
  grid->GetCellData()->AddArray(element_id);
  detail::write_grid(file, grid);
}

void write_mode_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                    const analysis::LoadResult& result, std::size_t mode) {
  const auto& m = result.buckling_modes.at(mode);
  if (m.element_points.size() != model.elements.size())
    throw std::invalid_argument("write_mode_vtu: mode does not belong to this model");
  const auto owner = element_members(model);
  vtkNew<vtkPoints> points;
  points->SetDataTypeToDouble();
  vtkNew<vtkDoubleArray> shape;
  shape->SetName("mode_shape");
  shape->SetNumberOfComponents(3);
  vtkNew<vtkIntArray> member_id;
  member_id->SetName("member_id");
  vtkNew<vtkUnstructuredGrid> grid;
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const Eigen::Vector3d a = model.nodes[model.elements[e].nodes[0]], b = model.nodes[model.elements[e].nodes[1]];
    const auto& translations = m.element_points[e];
    vtkNew<vtkIdList> ids;
    for (std::size_t k = 0; k < translations.size(); ++k) {
      const double t = translations.size() > 1 ? static_cast<double>(k) / static_cast<double>(translations.size() - 1) : 0.0;
      const Eigen::Vector3d p = a + t * (b - a);
      ids->InsertNextId(points->InsertNextPoint(p.data()));
      shape->InsertNextTuple(translations[k].data());
    }
    grid->InsertNextCell(VTK_POLY_LINE, ids);
    member_id->InsertNextValue(owner[e]);
  }
  grid->SetPoints(points);
  grid->GetPointData()->AddArray(shape);
  grid->GetPointData()->SetVectors(shape);
  grid->GetCellData()->AddArray(member_id);
  vtkNew<vtkDoubleArray> alpha;
  alpha->SetName("alpha");
  alpha->InsertNextValue(m.alpha);
  grid->GetFieldData()->AddArray(alpha);
  detail::write_grid(file, grid);
}

}  // namespace stepframe::viz
