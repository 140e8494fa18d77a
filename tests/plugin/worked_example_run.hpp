#pragma once
// What the end-to-end worked-example tests share: one member written as a STEP
// file, and the check entries and details of the results.json it gives.

#include "stepframe/geometry/step_writer.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <filesystem>
#include <string>

namespace stepframe::test {

/// One straight edge along X from the origin, `length` metres long, named `name`, written in millimetres.
inline void write_member(const std::filesystem::path& file, double length, const std::string& name) {
  geometry::LineToWrite line{{0, 0, 0}, {length, 0, 0}, {}};
  line.attributes.name = name;
  line.attributes.layers = {"MEMBER"};
  geometry::write_step_wireframe(file, {line}, "mm");
}

/// The check named `check` of results.json (one member, so one entry per check).
inline const nlohmann::json& check_entry(const nlohmann::json& doc, const std::string& check) {
  for (const auto& c : doc["checks"])
    if (c["check"] == check) return c;
  FAIL("results.json has no check " << check);
  static const nlohmann::json none;
  return none;
}

/// The detail `name` of a check entry.
inline double detail(const nlohmann::json& check, const std::string& name) {
  INFO(check.dump());
  REQUIRE(check["details"].contains(name));
  return check["details"][name].get<double>();
}

}  // namespace stepframe::test
