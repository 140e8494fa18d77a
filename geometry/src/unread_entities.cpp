#include "unread_entities.hpp"

#include <Interface_Check.hxx>
#include <Standard_Type.hxx>

#include <string_view>

namespace stepframe::geometry::detail {

std::vector<UnreadEntity> unread_entities(const Handle(StepData_StepModel) & model) {
  std::vector<UnreadEntity> unread;
  for (Standard_Integer i = 1; i <= model->NbEntities(); ++i) {
    // IsErrorEntity is a lookup in the parse's report map: cheap for the many
    // entities that read well.
    if (!model->IsErrorEntity(i)) continue;
    const Handle(Standard_Transient)& entity = model->Value(i);
    if (entity.IsNull()) continue;
    const Handle(Interface_Check) check = model->Check(i, Standard_True);  // the parse records them as syntactic
    if (check.IsNull() || !check->HasFailed()) continue;
    std::string failures;
    for (Standard_Integer k = 1; k <= check->NbFails(); ++k)
      failures += (failures.empty() ? "" : "; ") + std::string(check->CFail(k, Standard_True));
    const std::string_view type = entity->DynamicType()->Name();
    unread.push_back({model->IdentLabel(entity), std::string(type), std::move(failures), type.starts_with("StepVisual_")});
  }
  return unread;
}

}  // namespace stepframe::geometry::detail
