#include "child_process.hpp"

#include <fcntl.h>
#include <signal.h>
#include <spawn.h>
#include <sys/wait.h>

#include <cstring>
#include <stdexcept>
#include <thread>

extern char** environ;

namespace stepframe::detail {

ChildProcess::ChildProcess(const std::vector<std::string>& argv, const std::filesystem::path& stdout_file,
                           const std::filesystem::path& stderr_file)
    : start_(std::chrono::steady_clock::now()) {
  posix_spawn_file_actions_t actions;
  posix_spawn_file_actions_init(&actions);
  posix_spawn_file_actions_addopen(&actions, 1, stdout_file.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
  posix_spawn_file_actions_addopen(&actions, 2, stderr_file.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
  std::vector<char*> args;
  for (const auto& a : argv) args.push_back(const_cast<char*>(a.c_str()));
  args.push_back(nullptr);
  const int failed = posix_spawn(&pid_, args[0], &actions, nullptr, args.data(), environ);
  posix_spawn_file_actions_destroy(&actions);
  if (failed) throw std::runtime_error("cannot start " + argv.front() + ": " + std::strerror(failed));
}

ChildProcess::ChildProcess(ChildProcess&& other) noexcept
    : pid_(other.pid_), done_(other.done_), status_(other.status_), signal_(other.signal_), start_(other.start_),
      end_(other.end_) {
  other.pid_ = -1;
  other.done_ = true;
}

ChildProcess::~ChildProcess() {
  if (pid_ > 0 && !done_) {
    ::kill(pid_, SIGKILL);
    int raw = 0;
    ::waitpid(pid_, &raw, 0);
  }
}

bool ChildProcess::finished() {
  if (done_) return true;
  int raw = 0;
  const pid_t r = ::waitpid(pid_, &raw, WNOHANG);
  if (r == 0) return false;
  done_ = true;
  end_ = std::chrono::steady_clock::now();
  if (r == pid_ && WIFEXITED(raw)) status_ = WEXITSTATUS(raw);
  else if (r == pid_ && WIFSIGNALED(raw)) signal_ = WTERMSIG(raw);
  return true;
}

void ChildProcess::stop(std::chrono::milliseconds grace) {
  if (finished()) return;
  ::kill(pid_, SIGTERM);
  const auto deadline = std::chrono::steady_clock::now() + grace;
  while (!finished() && std::chrono::steady_clock::now() < deadline) std::this_thread::sleep_for(std::chrono::milliseconds(20));
  if (!finished()) {
    ::kill(pid_, SIGKILL);
    while (!finished()) std::this_thread::sleep_for(std::chrono::milliseconds(5));
  }
}

double ChildProcess::seconds() const {
  return std::chrono::duration<double>((done_ ? end_ : std::chrono::steady_clock::now()) - start_).count();
}

}  // namespace stepframe::detail
