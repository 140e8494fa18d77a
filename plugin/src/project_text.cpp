#include "project_text.hpp"

#include "stepframe/errors.hpp"

#include <fmt/format.h>

#include <cerrno>
#include <cstring>
#include <fstream>
#include <map>
#include <vector>

namespace stepframe::detail {
namespace {

std::string at_line(const std::string& name, const YAML::Mark& mark) {
  return mark.line >= 0 ? fmt::format("{}:{}", name, mark.line + 1) : name;
}

/// The length of the UTF-8 sequence starting at `s[i]`, or 0 when it is not
/// one (RFC 3629: no overlong forms, no surrogates, nothing above U+10FFFF).
std::size_t utf8_length(std::string_view s, std::size_t i) {
  const auto byte = [&](std::size_t k) { return static_cast<unsigned char>(s[k]); };
  const unsigned char c = byte(i);
  if (c < 0x80) return 1;
  std::size_t n = 0;
  unsigned char low = 0x80, high = 0xBF;  // the allowed range of the second byte
  if (c >= 0xC2 && c <= 0xDF) n = 2;
  else if (c == 0xE0) n = 3, low = 0xA0;
  else if (c >= 0xE1 && c <= 0xEC) n = 3;
  else if (c == 0xED) n = 3, high = 0x9F;
  else if (c >= 0xEE && c <= 0xEF) n = 3;
  else if (c == 0xF0) n = 4, low = 0x90;
  else if (c >= 0xF1 && c <= 0xF3) n = 4;
  else if (c == 0xF4) n = 4, high = 0x8F;
  else return 0;
  if (i + n > s.size()) return 0;
  if (byte(i + 1) < low || byte(i + 1) > high) return 0;
  for (std::size_t k = 2; k < n; ++k)
    if (byte(i + k) < 0x80 || byte(i + k) > 0xBF) return 0;
  return n;
}

}  // namespace

std::string read_project_bytes(const std::filesystem::path& file) {
  const std::string name = file.string();
  std::error_code ec;
  const auto status = std::filesystem::status(file, ec);
  if (!std::filesystem::exists(status)) throw InputError(name + ": project file not found; check the path");
  if (std::filesystem::is_directory(status))
    throw InputError(name + ": is a folder, not a project file; give the path of the .yaml file");
  if (!std::filesystem::is_regular_file(status))
    throw InputError(name + ": is not a regular file (a pipe or a device?); give the path of a .yaml project file");
  const auto size = std::filesystem::file_size(file, ec);
  if (!ec && size > max_project_bytes)
    throw InputError(fmt::format("{}: the project file has {} bytes, more than the {} MiB a project may have; "
                                 "a project of a few thousand load cases is a few megabytes",
                                 name, size, max_project_bytes >> 20));
  errno = 0;
  std::ifstream in(file, std::ios::binary);
  if (!in)
    throw InputError(name + ": cannot be read (" + std::string(std::strerror(errno != 0 ? errno : EIO)) +
                     "); check its permissions");
  std::string text(static_cast<std::size_t>(ec ? 0 : size), '\0');
  in.read(text.data(), static_cast<std::streamsize>(text.size()));
  if (in.bad() || static_cast<std::size_t>(in.gcount()) != text.size())
    throw InputError(name + ": could not be read to its end; check the file");
  return text;
}

void require_utf8_text(std::string_view text, const std::string& name) {
  if (text.size() > max_project_bytes)
    throw InputError(fmt::format("{}: the project text has {} bytes, more than the {} MiB a project may have", name,
                                 text.size(), max_project_bytes >> 20));
  std::size_t line = 1, line_start = 0;
  for (std::size_t i = 0; i < text.size();) {
    const std::size_t n = utf8_length(text, i);
    if (n == 0)
      throw InputError(fmt::format("{}:{}: byte {} (column {}) is not UTF-8 text; save the project file as UTF-8",
                                   name, line, fmt::format("0x{:02X}", static_cast<unsigned char>(text[i])),
                                   i - line_start + 1));
    if (text[i] == '\n') ++line, line_start = i + 1;
    i += n;
  }
}

void require_distinct_plain_keys(const YAML::Node& root, const std::string& name) {
  // An explicit stack: the tree may be deep, and recursion is not needed.
  std::vector<YAML::Node> pending{root};
  // Aliases share their node, so the walk could revisit one exponentially often ("a billion laughs").
  constexpr std::size_t max_nodes = 4'000'000;
  std::size_t visited = 0;
  while (!pending.empty()) {
    if (++visited > max_nodes)
      throw InputError(name + ": the project expands to more than four million values (aliases used over and over?); "
                              "write the project without nested aliases");
    const YAML::Node node = pending.back();
    pending.pop_back();
    if (node.IsSequence()) {
      for (const auto& item : node) pending.push_back(item);
    } else if (node.IsMap()) {
      std::map<std::string, YAML::Mark> seen;
      for (const auto& item : node) {
        if (!item.first.IsScalar())
          throw InputError(at_line(name, item.first.Mark()) +
                           ": a key must be a plain name, not a list or a mapping; write it as text");
        const auto [first, inserted] = seen.emplace(item.first.Scalar(), item.first.Mark());
        if (!inserted)
          throw InputError(at_line(name, item.first.Mark()) + ": the key '" + item.first.Scalar() +
                           "' appears a second time in the same block (first on line " +
                           std::to_string(first->second.line + 1) + "); keep one of them");
        pending.push_back(item.second);
      }
    }
  }
}

}  // namespace stepframe::detail
