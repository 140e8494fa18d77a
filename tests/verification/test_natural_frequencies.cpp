// Natural frequencies against published formulas:
//  - beams: f_n = lambda_n^2 / (2 pi L^2) sqrt(E I / m), with lambda_n = n pi for a simply supported
//    beam and 1.87510, 4.69409, 7.85476 for a cantilever (Blevins, Formulas for Natural Frequency and
//    Mode Shape, 1979, Table 8-1; the cantilever's lambda values from memory), tolerance 0.2%;
//  - a one-storey portal with a rigid beam carrying a lumped mass M on massless columns fixed at
//    their feet: k = 24 E I_c / h^3, f = sqrt(k / M) / (2 pi) (Chopra, Dynamics of Structures,
//    4th ed. 2012, sec. 1.3, lateral stiffness of a one-storey frame), tolerance 0.2% (the beam is
//    1000 times stiffer than a column, not rigid: 0.05% by the same section's formula with rho);
//  - participating masses: over all modes they sum to the mass that moves in each direction
//    (Chopra 2012, sec. 13.2.5), to 1e-9.

#include "verification_models.hpp"
#include "stepframe/analysis/natural_frequencies.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>

using namespace stepframe::analysis;
using namespace stepframe::analysis::verification;

namespace {

constexpr double pi = std::numbers::pi;

// Share of a mode's squared translations along Z (model nodes and inner points).
double share_z(const VibrationMode& mode) {
  double z = 0, all = 0;
  auto add = [&](const Eigen::Vector3d& u) {
    z += u.z() * u.z();
    all += u.squaredNorm();
  };
  for (Eigen::Index n = 0; n < mode.shape.displacements.size() / 6; ++n) add(mode.shape.displacements.segment<3>(6 * n));
  for (const auto& element : mode.shape.inner_points)
    for (const auto& p : element) add(p.head<3>());
  return all > 0 ? z / all : 0;
}

std::vector<double> vertical_frequencies(const ModalResult& r) {
  std::vector<double> f;
  for (const auto& m : r.modes)
    if (share_z(m) > 0.99) f.push_back(m.frequency);
  return f;
}

// Torsion made stiff (a closed-section J) so that torsional modes stay above the bending ones tested.
Section stiff_torsion_section() {
  Section s = beam_section();
  s.J = 2 * (s.Iy + s.Iz);
  return s;
}

}  // namespace

TEST_CASE("simply supported beam: f_n = n^2 pi / (2 L^2) sqrt(E I / m) (Blevins 1979, Table 8-1)",
          "[verification][modes]") {
  const double L = 6;
  FrameModel model = beam_along_x({0, 1.5, 3, 4.5, 6}, stiff_torsion_section());
  model.supports = {support(0, pin), support(4, roller)};
  ModalOptions options;
  options.modes = 14;
  const ModalResult r = natural_frequencies(model, {}, options);
  const Section s = model.sections[0];
  const double m = s.A * steel().density;  // kg/m
  const auto f = vertical_frequencies(r);
  REQUIRE(f.size() >= 3);
  for (int n = 1; n <= 3; ++n) {
    const double exact = n * n * pi / (2 * L * L) * std::sqrt(E * s.Iy / m);
    CHECK(f[static_cast<std::size_t>(n - 1)] == Approx(exact).epsilon(0.002));
  }
  // The total mass is the beam's, rho A L.
  CHECK(r.total_mass == Approx(m * L).epsilon(1e-12));
}

TEST_CASE("cantilever: lambda = 1.87510, 4.69409, 7.85476 (Blevins 1979, Table 8-1, from memory)", "[verification][modes]") {
  const double L = 4;
  FrameModel model = beam_along_x({0, 1, 2, 3, 4}, stiff_torsion_section());
  model.supports = {support(0, fixed)};
  ModalOptions options;
  options.modes = 14;
  const ModalResult r = natural_frequencies(model, {}, options);
  const Section s = model.sections[0];
  const double m = s.A * steel().density;
  const auto f = vertical_frequencies(r);
  REQUIRE(f.size() >= 3);
  const double lambda[] = {1.87510, 4.69409, 7.85476};
  for (std::size_t n = 0; n < 3; ++n) {
    const double exact = lambda[n] * lambda[n] / (2 * pi * L * L) * std::sqrt(E * s.Iy / m);
    CHECK(f[n] == Approx(exact).epsilon(0.002));
  }
  // An added mass per length of m doubles the mass: every frequency falls by sqrt(2) (f ~ 1 / sqrt(m)).
  AddedMass added;
  added.per_length.assign(model.elements.size(), m);
  const auto heavy = vertical_frequencies(natural_frequencies(model, added, options));
  REQUIRE(heavy.size() >= 1);
  CHECK(heavy[0] == Approx(f[0] / std::sqrt(2.0)).epsilon(1e-9));
}

