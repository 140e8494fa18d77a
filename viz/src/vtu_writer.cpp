#include "stepframe/viz/vtu_writer.hpp"

#include "stepframe/analysis/member_line.hpp"
#include "write_grid.hpp"

#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkIdList.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>

#include <stdexcept>

namespace stepframe::viz {

void write_line_model_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                          const analysis::LoadResult& result, const std::vector<double>& member_utilisation) {
  const auto chains = analysis::member_chains(model);
  if (result.members.size() != chains.size())
    throw std::invalid_argument("write_line_model_vtu: result does not belong to this model");

  vtkNew<vtkPoints> points;
  points->SetDataTypeToDouble();
  vtkNew<vtkDoubleArray> displacement;
  displacement->SetName("displacement");
  displacement->SetNumberOfComponents(3);
  vtkNew<vtkDoubleArray> von_mises, axial, moment_y, moment_z;
  von_mises->SetName("von_mises");
  axial->SetName("N");
  moment_y->SetName("My");
  moment_z->SetName("Mz");

  vtkNew<vtkDoubleArray> stress, normal_stress, utilisation;
  stress->SetName("stress");
  normal_stress->SetName("normal_stress");
  utilisation->SetName("utilisation");
  vtkNew<vtkIntArray> member_id;
  member_id->SetName("member_id");
  vtkNew<vtkIntArray> section_id;
  section_id->SetName("section_id");
  vtkNew<vtkStringArray> section;
  section->SetName("section");

  vtkNew<vtkUnstructuredGrid> grid;
  for (std::size_t m = 0; m < chains.size(); ++m) {
    const auto& line = result.members[m];
    const std::size_t section_index = model.elements[chains[m].elements.front()].section;
    vtkNew<vtkIdList> ids;
    for (const auto& station : line.stations) {
      ids->InsertNextId(points->InsertNextPoint(station.position.data()));
      displacement->InsertNextTuple(station.displacement.data());
      von_mises->InsertNextValue(station.von_mises);
      axial->InsertNextValue(station.forces(0));
      moment_y->InsertNextValue(station.forces(4));
      moment_z->InsertNextValue(station.forces(5));
    }
    grid->InsertNextCell(VTK_POLY_LINE, ids);
    stress->InsertNextValue(line.max_von_mises);
    normal_stress->InsertNextValue(line.max_abs_stress);
    if (m < member_utilisation.size()) utilisation->InsertNextValue(member_utilisation[m]);
    member_id->InsertNextValue(static_cast<int>(m));
    section_id->InsertNextValue(static_cast<int>(section_index));
    section->InsertNextValue(model.sections[section_index].designation);
  }
  grid->SetPoints(points);
  grid->GetPointData()->AddArray(displacement);
  grid->GetPointData()->SetVectors(displacement);
  for (auto* array : {von_mises.Get(), axial.Get(), moment_y.Get(), moment_z.Get()}) grid->GetPointData()->AddArray(array);
  grid->GetCellData()->AddArray(stress);
  grid->GetCellData()->SetActiveScalars("stress");
  grid->GetCellData()->AddArray(normal_stress);
  if (!member_utilisation.empty()) grid->GetCellData()->AddArray(utilisation);
  grid->GetCellData()->AddArray(member_id);
  grid->GetCellData()->AddArray(section_id);
  grid->GetCellData()->AddArray(section);

  detail::write_grid(file, grid);
}

}  // namespace stepframe::viz
