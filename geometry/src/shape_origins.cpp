#include "shape_origins.hpp"

#include <TopAbs_ShapeEnum.hxx>
#include <TopoDS_Edge.hxx>
#include <TopoDS_Iterator.hxx>
#include <TopoDS_TShape.hxx>

#include <spdlog/fmt/fmt.h>

#include <algorithm>

namespace stepframe::geometry::detail {

void ShapeTable::add(const TopoDS_Shape& shape, const SourceInfo& info) {
  if (shape.IsNull()) return;
  if (!exact_.IsBound(shape)) exact_.Bind(shape, info);
  by_geometry_.try_emplace(shape.TShape().get(), info);
}

const SourceInfo* ShapeTable::find(const TopoDS_Shape& shape) const {
  if (shape.IsNull()) return nullptr;
  if (const SourceInfo* hit = exact_.Seek(shape)) return hit;
  const auto it = by_geometry_.find(shape.TShape().get());
  return it == by_geometry_.end() ? nullptr : &it->second;
}

SourceInfo inherit(const SourceInfo& inherited, const SourceInfo& own) {
  SourceInfo out = inherited;
  if (!own.entity.empty()) out.entity = own.entity;
  if (!own.name.empty()) out.name = own.name;
  if (!own.product.empty()) out.product = own.product;
  if (!own.colour.empty()) out.colour = own.colour;
  for (const std::string& layer : own.layers)
    if (std::find(out.layers.begin(), out.layers.end(), layer) == out.layers.end()) out.layers.push_back(layer);
  return out;
}

void TableOrigins::add_root(const TopoDS_Shape& root, const SourceInfo& inherited, const ShapeTable& items) {
  walk(root, inherited, items);
}

void TableOrigins::walk(const TopoDS_Shape& shape, const SourceInfo& inherited, const ShapeTable& items) {
  const SourceInfo* own = items.find(shape);
  if (shape.ShapeType() == TopAbs_VERTEX) {
    if (own != nullptr && (!own->name.empty() || !own->layers.empty())) vertices_.add(shape, *own);
    return;
  }
  SourceInfo info = own != nullptr ? inherit(inherited, *own) : inherited;
  if (shape.ShapeType() == TopAbs_EDGE) {
    if (edges_.find(shape) != nullptr) return;  // met before, through another wire
    ++edges_met_;
    if (info.entity.empty()) info.entity = fmt::format("edge {}", edges_met_);
    edges_.add(shape, info);
  }
  for (TopoDS_Iterator it(shape); it.More(); it.Next()) walk(it.Value(), info, items);
}

Origin TableOrigins::edge(const TopoDS_Edge& edge) const {
  Origin origin;
  if (const SourceInfo* info = edges_.find(edge)) origin.info = *info;
  return origin;
}

std::optional<SourceInfo> TableOrigins::vertex(const TopoDS_Shape& vertex) const {
  if (const SourceInfo* info = vertices_.find(vertex)) return *info;
  return std::nullopt;
}

}  // namespace stepframe::geometry::detail
