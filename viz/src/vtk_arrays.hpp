#pragma once
// VTK arrays allocated once at their final size and filled in place (no
// per-value insertion), and cells that are runs of consecutive points.

#include <Eigen/Core>
#include <vtkCellArray.h>
#include <vtkFieldData.h>
#include <vtkStringArray.h>
#include <vtkFloatArray.h>
#include <vtkIntArray.h>
#include <vtkNew.h>
#include <vtkSmartPointer.h>
#include <vtkTypeInt32Array.h>

#include <string>
#include <utility>
#include <vector>

namespace stepframe::viz::detail {

/// A float array of `tuples` tuples of `components`, named; 32-bit floats
/// hold results to about seven significant digits, plenty for a picture.
inline vtkSmartPointer<vtkFloatArray> float_array(const char* name, int components, vtkIdType tuples) {
  auto a = vtkSmartPointer<vtkFloatArray>::New();
  a->SetName(name);
  a->SetNumberOfComponents(components);
  a->SetNumberOfTuples(tuples);
  return a;
}

inline vtkSmartPointer<vtkIntArray> int_array(const char* name, vtkIdType values) {
  auto a = vtkSmartPointer<vtkIntArray>::New();
  a->SetName(name);
  a->SetNumberOfValues(values);
  return a;
}

/// Sets tuple `i` of a 3-component array (safe from several threads for different i).
inline void set(vtkFloatArray* a, vtkIdType i, const Eigen::Vector3d& v) {
  float* p = a->GetPointer(3 * i);
  p[0] = static_cast<float>(v.x()), p[1] = static_cast<float>(v.y()), p[2] = static_cast<float>(v.z());
}

/// Field data every stepframe VTK file carries: "units" (one "array: unit"
/// line per array, SI) and "caution" (the screening-aid caution).
inline void describe(vtkFieldData* field, const std::vector<std::pair<std::string, std::string>>& units) {
  vtkNew<vtkStringArray> unit_list;
  unit_list->SetName("units");
  for (const auto& [array, unit] : units) unit_list->InsertNextValue(array + ": " + unit);
  field->AddArray(unit_list);
  vtkNew<vtkStringArray> caution;
  caution->SetName("caution");
  caution->InsertNextValue(
      "Screening aid only: a competent engineer must review these results; local codes and licensed practice govern.");
  field->AddArray(caution);
}

/// Cells of consecutive points: cell c runs through points [first[c], first[c + 1]).
inline vtkSmartPointer<vtkCellArray> consecutive_cells(const std::vector<vtkIdType>& first) {
  vtkNew<vtkTypeInt32Array> offsets, connectivity;
  offsets->SetNumberOfValues(static_cast<vtkIdType>(first.size()));
  for (std::size_t c = 0; c < first.size(); ++c) offsets->SetValue(static_cast<vtkIdType>(c), static_cast<int>(first[c]));
  connectivity->SetNumberOfValues(first.back());
  for (vtkIdType p = 0; p < first.back(); ++p) connectivity->SetValue(p, static_cast<int>(p));
  auto cells = vtkSmartPointer<vtkCellArray>::New();
  cells->SetData(offsets, connectivity);
  return cells;
}

}  // namespace stepframe::viz::detail
