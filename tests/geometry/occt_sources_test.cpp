// The in-memory model sources: STEP text, an OCCT shape with attributes the
// caller supplies, and an XDE document, each checked against what read_step
// gives for the same model or against the coordinates the test builds.

#include "stepframe/geometry/occt_sources.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "test_support.hpp"

#include <BRepBuilderAPI_MakeEdge.hxx>
#include <BRepBuilderAPI_MakeVertex.hxx>
#include <BRep_Builder.hxx>
#include <GC_MakeArcOfCircle.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <TopoDS_Compound.hxx>
#include <TopoDS_Edge.hxx>
#include <XCAFApp_Application.hxx>
#include <TCollection_AsciiString.hxx>
#include <TDF_Label.hxx>
#include <TDF_LabelSequence.hxx>
#include <TDataStd_Name.hxx>
#include <TopAbs_ShapeEnum.hxx>
#include <TopExp_Explorer.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>
#include <gp_Pnt.hxx>

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;

namespace {

const std::filesystem::path data = STEPFRAME_TEST_DATA;

bool close(const Eigen::Vector3d& a, const Eigen::Vector3d& b) { return (a - b).norm() <= 1e-9 * std::max(1.0, b.norm()); }

void same_edges(const sg::StepModel& a, const sg::StepModel& b) {
  REQUIRE(a.edges.size() == b.edges.size());
  for (std::size_t i = 0; i < a.edges.size(); ++i) {
    CAPTURE(i);
    CHECK(close(a.edges[i].start, b.edges[i].start));
    CHECK(close(a.edges[i].end, b.edges[i].end));
    CHECK(a.edges[i].source.product == b.edges[i].source.product);
    CHECK(a.edges[i].source.assembly_path == b.edges[i].source.assembly_path);
  }
}

sg::SourceInfo info(std::string entity, std::string name, std::vector<std::string> layers, std::string product = {}) {
  sg::SourceInfo s;
  s.entity = std::move(entity);
  s.name = std::move(name);
  s.layers = std::move(layers);
  s.product = std::move(product);
  return s;
}

}  // namespace

TEST_CASE("STEP text in memory reads as the file does", "[sources][text]") {
  for (const char* name : {"yard_nested_assembly_mm.stp", "truss_shell_m.stp", "frame_healing_mm.stp"}) {
    CAPTURE(name);
    const std::string text = sg::test::read_text(data / name);
    const sg::StepModel from_text = sg::read_step_text(text, std::string("memory:") + name);
    const sg::StepModel from_file = sg::read_step(data / name);
    CHECK(from_text.file == std::string("memory:") + name);
    CHECK(from_text.length_unit == from_file.length_unit);
    same_edges(from_text, from_file);
    for (std::size_t i = 0; i < from_text.edges.size(); ++i) CHECK(from_text.edges[i].source.name == from_file.edges[i].source.name);
    for (std::size_t i = 0; i < from_text.edges.size(); ++i) CHECK(from_text.edges[i].source.entity == from_file.edges[i].source.entity);
    CHECK(from_text.points.size() == from_file.points.size());
  }
  CHECK_THROWS_WITH(sg::read_step_text("member list\nB1 IPE 300\n", "pasted"),
                    Catch::StartsWith("pasted:") && Catch::Contains("not STEP"));
}

