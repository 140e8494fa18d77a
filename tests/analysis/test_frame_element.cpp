// The 12-DOF element on its own: symmetry, rigid-body motions free of force
// (a property every consistent stiffness must have; common practice), the
// closed-form stiffness terms of Euler-Bernoulli beam theory, and the
// equivalent nodal loads of a uniform load (fixed-end actions w L/2 and
// w L^2/12; standard beam theory, common practice).

#include "frame_fixtures.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/geometric_stiffness.hpp"
#include "stepframe/analysis/local_axes.hpp"

#include <catch2/catch.hpp>

#include <cmath>

using namespace stepframe::analysis;

namespace {

ElementProperties sample_properties() {
  return element_properties(test::test_section(), test::test_steel(), 4.0);
}

}  // namespace

TEST_CASE("element stiffness is symmetric with the closed-form diagonal", "[analysis][element]") {
  const ElementProperties p = sample_properties();
  const Matrix12d k = local_stiffness(p);
  REQUIRE((k - k.transpose()).norm() <= 1e-12 * k.norm());
  const double L = p.length;
  // Bar EA/L, torsion GJ/L, bending 12EI/L^3 and 4EI/L (standard beam theory).
  CHECK(k(0, 0) == Approx(p.E * p.A / L).epsilon(1e-14));
  CHECK(k(3, 3) == Approx(p.G * p.J / L).epsilon(1e-14));
  CHECK(k(1, 1) == Approx(12 * p.E * p.Iz / (L * L * L)).epsilon(1e-14));
  CHECK(k(2, 2) == Approx(12 * p.E * p.Iy / (L * L * L)).epsilon(1e-14));
  CHECK(k(5, 5) == Approx(4 * p.E * p.Iz / L).epsilon(1e-14));
  CHECK(k(4, 4) == Approx(4 * p.E * p.Iy / L).epsilon(1e-14));
  // Carry-over moments 2EI/L.
  CHECK(k(5, 11) == Approx(2 * p.E * p.Iz / L).epsilon(1e-14));
  CHECK(k(4, 10) == Approx(2 * p.E * p.Iy / L).epsilon(1e-14));
}

TEST_CASE("rigid-body motions produce no end forces", "[analysis][element]") {
  const ElementProperties p = sample_properties();
  const Matrix12d k = local_stiffness(p);
  const double L = p.length, theta = 1e-3;
  const double scale = k.cwiseAbs().maxCoeff() * theta * L;

  Vector12d about_z = Vector12d::Zero();  // rotation about local z: v = theta x, rz = theta
  about_z(5) = theta;
  about_z(7) = theta * L;
  about_z(11) = theta;
  CHECK((k * about_z).norm() <= 1e-12 * scale);

  Vector12d about_y = Vector12d::Zero();  // rotation about local y: w = -theta x, ry = theta
  about_y(4) = theta;
  about_y(8) = -theta * L;
  about_y(10) = theta;
  CHECK((k * about_y).norm() <= 1e-12 * scale);

  Vector12d about_x = Vector12d::Zero();  // rotation about the axis: rx equal at both ends
  about_x(3) = about_x(9) = theta;
  CHECK((k * about_x).norm() <= 1e-12 * scale);

  // Global check: T^T k T of an inclined, rolled member annihilates any rigid
  // motion u_i = t + omega x p_i, r_i = omega.
  const Eigen::Vector3d a(1, -2, 0.5), b(3.5, 1, 4);
  ElementProperties q = p;
  q.length = (b - a).norm();
  const Matrix12d t = transformation(local_axes(a, b, 0.7));
  const Matrix12d kg = t.transpose() * local_stiffness(q) * t;
  const Eigen::Vector3d shift(1e-3, -2e-3, 3e-3), omega(2e-3, 1e-3, -1.5e-3);
  Vector12d rigid;
  rigid << shift + omega.cross(a), omega, shift + omega.cross(b), omega;
  CHECK((kg * rigid).norm() <= 1e-11 * kg.cwiseAbs().maxCoeff() * rigid.norm());
}

TEST_CASE("to_global and to_local by 3 x 3 blocks equal the dense products with T", "[analysis][element]") {
  // An inclined, rolled member's axes and a full local matrix (the stiffness plus a geometric part,
  // every block non-zero after rotation) and vector: the block forms against T^T k T, T^T v and T u.
  const ElementProperties p = sample_properties();
  const Eigen::Matrix3d axes = local_axes(Eigen::Vector3d(1, -2, 0.5), Eigen::Vector3d(3.5, 1, 4), 0.7);
  const Matrix12d t = transformation(axes);
  const Matrix12d k = local_stiffness(p) + local_geometric_stiffness(p, -3e5);
  Vector12d v;
  for (int i = 0; i < 12; ++i) v(i) = std::sin(1.0 + static_cast<double>(i));
  const Matrix12d dense = t.transpose() * k * t;
  CHECK((to_global(axes, k) - dense).norm() <= 1e-14 * dense.norm());
  CHECK((to_global(axes, v) - t.transpose() * v).norm() <= 1e-15 * v.norm());
  CHECK((to_local(axes, v) - t * v).norm() <= 1e-15 * v.norm());
  CHECK((to_local(axes, to_global(axes, v)) - v).norm() <= 1e-15 * v.norm());  // R R^T = I
  // An axis-aligned member keeps its exact zeros (the assembly leaves zero entries out).
  const Eigen::Matrix3d along_x = local_axes(Eigen::Vector3d(0, 0, 0), Eigen::Vector3d(4, 0, 0), 0.0);
  const Matrix12d aligned = to_global(along_x, local_stiffness(p));
  const Matrix12d aligned_dense = transformation(along_x).transpose() * local_stiffness(p) * transformation(along_x);
  CHECK(((aligned.array() == 0) == (aligned_dense.array() == 0)).all());
}

TEST_CASE("equivalent nodal loads of a uniform load", "[analysis][element]") {
  const double L = 5.0;
  const Eigen::Vector3d q(1.5e3, -2e3, -3e3);
  const Vector12d f = equivalent_nodal_loads(L, q);
  // Forces: half the load to each end.
  CHECK(f(0) == Approx(q.x() * L / 2));
  CHECK(f(6) == Approx(q.x() * L / 2));
  CHECK(f(1) == Approx(q.y() * L / 2));
  CHECK(f(7) == Approx(q.y() * L / 2));
  CHECK(f(2) == Approx(q.z() * L / 2));
  CHECK(f(8) == Approx(q.z() * L / 2));
  // Moments w L^2/12: in the x-y plane +q_y L^2/12 about z at the start and
  // the opposite at the end; in the x-z plane the mirror image (ry = -dw/dx).
  CHECK(f(5) == Approx(q.y() * L * L / 12));
  CHECK(f(11) == Approx(-q.y() * L * L / 12));
  CHECK(f(4) == Approx(-q.z() * L * L / 12));
  CHECK(f(10) == Approx(q.z() * L * L / 12));
  CHECK(f(3) == 0.0);
  CHECK(f(9) == 0.0);
  // Work-consistency: the loads do the same work as q on the rigid rotation about
  // the member's midpoint (zero, by symmetry of the uniform load).
  const double theta = 1e-3;
  Vector12d about_mid_z = Vector12d::Zero();
  about_mid_z(1) = -theta * L / 2;
  about_mid_z(5) = theta;
  about_mid_z(7) = theta * L / 2;
  about_mid_z(11) = theta;
  CHECK(f.dot(about_mid_z) == Approx(0.0).margin(1e-9));
}
