// The `stepframe` command as users start it: it sets up the C library's allocator for a long numerical
// run and becomes the program proper, stepframe-engine beside it (exec: the same process, its arguments,
// its exit status and its signals).
//
// Why: a 10,000-member run touches half a gigabyte of fresh memory, and on 4 KiB pages every first
// touch is a page fault (some 136,000 of them, about a sixth of the run's time on the bench machine).
// glibc's malloc tunables (glibc manual, "Memory Allocation Tunables") ask for transparent huge pages
// on the heap and keep freed memory for reuse: the same run then takes some 9,000 faults and 15% less
// time, for about 8% more peak memory. Tunables are read only when a process starts, hence this step;
// the engine itself runs the same without them. A caller's own GLIBC_TUNABLES settings are kept, and
// win over these.
//
// It also names OpenBLAS' kernels for this processor (OPENBLAS_CORETYPE, read when OpenBLAS loads) unless
// the caller did: OpenBLAS falls back to its oldest kernels on processors newer than its release
// (analysis/include/stepframe/analysis/blas_kernels.hpp). It links no library of the engine, so that it
// starts in a few milliseconds.

#include "stepframe/analysis/blas_kernels.hpp"

#include <cerrno>
#include <climits>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <iterator>
#include <string>
#include <vector>
#include <unistd.h>

namespace {

// name=value pairs added to GLIBC_TUNABLES unless the caller set the name already.
constexpr const char* tunables[] = {
    "glibc.malloc.hugetlb=1",                 // madvise(MADV_HUGEPAGE) on the heap and on mmapped blocks
    "glibc.malloc.mmap_threshold=33554432",   // blocks up to 32 MiB from the heap (reused), not fresh mmaps
    "glibc.malloc.trim_threshold=268435456",  // up to 256 MiB free at the heap's top kept for reuse
    "glibc.malloc.top_pad=67108864",          // the heap grows 64 MiB at a time
};
// Also glibc.malloc.arena_max = the cores online (at least 2): the run's many threads (writers, the
// buckling task, the OpenMP team) then share a few heaps instead of up to 8 per core, which took the
// 100k bench frame's peak from 3.78 to 3.59 GiB at the same speed.

constexpr int internal_error = 4;  // the command line's status for "not the input's fault"

}  // namespace

int main(int, char** argv) {
  char self[PATH_MAX];
  const ssize_t n = readlink("/proc/self/exe", self, sizeof self - 1);
  if (n <= 0) {
    std::fprintf(stderr, "stepframe: cannot find its own location (/proc/self/exe): %s\n", std::strerror(errno));
    return internal_error;
  }
  self[n] = '\0';
  std::string engine(self);
  engine.replace(engine.rfind('/') + 1, std::string::npos, "stepframe-engine");

  const char* given = std::getenv("GLIBC_TUNABLES");
  std::string settings = given ? given : "";
  std::vector<std::string> wanted(std::begin(tunables), std::end(tunables));
  const long cores = sysconf(_SC_NPROCESSORS_ONLN);
  wanted.push_back("glibc.malloc.arena_max=" + std::to_string(cores > 2 ? cores : 2));
  for (const std::string& t : wanted) {
    const std::string name = t.substr(0, t.find('=') + 1);  // "glibc.malloc.x="
    if (settings.find(name) != std::string::npos) continue;
    if (!settings.empty()) settings += ':';
    settings += t;
  }
  setenv("GLIBC_TUNABLES", settings.c_str(), 1);
  if (!std::getenv("OPENBLAS_CORETYPE")) {
    const std::string_view core = stepframe::analysis::openblas_core_for(stepframe::analysis::this_processor());
    if (!core.empty()) setenv("OPENBLAS_CORETYPE", std::string(core).c_str(), 1);
  }
  execv(engine.c_str(), argv);
  std::fprintf(stderr, "stepframe: cannot start %s: %s (build or install it beside %s)\n", engine.c_str(),
               std::strerror(errno), self);
  return internal_error;
}
