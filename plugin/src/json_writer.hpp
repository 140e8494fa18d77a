#pragma once
// A streaming JSON writer: text is appended to a buffer and handed to a sink
// in large pieces, so a document of hundreds of megabytes is never held whole
// (and never as a tree). Numbers are written with twelve significant digits
// (a relative rounding of 5e-13, far below any engineering tolerance, and a
// quarter of the text of the full 17); non-finite numbers become null.

#include "significant_digits.hpp"

#include <fmt/format.h>

#include <array>
#include <charconv>
#include <cmath>
#include <cstddef>
#include <functional>
#include <iterator>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::detail {

/// Length of the valid UTF-8 sequence starting at s[i] (RFC 3629 section 4), or 0.
inline std::size_t utf8_length(std::string_view s, std::size_t i) {
  const auto b = [&](std::size_t k) { return static_cast<unsigned char>(s[k]); };
  const unsigned char c = b(i);
  std::size_t n = 0;
  unsigned lo = 0x80, hi = 0xBF;
  if (c >= 0xC2 && c <= 0xDF) n = 2;
  else if (c >= 0xE0 && c <= 0xEF) n = 3, lo = c == 0xE0 ? 0xA0 : 0x80, hi = c == 0xED ? 0x9F : 0xBF;
  else if (c >= 0xF0 && c <= 0xF4) n = 4, lo = c == 0xF0 ? 0x90 : 0x80, hi = c == 0xF4 ? 0x8F : 0xBF;
  else return 0;
  if (i + n > s.size() || b(i + 1) < lo || b(i + 1) > hi) return 0;
  for (std::size_t k = 2; k < n; ++k)
    if (b(i + k) < 0x80 || b(i + k) > 0xBF) return 0;
  return n;
}

/// Appends `s` to `out` (a std::string or an fmt::memory_buffer) as a JSON string, RFC 8259 section 7:
/// quotation mark, reverse solidus and control characters escaped; a byte that does not start valid
/// UTF-8 becomes U+FFFD (names from CAD files are not always UTF-8).
template <class Buffer>
void append_json_string(Buffer& out, std::string_view s) {
  auto append = [&](std::string_view text) { out.append(text.data(), text.data() + text.size()); };
  out.push_back('"');
  // Plain ASCII (keys, names, clause texts: nearly everything) goes over in runs.
  auto plain = [](char c) {
    const auto u = static_cast<unsigned char>(c);
    return u >= 0x20 && u < 0x80 && c != '"' && c != '\\';
  };
  for (std::size_t i = 0; i < s.size(); ++i) {
    if (plain(s[i])) {
      std::size_t end = i + 1;
      while (end < s.size() && plain(s[end])) ++end;
      append(s.substr(i, end - i));
      i = end - 1;
      continue;
    }
    const char c = s[i];
    if (static_cast<unsigned char>(c) >= 0x80) {
      const std::size_t n = utf8_length(s, i);
      if (n == 0) append("\ufffd");
      else append(s.substr(i, n)), i += n - 1;
      continue;
    }
    switch (c) {
      case '"': append("\\\""); break;
      case '\\': append("\\\\"); break;
      case '\n': append("\\n"); break;
      case '\r': append("\\r"); break;
      case '\t': append("\\t"); break;
      default:
        if (static_cast<unsigned char>(c) < 0x20)
          fmt::format_to(std::back_inserter(out), "\\u{:04x}", static_cast<int>(c));
        else out.push_back(c);
    }
  }
  out.push_back('"');
}

/// `s` as a JSON string (append_json_string).
inline std::string json_string(std::string_view s) {
  std::string out;
  out.reserve(s.size() + 2);
  append_json_string(out, s);
  return out;
}

class JsonWriter {
 public:
  using Sink = std::function<void(std::string_view)>;

  explicit JsonWriter(Sink sink) : sink_(std::move(sink)) {}
  JsonWriter(const JsonWriter&) = delete;
  JsonWriter& operator=(const JsonWriter&) = delete;
  ~JsonWriter() { flush(); }

  void begin_object() { open('{'); }
  void end_object() { close('}'); }
  void begin_array() { open('['); }
  void end_array() { close(']'); }

  /// A key of the current object; the value follows.
  JsonWriter& key(std::string_view name) {
    separate();
    string_text(name);
    out_.push_back(':');
    after_key_ = true;
    return *this;
  }

  void value(double v) {
    separate();
    if (!std::isfinite(v)) return append("null");
    char text[32];  // 12 significant digits as printf's %.12g
    out_.append(text, significant_digits<12>(v, text));
  }
  void value(std::size_t v) {
    separate();
    integer(v);
  }
  void value(int v) {
    separate();
    integer(v);
  }
  void value(bool v) {
    separate();
    append(v ? "true" : "false");
  }
  void value(std::string_view v) {
    separate();
    string_text(v);
  }
  void value(const char* v) { value(std::string_view(v)); }
  void null() {
    separate();
    append("null");
  }
  template <class Range>
  void numbers(const Range& values) {
    begin_array();
    for (const auto& v : values) value(static_cast<double>(v));
    end_array();
  }
  template <std::size_t N>
  void bools(const std::array<bool, N>& values) {
    begin_array();
    for (bool v : values) value(v);
    end_array();
  }
  void strings(const std::vector<std::string>& values) {
    begin_array();
    for (const auto& v : values) value(std::string_view(v));
    end_array();
  }

  /// A line break (between the elements of a long array, so that the file
  /// reads and compares line by line).
  void newline() { out_.push_back('\n'); }

  /// Hands what is buffered to the sink.
  void flush() {
    if (out_.size() == 0) return;
    sink_(std::string_view(out_.data(), out_.size()));
    out_.clear();
  }

 private:
  void open(char c) {
    separate();
    out_.push_back(c);
    first_.push_back(true);
  }
  void close(char c) {
    out_.push_back(c);
    first_.pop_back();
    if (out_.size() > (1u << 20)) flush();
  }
  // A comma before every value or key but the first of its container (a value after its key needs none).
  void separate() {
    if (after_key_) {
      after_key_ = false;
      return;
    }
    if (first_.empty()) return;
    if (!first_.back()) out_.push_back(',');
    first_.back() = false;
  }
  void append(std::string_view text) { out_.append(text.data(), text.data() + text.size()); }
  template <class Integer>
  void integer(Integer v) {
    char text[24];
    out_.append(text, std::to_chars(text, text + sizeof text, v).ptr);
  }
  void string_text(std::string_view s) { append_json_string(out_, s); }

  Sink sink_;
  fmt::memory_buffer out_;
  std::vector<bool> first_;
  bool after_key_ = false;
};

}  // namespace stepframe::detail
