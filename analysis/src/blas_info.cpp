#include "stepframe/analysis/blas_info.hpp"

#include "stepframe/analysis/blas_kernels.hpp"

#include <fmt/format.h>

#include <strings.h>

#ifdef STEPFRAME_HAVE_OPENBLAS
// OpenBLAS' own query functions (its cblas.h names them; declared here so that no
// OpenBLAS header is needed).
extern "C" {
char* openblas_get_config(void);
char* openblas_get_corename(void);
int openblas_get_num_threads(void);
int openblas_get_parallel(void);
void openblas_set_num_threads(int num_threads);
}
#endif

namespace stepframe::analysis {

bool optimised_blas() {
#ifdef STEPFRAME_HAVE_OPENBLAS
  return true;
#else
  return false;
#endif
}

std::string blas_description() {
#ifdef STEPFRAME_HAVE_OPENBLAS
  const int parallel = openblas_get_parallel();  // 0 sequential, 1 pthreads, 2 OpenMP
  const char* how = parallel == 1 ? "pthreads" : parallel == 2 ? "OpenMP" : "sequential";
  return fmt::format("OpenBLAS ({}; {}, {} thread(s), core {})", openblas_get_config(), how,
                     openblas_get_num_threads(), blas_core_name());
#else
  return "the reference BLAS (this build found no OpenBLAS: large factorisations are several times slower; "
         "install libopenblas-dev and rebuild)";
#endif
}

std::string blas_core_name() {
#ifdef STEPFRAME_HAVE_OPENBLAS
  return openblas_get_corename();
#else
  return {};
#endif
}

std::string blas_kernel_advice() {
#ifdef STEPFRAME_HAVE_OPENBLAS
  const std::string_view best = openblas_core_for(this_processor());
  const std::string used = blas_core_name();
  if (best.empty() || strcasecmp(used.c_str(), "Prescott") != 0) return {};
  return fmt::format("OpenBLAS runs its oldest kernels ({}, SSE3) on a processor with better ones, and the "
                     "factorisation takes about twice as long: set OPENBLAS_CORETYPE={} in the environment before "
                     "the process starts (the stepframe command does so unless it is set already)",
                     used, best);
#else
  return {};
#endif
}

void set_blas_threads(int threads) {
#ifdef STEPFRAME_HAVE_OPENBLAS
  openblas_set_num_threads(threads);
#else
  (void)threads;
#endif
}

int blas_threads() {
#ifdef STEPFRAME_HAVE_OPENBLAS
  return openblas_get_num_threads();
#else
  return 1;
#endif
}

}  // namespace stepframe::analysis
