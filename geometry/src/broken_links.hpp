#pragma once
// References OCCT's parse could not bind. When an entity refers to another of a
// type the schema does not allow there (a misspelt or unknown entity type, say),
// OCCT 7.6 records a failed check on the referring entity and leaves the
// reference null; its transfer then dereferences the null for the entities that
// tie an assembly together (a representation relationship's rep_1 or rep_2, for
// one) and the process crashes. These are found between the parse and the
// transfer and the file is refused.

#include <StepData_StepModel.hxx>

#include <string>
#include <vector>

namespace stepframe::geometry::detail {

/// One entity of the assembly structure with a reference OCCT left unbound.
struct BrokenLink {
  int entity = 0;        ///< the referring entity's number (#N)
  std::string type;      ///< its OCCT class, e.g. StepRepr_RepresentationRelationship
  std::string failures;  ///< OCCT's check messages, e.g. "Parameter n0.4 (rep_2) : Entity has illegal type"
};

/// The entities of the product and shape structure (representation
/// relationships and their transformations, shape definition representations,
/// context-dependent shape representations, product definition relationships,
/// property definitions, mapped items and representation maps) whose parse
/// failed; empty when the transfer can follow every link.
std::vector<BrokenLink> broken_structure_links(const Handle(StepData_StepModel) & model);

}  // namespace stepframe::geometry::detail
