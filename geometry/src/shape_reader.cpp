#include "stepframe/geometry/occt_sources.hpp"

#include "harvest.hpp"
#include "occt_messages.hpp"
#include "shape_origins.hpp"

#include <spdlog/fmt/fmt.h>
#include <spdlog/spdlog.h>

#include <cmath>

namespace stepframe::geometry {

namespace {

constexpr const char* shape_advice =
    "Pass a shape whose edges are the member centrelines (a compound of edges or wires).";

}  // namespace

StepModel read_shape(const TopoDS_Shape& shape, const ShapeAttributes& attributes) {
  const std::string& source = attributes.display_name;
  const std::lock_guard<std::mutex> one_at_a_time(detail::occt_exchange_lock());
  if (shape.IsNull()) throw StepReadError(fmt::format("{}: the shape is null. {}", source, shape_advice));
  if (!(attributes.metres_per_unit > 0.0) || !std::isfinite(attributes.metres_per_unit))
    throw StepReadError(fmt::format("{}: the length unit '{}' must be a positive length in metres, got {}", source,
                                    attributes.length_unit, attributes.metres_per_unit));
  detail::ShapeTable items;
  for (const auto& [sub_shape, info] : attributes.items) items.add(sub_shape, info);
  detail::TableOrigins origins;
  origins.add_root(shape, SourceInfo{}, items);

  StepModel model;
  model.file = source;
  model.length_unit = attributes.length_unit;
  model.metres_per_unit = attributes.metres_per_unit;
  detail::Harvest harvest{origins, attributes.metres_per_unit, model, {}, {}, 0, 0, 0};
  // Product and assembly path come with the attributes, not from a document.
  detail::harvest_shape(shape, {}, {}, harvest);
  detail::finish_harvest(harvest, source, shape_advice);
  spdlog::info("{}: {} edges, {} labelled points from an OCCT shape", source, model.edges.size(), model.points.size());
  return model;
}

}  // namespace stepframe::geometry
