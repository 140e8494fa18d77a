#pragma once
// The largest eigenvalue of a small symmetric matrix (the lateral-torsional Mcr's eigenproblem).

#include <Eigen/Core>

namespace stepframe::analysis::detail {

/// Matrices and vectors of at most 64 rows and columns, kept on the stack (no heap traffic for the
/// small eigenproblem solved for every member and load result).
constexpr int small_most = 64;
using SmallMatrix = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, 0, small_most, small_most>;
using SmallVector = Eigen::Matrix<double, Eigen::Dynamic, 1, 0, small_most, 1>;

/// The largest eigenvalue of the symmetric matrix `a` (both triangles read, at least 1 x 1): Householder
/// reduction to tridiagonal form, then bisection on the Sturm sequence count to two adjacent doubles
/// (Golub & Van Loan, Matrix Computations, 4th ed. 2013, 8.3.1 and 8.4.1; from memory). Only the one
/// eigenvalue is wanted: no QR sweeps for the rest.
double largest_eigenvalue(const SmallMatrix& a);

}  // namespace stepframe::analysis::detail
