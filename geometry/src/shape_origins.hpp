#pragma once
// Attributes of edges and vertices given per sub-shape (by a caller, or by
// the labels of an XDE document), inherited down the shape tree.

#include "harvest.hpp"

#include <NCollection_DataMap.hxx>
#include <TopTools_ShapeMapHasher.hxx>
#include <TopoDS_Shape.hxx>

#include <cstddef>
#include <optional>
#include <unordered_map>
#include <utility>
#include <vector>

class TopoDS_TShape;

namespace stepframe::geometry::detail {

/// Own attributes of sub-shapes: found by IsSame (geometry and placement),
/// else by geometry alone.
class ShapeTable {
 public:
  void add(const TopoDS_Shape& shape, const SourceInfo& info);
  const SourceInfo* find(const TopoDS_Shape& shape) const;

 private:
  NCollection_DataMap<TopoDS_Shape, SourceInfo, TopTools_ShapeMapHasher> exact_;
  std::unordered_map<const TopoDS_TShape*, SourceInfo> by_geometry_;
};

class TableOrigins : public OriginLookup {
 public:
  /// Walks `root` (as it will be harvested, before any assembly placement):
  /// each edge gets the attributes of its own entry, completed field by field
  /// from its nearest containers' entries and `inherited`; layers gather from
  /// all of them. Edges without an entity are named "edge N".
  void add_root(const TopoDS_Shape& root, const SourceInfo& inherited, const ShapeTable& items);

  Origin edge(const TopoDS_Edge& edge) const override;
  std::optional<SourceInfo> vertex(const TopoDS_Shape& vertex) const override;

 private:
  void walk(const TopoDS_Shape& shape, const SourceInfo& inherited, const ShapeTable& items);

  ShapeTable edges_;
  ShapeTable vertices_;
  std::size_t edges_met_ = 0;
};

/// `inherited` completed by `own`: own name, entity, product, colour where
/// set; layers of both.
SourceInfo inherit(const SourceInfo& inherited, const SourceInfo& own);

}  // namespace stepframe::geometry::detail
