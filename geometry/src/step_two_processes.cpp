#include "step_two_processes.hpp"

#include "occt_messages.hpp"
#include "step_model_bytes.hpp"
#include "step_split.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cerrno>
#include <chrono>
#include <csignal>
#include <optional>
#include <string>
#include <fcntl.h>
#include <poll.h>
#include <sys/types.h>
#include <sys/wait.h>
#include <unistd.h>

namespace stepframe::geometry::detail {

namespace {

using Clock = std::chrono::steady_clock;

bool write_all(int fd, std::string_view bytes) {
  while (!bytes.empty()) {
    const ssize_t wrote = ::write(fd, bytes.data(), bytes.size());
    if (wrote < 0 && errno == EINTR) continue;
    if (wrote <= 0) return false;
    bytes.remove_prefix(static_cast<std::size_t>(wrote));
  }
  return true;
}

// Everything the child writes until it closes the pipe, or nullopt when `deadline` passes first.
std::optional<std::string> read_all(int fd, Clock::time_point deadline) {
  std::string bytes;
  char block[1 << 16];
  for (;;) {
    const auto left = std::chrono::duration_cast<std::chrono::milliseconds>(deadline - Clock::now()).count();
    if (left <= 0) return std::nullopt;
    pollfd wait{fd, POLLIN, 0};
    const int ready = ::poll(&wait, 1, static_cast<int>(std::min<long long>(left, 60'000)));
    if (ready < 0 && errno == EINTR) continue;
    if (ready < 0) return std::nullopt;
    if (ready == 0) continue;
    const ssize_t got = ::read(fd, block, sizeof block);
    if (got < 0 && errno == EINTR) continue;
    if (got < 0) return std::nullopt;
    if (got == 0) return bytes;
    bytes.append(block, static_cast<std::size_t>(got));
  }
}

// The child's side: its half read and sent; never returns.
[[noreturn]] void child(int fd, std::string_view text, std::size_t min_members, const PartReader& read_part) {
  // Quiet: the parent logs for both (a level is an atomic: no lock taken that another thread of the
  // parent might have held when it forked).
  spdlog::default_logger_raw()->set_level(spdlog::level::off);
  int status = 3;
  try {
    if (const std::optional<std::string> part = step_split_part(text, min_members, 1)) {
      OcctFailureLog messages;
      ModelWithMessages read{read_part(*part), messages.all()};
      status = write_all(fd, to_bytes(read)) ? 0 : 4;
    }
  } catch (...) {
    status = 5;
  }
  ::close(fd);
  ::_exit(status);  // no destructors, no atexit handlers of the parent's
}

struct Child {
  pid_t pid = -1;
  int fd = -1;

  // Stops the child (when it still runs) and collects it; its exit status, -1 when a signal ended it.
  int end(bool kill) {
    if (fd >= 0) ::close(fd);
    fd = -1;
    if (pid <= 0) return -1;
    if (kill) ::kill(pid, SIGKILL);
    int status = 0;
    pid_t waited = -1;
    while ((waited = ::waitpid(pid, &status, 0)) < 0 && errno == EINTR) {
    }
    pid = -1;
    // Not collected (a host that ignores SIGCHLD has its children reaped for it): no status to trust.
    if (waited < 0) return -1;
    return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  }
  ~Child() { end(true); }
};

bool same(const Diagnostic& a, const Diagnostic& b) {
  return a.severity == b.severity && a.code == b.code && a.message == b.message && a.entities == b.entities &&
         a.at.has_value() == b.at.has_value() && (!a.at || *a.at == *b.at);
}

// One placement for every edge: each part's edges then come in the order the whole read gives.
bool one_placement(const StepModel& first, const StepModel& second) {
  const SourceInfo& place = first.edges.front().source;
  auto here = [&](const WireEdge& e) {
    return e.source.product == place.product && e.source.assembly_path == place.assembly_path;
  };
  return std::all_of(first.edges.begin(), first.edges.end(), here) &&
         std::all_of(second.edges.begin(), second.edges.end(), here);
}

}  // namespace

std::optional<StepModel> read_in_two_processes(std::string_view text, std::size_t min_members,
                                               const PartReader& read_part) {
  // Close-on-exec: a program another thread of the process starts meanwhile must not hold the write end
  // open (the parent would wait for the end of the child's bytes until the deadline).
  int pipe_ends[2];
  if (::pipe2(pipe_ends, O_CLOEXEC) != 0) return std::nullopt;
  Child other;
  other.pid = ::fork();
  if (other.pid == 0) {
    ::close(pipe_ends[0]);
    child(pipe_ends[1], text, min_members, read_part);
  }
  ::close(pipe_ends[1]);
  other.fd = pipe_ends[0];
  if (other.pid < 0) {
    other.end(false);
    return std::nullopt;
  }

  const Clock::time_point start = Clock::now();
  StepModel first;
  try {
    const std::optional<std::string> part = step_split_part(text, min_members, 0);
    if (!part) return std::nullopt;
    first = read_part(*part);
  } catch (const std::exception& e) {
    spdlog::debug("the first half of the STEP text failed to read ({}); reading the whole text", e.what());
    return std::nullopt;
  }
  // The halves take about as long: a child that needs four times as long (and ten seconds) is stuck.
  const Clock::time_point deadline = Clock::now() + std::max(std::chrono::duration_cast<Clock::duration>(
                                                                 std::chrono::seconds(10)),
                                                             4 * (Clock::now() - start));
  const std::optional<std::string> bytes = read_all(other.fd, deadline);
  const bool answered = bytes.has_value();
  const int status = other.end(!answered);
  std::optional<ModelWithMessages> second = answered && status == 0 ? from_bytes(*bytes) : std::nullopt;
  if (!second) {
    spdlog::debug("the child process reading the second half of the STEP text {} (exit status {}); reading the "
                  "whole text",
                  answered ? "gave no model" : "did not answer in time", status);
    return std::nullopt;
  }
  for (const std::string& line : second->occt_messages) spdlog::warn("OCCT: {}", line);

  StepModel& rest = second->model;
  const bool joinable =
      rest.file == first.file && rest.length_unit == first.length_unit && rest.metres_per_unit == first.metres_per_unit &&
      !first.edges.empty() && !rest.edges.empty() && one_placement(first, rest) &&
      std::equal(first.diagnostics.begin(), first.diagnostics.end(), rest.diagnostics.begin(), rest.diagnostics.end(),
                 same);
  if (!joinable) {
    spdlog::debug("the halves of the STEP text do not join exactly (findings about members); reading the whole text");
    return std::nullopt;
  }
  spdlog::info("{}: read in two processes, {} + {} edges", first.file.string(), first.edges.size(), rest.edges.size());
  first.edges.insert(first.edges.end(), std::make_move_iterator(rest.edges.begin()),
                     std::make_move_iterator(rest.edges.end()));
  first.points.insert(first.points.end(), std::make_move_iterator(rest.points.begin()),
                      std::make_move_iterator(rest.points.end()));
  return first;
}

}  // namespace stepframe::geometry::detail
