#pragma once
// JSON shapes shared by results.json and `inspect --json`.

#include "json_writer.hpp"
#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/source_info.hpp"

#include <Eigen/Core>

#include <array>

namespace stepframe::json_shapes {

inline void vec(detail::JsonWriter& w, const Eigen::Vector3d& v) { w.numbers(std::array<double, 3>{v[0], v[1], v[2]}); }

inline void source(detail::JsonWriter& w, const geometry::SourceInfo& s) {
  w.begin_object();
  w.key("entity").value(s.entity);
  w.key("name").value(s.name);
  w.key("layers").strings(s.layers);
  w.key("product").value(s.product);
  w.key("colour").value(s.colour);
  w.key("assembly_path").value(s.assembly_path);
  w.end_object();
}

inline void diagnostic(detail::JsonWriter& w, const geometry::Diagnostic& d) {
  w.begin_object();
  w.key("severity").value(geometry::to_string(d.severity));
  w.key("code").value(d.code);
  w.key("message").value(d.message);
  w.key("entities").strings(d.entities);
  if (d.at) {
    w.key("at");
    vec(w, *d.at);
  }
  w.end_object();
}

}  // namespace stepframe::json_shapes
