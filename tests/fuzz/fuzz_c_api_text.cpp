// libFuzzer target: the C ABI's entry points that take text in memory
// (stepframe.h: sf_run_project_text, sf_run_project_text_with_step), then every
// getter of the handle. The input is the project text, and when it holds a NUL
// byte, the bytes after the first NUL are the STEP text of the model
// (sf_run_project_text_with_step); without one it goes to sf_run_project_text
// with a base folder that does not exist, so no file is read. No output folder
// is set, so nothing is written. Seeds: a project, a NUL and a STEP file of
// tests/data (`./setup.sh fuzz` makes them).

#include "stepframe/stepframe.h"

#include <spdlog/spdlog.h>

#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <cstring>
#include <memory>
#include <string>
#include <vector>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  static const bool quiet = [] {
    spdlog::set_level(spdlog::level::off);
    return true;
  }();
  (void)quiet;
  const char* bytes = reinterpret_cast<const char*>(data);
  const auto* nul = static_cast<const char*>(std::memchr(bytes, '\0', size));
  const std::string project(bytes, nul ? static_cast<std::size_t>(nul - bytes) : size);

  sf_run* run = sf_run_new();
  if (!run) return 0;
  int status = 0;
  if (nul) {
    const std::size_t step_at = static_cast<std::size_t>(nul - bytes) + 1;
    // The STEP text in a heap block of exactly its size (never a null pointer, even when empty),
    // so reading past step_len is caught.
    const std::size_t step_len = size - step_at;
    const auto step = std::make_unique<char[]>(step_len);
    std::memcpy(step.get(), bytes + step_at, step_len);
    status = sf_run_project_text_with_step(run, project.c_str(), "/nonexistent/stepframe-fuzz", step.get(), step_len);
  } else {
    status = sf_run_project_text(run, project.c_str(), "/nonexistent/stepframe-fuzz");
  }
  // A bug (status 4) or an argument refused that was given (6) is a finding.
  if (status == SF_INTERNAL_ERROR || status == SF_INVALID_ARGUMENT || sf_run_status(run) != status) std::abort();

  // Every string the handle hands out is NUL-terminated and stays readable.
  const std::size_t message_length = std::strlen(sf_run_message(run));
  const std::size_t summary_length = std::strlen(sf_run_summary(run));
  const char* json = sf_run_results_json(run);
  const std::size_t json_length = sf_run_copy_results_json(run, nullptr, 0);
  if (!json || std::strlen(json) != json_length) std::abort();
  std::vector<char> copy(json_length / 2 + 1);
  if (sf_run_copy_results_json(run, copy.data(), copy.size()) != json_length || std::strlen(copy.data()) != copy.size() - 1)
    std::abort();
  (void)message_length;
  (void)summary_length;
  (void)sf_status_name(status);
  sf_run_free(run);
  return 0;
}
