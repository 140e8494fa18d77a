#include "stepframe/geometry/step_writer.hpp"

#include "stepframe/geometry/length_unit.hpp"

#include "occt_messages.hpp"
#include "xde_document.hpp"

#include <APIHeaderSection_MakeHeader.hxx>
#include <BRepBuilderAPI_MakeEdge.hxx>
#include <BRep_Builder.hxx>
#include <IFSelect_ReturnStatus.hxx>
#include <Interface_Static.hxx>
#include <STEPCAFControl_Controller.hxx>
#include <STEPCAFControl_Writer.hxx>
#include <STEPControl_StepModelType.hxx>
#include <StepData_StepModel.hxx>
#include <StepShape_EdgeBasedWireframeModel.hxx>
#include <StepShape_GeometricCurveSet.hxx>
#include <TCollection_HAsciiString.hxx>
#include <TDF_Label.hxx>
#include <TDataStd_Name.hxx>
#include <TDocStd_Document.hxx>
#include <TopLoc_Location.hxx>
#include <TopoDS_Compound.hxx>
#include <TopoDS_Edge.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_LayerTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>
#include <XSControl_WorkSession.hxx>
#include <gp_Pnt.hxx>
#include <gp_Trsf.hxx>
#include <gp_Vec.hxx>

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cstdio>
#include <map>
#include <stdexcept>
#include <system_error>
#include <utility>

namespace stepframe::geometry {

namespace {

// OCCT's translator parameters are process-wide (Interface_Static). Each
// write sets the ones it needs and puts the previous values back afterwards.
class StaticParameterScope {
 public:
  StaticParameterScope() = default;
  StaticParameterScope(const StaticParameterScope&) = delete;
  StaticParameterScope& operator=(const StaticParameterScope&) = delete;
  ~StaticParameterScope() {
    for (auto it = saved_.rbegin(); it != saved_.rend(); ++it)
      Interface_Static::SetCVal(it->first.c_str(), it->second.c_str());
  }
  void set(const char* name, const char* value) {
    const char* previous = Interface_Static::CVal(name);
    saved_.emplace_back(name, previous != nullptr ? previous : "");
    if (!Interface_Static::SetCVal(name, value))
      throw std::runtime_error(std::string("OCCT rejected STEP parameter ") + name + " = " + value);
  }

