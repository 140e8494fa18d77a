// libFuzzer target: the STEP exchange-structure check (geometry::StepStructureCheck),
// fed the input in two pieces split at its first byte's value, as read_step feeds blocks.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/step_structure.hpp"

#include <cstddef>
#include <cstdint>
#include <string_view>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view text(reinterpret_cast<const char*>(data), size);
  const std::size_t split = size == 0 ? 0 : data[0] % size;
  try {
    stepframe::geometry::StepStructureCheck check("<fuzz>");
    check.feed(text.substr(0, split));
    check.feed(text.substr(split));
    check.finish();
  } catch (const stepframe::geometry::StepReadError&) {
    // a refusal with a message is the expected outcome for most inputs
  }
  return 0;
}
