#include "step_long_lists.hpp"

#include <IFSelect_WorkLibrary.hxx>
#include <Interface_InterfaceModel.hxx>
#include <Interface_Protocol.hxx>
#include <Standard_ErrorHandler.hxx>
#include <Standard_Failure.hxx>
#include <StepData_StepModel.hxx>
#include <StepRepr_HArray1OfRepresentationItem.hxx>
#include <StepRepr_Representation.hxx>
#include <StepRepr_RepresentationItem.hxx>
#include <StepShape_GeometricSet.hxx>
#include <StepShape_HArray1OfGeometricSetSelect.hxx>
#include <StepVisual_HArray1OfLayeredItem.hxx>
#include <StepVisual_PresentationLayerAssignment.hxx>
#include <XSControl_WorkSession.hxx>

#include <spdlog/spdlog.h>

#include <algorithm>
#include <optional>
#include <unordered_map>

namespace stepframe::geometry::detail {
namespace {

// The list's entity type and parameter: ISO 10303-43 representation (name, items, context_of_items),
// ISO 10303-42 geometric_set (name, elements), ISO 10303-46 presentation_layer_assignment (name,
// description, assigned_items); parameter numbers from the schemas, from memory, as OCCT reads them.
enum class ListKind { representation_items, geometric_set_elements, layer_assigned_items, other };

ListKind kind_of(const StepLongList& list) {
  const std::string_view type = list.type;
  constexpr std::string_view representation = "REPRESENTATION";
  if (list.parameter == 1 && type.size() >= representation.size() &&
      type.substr(type.size() - representation.size()) == representation)
    return ListKind::representation_items;
  if (list.parameter == 1 && (type == "GEOMETRIC_SET" || type == "GEOMETRIC_CURVE_SET"))
    return ListKind::geometric_set_elements;
  if (list.parameter == 2 && type == "PRESENTATION_LAYER_ASSIGNMENT") return ListKind::layer_assigned_items;
  return ListKind::other;
}

// The array of the entities `items`, each made an element by `element` (nothing when it cannot be one:
// OCCT's reader refuses such an item); null when an entity is missing or refused.
template <class Array, class Find, class Element>
Handle(Array) array_of(const std::vector<std::uint64_t>& items, const Find& find, const Element& element) {
  Handle(Array) array = new Array(1, static_cast<Standard_Integer>(items.size()));
  for (std::size_t k = 0; k < items.size(); ++k) {
    const Handle(Standard_Transient) entity = find(items[k]);
    if (entity.IsNull()) return nullptr;
    const auto value = element(entity);
    if (!value) return nullptr;
    array->SetValue(static_cast<Standard_Integer>(k) + 1, *value);
  }
  return array;
}

// A select value (a layer's item, a set's element) of `entity`, as OCCT's reader makes one.
template <class Select>
std::optional<Select> select_of(const Handle(Standard_Transient)& entity) {
  Select select;
  if (!select.Matches(entity)) return std::nullopt;
  select.SetValue(entity);
  return select;
}

// A representation item of `entity` (the type OCCT's representation readers ask for).
std::optional<Handle(StepRepr_RepresentationItem)> item_of(const Handle(Standard_Transient)& entity) {
  auto item = Handle(StepRepr_RepresentationItem)::DownCast(entity);
  if (item.IsNull()) return std::nullopt;
  return item;
}

}  // namespace

std::vector<StepLongList> restorable_long_lists(std::vector<StepLongList> lists) {
  std::erase_if(lists, [](const StepLongList& l) { return kind_of(l) == ListKind::other; });
  return lists;
}

std::string cut_long_lists(std::string_view step_text, const std::vector<StepLongList>& lists) {
  std::string out;
  out.reserve(step_text.size());
  std::size_t from = 0;
  for (const StepLongList& list : lists) {
    const std::string_view inside = step_text.substr(list.begin, list.end + 1 - list.begin);
    out.append(step_text.substr(from, list.begin - from));
    out.append("(#").append(std::to_string(list.items.front())).append(")");
    out.append(static_cast<std::size_t>(std::count(inside.begin(), inside.end(), '\n')), '\n');
    from = list.end + 1;
  }
  out.append(step_text.substr(from));
  return out;
}

IFSelect_ReturnStatus parse_unlinked(STEPCAFControl_Reader& reader, const char* name, std::istream& stream,
                                     Handle(StepData_StepModel)& parsed) {
  // As IFSelect_WorkSession::ReadStream, less its SetModel; then XSControl_Reader::ReadStream's
  // InitTransferReader(4).
  const Handle(XSControl_WorkSession) session = reader.ChangeReader().WS();
  if (session.IsNull() || session->WorkLibrary().IsNull() || session->Protocol().IsNull()) return IFSelect_RetVoid;
  Handle(Interface_InterfaceModel) model;
  IFSelect_ReturnStatus status = IFSelect_RetVoid;
  try {
    OCC_CATCH_SIGNALS
    const Standard_Integer read = session->WorkLibrary()->ReadStream(name, stream, model, session->Protocol());
    status = read == 0 ? IFSelect_RetDone : read < 0 ? IFSelect_RetError : IFSelect_RetFail;
  } catch (const Standard_Failure& failure) {
    spdlog::debug("OCCT's parser stopped on an exception: {}", failure.GetMessageString());
    status = IFSelect_RetFail;
  }
  session->InitTransferReader(4);
  if (status != IFSelect_RetDone) return status;
  parsed = Handle(StepData_StepModel)::DownCast(model);
  return parsed.IsNull() ? IFSelect_RetVoid : status;
}

bool restore_long_lists(STEPCAFControl_Reader& reader, const Handle(StepData_StepModel)& model, const char* name,
                        const std::vector<StepLongList>& lists) {
  const Handle(XSControl_WorkSession) session = reader.ChangeReader().WS();
  if (session.IsNull() || model.IsNull()) return false;
  std::unordered_map<std::uint64_t, Standard_Integer> number_of;  // entity id -> number in the model
  number_of.reserve(static_cast<std::size_t>(model->NbEntities()));
  for (Standard_Integer n = 1; n <= model->NbEntities(); ++n)
    number_of.emplace(static_cast<std::uint64_t>(model->IdentLabel(model->Value(n))), n);
  auto find = [&](std::uint64_t id) -> Handle(Standard_Transient) {
    const auto it = number_of.find(id);
    return it == number_of.end() ? Handle(Standard_Transient)() : model->Value(it->second);
  };
  for (const StepLongList& list : lists) {
    const Handle(Standard_Transient) owner = find(list.entity);
    bool done = false;
    switch (kind_of(list)) {
      case ListKind::representation_items:  // as RWStepRepr_RWRepresentation and its kin read `items`
        if (const auto rep = Handle(StepRepr_Representation)::DownCast(owner); !rep.IsNull()) {
          const auto items = array_of<StepRepr_HArray1OfRepresentationItem>(list.items, find, item_of);
          if ((done = !items.IsNull())) rep->SetItems(items);
        }
        break;
      case ListKind::geometric_set_elements:
        if (const auto set = Handle(StepShape_GeometricSet)::DownCast(owner); !set.IsNull()) {
          const auto elements = array_of<StepShape_HArray1OfGeometricSetSelect>(
              list.items, find, select_of<StepShape_GeometricSetSelect>);
          if ((done = !elements.IsNull())) set->SetElements(elements);
        }
        break;
      case ListKind::layer_assigned_items:
        if (const auto layer = Handle(StepVisual_PresentationLayerAssignment)::DownCast(owner); !layer.IsNull()) {
          const auto items =
              array_of<StepVisual_HArray1OfLayeredItem>(list.items, find, select_of<StepVisual_LayeredItem>);
          if ((done = !items.IsNull())) layer->SetAssignedItems(items);
        }
        break;
      case ListKind::other:
        break;
    }
    if (!done) {
      spdlog::debug("the list of #{} ({}, {} items) is not as OCCT reads it; OCCT parses the whole text", list.entity,
                    list.type, list.items.size());
      return false;
    }
  }
  // What ReadStream would have done with the whole model: the session takes it (and computes the graph of
  // references, with the whole lists), its transfer reader begins afresh.
  session->SetModel(model);
  session->SetLoadedFile(name);
  session->InitTransferReader(4);
  return true;
}

}  // namespace stepframe::geometry::detail
