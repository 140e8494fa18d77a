#include "harvest.hpp"

#include "curve_sampling.hpp"

#include <BRepAdaptor_Curve.hxx>
#include <BRep_Tool.hxx>
#include <GeomAbs_CurveType.hxx>
#include <Precision.hxx>
#include <TColStd_Array1OfReal.hxx>
#include <TCollection_AsciiString.hxx>
#include <TDF_Label.hxx>
#include <TDF_LabelSequence.hxx>
#include <TDataStd_Name.hxx>
#include <TDocStd_Document.hxx>
#include <TopAbs_ShapeEnum.hxx>
#include <TopExp_Explorer.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Edge.hxx>
#include <TopoDS_Iterator.hxx>
#include <TopoDS_Shape.hxx>
#include <TopoDS_Vertex.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>

#include <spdlog/fmt/fmt.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <utility>

namespace stepframe::geometry::detail {

namespace {

Eigen::Vector3d to_metres(const gp_Pnt& p, double metres_per_model_unit) {
  return Eigen::Vector3d(p.X(), p.Y(), p.Z()) * metres_per_model_unit;
}

// Samples of curved edges are this close in tangent direction, so a later
// division by turn (5 degrees by default) lands within a small fraction of its target.
constexpr double sample_turn = 0.25 * std::numbers::pi / 180.0;

// The straight pieces of an edge as break points along its parameter
// direction, or empty when the edge is curved. A line is one piece; a
// degree-1 B-spline or Bezier (STEP polyline) is one piece per span.
std::vector<gp_Pnt> straight_break_points(const BRepAdaptor_Curve& curve) {
  const GeomAbs_CurveType type = curve.GetType();
  const bool straight = type == GeomAbs_Line ||
                        ((type == GeomAbs_BSplineCurve || type == GeomAbs_BezierCurve) && curve.Degree() == 1);
  if (!straight) return {};
  if (type == GeomAbs_Line) return {curve.Value(curve.FirstParameter()), curve.Value(curve.LastParameter())};
  // C1 intervals of a degree-1 curve end at its corners.
  const Standard_Integer spans = curve.NbIntervals(GeomAbs_C1);
  TColStd_Array1OfReal breaks(1, spans + 1);
  curve.Intervals(breaks, GeomAbs_C1);
  std::vector<gp_Pnt> points;
  for (Standard_Integer i = breaks.Lower(); i <= breaks.Upper(); ++i) points.push_back(curve.Value(breaks(i)));
  return points;
}

std::string who(const SourceInfo& source) {
  return source.entity.empty() ? std::string("an edge with no STEP entity") : source.entity;
}

void add_label(Harvest& harvest, const Eigen::Vector3d& at, const std::optional<SourceInfo>& label,
               const SourceInfo& owner) {
  if (!label) return;
  // A vertex shared by several edges, or met both as a vertex and as a
  // trimming point, is one labelled point, wherever rounding put each copy.
  const auto micrometres = [](double metres) { return std::llround(metres * 1e6); };
  if (!harvest.labelled.insert({label->entity, {micrometres(at.x()), micrometres(at.y()), micrometres(at.z())}}).second)
    return;
  SourceInfo source = *label;
  if (!owner.product.empty()) source.product = owner.product;
  source.assembly_path = owner.assembly_path;
  harvest.model.points.push_back({at, std::move(source)});
}

void harvest_edge(const TopoDS_Edge& edge, const std::string& product, const std::string& assembly_path,
                  Harvest& harvest) {
  ++harvest.edges_seen;
  const Origin origin = harvest.origins.edge(edge);
  SourceInfo source = origin.info;
  if (!product.empty() || source.product.empty()) source.product = product;
  source.assembly_path = assembly_path;
  if (source.entity.empty()) ++harvest.without_entity;
  if (!origin.entity.IsNull()) harvest.reached.insert(origin.entity.get());
  // Vertices the source names (in-memory shapes and documents) label points.
  for (TopoDS_Iterator it(edge); it.More(); it.Next()) {
    if (it.Value().ShapeType() != TopAbs_VERTEX) continue;
    if (const auto label = harvest.origins.vertex(it.Value()))
      add_label(harvest, to_metres(BRep_Tool::Pnt(TopoDS::Vertex(it.Value())), harvest.metres_per_model_unit), label,
                source);
  }
  auto& diagnostics = harvest.model.diagnostics;
  const double scale = harvest.metres_per_model_unit;

  if (BRep_Tool::Degenerated(edge)) {
    diagnostics.push_back({Severity::warning, "zero-length-edge",
                           fmt::format("{} has no length (degenerate edge); it was dropped", who(source)),
                           {source.entity}, std::nullopt});
    return;
  }
  const BRepAdaptor_Curve curve(edge);
  if (Precision::IsInfinite(curve.FirstParameter()) || Precision::IsInfinite(curve.LastParameter())) {
    diagnostics.push_back(
        {Severity::warning, "unbounded-curve-skipped",
         fmt::format("{} is an unbounded curve (e.g. a LINE with no trimming); it was skipped. Trim it to the "
                     "member's length.",
                     who(source)),
         {source.entity}, std::nullopt});
    return;
  }
  const bool against = harvest.origins.runs_against_source(edge, origin);
  // OCCT's confusion distance (Precision::Confusion, 1e-7 model units) is the
  // shortest length it treats as a length at all.
  const double shortest = Precision::Confusion() * scale;

  std::vector<gp_Pnt> points = straight_break_points(curve);
  if (points.empty()) {
    std::vector<CurveSample> samples = sample_curve(curve, sample_turn);
    if (against) samples = reversed(samples);
    for (CurveSample& s : samples) s.point *= scale;
    WireEdge curved{samples.front().point, samples.back().point, source, std::move(samples)};
    double reach = 0.0;
    for (const CurveSample& s : curved.curve) reach = std::max(reach, (s.point - curved.start).norm());
    if (reach <= shortest) {
      diagnostics.push_back({Severity::warning, "zero-length-edge",
                             fmt::format("{} is a curve of zero length; it was dropped", who(source)),
                             {source.entity}, curved.start});
      return;
    }
    const CornerLabels labels = harvest.origins.corners(origin, 2);
    if (labels.at.size() == 2) {
      add_label(harvest, curved.start, labels.at[0], source);
      add_label(harvest, curved.end, labels.at[1], source);
    }
    harvest.model.edges.push_back(std::move(curved));
    return;
  }
  if (against) std::reverse(points.begin(), points.end());
  const CornerLabels labels = harvest.origins.corners(origin, points.size());
  for (std::size_t i = 0; i < labels.at.size() && i < points.size(); ++i)
    add_label(harvest, to_metres(points[i], scale), labels.at[i], source);
  for (std::size_t i = 0; i + 1 < points.size(); ++i) {
    const Eigen::Vector3d start = to_metres(points[i], scale), end = to_metres(points[i + 1], scale);
    if ((end - start).norm() <= shortest) {
      diagnostics.push_back({Severity::warning, "zero-length-edge",
                             fmt::format("{} has zero length at ({:.6g}, {:.6g}, {:.6g}) m; it was dropped",
                                         who(source), start.x(), start.y(), start.z()),
                             {source.entity}, start});
      continue;
    }
    // The last piece takes the attributes over; the others copy them.
    harvest.model.edges.push_back({start, end, i + 2 == points.size() ? std::move(source) : source, {}});
  }
}

// Walks one label of the assembly tree with the placement of its instance.
void harvest_label(const TDF_Label& label, const TopLoc_Location& placement, const std::string& product,
                   const std::string& assembly_path, Harvest& harvest, int depth) {
  // Guards against a cyclic assembly (an XDE document from a host: files are checked for cycles before
  // OCCT reads them). Deeper parts are not dropped silently: an error names where the walk stopped.
  constexpr int max_depth = 256;
  if (depth > max_depth) {
    harvest.model.diagnostics.push_back(
        {Severity::error, "assembly-too-deep",
         fmt::format("the assembly nests more than {} levels deep (or contains itself) at '{}'; the parts below "
                     "were not read. Flatten the assembly in the CAD program before exporting.",
                     max_depth, assembly_path),
         {}, std::nullopt});
    return;
  }
  if (XCAFDoc_ShapeTool::IsAssembly(label)) {
    TDF_LabelSequence components;
    XCAFDoc_ShapeTool::GetComponents(label, components);
    for (Standard_Integer i = 1; i <= components.Length(); ++i) {
      const TDF_Label& component = components.Value(i);
      TDF_Label part;
      if (!XCAFDoc_ShapeTool::GetReferredShape(component, part)) continue;
      // TopLoc_Location product: the right factor acts first (component, then parent).
      const TopLoc_Location instance = placement * XCAFDoc_ShapeTool::GetLocation(component);
      const std::string part_name = label_name(part);
      std::string instance_name = label_name(component);
      if (instance_name.empty()) instance_name = part_name.empty() ? fmt::format("instance {}", i) : part_name;
      harvest_label(part, instance, part_name.empty() ? product : part_name,
                    assembly_path + " / " + instance_name, harvest, depth + 1);
    }
    return;
  }
  const TopoDS_Shape shape = XCAFDoc_ShapeTool::GetShape(label);
  if (shape.IsNull()) return;
  harvest_shape(shape.Moved(placement), product, assembly_path, harvest);
}

}  // namespace

std::string label_name(const TDF_Label& label) {
  Handle(TDataStd_Name) name;
  if (!label.FindAttribute(TDataStd_Name::GetID(), name)) return {};
  return TCollection_AsciiString(name->Get()).ToCString();
}

void harvest_shape(const TopoDS_Shape& shape, const std::string& product, const std::string& assembly_path,
                   Harvest& harvest) {
  if (shape.ShapeType() == TopAbs_EDGE) {
    harvest_edge(TopoDS::Edge(shape), product, assembly_path, harvest);
    return;
  }
  if (shape.ShapeType() == TopAbs_VERTEX) {
    add_label(harvest, to_metres(BRep_Tool::Pnt(TopoDS::Vertex(shape)), harvest.metres_per_model_unit),
              harvest.origins.vertex(shape), SourceInfo{{}, {}, {}, product, {}, assembly_path});
    return;
  }
  // Bodies are not members: count them and leave them out, with the edges of their faces.
  for (TopExp_Explorer it(shape, TopAbs_SOLID); it.More(); it.Next()) ++harvest.bodies;
  for (TopExp_Explorer it(shape, TopAbs_SHELL, TopAbs_SOLID); it.More(); it.Next()) ++harvest.bodies;
  for (TopExp_Explorer it(shape, TopAbs_FACE, TopAbs_SHELL); it.More(); it.Next()) ++harvest.bodies;
  for (TopExp_Explorer it(shape, TopAbs_EDGE, TopAbs_FACE); it.More(); it.Next())
    harvest_edge(TopoDS::Edge(it.Current()), product, assembly_path, harvest);
  // Loose vertices (points of a curve set, vertex shells) may carry a name or layer.
  for (TopExp_Explorer it(shape, TopAbs_VERTEX, TopAbs_EDGE); it.More(); it.Next()) {
    add_label(harvest, to_metres(BRep_Tool::Pnt(TopoDS::Vertex(it.Current())), harvest.metres_per_model_unit),
              harvest.origins.vertex(it.Current()), SourceInfo{{}, {}, {}, product, {}, assembly_path});
  }
}

void harvest_document(const Handle(TDocStd_Document) & document, Harvest& harvest) {
  const Handle(XCAFDoc_ShapeTool) shapes = XCAFDoc_DocumentTool::ShapeTool(document->Main());
  TDF_LabelSequence roots;
  shapes->GetFreeShapes(roots);
  for (Standard_Integer i = 1; i <= roots.Length(); ++i) {
    const std::string name = label_name(roots.Value(i));
    // A root that is an assembly starts the path; a lone part has none.
    const std::string path = XCAFDoc_ShapeTool::IsAssembly(roots.Value(i)) ? name : std::string();
    harvest_label(roots.Value(i), TopLoc_Location(), name, path, harvest, 0);
  }
}

void finish_harvest(const Harvest& harvest, const std::string& source, const std::string& advice) {
  StepModel& model = harvest.model;
  if (harvest.bodies > 0)
    model.diagnostics.push_back(
        {Severity::warning, "bodies-skipped",
         fmt::format("{} solid or surface bodies were ignored, with their edges; only wireframe curves become "
                     "members",
                     harvest.bodies),
         {}, std::nullopt});
  if (harvest.without_entity > 0)
    model.diagnostics.push_back(
        {Severity::info, "edge-without-entity",
         fmt::format("{} edges could not be traced to a source entity; their attributes are empty",
                     harvest.without_entity),
         {}, std::nullopt});
  if (model.edges.empty()) {
    // An error met on the way (an assembly too deep) is the likelier reason: say it first.
    for (const Diagnostic& d : model.diagnostics)
      if (d.severity == Severity::error) throw StepReadError(fmt::format("{}: {}", source, d.message));
    throw StepReadError(fmt::format("{}: contains no usable edges ({} edges seen, {} solid or surface bodies "
                                    "ignored). {}",
                                    source, harvest.edges_seen, harvest.bodies, advice));
  }
}

}  // namespace stepframe::geometry::detail
