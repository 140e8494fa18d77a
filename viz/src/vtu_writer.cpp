#include "stepframe/viz/vtu_writer.hpp"

#include "stepframe/analysis/member_line.hpp"

#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkIdList.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <stdexcept>

namespace stepframe::viz {

void write_line_model_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                          const analysis::LoadResult& result) {
  const auto chains = analysis::member_chains(model);
  if (result.members.size() != chains.size())
    throw std::invalid_argument("write_line_model_vtu: result does not belong to this model");

  vtkNew<vtkPoints> points;
  points->SetDataTypeToDouble();
  vtkNew<vtkDoubleArray> displacement;
  displacement->SetName("displacement");
  displacement->SetNumberOfComponents(3);
  vtkNew<vtkDoubleArray> station_stress;
  station_stress->SetName("station_stress");

  vtkNew<vtkDoubleArray> stress;
  stress->SetName("stress");
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
      station_stress->InsertNextValue(station.max_abs_stress);
    }
    grid->InsertNextCell(VTK_POLY_LINE, ids);
    stress->InsertNextValue(line.max_abs_stress);
    member_id->InsertNextValue(static_cast<int>(m));
    section_id->InsertNextValue(static_cast<int>(section_index));
    section->InsertNextValue(model.sections[section_index].designation);
  }
  grid->SetPoints(points);
  grid->GetPointData()->AddArray(displacement);
  grid->GetPointData()->SetVectors(displacement);
  grid->GetPointData()->AddArray(station_stress);
  grid->GetCellData()->AddArray(stress);
  grid->GetCellData()->SetActiveScalars("stress");
  grid->GetCellData()->AddArray(member_id);
  grid->GetCellData()->AddArray(section_id);
  grid->GetCellData()->AddArray(section);

  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(file.string().c_str());
  writer->SetInputData(grid);
  writer->SetDataModeToAppended();
  writer->EncodeAppendedDataOff();
  writer->SetCompressorTypeToZLib();
  if (writer->Write() != 1) throw std::runtime_error(file.string() + ": could not write the VTK file");
}

}  // namespace stepframe::viz
