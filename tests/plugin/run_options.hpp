#pragma once
// Run options for tests that run a project through the C++ API.

#include "stepframe/api.hpp"

#include <filesystem>

namespace stepframe::test {

/// Options that write the outputs into `folder`.
inline RunOptions out_to(const std::filesystem::path& folder) {
  RunOptions options;
  options.out_dir = folder;
  return options;
}

}  // namespace stepframe::test
