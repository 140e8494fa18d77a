// libFuzzer target: STEP text through the structure check and, when it passes,
// OCCT's parse and transfer (geometry::read_step_text). Slow per input: run it
// with a corpus of small files.

#include "stepframe/geometry/step_reader.hpp"

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
    (void)stepframe::geometry::read_step_text(std::string_view(reinterpret_cast<const char*>(data), size), "<fuzz>");
  } catch (const stepframe::geometry::StepReadError&) {
  }
  return 0;
}
