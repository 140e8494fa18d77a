// The numbers of results.json: twelve significant digits, the text C's printf gives for "%.12g"
// (ISO C 7.21.6.1, the g conversion), finite numbers only.

#include "json_writer.hpp"

#include <nlohmann/json.hpp>

#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <cstdio>
#include <cstring>
#include <limits>
#include <random>
#include <string>

namespace {

std::string written(double v) {
  std::string text;
  {
    stepframe::detail::JsonWriter json([&](std::string_view piece) { text.append(piece); });
    json.value(v);
  }
  return text;
}

std::string printf_g12(double v) {
  char text[64];
  std::snprintf(text, sizeof text, "%.12g", v);
  return text;
}

}  // namespace

TEST_CASE("results.json numbers are printf's %.12g text, non-finite ones null", "[plugin][json]") {
  for (double v : {0.0, -0.0, 1.0, 345e6, 1e-5, 2.5, 0.1, 1.0 / 3, 1e15, 1e16, 1e21, 999999999999.5, 9.999999999995e-5,
                   -7.25e-12, 1e12, 5e-324, std::numeric_limits<double>::max()})
    CHECK(written(v) == printf_g12(v));
  // Every kind of double: random bit patterns (exponents over the whole range).
  std::mt19937_64 bits(20261203);
  int differ = 0;
  for (int i = 0; i < 200000; ++i) {
    const std::uint64_t b = bits();
    double v;
    std::memcpy(&v, &b, sizeof v);
    if (std::isfinite(v) && written(v) != printf_g12(v)) ++differ;
  }
  CHECK(differ == 0);
  CHECK(written(std::numeric_limits<double>::quiet_NaN()) == "null");
  CHECK(written(-std::numeric_limits<double>::infinity()) == "null");
}

namespace {

std::string written_text(std::string_view s) {
  std::string text;
  {
    stepframe::detail::JsonWriter json([&](std::string_view piece) { text.append(piece); });
    json.value(s);
  }
  return text;
}

}  // namespace

TEST_CASE("results.json strings: escapes of RFC 8259 section 7, invalid UTF-8 as U+FFFD", "[plugin][json]") {
  CHECK(written_text("IPE 300 / bay 2, frame #12") == "\"IPE 300 / bay 2, frame #12\"");
  CHECK(written_text("say \"hi\"\\now") == "\"say \\\"hi\\\"\\\\now\"");
  CHECK(written_text("a\nb\tc\rd") == "\"a\\nb\\tc\\rd\"");
  CHECK(written_text(std::string("x\x01y", 3)) == "\"x\\u0001y\"");
  CHECK(written_text("Stütze Ø 60") == "\"Stütze Ø 60\"");                 // valid UTF-8 goes through
  CHECK(written_text("bad \xff byte") == "\"bad \xef\xbf\xbd byte\"");      // U+FFFD for a stray byte
  CHECK(written_text("cut \xc3") == "\"cut \xef\xbf\xbd\"");                // a sequence cut short
  CHECK(written_text("") == "\"\"");
  // Any bytes at all give a string that a JSON parser reads back, printable ASCII unchanged.
  std::mt19937 bytes(20261203);
  for (int i = 0; i < 2000; ++i) {
    std::string s(static_cast<std::size_t>(bytes() % 40), ' ');
    for (char& c : s) c = static_cast<char>(i % 2 ? bytes() % 256 : 0x20 + bytes() % 95);
    const std::string text = written_text(s);
    REQUIRE_NOTHROW(nlohmann::json::parse(text));
    if (i % 2 == 0) CHECK(nlohmann::json::parse(text).get<std::string>() == s);
  }
}
