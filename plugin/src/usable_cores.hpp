#pragma once
// How many cores a run can compute on right now without taking one from
// anything else on the machine.

namespace stepframe::detail {

/// The cores of this process's CPU set (sched_getaffinity(2)) less those the
/// rest of the system keeps busy now: the runnable threads of /proc/loadavg
/// (proc(5); it counts the calling thread too), the highest of a few samples a
/// millisecond apart. At least 1, the calling thread's own core; 1 where
/// either cannot be read (not Linux).
int usable_cores_now();

}  // namespace stepframe::detail
