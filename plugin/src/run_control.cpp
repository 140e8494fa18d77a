#include "stepframe/run_control.hpp"

#include "stepframe/geometry/step_reader.hpp"

#include <spdlog/spdlog.h>

namespace stepframe {

geometry::StepReadOptions RunControl::step_read_options() const {
  geometry::StepReadOptions read;
  read.two_processes_from = two_process_read_from;
  return read;
}

ScopedLogSink::ScopedLogSink(spdlog::sink_ptr sink, spdlog::level::level_enum level) {
  if (!sink) return;
  previous_ = spdlog::default_logger();
  // Not registered by name: the run's logger lives only as the default, for this scope.
  auto logger = std::make_shared<spdlog::logger>("stepframe-run", std::move(sink));
  logger->set_level(level);
  spdlog::set_default_logger(std::move(logger));
  active_ = true;
}

ScopedLogSink::~ScopedLogSink() {
  if (active_) spdlog::set_default_logger(previous_);
}

}  // namespace stepframe
