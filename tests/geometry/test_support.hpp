#pragma once
// Helpers shared by the geometry tests: a scratch folder, and a plain-text
// look at the entities of an ISO 10303-21 file so a test can check what a
// "#n" id points at without going through OCCT.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"

#include <Eigen/Core>

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
