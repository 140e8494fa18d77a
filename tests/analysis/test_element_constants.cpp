// The element constants a solve shares between its load results (geometry,
// properties, cantilever flexibility) give the recovery the same numbers, bit
// for bit, as working them out for each result; a summary (no stations kept)
// gives the full line's summary fields bit for bit: consistency tests of the
// shortcuts against the plain path, no outside reference.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/element_constants.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/solve.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

// A portal leaning in plan (no axis along a global one) with a pinned brace, a loaded beam and a
// point load, under a case and a combination.
FrameModel braced_portal() {
  FrameModel model;
  model.nodes = {V(0, 0, 0), V(0.3, 0.2, 3.5), V(5.1, 1.4, 3.7), V(4.9, 1.1, 0)};
  model.sections = {test::test_section()};
  model.materials = {test::test_steel()};
  model.elements = {FrameElement{{0, 1}, 0, 0, 0.1}, FrameElement{{1, 2}, 0, 0, 0.0}, FrameElement{{3, 2}, 0, 0, 0.2},
                    FrameElement{{0, 2}, 0, 0, 0.0}};
  model.elements[3].releases = {{{false, false, false, false, true, true}, {false, false, false, false, true, true}}};
  model.supports = {test::support(0, test::fixed_all), test::support(3, test::fixed_all)};
  LoadCase g;
  g.name = "G";
  g.element_loads = {ElementUniformLoad{1, V(0, 0, -6e3)}};
  g.partial_loads = {ElementLoad{1, LoadAxes::global, true, 1.7, -1, V(2e3, 0, -2e4), V::Zero()},
                     ElementLoad{0, LoadAxes::local, false, 0.5, 2.5, V(0, 1e3, 0), V(0, 3e3, 0)}};
  LoadCase w;
  w.name = "W";
  w.node_loads = {NodeLoad{1, V(8e3, 1e3, 0), V::Zero()}};
  model.cases = {g, w};
  Combination c;
  c.name = "ULS";
  c.factors = {{0, 1.35}, {1, 1.5}};
  model.combinations = {c};
  return model;
}

void same_line(const LineResult& a, const LineResult& b) {
  REQUIRE(a.stations.size() == b.stations.size());
  for (std::size_t k = 0; k < a.stations.size(); ++k) {
    CHECK(a.stations[k].forces == b.stations[k].forces);
    CHECK(a.stations[k].displacement == b.stations[k].displacement);
    CHECK(a.stations[k].rotation == b.stations[k].rotation);
    CHECK(a.stations[k].von_mises == b.stations[k].von_mises);
  }
  for (std::size_t c = 0; c < 6; ++c) {
    CHECK(a.extremes[c].max == b.extremes[c].max);
    CHECK(a.extremes[c].min == b.extremes[c].min);
  }
  CHECK(a.max_von_mises == b.max_von_mises);
  CHECK(a.max_local_deflection == b.max_local_deflection);
  CHECK(a.start_forces == b.start_forces);
  CHECK(a.end_forces == b.end_forces);
}

}  // namespace

TEST_CASE("a solve's shared element constants recover every element as working them out afresh",
          "[analysis][recovery]") {
  const FrameModel model = braced_portal();
  const std::vector<LoadResult> results = solve(model);
  REQUIRE(results.size() == 3);
  for (const LoadResult& r : results) {
    INFO(r.name);
    REQUIRE(r.element_constants);
    CHECK(r.element_constants == results.front().element_constants);  // one set for every result
    LoadResult plain = r;
    plain.element_constants.reset();
    for (std::size_t e = 0; e < model.elements.size(); ++e) {
      INFO("element " << e);
      const LineResult shared = element_line(model, r, e, 11, LineDetail::full);
      same_line(shared, element_line(model, plain, e, 11, LineDetail::full));
      CHECK(shared.max_von_mises > 0);
    }
  }
  // Flexibilities only where a case loads the element: the column with the local load and the beam.
  const auto& constants = *results.front().element_constants;
  CHECK(constants[0].flexibility.has_value());
  CHECK(constants[1].flexibility.has_value());
  CHECK_FALSE(constants[2].flexibility.has_value());
  CHECK_FALSE(constants[3].flexibility.has_value());

  SECTION("constants of another model (another element count) are not used") {
    FrameModel smaller = test::single_member(V(0, 0, 0), V(1, 0, 0));
    LoadResult r = results.front();
    r.element_constants = std::make_shared<const std::vector<ElementConstants>>(element_constants(smaller, {}));
    LoadResult plain = results.front();
    plain.element_constants.reset();
    same_line(element_line(model, r, 2, 5, LineDetail::full), element_line(model, plain, 2, 5, LineDetail::full));
  }
}

namespace {

// Every LineSummary field of a summary equals the full line's, bit for bit.
void same_summary(const LineSummary& summary, const LineResult& full) {
  CHECK(summary.length == full.length);
  CHECK(summary.start_forces == full.start_forces);
  CHECK(summary.end_forces == full.end_forces);
  CHECK(summary.max_abs_stress == full.max_abs_stress);
  CHECK(summary.max_von_mises == full.max_von_mises);
  CHECK(summary.max_von_mises_at == full.max_von_mises_at);
  CHECK(summary.max_local_deflection == full.max_local_deflection);
  CHECK(summary.max_local_deflection_at == full.max_local_deflection_at);
  for (std::size_t c = 0; c < 6; ++c) {
    CHECK(summary.extremes[c].max == full.extremes[c].max);
    CHECK(summary.extremes[c].x_max == full.extremes[c].x_max);
    CHECK(summary.extremes[c].min == full.extremes[c].min);
    CHECK(summary.extremes[c].x_min == full.extremes[c].x_min);
  }
}

}  // namespace

TEST_CASE("a summary is the full line without its stations, in first and second order", "[analysis][recovery]") {
  for (const bool second_order : {false, true}) {
    INFO((second_order ? "second order" : "first order"));
    FrameModel model = braced_portal();
    model.settings.second_order = second_order;
    // The column and the beam one member of two elements, the rest members of their own.
    model.members = {Member{{0, 1}}, Member{{2}}, Member{{3}}};
    const std::vector<LoadResult> results = solve(model);
    REQUIRE(results.size() == 3);
    CHECK(results.back().second_order == second_order);
    for (const LoadResult& r : results) {
      INFO(r.name);
      for (std::size_t e = 0; e < model.elements.size(); ++e) {
        INFO("element " << e);
        const LineResult summary = element_line(model, r, e, 11, LineDetail::summary);
        const LineResult full = element_line(model, r, e, 11, LineDetail::full);
        CHECK(summary.stations.empty());
        REQUIRE(full.stations.size() == 11);
        same_summary(summary, full);
        CHECK(full.max_local_deflection > 0);
      }
      // What the solve keeps for each member is the full member line's summary.
      const auto chains = member_chains(model);
      REQUIRE(r.members.size() == chains.size());
      for (std::size_t m = 0; m < chains.size(); ++m) {
        INFO("member " << m);
        same_summary(r.members[m], member_line(model, r, chains[m], LineDetail::full));
        same_summary(member_line(model, r, chains[m], LineDetail::summary),
                     member_line(model, r, chains[m], LineDetail::full));
      }
    }
  }
}
