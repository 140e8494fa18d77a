#include "step_origins.hpp"

#include "step_kind.hpp"

#include <BRepAdaptor_Curve.hxx>
#include <StepGeom_CartesianPoint.hxx>
#include <StepGeom_HArray1OfCartesianPoint.hxx>
#include <StepGeom_HArray1OfTrimmingSelect.hxx>
#include <StepGeom_Polyline.hxx>
#include <StepGeom_TrimmedCurve.hxx>
#include <StepShape_EdgeCurve.hxx>
#include <StepShape_Vertex.hxx>
#include <StepShape_VertexPoint.hxx>
#include <TopLoc_Location.hxx>
#include <TopoDS_Edge.hxx>
#include <TopoDS_Shape.hxx>
#include <gp_Pnt.hxx>
#include <gp_Vec.hxx>

#include <optional>

namespace stepframe::geometry::detail {

namespace {

std::optional<gp_Pnt> vertex_point(const Handle(StepShape_Vertex) & vertex) {
  const auto with_point = as_kind<StepShape_VertexPoint>(vertex);
  if (with_point.IsNull()) return std::nullopt;
  const auto point = as_kind<StepGeom_CartesianPoint>(with_point->VertexGeometry());
  if (point.IsNull() || point->NbCoordinates() != 3) return std::nullopt;
  return gp_Pnt(point->CoordinatesValue(1), point->CoordinatesValue(2), point->CoordinatesValue(3));
}

// The cartesian point a trimming select names, if it names one.
Handle(StepGeom_CartesianPoint) trimming_point(const Handle(StepGeom_HArray1OfTrimmingSelect) & trims) {
  if (trims.IsNull()) return nullptr;
  for (Standard_Integer i = trims->Lower(); i <= trims->Upper(); ++i) {
    if (Handle(StepGeom_CartesianPoint) p = trims->Value(i).CartesianPoint(); !p.IsNull()) return p;
  }
  return nullptr;
}

}  // namespace

Handle(Standard_Transient) StepOrigins::entity_of(const TopoDS_Shape& shape) const {
  if (auto it = entities_.find(shape.TShape().get()); it != entities_.end()) return it->second.entity;
  return nullptr;
}

Origin StepOrigins::edge(const TopoDS_Edge& edge) const {
  Origin origin;
  origin.entity = entity_of(edge);
  origin.info = attributes_.attributes_of(origin.entity);
  return origin;
}

std::optional<SourceInfo> StepOrigins::vertex(const TopoDS_Shape& vertex) const {
  if (!attributes_.may_label_points()) return std::nullopt;
  return attributes_.point_attributes(entity_of(vertex));
}

bool StepOrigins::runs_against_source(const TopoDS_Edge& edge, const Origin& origin) const {
  const auto step_edge = as_kind<StepShape_EdgeCurve>(origin.entity);
  if (step_edge.IsNull()) return false;
  const auto start = vertex_point(step_edge->EdgeStart());
  const auto end = vertex_point(step_edge->EdgeEnd());
  if (!start || !end || start->Distance(*end) == 0.0) return false;
  // Both directions in the part's own axes, where only their sign matters.
  TopoDS_Edge unplaced = edge;
  unplaced.Location(TopLoc_Location());
  const BRepAdaptor_Curve curve(unplaced);
  const gp_Vec occt(curve.Value(curve.FirstParameter()), curve.Value(curve.LastParameter()));
  return occt.Dot(gp_Vec(*start, *end)) < 0.0;
}

CornerLabels StepOrigins::corners(const Origin& origin, std::size_t break_points) const {
  CornerLabels labels;
  if (origin.entity.IsNull() || break_points < 2 || !attributes_.may_label_points()) return labels;
  auto ends = [&](const Handle(Standard_Transient) & first, const Handle(Standard_Transient) & last) {
    labels.at.assign(break_points, std::nullopt);
    labels.at.front() = attributes_.point_attributes(first);
    labels.at.back() = attributes_.point_attributes(last);
  };
  if (auto step_edge = as_kind<StepShape_EdgeCurve>(origin.entity); !step_edge.IsNull()) {
    ends(step_edge->EdgeStart(), step_edge->EdgeEnd());
  } else if (auto trimmed = as_kind<StepGeom_TrimmedCurve>(origin.entity); !trimmed.IsNull()) {
    const Handle(StepGeom_CartesianPoint) first = trimming_point(trimmed->Trim1());
    const Handle(StepGeom_CartesianPoint) second = trimming_point(trimmed->Trim2());
    if (trimmed->SenseAgreement()) ends(first, second);
    else ends(second, first);
  } else if (auto polyline = as_kind<StepGeom_Polyline>(origin.entity); !polyline.IsNull()) {
    if (polyline->Points().IsNull() || static_cast<std::size_t>(polyline->NbPoints()) != break_points) return labels;
    for (Standard_Integer i = 1; i <= polyline->NbPoints(); ++i)
      labels.at.push_back(attributes_.point_attributes(polyline->PointsValue(i)));
  }
  return labels;
}

}  // namespace stepframe::geometry::detail
