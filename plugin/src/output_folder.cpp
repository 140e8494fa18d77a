#include "output_folder.hpp"

#include <spdlog/spdlog.h>

#include <atomic>
#include <cerrno>
#include <cstdio>
#include <cstring>
#include <string>

#include <fcntl.h>
#include <sys/file.h>
#include <sys/stat.h>
#include <sys/statvfs.h>
#include <unistd.h>

namespace stepframe::detail {
namespace {

namespace fs = std::filesystem;

/// The folder that holds `out_dir` ("." for a bare name).
fs::path parent_of(const fs::path& out_dir) {
  const fs::path parent = out_dir.parent_path();
  return parent.empty() ? fs::path(".") : parent;
}

/// "<parent>/.<name>.stepframe-<what>": hidden siblings of the output folder.
fs::path sibling(const fs::path& out_dir, const std::string& what) {
  return parent_of(out_dir) / ("." + out_dir.filename().string() + ".stepframe-" + what);
}

/// A name no other staging folder of this process or another has.
std::string unique_suffix() {
  static std::atomic<unsigned> counter{0};  // process-wide: unique names only, no other state
  return std::to_string(::getpid()) + "-" + std::to_string(counter.fetch_add(1));
}

/// out_dir without a trailing separator ("out/" names the folder "out").
fs::path normalised(const fs::path& out_dir) {
  fs::path p = out_dir.lexically_normal();
  if (p.filename().empty() && p.has_parent_path()) p = p.parent_path();
  return p;
}

}  // namespace

bool output_unwritable(const fs::path& folder) {
  struct statvfs space {};
  if (::statvfs(folder.c_str(), &space) == 0) {
    if (space.f_flag & ST_RDONLY) return true;
    if (space.f_blocks > 0 && space.f_bavail == 0) return true;
  }
  return ::access(folder.c_str(), W_OK) != 0;
}

InputError output_failure(const fs::path& file, int error_number) {
  const std::string name = file.string();
  const auto full = [&] {
    return InputError(name + ": disk full: no space left for the results; free some space or choose another --out folder");
  };
  const auto unwritable = [&](const std::string& why) {
    return InputError(name + ": not writable (" + why + "); choose an output folder you may write to (--out)");
  };
  if (error_number == ENOSPC || error_number == EDQUOT) return full();
  if (error_number == EACCES || error_number == EPERM || error_number == EROFS)
    return unwritable(std::strerror(error_number));
  // errno unknown (a VTK writer failed): ask the file system. Pseudo file systems report no blocks at all.
  const fs::path folder = file.has_parent_path() ? file.parent_path() : fs::path(".");
  struct statvfs space {};
  if (::statvfs(folder.c_str(), &space) == 0) {
    if (space.f_blocks > 0 && space.f_bavail == 0) return full();
    if (space.f_flag & ST_RDONLY) return unwritable("read-only file system");
    if (::access(folder.c_str(), W_OK) != 0) return unwritable("no write permission on its folder");
  }
  return InputError(name + ": could not be written" +
                    (error_number != 0 ? " (" + std::string(std::strerror(error_number)) + ")" : std::string()) +
                    "; check the output folder (--out)");
}

OutputFolderLock::OutputFolderLock(const fs::path& out_dir) {
  const fs::path dir = normalised(out_dir);
  std::error_code ec;
  fs::create_directories(parent_of(dir), ec);
  if (ec) throw output_failure(parent_of(dir), ec.value());
  file_ = sibling(dir, "lock");
  for (;;) {
    fd_ = ::open(file_.c_str(), O_RDWR | O_CREAT | O_CLOEXEC, 0644);
    if (fd_ < 0) throw output_failure(file_, errno);
    if (::flock(fd_, LOCK_EX | LOCK_NB) != 0) {
      const int error = errno;
      char text[32] = {};
      const ssize_t got = ::pread(fd_, text, sizeof text - 1, 0);
      ::close(fd_);
      fd_ = -1;
      if (error != EWOULDBLOCK) throw output_failure(file_, error);
      const std::string pid = got > 0 ? std::string(text, static_cast<std::size_t>(got)) : std::string();
      throw InputError(dir.string() + ": output folder in use by " +
                       (pid.empty() ? std::string("another process") : "process " + pid) +
                       " (another stepframe run writes its results there); wait for it to finish or choose another "
                       "--out folder");
    }
    // The previous owner may have removed the file between our open and our
    // lock: hold the lock only on the file that is still there.
    struct stat held {}, named {};
    if (::fstat(fd_, &held) == 0 && ::stat(file_.c_str(), &named) == 0 && held.st_dev == named.st_dev &&
        held.st_ino == named.st_ino)
      break;
    ::close(fd_);
  }
  const std::string pid = std::to_string(::getpid());
  if (::ftruncate(fd_, 0) != 0 || ::pwrite(fd_, pid.data(), pid.size(), 0) != static_cast<ssize_t>(pid.size()))
    spdlog::debug("{}: could not record the process id", file_.string());
}

OutputFolderLock::~OutputFolderLock() {
  if (fd_ < 0) return;
  ::unlink(file_.c_str());  // still locked: a waiting run sees the file gone and makes a new one
  ::close(fd_);
}

StagingFolder::StagingFolder(const fs::path& out_dir) : out_dir_(normalised(out_dir)) {
  std::error_code ec;
  const auto status = fs::symlink_status(out_dir_, ec);
  if (fs::exists(status)) {
    if (!fs::is_directory(status))
      throw InputError(out_dir_.string() + ": exists and is not a folder; give a new or an earlier results folder as --out");
    if (!fs::is_empty(out_dir_, ec) && !fs::exists(out_dir_ / "results.json") && !fs::exists(out_dir_ / "compare.json") &&
        !fs::exists(out_dir_ / "suggest.json"))
      throw InputError(out_dir_.string() +
                       ": the output folder holds files that are not stepframe results (no results.json), and a run "
                       "replaces the whole folder; choose a new or empty folder for --out");
  }
  // Under the lock, every staging or set-aside folder of this output is a leftover of a killed run.
  const std::string prefix = "." + out_dir_.filename().string() + ".stepframe-";
  for (const auto& entry : fs::directory_iterator(parent_of(out_dir_), ec)) {
    const std::string name = entry.path().filename().string();
    if (name.rfind(prefix, 0) == 0 && name != prefix + "lock") fs::remove_all(entry.path(), ec);
  }
  staging_ = sibling(out_dir_, "tmp-" + unique_suffix());
  fs::create_directories(staging_ / "vtk", ec);
  if (ec) throw output_failure(staging_, ec.value());
}

StagingFolder::~StagingFolder() {
  if (committed_) return;
  std::error_code ec;
  fs::remove_all(staging_, ec);
}

void StagingFolder::commit() {
  if (::rename(staging_.c_str(), out_dir_.c_str()) == 0) {  // no previous folder, or an empty one
    committed_ = true;
    return;
  }
  const int first = errno;
  if (first != EEXIST && first != ENOTEMPTY) throw output_failure(out_dir_, first);
#ifdef RENAME_EXCHANGE
  if (::renameat2(AT_FDCWD, staging_.c_str(), AT_FDCWD, out_dir_.c_str(), RENAME_EXCHANGE) == 0) {
    committed_ = true;
    std::error_code ec;
    fs::remove_all(staging_, ec);  // now the previous results
    return;
  }
  if (errno != EINVAL && errno != ENOSYS) throw output_failure(out_dir_, errno);
#endif
  // A file system without the exchange: set the old folder aside, then rename.
  const fs::path aside = sibling(out_dir_, "old-" + unique_suffix());
  if (::rename(out_dir_.c_str(), aside.c_str()) != 0) throw output_failure(out_dir_, errno);
  if (::rename(staging_.c_str(), out_dir_.c_str()) != 0) {
    const int error = errno;
    ::rename(aside.c_str(), out_dir_.c_str());
    throw output_failure(out_dir_, error);
  }
  committed_ = true;
  std::error_code ec;
  fs::remove_all(aside, ec);
}

}  // namespace stepframe::detail
