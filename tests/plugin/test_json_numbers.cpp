// The numbers of results.json: twelve significant digits, the text C's printf gives for "%.12g"
// (ISO C 7.21.6.1, the g conversion), finite numbers only.

#include "json_writer.hpp"
#include "significant_digits.hpp"

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

// significant_digits.hpp rounds in double arithmetic for 1e-30 <= |v| < 1e30 and leaves numbers near a
// rounding tie to std::to_chars: every path against printf, where the numbers of a frame lie.
TEST_CASE("results.json numbers of engineering size, near ties and at decade edges are printf's %.12g text",
          "[plugin][json]") {
  std::mt19937_64 random(20261204);
  std::uniform_real_distribution<double> exponent(-31.0, 31.0), sign(-1.0, 1.0);
  std::uniform_int_distribution<std::uint64_t> twelve(100000000000ULL, 999999999999ULL);
  std::uniform_int_distribution<int> decade(-40, 28);
  int differ = 0, tried = 0;
  auto compare = [&](double v) {
    ++tried;
    if (written(v) != printf_g12(v)) ++differ;
  };
  for (int i = 0; i < 200000; ++i) compare(std::copysign(std::pow(10.0, exponent(random)), sign(random)));
  for (int i = 0; i < 100000; ++i) {  // twelve digits and a half: the tie, and its neighbours on either side
    const double tie = (static_cast<double>(twelve(random)) + 0.5) * std::pow(10.0, decade(random));
    for (double v : {tie, std::nextafter(tie, 0.0), std::nextafter(tie, 1e300)}) compare(v), compare(-v);
  }
  for (int k = -35; k <= 35; ++k) {  // powers of ten and the numbers that round up to them
    const double p = std::pow(10.0, k);
    for (double v : {p, std::nextafter(p, 0.0), std::nextafter(p, 1e300), 0.99999999999951 * p, 0.99999999999949 * p,
                     1.00000000000049 * p, 1.00000000000051 * p})
      compare(v), compare(-v);
  }
  for (int i = -1000; i <= 1000; ++i) compare(i / 8.0), compare(i * 1e5), compare(i * 1e-4);  // exact short ones
  CHECK(tried > 800000);
  CHECK(differ == 0);
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
    // The report's 3D view quotes its names with the same escapes (report_view.cpp); printable ASCII
    // as nlohmann's own writer gives it.
    CHECK(stepframe::detail::json_string(s) == text);
    if (i % 2 == 0) CHECK(stepframe::detail::json_string(s) == nlohmann::json(s).dump());
  }
}

// The report's 3D view writes five significant digits with the same code (report_view.cpp).
TEST_CASE("five significant digits are printf's %.5g text", "[plugin][json]") {
  auto g5 = [](double v) {
    char text[32], expected[64];
    std::snprintf(expected, sizeof expected, "%.5g", v);
    return std::string(text, stepframe::detail::significant_digits<5>(v, text)) == expected;
  };
  std::mt19937_64 random(5);
  std::uniform_real_distribution<double> exponent(-31.0, 31.0), sign(-1.0, 1.0);
  std::uniform_int_distribution<int> five(10000, 99999), decade(-35, 25);
  int differ = 0;
  for (int i = 0; i < 100000; ++i) {
    if (!g5(std::copysign(std::pow(10.0, exponent(random)), sign(random)))) ++differ;
    const double tie = (five(random) + 0.5) * std::pow(10.0, decade(random));
    for (double v : {tie, std::nextafter(tie, 0.0), std::nextafter(tie, 1e300), -tie})
      if (!g5(v)) ++differ;
  }
  for (double v : {0.0, -0.0, 99999.5, 99999.4, 0.000099999, 1e-5, 12345.0, 0.1, 1.0 / 3, 5e-324, 1e300})
    if (!g5(v)) ++differ;
  CHECK(differ == 0);
}
