#pragma once
// A buckling analysis running on a thread of its own: the work that does not
// need alpha_cr (recovery of the members, their checks) goes on beside it, and
// the results get their modes when that work is done.

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/buckling.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/analysis/solve.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <Eigen/SparseCore>

#include <functional>
#include <future>
#include <memory>
#include <string>
#include <vector>

namespace stepframe::analysis {

/// The modes buckling_modes found for one pattern, named as its result.
struct ResultModes {
  std::string result;
  std::vector<BucklingMode> modes;
};

/// buckling_modes on a thread of its own. The task owns everything it reads
/// (a copy of the model, the reduced stiffness and the shared factor), so the
/// caller may change or drop its own copies at once, and frees it when it ends.
class PendingBuckling {
 public:
  PendingBuckling() = default;  ///< nothing to wait for

  /// Starts buckling_modes(model, patterns, options) with the model's own
  /// factorised stiffness; `names` are the patterns' results.
  PendingBuckling(FrameModel model, std::vector<AxialForce> patterns, std::vector<std::string> names,
                  BucklingOptions options, Eigen::SparseMatrix<double> k_free, DofNumbering dofs,
                  std::shared_ptr<const StiffnessFactor> factor);

  PendingBuckling(PendingBuckling&& other) noexcept = default;
  PendingBuckling& operator=(PendingBuckling&& other) noexcept;
  PendingBuckling(const PendingBuckling&) = delete;
  PendingBuckling& operator=(const PendingBuckling&) = delete;

  /// An analysis nobody waited for (an error on the caller's side) is asked to
  /// stop at its next pattern, and waited for.
  ~PendingBuckling();

  /// True while an analysis has not been attached.
  bool pending() const { return modes_.valid(); }

  /// Bytes the analysis holds until it ends: the factor's and k_free's
  /// values and indices (what a caller weighs before it lets memory of its
  /// own grow beside the analysis).
  double held_bytes() const { return held_bytes_; }

  /// Waits for the analysis, calling `progress` with the fraction done about
  /// ten times a second, then gives every result of `results` named as a
  /// pattern its modes and alpha_cr (the lowest factor; none when the pattern
  /// compresses nothing). Rethrows the analysis' error. Does nothing when
  /// nothing is pending; a second call does nothing.
  void attach(std::vector<LoadResult>& results, const std::function<void(double)>& progress = {});

 private:
  void stop_and_wait() noexcept;

  struct Shared;  // the stop request and the fraction done, shared with the task
  std::shared_ptr<Shared> shared_;
  std::future<std::vector<ResultModes>> modes_;
  double held_bytes_ = 0;
};

/// solve's results, and their buckling analysis still running.
struct Solution {
  std::vector<LoadResult> results;  ///< without buckling modes and alpha_cr until buckling.attach(results)
  PendingBuckling buckling;
};

/// As solve, but the buckling analysis starts on a thread of its own as soon
/// as the combinations are superposed, and is not waited for: the recovery of
/// the members runs beside it, and so can the caller's member checks, which
/// need no alpha_cr. solve is this followed by attach.
Solution solve_beside_buckling(const FrameModel& model, const SolveOptions& options = {});

}  // namespace stepframe::analysis
