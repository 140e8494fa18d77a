#include "stepframe/run.hpp"

#include "json_shapes.hpp"

namespace stepframe {
namespace {

using json_shapes::vec;
nlohmann::json vec6(const analysis::Vector6d& v) { return {v[0], v[1], v[2], v[3], v[4], v[5]}; }

}  // namespace

nlohmann::json results_json(const Analysis& a) {
  const auto& model = a.built.model;
  nlohmann::json j;
  j["schema"] = "stepframe-results/1";
  j["caution"] = caution;
  j["units"] = {{"length", "m"}, {"force", "N"}, {"moment", "N*m"}, {"stress", "Pa"}, {"rotation", "rad"}};
  j["status"] = a.status() == ExitStatus::pass ? "pass" : "fail";
  j["model"] = {{"file", a.project.model.string()}, {"length_unit", a.file_length_unit}};

  auto& nodes = j["nodes"] = nlohmann::json::array();
  for (std::size_t i = 0; i < model.nodes.size(); ++i) nodes.push_back({{"id", i}, {"xyz", vec(model.nodes[i])}});

  auto& members = j["members"] = nlohmann::json::array();
  for (std::size_t i = 0; i < model.members.size(); ++i) {
    const auto& chain = model.members[i].elements;
    const auto& first = model.elements[chain.front()];
    std::vector<std::size_t> path{first.nodes[0]};
    double length = 0;
    for (std::size_t e : chain) {
      const auto& element = model.elements[e];
      path.push_back(element.nodes[1]);
      length += (model.nodes[element.nodes[1]] - model.nodes[element.nodes[0]]).norm();
    }
    members.push_back({{"id", i},
                       {"nodes", {path.front(), path.back()}},
                       {"path", path},
                       {"section", model.sections[first.section].designation},
                       {"material", model.materials[first.material].name},
                       {"length", length},
                       {"source", json_shapes::source(a.built.member_sources[i])}});
  }

  auto& results = j["results"] = nlohmann::json::array();
  for (const auto& r : a.results) {
    nlohmann::json jr{{"name", r.name}, {"kind", r.is_combination ? "combination" : "case"}};
    // Elastic critical load factor and the lowest buckling modes' factors (null / empty when not computed).
    jr["alpha_cr"] = r.alpha_cr ? nlohmann::json(*r.alpha_cr) : nlohmann::json(nullptr);
    jr["buckling_factors"] = nlohmann::json::array();
    for (const auto& mode : r.buckling_modes) jr["buckling_factors"].push_back(mode.alpha);
    jr["second_order"] = r.second_order;
    auto& disp = jr["displacements"] = nlohmann::json::array();
    auto& reactions = jr["reactions"] = nlohmann::json::array();
    std::vector<bool> supported(model.nodes.size(), false);
    for (const auto& s : model.supports) supported[s.node] = true;
    for (std::size_t n = 0; n < model.nodes.size(); ++n) {
      const auto d = r.displacements.segment<6>(static_cast<Eigen::Index>(6 * n));
      disp.push_back({{"node", n}, {"u", vec(d.head<3>())}, {"r", vec(d.tail<3>())}});
      if (!supported[n]) continue;
      const auto f = r.reactions.segment<6>(static_cast<Eigen::Index>(6 * n));
      reactions.push_back({{"node", n}, {"force", vec(f.head<3>())}, {"moment", vec(f.tail<3>())}});
    }
    auto& mr = jr["members"] = nlohmann::json::array();
    for (std::size_t m = 0; m < r.members.size(); ++m) {
      const auto& res = r.members[m];
      mr.push_back({{"member", m},
                    {"max_abs_stress", res.max_abs_stress},
                    {"max_von_mises", res.max_von_mises},
                    {"max_local_deflection", res.max_local_deflection},
                    {"end_forces", {{"start", vec6(res.start_forces)}, {"end", vec6(res.end_forces)}}}});
    }
    results.push_back(std::move(jr));
  }

  auto& checks = j["checks"] = nlohmann::json::array();
  for (const auto& c : a.checks)
    checks.push_back({{"member", c.member == analysis::whole_frame ? nlohmann::json(nullptr) : nlohmann::json(c.member)},
                      {"check", c.check},
                      {"clause", c.clause},
                      {"combination", c.combination},
                      {"station", c.station},
                      {"value", c.value},
                      {"limit", c.limit},
                      {"utilisation", c.utilisation},
                      {"pass", c.pass}});

  auto& diagnostics = j["diagnostics"] = nlohmann::json::array();
  for (const auto& d : a.wireframe.diagnostics) diagnostics.push_back(json_shapes::diagnostic(d));
  return j;
}

}  // namespace stepframe
