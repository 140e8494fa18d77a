#pragma once
// Which of OpenBLAS' kernel sets a processor runs best. OpenBLAS built for many processors (Debian's
// package, DYNAMIC_ARCH) picks its kernels when it loads, from the processor's family and model numbers;
// a processor newer than the release gets its oldest set instead, SSE3 ("Prescott"): Debian 12's 0.3.21
// does that on Intel's 2023 server processors, and the 10,000-member bench frame's factorisation then
// takes 0.72 s instead of 0.35 s. The set can be named before the process starts, in the environment
// variable OPENBLAS_CORETYPE (OpenBLAS, USAGE.md: "How to choose TARGET manually at runtime when compiled
// with DYNAMIC_ARCH"); the `stepframe` command does so from the processor's instruction sets below.
//
// Header-only: the command's launcher uses it without linking the engine's libraries.

#include <string_view>

namespace stepframe::analysis {

/// The instruction sets that decide the choice, as the processor offers them and the operating system
/// saves their registers.
struct ProcessorFeatures {
  bool amd = false;     ///< made by AMD (OpenBLAS tunes its AVX2 kernels for AMD's cores separately)
  bool avx2 = false;    ///< AVX2
  bool fma = false;     ///< FMA3
  bool avx512 = false;  ///< AVX-512 F, CD, DQ, BW and VL together (the Skylake-X set)
};

/// The OPENBLAS_CORETYPE name of the best kernels `cpu` can run, or "" when it has no AVX2 and FMA (then
/// OpenBLAS' own choice stands). The sets are OpenBLAS' (README, "Additional supported CPUs"): SkylakeX
/// needs AVX-512, Haswell and Zen (the same kernels, AMD's blocking) AVX2 and FMA.
constexpr std::string_view openblas_core_for(const ProcessorFeatures& cpu) {
  if (cpu.avx512 && cpu.avx2 && cpu.fma) return "SkylakeX";
  if (cpu.avx2 && cpu.fma) return cpu.amd ? "Zen" : "Haswell";
  return "";
}

/// This processor's features, from GCC's processor checks (which count a set only when the operating
/// system saves its registers); none on other architectures.
inline ProcessorFeatures this_processor() {
  ProcessorFeatures cpu;
#if defined(__x86_64__) && defined(__GNUC__)
  __builtin_cpu_init();
  cpu.amd = __builtin_cpu_is("amd");
  cpu.avx2 = __builtin_cpu_supports("avx2");
  cpu.fma = __builtin_cpu_supports("fma");
  cpu.avx512 = __builtin_cpu_supports("avx512f") && __builtin_cpu_supports("avx512cd") &&
               __builtin_cpu_supports("avx512dq") && __builtin_cpu_supports("avx512bw") &&
               __builtin_cpu_supports("avx512vl");
#endif
  return cpu;
}

}  // namespace stepframe::analysis
