#include "stepframe/analysis/pending_buckling.hpp"

#include <spdlog/spdlog.h>

#include <atomic>
#include <chrono>
#include <stdexcept>
#include <utility>

namespace stepframe::analysis {

struct PendingBuckling::Shared {
  std::atomic<bool> stop{false};
  std::atomic<double> fraction{0.0};
};

namespace {

// Thrown inside the task, from its progress callback, when the owner is gone.
struct Stopped : std::runtime_error {
  Stopped() : std::runtime_error("buckling analysis stopped") {}
};

}  // namespace

PendingBuckling::PendingBuckling(FrameModel model, std::vector<AxialForce> patterns, std::vector<std::string> names,
                                 BucklingOptions options, Eigen::SparseMatrix<double> k_free, DofNumbering dofs,
                                 std::shared_ptr<const StiffnessFactor> factor)
    : shared_(std::make_shared<Shared>()) {
  modes_ = std::async(std::launch::async, [shared = shared_, model = std::move(model), patterns = std::move(patterns),
                                           names = std::move(names), options, k_free = std::move(k_free),
                                           dofs = std::move(dofs), factor = std::move(factor)] {
    const FactorisedStiffness stiffness{k_free, dofs, *factor};
    auto modes = buckling_modes(model, patterns, options, &stiffness, [&](double f) {
      if (shared->stop.load(std::memory_order_relaxed)) throw Stopped();
      shared->fraction.store(f, std::memory_order_relaxed);
    });
    std::vector<ResultModes> named;
    for (std::size_t p = 0; p < modes.size(); ++p) named.push_back({names[p], std::move(modes[p])});
    return named;
  });
}

PendingBuckling& PendingBuckling::operator=(PendingBuckling&& other) noexcept {
  if (this != &other) {
    stop_and_wait();
    shared_ = std::move(other.shared_);
    modes_ = std::move(other.modes_);
  }
  return *this;
}

PendingBuckling::~PendingBuckling() { stop_and_wait(); }

void PendingBuckling::stop_and_wait() noexcept {
  if (!modes_.valid()) return;
  shared_->stop.store(true, std::memory_order_relaxed);
  modes_.wait();
  modes_ = {};
}

void PendingBuckling::attach(std::vector<LoadResult>& results, const std::function<void(double)>& progress) {
  if (!modes_.valid()) return;
  using namespace std::chrono_literals;
  while (modes_.wait_for(100ms) != std::future_status::ready)
    if (progress) progress(shared_->fraction.load(std::memory_order_relaxed));
  std::vector<ResultModes> named = modes_.get();  // rethrows the analysis' error
  for (ResultModes& m : named)
    for (LoadResult& r : results) {
      if (r.name != m.result) continue;
      r.buckling_modes = std::move(m.modes);
      if (!r.buckling_modes.empty()) {
        r.alpha_cr = r.buckling_modes.front().alpha;
        spdlog::info("'{}': alpha_cr = {:.3f}", r.name, *r.alpha_cr);
      }
      break;
    }
  if (progress) progress(1.0);
}

}  // namespace stepframe::analysis
