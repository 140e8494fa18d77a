#include "step_attributes.hpp"

#include <Interface_EntityIterator.hxx>
#include <Interface_Graph.hxx>
#include <Quantity_Color.hxx>
#include <STEPConstruct_Styles.hxx>
#include <StepData_StepModel.hxx>
#include <StepGeom_CompositeCurve.hxx>
#include <StepGeom_CompositeCurveSegment.hxx>
#include <StepShape_HArray1OfConnectedEdgeSet.hxx>
#include <StepShape_HArray1OfEdge.hxx>
#include <StepRepr_Representation.hxx>
#include <StepRepr_RepresentationItem.hxx>
#include <StepShape_ConnectedEdgeSet.hxx>
#include <StepShape_EdgeBasedWireframeModel.hxx>
#include <StepShape_GeometricSet.hxx>
#include <StepGeom_CartesianPoint.hxx>
#include <StepGeom_Point.hxx>
#include <StepShape_HArray1OfGeometricSetSelect.hxx>
#include <StepShape_VertexPoint.hxx>
#include <StepVisual_Colour.hxx>
#include <StepVisual_HArray1OfLayeredItem.hxx>
#include <StepVisual_LayeredItem.hxx>
#include <StepVisual_PresentationLayerAssignment.hxx>
#include <StepVisual_StyledItem.hxx>
#include <StepVisual_StyledItemTarget.hxx>
#include <TCollection_HAsciiString.hxx>
#include <XSControl_WorkSession.hxx>

#include <spdlog/fmt/fmt.h>

#include <algorithm>
#include <cmath>
#include <deque>
#include <unordered_set>

