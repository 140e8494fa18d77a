// The `fabrication:` block of a project file: identical pieces, handling
// limits, camber and the lifting check.

#include "project_blocks.hpp"

#include <algorithm>

namespace stepframe::detail {

FabricationSpec read_fabrication(const Reader& r, const YAML::Node& node, const std::vector<std::string>& results) {
  FabricationSpec spec;
  if (!node) return spec;
  r.check_keys(node, "fabrication", {"mark_tolerance", "max_length", "max_mass", "camber", "lifting"});
  auto positive = [&](const YAML::Node& n, const std::string& key, Dimension dim) {
    const double v = r.number(n, key, dim);
    if (!(v > 0)) r.fail(n, key, "must be above 0");
    return v;
  };
  if (const auto n = node["mark_tolerance"]) {
    spec.mark_tolerance = r.number(n, "fabrication.mark_tolerance", dimension::length);
    if (!(spec.mark_tolerance >= 0)) r.fail(n, "fabrication.mark_tolerance", "must be 0 or more");
  }
  if (const auto n = node["max_length"]) spec.max_length = positive(n, "fabrication.max_length", dimension::length);
  if (const auto n = node["max_mass"]) spec.max_mass = positive(n, "fabrication.max_mass", dimension::mass);
  if (const auto n = node["camber"]) {
    r.check_keys(n, "fabrication.camber", {"load", "threshold", "increment"});
    CamberSpec c;
    c.origin = r.where(n, "fabrication.camber");
    if (!n["load"])
      r.fail(n, "fabrication.camber", "needs load: the case or combination of the permanent loads (e.g. load: G)");
    c.load = r.text(n["load"], "fabrication.camber.load");
    if (std::find(results.begin(), results.end(), c.load) == results.end())
      r.fail(n["load"], "fabrication.camber.load", "'" + c.load + "' is not a load case or combination of this project");
    if (n["threshold"]) {
      c.threshold = r.number(n["threshold"], "fabrication.camber.threshold", dimension::length);
      if (!(c.threshold >= 0)) r.fail(n["threshold"], "fabrication.camber.threshold", "must be 0 or more");
    }
    if (n["increment"]) c.increment = positive(n["increment"], "fabrication.camber.increment", dimension::length);
    spec.camber = c;
  }
  if (const auto n = node["lifting"]) {
    r.check_keys(n, "fabrication.lifting", {"min_length", "points", "dynamic_factor"});
    LiftingSpec l;
    if (n["min_length"]) {
      l.min_length = r.number(n["min_length"], "fabrication.lifting.min_length", dimension::length);
      if (!(l.min_length >= 0)) r.fail(n["min_length"], "fabrication.lifting.min_length", "must be 0 or more");
    }
    if (const auto p = n["points"]) {
      if (!p.IsSequence() || p.size() != 2)
        r.fail(p, "fabrication.lifting.points", "expected two fractions of the length, e.g. [0.2, 0.8]");
      l.points = {r.number(p[0], "fabrication.lifting.points[0]", dimension::none),
                  r.number(p[1], "fabrication.lifting.points[1]", dimension::none)};
      if (!(l.points[0] >= 0 && l.points[0] < l.points[1] && l.points[1] <= 1))
        r.fail(p, "fabrication.lifting.points", "expected two fractions 0 <= a < b <= 1, e.g. [0.2, 0.8]");
    }
    if (n["dynamic_factor"]) {
      l.dynamic_factor = r.number(n["dynamic_factor"], "fabrication.lifting.dynamic_factor", dimension::none);
      if (!(l.dynamic_factor >= 1 && l.dynamic_factor <= 3))
        r.fail(n["dynamic_factor"], "fabrication.lifting.dynamic_factor", "expected a factor from 1 to 3, e.g. 1.25");
    }
    spec.lifting = l;
  }
  return spec;
}

}  // namespace stepframe::detail
