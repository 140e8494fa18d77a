#include "stepframe/geometry/step_reader.hpp"

#include "declared_length_unit.hpp"
#include "edge_entities.hpp"
#include "occt_messages.hpp"
#include "step_attributes.hpp"
#include "xde_document.hpp"

#include <BRepAdaptor_Curve.hxx>
#include <BRep_Tool.hxx>
#include <IFSelect_ReturnStatus.hxx>
#include <Precision.hxx>
#include <STEPCAFControl_Controller.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <STEPControl_Reader.hxx>
#include <Standard_Failure.hxx>
#include <StepData_StepModel.hxx>
#include <StepGeom_CartesianPoint.hxx>
#include <StepGeom_Curve.hxx>
#include <StepGeom_HArray1OfTrimmingSelect.hxx>
#include <StepGeom_TrimmedCurve.hxx>
#include <StepShape_ConnectedEdgeSet.hxx>
#include <StepShape_EdgeCurve.hxx>
#include <StepShape_Vertex.hxx>
#include <StepShape_VertexPoint.hxx>
#include <gp_Vec.hxx>
#include <StepShape_EdgeBasedWireframeModel.hxx>
#include <StepShape_GeometricSet.hxx>
#include <StepShape_HArray1OfConnectedEdgeSet.hxx>
#include <StepShape_HArray1OfEdge.hxx>
#include <StepShape_HArray1OfGeometricSetSelect.hxx>
#include <TColStd_Array1OfReal.hxx>
#include <TCollection_AsciiString.hxx>
#include <TDF_Label.hxx>
#include <TDF_LabelSequence.hxx>
#include <TDataStd_Name.hxx>
#include <TDocStd_Document.hxx>
#include <TopAbs_ShapeEnum.hxx>
#include <TopExp_Explorer.hxx>
#include <TopLoc_Location.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Edge.hxx>
#include <TopoDS_Shape.hxx>
#include <Transfer_TransientProcess.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>
#include <XSControl_TransferReader.hxx>
#include <XSControl_WorkSession.hxx>

#include <spdlog/fmt/fmt.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <optional>
#include <system_error>
#include <unordered_set>
#include <utility>

