#pragma once
// What a project file must be before its YAML is read: a regular file of a
// bounded size, UTF-8 text, and mappings whose keys are plain, distinct values
// (yaml-cpp keeps both of two equal keys and silently reads one of them).

#include <yaml-cpp/yaml.h>

#include <cstddef>
#include <filesystem>
#include <string>
#include <string_view>

namespace stepframe::detail {

/// The largest project file or text read [bytes]: a project of a few thousand
/// load cases is a few megabytes.
inline constexpr std::size_t max_project_bytes = 16u << 20;

/// The most load cases, and the most combinations, a project may define.
inline constexpr std::size_t max_results = 10000;

/// The bytes of a project file. Throws InputError when it does not exist, is
/// not a regular file (a folder, a FIFO, a device), cannot be read (naming
/// the reason, e.g. permission denied) or is larger than max_project_bytes.
std::string read_project_bytes(const std::filesystem::path& file);

/// Throws InputError naming `name`, the line and column of the first byte
/// sequence that is not UTF-8, and when the text is larger than max_project_bytes.
void require_utf8_text(std::string_view text, const std::string& name);

/// Throws InputError at the second of two equal keys of one mapping (naming
/// both lines), and at a key that is a list or a mapping. Walks the whole tree.
void require_distinct_plain_keys(const YAML::Node& root, const std::string& name);

}  // namespace stepframe::detail
