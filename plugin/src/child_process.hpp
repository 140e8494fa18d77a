#pragma once
// A command run in a child process with its output captured, stopped when it
// runs too long (POSIX spawn and wait). Internal to the plugin stage.

#include <chrono>
#include <filesystem>
#include <optional>
#include <string>
#include <sys/types.h>
#include <vector>

namespace stepframe::detail {

class ChildProcess {
 public:
  /// Starts `argv` (argv[0] the executable), stdout and stderr into the two files.
  /// Throws std::runtime_error when it cannot be started.
  ChildProcess(const std::vector<std::string>& argv, const std::filesystem::path& stdout_file,
               const std::filesystem::path& stderr_file);
  ChildProcess(const ChildProcess&) = delete;
  ChildProcess& operator=(const ChildProcess&) = delete;
  ChildProcess(ChildProcess&& other) noexcept;
  ~ChildProcess();  ///< a child still running is killed

  /// Checks without waiting; true once it has ended.
  bool finished();
  /// SIGTERM, then SIGKILL after `grace` if it is still there; waits for it.
  void stop(std::chrono::milliseconds grace = std::chrono::milliseconds(3000));

  /// After finished(): the exit status, or nothing when a signal ended it (`signal` says which).
  std::optional<int> exit_status() const { return status_; }
  int signal() const { return signal_; }
  double seconds() const;  ///< wall time since the start (until the end, once finished)

 private:
  pid_t pid_ = -1;
  bool done_ = false;
  std::optional<int> status_;
  int signal_ = 0;
  std::chrono::steady_clock::time_point start_, end_;
};

}  // namespace stepframe::detail
