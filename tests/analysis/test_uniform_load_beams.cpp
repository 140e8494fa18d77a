// Beams under a uniform load w. References (standard beam theory, common practice):
//  - simply supported: midspan deflection 5 w L^4 / (384 E I), midspan moment
//    w L^2 / 8, end shear w L / 2;
//  - both ends fixed: end moments w L^2 / 12, midspan moment w L^2 / 24,
//    midspan deflection w L^4 / (384 E I), deflected shape w x^2 (L - x)^2 / (24 E I).

#include "frame_fixtures.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/solve.hpp"

#include "recovered_lines.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

constexpr double tol = 1e-9;  // relative; exact element and exact recovery

const Station& station_at(const LineResult& r, double x) {
  for (const Station& st : r.stations)
    if (std::abs(st.x - x) < 1e-12) return st;
  FAIL("no station at x = " << x);
  return r.stations.front();
}

}  // namespace

TEST_CASE("simply supported beam under uniform load, one member", "[analysis][udl]") {
  const double L = 6.0, w = 4.5e3;  // m, N/m (downwards)
  const Section s = test::test_section();
  const Material m = test::test_steel();
  FrameModel model = test::single_member(V(0, 0, 0), V(L, 0, 0));
  // Pin (translations and torsion) at the start, roller (transverse only) at the end.
  model.supports = {test::support(0, {true, true, true, true, false, false}),
                    test::support(1, {false, true, true, false, false, false})};
  LoadCase lc;
  lc.name = "uniform";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}};
  model.cases = {lc};

  SolveOptions options;
  options.stations = 21;  // station 10 sits at midspan
  const auto r = stepframe::testing::recovered(model, solve(model, options)).at(0);
  const LineResult& mr = r.elements.at(0);
  REQUIRE(mr.stations.size() == 21);
  const Station& mid = station_at(mr, L / 2);

  const double delta = 5 * w * L * L * L * L / (384 * m.E * s.Iy);
  CHECK(mid.displacement.z() == Approx(-delta).epsilon(tol));
  CHECK(mid.displacement.x() == Approx(0).margin(1e-15));
  CHECK(mid.displacement.y() == Approx(0).margin(1e-15));
  CHECK(mr.max_local_deflection == Approx(delta).epsilon(tol));

  // Sagging: My < 0 so the top fibre (local +z) is in compression.
  CHECK(mid.forces(4) == Approx(-w * L * L / 8).epsilon(tol));
  CHECK(mid.forces(2) == Approx(0).margin(1e-6));
  CHECK(mid.max_abs_stress == Approx(w * L * L / 8 / s.Wy()).epsilon(tol));
  CHECK(mr.max_abs_stress == Approx(w * L * L / 8 / s.Wy()).epsilon(tol));
  // End shears: the beam pushes down on its supports.
  CHECK(mr.start_forces(2) == Approx(-w * L / 2).epsilon(tol));
  CHECK(mr.end_forces(2) == Approx(w * L / 2).epsilon(tol));
  CHECK(mr.start_forces(4) == Approx(0).margin(1e-6));
  CHECK(mr.end_forces(4) == Approx(0).margin(1e-6));
  // Reactions w L / 2 upwards at each end.
  CHECK(r.reactions(2) == Approx(w * L / 2).epsilon(tol));
  CHECK(r.reactions(6 + 2) == Approx(w * L / 2).epsilon(tol));
  // Parabolic moment diagram M(x) = -w x (L - x) / 2 at every station.
  for (const Station& st : mr.stations) CHECK(st.forces(4) == Approx(-w * st.x * (L - st.x) / 2).margin(1e-6));
}

