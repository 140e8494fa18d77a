#pragma once
// Assemblies that contain themselves. OCCT 7.6 translates a
// NEXT_ASSEMBLY_USAGE_OCCURRENCE through its shape: from the
// CONTEXT_DEPENDENT_SHAPE_REPRESENTATION's representation relationship to the
// part's representation, and from that representation to the product
// definition it is the shape of, which it then translates by recursion (and
// records as done only at the end). When that product definition is the
// assembly itself or one above it, the recursion never ends and overflows
// the stack (a fuzz finding: a PRODUCT_DEFINITION_SHAPE that named the
// assembly instead of its part). The file's references form no cycle there;
// the loop is in the product structure, so it is looked for on the parsed
// model, before the transfer.

#include <StepData_StepModel.hxx>

#include <vector>

namespace stepframe::geometry::detail {

/// A loop in the product structure, as entity numbers: a product definition,
/// the occurrence that holds its part, that part's product definition, ...,
/// back to the first (repeated at the end). Empty when the structure is a
/// tree, i.e. nothing contains itself. An occurrence's part is its related
/// product definition and, as OCCT finds it, the product definition whose
/// shape its representation relationship names for the part.
std::vector<int> assembly_loop(const Handle(StepData_StepModel) & model);

}  // namespace stepframe::geometry::detail
