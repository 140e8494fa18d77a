#pragma once
// Where the edges and points of a STEP transfer came from: entity ids and the
// attributes the file attaches to them, wherever it puts them.

#include "edge_entities.hpp"
#include "harvest.hpp"
#include "step_attributes.hpp"

namespace stepframe::geometry::detail {

class StepOrigins : public OriginLookup {
 public:
  StepOrigins(const EdgeEntityMap& entities, const StepAttributes& attributes)
      : entities_(entities), attributes_(attributes) {}

  Origin edge(const TopoDS_Edge& edge) const override;
  std::optional<SourceInfo> vertex(const TopoDS_Shape& vertex) const override;
  /// True for the edge of an EDGE_CURVE that OCCT built running from edge_end
  /// to edge_start (as it does for same_sense = .F.).
  bool runs_against_source(const TopoDS_Edge& edge, const Origin& origin) const override;
  /// EDGE_CURVE: its start and end vertices; TRIMMED_CURVE trimmed by points:
  /// those points (in the curve's sense); POLYLINE: its points.
  CornerLabels corners(const Origin& origin, std::size_t break_points) const override;

 private:
  Handle(Standard_Transient) entity_of(const TopoDS_Shape& shape) const;

  const EdgeEntityMap& entities_;
  const StepAttributes& attributes_;
};

}  // namespace stepframe::geometry::detail
