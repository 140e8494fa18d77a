#pragma once
// Scratch folders and command runs for the plugin tests.

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <random>
#include <sstream>
#include <string>

namespace stepframe::test {

/// A fresh folder under the system temp dir, removed when the object dies.
class ScratchDir {
 public:
  ScratchDir() {
    std::random_device rd;
    path_ = std::filesystem::temp_directory_path() / ("stepframe-test-" + std::to_string(rd()));
    std::filesystem::create_directories(path_);
  }
  ~ScratchDir() {
    std::error_code ec;
    std::filesystem::remove_all(path_, ec);
  }
  ScratchDir(const ScratchDir&) = delete;
  ScratchDir& operator=(const ScratchDir&) = delete;
  const std::filesystem::path& path() const { return path_; }
  std::filesystem::path operator/(const std::string& name) const { return path_ / name; }

 private:
  std::filesystem::path path_;
};

inline void write_text(const std::filesystem::path& file, const std::string& text) {
  std::ofstream(file) << text;
}

inline std::string read_text(const std::filesystem::path& file) {
  std::ifstream in(file);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

/// Runs the stepframe executable with `args`; returns its exit status and
/// fills stdout and stderr text.
struct CommandResult {
  int status = -1;
  std::string out, err;
};

inline CommandResult run_stepframe(const std::string& args, const ScratchDir& scratch) {
  const auto out = scratch / "stdout.txt", err = scratch / "stderr.txt";
  const std::string command = std::string("\"") + STEPFRAME_EXE + "\" " + args + " >\"" + out.string() + "\" 2>\"" +
                              err.string() + "\"";
  const int raw = std::system(command.c_str());
  CommandResult r;
  r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  r.out = read_text(out);
  r.err = read_text(err);
  return r;
}

/// Runs a shell command (an independent tool); its exit status and output.
inline CommandResult run_shell(const std::string& command, const ScratchDir& scratch) {
  const auto out = scratch / "shell-stdout.txt";
  const int raw = std::system((command + " >\"" + out.string() + "\"").c_str());
  CommandResult r;
  r.status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
  r.out = read_text(out);
  return r;
}

}  // namespace stepframe::test
