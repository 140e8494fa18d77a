// The `masses:` block (point masses for natural frequencies) and the
// `checks.frequency` limits (README "Natural frequencies").

#include "project_blocks.hpp"

namespace stepframe::detail {

std::vector<PointMassSpec> read_masses(const Reader& r, const YAML::Node& node) {
  std::vector<PointMassSpec> out;
  if (!node) return out;
  r.expect_list(node, "masses");
  for (std::size_t i = 0; i < node.size(); ++i) {
    const auto path = Reader::index("masses", i);
    PointMassSpec m;
    m.where = node_target(r, node[i], path, "a point mass", {"where", "near", "mass"});
    if (!node[i]["mass"]) r.fail(node[i], path, "a point mass needs mass:, e.g. \"850 kg\" or \"1.2 t\"");
    m.mass = r.number(node[i]["mass"], path + ".mass", dimension::mass);
    // Beyond 10 000 t on one node is a wrong unit, not equipment on a steel frame (common practice).
    if (!(m.mass > 0 && m.mass <= 1e7))
      r.fail(node[i]["mass"], path + ".mass", "a point mass is positive and at most 10000 t; bare numbers are kg");
    out.push_back(std::move(m));
  }
  return out;
}

std::vector<FrequencyCheckSpec> read_frequency_checks(const Reader& r, const YAML::Node& node, const std::string& path) {
  r.expect_list(node, path);
  std::vector<FrequencyCheckSpec> out;
  for (std::size_t i = 0; i < node.size(); ++i) {
    const auto p = Reader::index(path, i);
    r.check_keys(node[i], p, {"where", "min_hz", "running_hz", "band"});
    FrequencyCheckSpec c;
    c.origin = r.where(node[i], p);
    if (node[i]["where"]) c.where = member_selector(r, node[i]["where"], p + ".where");
    auto hertz = [&](const char* key) {
      const double f = r.number(node[i][key], p + "." + key, dimension::none);
      if (!(f > 0 && f <= 1000)) r.fail(node[i][key], p + "." + key, "a frequency in Hz above 0 and at most 1000, e.g. 3");
      return f;
    };
    if (node[i]["min_hz"]) c.min_hz = hertz("min_hz");
    if (node[i]["running_hz"]) c.running_hz = hertz("running_hz");
    if (node[i]["band"]) {
      if (!c.running_hz) r.fail(node[i]["band"], p + ".band", "band belongs to running_hz (a machine's running frequency)");
      c.band = r.number(node[i]["band"], p + ".band", dimension::none);
      if (!(c.band > 0 && c.band < 1)) r.fail(node[i]["band"], p + ".band", "a fraction of the running frequency, e.g. 0.2 for +-20%");
    }
    if (!c.min_hz && !c.running_hz)
      r.fail(node[i], p, "a frequency check sets min_hz (floors, walkways) and/or running_hz with band (machines)");
    out.push_back(std::move(c));
  }
  return out;
}

}  // namespace stepframe::detail
