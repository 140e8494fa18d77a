// libFuzzer target: section designations as people type them
// (normalize_designation, find_catalogue_section, search_catalogue, nearest_designations).

#include "stepframe/analysis/section.hpp"

#include <cstddef>
#include <cstdint>
#include <stdexcept>
#include <string_view>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  if (size > 256) return 0;  // designations are short; long inputs only slow the edit distances
  const std::string_view text(reinterpret_cast<const char*>(data), size);
  (void)stepframe::analysis::normalize_designation(text);
  try {
    (void)stepframe::analysis::find_catalogue_section(text);
  } catch (const std::invalid_argument&) {
    // dimensions that make no section (a wall thicker than the tube) are refused
  }
  (void)stepframe::analysis::search_catalogue(text);
  (void)stepframe::analysis::nearest_designations(text, 3);
  return 0;
}
