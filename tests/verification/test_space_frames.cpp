// Three-dimensional frames checked by statics and symmetry (common practice):
// the reactions balance every applied load as forces and as moments about
// the origin, and a doubly symmetric frame under a doubly symmetric load
// responds symmetrically. The applied totals are computed here from the load
// definitions, independently of the solver's load conversion.

#include "verification_models.hpp"

#include <catch2/catch.hpp>

#include <Eigen/Geometry>

#include <cmath>

using namespace stepframe::analysis;
using namespace stepframe::analysis::verification;
using V = Eigen::Vector3d;

namespace {

// A table frame: four columns of height h at the corners of an a x b
// rectangle, four edge beams at the top. Nodes 0-3 at the feet, 4-7 at the heads.
FrameModel table(double a, double b, double h) {
  FrameModel m;
  const V corners[] = {V(0, 0, 0), V(a, 0, 0), V(a, b, 0), V(0, b, 0)};
  for (const V& c : corners) m.nodes.push_back(c);
  for (const V& c : corners) m.nodes.push_back(c + V(0, 0, h));
  m.sections = {beam_section()};
  m.materials = {steel()};
  for (std::size_t i = 0; i < 4; ++i) m.elements.push_back(FrameElement{{i, i + 4}, 0, 0, 0.0, {}});
  for (std::size_t i = 0; i < 4; ++i) m.elements.push_back(FrameElement{{4 + i, 4 + (i + 1) % 4}, 0, 0, 0.0, {}});
  for (std::size_t i = 0; i < 4; ++i) m.supports.push_back(support(i, fixed));
  return m;
}

struct Totals {
  V force = V::Zero();
  V moment = V::Zero();  // about the origin
};

Totals reactions(const FrameModel& m, const LoadResult& r) {
  Totals t;
  for (std::size_t n = 0; n < m.nodes.size(); ++n) {
    const V f = r.reactions.segment<3>(static_cast<Eigen::Index>(6 * n));
    t.force += f;
    t.moment += m.nodes[n].cross(f) + V(r.reactions.segment<3>(static_cast<Eigen::Index>(6 * n + 3)));
  }
  return t;
}

}  // namespace

TEST_CASE("doubly symmetric table frame under a symmetric load: equal feet, symmetric sway", "[verification][space]") {
  const double a = 6.0, b = 4.0, h = 3.5, w = 5e3;
  FrameModel m = table(a, b, h);
  LoadCase lc;
  lc.name = "w";
  for (std::size_t e = 4; e < 8; ++e) lc.element_loads.push_back({e, V(0, 0, -w)});
  m.cases = {lc};
  const auto r = solve_one(m);
  const double total = 2 * (a + b) * w;
  const Totals t = reactions(m, r);
  CHECK(t.force.z() == Approx(total).epsilon(1e-9));
  CHECK(t.force.head<2>().norm() < 1e-9 * total);
  CHECK(t.moment.norm() == Approx(V(total * b / 2, -total * a / 2, 0).norm()).epsilon(1e-9));
  for (std::size_t n = 1; n < 4; ++n) {
    CHECK(reaction(r, n, uz) == Approx(total / 4).epsilon(1e-9));
    CHECK(disp_z(r, 4 + n) == Approx(disp_z(r, 4)).epsilon(1e-9));
    // Mirror images: the feet's moments have equal size.
    CHECK(std::abs(reaction(r, n, rx)) == Approx(std::abs(reaction(r, 0, rx))).epsilon(1e-9));
    CHECK(std::abs(reaction(r, n, ry)) == Approx(std::abs(reaction(r, 0, ry))).epsilon(1e-9));
  }
  // Heads spread symmetrically: node 4 moves by (-d, -e), node 6 by (+d, +e).
  CHECK(r.displacements(6 * 4 + 0) == Approx(-r.displacements(6 * 6 + 0)).epsilon(1e-9));
  CHECK(r.displacements(6 * 4 + 1) == Approx(-r.displacements(6 * 6 + 1)).epsilon(1e-9));
}

