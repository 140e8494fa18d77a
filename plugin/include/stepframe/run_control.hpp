#pragma once
// How a caller watches and steers a run: progress reports, cancellation and
// where the log messages go.

#include <spdlog/common.h>
#include <spdlog/logger.h>

#include <atomic>
#include <cstddef>
#include <functional>
#include <memory>
#include <stdexcept>
#include <string>
#include <string_view>

namespace stepframe {

struct Analysis;  // run.hpp

/// Called as work goes on: a stage name and the fraction of that stage done,
/// in [0, 1]. The stages, in order: "project", "geometry" (reading the
/// STEP file), "wireframe" (members and nodes from it), "model",
/// "assembly", "factorisation", "recovery", "checks", then, when files are
/// written, "vtk", "tables", "results.json" and "report", which reports 1
/// when every file is in place. Each stage reports 0 when it starts. The
/// buckling analysis (when asked for) runs on a thread of its own beside the
/// recovery and the member checks; while the run waits for it, inside
/// "checks", it reports "buckling", then "checks" again for the checks that
/// need alpha_cr. A frame whose factorised stiffness takes more than
/// RunControl::checks_beside_buckling_bytes (1 GB by default: some 30,000
/// members) waits for it before "checks" instead, so that
/// the factor is freed before the checks' own memory grows.
using ProgressCallback = std::function<void(std::string_view stage, double fraction)>;

/// Asked between stages and inside the solver's loops; returning true stops
/// the run with Cancelled. It may be called from the thread running the
/// analysis only, so it must be cheap and must not block.
using CancelCallback = std::function<bool()>;

/// Thrown when a caller cancels a run. Nothing is written after it.
class Cancelled : public std::runtime_error {
 public:
  Cancelled() : std::runtime_error("the run was cancelled by the caller") {}
};

namespace geometry {
struct StepReadOptions;
}

/// Everything a caller can hook into a run. All members are optional.
struct RunControl {
  ProgressCallback progress;
  CancelCallback cancel;
  /// A flag another thread may set to stop the run (checked like `cancel`).
  /// Not owned: it must outlive the run.
  const std::atomic<bool>* cancel_flag = nullptr;
  /// Receives the run's log messages instead of the process default logger.
  spdlog::sink_ptr log_sink;
  spdlog::level::level_enum log_level = spdlog::level::info;
  /// Lets a large factorisation (StiffnessFactor) run OpenBLAS on the cores
  /// that are idle when it starts, its setting restored after it. OpenBLAS
  /// keeps one setting per process, so a host that computes on threads of its
  /// own meanwhile (several runs at once) leaves this off; the command line
  /// turns it on unless OPENBLAS_NUM_THREADS says otherwise.
  bool idle_cores_for_factorisation = false;
  /// When not 0, a STEP file of this many members or more may be read in two processes at once (this
  /// one and a child made with fork(); geometry::StepReadOptions::two_processes_from), which needs a
  /// process with no other thread that could hold a lock the child takes: the command line sets it,
  /// a host leaves it at 0.
  std::size_t two_process_read_from = 0;
  /// How the run reads a STEP file: geometry::StepReadOptions with `two_process_read_from`
  /// (stepframe/geometry/step_reader.hpp has the type).
  geometry::StepReadOptions step_read_options() const;
  /// The most memory [bytes] a pending buckling analysis (its factorised
  /// stiffness) may hold for the checks to run beside it; above it the checks
  /// wait for it, so that their memory and the factor's do not add up (some
  /// 30,000 members and more). A host short of memory may lower it.
  double checks_beside_buckling_bytes = 1e9;
  /// Called on the analysing thread when the checks are about to wait for the
  /// buckling analysis (see checks_beside_buckling_bytes; not called
  /// otherwise), with the analysis as far as it has come: results and shop
  /// data, no checks yet, alpha_cr still on its way. One core is idle then:
  /// the run writing an output folder writes the tables that need no check.
  std::function<void(const Analysis&)> results_solved;

  /// Throws Cancelled when either the callback or the flag asks for it.
  void throw_if_cancelled() const {
    if ((cancel_flag && cancel_flag->load(std::memory_order_relaxed)) || (cancel && cancel()))
      throw Cancelled();
  }
  /// Reports progress (if anyone listens), then checks for cancellation.
  void report(std::string_view stage, double fraction) const {
    if (progress) progress(stage, fraction);
    throw_if_cancelled();
  }
};

/// While alive, routes spdlog's default logger to `sink` (at `level`); the
/// previous default logger is restored on destruction. With a null sink it
/// does nothing. The library logs through the default logger, so a process
/// that runs several analyses at once on different threads must give them
/// the same sink (or none): the default logger is one per process.
class ScopedLogSink {
 public:
  ScopedLogSink(spdlog::sink_ptr sink, spdlog::level::level_enum level);
  ~ScopedLogSink();
  ScopedLogSink(const ScopedLogSink&) = delete;
  ScopedLogSink& operator=(const ScopedLogSink&) = delete;

 private:
  std::shared_ptr<spdlog::logger> previous_;
  bool active_ = false;
};

}  // namespace stepframe
