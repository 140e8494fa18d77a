#pragma once
// The command line's progress display: one line on stderr redrawn in place,
// shown only when stderr is a terminal (pipes and log files stay clean), and
// the time each stage took.

#include "stepframe/run_control.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include <unistd.h>

namespace stepframe::cli {

/// True when stderr is a terminal.
inline bool stderr_is_terminal() { return ::isatty(STDERR_FILENO) == 1; }

/// A progress callback: on a terminal, "  solve  [#######.........]  42%"
/// redrawn in place; elsewhere, each stage's start as a debug log line. It
/// also keeps the wall time of every stage (from its start to the next
/// stage's start), logged at debug level as each stage ends.
class ProgressDisplay {
 public:
  using Clock = std::chrono::steady_clock;

  explicit ProgressDisplay(bool enabled) : enabled_(enabled), started_(Clock::now()), stage_start_(started_) {}
  ProgressDisplay(const ProgressDisplay&) = delete;
  ProgressDisplay& operator=(const ProgressDisplay&) = delete;
  ~ProgressDisplay() { clear(); }

  ProgressCallback callback() {
    return [this](std::string_view stage, double fraction) { show(stage, fraction); };
  }

  /// Erases the line, e.g. before the summary is printed.
  void clear() {
    if (drawn_) std::fputs("\r\033[K", stderr), std::fflush(stderr);
    drawn_ = false;
  }

  /// Closes the last stage and returns every stage with its seconds, in
  /// order (a stage met twice is counted once, with both times summed).
  std::vector<std::pair<std::string, double>> timings() {
    close_stage(Clock::now());
    return timings_;
  }

  /// Seconds since the display was made.
  double elapsed() const { return std::chrono::duration<double>(Clock::now() - started_).count(); }

 private:
  void show(std::string_view stage, double fraction) {
    if (stage != stage_) {
      close_stage(Clock::now());
      stage_ = stage;
      if (!enabled_) spdlog::debug("{} ...", stage);
    }
    if (!enabled_) return;
    fraction = std::clamp(fraction, 0.0, 1.0);
    constexpr int width = 24;
    const int filled = static_cast<int>(fraction * width + 0.5);
    const int percent = static_cast<int>(fraction * 100 + 0.5);
    const std::string line = fmt::format("\r\033[K  {:<13}[{}{}] {:3d}%", stage, std::string(static_cast<std::size_t>(filled), '#'),
                                         std::string(static_cast<std::size_t>(width - filled), '.'), percent);
    std::fputs(line.c_str(), stderr);
    std::fflush(stderr);
    drawn_ = true;
  }

  void close_stage(Clock::time_point now) {
    if (!stage_.empty()) {
      const double seconds = std::chrono::duration<double>(now - stage_start_).count();
      spdlog::debug("{} took {:.3f} s", stage_, seconds);
      auto it = std::find_if(timings_.begin(), timings_.end(), [&](const auto& t) { return t.first == stage_; });
      if (it == timings_.end()) timings_.emplace_back(stage_, seconds);
      else it->second += seconds;
    }
    stage_start_ = now;
  }

  bool enabled_;
  bool drawn_ = false;
  Clock::time_point started_, stage_start_;
  std::string stage_;
  std::vector<std::pair<std::string, double>> timings_;
};

}  // namespace stepframe::cli
