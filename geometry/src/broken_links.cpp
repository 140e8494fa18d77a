#include "broken_links.hpp"

#include <Interface_Check.hxx>
#include <StepBasic_ProductDefinitionRelationship.hxx>
#include <StepRepr_ItemDefinedTransformation.hxx>
#include <StepRepr_MappedItem.hxx>
#include <StepRepr_PropertyDefinition.hxx>
#include <StepRepr_PropertyDefinitionRepresentation.hxx>
#include <StepRepr_RepresentationMap.hxx>
#include <StepRepr_RepresentationRelationship.hxx>
#include <StepShape_ContextDependentShapeRepresentation.hxx>
#include <Standard_Type.hxx>

namespace stepframe::geometry::detail {

namespace {

// The entities OCCT's STEP transfer follows from a product to its shapes.
bool in_structure(const Handle(Standard_Transient) & entity) {
  return entity->IsKind(STANDARD_TYPE(StepRepr_RepresentationRelationship)) ||
         entity->IsKind(STANDARD_TYPE(StepRepr_ItemDefinedTransformation)) ||
         entity->IsKind(STANDARD_TYPE(StepRepr_PropertyDefinitionRepresentation)) ||
         entity->IsKind(STANDARD_TYPE(StepShape_ContextDependentShapeRepresentation)) ||
         entity->IsKind(STANDARD_TYPE(StepBasic_ProductDefinitionRelationship)) ||
         entity->IsKind(STANDARD_TYPE(StepRepr_PropertyDefinition)) ||
         entity->IsKind(STANDARD_TYPE(StepRepr_MappedItem)) ||
         entity->IsKind(STANDARD_TYPE(StepRepr_RepresentationMap));
}

}  // namespace

std::vector<BrokenLink> broken_structure_links(const Handle(StepData_StepModel) & model) {
  std::vector<BrokenLink> broken;
  for (Standard_Integer i = 1; i <= model->NbEntities(); ++i) {
    // IsErrorEntity is a lookup in the parse's report map: cheap for the many
    // entities that read well.
    if (!model->IsErrorEntity(i)) continue;
    const Handle(Standard_Transient)& entity = model->Value(i);
    if (entity.IsNull() || !in_structure(entity)) continue;
    const Handle(Interface_Check) check = model->Check(i, Standard_True);  // the parse records them as syntactic
    if (check.IsNull() || !check->HasFailed()) continue;
    std::string failures;
    for (Standard_Integer k = 1; k <= check->NbFails(); ++k)
      failures += (failures.empty() ? "" : "; ") + std::string(check->CFail(k, Standard_True));
    broken.push_back({model->IdentLabel(entity), entity->DynamicType()->Name(), std::move(failures)});
  }
  return broken;
}

}  // namespace stepframe::geometry::detail
