#pragma once
// Which BLAS the sparse factorisation runs on. CHOLMOD spends nearly all of a
// large factorisation in dense BLAS kernels; the reference BLAS that Debian's
// SuiteSparse pulls in is four to seven times slower than OpenBLAS there.

#include <string>

namespace stepframe::analysis {

/// What the build links: "OpenBLAS 0.3.21 ... (pthreads, 2 threads, core Haswell)",
/// or a note that the reference BLAS is in use.
std::string blas_description();

/// True when OpenBLAS is linked.
bool optimised_blas();

/// Runs OpenBLAS' kernels on `threads` threads from now on. Process-wide (OpenBLAS
/// keeps one setting), so a library leaves this to its host; the command line
/// calls it. No effect without OpenBLAS.
void set_blas_threads(int threads);

/// The threads OpenBLAS' kernels run on now (1 without OpenBLAS).
int blas_threads();

}  // namespace stepframe::analysis
