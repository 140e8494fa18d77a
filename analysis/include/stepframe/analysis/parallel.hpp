#pragma once
// Independent work items spread over the processor's cores.

#include <cstddef>
#include <functional>

namespace stepframe::analysis {

/// Calls body(i) for every i in [0, count), spread over the cores (OpenMP,
/// dynamic chunks; OMP_NUM_THREADS limits the threads). The items must be
/// independent: a body that writes only to the slots of its own i gives the
/// same results, in the same order, whatever the number of threads.
/// `progress`, when given, is called with the fraction done, from the calling
/// thread only (so it may be a caller's progress callback). The first
/// exception a body or `progress` throws stops the loop (bodies already
/// running finish) and is rethrown on the calling thread.
void parallel_for(std::size_t count, const std::function<void(std::size_t)>& body,
                  const std::function<void(double)>& progress = {});

}  // namespace stepframe::analysis
