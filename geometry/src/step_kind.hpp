#pragma once
// A cheap type test for STEP entities. Handle(T)::DownCast is a C++
// dynamic_cast, which compares type names as strings across OCCT's shared
// libraries and costs more than the rest of a walk over a large model; OCCT's
// own type descriptors answer the same question by comparing pointers.

#include <Standard_Handle.hxx>
#include <Standard_Transient.hxx>
#include <Standard_Type.hxx>

namespace stepframe::geometry::detail {

/// `entity` as a T when it is one (or derives from T), else null.
template <class T, class From>
Handle(T) as_kind(const Handle(From) & entity) {
  if (entity.IsNull() || !entity->IsKind(STANDARD_TYPE(T))) return Handle(T)();
  // OCCT's STEP entity classes derive from Standard_Transient alone, so a
  // static cast is exact once the type descriptor has said yes.
  return Handle(T)(static_cast<T*>(static_cast<Standard_Transient*>(entity.get())));
}

}  // namespace stepframe::geometry::detail
