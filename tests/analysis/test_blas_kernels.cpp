// Which of OpenBLAS' kernel sets the `stepframe` command names for a processor. The instruction sets each
// set needs are OpenBLAS' own (README, "Additional supported CPUs": Haswell "with AVX2 and FMA", Skylake-X
// "with AVX512 and FMA"; the Zen target runs the Haswell kernels with AMD's blocking, driver/others/
// dynamic.c), and OPENBLAS_CORETYPE takes the names OpenBLAS reports (USAGE.md, "How to choose TARGET
// manually at runtime when compiled with DYNAMIC_ARCH").

#include "stepframe/analysis/blas_kernels.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;

TEST_CASE("OpenBLAS' kernels are named from the processor's instruction sets", "[analysis][blas]") {
  ProcessorFeatures sse_only;  // e.g. an early x86-64 processor: OpenBLAS' own choice stands
  CHECK(openblas_core_for(sse_only).empty());

  ProcessorFeatures avx2{false, true, true, false};
  CHECK(openblas_core_for(avx2) == "Haswell");
  avx2.amd = true;
  CHECK(openblas_core_for(avx2) == "Zen");

  ProcessorFeatures avx2_without_fma{false, true, false, false};  // Haswell's kernels use FMA
  CHECK(openblas_core_for(avx2_without_fma).empty());

  const ProcessorFeatures avx512{false, true, true, true};
  CHECK(openblas_core_for(avx512) == "SkylakeX");
  // AMD's cores with AVX-512 run the same kernels (from memory: later OpenBLAS releases pick SkylakeX's
  // kernels for AMD's Zen 4 themselves).
  const ProcessorFeatures amd_avx512{true, true, true, true};
  CHECK(openblas_core_for(amd_avx512) == "SkylakeX");
}
