#pragma once
// The length unit a STEP file declares in its representation contexts.

#include <Standard_Handle.hxx>

#include <string>
#include <vector>

class StepData_StepModel;

namespace stepframe::geometry::detail {

struct DeclaredLengthUnit {
  std::string name;               ///< short name ("mm", "m", "inch", ...) or the file's own spelling
  double metres_per_unit = 0.0;   ///< size of one unit in metres
};

/// Every distinct length unit declared by a GLOBAL_UNIT_ASSIGNED_CONTEXT of the
/// model, in the order the contexts appear. SI units are the prefix times one
/// metre; a CONVERSION_BASED_UNIT is its conversion factor times the size of
/// the unit that factor is given in (ISO 10303-41, measure_with_unit).
std::vector<DeclaredLengthUnit> declared_length_units(const Handle(StepData_StepModel) & model);

}  // namespace stepframe::geometry::detail
