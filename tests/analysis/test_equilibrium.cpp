// Global and nodal statics of solved frames: the reactions balance the applied
// loads in force and in moment about the origin, member end forces balance the
// node loads at every free node, and self weight equals A rho g L per member
// (Newtonian statics of rigid bodies, common practice).

#include "frame_fixtures.hpp"
#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/analysis/solve.hpp"

#include "recovered_lines.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

// A 3D frame with members along X, Y, Z and sloping, rolled sections, two
// different sections and supports of different kinds.
FrameModel space_frame() {
  FrameModel model;
  model.nodes = {V(0, 0, 0), V(4, 0, 0), V(4, 3, 0), V(0, 3, 0),      // column bases 0-3
                 V(0, 0, 3.5), V(4, 0, 3.5), V(4, 3, 3.2), V(0, 3, 3.5),  // column heads 4-7
                 V(2, 1.5, 4.6)};                                       // apex 8
  Section heavy = test::test_section();
  heavy.designation = "TEST-H";
  heavy.A = 7.8e-3;
  heavy.Iy = 5.7e-5;
  heavy.Iz = 2.0e-5;
  heavy.J = 6.0e-7;
  heavy.depth = heavy.width = 0.2;
  model.sections = {test::test_section(), heavy};
  model.materials = {test::test_steel()};
  auto add = [&](std::size_t a, std::size_t b, std::size_t section, double roll) {
    model.elements.push_back(FrameElement{{a, b}, section, 0, roll});
  };
  add(0, 4, 1, 0.0);   // vertical columns, one rolled
  add(1, 5, 1, 0.6);
  add(2, 6, 1, 0.0);
  add(3, 7, 1, 0.0);
  add(4, 5, 0, 0.0);   // beams along X and Y
  add(5, 6, 0, 0.2);
  add(7, 6, 0, 0.0);
  add(4, 7, 0, -0.3);
  add(4, 8, 0, 0.0);   // sloping rafters to the apex
  add(6, 8, 0, 0.4);
  add(5, 8, 0, 0.0);
  add(4, 6, 0, 0.0);   // plan diagonal
  model.supports = {test::support(0, test::fixed_all), test::support(1, {true, true, true, false, false, false}),
                    test::support(2, test::fixed_all), test::support(3, {true, true, true, true, false, true})};
  return model;
}

LoadCase mixed_loads() {
  LoadCase lc;
  lc.name = "mixed";
  lc.node_loads = {NodeLoad{8, V(3e3, -2e3, -15e3), V(1.5e3, -0.8e3, 2.2e3)},
                   NodeLoad{5, V(-4e3, 6e3, 1e3), V(0, 2e3, -1e3)},
                   NodeLoad{7, V(0, 0, -5e3), V(-3e3, 0, 0)}};
  lc.element_loads = {ElementUniformLoad{4, V(0, 0, -6e3)}, ElementUniformLoad{9, V(1e3, 0.5e3, -2e3)},
                     ElementUniformLoad{1, V(2.5e3, 0, 0)}, ElementUniformLoad{7, V(0.3e3, -0.7e3, -1.1e3)}};
  lc.self_weight = true;
  return lc;
}

// Applied loads of a case as a force and a moment about the origin, with
// self weight A rho g per metre along -Z.
test::Resultant applied_resultant(const FrameModel& model, const LoadCase& lc) {
  test::Resultant r;
  for (const NodeLoad& load : lc.node_loads) {
    r.force += load.force;
    r.moment += model.nodes[load.node].cross(load.force) + load.moment;
  }
  auto add_member_load = [&](std::size_t m, const V& w) {
    const V a = model.nodes[model.elements[m].nodes[0]], b = model.nodes[model.elements[m].nodes[1]];
    const V total = w * (b - a).norm();  // resultant at the midpoint
    r.force += total;
    r.moment += (0.5 * (a + b)).cross(total);
  };
  for (const ElementUniformLoad& load : lc.element_loads) add_member_load(load.element, load.w);
  if (lc.self_weight) {
    for (std::size_t m = 0; m < model.elements.size(); ++m) {
      const FrameElement& member = model.elements[m];
      const double g = model.sections[member.section].A * model.materials[member.material].density * standard_gravity;
      add_member_load(m, V(0, 0, -g));
    }
  }
  return r;
}

}  // namespace

