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
  // Values (8 bytes) and row indices (4) of the factor and of k_free.
  held_bytes_ = 12.0 * (factor->factor_nonzeros() + static_cast<double>(k_free.nonZeros()));
  spdlog::debug("buckling: {} pattern(s) on a thread of their own, holding {:.0f} MB", patterns.size(),
                held_bytes_ / 1e6);
  struct Inputs {
    FrameModel model;
    std::vector<AxialForce> patterns;
    Eigen::SparseMatrix<double> k_free;
    DofNumbering dofs;
    std::shared_ptr<const StiffnessFactor> factor;
  };
  auto inputs = std::make_unique<Inputs>(
      Inputs{std::move(model), std::move(patterns), std::move(k_free), std::move(dofs), std::move(factor)});
  modes_ = std::async(std::launch::async, [shared = shared_, names = std::move(names), options,
                                           inputs = std::move(inputs)]() mutable {
    // Taken out of the task's own state, so that the factor is freed when the analysis ends, not when
    // someone collects its modes.
    const std::unique_ptr<Inputs> in = std::move(inputs);
    const FactorisedStiffness stiffness{in->k_free, in->dofs, *in->factor};
    auto modes = buckling_modes(in->model, in->patterns, options, &stiffness, [&](double f) {
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
    held_bytes_ = other.held_bytes_;
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
