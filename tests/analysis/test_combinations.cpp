// Combinations of load cases: in a linear analysis displacements, reactions
// and internal forces superpose (principle of superposition, common
// practice); stresses take absolute values and must be recomputed from the
// combined internal forces, not summed.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/element_recovery.hpp"
#include "stepframe/analysis/solve.hpp"

#include "recovered_lines.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

TEST_CASE("combination equals the factored sum of its cases", "[analysis][combination]") {
  // Portal frame: two fixed columns and a beam.
  FrameModel model;
  model.nodes = {V(0, 0, 0), V(0, 0, 3), V(5, 0, 3), V(5, 0, 0)};
  model.sections = {test::test_section()};
  model.materials = {test::test_steel()};
  model.elements = {FrameElement{{0, 1}, 0, 0, 0}, FrameElement{{1, 2}, 0, 0, 0}, FrameElement{{3, 2}, 0, 0, 0}};
  model.supports = {test::support(0, test::fixed_all), test::support(3, test::fixed_all)};

  LoadCase dead;  // gravity on the beam and self weight
  dead.name = "dead";
  dead.self_weight = true;
  dead.element_loads = {ElementUniformLoad{1, V(0, 0, -10e3)}};
  LoadCase uplift;  // upward load on the beam and a sway force
  uplift.name = "uplift";
  uplift.element_loads = {ElementUniformLoad{1, V(0, 0, 9e3)}};
  uplift.node_loads = {NodeLoad{1, V(4e3, 1e3, 0), V(0, 0, 500)}};
  model.cases = {dead, uplift};
  const double fd = 1.0, fu = 1.5;
  model.combinations = {Combination{"dead + 1.5 uplift", {{0, fd}, {1, fu}}}};

  const auto results = stepframe::testing::recovered(model, solve(model));
  REQUIRE(results.size() == 3);
  const auto& d = results[0];
  const auto& u = results[1];
  const auto& c = results[2];
  CHECK_FALSE(d.is_combination);
  CHECK(c.is_combination);
  CHECK(c.name == "dead + 1.5 uplift");

  const double u_scale = (fd * d.displacements).norm() + (fu * u.displacements).norm();
  CHECK((c.displacements - (fd * d.displacements + fu * u.displacements)).norm() <= 1e-12 * u_scale);
  const double r_scale = (fd * d.reactions).norm() + (fu * u.reactions).norm();
  CHECK((c.reactions - (fd * d.reactions + fu * u.reactions)).norm() <= 1e-10 * r_scale);

  const Section s = test::test_section();
  bool stress_differs_from_sum = false;
  for (std::size_t m = 0; m < model.elements.size(); ++m) {
    double recomputed_max = 0;
    for (std::size_t k = 0; k < c.elements[m].stations.size(); ++k) {
      const Station& sc = c.elements[m].stations[k];
      const Vector6d summed = fd * d.elements[m].stations[k].forces + fu * u.elements[m].stations[k].forces;
      CHECK((sc.forces - summed).norm() <= 1e-9 * (summed.norm() + 1.0));
      const V summed_disp = fd * d.elements[m].stations[k].displacement + fu * u.elements[m].stations[k].displacement;
      CHECK((sc.displacement - summed_disp).norm() <= 1e-12 * u_scale);
      // Stress from the combined forces: |N|/A + |My|/Wy + |Mz|/Wz (see results.hpp).
      const double expected =
          std::abs(summed(0)) / s.A + std::abs(summed(4)) / s.Wy() + std::abs(summed(5)) / s.Wz();
      CHECK(sc.max_abs_stress == Approx(expected).epsilon(1e-9));
      recomputed_max = std::max(recomputed_max, expected);
      const double naive = fd * d.elements[m].stations[k].max_abs_stress + fu * u.elements[m].stations[k].max_abs_stress;
      if (std::abs(naive - sc.max_abs_stress) > 1e-3 * naive) stress_differs_from_sum = true;
    }
    CHECK(c.elements[m].max_abs_stress == Approx(recomputed_max).epsilon(1e-12));
  }
  // The cases bend the beam in opposite senses, so summing stresses would be wrong.
  CHECK(stress_differs_from_sum);
}
