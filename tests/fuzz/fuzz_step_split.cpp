// libFuzzer target: the split of a large wireframe's STEP text into two parts for two processes
// (geometry/src/step_split.hpp), on text that passed the exchange-structure check, as read_step gives
// it. Besides running clean under the sanitizers, a split must be consistent: both parts or neither
// (the two processes decide alone), and each part passes the structure check the whole text passed.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/step_structure.hpp"

#include "step_split.hpp"

#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <optional>
#include <string>
#include <string_view>

namespace {

namespace sg = stepframe::geometry;

bool well_formed(std::string_view text) {
  try {
    sg::StepStructureCheck check("<fuzz>");
    check.feed(text);
    check.finish();
    return true;
  } catch (const sg::StepReadError&) {
    return false;
  }
}

[[noreturn]] void finding(const char* what) {
  std::fprintf(stderr, "fuzz_step_split: %s\n", what);
  std::abort();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view text(reinterpret_cast<const char*>(data), size);
  if (!well_formed(text)) return 0;
  // Two members or more: the small seeds split as a 10,000-member file does from the command line's 1,000.
  const std::optional<std::string> first = sg::detail::step_split_part(text, 2, 0);
  const std::optional<std::string> second = sg::detail::step_split_part(text, 2, 1);
  if (first.has_value() != second.has_value()) finding("one part split and the other not");
  if (first && !well_formed(*first)) finding("the first part fails the structure check the whole text passed");
  if (second && !well_formed(*second)) finding("the second part fails the structure check the whole text passed");
  return 0;
}