 private:
  std::vector<std::pair<std::string, std::string>> saved_;
};

// Name of the length unit as OCCT's "write.step.unit" parameter spells it.
const char* occt_unit_keyword(const std::string& unit) {
  if (unit == "mm") return "MM";
  if (unit == "m") return "M";
  if (unit == "inch") return "INCH";
  return nullptr;
}

TCollection_ExtendedString to_occt(const std::string& text) {
  return TCollection_ExtendedString(text.c_str(), /*isMultiByte=*/true);
}

// One part: the lines that share a product name, in input order.
struct PartLines {
  std::string product;
  std::vector<const LineToWrite*> lines;
};

std::vector<PartLines> group_by_product(const std::vector<LineToWrite>& lines) {
  std::vector<PartLines> parts;
  std::map<std::string, std::size_t> index;
  for (const LineToWrite& line : lines) {
    const auto [it, inserted] = index.try_emplace(line.attributes.product, parts.size());
    if (inserted) parts.push_back(PartLines{line.attributes.product, {}});
    parts[it->second].lines.push_back(&line);
  }
  return parts;
}

bool model_has_wireframe(const Handle(StepData_StepModel) & model) {
  for (Standard_Integer i = 1; i <= model->NbEntities(); ++i) {
    const Handle(Standard_Transient)& entity = model->Value(i);
    if (entity->IsKind(STANDARD_TYPE(StepShape_GeometricCurveSet)) ||
        entity->IsKind(STANDARD_TYPE(StepShape_EdgeBasedWireframeModel)))
      return true;
  }
  return false;
}

}  // namespace

void write_step_wireframe(const std::filesystem::path& file, const std::vector<LineToWrite>& lines,
                          const std::string& length_unit) {
  const std::lock_guard<std::mutex> one_at_a_time(detail::occt_exchange_lock());
  const char* unit_keyword = occt_unit_keyword(length_unit);
  if (unit_keyword == nullptr)
    throw std::invalid_argument("cannot write " + file.string() + ": length unit '" + length_unit +
                                "' is not supported; use \"mm\", \"m\" or \"inch\"");
  if (lines.empty())
    throw std::runtime_error("cannot write " + file.string() + ": there are no lines to write");
  const double unit_in_metres = *metres_per_unit(length_unit);

  detail::route_occt_messages_to_spdlog();
  STEPCAFControl_Controller::Init();
  StaticParameterScope parameters;
  parameters.set("write.step.schema", "AP214IS");
  parameters.set("write.step.unit", unit_keyword);
  parameters.set("write.stepcaf.subshapes.name", "1");

  detail::XdeDocument xde;
  const Handle(TDocStd_Document)& document = xde.get();
  // Shapes are built in the file's unit and the document says so, so OCCT
  // writes the coordinates without rescaling them.
  XCAFDoc_DocumentTool::SetLengthUnit(document, unit_in_metres);
  const Handle(XCAFDoc_ShapeTool) shapes = XCAFDoc_DocumentTool::ShapeTool(document->Main());
  const Handle(XCAFDoc_LayerTool) layers = XCAFDoc_DocumentTool::LayerTool(document->Main());

  const TDF_Label assembly = shapes->NewShape();
  TDataStd_Name::Set(assembly, to_occt(file.stem().string()));

  for (const PartLines& part : group_by_product(lines)) {
    // The part's own axes start at its first point; the component placement
    // moves it back, so readers must apply assembly placements to get it right.
    const Eigen::Vector3d origin = part.lines.front()->start;
    auto local = [&](const Eigen::Vector3d& p) {
      const Eigen::Vector3d q = (p - origin) / unit_in_metres;
      return gp_Pnt(q.x(), q.y(), q.z());
    };

    BRep_Builder builder;
    TopoDS_Compound compound;
    builder.MakeCompound(compound);
    std::vector<TopoDS_Edge> edges;
    edges.reserve(part.lines.size());
    for (const LineToWrite* line : part.lines) {
      if (!line->start.allFinite() || !line->end.allFinite())
        throw std::runtime_error("cannot write " + file.string() + ": line '" + line->attributes.name +
                                 "' of part '" + part.product + "' has a non-finite coordinate");
      BRepBuilderAPI_MakeEdge make(local(line->start), local(line->end));
      if (!make.IsDone())
        throw std::runtime_error("cannot write " + file.string() + ": line '" +
                                 line->attributes.name + "' of part '" + part.product +
                                 "' has coincident end points");
      edges.push_back(make.Edge());
      builder.Add(compound, edges.back());
    }

    const TDF_Label part_label = shapes->AddShape(compound, /*makeAssembly=*/Standard_False);
    TDataStd_Name::Set(part_label, to_occt(part.product.empty() ? "wireframe" : part.product));
    for (std::size_t i = 0; i < edges.size(); ++i) {
      const SourceInfo& attributes = part.lines[i]->attributes;
      if (attributes.name.empty() && attributes.layers.empty()) continue;
      const TDF_Label edge_label = shapes->AddSubShape(part_label, edges[i]);
      if (edge_label.IsNull())
        throw std::runtime_error("cannot write " + file.string() +
                                 ": OCCT refused a sub-shape label for line '" + attributes.name + "'");
      if (!attributes.name.empty()) TDataStd_Name::Set(edge_label, to_occt(attributes.name));
      for (const std::string& layer : attributes.layers) layers->SetLayer(edge_label, to_occt(layer));
    }

    gp_Trsf placement;
    placement.SetTranslation(gp_Vec(origin.x() / unit_in_metres, origin.y() / unit_in_metres,
                                    origin.z() / unit_in_metres));
    shapes->AddComponent(assembly, part_label, TopLoc_Location(placement));
  }
  shapes->UpdateAssemblies();

  STEPCAFControl_Writer writer;
  writer.SetNameMode(Standard_True);
  writer.SetLayerMode(Standard_True);
  writer.SetColorMode(Standard_False);
  if (!writer.Transfer(document, STEPControl_AsIs))
    throw std::runtime_error("cannot write " + file.string() + ": OCCT could not translate the wireframe to STEP");
  const Handle(StepData_StepModel) model = writer.ChangeWriter().Model();
  if (model.IsNull() || !model_has_wireframe(model))
    throw std::runtime_error("cannot write " + file.string() +
                             ": OCCT did not produce a geometric curve set or edge-based wireframe");

  // FILE_NAME and FILE_DESCRIPTION say what wrote the file (ISO 10303-21 header section).
  APIHeaderSection_MakeHeader header(model);
  header.SetName(new TCollection_HAsciiString(file.filename().string().c_str()));
  header.SetAuthorValue(1, new TCollection_HAsciiString(""));
  header.SetOrganizationValue(1, new TCollection_HAsciiString(""));
  header.SetOriginatingSystem(new TCollection_HAsciiString("stepframe"));
  header.SetAuthorisation(new TCollection_HAsciiString(""));
  header.SetDescriptionValue(1, new TCollection_HAsciiString("stepframe wireframe: one line per member centreline"));

  // Write next to the target and rename, so a failed write never leaves a
  // half-written file under the real name.
  std::filesystem::path temporary = file;
  temporary += ".tmp";
  const IFSelect_ReturnStatus status = writer.Write(temporary.string().c_str());
  if (status != IFSelect_RetDone) {
    std::error_code ignored;
    std::filesystem::remove(temporary, ignored);
    throw std::runtime_error("cannot write " + file.string() +
                             ": OCCT's STEP writer failed; check that the folder exists and is writable");
  }
  std::error_code rename_error;
  std::filesystem::rename(temporary, file, rename_error);
  if (rename_error)
    throw std::runtime_error("cannot write " + file.string() + ": renaming the temporary file failed (" +
                             rename_error.message() + ")");
  spdlog::info("wrote {} lines to {} in {}", lines.size(), file.string(), length_unit);
}

}  // namespace stepframe::geometry
