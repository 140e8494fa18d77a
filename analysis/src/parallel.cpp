#include "stepframe/analysis/parallel.hpp"

#include <omp.h>

#include <atomic>
#include <exception>
#include <mutex>

namespace stepframe::analysis {

void parallel_for(std::size_t count, const std::function<void(std::size_t)>& body,
                  const std::function<void(double)>& progress) {
  if (count == 0) return;
  std::atomic<bool> stop{false};
  std::atomic<std::size_t> done{0};
  std::exception_ptr first_error;
  std::mutex error_mutex;
  auto keep = [&](std::exception_ptr error) {
    const std::lock_guard<std::mutex> lock(error_mutex);
    if (!first_error) first_error = std::move(error);
    stop = true;
  };
  const auto n = static_cast<long long>(count);
  // Chunks of a few dozen items keep the scheduling cost small against the work of one item.
#pragma omp parallel for schedule(dynamic, 32)
  for (long long i = 0; i < n; ++i) {
    if (stop.load(std::memory_order_relaxed)) continue;
    try {
      body(static_cast<std::size_t>(i));
      const std::size_t finished = done.fetch_add(1, std::memory_order_relaxed) + 1;
      // The thread that started the loop is thread 0 of the team: only it reports.
      if (progress && omp_get_thread_num() == 0 && finished % 256 == 0)
        progress(static_cast<double>(finished) / static_cast<double>(count));
    } catch (...) {
      keep(std::current_exception());
    }
  }
  if (first_error) std::rethrow_exception(first_error);
  if (progress) progress(1.0);
}

}  // namespace stepframe::analysis