TEST_CASE("fixed-ended beam under uniform load", "[analysis][udl]") {
  const double L = 5.0, w = 8e3;
  const Section s = test::test_section();
  const Material m = test::test_steel();

  SECTION("modelled as two members with a free node at midspan") {
    FrameModel model = test::single_member(V(0, 0, 0), V(L / 2, 0, 0));
    model.nodes.push_back(V(L, 0, 0));
    model.elements.push_back(FrameElement{{1, 2}, 0, 0, 0});
    model.supports = {test::support(0, test::fixed_all), test::support(2, test::fixed_all)};
    LoadCase lc;
    lc.name = "uniform";
    lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}, ElementUniformLoad{1, V(0, 0, -w)}};
    model.cases = {lc};
    const auto r = stepframe::testing::recovered(model, solve(model)).at(0);

    // Midspan node deflection and moment.
    CHECK(r.displacements(6 + 2) == Approx(-w * L * L * L * L / (384 * m.E * s.Iy)).epsilon(tol));
    CHECK(r.elements[0].end_forces(4) == Approx(-w * L * L / 24).epsilon(tol));
    CHECK(r.elements[1].start_forces(4) == Approx(-w * L * L / 24).epsilon(tol));
    // Hogging end moments w L^2 / 12 (top fibre in tension: My > 0).
    CHECK(r.elements[0].start_forces(4) == Approx(w * L * L / 12).epsilon(tol));
    CHECK(r.elements[1].end_forces(4) == Approx(w * L * L / 12).epsilon(tol));
    CHECK(r.elements[0].max_abs_stress == Approx(w * L * L / 12 / s.Wy()).epsilon(tol));
    // Support reactions: w L / 2 up and the fixing moments.
    CHECK(r.reactions(2) == Approx(w * L / 2).epsilon(tol));
    CHECK(r.reactions(4) == Approx(-w * L * L / 12).epsilon(tol));  // global ry at the left end
    CHECK(r.reactions(12 + 4) == Approx(w * L * L / 12).epsilon(tol));
    // Deflected shape between the nodes, member 0 covers 0 <= x <= L/2.
    for (const Station& st : r.elements[0].stations) {
      const double x = st.x;
      CHECK(st.displacement.z() ==
            Approx(-w * x * x * (L - x) * (L - x) / (24 * m.E * s.Iy)).margin(1e-9 * w * L * L * L * L / (m.E * s.Iy)));
    }
  }

  SECTION("modelled as one member: every DOF is supported") {
    FrameModel model = test::single_member(V(0, 0, 0), V(0, L, 0));  // along Y this time
    model.supports = {test::support(0, test::fixed_all), test::support(1, test::fixed_all)};
    LoadCase lc;
    lc.name = "uniform";
    lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}};
    model.cases = {lc};
    SolveOptions options;
    options.stations = 11;
    const LineResult mr = stepframe::testing::recovered(model, solve(model, options)).at(0).elements.at(0);
    const Station& mid = station_at(mr, L / 2);
    CHECK(mid.displacement.z() == Approx(-w * L * L * L * L / (384 * m.E * s.Iy)).epsilon(tol));
    CHECK(mid.forces(4) == Approx(-w * L * L / 24).epsilon(tol));
    CHECK(mr.start_forces(4) == Approx(w * L * L / 12).epsilon(tol));
    CHECK(mr.end_forces(4) == Approx(w * L * L / 12).epsilon(tol));
    CHECK(mr.max_local_deflection == Approx(w * L * L * L * L / (384 * m.E * s.Iy)).epsilon(tol));
  }
}

TEST_CASE("uniform load along local y bends the beam about z", "[analysis][udl]") {
  const double L = 4.0, w = 1.2e3;
  const Section s = test::test_section();
  const Material m = test::test_steel();
  FrameModel model = test::single_member(V(0, 0, 0), V(L, 0, 0));
  model.supports = {test::support(0, {true, true, true, true, false, false}),
                    test::support(1, {false, true, true, false, false, false})};
  LoadCase lc;
  lc.name = "lateral";
  lc.element_loads = {ElementUniformLoad{0, V(0, w, 0)}};  // global +Y = local +y
  model.cases = {lc};
  const LineResult mr = stepframe::testing::recovered(model, solve(model)).at(0).elements.at(0);
  const Station& mid = station_at(mr, L / 2);
  CHECK(mid.displacement.y() == Approx(5 * w * L * L * L * L / (384 * m.E * s.Iz)).epsilon(tol));
  CHECK(std::abs(mid.forces(5)) == Approx(w * L * L / 8).epsilon(tol));
  CHECK(mid.max_abs_stress == Approx(w * L * L / 8 / s.Wz()).epsilon(tol));
}

TEST_CASE("the member checks' forces-only recovery gives the stations' forces alone", "[analysis][udl]") {
  // Fixed-ended beam under uniform load: M(x) = w (6 L x - 6 x^2 - L^2) / 12, end moments w L^2 / 12
  // (standard beam theory, common practice; sagging My < 0 as above).
  const double L = 5.0, w = 8e3;
  FrameModel model = test::single_member(V(0, 0, 0), V(L, 0, 0));
  model.supports = {test::support(0, test::fixed_all), test::support(1, test::fixed_all)};
  LoadCase lc;
  lc.name = "uniform";
  lc.element_loads = {ElementUniformLoad{0, V(0, 0, -w)}};
  model.cases = {lc};
  const auto results = solve(model);
  const LineResult forces = element_line(model, results.at(0), 0, 11, LineDetail::forces);
  const LineResult stations = element_line(model, results.at(0), 0, 11, LineDetail::stations);
  REQUIRE(forces.stations.size() == 11);
  for (std::size_t k = 0; k < forces.stations.size(); ++k) {
    const Station& f = forces.stations[k];
    const double x = f.x;
    CHECK(x == stations.stations[k].x);
    CHECK(f.position == stations.stations[k].position);
    CHECK(f.forces == stations.stations[k].forces);  // the same arithmetic in first order
    CHECK(-f.forces(4) == Approx(w * (6 * L * x - 6 * x * x - L * L) / 12).margin(1e-6));
    CHECK(f.displacement.isZero(0.0));
    CHECK(f.von_mises == 0.0);
  }
  CHECK(forces.start_forces == stations.start_forces);
  CHECK(forces.end_forces == stations.end_forces);
  CHECK(forces.length == L);

  SECTION("in second order the forces need the deflected axis, so the stations are recovered whole") {
    LoadResult second = results.at(0);
    second.second_order_axial = {-2e5};  // an axial thrust [N] in the element's stiffness
    const LineResult f2 = element_line(model, second, 0, 11, LineDetail::forces);
    const LineResult s2 = element_line(model, second, 0, 11, LineDetail::stations);
    for (std::size_t k = 0; k < f2.stations.size(); ++k) {
      CHECK(f2.stations[k].forces == s2.stations[k].forces);
      CHECK(f2.stations[k].displacement == s2.stations[k].displacement);
    }
    CHECK(f2.stations[5].displacement.z() < 0);  // the midspan sags: the deflected axis was recovered
  }
}
