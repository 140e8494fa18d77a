#pragma once
// Which STEP entity each OCCT edge was made from, using the records OCCT's
// transfer process keeps (STEP entity -> resulting shape).

#include <Standard_Handle.hxx>
#include <Standard_Transient.hxx>

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
using EdgeEntityMap = std::unordered_map<const TopoDS_TShape*, Handle(Standard_Transient)>;

EdgeEntityMap map_edges_to_entities(const Handle(Transfer_TransientProcess) & process);

}  // namespace stepframe::geometry::detail
