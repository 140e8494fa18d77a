// libFuzzer target: project text through every check and block reader
// (read_project_text); InputError is the expected refusal.

#include "stepframe/errors.hpp"
#include "stepframe/project_reader.hpp"

#include <spdlog/spdlog.h>

#include <cstddef>
#include <cstdint>
#include <string_view>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  static const bool quiet = [] {
    spdlog::set_level(spdlog::level::off);
    return true;
  }();
  (void)quiet;
  try {
    (void)stepframe::read_project_text(std::string_view(reinterpret_cast<const char*>(data), size), "/nonexistent",
                                       "<fuzz>");
  } catch (const stepframe::InputError&) {
  }
  return 0;
}
