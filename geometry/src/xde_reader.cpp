#include "stepframe/geometry/occt_sources.hpp"

#include "stepframe/geometry/length_unit.hpp"

#include "harvest.hpp"
#include "occt_messages.hpp"
#include "shape_origins.hpp"

#include <Quantity_Color.hxx>
#include <TColStd_HSequenceOfExtendedString.hxx>
#include <TCollection_AsciiString.hxx>
#include <TDF_Label.hxx>
#include <TDF_LabelSequence.hxx>
#include <TDF_Tool.hxx>
#include <XCAFDoc_ColorTool.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_LayerTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>

#include <spdlog/fmt/fmt.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>

namespace stepframe::geometry {

namespace {

constexpr const char* document_advice =
    "Put the member centrelines into the document as edges or wires (a wireframe part).";

std::string hex_colour(const Quantity_Color& colour) {
  Standard_Real r = 0, g = 0, b = 0;
  colour.Values(r, g, b, Quantity_TOC_sRGB);
  auto byte = [](Standard_Real v) { return static_cast<int>(std::lround(std::clamp(v, 0.0, 1.0) * 255.0)); };
  return fmt::format("#{:02x}{:02x}{:02x}", byte(r), byte(g), byte(b));
}

// Layers and curve colour a label carries (its name is used by the caller).
SourceInfo label_attributes(const TDF_Label& label, const Handle(XCAFDoc_LayerTool) & layers,
                            const Handle(XCAFDoc_ColorTool) & colours) {
  SourceInfo info;
  Handle(TColStd_HSequenceOfExtendedString) names;
  if (!layers.IsNull() && layers->GetLayers(label, names) && !names.IsNull()) {
    for (Standard_Integer i = 1; i <= names->Length(); ++i) {
      std::string layer = TCollection_AsciiString(names->Value(i)).ToCString();
      if (!layer.empty() && std::find(info.layers.begin(), info.layers.end(), layer) == info.layers.end())
        info.layers.push_back(std::move(layer));
    }
  }
  Quantity_Color colour;
  if (!colours.IsNull()) {
    for (const XCAFDoc_ColorType type : {XCAFDoc_ColorCurv, XCAFDoc_ColorGen, XCAFDoc_ColorSurf}) {
      if (colours->GetColor(label, type, colour)) {
        info.colour = hex_colour(colour);
        break;
      }
    }
  }
  return info;
}

std::string entry_of(const TDF_Label& label) {
  TCollection_AsciiString entry;
  TDF_Tool::Entry(label, entry);
  return entry.ToCString();
}

}  // namespace

StepModel read_xde_document(const Handle(TDocStd_Document) & document, const std::string& display_name) {
  const std::string source = display_name.empty() ? std::string("<XDE document>") : display_name;
  const std::lock_guard<std::mutex> one_at_a_time(detail::occt_exchange_lock());
  if (document.IsNull()) throw StepReadError(fmt::format("{}: the document is null. {}", source, document_advice));
  if (!XCAFDoc_DocumentTool::IsXCAFDocument(document))
    throw StepReadError(fmt::format("{}: is not an XDE (XCAF) document. {}", source, document_advice));
  const TDF_Label main = document->Main();
  const Handle(XCAFDoc_ShapeTool) shapes = XCAFDoc_DocumentTool::ShapeTool(main);
  const Handle(XCAFDoc_LayerTool) layers = XCAFDoc_DocumentTool::LayerTool(main);
  const Handle(XCAFDoc_ColorTool) colours = XCAFDoc_DocumentTool::ColorTool(main);

  StepModel model;
  model.file = source;
  double metres_per_model_unit = 1e-3;
  if (Standard_Real unit = 0.0; XCAFDoc_DocumentTool::GetLengthUnit(document, unit) && unit > 0.0) {
    metres_per_model_unit = unit;
  } else {
    model.diagnostics.push_back({Severity::warning, "no-length-unit",
                                 "the document declares no length unit; its coordinates were read as millimetres",
                                 {}, std::nullopt});
  }
  model.metres_per_unit = metres_per_model_unit;
  model.length_unit = "m";
  for (const char* unit : {"mm", "cm", "m", "inch", "ft"}) {
    if (std::abs(*metres_per_unit(unit) / metres_per_model_unit - 1.0) < 1e-9) model.length_unit = unit;
  }
  if (model.length_unit == "m" && std::abs(metres_per_model_unit - 1.0) > 1e-9)
    model.length_unit = fmt::format("{:g} m", metres_per_model_unit);

  // Every part: the attributes of its own label (layers, colour) and of its
  // sub-shape labels (name, layers, colour, entry), walked down its shape.
  detail::TableOrigins origins;
  TDF_LabelSequence parts;
  shapes->GetShapes(parts);
  for (Standard_Integer i = 1; i <= parts.Length(); ++i) {
    const TDF_Label& part = parts.Value(i);
    if (XCAFDoc_ShapeTool::IsAssembly(part)) continue;
    detail::ShapeTable items;
    TDF_LabelSequence sub_shapes;
    XCAFDoc_ShapeTool::GetSubShapes(part, sub_shapes);
    for (Standard_Integer k = 1; k <= sub_shapes.Length(); ++k) {
      const TDF_Label& label = sub_shapes.Value(k);
      SourceInfo info = label_attributes(label, layers, colours);
      info.name = detail::label_name(label);
      info.entity = entry_of(label);
      items.add(XCAFDoc_ShapeTool::GetShape(label), info);
    }
    const SourceInfo inherited = label_attributes(part, layers, colours);
    origins.add_root(XCAFDoc_ShapeTool::GetShape(part), inherited, items);
  }

  detail::Harvest harvest{origins, metres_per_model_unit, model, {}, {}, 0, 0, 0};
  detail::harvest_document(document, harvest);
  detail::finish_harvest(harvest, source, document_advice);
  spdlog::info("{}: {} edges, {} labelled points from an XDE document", source, model.edges.size(),
               model.points.size());
  return model;
}

}  // namespace stepframe::geometry
