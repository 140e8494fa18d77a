// The C ABI (stepframe/stepframe.h) over the C++ API: every call catches
// everything, so no exception crosses into C.

#include "stepframe/stepframe.h"

#include "stepframe/api.hpp"

#include <spdlog/sinks/base_sink.h>
#include <spdlog/sinks/stdout_color_sinks.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <atomic>
#include <cstring>
#include <mutex>
#include <new>
#include <string>

struct sf_run {
  std::filesystem::path out_dir;
  sf_progress_fn progress = nullptr;
  void* progress_data = nullptr;
  sf_log_fn log = nullptr;
  void* log_data = nullptr;
  int log_min_level = SF_LOG_INFO;
  std::atomic<bool> cancel_requested{false};  ///< sf_run_cancel: stays until sf_run_reset_cancel
  bool progress_cancelled = false;             ///< the progress callback asked to stop this run

  int status = SF_INVALID_ARGUMENT;
  std::string message;
  std::string results_json;
  std::string summary;
};

namespace {

const char* const library_version_string = STEPFRAME_VERSION;

/// Copies `text` into a caller's buffer, NUL-terminated and truncated.
void copy_out(const std::string& text, char* buffer, std::size_t length) {
  if (!buffer || length == 0) return;
  const std::size_t n = std::min(text.size(), length - 1);
  std::memcpy(buffer, text.data(), n);
  buffer[n] = '\0';
}

/// An spdlog sink that hands each message to a C callback.
class CallbackSink : public spdlog::sinks::base_sink<std::mutex> {
 public:
  CallbackSink(sf_log_fn callback, void* user_data) : log_(callback), user_data_(user_data) {}

 protected:
  void sink_it_(const spdlog::details::log_msg& msg) override {
    const std::string text(msg.payload.data(), msg.payload.size());
    log_(to_c_level(msg.level), text.c_str(), user_data_);
  }
  void flush_() override {}

 private:
  static int to_c_level(spdlog::level::level_enum level) {
    switch (level) {
      case spdlog::level::trace:
      case spdlog::level::debug: return SF_LOG_DEBUG;
      case spdlog::level::info: return SF_LOG_INFO;
      case spdlog::level::warn: return SF_LOG_WARNING;
      default: return SF_LOG_ERROR;
    }
  }
  sf_log_fn log_;
  void* user_data_;
};

/// stepframe.h promises the log on stderr, but spdlog's own default logger
/// writes to stdout: a host that has not set a default logger of its own (it
/// would have a name) gets one on stderr, once per process.
void log_to_stderr_by_default() {
  static std::once_flag once;
  std::call_once(once, [] {
    const auto current = spdlog::default_logger();
    if (current && !current->name().empty()) return;
    auto logger = std::make_shared<spdlog::logger>("stepframe", std::make_shared<spdlog::sinks::stderr_color_sink_mt>());
    if (current) logger->set_level(current->level());
    spdlog::set_default_logger(std::move(logger));
  });
}

spdlog::level::level_enum to_spdlog_level(int level) {
  return level <= SF_LOG_DEBUG     ? spdlog::level::debug
         : level == SF_LOG_INFO    ? spdlog::level::info
         : level == SF_LOG_WARNING ? spdlog::level::warn
                                   : spdlog::level::err;
}

stepframe::RunOptions options_of(sf_run& run) {
  stepframe::RunOptions options;
  options.out_dir = run.out_dir;
  options.control.cancel_flag = &run.cancel_requested;
  if (run.progress) {
    options.control.progress = [&run](std::string_view stage, double fraction) {
      const std::string name(stage);
      if (run.progress(name.c_str(), fraction, run.progress_data) != 0) run.progress_cancelled = true;
    };
    options.control.cancel = [&run] { return run.progress_cancelled; };
  }
  if (run.log) {
    options.control.log_sink = std::make_shared<CallbackSink>(run.log, run.log_data);
    options.control.log_level = to_spdlog_level(run.log_min_level);
  }
  return options;
}

void keep(sf_run& run, const stepframe::Results& results) {
  run.status = static_cast<int>(results.status());
  run.message = results.message();
  run.results_json = results.json_text();
  run.summary = results.summary();
}

/// Runs `body` on the handle with every exception turned into a status.
template <class Body>
int guarded(sf_run* run, Body&& body) {
  if (!run) return SF_INVALID_ARGUMENT;
  log_to_stderr_by_default();
  run->progress_cancelled = false;
  try {
    keep(*run, body(options_of(*run)));
  } catch (const std::bad_alloc&) {
    run->status = SF_INTERNAL_ERROR;
    run->message = "out of memory";
    run->results_json.clear();
    run->summary = run->message;
  } catch (const std::exception& e) {
    run->status = SF_INTERNAL_ERROR;
    run->message = std::string("internal error: ") + e.what() + " (please report it with the input files)";
    run->results_json = nlohmann::json{{"schema", "stepframe-results/1"}, {"status", "error"},
                                       {"exit_status", SF_INTERNAL_ERROR}, {"message", run->message}}
                             .dump(-1, ' ', false, nlohmann::json::error_handler_t::replace);
    run->summary = run->message;
  } catch (...) {
    run->status = SF_INTERNAL_ERROR;
    run->message = "internal error of an unknown kind (please report it with the input files)";
    run->results_json.clear();
    run->summary = run->message;
  }
  return run->status;
}

/// A call with a missing argument: the handle (if any) says so.
int refuse(sf_run* run, const char* why) {
  if (!run) return SF_INVALID_ARGUMENT;
  run->status = SF_INVALID_ARGUMENT;
  run->message = why;
  run->results_json.clear();
  run->summary = why;
  return run->status;
}

}  // namespace