TEST_CASE("an OCCT shape with caller-supplied attributes", "[sources][shape]") {
  // A compound in millimetres: a column, a beam, an arc of radius 1000 mm and a named point.
  const TopoDS_Edge column = BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(0, 0, 3000));
  const TopoDS_Edge beam = BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 3000), gp_Pnt(4000, 0, 3000));
  // Half circle through (0,0,3000), (1000,0,4000), (2000,0,3000).
  const TopoDS_Edge arch =
      BRepBuilderAPI_MakeEdge(GC_MakeArcOfCircle(gp_Pnt(0, 0, 3000), gp_Pnt(1000, 0, 4000), gp_Pnt(2000, 0, 3000)).Value());
  const TopoDS_Shape hook = BRepBuilderAPI_MakeVertex(gp_Pnt(4000, 0, 3000)).Vertex();
  TopoDS_Compound frame;
  BRep_Builder builder;
  builder.MakeCompound(frame);
  for (const TopoDS_Shape& s : {TopoDS_Shape(column), TopoDS_Shape(beam), TopoDS_Shape(arch), hook}) builder.Add(frame, s);

  sg::ShapeAttributes attributes;
  attributes.display_name = "pipeline frame";
  attributes.items = {{frame, info("", "", {"S-STEEL"}, "RACK-1")},
                      {column, info("C1", "HE 200 B", {"COLUMNS"})},
                      {beam, info("B1", "IPE 300", {})},
                      {hook, info("P1", "HOOK", {"LIFTING"})}};
  const sg::StepModel model = sg::read_shape(frame, attributes);
  CHECK(model.file == "pipeline frame");
  CHECK(model.length_unit == "mm");
  REQUIRE(model.edges.size() == 3);
  CHECK(close(model.edges[0].start, {0, 0, 0}));
  CHECK(close(model.edges[0].end, {0, 0, 3}));
  CHECK(model.edges[0].source.entity == "C1");
  CHECK(model.edges[0].source.name == "HE 200 B");
  // Own layers first, then the compound's; the product comes from the compound.
  CHECK(model.edges[0].source.layers == std::vector<std::string>{"S-STEEL", "COLUMNS"});
  CHECK(model.edges[0].source.product == "RACK-1");
  CHECK(model.edges[1].source.name == "IPE 300");
  CHECK(model.edges[1].source.layers == std::vector<std::string>{"S-STEEL"});
  // The arc has no entry of its own: it is named by its place.
  CHECK(model.edges[2].source.entity == "edge 3");
  REQUIRE(model.edges[2].curved());
  REQUIRE(model.points.size() == 1);
  CHECK(model.points[0].source.name == "HOOK");
  CHECK(close(model.points[0].at, {4, 0, 3}));

  const sg::Wireframe wireframe = sg::build_wireframe(model, 1e-3);
  CHECK(wireframe.members.size() == 3);
  CHECK(wireframe.members[2].nodes.size() == 37);  // a half circle at 5 degrees per element
  REQUIRE(wireframe.labels.size() == 1);
  CHECK(wireframe.labels[0].node == wireframe.members[1].nodes.back());

  SECTION("a unit given in metres") {
    attributes.length_unit = "m";
    attributes.metres_per_unit = 1.0;
    CHECK(close(sg::read_shape(frame, attributes).edges[1].end, {4000, 0, 3000}));
  }
  SECTION("bad input") {
    CHECK_THROWS_WITH(sg::read_shape(TopoDS_Shape(), attributes), Catch::Contains("pipeline frame") && Catch::Contains("null"));
    attributes.metres_per_unit = 0;
    CHECK_THROWS_AS(sg::read_shape(frame, attributes), sg::StepReadError);
    CHECK_THROWS_WITH(sg::read_shape(hook, sg::ShapeAttributes{}), Catch::Contains("no usable edges"));
  }
}

