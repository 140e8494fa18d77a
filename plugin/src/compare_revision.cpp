// Reading one side of a comparison: a results folder, a results.json file or
// a project run on the spot, and the document read into plain values.

#include "compare_parts.hpp"

#include "stepframe/analysis/solve.hpp"
#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/inspect.hpp"
#include "stepframe/run.hpp"

#include <spdlog/spdlog.h>

#include <Eigen/Geometry>

#include <fstream>

namespace stepframe {
namespace fs = std::filesystem;

Revision read_revision(const fs::path& path, const RunControl& control) {
  const std::string what_to_give = "give a results folder, a results.json file or a project file (.yaml)";
  std::error_code ec;
  if (!fs::exists(path, ec)) throw InputError(path.string() + ": not found; " + what_to_give);
  if (is_project_file(path)) {
    spdlog::info("{}: analysing the project for the comparison (nothing is written)", path.string());
    try {
      return {path.string(), results_json(analyse_project(path, control))};
    } catch (const InputError& e) {
      throw InputError(std::string(e.what()));
    } catch (const geometry::StepReadError& e) {
      throw InputError(std::string(e.what()));
    } catch (const analysis::UnstableFrame& e) {
      throw InputError(path.string() + ": the frame is unstable, so it cannot be compared: " + e.what());
    }
  }
  const fs::path file = fs::is_directory(path, ec) ? path / "results.json" : path;
  if (!fs::is_regular_file(file, ec))
    throw InputError(path.string() + ": holds no results.json; " + what_to_give);
  std::ifstream in(file, std::ios::binary);
  nlohmann::json document = nlohmann::json::parse(in, nullptr, false);
  if (document.is_discarded())
    throw InputError(file.string() + ": not valid JSON (a results.json cut short?); run the project again or " +
                     what_to_give);
  if (!document.is_object() || document.value("schema", std::string()) != "stepframe-results/1")
    throw InputError(file.string() + ": not a stepframe results.json (schema stepframe-results/1); " + what_to_give);
  return {path.string(), std::move(document)};
}

namespace detail {
namespace {

Eigen::Vector3d vec3(const nlohmann::json& a) { return {a.at(0).get<double>(), a.at(1).get<double>(), a.at(2).get<double>()}; }

template <class T>
std::array<T, 6> six(const nlohmann::json& a) {
  std::array<T, 6> out{};
  for (std::size_t i = 0; i < 6; ++i) out[i] = a.at(i).get<T>();
  return out;
}

// Every path point within `tolerance` of the chord start -> end.
bool is_straight(const std::vector<Eigen::Vector3d>& path, double tolerance) {
  const Eigen::Vector3d chord = path.back() - path.front();
  const double length = chord.norm();
  if (length == 0) return false;
  for (const auto& p : path) {
    const Eigen::Vector3d d = p - path.front();
    if ((d - d.dot(chord) / (length * length) * chord).norm() > tolerance) return false;
  }
  return true;
}

RevisionView read_view(const nlohmann::json& j, double tolerance) {
  RevisionView v;
  std::vector<Eigen::Vector3d> nodes;
  for (const auto& n : j.at("nodes")) nodes.push_back(vec3(n.at("xyz")));
  for (const auto& m : j.at("members")) {
    MemberView mv;
    mv.id = m.at("id").get<std::size_t>();
    for (const auto& n : m.at("path")) mv.path.push_back(nodes.at(n.get<std::size_t>()));
    mv.length = m.at("length").get<double>();
    mv.mass = m.value("mass", 0.0);
    mv.section = m.at("section").get<std::string>();
    mv.material = m.at("material").get<std::string>();
    const auto& s = m.at("source");
    mv.name = s.value("name", std::string());
    mv.product = s.value("product", std::string());
    mv.assembly = s.value("assembly_path", std::string());
    mv.entity = s.value("entity", std::string());
    mv.has_axes = m.contains("z_axis") && m.contains("releases");
    if (mv.has_axes) {
      mv.z_axis = vec3(m["z_axis"]);
      mv.releases = {six<bool>(m["releases"].at("start")), six<bool>(m["releases"].at("end"))};
    }
    mv.straight = is_straight(mv.path, tolerance);
    if (mv.id != v.members.size()) throw std::out_of_range("member ids out of order");
    v.members.push_back(std::move(mv));
  }
  v.member_checks.resize(v.members.size());
  for (const auto& c : j.at("checks")) {
    // A utilisation that is not a number (null) never passes.
    const double u = c.at("utilisation").is_number() ? c["utilisation"].get<double>() : 1e300;
    const bool failed = !c.at("pass").get<bool>();
    CheckState& state = c.at("member").is_null()
                            ? v.frame_checks[{c.at("check").get<std::string>(), c.at("combination").get<std::string>()}]
                            : v.member_checks.at(c["member"].get<std::size_t>())[c.at("check").get<std::string>()];
    state.utilisation = std::max(state.utilisation, u);
    state.failed = state.failed || failed;
  }
  for (const auto& s : j.value("supports", nlohmann::json::array()))
    v.supports.push_back({nodes.at(s.at("node").get<std::size_t>()), six<bool>(s.at("fixed")), six<double>(s.at("spring"))});
  for (const auto& r : j.at("results")) {
    if (r.at("kind") != "case") continue;
    CaseView c{r.at("name").get<std::string>()};
    for (const auto& reaction : r.at("reactions")) {
      const Eigen::Vector3d at = nodes.at(reaction.at("node").get<std::size_t>());
      const Eigen::Vector3d f = vec3(reaction.at("force")), m = vec3(reaction.at("moment"));
      c.force -= f;
      c.moment -= at.cross(f) + m;
    }
    v.cases.push_back(std::move(c));
  }
  return v;
}

}  // namespace

std::string MemberView::label() const {
  if (!name.empty()) return name;
  if (!entity.empty()) return entity;
  return "member " + std::to_string(id);
}

RevisionView view_of(const Revision& revision, double tolerance) {
  try {
    return read_view(revision.results, tolerance);
  } catch (const std::exception& e) {
    throw InputError(revision.label + ": a results.json with missing or malformed parts (" + e.what() +
                     "); run the project again with this version of stepframe");
  }
}

}  // namespace detail
}  // namespace stepframe
