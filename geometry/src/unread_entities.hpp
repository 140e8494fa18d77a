#pragma once
// Entities OCCT's parse could not read as written. When an entity refers to
// another of a type the schema does not allow there (a misspelt or unknown
// entity type, a curve where a point belongs), OCCT 7.6 records a failed check
// on the referring entity and leaves the reference null; its transfer then
// dereferences the null (a polyline's point, a representation relationship's
// rep_2, ...) and the process crashes. These are found between the parse and
// the transfer: a presentation entity (layer, style, colour) is only reported,
// since the transfer is not asked to follow them and our attribute reading
// skips null references; any other is refused.

#include <StepData_StepModel.hxx>

#include <string>
#include <vector>

namespace stepframe::geometry::detail {

/// One entity whose parse failed.
struct UnreadEntity {
  int entity = 0;             ///< its number (#N)
  std::string type;           ///< its OCCT class, e.g. StepGeom_Polyline
  std::string failures;       ///< OCCT's check messages, e.g. "Parameter n0.2 (cartesian_point) : Entity has illegal type"
  bool presentation = false;  ///< a StepVisual entity (layers, styles, colours)
};

/// Every entity whose parse failed, in file order.
std::vector<UnreadEntity> unread_entities(const Handle(StepData_StepModel) & model);

}  // namespace stepframe::geometry::detail