TEST_CASE("an XDE document reads with its names, products, assembly and placements", "[sources][xde]") {
  // Fill a document the way a CAD pipeline does, with OCCT's own STEP reader.
  Handle(TDocStd_Document) document;
  XCAFApp_Application::GetApplication()->NewDocument("MDTV-XCAF", document);
  STEPCAFControl_Reader reader;
  reader.SetNameMode(Standard_True);
  reader.SetLayerMode(Standard_True);
  REQUIRE(reader.ReadFile((data / "yard_nested_assembly_mm.stp").string().c_str()) == IFSelect_RetDone);
  REQUIRE(reader.Transfer(document));

  // OCCT's reader keeps no names for the curves of a curve set; a pipeline
  // names its own sub-shapes. Name the FRAME part's column edge here.
  const Handle(XCAFDoc_ShapeTool) shapes = XCAFDoc_DocumentTool::ShapeTool(document->Main());
  TDF_Label frame_part;
  TDF_LabelSequence free_shapes;
  shapes->GetShapes(free_shapes);
  for (Standard_Integer i = 1; i <= free_shapes.Length(); ++i) {
    Handle(TDataStd_Name) name;
    if (free_shapes.Value(i).FindAttribute(TDataStd_Name::GetID(), name) &&
        TCollection_AsciiString(name->Get()) == "FRAME")
      frame_part = free_shapes.Value(i);
  }
  REQUIRE_FALSE(frame_part.IsNull());
  TopoDS_Shape column;
  for (TopExp_Explorer it(XCAFDoc_ShapeTool::GetShape(frame_part), TopAbs_EDGE); it.More() && column.IsNull(); it.Next())
    column = it.Current();
  const TDF_Label column_label = shapes->AddSubShape(frame_part, column);
  REQUIRE_FALSE(column_label.IsNull());
  TDataStd_Name::Set(column_label, "HE 160 A");

  const sg::StepModel from_document = sg::read_xde_document(document, "yard document");
  const sg::StepModel from_file = sg::read_step(data / "yard_nested_assembly_mm.stp");
  CHECK(from_document.file == "yard document");
  CHECK(from_document.length_unit == "mm");
  same_edges(from_document, from_file);
  for (std::size_t i = 0; i < from_document.edges.size(); ++i) {
    const sg::SourceInfo& s = from_document.edges[i].source;
    CAPTURE(i);
    // XDE keeps the file's layer on the curve set as a layer of the part.
    CHECK(s.layers == std::vector<std::string>{"S-YARD"});
    // The named column, in each of its four placements, carries its label's entry.
    if (from_file.edges[i].source.name == "column") {
      CHECK(s.name == "HE 160 A");
      CHECK(s.entity.rfind("0:1:1:", 0) == 0);
    } else {
      CHECK(s.name.empty());
      CHECK(s.entity.rfind("edge ", 0) == 0);
    }
  }
  XCAFApp_Application::GetApplication()->Close(document);

  CHECK_THROWS_WITH(sg::read_xde_document(Handle(TDocStd_Document)(), "nothing"), Catch::Contains("nothing"));
}

TEST_CASE("deeply nested assemblies: 70 levels are read, beyond the limit an error says where", "[sources][xde]") {
  // A chain of assemblies, each holding the next once, with one edge at the bottom.
  auto nested = [](int levels) {
    Handle(TDocStd_Document) document;
    XCAFApp_Application::GetApplication()->NewDocument("MDTV-XCAF", document);
    const Handle(XCAFDoc_ShapeTool) shapes = XCAFDoc_DocumentTool::ShapeTool(document->Main());
    TDF_Label inner = shapes->AddShape(BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(1000, 0, 0)).Edge(), false);
    for (int i = 0; i < levels; ++i) {
      const TDF_Label assembly = shapes->NewShape();
      shapes->AddComponent(assembly, inner, TopLoc_Location());
      inner = assembly;
    }
    shapes->UpdateAssemblies();
    return document;
  };
  const auto seventy = nested(70);
  const sg::StepModel read = sg::read_xde_document(seventy, "seventy levels");
  CHECK(read.edges.size() == 1);
  CHECK_FALSE(sg::has_errors(read.diagnostics));
  XCAFApp_Application::GetApplication()->Close(seventy);

  // Too deep, with nothing else in the document: the read fails, saying why.
  const auto too_deep = nested(300);
  CHECK_THROWS_WITH(sg::read_xde_document(too_deep, "300 levels"),
                    Catch::Contains("300 levels") && Catch::Contains("more than 256 levels deep"));
  // Beside a part that reads: the model carries the error, so a run refuses it (exit 2).
  const Handle(XCAFDoc_ShapeTool) shapes = XCAFDoc_DocumentTool::ShapeTool(too_deep->Main());
  shapes->AddShape(BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(0, 1000, 0)).Edge(), false);
  const sg::StepModel cut = sg::read_xde_document(too_deep, "300 levels");
  CHECK(cut.edges.size() == 1);
  REQUIRE(sg::has_errors(cut.diagnostics));
  const auto error = std::find_if(cut.diagnostics.begin(), cut.diagnostics.end(),
                                  [](const sg::Diagnostic& d) { return d.code == "assembly-too-deep"; });
  REQUIRE(error != cut.diagnostics.end());
  CHECK_THAT(error->message, Catch::Contains("more than 256 levels"));
  XCAFApp_Application::GetApplication()->Close(too_deep);
}
