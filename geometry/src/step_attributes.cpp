#include "step_attributes.hpp"

#include <Interface_EntityIterator.hxx>
#include <Interface_Graph.hxx>
#include <Quantity_Color.hxx>
#include <STEPConstruct_Styles.hxx>
#include <StepData_StepModel.hxx>
#include <StepRepr_Representation.hxx>
#include <StepRepr_RepresentationItem.hxx>
#include <StepShape_ConnectedEdgeSet.hxx>
#include <StepShape_EdgeBasedWireframeModel.hxx>
#include <StepShape_GeometricSet.hxx>
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

// Entities that group curves or edges: climbing through these finds the
// attributes a CAD program attached to a whole set rather than to each curve.
bool is_container(const Handle(Standard_Transient) & entity) {
  return entity->IsKind(STANDARD_TYPE(StepShape_GeometricSet)) ||
         entity->IsKind(STANDARD_TYPE(StepShape_ConnectedEdgeSet)) ||
         entity->IsKind(STANDARD_TYPE(StepShape_EdgeBasedWireframeModel)) ||
         entity->IsKind(STANDARD_TYPE(StepRepr_Representation));
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
  for (Standard_Integer i = 1; i <= model_->NbEntities(); ++i) {
    const Handle(Standard_Transient)& entity = model_->Value(i);

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
}

std::string StepAttributes::entity_id(const Handle(Standard_Transient) & entity) const {
  if (entity.IsNull() || model_.IsNull()) return {};
  Standard_Integer label = model_->IdentLabel(entity);
  if (label <= 0) label = model_->Number(entity);
  return label > 0 ? fmt::format("#{}", label) : std::string();
}

std::vector<Handle(Standard_Transient)> StepAttributes::lineage(const Handle(Standard_Transient) & entity) const {
  std::vector<Handle(Standard_Transient)> chain{entity};
  const Interface_Graph& graph = session_->Graph();
  std::unordered_set<const Standard_Transient*> seen{entity.get()};
  // Breadth first, so nearer containers come before farther ones. Containers
  // nest only a few levels deep (curve -> set -> representation).
  constexpr std::size_t max_entities = 64;
  for (std::size_t next = 0; next < chain.size() && chain.size() < max_entities; ++next) {
    for (Interface_EntityIterator it = graph.Sharings(chain[next]); it.More(); it.Next()) {
      const Handle(Standard_Transient)& parent = it.Value();
      if (parent.IsNull() || !is_container(parent) || !seen.insert(parent.get()).second) continue;
      chain.push_back(parent);
    }
  }
  return chain;
}

SourceInfo StepAttributes::attributes_of(const Handle(Standard_Transient) & entity) const {
  SourceInfo info;
  if (entity.IsNull()) return info;
  info.entity = entity_id(entity);
  for (const Handle(Standard_Transient)& member : lineage(entity)) {
    if (info.name.empty()) info.name = own_name(member);
    if (info.colour.empty()) {
      if (auto it = colours_.find(member.get()); it != colours_.end()) info.colour = it->second;
    }
    if (auto it = layers_.find(member.get()); it != layers_.end()) {
      for (const std::string& layer : it->second) {
        if (std::find(info.layers.begin(), info.layers.end(), layer) == info.layers.end())
          info.layers.push_back(layer);
      }
    }
  }
  return info;
}

}  // namespace stepframe::geometry::detail