TEST_CASE("3D frame: reactions balance loads in force and moment", "[analysis][equilibrium]") {
  FrameModel model = space_frame();
  model.cases = {mixed_loads()};
  const auto r = stepframe::testing::recovered(model, solve(model)).at(0);
  const test::Resultant applied = applied_resultant(model, model.cases[0]);
  const test::Resultant reactions = test::reaction_resultant(model, r.reactions);
  const double scale = applied.force.norm();
  INFO("applied force " << applied.force.transpose() << ", reactions " << reactions.force.transpose());
  CHECK((reactions.force + applied.force).norm() <= 1e-8 * scale);
  CHECK((reactions.moment + applied.moment).norm() <= 1e-8 * scale * 5.0);

  // Reactions only where a support acts.
  for (std::size_t n = 4; n < model.nodes.size(); ++n)
    CHECK(r.reactions.segment<6>(static_cast<Eigen::Index>(6 * n)).norm() == 0.0);
  CHECK(r.reactions(6 * 1 + 3) == 0.0);  // node 1 is pinned: no moment reaction

  // Node equilibrium at every free node: the members act on a node with
  // +start_forces at their start and -end_forces at their end (actions of the
  // member on the node, local axes); these plus the node loads vanish.
  for (std::size_t n = 4; n < model.nodes.size(); ++n) {
    Vector6d sum = Vector6d::Zero();
    for (const NodeLoad& load : model.cases[0].node_loads) {
      if (load.node != n) continue;
      sum.head<3>() += load.force;
      sum.tail<3>() += load.moment;
    }
    for (std::size_t m = 0; m < model.elements.size(); ++m) {
      const FrameElement& member = model.elements[m];
      const Eigen::Matrix3d axes = local_axes(model.nodes[member.nodes[0]], model.nodes[member.nodes[1]], member.roll);
      if (member.nodes[0] == n) {
        sum.head<3>() += axes.transpose() * r.elements[m].start_forces.head<3>();
        sum.tail<3>() += axes.transpose() * r.elements[m].start_forces.tail<3>();
      }
      if (member.nodes[1] == n) {
        sum.head<3>() -= axes.transpose() * r.elements[m].end_forces.head<3>();
        sum.tail<3>() -= axes.transpose() * r.elements[m].end_forces.tail<3>();
      }
    }
    INFO("node " << n << " residual " << sum.transpose());
    CHECK(sum.norm() <= 1e-7 * scale);
  }
}

TEST_CASE("self weight: vertical reaction equals sum of A rho g L", "[analysis][self_weight]") {
  FrameModel model = space_frame();
  LoadCase lc;
  lc.name = "self weight";
  lc.self_weight = true;
  model.cases = {lc};
  const auto r = stepframe::testing::recovered(model, solve(model)).at(0);

  double weight = 0;
  for (const FrameElement& member : model.elements) {
    const double L = (model.nodes[member.nodes[1]] - model.nodes[member.nodes[0]]).norm();
    weight += model.sections[member.section].A * model.materials[member.material].density * standard_gravity * L;
  }
  const test::Resultant reactions = test::reaction_resultant(model, r.reactions);
  CHECK(reactions.force.z() == Approx(weight).epsilon(1e-10));
  CHECK(reactions.force.head<2>().norm() <= 1e-9 * weight);

  // A vertical column under self weight alone: N varies linearly, compression at the base.
  FrameModel column = test::single_member(V(0, 0, 0), V(0, 0, 4));
  column.supports = {test::support(0, test::fixed_all)};
  column.cases = {lc};
  const LineResult mr = stepframe::testing::recovered(column, solve(column)).at(0).elements.at(0);
  const Section s = test::test_section();
  const double g = s.A * test::test_steel().density * standard_gravity;
  for (const Station& st : mr.stations) CHECK(st.forces(0) == Approx(-g * (4 - st.x)).margin(1e-9 * g));
}
