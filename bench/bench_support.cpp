#include "bench_support.hpp"

#include <STEPCAFControl_Controller.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <TDocStd_Document.hxx>
#include <XCAFApp_Application.hxx>
#include <XCAFDoc_DocumentTool.hxx>

#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <ctime>

#include <fcntl.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

namespace stepframe::bench {
namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t0) { return std::chrono::duration<double>(Clock::now() - t0).count(); }

double cpu_of(const rusage& u) {
  return static_cast<double>(u.ru_utime.tv_sec + u.ru_stime.tv_sec) +
         1e-6 * static_cast<double>(u.ru_utime.tv_usec + u.ru_stime.tv_usec);
}

// Waits for `child` and fills in its status, processor time and peak memory.
void collect(pid_t child, Clock::time_point started, Measurement& m) {
  int status = 0;
  rusage usage{};
  wait4(child, &status, 0, &usage);
  m.wall = seconds_since(started);
  m.cpu = cpu_of(usage);
  m.peak_mb = static_cast<double>(usage.ru_maxrss) / 1024.0;  // Linux: kilobytes
  m.status = WIFEXITED(status) ? WEXITSTATUS(status) : 128 + WTERMSIG(status);
}

}  // namespace

Measurement occt_read_and_transfer(const std::filesystem::path& file, bool xde_attributes) {
  std::fflush(nullptr);  // else the child would write this process's buffered output again
  int pipe_ends[2];
  if (pipe(pipe_ends) != 0) std::perror("pipe"), std::exit(1);
  const auto started = Clock::now();
  const pid_t child = fork();
  if (child < 0) std::perror("fork"), std::exit(1);
  if (child == 0) {
    close(pipe_ends[0]);
    STEPCAFControl_Controller::Init();
    STEPCAFControl_Reader reader;
    reader.SetNameMode(Standard_True);
    reader.SetLayerMode(xde_attributes);
    reader.SetColorMode(xde_attributes);
    reader.SetPropsMode(Standard_False);
    reader.SetGDTMode(Standard_False);
    reader.SetMatMode(Standard_False);
    reader.SetViewMode(Standard_False);
    if (reader.ReadFile(file.string().c_str()) != IFSelect_RetDone) _exit(2);
    Handle(TDocStd_Document) document;
    XCAFApp_Application::GetApplication()->NewDocument("MDTV-XCAF", document);
    XCAFDoc_DocumentTool::SetLengthUnit(document, 1e-3);
    if (!reader.Transfer(document)) _exit(3);
    const auto shapes = static_cast<std::size_t>(reader.Reader().NbShapes());
    XCAFApp_Application::GetApplication()->Close(document);
    const bool sent = write(pipe_ends[1], &shapes, sizeof shapes) == static_cast<ssize_t>(sizeof shapes);
    _exit(sent ? 0 : 4);
  }
  close(pipe_ends[1]);
  Measurement m;
  if (read(pipe_ends[0], &m.count, sizeof m.count) != static_cast<ssize_t>(sizeof m.count)) m.count = 0;
  close(pipe_ends[0]);
  collect(child, started, m);
  return m;
}

Measurement run_command(const std::vector<std::string>& arguments) {
  std::fflush(nullptr);
  std::vector<char*> argv;
  for (const auto& a : arguments) argv.push_back(const_cast<char*>(a.c_str()));
  argv.push_back(nullptr);
  const auto started = Clock::now();
  const pid_t child = fork();
  if (child < 0) std::perror("fork"), std::exit(1);
  if (child == 0) {
    const int null = open("/dev/null", O_WRONLY);
    dup2(null, STDOUT_FILENO);
    dup2(null, STDERR_FILENO);
    execv(argv[0], argv.data());
    _exit(127);
  }
  Measurement m;
  collect(child, started, m);
  return m;
}

double folder_mb(const std::filesystem::path& folder) {
  double bytes = 0;
  std::error_code ec;
  for (const auto& entry : std::filesystem::recursive_directory_iterator(folder, ec))
    if (entry.is_regular_file(ec)) bytes += static_cast<double>(entry.file_size(ec));
  return bytes / 1e6;
}

}  // namespace stepframe::bench
