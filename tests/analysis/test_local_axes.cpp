// Member local axes: the convention written in local_axes.hpp (horizontal
// members keep y horizontal and z up; vertical members put z along global X;
// roll turns y and z about x by the right-hand rule). Reference values are
// elementary vector geometry (common practice).

#include "stepframe/analysis/local_axes.hpp"

#include <catch2/catch.hpp>

#include <Eigen/Geometry>

#include <numbers>

using stepframe::analysis::local_axes;
using V = Eigen::Vector3d;

namespace {

constexpr double tol = 1e-12;  // exact geometry; only rounding

void require_vector(const Eigen::Vector3d& actual, const Eigen::Vector3d& expected) {
  INFO("actual " << actual.transpose() << " expected " << expected.transpose());
  REQUIRE((actual - expected).norm() < tol);
}

void require_right_handed_orthonormal(const Eigen::Matrix3d& r) {
  REQUIRE((r * r.transpose() - Eigen::Matrix3d::Identity()).norm() < tol);
  REQUIRE(r.determinant() == Approx(1.0).epsilon(1e-12));
}

}  // namespace

TEST_CASE("horizontal member along X: y horizontal, z up", "[analysis][local_axes]") {
  const Eigen::Matrix3d r = local_axes(V(1, 2, 3), V(5, 2, 3), 0);
  require_vector(r.row(0).transpose(), V::UnitX());
  require_vector(r.row(1).transpose(), V::UnitY());
  require_vector(r.row(2).transpose(), V::UnitZ());
  require_right_handed_orthonormal(r);
}

TEST_CASE("horizontal member along Y: y = Z x x = -X, z up", "[analysis][local_axes]") {
  const Eigen::Matrix3d r = local_axes(V(0, 0, 0), V(0, 3, 0), 0);
  require_vector(r.row(0).transpose(), V::UnitY());
  require_vector(r.row(1).transpose(), -V::UnitX());
  require_vector(r.row(2).transpose(), V::UnitZ());
}

TEST_CASE("sloping member: y stays horizontal and z points upwards", "[analysis][local_axes]") {
  const V a(0.5, -1, 2), b(3.5, 1.5, 4.0);
  const Eigen::Matrix3d r = local_axes(a, b, 0);
  require_vector(r.row(0).transpose(), (b - a).normalized());
  REQUIRE(std::abs(r(1, 2)) < tol);  // y has no Z component
  REQUIRE(r(2, 2) > 0);              // z has an upward component
  require_right_handed_orthonormal(r);
}

TEST_CASE("vertical member: z along global X", "[analysis][local_axes]") {
  SECTION("pointing up") {
    const Eigen::Matrix3d r = local_axes(V(2, 2, 0), V(2, 2, 4), 0);
    require_vector(r.row(0).transpose(), V::UnitZ());
    require_vector(r.row(2).transpose(), V::UnitX());
    require_vector(r.row(1).transpose(), -V::UnitY());  // y = z x x = X x Z
    require_right_handed_orthonormal(r);
  }
  SECTION("pointing down") {
    const Eigen::Matrix3d r = local_axes(V(2, 2, 4), V(2, 2, 0), 0);
    require_vector(r.row(0).transpose(), -V::UnitZ());
    require_vector(r.row(2).transpose(), V::UnitX());
    require_vector(r.row(1).transpose(), V::UnitY());  // X x (-Z) = Y
    require_right_handed_orthonormal(r);
  }
}

TEST_CASE("roll of 90 degrees turns y onto z and z onto -y", "[analysis][local_axes]") {
  const double quarter = std::numbers::pi / 2;
  const Eigen::Matrix3d r = local_axes(V(0, 0, 0), V(6, 0, 0), quarter);
  require_vector(r.row(0).transpose(), V::UnitX());
  require_vector(r.row(1).transpose(), V::UnitZ());
  require_vector(r.row(2).transpose(), -V::UnitY());

  const Eigen::Matrix3d vertical = local_axes(V(0, 0, 0), V(0, 0, 3), quarter);
  require_vector(vertical.row(1).transpose(), V::UnitX());  // unrolled z
  require_vector(vertical.row(2).transpose(), V::UnitY());  // minus unrolled y
}

TEST_CASE("zero-length member is rejected", "[analysis][local_axes]") {
  REQUIRE_THROWS_AS(local_axes(V(1, 1, 1), V(1, 1, 1), 0), std::invalid_argument);
}

TEST_CASE("a column a little out of plumb is oriented as a plumb one", "[analysis][local_axes]") {
  using stepframe::analysis::ambiguous_inclination;
  using stepframe::analysis::angle_from_vertical;
  using stepframe::analysis::is_vertical;
  using stepframe::analysis::vertical_tolerance;
  // A 3 m column whose top drifts 0.01 mm or 1 mm in X or Y: local z stays within the drift angle of
  // global X (square to the member), y within it of -Y, as for the plumb column above.
  for (const V& drift : {V(1e-5, 0, 0), V(0, 1e-5, 0), V(1e-3, 0, 0), V(0, -1e-3, 0), V(7e-4, 7e-4, 0)}) {
    const V top = V(0, 0, 3) + drift;
    INFO("drift " << drift.transpose());
    REQUIRE(is_vertical(V::Zero(), top));
    const Eigen::Matrix3d r = local_axes(V::Zero(), top, 0);
    require_right_handed_orthonormal(r);
    const double angle = drift.norm() / 3;  // small-angle: drift over height
    CHECK((r.row(2).transpose() - V::UnitX()).norm() < 1.01 * angle + tol);
    CHECK((r.row(1).transpose() + V::UnitY()).norm() < 1.01 * angle + tol);
    CHECK(std::abs(r.row(2).dot(r.row(0))) < tol);  // z square to the member
  }
  // The tolerance is an angle: 0.25 degrees either side, at any height; beyond it a member is inclined.
  CHECK(angle_from_vertical(V::Zero(), V(0, 0, 3)) == 0.0);
  CHECK(angle_from_vertical(V::Zero(), V(3, 0, 0)) == Approx(std::numbers::pi / 2));
  CHECK(angle_from_vertical(V::Zero(), V(1, 0, -1)) == Approx(std::numbers::pi / 4));
  const double inside = std::tan(0.99 * vertical_tolerance), outside = std::tan(1.01 * vertical_tolerance);
  CHECK(is_vertical(V::Zero(), V(0, 10 * inside, -10)));
  CHECK_FALSE(is_vertical(V::Zero(), V(0, 10 * outside, -10)));
  CHECK(ambiguous_inclination > vertical_tolerance);
}
