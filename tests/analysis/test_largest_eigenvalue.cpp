// The largest eigenvalue of a small symmetric matrix (behind every lateral-torsional Mcr), against
// Eigen's SelfAdjointEigenSolver (implicit symmetric QR: an independent algorithm) and closed forms.

#include "largest_eigenvalue.hpp"

#include <catch2/catch.hpp>

#include <Eigen/Eigenvalues>
#include <Eigen/SVD>

#include <cmath>
#include <random>
#include <stdexcept>

using stepframe::analysis::detail::largest_eigenvalue;
using stepframe::analysis::detail::SmallMatrix;

namespace {

SmallMatrix random_symmetric(Eigen::Index n, std::mt19937& random) {
  std::uniform_real_distribution<double> value(-1.0, 1.0);
  SmallMatrix a(n, n);
  for (Eigen::Index j = 0; j < n; ++j)
    for (Eigen::Index i = j; i < n; ++i) a(i, j) = a(j, i) = value(random);
  return a;
}

double largest_by_qr(const SmallMatrix& a) {
  const Eigen::MatrixXd dense = a;
  return Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd>(dense, Eigen::EigenvaluesOnly).eigenvalues().maxCoeff();
}

}  // namespace

TEST_CASE("the largest eigenvalue of random symmetric matrices of 1 to 64 rows agrees with symmetric QR",
          "[analysis][eigenvalue]") {
  // Both are backward stable: they agree to a small multiple of the rounding unit times the norm.
  std::mt19937 random(20261203);
  for (Eigen::Index n = 1; n <= 64; ++n)
    for (int sample = 0; sample < 5; ++sample) {
      const SmallMatrix a = random_symmetric(n, random);
      const double norm = a.norm();
      INFO("n = " << n << ", sample " << sample);
      CHECK(std::abs(largest_eigenvalue(a) - largest_by_qr(a)) <= 1e-13 * norm);
    }
}

TEST_CASE("the largest eigenvalue in the shapes Mcr gives and in special cases", "[analysis][eigenvalue]") {
  std::mt19937 random(7);
  std::uniform_real_distribution<double> value(-1.0, 1.0);
  SECTION("[0 C; C^T 0] has the eigenvalues plus and minus the singular values of C") {
    // Golub & Van Loan, Matrix Computations, 4th ed. 2013, 8.6.1 (from memory): the largest is sigma_max(C).
    for (Eigen::Index n : {1, 3, 10, 32}) {
      Eigen::MatrixXd c(n, n);
      for (Eigen::Index j = 0; j < n; ++j)
        for (Eigen::Index i = 0; i < n; ++i) c(i, j) = value(random);
      SmallMatrix s = SmallMatrix::Zero(2 * n, 2 * n);
      s.topRightCorner(n, n) = c;
      s.bottomLeftCorner(n, n) = c.transpose();
      const double sigma = Eigen::JacobiSVD<Eigen::MatrixXd>(c).singularValues()(0);
      CHECK(largest_eigenvalue(s) == Approx(sigma).epsilon(1e-13));
    }
  }
  SECTION("a rank-one matrix v v^T: |v|^2, the others zero (common practice)") {
    Eigen::VectorXd v(12);
    for (Eigen::Index i = 0; i < v.size(); ++i) v(i) = value(random);
    const SmallMatrix a = v * v.transpose();
    CHECK(largest_eigenvalue(a) == Approx(v.squaredNorm()).epsilon(1e-13));
    CHECK(largest_eigenvalue(-a) == Approx(0.0).margin(1e-14 * v.squaredNorm()));
  }
  SECTION("matrices already tridiagonal or diagonal (no reflection needed), and zero") {
    SmallMatrix diagonal = SmallMatrix::Zero(6, 6);
    for (Eigen::Index i = 0; i < 6; ++i) diagonal(i, i) = static_cast<double>(i) - 2.5;
    CHECK(largest_eigenvalue(diagonal) == Approx(2.5).epsilon(1e-15));
    // The second-difference matrix tridiag(-1, 2, -1) of order n: 2 - 2 cos(n pi / (n + 1)) (common practice).
    const Eigen::Index n = 9;
    SmallMatrix second = SmallMatrix::Zero(n, n);
    for (Eigen::Index i = 0; i < n; ++i) {
      second(i, i) = 2;
      if (i + 1 < n) second(i, i + 1) = second(i + 1, i) = -1;
    }
    const double pi = 3.14159265358979323846;
    CHECK(largest_eigenvalue(second) == Approx(2 - 2 * std::cos(n * pi / (n + 1))).epsilon(1e-14));
    CHECK(largest_eigenvalue(SmallMatrix::Zero(4, 4)) == 0.0);
    SmallMatrix one(1, 1);
    one(0, 0) = -3.25;
    CHECK(largest_eigenvalue(one) == -3.25);
    CHECK_THROWS_AS(largest_eigenvalue(SmallMatrix(0, 0)), std::invalid_argument);
  }
}