TEST_CASE("skew space frame with every kind of member load: reactions balance the loads", "[verification][space]") {
  FrameModel m = table(5.0, 3.0, 4.0);
  m.nodes[6] += V(0.4, 0.3, 0.8);  // a skew, sloping head: members in general directions
  m.elements[0].roll = 0.4;
  LoadCase lc;
  lc.name = "mixed";
  const std::size_t sloping = 5;  // head 5 -> head 6, sloping
  const V p5 = m.nodes[5], p6 = m.nodes[6];
  const double L = (p6 - p5).norm();
  const V axis = (p6 - p5) / L;
  // Partial trapezoidal global load on [0.5, 2.5] m.
  lc.partial_loads.push_back(distributed(sloping, 0.5, 2.5, V(1e3, -2e3, -3e3), V(0, 1e3, -6e3)));
  // Point load at 1.2 m.
  lc.partial_loads.push_back(point(sloping, 1.2, V(4e3, 2e3, -9e3)));
  // Projected vertical load on the whole member: w per horizontal length.
  lc.partial_loads.push_back(distributed(sloping, 0, L, V(0, 0, -4e3), V(0, 0, -4e3), LoadAxes::projected));
  // Local load on a column: along its local y over [1, 3] m.
  lc.partial_loads.push_back(distributed(0, 1.0, 3.0, V(0, 2e3, 0), V(0, 2e3, 0), LoadAxes::local));
  lc.node_loads = {NodeLoad{7, V(3e3, 0, 0), V(0, 0, 2e3)}};
  lc.self_weight = true;
  m.cases = {lc};
  const auto r = solve_one(m);

  // Applied totals from the definitions.
  Totals applied;
  auto add_force = [&](const V& at, const V& f) {
    applied.force += f;
    applied.moment += at.cross(f);
  };
  // Trapezoid: resultant (wa + wb)/2 * c at the centroid of each component's trapezoid.
  {
    const double a = 0.5, c = 2.0;
    const V wa(1e3, -2e3, -3e3), wb(0, 1e3, -6e3);
    for (int i = 0; i < 3; ++i) {
      const double resultant = 0.5 * (wa(i) + wb(i)) * c;
      if (resultant == 0) continue;
      // Centroid of a trapezoid from its start: c (wa + 2 wb) / (3 (wa + wb)).
      const double xc = a + c * (wa(i) + 2 * wb(i)) / (3 * (wa(i) + wb(i)));
      add_force(p5 + xc * axis, resultant * V::Unit(i));
    }
  }
  add_force(p5 + 1.2 * axis, V(4e3, 2e3, -9e3));
  const double horizontal = (p6 - p5).head<2>().norm();
  add_force(p5 + 0.5 * L * axis, V(0, 0, -4e3 * horizontal));
  {
    const V c0 = m.nodes[0], c4 = m.nodes[4];
    // Local y of a vertical member (depth z along X, y = z x x; README) turned by the roll 0.4 about its axis.
    const V z0 = V::UnitX(), y0 = z0.cross(V::UnitZ());
    const V y = std::cos(0.4) * y0 + std::sin(0.4) * z0;
    add_force(c0 + 2.0 * (c4 - c0).normalized(), 2e3 * 2.0 * y);
  }
  add_force(m.nodes[7], V(3e3, 0, 0));
  applied.moment += V(0, 0, 2e3);
  const double weight_per_length = beam_section().A * 7850 * standard_gravity;
  for (std::size_t e = 0; e < m.elements.size(); ++e) {
    const V s = m.nodes[m.elements[e].nodes[0]], f = m.nodes[m.elements[e].nodes[1]];
    add_force(0.5 * (s + f), V(0, 0, -weight_per_length * (f - s).norm()));
  }

  const Totals t = reactions(m, r);
  const double scale = applied.force.norm();
  CHECK((t.force + applied.force).norm() < 1e-9 * scale);
  CHECK((t.moment + applied.moment).norm() < 1e-9 * scale * 5.0);
}
