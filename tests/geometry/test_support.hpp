#pragma once
// Helpers shared by the geometry tests: a scratch folder, and a plain-text
// look at the entities of an ISO 10303-21 file so a test can check what a
// "#n" id points at without going through OCCT.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"

#include <Eigen/Core>
#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <map>
#include <random>
#include <regex>
#include <sstream>
#include <stdexcept>
#include <string>
#include <system_error>
#include <vector>

namespace stepframe::geometry::test {

/// A straight edge in metres carrying only an entity id.
inline WireEdge edge(Eigen::Vector3d a, Eigen::Vector3d b, std::string entity) {
  WireEdge e{a, b, {}, {}};
  e.source.entity = std::move(entity);
  return e;
}

/// An in-memory model in metres holding `edges`.
inline StepModel model_of(std::vector<WireEdge> edges) {
  StepModel model;
  model.file = "in-memory.stp";
  model.length_unit = "m";
  model.metres_per_unit = 1.0;
  model.edges = std::move(edges);
  return model;
}

/// The wireframe's findings with `code`, in order.
inline std::vector<const Diagnostic*> with_code(const Wireframe& frame, const std::string& code) {
  std::vector<const Diagnostic*> found;
  for (const auto& d : frame.diagnostics)
    if (d.code == code) found.push_back(&d);
  return found;
}

/// The member made from STEP entity `entity`; throws when there is none.
inline const WireMember& member(const Wireframe& frame, const std::string& entity) {
  const auto it = std::find_if(frame.members.begin(), frame.members.end(),
                               [&](const WireMember& m) { return m.source.entity == entity; });
  if (it == frame.members.end()) throw std::runtime_error("no member made from " + entity);
  return *it;
}

/// Fails the running Catch2 test unless the two models are the same, bit for bit: edges in order with
/// their attributes and curve samples, labelled points, findings, units.
inline void require_same_model(const StepModel& a, const StepModel& b) {
  REQUIRE(a.file == b.file);
  REQUIRE(a.length_unit == b.length_unit);
  REQUIRE(a.metres_per_unit == b.metres_per_unit);
  const auto same_source = [](const SourceInfo& x, const SourceInfo& y) {
    return x.entity == y.entity && x.name == y.name && x.layers == y.layers && x.product == y.product &&
           x.colour == y.colour && x.assembly_path == y.assembly_path;
  };
  REQUIRE(a.edges.size() == b.edges.size());
  for (std::size_t k = 0; k < a.edges.size(); ++k) {
    CAPTURE(k, a.edges[k].source.entity, b.edges[k].source.entity);
    REQUIRE(a.edges[k].start == b.edges[k].start);
    REQUIRE(a.edges[k].end == b.edges[k].end);
    REQUIRE(same_source(a.edges[k].source, b.edges[k].source));
    REQUIRE(a.edges[k].curve.size() == b.edges[k].curve.size());
    for (std::size_t i = 0; i < a.edges[k].curve.size(); ++i) {
      REQUIRE(a.edges[k].curve[i].point == b.edges[k].curve[i].point);
      REQUIRE(a.edges[k].curve[i].turn == b.edges[k].curve[i].turn);
    }
  }
  REQUIRE(a.points.size() == b.points.size());
  for (std::size_t k = 0; k < a.points.size(); ++k) {
    CAPTURE(k);
    REQUIRE(a.points[k].at == b.points[k].at);
    REQUIRE(same_source(a.points[k].source, b.points[k].source));
  }
  REQUIRE(a.diagnostics.size() == b.diagnostics.size());
  for (std::size_t k = 0; k < a.diagnostics.size(); ++k) {
    CAPTURE(k, a.diagnostics[k].message);
    REQUIRE(a.diagnostics[k].severity == b.diagnostics[k].severity);
    REQUIRE(a.diagnostics[k].code == b.diagnostics[k].code);
    REQUIRE(a.diagnostics[k].message == b.diagnostics[k].message);
    REQUIRE(a.diagnostics[k].entities == b.diagnostics[k].entities);
    REQUIRE(a.diagnostics[k].at.has_value() == b.diagnostics[k].at.has_value());
    if (a.diagnostics[k].at) REQUIRE(*a.diagnostics[k].at == *b.diagnostics[k].at);
  }
}

/// A fresh folder under the system temporary folder, removed afterwards.
class ScratchFolder {
 public:
  ScratchFolder() {
    std::random_device entropy;
    path_ = std::filesystem::temp_directory_path() /
            ("stepframe-geometry-test-" + std::to_string(entropy()) + std::to_string(entropy()));
    std::filesystem::create_directories(path_);
  }
  ScratchFolder(const ScratchFolder&) = delete;
  ScratchFolder& operator=(const ScratchFolder&) = delete;
  ~ScratchFolder() {
    std::error_code ignored;
    std::filesystem::remove_all(path_, ignored);
  }
  const std::filesystem::path& path() const { return path_; }

 private:
  std::filesystem::path path_;
};

inline std::string read_text(const std::filesystem::path& file) {
  std::ifstream in(file, std::ios::binary);
  if (!in) throw std::runtime_error("cannot open " + file.string());
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

/// Entity instances of a STEP file's DATA section: "#n" -> the text after
/// "=" with line breaks removed (e.g. "TRIMMED_CURVE('',#39,...)").
/// Enough for files without ';' inside strings, which is all the tests need.
inline std::map<std::string, std::string> step_entities(const std::filesystem::path& file) {
  std::string text = read_text(file);
  const auto data = text.find("DATA;");
  const auto end = text.find("ENDSEC;", data);
  if (data == std::string::npos || end == std::string::npos) throw std::runtime_error("no DATA section");
  text = text.substr(data + 5, end - data - 5);
  std::map<std::string, std::string> entities;
  std::istringstream statements(text);
  std::string statement;
  const std::regex instance(R"(^\s*(#\d+)\s*=\s*([\s\S]*)$)");
  while (std::getline(statements, statement, ';')) {
    std::string flat;
    for (const char c : statement) {
      if (c != '\n' && c != '\r') flat.push_back(c);
    }
    std::smatch match;
    if (std::regex_match(flat, match, instance)) entities[match[1]] = match[2];
  }
  return entities;
}

/// Coordinates of a CARTESIAN_POINT entity, in the file's unit.
inline Eigen::Vector3d cartesian_point(const std::map<std::string, std::string>& entities, const std::string& id) {
  const std::string& text = entities.at(id);
  const std::regex point(R"(CARTESIAN_POINT\('[^']*',\(\s*([^,]+),\s*([^,]+),\s*([^)]+)\)\))");
  std::smatch match;
  if (!std::regex_search(text, match, point)) throw std::runtime_error(id + " is not a 3D CARTESIAN_POINT: " + text);
  return {std::stod(match[1]), std::stod(match[2]), std::stod(match[3])};
}

/// The two trimming points of a TRIMMED_CURVE entity trimmed by points.
inline std::pair<Eigen::Vector3d, Eigen::Vector3d> trimming_points(const std::map<std::string, std::string>& entities,
                                                                   const std::string& id) {
  const std::string& text = entities.at(id);
  const std::regex trimmed(R"(^\s*TRIMMED_CURVE\('[^']*',\s*#\d+,\s*\(\s*(#\d+)[^)]*\)?\)\s*,\s*\(\s*(#\d+))");
  std::smatch match;
  if (!std::regex_search(text, match, trimmed))
    throw std::runtime_error(id + " is not a TRIMMED_CURVE trimmed by points: " + text);
  return {cartesian_point(entities, match[1]), cartesian_point(entities, match[2])};
}

}  // namespace stepframe::geometry::test