namespace stepframe::geometry {

namespace {

constexpr const char* export_advice =
    "Export the frame from the CAD program as a STEP (ISO 10303-21) wireframe: one straight line per "
    "member centreline, as a geometric curve set or an edge-based wireframe.";

[[noreturn]] void fail(const std::filesystem::path& file, const std::string& what) {
  throw StepReadError(fmt::format("{}: {}", file.string(), what));
}

std::string label_name(const TDF_Label& label) {
  Handle(TDataStd_Name) name;
  if (!label.FindAttribute(TDataStd_Name::GetID(), name)) return {};
  return TCollection_AsciiString(name->Get()).ToCString();
}

Eigen::Vector3d to_metres(const gp_Pnt& p, double metres_per_model_unit) {
  return Eigen::Vector3d(p.X(), p.Y(), p.Z()) * metres_per_model_unit;
}

// Everything the XDE walk needs while it collects edges.
struct Harvest {
  const detail::EdgeEntityMap& edge_entities;
  const detail::StepAttributes& attributes;
  double metres_per_model_unit;             // OCCT's model unit (the document's) in metres
  std::vector<WireEdge>& edges;
  std::vector<Diagnostic>& diagnostics;
  std::unordered_set<const Standard_Transient*> reached;  // entities met, straight or not
  std::size_t bodies = 0;
  std::size_t curved = 0;
  std::size_t without_entity = 0;
};

// The straight pieces of an edge as break points along its own direction, or
// empty when the edge is curved. A line is one piece; a degree-1 B-spline or
// Bezier (STEP polyline) is one piece per span.
std::vector<gp_Pnt> straight_break_points(const TopoDS_Edge& edge) {
  BRepAdaptor_Curve curve(edge);
  const GeomAbs_CurveType type = curve.GetType();
  const bool straight = type == GeomAbs_Line ||
                        ((type == GeomAbs_BSplineCurve || type == GeomAbs_BezierCurve) && curve.Degree() == 1);
  if (!straight) return {};
  std::vector<gp_Pnt> points;
  if (type == GeomAbs_Line) {
    points = {curve.Value(curve.FirstParameter()), curve.Value(curve.LastParameter())};
  } else {
    // C1 intervals of a degree-1 curve end at its corners.
    const Standard_Integer spans = curve.NbIntervals(GeomAbs_C1);
    TColStd_Array1OfReal breaks(1, spans + 1);
    curve.Intervals(breaks, GeomAbs_C1);
    for (Standard_Integer i = breaks.Lower(); i <= breaks.Upper(); ++i) points.push_back(curve.Value(breaks(i)));
  }
  // Points run in the curve's parameter direction. How a wire happens to use
  // the edge (its orientation there) is not the edge's own direction.
  return points;
}

std::optional<gp_Pnt> vertex_point(const Handle(StepShape_Vertex) & vertex) {
  const auto with_point = Handle(StepShape_VertexPoint)::DownCast(vertex);
  if (with_point.IsNull()) return std::nullopt;
  const auto point = Handle(StepGeom_CartesianPoint)::DownCast(with_point->VertexGeometry());
  if (point.IsNull() || point->NbCoordinates() != 3) return std::nullopt;
  return gp_Pnt(point->CoordinatesValue(1), point->CoordinatesValue(2), point->CoordinatesValue(3));
}

// True when OCCT's edge runs opposite to the STEP EDGE_CURVE it came from
// (edge_start -> edge_end), as it does for same_sense = .F. Both directions
// are compared in the part's own axes, where only their sign matters.
bool runs_against_step_edge(const TopoDS_Edge& edge, const Handle(Standard_Transient) & entity) {
  const auto step_edge = Handle(StepShape_EdgeCurve)::DownCast(entity);
  if (step_edge.IsNull()) return false;
  const auto start = vertex_point(step_edge->EdgeStart());
  const auto end = vertex_point(step_edge->EdgeEnd());
  if (!start || !end || start->Distance(*end) == 0.0) return false;
  TopoDS_Edge unplaced = edge;
  unplaced.Location(TopLoc_Location());
  BRepAdaptor_Curve curve(unplaced);
  const gp_Vec occt(curve.Value(curve.FirstParameter()), curve.Value(curve.LastParameter()));
  return occt.Dot(gp_Vec(*start, *end)) < 0.0;
}

void harvest_edge(const TopoDS_Edge& edge, const std::string& product, Harvest& harvest) {
  Handle(Standard_Transient) entity;
  if (auto it = harvest.edge_entities.find(edge.TShape().get()); it != harvest.edge_entities.end())
    entity = it->second;
  SourceInfo source = harvest.attributes.attributes_of(entity);
  source.product = product;
  if (entity.IsNull()) {
    ++harvest.without_entity;
  } else {
    harvest.reached.insert(entity.get());
  }
  const std::string who = source.entity.empty() ? std::string("an edge with no STEP entity") : source.entity;

  if (BRep_Tool::Degenerated(edge)) {
    harvest.diagnostics.push_back({Severity::warning, "zero-length-edge",
                                   fmt::format("{} has no length (degenerate edge); it was dropped", who),
                                   {source.entity}, std::nullopt});
    return;
  }
  if (BRepAdaptor_Curve bounds(edge);
      Precision::IsInfinite(bounds.FirstParameter()) || Precision::IsInfinite(bounds.LastParameter())) {
    harvest.diagnostics.push_back(
        {Severity::warning, "unbounded-curve-skipped",
         fmt::format("{} is an unbounded curve (e.g. a LINE with no trimming); it was skipped. Trim it to the "
                     "member's length.",
                     who),
         {source.entity}, std::nullopt});
    return;
  }
  std::vector<gp_Pnt> points = straight_break_points(edge);
  if (points.empty()) {
    ++harvest.curved;
    BRepAdaptor_Curve curve(edge);
    harvest.diagnostics.push_back(
        {Severity::warning, "curved-edge-skipped",
         fmt::format("{} is not a straight line; it was skipped. Model members as straight lines.", who),
         {source.entity}, to_metres(curve.Value(curve.FirstParameter()), harvest.metres_per_model_unit)});
    return;
  }
  if (runs_against_step_edge(edge, entity)) std::reverse(points.begin(), points.end());
  // OCCT's confusion distance (Precision::Confusion, 1e-7 model units) is the
  // shortest length it treats as a length at all.
  const double shortest = Precision::Confusion() * harvest.metres_per_model_unit;
  for (std::size_t i = 0; i + 1 < points.size(); ++i) {
    WireEdge piece{to_metres(points[i], harvest.metres_per_model_unit),
                   to_metres(points[i + 1], harvest.metres_per_model_unit), source};
    if ((piece.end - piece.start).norm() <= shortest) {
      harvest.diagnostics.push_back({Severity::warning, "zero-length-edge",
                                     fmt::format("{} has zero length at ({:.6g}, {:.6g}, {:.6g}) m; it was dropped",
                                                 who, piece.start.x(), piece.start.y(), piece.start.z()),
                                     {source.entity}, piece.start});
      continue;
    }
    harvest.edges.push_back(std::move(piece));
  }
}

void harvest_shape(const TopoDS_Shape& shape, const std::string& product, Harvest& harvest) {
  // Bodies are not members: count them and leave them out, with the edges of
  // their faces.
  for (TopExp_Explorer it(shape, TopAbs_SOLID); it.More(); it.Next()) ++harvest.bodies;
  for (TopExp_Explorer it(shape, TopAbs_SHELL, TopAbs_SOLID); it.More(); it.Next()) ++harvest.bodies;
  for (TopExp_Explorer it(shape, TopAbs_FACE, TopAbs_SHELL); it.More(); it.Next()) ++harvest.bodies;
  for (TopExp_Explorer it(shape, TopAbs_EDGE, TopAbs_FACE); it.More(); it.Next())
    harvest_edge(TopoDS::Edge(it.Current()), product, harvest);
}

// Walks XDE's assembly tree: every component instance is visited with its
// placement composed onto its parent's, so each instance yields its edges.
void harvest_label(const TDF_Label& label, const TopLoc_Location& placement, const std::string& product,
                   Harvest& harvest, int depth) {
  constexpr int max_depth = 64;  // guards against a cyclic assembly in a broken file
  if (depth > max_depth) return;
  if (XCAFDoc_ShapeTool::IsAssembly(label)) {
    TDF_LabelSequence components;
    XCAFDoc_ShapeTool::GetComponents(label, components);
    for (Standard_Integer i = 1; i <= components.Length(); ++i) {
      TDF_Label part;
      if (!XCAFDoc_ShapeTool::GetReferredShape(components.Value(i), part)) continue;
      // TopLoc_Location product: the right factor acts first (component, then parent).
      const TopLoc_Location instance = placement * XCAFDoc_ShapeTool::GetLocation(components.Value(i));
      std::string name = label_name(part);
      harvest_label(part, instance, name.empty() ? product : name, harvest, depth + 1);
    }
    return;
  }
  const TopoDS_Shape shape = XCAFDoc_ShapeTool::GetShape(label);
  if (shape.IsNull()) return;
  harvest_shape(shape.Moved(placement), product, harvest);
}

bool coincident_trims(const Handle(StepGeom_TrimmedCurve) & curve) {
  const Handle(StepGeom_HArray1OfTrimmingSelect) first = curve->Trim1();
  const Handle(StepGeom_HArray1OfTrimmingSelect) second = curve->Trim2();
  if (first.IsNull() || second.IsNull()) return false;
  for (Standard_Integer i = first->Lower(); i <= first->Upper(); ++i) {
    for (Standard_Integer k = second->Lower(); k <= second->Upper(); ++k) {
      const StepGeom_TrimmingSelect& a = first->Value(i);
      const StepGeom_TrimmingSelect& b = second->Value(k);
      const Handle(StepGeom_CartesianPoint) pa = a.CartesianPoint();
      const Handle(StepGeom_CartesianPoint) pb = b.CartesianPoint();
      if (!pa.IsNull() && !pb.IsNull() && pa->NbCoordinates() == pb->NbCoordinates()) {
        bool same = true;
        for (Standard_Integer c = 1; c <= pa->NbCoordinates(); ++c)
          same = same && pa->CoordinatesValue(c) == pb->CoordinatesValue(c);
        if (same) return true;
      }
      if (pa.IsNull() && pb.IsNull() && a.ParameterValue() == b.ParameterValue()) return true;
    }
  }
  return false;
}

// Curves of geometric sets and edges of edge-based wireframes that produced no
// edge at all: OCCT could not translate them, or they have no length.
void report_untranslated(const Handle(StepData_StepModel) & model, const detail::StepAttributes& attributes,
                         const Harvest& harvest, std::vector<Diagnostic>& diagnostics) {
  auto report = [&](const Handle(Standard_Transient) & item) {
    if (item.IsNull() || harvest.reached.count(item.get()) != 0) return;
    const std::string id = attributes.entity_id(item);
    if (auto trimmed = Handle(StepGeom_TrimmedCurve)::DownCast(item); !trimmed.IsNull() && coincident_trims(trimmed)) {
      diagnostics.push_back({Severity::warning, "zero-length-edge",
                             fmt::format("{} (TRIMMED_CURVE) starts and ends at the same place; it was dropped", id),
                             {id}, std::nullopt});
      return;
    }
    diagnostics.push_back({Severity::warning, "curve-not-translated",
                           fmt::format("{} ({}) gave no edge: OCCT could not translate it, or it is not placed in "
                                       "any product. Check this entity in the file.",
                                       id, item->DynamicType()->Name()),
                           {id}, std::nullopt});
  };
  for (Standard_Integer i = 1; i <= model->NbEntities(); ++i) {
    const Handle(Standard_Transient)& entity = model->Value(i);
    if (auto set = Handle(StepShape_GeometricSet)::DownCast(entity); !set.IsNull()) {
      if (set->Elements().IsNull()) continue;
      for (Standard_Integer k = 1; k <= set->NbElements(); ++k) {
        const Handle(Standard_Transient) element = set->ElementsValue(k).Value();
        if (!element.IsNull() && element->IsKind(STANDARD_TYPE(StepGeom_Curve))) report(element);
      }
    } else if (auto wireframe = Handle(StepShape_EdgeBasedWireframeModel)::DownCast(entity); !wireframe.IsNull()) {
      const Handle(StepShape_HArray1OfConnectedEdgeSet) sets = wireframe->EbwmBoundary();
      if (sets.IsNull()) continue;
      for (Standard_Integer s = sets->Lower(); s <= sets->Upper(); ++s) {
        if (sets->Value(s).IsNull() || sets->Value(s)->CesEdges().IsNull()) continue;
        const Handle(StepShape_HArray1OfEdge) edges = sets->Value(s)->CesEdges();
        for (Standard_Integer k = edges->Lower(); k <= edges->Upper(); ++k) report(edges->Value(k));
      }
    }
  }
}

}  // namespace

StepModel read_step(const std::filesystem::path& file) {
  std::error_code status_error;
  const auto status = std::filesystem::status(file, status_error);
  if (!std::filesystem::exists(status))
    fail(file, "file not found. Check the path and the file name (.stp or .step).");
  if (!std::filesystem::is_regular_file(status))
    fail(file, "is not a regular file (a folder?). Give the path of a STEP file.");

  detail::route_occt_messages_to_spdlog();
  STEPCAFControl_Controller::Init();
  spdlog::info("reading STEP file {}", file.string());

  STEPCAFControl_Reader reader;
  reader.SetNameMode(Standard_True);
  reader.SetLayerMode(Standard_True);
  reader.SetColorMode(Standard_True);
  reader.SetPropsMode(Standard_False);
  reader.SetGDTMode(Standard_False);
  reader.SetMatMode(Standard_False);
  reader.SetViewMode(Standard_False);

  IFSelect_ReturnStatus read_status = IFSelect_RetFail;
  detail::OcctFailureLog parser_log;
  try {
    read_status = reader.ReadFile(file.string().c_str());
  } catch (const Standard_Failure& failure) {
    fail(file, fmt::format("OCCT failed while parsing it ({}). {}", failure.GetMessageString(), export_advice));
  }
  if (read_status != IFSelect_RetDone) {
    const std::string said = parser_log.summary();
    fail(file, fmt::format("is not a readable STEP (ISO 10303-21) file: OCCT could not parse it{}. {}",
                           said.empty() ? std::string() : " (" + said + ")", export_advice));
  }

  const Handle(XSControl_WorkSession) session = reader.Reader().WS();
  const Handle(StepData_StepModel) step_model = reader.Reader().StepModel();
  if (step_model.IsNull() || step_model->NbEntities() == 0)
    fail(file, fmt::format("holds no STEP entities. {}", export_advice));

  detail::XdeDocument document;
  // OCCT converts coordinates into the document's unit; fix it to millimetres
  // and read it back below rather than trusting the session default.
  XCAFDoc_DocumentTool::SetLengthUnit(document.get(), 1e-3);
  bool transferred = false;
  try {
    transferred = reader.Transfer(document.get());
  } catch (const Standard_Failure& failure) {
    fail(file, fmt::format("OCCT failed while translating its shapes ({}). {}", failure.GetMessageString(),
                           export_advice));
  }
  if (!transferred) fail(file, fmt::format("OCCT found no shapes to translate in it. {}", export_advice));

  double metres_per_model_unit = 1e-3;
  if (Standard_Real unit = 0.0; XCAFDoc_DocumentTool::GetLengthUnit(document.get(), unit) && unit > 0.0)
    metres_per_model_unit = unit;

  StepModel model;
  model.file = file;

  const std::vector<detail::DeclaredLengthUnit> units = detail::declared_length_units(step_model);
  if (units.empty()) {
    model.length_unit = "mm";
    model.metres_per_unit = 1e-3;
    model.diagnostics.push_back({Severity::warning, "no-length-unit",
                                 "the file declares no length unit; OCCT read its coordinates as millimetres",
                                 {}, std::nullopt});
  } else {
    model.length_unit = units.front().name;
    model.metres_per_unit = units.front().metres_per_unit;
    if (units.size() > 1) {
      std::string names;
      for (const auto& unit : units) names += (names.empty() ? "" : ", ") + unit.name;
      model.diagnostics.push_back(
          {Severity::info, "mixed-length-units",
           fmt::format("the file declares several length units ({}); each part's coordinates were converted "
                       "from its own unit, and {} is reported as the file's unit",
                       names, model.length_unit),
           {}, std::nullopt});
    }
  }

  const Handle(Transfer_TransientProcess) process = session->TransferReader()->TransientProcess();
  const detail::EdgeEntityMap edge_entities = detail::map_edges_to_entities(process);
  const detail::StepAttributes attributes(session);

  Harvest harvest{edge_entities, attributes, metres_per_model_unit, model.edges, model.diagnostics, {}, 0, 0, 0};
  const Handle(XCAFDoc_ShapeTool) shapes = XCAFDoc_DocumentTool::ShapeTool(document.get()->Main());
  TDF_LabelSequence roots;
  shapes->GetFreeShapes(roots);
  for (Standard_Integer i = 1; i <= roots.Length(); ++i)
    harvest_label(roots.Value(i), TopLoc_Location(), label_name(roots.Value(i)), harvest, 0);

  report_untranslated(step_model, attributes, harvest, model.diagnostics);
  if (harvest.bodies > 0)
    model.diagnostics.push_back(
        {Severity::warning, "bodies-skipped",
         fmt::format("{} solid or surface bodies were ignored; only wireframe lines become members", harvest.bodies),
         {}, std::nullopt});
  if (harvest.without_entity > 0)
    model.diagnostics.push_back(
        {Severity::info, "edge-without-entity",
         fmt::format("{} edges could not be traced to a STEP entity; their attributes are empty",
                     harvest.without_entity),
         {}, std::nullopt});

  if (model.edges.empty()) {
    fail(file, fmt::format("contains no usable straight edges ({} curved edges skipped, {} solid or surface "
                           "bodies ignored). {}",
                           harvest.curved, harvest.bodies, export_advice));
  }
  spdlog::info("{}: {} straight edges, length unit {} ({} m), {} diagnostics", file.string(), model.edges.size(),
               model.length_unit, model.metres_per_unit, model.diagnostics.size());
  return model;
}

}  // namespace stepframe::geometry
