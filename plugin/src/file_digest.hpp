#pragma once
// SHA-256 (FIPS 180-4) of a file, by OpenSSL: the fingerprint of an input in
// the report and the batch stage's record of what it ran.

#include <filesystem>
#include <string>

namespace stepframe::detail {

/// Lowercase hex digest of the file's bytes; "unreadable" when it cannot be read.
std::string file_sha256(const std::filesystem::path& file);

}  // namespace stepframe::detail
