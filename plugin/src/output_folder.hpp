#pragma once
// The output folder of a run, replaced whole or not at all.
//
// A run locks the folder (a lock file beside it, so a second run into the same
// folder is refused at once), writes every file into a fresh staging folder
// beside it and, when all are complete, exchanges the two folders in one
// atomic rename (Linux renameat2 RENAME_EXCHANGE; elsewhere the old folder is
// renamed aside first), then removes the old results. Readers therefore see
// either the whole previous result or the whole new one, never a mix.

#include "stepframe/errors.hpp"

#include <filesystem>
#include <string>
#include <vector>

namespace stepframe {
struct Analysis;
struct RunControl;
}  // namespace stepframe

namespace stepframe::detail {

/// An exclusive lock on an output folder for as long as it lives: an flock(2)
/// on "<parent>/.<name>.stepframe-lock", which holds the owner's process id.
/// Throws InputError "... in use by process N" when another run holds it, and
/// InputError "not writable" when the lock file cannot be made. The lock
/// dies with the process, so a killed run never blocks the next one.
class OutputFolderLock {
 public:
  explicit OutputFolderLock(const std::filesystem::path& out_dir);
  ~OutputFolderLock();
  OutputFolderLock(const OutputFolderLock&) = delete;
  OutputFolderLock& operator=(const OutputFolderLock&) = delete;

 private:
  std::filesystem::path file_;
  int fd_ = -1;
};

/// A fresh, empty folder beside `out_dir` ("<parent>/.<name>.stepframe-tmp-<pid>-<n>")
/// that becomes `out_dir` on commit() and is removed with everything in it
/// otherwise. Create it only while holding the folder's OutputFolderLock: it
/// first removes the staging folders that killed runs left behind. An existing
/// `out_dir` must be a folder that is empty or holds earlier results
/// (results.json, or compare.json / suggest.json of `compare` / `suggest`); anything else is refused with InputError, so a mistyped
/// --out never deletes someone's files.
class StagingFolder {
 public:
  explicit StagingFolder(const std::filesystem::path& out_dir);
  ~StagingFolder();
  StagingFolder(const StagingFolder&) = delete;
  StagingFolder& operator=(const StagingFolder&) = delete;

  const std::filesystem::path& path() const { return staging_; }
  /// Puts the staging folder in place of out_dir in one atomic exchange and
  /// removes the previous results.
  void commit();

 private:
  std::filesystem::path out_dir_, staging_;
  bool committed_ = false;
};

/// The InputError for an output file that could not be written: "disk full"
/// (ENOSPC, EDQUOT, or no free space left on its file system), "not
/// writable" (EACCES, EPERM, EROFS, or no write permission on its folder),
/// else "could not be written" with the system's reason. `error_number` is the
/// errno of the failed call (0 when unknown).
InputError output_failure(const std::filesystem::path& file, int error_number);

/// True when the failure to write into `folder` is the disk's or the folder's
/// fault (full, read-only, no permission) rather than ours.
bool output_unwritable(const std::filesystem::path& folder);

/// write_outputs for a caller that already holds out_dir's OutputFolderLock
/// (run_guarded takes it before the analysis, so a second run is refused at once).
std::vector<std::filesystem::path> write_outputs_locked(const Analysis& analysis, const std::filesystem::path& out_dir,
                                                        const RunControl& control);

/// The tables that need no check (all but checks.csv: takeoff, reactions, end
/// forces, cut list, connections), written into `staging`; their names
/// relative to it, in the order write_outputs lists them. Needs the
/// analysis's results and shop data only (RunControl::results_solved).
std::vector<std::filesystem::path> write_check_free_tables(const Analysis& analysis, const StagingFolder& staging,
                                                           const std::filesystem::path& out_dir);

/// As write_outputs_locked, into a staging folder the caller made (and
/// commits through this), where write_check_free_tables may already have
/// written `tables_written`.
std::vector<std::filesystem::path> write_outputs_into(const Analysis& analysis, StagingFolder& staging,
                                                      const std::filesystem::path& out_dir,
                                                      std::vector<std::filesystem::path> tables_written,
                                                      const RunControl& control);

}  // namespace stepframe::detail
