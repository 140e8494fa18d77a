// Area loads: panels found from the members that bound them, the classic
// 45-degree (trapezoid / triangle) and one-way splits of rectangular panels
// (common practice), the nearest-side tributary split of other panels, and
// the total always pressure x loaded area (exact to round-off).

#include "frame_fixtures.hpp"
#include "stepframe/analysis/area_loads.hpp"

#include <catch2/catch.hpp>

#include <cmath>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

// Beams on the level z = 3 between the given nodes (by index pairs), the test section.
FrameModel floor(const std::vector<V>& nodes, const std::vector<std::array<std::size_t, 2>>& beams) {
  FrameModel m;
  m.nodes = nodes;
  for (const auto& b : beams) m.elements.push_back(FrameElement{{b[0], b[1]}, 0, 0, 0.0, {}});
  m.sections = {test::test_section()};
  m.materials = {test::test_steel()};
  return m;
}

AreaLoadInput level_input(const FrameModel& m, double pressure) {
  AreaLoadInput in;
  in.pressure = pressure;
  in.origin = V(0, 0, 3);
  in.normal = V::UnitZ();
  for (std::size_t e = 0; e < m.elements.size(); ++e) in.elements.push_back(e);
  return in;
}

// Total of the loads along `direction` [N], and per element.
double total(const AreaLoadResult& r, const V& direction, std::optional<std::size_t> element = std::nullopt) {
  double t = 0;
  for (const auto& l : r.loads)
    if (!element || l.load.element == *element) t += 0.5 * (l.load.w_start + l.load.w_end).dot(direction) * (l.load.b - l.load.a);
  return t;
}

// Intensity along -Z on element e at distance x from its start [N/m].
double intensity(const AreaLoadResult& r, std::size_t e, double x) {
  double w = 0;
  for (const auto& l : r.loads)
    if (l.load.element == e && x >= l.load.a && x <= l.load.b) {
      const double t = (x - l.load.a) / (l.load.b - l.load.a);
      w = std::max(w, -((1 - t) * l.load.w_start + t * l.load.w_end).z());
    }
  return w;
}

const V down = -V::UnitZ();

}  // namespace

TEST_CASE("two-way rectangular panel: trapezoids on the long sides, triangles on the short (common practice)",
          "[analysis][area_loads]") {
  // 6 m x 4 m, p = 2.5 kPa. Long sides: p (L b / 2 - b^2 / 4) = 2500 (12 - 4) = 20 kN each;
  // short sides: p b^2 / 4 = 10 kN each; peak intensity p b / 2 = 5 kN/m.
  const auto m = floor({{0, 0, 3}, {6, 0, 3}, {6, 4, 3}, {0, 4, 3}}, {{0, 1}, {1, 2}, {3, 2}, {0, 3}});
  const auto r = distribute_area_load(m, level_input(m, 2500));
  REQUIRE(r.panels.size() == 1);
  CHECK(r.panels[0].method == "two-way, 45-degree split");
  CHECK(r.area == Approx(24.0).epsilon(1e-12));
  CHECK(r.total_force == Approx(60e3).epsilon(1e-12));
  CHECK(total(r, down) == Approx(60e3).epsilon(1e-12));
  CHECK(total(r, down, 0) == Approx(20e3).epsilon(1e-12));
  CHECK(total(r, down, 2) == Approx(20e3).epsilon(1e-12));
  CHECK(total(r, down, 1) == Approx(10e3).epsilon(1e-12));
  CHECK(total(r, down, 3) == Approx(10e3).epsilon(1e-12));
  CHECK(intensity(r, 0, 3.0) == Approx(5000).epsilon(1e-12));
  CHECK(intensity(r, 0, 1.0) == Approx(2500).epsilon(1e-12));
  CHECK(intensity(r, 1, 2.0) == Approx(5000).epsilon(1e-12));  // apex of the triangle
  // Element 2 runs from node 3 to node 2 (its start at x = 0): the trapezoid is symmetric either way.
  CHECK(intensity(r, 2, 5.5) == Approx(1250).epsilon(1e-12));
}

TEST_CASE("one-way rectangular panel: the two beams along the span direction take p b / 2 each (common practice)",
          "[analysis][area_loads]") {
  const auto m = floor({{0, 0, 3}, {6, 0, 3}, {6, 4, 3}, {0, 4, 3}}, {{0, 1}, {1, 2}, {3, 2}, {0, 3}});
  auto in = level_input(m, 2500);
  in.two_way = false;
  in.beams_along = V::UnitX();
  const auto r = distribute_area_load(m, in);
  CHECK(r.panels[0].method == "one-way");
  CHECK(total(r, down, 0) == Approx(30e3).epsilon(1e-12));
  CHECK(total(r, down, 2) == Approx(30e3).epsilon(1e-12));
  CHECK(total(r, down, 1) == 0.0);
  CHECK(intensity(r, 0, 2.0) == Approx(5000).epsilon(1e-12));
  in.beams_along = V(1, 1, 0);  // no side along it
  CHECK_THROWS_AS(distribute_area_load(m, in), std::invalid_argument);
}