TEST_CASE("portal sway with a lumped mass: k = 24 E Ic / h^3 (Chopra 2012, sec. 1.3)", "[verification][modes]") {
  const double h = 4, span = 4, M = 20000;  // kg on the beam
  FrameModel model;
  model.nodes = {{0, 0, 0}, {0, 0, h}, {span, 0, h}, {span, 0, 0}};
  Section column = beam_section();
  column.A *= 1000;  // axially rigid columns, as the formula assumes (their shortening would add 2% of sway)
  Section beam = column;
  beam.Iy = 1000 * column.Iy;

  Material light = steel();
  light.density = 1e-6;  // massless members: the mass is the lumped M
  model.sections = {column, beam};
  model.materials = {light};
  // Columns with local z along global X (bending about Iy in the frame's plane), beam likewise.
  model.elements = {FrameElement{{0, 1}, 0, 0, 0.0, {}}, FrameElement{{1, 2}, 1, 0, 0.0, {}},
                    FrameElement{{3, 2}, 0, 0, 0.0, {}}};
  model.supports = {support(0, fixed), support(3, fixed)};
  // Out of the frame's plane: held at the beam level (a 2D frame).
  Support hold1 = support(1, in_plane_only), hold2 = support(2, in_plane_only);
  model.supports.push_back(hold1);
  model.supports.push_back(hold2);
  AddedMass added;
  added.at_node = {0, M / 2, M / 2, 0};
  ModalOptions options;
  options.modes = 1;
  const ModalResult r = natural_frequencies(model, added, options);
  REQUIRE(r.modes.size() == 1);
  // A vertical member's depth (local z) lies along global X (local_axes.hpp): sway along X bends the columns
  // about their local y, with Iy.
  const double k = 24 * E * column.Iy / (h * h * h);
  CHECK(r.modes[0].frequency == Approx(std::sqrt(k / M) / (2 * pi)).epsilon(0.002));
  // The sway mode carries all the mass along X.
  CHECK(r.modes[0].mass_ratio[0] == Approx(1.0).epsilon(1e-3));
}

TEST_CASE("participating masses over all modes sum to the moving mass (Chopra 2012, sec. 13.2.5)", "[verification][modes]") {
  // A small space frame: four columns 3 m high, beams around the top, a point mass at one corner.
  FrameModel model;
  model.nodes = {{0, 0, 0}, {4, 0, 0}, {4, 3, 0}, {0, 3, 0}, {0, 0, 3}, {4, 0, 3}, {4, 3, 3}, {0, 3, 3}};
  model.sections = {beam_section()};
  model.materials = {steel()};
  for (std::size_t i = 0; i < 4; ++i) {
    model.elements.push_back(FrameElement{{i, i + 4}, 0, 0, 0.0, {}});
    model.elements.push_back(FrameElement{{i + 4, (i + 1) % 4 + 4}, 0, 0, 0.0, {}});
    model.supports.push_back(support(i, fixed));
  }
  AddedMass added;
  added.at_node.assign(8, 0.0);
  added.at_node[6] = 1500;
  ModalOptions options;
  options.parts = 2;
  options.modes = 10000;  // all of them (dense)
  const ModalResult r = natural_frequencies(model, added, options);
  const double members = 4 * 3 * 5.0e-3 * 7850 + 2 * (4 + 3) * 5.0e-3 * 7850;
  CHECK(r.total_mass == Approx(members + 1500).epsilon(1e-12));
  for (std::size_t axis = 0; axis < 3; ++axis) {
    double sum = 0, ratios = 0;
    for (const auto& m : r.modes) {
      sum += m.effective_mass[axis];
      ratios += m.mass_ratio[axis];
    }
    CHECK(sum == Approx(r.moving_mass[axis]).epsilon(1e-9));
    CHECK(ratios == Approx(1.0).epsilon(1e-9));
    CHECK(r.moving_mass[axis] < r.total_mass);  // the columns' feet sit on the supports
  }
}

TEST_CASE("shift-invert Lanczos and the dense solver agree", "[verification][modes]") {
  FrameModel model = beam_along_x({0, 2, 4, 6, 8, 10, 12});
  model.supports = {support(0, fixed), support(3, pin), support(6, fixed)};
  ModalOptions dense, lanczos;
  dense.modes = lanczos.modes = 6;
  lanczos.dense_limit = 0;
  const auto a = natural_frequencies(model, {}, dense), b = natural_frequencies(model, {}, lanczos);
  REQUIRE(a.modes.size() == 6);
  REQUIRE(b.modes.size() == 6);
  for (std::size_t i = 0; i < 6; ++i) {
    CHECK(b.modes[i].frequency == Approx(a.modes[i].frequency).epsilon(1e-8));
    for (std::size_t axis = 0; axis < 3; ++axis)
      CHECK(b.modes[i].effective_mass[axis] == Approx(a.modes[i].effective_mass[axis]).margin(1e-6 * a.total_mass));
  }
}
