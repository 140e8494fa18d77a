#include "assembly_loops.hpp"

#include <StepBasic_ProductDefinition.hxx>
#include <StepRepr_NextAssemblyUsageOccurrence.hxx>
#include <StepRepr_ProductDefinitionShape.hxx>
#include <StepRepr_PropertyDefinition.hxx>
#include <StepRepr_Representation.hxx>
#include <StepRepr_ShapeRepresentationRelationship.hxx>
#include <StepShape_ContextDependentShapeRepresentation.hxx>
#include <StepShape_ShapeDefinitionRepresentation.hxx>

#include <algorithm>
#include <cstdint>
#include <unordered_map>
#include <utility>

namespace stepframe::geometry::detail {
namespace {

using Key = const Standard_Transient*;

bool owned_by(const std::vector<Key>& owners, Key pd) {
  return std::find(owners.begin(), owners.end(), pd) != owners.end();
}

}  // namespace

std::vector<int> assembly_loop(const Handle(StepData_StepModel) & model) {
  const Handle(Standard_Type) sdr_type = STANDARD_TYPE(StepShape_ShapeDefinitionRepresentation);
  const Handle(Standard_Type) cdsr_type = STANDARD_TYPE(StepShape_ContextDependentShapeRepresentation);
  const Handle(Standard_Type) nauo_type = STANDARD_TYPE(StepRepr_NextAssemblyUsageOccurrence);

  // The product definitions each representation is the shape of, the occurrences, and their shapes.
  std::unordered_map<Key, std::vector<Key>> shape_of;
  std::vector<const StepRepr_NextAssemblyUsageOccurrence*> occurrences;
  std::vector<const StepShape_ContextDependentShapeRepresentation*> placements;
  for (Standard_Integer i = 1; i <= model->NbEntities(); ++i) {
    const Handle(Standard_Transient)& entity = model->Value(i);
    if (entity.IsNull()) continue;
    const Handle(Standard_Type)& type = entity->DynamicType();
    if (type == sdr_type) {
      const auto* sdr = static_cast<const StepShape_ShapeDefinitionRepresentation*>(entity.get());
      const Handle(StepRepr_PropertyDefinition) property = sdr->Definition().PropertyDefinition();
      if (property.IsNull() || sdr->UsedRepresentation().IsNull()) continue;
      const Handle(StepBasic_ProductDefinition) pd = property->Definition().ProductDefinition();
      if (!pd.IsNull()) shape_of[sdr->UsedRepresentation().get()].push_back(pd.get());
    } else if (type == cdsr_type) {
      placements.push_back(static_cast<const StepShape_ContextDependentShapeRepresentation*>(entity.get()));
    } else if (type == nauo_type) {
      occurrences.push_back(static_cast<const StepRepr_NextAssemblyUsageOccurrence*>(entity.get()));
    }
  }
  const auto owners = [&](const Handle(StepRepr_Representation)& rep) -> const std::vector<Key>& {
    static const std::vector<Key> none;
    const auto it = rep.IsNull() ? shape_of.end() : shape_of.find(rep.get());
    return it == shape_of.end() ? none : it->second;
  };

  // Assembly -> (occurrence, part): the graph whose cycles are looked for; assemblies in file order.
  std::unordered_map<Key, std::vector<std::pair<Key, Key>>> parts;
  std::vector<Key> assemblies;
  const auto add = [&](Key assembly, Key occurrence, Key part) {
    auto& list = parts[assembly];
    if (list.empty()) assemblies.push_back(assembly);
    list.push_back({occurrence, part});
  };
  for (const auto* nauo : occurrences) {
    const Handle(StepBasic_ProductDefinition) relating = nauo->RelatingProductDefinition();
    const Handle(StepBasic_ProductDefinition) related = nauo->RelatedProductDefinition();
    if (!relating.IsNull() && !related.IsNull()) add(relating.get(), nauo, related.get());
  }
  for (const auto* cdsr : placements) {
    const Handle(StepRepr_ProductDefinitionShape) pds = cdsr->RepresentedProductRelation();
    const Handle(StepRepr_ShapeRepresentationRelationship) relation = cdsr->RepresentationRelation();
    if (pds.IsNull() || relation.IsNull()) continue;
    const Handle(StepRepr_NextAssemblyUsageOccurrence) nauo =
        Handle(StepRepr_NextAssemblyUsageOccurrence)::DownCast(pds->Definition().ProductDefinitionRelationship());
    if (nauo.IsNull() || nauo->RelatingProductDefinition().IsNull()) continue;
    const Key assembly = nauo->RelatingProductDefinition().get();
    const Key part = nauo->RelatedProductDefinition().get();
    // Which side of the relationship is the part's shape: rep_1 unless the relationship is written the other
    // way round (rep_1 the assembly's shape or rep_2 the part's), as OCCT 7.6 decides it
    // (STEPConstruct_Assembly::CheckSRRReversesNAUO).
    const std::vector<Key>& first = owners(relation->Rep1());
    const std::vector<Key>& second = owners(relation->Rep2());
    const bool as_written = owned_by(first, part) && owned_by(second, assembly);
    const bool reversed = !as_written && (owned_by(second, part) || owned_by(first, assembly));
    for (const Key pd : reversed ? second : first) add(assembly, nauo.get(), pd);
  }

  // Depth-first walk without recursion (0 unseen, 1 on the path, 2 done).
  std::unordered_map<Key, std::uint8_t> state;
  std::vector<std::pair<Key, std::size_t>> path;  // assembly, next part to follow
  const auto number = [&](Key entity) {
    return model->IdentLabel(Handle(Standard_Transient)(const_cast<Standard_Transient*>(entity)));
  };
  for (const Key root : assemblies) {
    if (state[root] != 0) continue;
    path.push_back({root, 0});
    state[root] = 1;
    while (!path.empty()) {
      auto& [assembly, next] = path.back();
      const auto found = parts.find(assembly);
      if (found == parts.end() || next == found->second.size()) {
        state[assembly] = 2;
        path.pop_back();
        continue;
      }
      const Key part = found->second[next++].second;
      if (state[part] == 1) {  // the loop: from `part` on the path, to here, back to `part`
        std::vector<int> loop;
        bool on = false;
        for (std::size_t k = 0; k < path.size(); ++k) {
          on = on || path[k].first == part;
          if (!on) continue;
          loop.push_back(number(path[k].first));
          const auto& step = parts.at(path[k].first)[path[k].second - 1];  // the occurrence followed from there
          loop.push_back(number(step.first));
        }
        loop.push_back(number(part));
        return loop;
      }
      if (state[part] == 0) {
        state[part] = 1;
        path.push_back({part, 0});
      }
    }
  }
  return {};
}

}  // namespace stepframe::geometry::detail
