#pragma once
// The command line's progress display: one line on stderr redrawn in place,
// shown only when stderr is a terminal (pipes and log files stay clean).

#include "stepframe/run_control.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cstdio>
#include <string>
#include <string_view>

#include <unistd.h>

namespace stepframe::cli {

/// True when stderr is a terminal.
inline bool stderr_is_terminal() { return ::isatty(STDERR_FILENO) == 1; }

/// A progress callback: on a terminal, "  solve  [#######.........]  42%"
/// redrawn in place; elsewhere, each stage's start as a debug log line.
class ProgressDisplay {
 public:
  explicit ProgressDisplay(bool enabled) : enabled_(enabled) {}
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

 private:
  void show(std::string_view stage, double fraction) {
    if (!enabled_) {
      if (fraction == 0.0) spdlog::debug("{} ...", stage);
      return;
    }
    fraction = std::clamp(fraction, 0.0, 1.0);
    constexpr int width = 24;
    const int filled = static_cast<int>(fraction * width + 0.5);
    const int percent = static_cast<int>(fraction * 100 + 0.5);
    const std::string line = fmt::format("\r\033[K  {:<9}[{}{}] {:3d}%", stage, std::string(static_cast<std::size_t>(filled), '#'),
                                         std::string(static_cast<std::size_t>(width - filled), '.'), percent);
    std::fputs(line.c_str(), stderr);
    std::fflush(stderr);
    drawn_ = true;
  }

  bool enabled_;
  bool drawn_ = false;
};

}  // namespace stepframe::cli
