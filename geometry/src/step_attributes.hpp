#pragma once
// CAD attributes of STEP entities read straight from the file's entity graph:
// "#n" ids, item names, presentation layers and curve colours. Found on the
// entity itself or on the sets and representations that contain it.

#include "stepframe/geometry/source_info.hpp"

#include <Standard_Handle.hxx>
#include <Standard_Transient.hxx>

#include <optional>
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

  /// Attributes of a point (CARTESIAN_POINT or VERTEX_POINT) when it carries a
  /// name of its own or a layer (its own, its vertex's or point's, or a
  /// container's); nullopt for an unlabelled point. A vertex takes name and
  /// layers from the vertex loops and shells holding it too, and the cartesian
  /// point of a vertex shell's vertex is reported as that vertex.
  std::optional<SourceInfo> point_attributes(const Handle(Standard_Transient) & point) const;

  /// False when no point of the file can be labelled (no point or vertex has a
  /// name or a layer, no layered set holds a point, no vertex shell): then
  /// point_attributes is nullopt for every point, and callers may skip asking.
  bool may_label_points() const { return may_label_points_; }

 private:
  /// Name, colour and layers a container passes down to what it holds (its
  /// own, then its containers'), worked out once per container.
  const SourceInfo& inherited_from(const Handle(Standard_Transient) & container) const;
  /// The containers that hold `entity` directly.
  const std::vector<Handle(Standard_Transient)>& containers_of(const Handle(Standard_Transient) & entity) const;

  Handle(XSControl_WorkSession) session_;
  Handle(StepData_StepModel) model_;
  std::unordered_map<const Standard_Transient*, std::vector<std::string>> layers_;
  std::unordered_map<const Standard_Transient*, std::string> colours_;
  /// Layers of the geometric sets that hold a point as one of their elements.
  std::unordered_map<const Standard_Transient*, std::vector<std::string>> set_layers_of_point_;
  /// Cartesian point -> the vertex point of a vertex loop that stands on it.
  std::unordered_map<const Standard_Transient*, Handle(Standard_Transient)> vertex_of_point_;
  bool may_label_points_ = false;
  mutable std::unordered_map<const Standard_Transient*, SourceInfo> inherited_;
  /// Child -> the containers that list it (sets, edge sets, wireframe models,
  /// representations, composite curves), read once from the model.
  std::unordered_map<const Standard_Transient*, std::vector<Handle(Standard_Transient)>> parents_;
};

}  // namespace stepframe::geometry::detail
