// `cases[i].area_loads`: pressures on the panels of a plane (README "Area loads").

#include "project_blocks.hpp"

namespace stepframe::detail {

std::vector<AreaLoadSpec> read_area_loads(const Reader& r, const YAML::Node& node, const std::string& path) {
  r.expect_list(node, path);
  std::vector<AreaLoadSpec> out;
  for (std::size_t i = 0; i < node.size(); ++i) {
    const auto p = Reader::index(path, i);
    const YAML::Node item = node[i];
    r.check_keys(item, p, {"pressure", "where", "plane", "polygon", "openings", "direction", "span", "beams_along"});
    AreaLoadSpec a;
    a.origin = r.where(item, p);
    if (!item["pressure"]) r.fail(item, p, "an area load needs pressure:, e.g. \"2.5 kN/m2\"");
    // A bare number would be read in the stress unit (MPa by default): a pressure always says its unit.
    const YAML::Node pressure = item["pressure"];
    if (const auto q = parse_quantity(pressure.IsScalar() ? pressure.Scalar() : ""); q && q->dimension == dimension::none)
      r.fail(pressure, p + ".pressure", "write the pressure with its unit, e.g. \"2.5 kN/m2\" or \"2500 Pa\"");
    a.pressure = r.number(pressure, p + ".pressure", dimension::stress);
    if (item["where"]) a.where = member_selector(r, item["where"], p + ".where");
    if (const auto plane = item["plane"]) {
      r.check_keys(plane, p + ".plane", {"x", "y", "z"});
      if (plane.size() != 1) r.fail(plane, p + ".plane", "give one coordinate plane, e.g. {z: 3.5}");
      if (plane["x"]) a.plane_x = r.number(plane["x"], p + ".plane.x", dimension::length);
      if (plane["y"]) a.plane_y = r.number(plane["y"], p + ".plane.y", dimension::length);
      if (plane["z"]) a.plane_z = r.number(plane["z"], p + ".plane.z", dimension::length);
    }
    auto outline = [&](const YAML::Node& list, const std::string& key) {
      r.expect_list(list, key);
      if (list.size() < 3) r.fail(list, key, "an outline needs at least three points [x, y, z]");
      std::vector<Eigen::Vector3d> points;
      for (std::size_t k = 0; k < list.size(); ++k) points.push_back(r.vector3(list[k], Reader::index(key, k), dimension::length));
      return points;
    };
    if (item["polygon"]) a.polygon = outline(item["polygon"], p + ".polygon");
    if (a.polygon.empty() && !item["plane"])
      r.fail(item, p, "an area load needs its plane: plane: {z: 3.5} with where: for the members, or polygon: [[x, y, z], ...]");
    if (!a.polygon.empty() && item["plane"]) r.fail(item["plane"], p + ".plane", "use either plane or polygon, not both");
    if (const auto openings = item["openings"]) {
      r.expect_list(openings, p + ".openings");
      for (std::size_t k = 0; k < openings.size(); ++k) a.openings.push_back(outline(openings[k], Reader::index(p + ".openings", k)));
    }
    if (const auto d = item["direction"]) {
      const auto v = r.text(d, p + ".direction");
      if (v != "global" && v != "normal") r.fail(d, p + ".direction", "expected global (along -Z) or normal (to the plane)");
      a.normal = v == "normal";
    }
    if (const auto s = item["span"]) {
      const auto v = r.text(s, p + ".span");
      if (v != "two_way" && v != "one_way") r.fail(s, p + ".span", "expected two_way or one_way");
      a.two_way = v == "two_way";
    }
    if (item["beams_along"]) {
      if (a.two_way) r.fail(item["beams_along"], p + ".beams_along", "beams_along belongs to span: one_way");
      a.beams_along = r.vector3(item["beams_along"], p + ".beams_along", dimension::none);
      if (a.beams_along.norm() == 0) r.fail(item["beams_along"], p + ".beams_along", "a direction such as [1, 0, 0]");
    } else if (!a.two_way) {
      r.fail(item, p, "span: one_way needs beams_along: the direction of the beams that carry the load, e.g. [1, 0, 0]");
    }
    out.push_back(std::move(a));
  }
  return out;
}

}  // namespace stepframe::detail
