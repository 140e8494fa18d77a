#include "declared_length_unit.hpp"

#include "step_kind.hpp"

#include "stepframe/geometry/length_unit.hpp"

#include <STEPConstruct_UnitContext.hxx>
#include <StepBasic_ConversionBasedUnit.hxx>
#include <StepBasic_HArray1OfNamedUnit.hxx>
#include <StepBasic_LengthUnit.hxx>
#include <StepBasic_MeasureWithUnit.hxx>
#include <StepBasic_NamedUnit.hxx>
#include <StepBasic_SiUnit.hxx>
#include <StepBasic_Unit.hxx>
#include <StepData_StepModel.hxx>
#include <StepGeom_GeomRepContextAndGlobUnitAssCtxAndGlobUncertaintyAssCtx.hxx>
#include <StepGeom_GeometricRepresentationContextAndGlobalUnitAssignedContext.hxx>
#include <StepRepr_GlobalUnitAssignedContext.hxx>
#include <TCollection_HAsciiString.hxx>

#include <spdlog/fmt/fmt.h>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <optional>

namespace stepframe::geometry::detail {

namespace {

// The unit assignment of a representation context, whichever complex-entity
// form OCCT read it into.
Handle(StepRepr_GlobalUnitAssignedContext) unit_context_of(const Handle(Standard_Transient) & entity) {
  if (auto plain = as_kind<StepRepr_GlobalUnitAssignedContext>(entity); !plain.IsNull())
    return plain;
  if (auto with_uncertainty =
          as_kind<StepGeom_GeomRepContextAndGlobUnitAssCtxAndGlobUncertaintyAssCtx>(entity);
      !with_uncertainty.IsNull())
    return with_uncertainty->GlobalUnitAssignedContext();
  if (auto geometric = as_kind<StepGeom_GeometricRepresentationContextAndGlobalUnitAssignedContext>(entity);
      !geometric.IsNull())
    return geometric->GlobalUnitAssignedContext();
  return nullptr;
}

bool is_length_unit(const Handle(StepBasic_NamedUnit) & unit) {
  // SI_UNIT(.., .METRE.) is a length unit whatever complex form it came in;
  // a conversion based unit is a length unit when its factor is a length.
  if (auto si = as_kind<StepBasic_SiUnit>(unit); !si.IsNull())
    return si->Name() == StepBasic_sunMetre;
  if (auto converted = as_kind<StepBasic_ConversionBasedUnit>(unit); !converted.IsNull()) {
    const Handle(StepBasic_MeasureWithUnit)& factor = converted->ConversionFactor();
    if (factor.IsNull()) return false;
    const Handle(StepBasic_NamedUnit) base = factor->UnitComponent().NamedUnit();
    return !base.IsNull() && base != unit && is_length_unit(base);
  }
  return unit->IsKind(STANDARD_TYPE(StepBasic_LengthUnit));
}

// Size of a length unit in metres; nullopt when it cannot be worked out.
std::optional<DeclaredLengthUnit> describe(const Handle(StepBasic_NamedUnit) & unit, int depth = 0) {
  if (unit.IsNull() || depth > 4) return std::nullopt;
  if (auto si = as_kind<StepBasic_SiUnit>(unit); !si.IsNull()) {
    if (si->Name() != StepBasic_sunMetre) return std::nullopt;
    // SI prefixes, ISO 80000-1: milli = 1e-3 etc.
    const double prefix = si->HasPrefix() ? STEPConstruct_UnitContext::ConvertSiPrefix(si->Prefix()) : 1.0;
    DeclaredLengthUnit out;
    out.metres_per_unit = prefix;
    // Name the unit from its size: the table holds the SI lengths stepframe names.
    for (const char* candidate : {"mm", "cm", "m", "km", "um"}) {
      if (std::abs(*metres_per_unit(candidate) / prefix - 1.0) < 1e-12) out.name = candidate;
    }
    if (out.name.empty()) out.name = fmt::format("{:g} m", prefix);
    return out;
  }
  if (auto converted = as_kind<StepBasic_ConversionBasedUnit>(unit); !converted.IsNull()) {
    const Handle(StepBasic_MeasureWithUnit)& factor = converted->ConversionFactor();
    if (factor.IsNull()) return std::nullopt;
    const auto base = describe(factor->UnitComponent().NamedUnit(), depth + 1);
    if (!base) return std::nullopt;
    DeclaredLengthUnit out;
    // measure_with_unit: one converted unit = value_component x unit_component.
    out.metres_per_unit = factor->ValueComponent() * base->metres_per_unit;
    const std::string spelt = converted->Name().IsNull() ? std::string() : converted->Name()->ToCString();
    if (auto known = short_length_unit_name(spelt)) {
      out.name = *known;
    } else {
      out.name = spelt;
      std::transform(out.name.begin(), out.name.end(), out.name.begin(),
                     [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
    }
    return out;
  }
  return std::nullopt;
}

}  // namespace

std::vector<DeclaredLengthUnit> declared_length_units(const Handle(StepData_StepModel) & model) {
  std::vector<DeclaredLengthUnit> units;
  if (model.IsNull()) return units;
  for (Standard_Integer i = 1; i <= model->NbEntities(); ++i) {
    const Handle(StepRepr_GlobalUnitAssignedContext) context = unit_context_of(model->Value(i));
    if (context.IsNull() || context->Units().IsNull()) continue;
    for (Standard_Integer k = 1; k <= context->NbUnits(); ++k) {
      const Handle(StepBasic_NamedUnit) unit = context->UnitsValue(k);
      if (unit.IsNull() || !is_length_unit(unit)) continue;
      const auto described = describe(unit);
      if (!described) continue;
      const bool seen = std::any_of(units.begin(), units.end(), [&](const DeclaredLengthUnit& u) {
        return u.name == described->name && u.metres_per_unit == described->metres_per_unit;
      });
      if (!seen) units.push_back(*described);
    }
  }
  return units;
}

}  // namespace stepframe::geometry::detail
