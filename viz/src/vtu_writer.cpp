#include "stepframe/viz/vtu_writer.hpp"

#include "stepframe/viz/colour_scale.hpp"

#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"
#include "vtk_arrays.hpp"
#include "write_grid.hpp"

#include <vtkCellArray.h>
#include <vtkCellData.h>
#include <vtkFieldData.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkStringArray.h>
#include <vtkUnsignedCharArray.h>
#include <vtkUnstructuredGrid.h>

#include <algorithm>
#include <stdexcept>

namespace stepframe::viz {

void write_line_model_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                          const analysis::LoadResult& result, const std::vector<double>& member_utilisation,
                          const LineModelOptions& options) {
  const auto chains = analysis::member_chains(model);
  if (result.members.size() != chains.size())
    throw std::invalid_argument("write_line_model_vtu: result does not belong to this model");

  // Every member's stations, in member order: member m owns points [first[m], first[m + 1]).
  const std::size_t stations = std::max<std::size_t>(2, options.points_per_element);
  std::vector<vtkIdType> first(chains.size() + 1, 0);
  for (std::size_t m = 0; m < chains.size(); ++m)
    first[m + 1] = first[m] + static_cast<vtkIdType>(chains[m].elements.size() * stations);
  const vtkIdType count = first.back();
  auto positions = detail::float_array("positions", 3, count);
  auto displacement = detail::float_array("displacement", 3, count);
  auto von_mises = detail::float_array("von_mises", 1, count);
  auto axial = detail::float_array("N", 1, count);
  auto shear_y = detail::float_array("Vy", 1, count);
  auto shear_z = detail::float_array("Vz", 1, count);
  auto torque = detail::float_array("T", 1, count);
  auto moment_y = detail::float_array("My", 1, count);
  auto moment_z = detail::float_array("Mz", 1, count);
  analysis::parallel_for(chains.size(), [&](std::size_t m) {
    const analysis::LineResult line =
        analysis::member_line(model, result, chains[m], analysis::LineDetail::stations, stations);
    vtkIdType p = first[m];
    for (const analysis::Station& st : line.stations) {
      detail::set(positions, p, st.position);
      detail::set(displacement, p, st.displacement);
      von_mises->SetValue(p, static_cast<float>(st.von_mises));
      axial->SetValue(p, static_cast<float>(st.forces(0)));
      shear_y->SetValue(p, static_cast<float>(st.forces(1)));
      shear_z->SetValue(p, static_cast<float>(st.forces(2)));
      torque->SetValue(p, static_cast<float>(st.forces(3)));
      moment_y->SetValue(p, static_cast<float>(st.forces(4)));
      moment_z->SetValue(p, static_cast<float>(st.forces(5)));
      ++p;
    }
  });

  const auto cells = static_cast<vtkIdType>(chains.size());
  auto stress = detail::float_array("stress", 1, cells);
  auto normal_stress = detail::float_array("normal_stress", 1, cells);
  auto utilisation = detail::float_array("utilisation", 1, cells);
  auto member_id = detail::int_array("member_id", cells);
  auto section_id = detail::int_array("section_id", cells);
  // Our utilisation colours as RGB, so a viewer can show the report's colours as they are
  // (direct colours rather than its own colour map).
  vtkNew<vtkUnsignedCharArray> utilisation_rgb;
  utilisation_rgb->SetName("utilisation_colour");
  utilisation_rgb->SetNumberOfComponents(3);
  utilisation_rgb->SetNumberOfTuples(cells);
  vtkNew<vtkStringArray> section;
  section->SetName("section");
  section->SetNumberOfValues(cells);
  for (std::size_t m = 0; m < chains.size(); ++m) {
    const auto i = static_cast<vtkIdType>(m);
    const std::size_t section_index = model.elements[chains[m].elements.front()].section;
    stress->SetValue(i, static_cast<float>(result.members[m].max_von_mises));
    normal_stress->SetValue(i, static_cast<float>(result.members[m].max_abs_stress));
    utilisation->SetValue(i, m < member_utilisation.size() ? static_cast<float>(member_utilisation[m]) : 0.0f);
    const Rgb colour = m < member_utilisation.size() ? utilisation_colour(member_utilisation[m]) : not_checked_colour();
    utilisation_rgb->SetTypedTuple(i, colour.data());
    member_id->SetValue(i, static_cast<int>(m));
    section_id->SetValue(i, static_cast<int>(section_index));
    section->SetValue(i, model.sections[section_index].designation);
  }

  vtkNew<vtkUnstructuredGrid> grid;
  vtkNew<vtkPoints> points;
  points->SetData(positions);
  grid->SetPoints(points);
  grid->SetCells(VTK_POLY_LINE, detail::consecutive_cells(first));
  grid->GetPointData()->AddArray(displacement);
  grid->GetPointData()->SetVectors(displacement);
  for (auto* array : {von_mises.Get(), axial.Get(), shear_y.Get(), shear_z.Get(), torque.Get(), moment_y.Get(),
                      moment_z.Get()})
    grid->GetPointData()->AddArray(array);
  grid->GetCellData()->AddArray(stress);
  grid->GetCellData()->SetActiveScalars("stress");
  grid->GetCellData()->AddArray(normal_stress);
  if (!member_utilisation.empty()) {
    grid->GetCellData()->AddArray(utilisation);
    grid->GetCellData()->AddArray(utilisation_rgb);
  }
  grid->GetCellData()->AddArray(member_id);
  grid->GetCellData()->AddArray(section_id);
  grid->GetCellData()->AddArray(section);
  if (options.marks.size() == chains.size()) {
    vtkNew<vtkStringArray> mark;
    mark->SetName("mark");
    mark->SetNumberOfValues(cells);
    for (std::size_t m = 0; m < chains.size(); ++m) mark->SetValue(static_cast<vtkIdType>(m), options.marks[m]);
    grid->GetCellData()->AddArray(mark);
  }
  detail::describe(grid->GetFieldData(), {{"displacement", "m"}, {"von_mises", "Pa"}, {"N", "N (tension > 0)"},
                                          {"Vy", "N"}, {"Vz", "N"}, {"T", "N*m"}, {"My", "N*m"}, {"Mz", "N*m"},
                                          {"stress", "Pa"}, {"normal_stress", "Pa"}, {"utilisation", "1"},
                                          {"utilisation_colour", "sRGB 0-255, stepframe's utilisation scale"},
                                          {"points", "m"}});
  detail::write_grid(file, grid, options.compression);
}

}  // namespace stepframe::viz
