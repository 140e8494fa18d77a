#pragma once
// Which STEP entity each OCCT edge was made from, using the records OCCT's
// transfer process keeps (STEP entity -> resulting shape).

#include <Standard_Handle.hxx>
#include <Standard_Transient.hxx>

#include <cstddef>
#include <unordered_map>

class Transfer_TransientProcess;
class TopoDS_TShape;

namespace stepframe::geometry::detail {

/// Edge geometry (TShape, shared by every placed instance of the edge) -> the
/// most specific STEP entity whose transfer produced it. A curve of a
/// geometric curve set maps to itself; an edge of an edge-based wireframe maps
/// to its EDGE_CURVE. Edges known only as part of a bigger result map to the
/// smallest entity that produced them. A loose vertex made from a cartesian
/// point maps to that point.
struct EdgeMaker {
  Handle(Standard_Transient) entity;
  bool is_curve_or_edge = false;  ///< a curve or edge entity, not a set holding it
  std::size_t granularity = 0;    ///< how many edges the entity produced

  /// True when this maker names the edge better: a curve or an edge entity
  /// beats a set holding it, and among sets the one that made fewer edges.
  bool better_than(const EdgeMaker& other) const {
    if (is_curve_or_edge != other.is_curve_or_edge) return is_curve_or_edge;
    return granularity < other.granularity;
  }
};
using EdgeEntityMap = std::unordered_map<const TopoDS_TShape*, EdgeMaker>;

EdgeEntityMap map_edges_to_entities(const Handle(Transfer_TransientProcess) & process);

}  // namespace stepframe::geometry::detail
