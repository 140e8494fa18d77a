#include "stepframe/viz/change_vtu.hpp"

#include "vtk_arrays.hpp"
#include "write_grid.hpp"

#include <vtkCellData.h>
#include <vtkFloatArray.h>
#include <vtkPoints.h>
#include <vtkUnsignedCharArray.h>

namespace stepframe::viz {

void write_change_vtu(const std::filesystem::path& file, const std::vector<ChangeLine>& lines,
                      const std::vector<std::string>& kind_names, VtkCompression compression) {
  std::vector<vtkIdType> first{0};
  for (const auto& l : lines) first.push_back(first.back() + static_cast<vtkIdType>(l.points.size()));
  auto positions = detail::float_array("points", 3, first.back());
  const auto cells = static_cast<vtkIdType>(lines.size());
  auto change = detail::float_array("utilisation_change", 1, cells);
  auto before = detail::float_array("utilisation_before", 1, cells);
  auto after = detail::float_array("utilisation_after", 1, cells);
  auto kind = detail::int_array("change_kind", cells);
  auto member = detail::int_array("member_id", cells);
  vtkNew<vtkUnsignedCharArray> colour;
  colour->SetName("change_colour");
  colour->SetNumberOfComponents(3);
  colour->SetNumberOfTuples(cells);
  vtkNew<vtkStringArray> label;
  label->SetName("label");
  label->SetNumberOfValues(cells);
  for (std::size_t c = 0; c < lines.size(); ++c) {
    const auto& l = lines[c];
    const auto i = static_cast<vtkIdType>(c);
    for (std::size_t p = 0; p < l.points.size(); ++p) detail::set(positions, first[c] + static_cast<vtkIdType>(p), l.points[p]);
    change->SetValue(i, static_cast<float>(l.after - l.before));
    before->SetValue(i, static_cast<float>(l.before));
    after->SetValue(i, static_cast<float>(l.after));
    kind->SetValue(i, l.change_kind);
    member->SetValue(i, l.member);
    colour->SetTypedTuple(i, l.colour.data());
    label->SetValue(i, l.label);
  }
  vtkNew<vtkUnstructuredGrid> grid;
  vtkNew<vtkPoints> points;
  points->SetData(positions);
  grid->SetPoints(points);
  grid->SetCells(VTK_POLY_LINE, detail::consecutive_cells(first));
  auto* data = grid->GetCellData();
  data->AddArray(change);
  data->SetActiveScalars("utilisation_change");
  for (auto* a : {static_cast<vtkAbstractArray*>(before.Get()), static_cast<vtkAbstractArray*>(after.Get()),
                  static_cast<vtkAbstractArray*>(kind.Get()), static_cast<vtkAbstractArray*>(colour.Get()),
                  static_cast<vtkAbstractArray*>(member.Get()), static_cast<vtkAbstractArray*>(label.Get())})
    data->AddArray(a);
  detail::describe(grid->GetFieldData(), {{"utilisation_change", "1 (after - before)"},
                                          {"utilisation_before", "1"},
                                          {"utilisation_after", "1"},
                                          {"change_colour", "sRGB 0-255, stepframe's scales as in compare.html"},
                                          {"points", "m"}});
  vtkNew<vtkStringArray> kinds;
  kinds->SetName("change_kinds");
  for (std::size_t k = 0; k < kind_names.size(); ++k) kinds->InsertNextValue(std::to_string(k) + ": " + kind_names[k]);
  grid->GetFieldData()->AddArray(kinds);
  detail::write_grid(file, grid, compression);
}

}  // namespace stepframe::viz
