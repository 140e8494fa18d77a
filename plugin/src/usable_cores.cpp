#include "usable_cores.hpp"

#include <algorithm>
#include <chrono>
#include <fstream>
#include <thread>

#ifdef __linux__
#include <sched.h>
#endif

namespace stepframe::detail {

int usable_cores_now() {
#ifdef __linux__
  cpu_set_t set;
  CPU_ZERO(&set);
  if (sched_getaffinity(0, sizeof set, &set) != 0) return 1;
  const int cores = CPU_COUNT(&set);
  // /proc/loadavg: "0.52 0.58 0.59 1/467 12345", the fourth field runnable/all scheduling entities.
  int running = 0;
  for (int sample = 0; sample < 5; ++sample) {
    if (sample > 0) std::this_thread::sleep_for(std::chrono::milliseconds(1));
    std::ifstream in("/proc/loadavg");
    double average = 0;
    int now = 0;
    char slash = 0;
    if (!(in >> average >> average >> average >> now >> slash) || slash != '/') return 1;
    running = std::max(running, now);
  }
  return std::clamp(cores - (running - 1), 1, std::max(cores, 1));
#else
  return 1;
#endif
}

}  // namespace stepframe::detail
