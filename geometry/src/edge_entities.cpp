#include "edge_entities.hpp"

#include "step_kind.hpp"

#include <StepGeom_Curve.hxx>
#include <StepShape_ConnectedEdgeSet.hxx>
#include <StepShape_Edge.hxx>
#include <StepShape_EdgeBasedWireframeModel.hxx>
#include <StepShape_HArray1OfConnectedEdgeSet.hxx>
#include <StepShape_HArray1OfEdge.hxx>
#include <StepShape_OrientedEdge.hxx>
#include <TopAbs_ShapeEnum.hxx>
#include <TopExp_Explorer.hxx>
#include <TopTools_IndexedMapOfShape.hxx>
#include <TopExp.hxx>
#include <TopoDS_Shape.hxx>
#include <TopoDS_TShape.hxx>
#include <Transfer_Binder.hxx>
#include <Transfer_TransientProcess.hxx>
#include <TransferBRep.hxx>

#include <cstddef>
#include <vector>

namespace stepframe::geometry::detail {

namespace {

bool is_curve_or_edge(const Handle(Standard_Transient) & entity) {
  return entity->IsKind(STANDARD_TYPE(StepGeom_Curve)) || entity->IsKind(STANDARD_TYPE(StepShape_Edge));
}

void offer(EdgeEntityMap& best, const TopoDS_TShape* edge, const EdgeMaker& offered) {
  const auto [slot, fresh] = best.try_emplace(edge, offered);
  if (!fresh && offered.better_than(slot->second)) slot->second = offered;
}

// OCCT binds an edge-based wireframe model as a whole; its edges come out in
// the order of the connected edge sets and their edges (StepToTopoDS_Builder).
// Pair them up when the counts agree, so each edge names its EDGE_CURVE.
void offer_wireframe_edges(EdgeEntityMap& best,
                           const Handle(StepShape_EdgeBasedWireframeModel) & model, const TopoDS_Shape& result) {
  std::vector<Handle(Standard_Transient)> step_edges;
  const Handle(StepShape_HArray1OfConnectedEdgeSet) sets = model->EbwmBoundary();
  if (sets.IsNull()) return;
  for (Standard_Integer i = sets->Lower(); i <= sets->Upper(); ++i) {
    const Handle(StepShape_ConnectedEdgeSet)& set = sets->Value(i);
    if (set.IsNull() || set->CesEdges().IsNull()) continue;
    const Handle(StepShape_HArray1OfEdge) edges = set->CesEdges();
    for (Standard_Integer k = edges->Lower(); k <= edges->Upper(); ++k) {
      Handle(Standard_Transient) edge(edges->Value(k));
      if (auto oriented = as_kind<StepShape_OrientedEdge>(edge); !oriented.IsNull())
        edge = oriented->EdgeElement();
      step_edges.push_back(edge);
    }
  }
  std::vector<TopoDS_Shape> occt_edges;
  for (TopExp_Explorer it(result, TopAbs_EDGE); it.More(); it.Next()) occt_edges.push_back(it.Current());
  if (occt_edges.size() != step_edges.size()) return;  // an edge failed to translate: keep the coarser map
  for (std::size_t i = 0; i < occt_edges.size(); ++i)
    offer(best, occt_edges[i].TShape().get(), EdgeMaker{step_edges[i], is_curve_or_edge(step_edges[i]), 1});
}

}  // namespace

EdgeEntityMap map_edges_to_entities(const Handle(Transfer_TransientProcess) & process) {
  EdgeEntityMap best;
  if (process.IsNull()) return best;
  best.reserve(static_cast<std::size_t>(process->NbMapped()));
  std::vector<const TopoDS_TShape*> made;
  for (Standard_Integer i = 1; i <= process->NbMapped(); ++i) {
    const Handle(Standard_Transient)& entity = process->Mapped(i);
    const Handle(Transfer_Binder) binder = process->MapItem(i);
    if (entity.IsNull() || binder.IsNull()) continue;
    const TopoDS_Shape result = TransferBRep::ShapeResult(binder);
    if (result.IsNull()) continue;
    const bool fine = is_curve_or_edge(entity);
    if (result.ShapeType() == TopAbs_EDGE || result.ShapeType() == TopAbs_VERTEX) {
      // A curve or edge made into one edge; a point of a curve set bound on
      // its own to the vertex made from it.
      offer(best, result.TShape().get(), EdgeMaker{entity, fine, 1});
      continue;
    }
    // A set, model or representation made into many edges: count them, then
    // offer each (an edge met twice in a compound is offered twice, harmlessly).
    made.clear();
    for (TopExp_Explorer it(result, TopAbs_EDGE); it.More(); it.Next()) made.push_back(it.Current().TShape().get());
    const EdgeMaker offered{entity, fine, made.size()};
    for (const TopoDS_TShape* edge : made) offer(best, edge, offered);
    if (auto wireframe = as_kind<StepShape_EdgeBasedWireframeModel>(entity); !wireframe.IsNull())
      offer_wireframe_edges(best, wireframe, result);
  }
  return best;
}

}  // namespace stepframe::geometry::detail