TEST_CASE("panels are found from the bounding members; a region and openings limit them", "[analysis][area_loads]") {
  // Two bays 6 m x 4 m sharing a beam (the middle beam split into two elements at a T node), and a
  // cantilever sticking out that bounds nothing.
  const auto m = floor({{0, 0, 3}, {6, 0, 3}, {12, 0, 3}, {12, 4, 3}, {6, 4, 3}, {0, 4, 3}, {6, 2, 3}, {14, 0, 3}},
                       {{0, 1}, {1, 2}, {2, 3}, {4, 3}, {5, 4}, {0, 5}, {1, 6}, {6, 4}, {2, 7}});
  auto in = level_input(m, 2000);
  const auto r = distribute_area_load(m, in);
  REQUIRE(r.panels.size() == 2);
  CHECK(r.total_force == Approx(2000 * 48).epsilon(1e-12));
  CHECK(total(r, down) == Approx(2000 * 48).epsilon(1e-12));
  // The middle beam (two collinear elements) is a short side of each panel: a triangle p b^2 / 4 from each.
  CHECK(total(r, down, 6) + total(r, down, 7) == Approx(2 * 2000 * 4).epsilon(1e-12));
  CHECK(total(r, down, 8) == 0.0);
  // Only the panel whose centroid lies inside the region.
  in.region = {{5, -1, 3}, {13, -1, 3}, {13, 5, 3}, {5, 5, 3}};
  const auto right = distribute_area_load(m, in);
  REQUIRE(right.panels.size() == 1);
  CHECK(total(right, down, 0) == 0.0);
  // An opening of 1 m x 1.5 m in the right panel: loaded area 24 - 1.5, the total exact; the panel is no longer
  // split by the rectangle rule but by the nearest side.
  in.openings = {{{8, 1, 3}, {9, 1, 3}, {9, 2.5, 3}, {8, 2.5, 3}}};
  const auto opened = distribute_area_load(m, in);
  CHECK(opened.panels[0].method == "two-way, nearest side");
  CHECK(opened.area == Approx(22.5).epsilon(1e-12));
  CHECK(total(opened, down) == Approx(2000 * 22.5).epsilon(1e-12));
  // Without the opening the nearest-side split of a rectangle is the 45-degree one: each long side near 16 kN.
  CHECK(total(opened, down, 1) == Approx(2000 * 8 - 2000 * 1.5 * 0.5).margin(0.1 * 2000 * 8));
}

TEST_CASE("a triangular panel takes the nearest-side split; the total is exact", "[analysis][area_loads]") {
  const auto m = floor({{0, 0, 3}, {6, 0, 3}, {0, 4, 3}}, {{0, 1}, {1, 2}, {2, 0}});
  const auto r = distribute_area_load(m, level_input(m, 3000));
  REQUIRE(r.panels.size() == 1);
  CHECK(r.panels[0].method == "two-way, nearest side");
  CHECK(r.area == Approx(12.0).epsilon(1e-12));
  CHECK(total(r, down) == Approx(36e3).epsilon(1e-12));
  // The nearest-side regions of a triangle meet at its incentre: each side carries p r L / 2 with r the
  // inradius, area / semiperimeter (a triangle's inradius, common geometry), to the grid's resolution.
  const double radius = 12 / (0.5 * (6 + 4 + std::sqrt(52.0)));
  CHECK(total(r, down, 0) == Approx(3000 * radius * 6 / 2).epsilon(0.02));
  CHECK(total(r, down, 1) == Approx(3000 * radius * std::sqrt(52.0) / 2).epsilon(0.02));
  CHECK(total(r, down, 2) == Approx(3000 * radius * 4 / 2).epsilon(0.02));
}

TEST_CASE("a sloping roof loaded normal to its plane", "[analysis][area_loads]") {
  // A roof plane rising 3 m over 4 m along Y (5 m along the slope), 6 m along X: 30 m2.
  const auto m = floor({{0, 0, 3}, {6, 0, 3}, {6, 4, 6}, {0, 4, 6}}, {{0, 1}, {1, 2}, {3, 2}, {0, 3}});
  AreaLoadInput in;
  in.pressure = 1000;
  in.origin = V(0, 0, 3);
  in.normal = V(0, -3, 4).normalized();
  in.direction = -in.normal;
  in.elements = {0, 1, 2, 3};
  const auto r = distribute_area_load(m, in);
  CHECK(r.area == Approx(30.0).epsilon(1e-12));
  CHECK(total(r, in.direction) == Approx(30e3).epsilon(1e-12));
  CHECK(total(r, V::UnitX()) == Approx(0.0).margin(1e-6));
}