extern "C" {

const sf_plugin_info* sf_plugin_descriptor(void) {
  static const sf_plugin_info info{"stepframe", library_version_string, SF_ABI_VERSION,
                                   "Steel frames from STEP wireframes: solve, check, VTK stress colours, results.json"};
  return &info;
}

int sf_abi_version(void) { return SF_ABI_VERSION; }

const char* sf_version(void) { return library_version_string; }

const char* sf_status_name(int status) {
  switch (status) {
    case SF_PASS: return "pass";
    case SF_CHECK_FAILED: return "check failed";
    case SF_BAD_INPUT: return "bad input";
    case SF_UNSTABLE: return "unstable frame";
    case SF_INTERNAL_ERROR: return "internal error";
    case SF_CANCELLED: return "cancelled";
    case SF_INVALID_ARGUMENT: return "invalid argument";
    default: return "unknown status";
  }
}

int sf_run_file(const char* project_yaml, const char* out_dir, char* message, size_t message_len) {
  if (!project_yaml) {
    copy_out("sf_run_file: no project file given", message, message_len);
    return SF_INVALID_ARGUMENT;
  }
  try {
    log_to_stderr_by_default();
    const std::filesystem::path project(project_yaml);
    stepframe::RunOptions options;
    options.out_dir = out_dir && *out_dir ? std::filesystem::path(out_dir) : stepframe::default_out_dir(project);
    const auto results = stepframe::run_file(project, options);
    std::string text = results.message();
    if (results.analysed()) {
      const auto& checks = results.analysis().checks;
      const auto failed = std::count_if(checks.begin(), checks.end(), [](const auto& c) { return !c.pass; });
      text = (failed == 0 ? "pass: " : "fail: ") + std::to_string(checks.size() - static_cast<std::size_t>(failed)) +
             " of " + std::to_string(checks.size()) + " checks pass; results in " + options.out_dir.string();
    }
    copy_out(text, message, message_len);
    return static_cast<int>(results.status());
  } catch (const std::exception& e) {
    copy_out(std::string("internal error: ") + e.what() + " (please report it with the input files)", message,
             message_len);
  } catch (...) {
    copy_out("internal error of an unknown kind (please report it with the input files)", message, message_len);
  }
  return SF_INTERNAL_ERROR;
}

sf_run* sf_run_new(void) { return new (std::nothrow) sf_run; }

void sf_run_free(sf_run* run) { delete run; }

int sf_run_set_out_dir(sf_run* run, const char* out_dir) {
  if (!run) return SF_INVALID_ARGUMENT;
  try {
    run->out_dir = out_dir ? std::filesystem::path(out_dir) : std::filesystem::path();
  } catch (...) {
    return SF_INTERNAL_ERROR;
  }
  return SF_PASS;
}

int sf_run_set_progress(sf_run* run, sf_progress_fn progress, void* user_data) {
  if (!run) return SF_INVALID_ARGUMENT;
  run->progress = progress;
  run->progress_data = user_data;
  return SF_PASS;
}

int sf_run_set_log(sf_run* run, sf_log_fn log, void* user_data, int min_level) {
  if (!run) return SF_INVALID_ARGUMENT;
  run->log = log;
  run->log_data = user_data;
  run->log_min_level = min_level;
  return SF_PASS;
}

int sf_run_cancel(sf_run* run) {
  if (!run) return SF_INVALID_ARGUMENT;
  run->cancel_requested = true;
  return SF_PASS;
}

int sf_run_reset_cancel(sf_run* run) {
  if (!run) return SF_INVALID_ARGUMENT;
  run->cancel_requested = false;
  return SF_PASS;
}

int sf_run_project_file(sf_run* run, const char* project_file) {
  if (!project_file) return refuse(run, "sf_run_project_file: no project file given");
  return guarded(run, [&](const stepframe::RunOptions& options) { return stepframe::run_file(project_file, options); });
}

int sf_run_project_text(sf_run* run, const char* project_text, const char* base_dir) {
  if (!project_text) return refuse(run, "sf_run_project_text: no project text given");
  return guarded(run, [&](const stepframe::RunOptions& options) {
    const auto base = base_dir ? std::filesystem::path(base_dir) : std::filesystem::current_path();
    return stepframe::run_text(project_text, base, options);
  });
}

int sf_run_project_text_with_step(sf_run* run, const char* project_text, const char* base_dir,
                                  const char* step_text, size_t step_len) {
  if (!project_text) return refuse(run, "sf_run_project_text_with_step: no project text given");
  if (!step_text) return refuse(run, "sf_run_project_text_with_step: no STEP text given");
  return guarded(run, [&](const stepframe::RunOptions& options) {
    const auto base = base_dir ? std::filesystem::path(base_dir) : std::filesystem::current_path();
    return stepframe::run_text(project_text, base, stepframe::StepText{std::string(step_text, step_len), "<STEP text>"},
                               options);
  });
}

int sf_run_status(const sf_run* run) { return run ? run->status : SF_INVALID_ARGUMENT; }

const char* sf_run_message(const sf_run* run) { return run ? run->message.c_str() : ""; }

const char* sf_run_results_json(const sf_run* run) {
  return run && !run->results_json.empty() ? run->results_json.c_str() : nullptr;
}

size_t sf_run_copy_results_json(const sf_run* run, char* buffer, size_t buffer_len) {
  if (!run) return 0;
  copy_out(run->results_json, buffer, buffer_len);
  return run->results_json.size();
}

const char* sf_run_summary(const sf_run* run) { return run ? run->summary.c_str() : ""; }

}  // extern "C"
