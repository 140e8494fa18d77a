// The cores a run may widen its factorisation to: never fewer than its own, never more than its CPU set.

#include "usable_cores.hpp"

#include <catch2/catch.hpp>

#include <sched.h>

TEST_CASE("usable cores lie between the calling thread's own and the process's CPU set", "[plugin][cores]") {
  cpu_set_t set;
  CPU_ZERO(&set);
  REQUIRE(sched_getaffinity(0, sizeof set, &set) == 0);
  const int n = stepframe::detail::usable_cores_now();
  CHECK(n >= 1);
  CHECK(n <= CPU_COUNT(&set));
}
