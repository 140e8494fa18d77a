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

/// The kernel set OpenBLAS runs in this process, by the name OPENBLAS_CORETYPE takes ("SkylakeX",
/// "Haswell", ...); "" without OpenBLAS. Chosen when OpenBLAS loads: a child process started with
/// OPENBLAS_CORETYPE set to it rounds as this one does.
std::string blas_core_name();

/// "" or, when OpenBLAS runs its oldest kernels (SSE3, "Prescott": its choice on a processor newer than
/// its release) where the processor has better ones, what to set before the process starts (see
/// blas_kernels.hpp). The `stepframe` command sets it itself; a host of the library sets it in its own
/// environment.
std::string blas_kernel_advice();

/// Runs OpenBLAS' kernels on `threads` threads from now on. Process-wide (OpenBLAS
/// keeps one setting), so a library leaves this to its host; the command line
/// calls it. No effect without OpenBLAS.
void set_blas_threads(int threads);

/// The threads OpenBLAS' kernels run on now (1 without OpenBLAS).
int blas_threads();

}  // namespace stepframe::analysis
