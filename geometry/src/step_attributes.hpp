#pragma once
// CAD attributes of STEP entities read straight from the file's entity graph:
// "#n" ids, item names, presentation layers and curve colours. Found on the
// entity itself or on the sets and representations that contain it.

#include "stepframe/geometry/source_info.hpp"

#include <Standard_Handle.hxx>
#include <Standard_Transient.hxx>

#include <string>
#include <unordered_map>
#include <vector>

class XSControl_WorkSession;
class StepData_StepModel;

namespace stepframe::geometry::detail {

class StepAttributes {
 public:
  /// Indexes the layer assignments and styled items of the session's model.
  explicit StepAttributes(const Handle(XSControl_WorkSession) & session);

  /// "#n" with n the entity's number in the file (its original label when the
  /// reader kept it, else its position in the model).
  std::string entity_id(const Handle(Standard_Transient) & entity) const;

  /// entity id, name, layers and colour of `entity` (product is left empty).
  /// Name and colour: the entity's own, else the nearest container's. Layers:
  /// those assigned to the entity and to every container of it.
  SourceInfo attributes_of(const Handle(Standard_Transient) & entity) const;

 private:
  /// The entity, then the geometric sets, edge sets, wireframe models and
  /// representations that contain it, nearest first.
  std::vector<Handle(Standard_Transient)> lineage(const Handle(Standard_Transient) & entity) const;

  Handle(XSControl_WorkSession) session_;
  Handle(StepData_StepModel) model_;
  std::unordered_map<const Standard_Transient*, std::vector<std::string>> layers_;
  std::unordered_map<const Standard_Transient*, std::string> colours_;
};

}  // namespace stepframe::geometry::detail
