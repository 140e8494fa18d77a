#pragma once
// JSON shapes shared by results.json and `inspect --json`.

#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/source_info.hpp"

#include <Eigen/Core>
#include <nlohmann/json.hpp>

namespace stepframe::json_shapes {

inline nlohmann::json vec(const Eigen::Vector3d& v) { return {v[0], v[1], v[2]}; }

inline nlohmann::json source(const geometry::SourceInfo& s) {
  return {{"entity", s.entity},   {"name", s.name},     {"layers", s.layers},
          {"product", s.product}, {"colour", s.colour}, {"assembly_path", s.assembly_path}};
}

inline nlohmann::json diagnostic(const geometry::Diagnostic& d) {
  nlohmann::json j{
      {"severity", geometry::to_string(d.severity)}, {"code", d.code}, {"message", d.message}, {"entities", d.entities}};
  if (d.at) j["at"] = vec(*d.at);
  return j;
}

}  // namespace stepframe::json_shapes