namespace stepframe::geometry::detail {

namespace {

void add_layers(std::vector<std::string>& to, const std::vector<std::string>& from) {
  for (const std::string& layer : from)
    if (std::find(to.begin(), to.end(), layer) == to.end()) to.push_back(layer);
}

std::string text_of(const Handle(TCollection_HAsciiString) & text) {
  return text.IsNull() ? std::string() : std::string(text->ToCString());
}

std::string own_name(const Handle(Standard_Transient) & entity) {
  if (auto item = Handle(StepRepr_RepresentationItem)::DownCast(entity); !item.IsNull())
    return text_of(item->Name());
  if (auto representation = Handle(StepRepr_Representation)::DownCast(entity); !representation.IsNull())
    return text_of(representation->Name());
  return {};
}

std::string hex_colour(const Quantity_Color& colour) {
  // STEP colour_rgb values are read by OCCT as sRGB; ask for them back as sRGB.
  Standard_Real r = 0, g = 0, b = 0;
  colour.Values(r, g, b, Quantity_TOC_sRGB);
  auto byte = [](Standard_Real v) { return static_cast<int>(std::lround(std::clamp(v, 0.0, 1.0) * 255.0)); };
  return fmt::format("#{:02x}{:02x}{:02x}", byte(r), byte(g), byte(b));
}

}  // namespace

StepAttributes::StepAttributes(const Handle(XSControl_WorkSession) & session)
    : session_(session), model_(Handle(StepData_StepModel)::DownCast(session->Model())) {
  if (model_.IsNull()) return;
  const STEPConstruct_Styles styles(session_);
  std::vector<Handle(StepShape_GeometricSet)> sets;
  for (Standard_Integer i = 1; i <= model_->NbEntities(); ++i) {
    const Handle(Standard_Transient)& entity = model_->Value(i);
    // Who lists whom: one pass instead of a graph query per edge.
    auto adopt = [&](const Handle(Standard_Transient) & child) {
      if (child.IsNull()) return;
      auto& list = parents_[child.get()];
      if (std::find(list.begin(), list.end(), entity) == list.end()) list.push_back(entity);
    };
    if (auto set = Handle(StepShape_GeometricSet)::DownCast(entity); !set.IsNull()) {
      sets.push_back(set);
      if (!set->Elements().IsNull())
        for (Standard_Integer k = 1; k <= set->NbElements(); ++k) adopt(set->ElementsValue(k).Value());
      continue;
    }
    if (auto edges = Handle(StepShape_ConnectedEdgeSet)::DownCast(entity); !edges.IsNull()) {
      if (!edges->CesEdges().IsNull())
        for (Standard_Integer k = edges->CesEdges()->Lower(); k <= edges->CesEdges()->Upper(); ++k)
          adopt(edges->CesEdges()->Value(k));
      continue;
    }
    if (auto wireframe = Handle(StepShape_EdgeBasedWireframeModel)::DownCast(entity); !wireframe.IsNull()) {
      if (!wireframe->EbwmBoundary().IsNull())
        for (Standard_Integer k = wireframe->EbwmBoundary()->Lower(); k <= wireframe->EbwmBoundary()->Upper(); ++k)
          adopt(wireframe->EbwmBoundary()->Value(k));
      continue;
    }
    if (auto representation = Handle(StepRepr_Representation)::DownCast(entity); !representation.IsNull()) {
      if (!representation->Items().IsNull())
        for (Standard_Integer k = 1; k <= representation->NbItems(); ++k) adopt(representation->ItemsValue(k));
      continue;
    }
    if (auto composite = Handle(StepGeom_CompositeCurve)::DownCast(entity); !composite.IsNull()) {
      if (!composite->Segments().IsNull())
        for (Standard_Integer k = 1; k <= composite->NbSegments(); ++k)
          if (!composite->SegmentsValue(k).IsNull()) adopt(composite->SegmentsValue(k)->ParentCurve());
      continue;
    }

    if (auto layer = Handle(StepVisual_PresentationLayerAssignment)::DownCast(entity); !layer.IsNull()) {
      const std::string name = text_of(layer->Name());
      if (name.empty() || layer->AssignedItems().IsNull()) continue;
      for (Standard_Integer k = 1; k <= layer->NbAssignedItems(); ++k) {
        const Handle(Standard_Transient) item = layer->AssignedItemsValue(k).Value();
        if (item.IsNull()) continue;
        auto& names = layers_[item.get()];
        if (std::find(names.begin(), names.end(), name) == names.end()) names.push_back(name);
      }
      continue;
    }

    if (auto styled = Handle(StepVisual_StyledItem)::DownCast(entity); !styled.IsNull()) {
      const Handle(Standard_Transient) target = styled->ItemAP242().Value();
      if (target.IsNull()) continue;
      Handle(StepVisual_Colour) surface, boundary, curve, render;
      Standard_Real transparency = 0.0;
      Standard_Boolean is_component = Standard_False;
      if (!styles.GetColors(styled, surface, boundary, curve, render, transparency, is_component)) continue;
      // A curve is drawn in its curve colour; surface colours are a fallback
      // for files that style a whole representation.
      for (const Handle(StepVisual_Colour)& candidate : {curve, boundary, surface}) {
        Quantity_Color colour;
        if (!candidate.IsNull() && STEPConstruct_Styles::DecodeColor(candidate, colour)) {
          colours_.try_emplace(target.get(), hex_colour(colour));
          break;
        }
      }
    }
  }
  // Points of a layered geometric set are on its layers.
  for (const Handle(StepShape_GeometricSet)& set : sets) {
    const auto layers = layers_.find(set.get());
    if (layers == layers_.end() || set->Elements().IsNull()) continue;
    for (Standard_Integer k = 1; k <= set->NbElements(); ++k) {
      const Handle(Standard_Transient) element = set->ElementsValue(k).Value();
      if (!element.IsNull() && element->IsKind(STANDARD_TYPE(StepGeom_CartesianPoint)))
        add_layers(set_layers_of_point_[element.get()], layers->second);
    }
  }
}

std::string StepAttributes::entity_id(const Handle(Standard_Transient) & entity) const {
  if (entity.IsNull() || model_.IsNull()) return {};
  Standard_Integer label = model_->IdentLabel(entity);
  if (label <= 0) label = model_->Number(entity);
  return label > 0 ? fmt::format("#{}", label) : std::string();
}

std::vector<Handle(Standard_Transient)> StepAttributes::containers_of(const Handle(Standard_Transient) & entity) const {
  if (auto it = parents_.find(entity.get()); it != parents_.end()) return it->second;
  return {};
}

const SourceInfo& StepAttributes::inherited_from(const Handle(Standard_Transient) & container) const {
  if (auto it = inherited_.find(container.get()); it != inherited_.end()) return it->second;
  // Mark the container first: a cycle in a broken file then ends here.
  inherited_.emplace(container.get(), SourceInfo{});
  SourceInfo info;
  info.name = own_name(container);
  if (auto it = colours_.find(container.get()); it != colours_.end()) info.colour = it->second;
  if (auto it = layers_.find(container.get()); it != layers_.end()) info.layers = it->second;
  // Containers nest only a few levels deep (curve -> set -> representation):
  // nearer ones give name and colour first, every one its layers.
  for (const Handle(Standard_Transient)& parent : containers_of(container)) {
    const SourceInfo parent_info = inherited_from(parent);
    if (info.name.empty()) info.name = parent_info.name;
    if (info.colour.empty()) info.colour = parent_info.colour;
    add_layers(info.layers, parent_info.layers);
  }
  return inherited_[container.get()] = std::move(info);
}

SourceInfo StepAttributes::attributes_of(const Handle(Standard_Transient) & entity) const {
  SourceInfo info;
  if (entity.IsNull()) return info;
  info.entity = entity_id(entity);
  info.name = own_name(entity);
  if (auto it = colours_.find(entity.get()); it != colours_.end()) info.colour = it->second;
  if (auto it = layers_.find(entity.get()); it != layers_.end()) info.layers = it->second;
  for (const Handle(Standard_Transient)& parent : containers_of(entity)) {
    const SourceInfo& parent_info = inherited_from(parent);
    if (info.name.empty()) info.name = parent_info.name;
    if (info.colour.empty()) info.colour = parent_info.colour;
    add_layers(info.layers, parent_info.layers);
  }
  return info;
}

std::optional<SourceInfo> StepAttributes::point_attributes(const Handle(Standard_Transient) & point) const {
  if (point.IsNull()) return std::nullopt;
  // The point itself and, for a vertex, its cartesian point: their own names,
  // their own layers, and the layers of geometric sets holding them.
  Handle(Standard_Transient) own[2] = {point, nullptr};
  if (auto vertex = Handle(StepShape_VertexPoint)::DownCast(point); !vertex.IsNull()) own[1] = vertex->VertexGeometry();
  SourceInfo info;
  for (const Handle(Standard_Transient)& entity : own) {
    if (entity.IsNull()) continue;
    if (info.name.empty()) info.name = own_name(entity);
    if (auto it = layers_.find(entity.get()); it != layers_.end()) add_layers(info.layers, it->second);
    if (auto it = set_layers_of_point_.find(entity.get()); it != set_layers_of_point_.end())
      add_layers(info.layers, it->second);
  }
  if (info.name.empty() && info.layers.empty()) return std::nullopt;
  info.entity = entity_id(point);
  return info;
}

}  // namespace stepframe::geometry::detail
