#include "step_attributes.hpp"

#include "step_kind.hpp"

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
#include <StepShape_VertexLoop.hxx>
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
  if (auto item = as_kind<StepRepr_RepresentationItem>(entity); !item.IsNull())
    return text_of(item->Name());
  if (auto representation = as_kind<StepRepr_Representation>(entity); !representation.IsNull())
    return text_of(representation->Name());
  return {};
}

bool is_point(const Handle(Standard_Transient) & entity) {
  return entity->IsKind(STANDARD_TYPE(StepGeom_CartesianPoint)) || entity->IsKind(STANDARD_TYPE(StepShape_VertexPoint));
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
    : session_(session), model_(as_kind<StepData_StepModel>(session->Model())) {
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
    if (auto set = as_kind<StepShape_GeometricSet>(entity); !set.IsNull()) {
      sets.push_back(set);
      if (!set->Elements().IsNull())
        for (Standard_Integer k = 1; k <= set->NbElements(); ++k) adopt(set->ElementsValue(k).Value());
      continue;
    }
    if (auto edges = as_kind<StepShape_ConnectedEdgeSet>(entity); !edges.IsNull()) {
      if (!edges->CesEdges().IsNull())
        for (Standard_Integer k = edges->CesEdges()->Lower(); k <= edges->CesEdges()->Upper(); ++k)
          adopt(edges->CesEdges()->Value(k));
      continue;
    }
    if (auto wireframe = as_kind<StepShape_EdgeBasedWireframeModel>(entity); !wireframe.IsNull()) {
      if (!wireframe->EbwmBoundary().IsNull())
        for (Standard_Integer k = wireframe->EbwmBoundary()->Lower(); k <= wireframe->EbwmBoundary()->Upper(); ++k)
          adopt(wireframe->EbwmBoundary()->Value(k));
      continue;
    }
    if (auto representation = as_kind<StepRepr_Representation>(entity); !representation.IsNull()) {
      if (!representation->Items().IsNull())
        for (Standard_Integer k = 1; k <= representation->NbItems(); ++k) adopt(representation->ItemsValue(k));
      continue;
    }
    // A vertex loop (of a vertex shell, ISO 10303-42) holds a vertex point;
    // OCCT makes a vertex of its cartesian point, which then stands for it.
    if (auto loop = as_kind<StepShape_VertexLoop>(entity); !loop.IsNull()) {
      adopt(loop->LoopVertex());
      if (auto vertex = as_kind<StepShape_VertexPoint>(loop->LoopVertex()); !vertex.IsNull())
        if (!vertex->VertexGeometry().IsNull()) vertex_of_point_.try_emplace(vertex->VertexGeometry().get(), vertex);
      continue;
    }
    if (auto composite = as_kind<StepGeom_CompositeCurve>(entity); !composite.IsNull()) {
      if (!composite->Segments().IsNull())
        for (Standard_Integer k = 1; k <= composite->NbSegments(); ++k)
          if (!composite->SegmentsValue(k).IsNull()) adopt(composite->SegmentsValue(k)->ParentCurve());
      continue;
    }

    if (auto layer = as_kind<StepVisual_PresentationLayerAssignment>(entity); !layer.IsNull()) {
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

    if (!may_label_points_ && is_point(entity) && !own_name(entity).empty()) {
      may_label_points_ = true;
      continue;
    }

    if (auto styled = as_kind<StepVisual_StyledItem>(entity); !styled.IsNull()) {
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
  // Points of a layered geometric set are on its layers. A set holding the
  // point of a vertex loop's vertex (a vertex shell, as the reader rewrites
  // it) holds that vertex: it passes down its name as well.
  for (const Handle(StepShape_GeometricSet)& set : sets) {
    if (set->Elements().IsNull()) continue;
    const auto layers = layers_.find(set.get());
    for (Standard_Integer k = 1; k <= set->NbElements(); ++k) {
      const Handle(Standard_Transient) element = set->ElementsValue(k).Value();
      if (element.IsNull() || !element->IsKind(STANDARD_TYPE(StepGeom_CartesianPoint))) continue;
      if (layers != layers_.end()) add_layers(set_layers_of_point_[element.get()], layers->second);
      if (auto vertex = vertex_of_point_.find(element.get()); vertex != vertex_of_point_.end())
        parents_[vertex->second.get()].push_back(set);
    }
  }
  may_label_points_ = may_label_points_ || !set_layers_of_point_.empty() || !vertex_of_point_.empty() ||
                      std::any_of(layers_.begin(), layers_.end(), [](const auto& entry) {
                        return entry.first->IsKind(STANDARD_TYPE(StepGeom_CartesianPoint)) ||
                               entry.first->IsKind(STANDARD_TYPE(StepShape_VertexPoint));
                      });
}

std::string StepAttributes::entity_id(const Handle(Standard_Transient) & entity) const {
  if (entity.IsNull() || model_.IsNull()) return {};
  Standard_Integer label = model_->IdentLabel(entity);
  if (label <= 0) label = model_->Number(entity);
  return label > 0 ? "#" + std::to_string(label) : std::string();
}

const std::vector<Handle(Standard_Transient)>& StepAttributes::containers_of(
    const Handle(Standard_Transient) & entity) const {
  static const std::vector<Handle(Standard_Transient)> none;
  if (auto it = parents_.find(entity.get()); it != parents_.end()) return it->second;
  return none;
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
  if (point.IsNull() || !may_label_points_) return std::nullopt;
  // The cartesian point of a vertex shell's vertex stands for that vertex.
  Handle(Standard_Transient) subject = point;
  if (auto it = vertex_of_point_.find(point.get()); it != vertex_of_point_.end()) subject = it->second;
  // The point itself and, for a vertex, its cartesian point: their own names,
  // their own layers, and the layers of geometric sets holding them.
  Handle(Standard_Transient) own[2] = {subject, nullptr};
  if (auto vertex = as_kind<StepShape_VertexPoint>(subject); !vertex.IsNull()) own[1] = vertex->VertexGeometry();
  SourceInfo info;
  for (const Handle(Standard_Transient)& entity : own) {
    if (entity.IsNull()) continue;
    if (info.name.empty()) info.name = own_name(entity);
    if (auto it = layers_.find(entity.get()); it != layers_.end()) add_layers(info.layers, it->second);
    if (auto it = set_layers_of_point_.find(entity.get()); it != set_layers_of_point_.end())
      add_layers(info.layers, it->second);
  }
  // A vertex also takes the names and layers of the vertex loops and vertex
  // shells that hold it (their own, not those of the representation above).
  for (const Handle(Standard_Transient)& container : containers_of(subject)) {
    if (info.name.empty()) info.name = own_name(container);
    if (auto it = layers_.find(container.get()); it != layers_.end()) add_layers(info.layers, it->second);
  }
  if (info.name.empty() && info.layers.empty()) return std::nullopt;
  info.entity = entity_id(subject);
  return info;
}

}  // namespace stepframe::geometry::detail
