#pragma once
// A double as printf's "%.Pg" writes it for P up to 12 (ISO C 7.21.6.1, the g
// conversion: P significant digits, correctly rounded, trailing zeros
// dropped, exponent form below 1e-4 and from 10^P), in less than half the
// time of std::to_chars with a precision (a results.json holds millions of
// numbers, the report's 3D view some hundred thousand).
//
// For 1e-30 <= |v| < 1e30 the digits come from one product m = |v| 10^k in
// [10^(P-1), 10^P): the power is the double nearest to 10^k and the product
// is rounded once (each a relative error of at most 2^-53), so m is within
// 2^-52 m < 2^-12 of the exact value (m < 10^12 < 2^40) and its nearest
// integer is the correctly rounded one unless m lies within 2^-10 of a half.
// Those numbers, and every other (zero, the extremes, subnormals), are
// written by std::to_chars, which is exact throughout.

#include <array>
#include <charconv>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstring>

namespace stepframe::detail {
namespace significant_digits_detail {

// 10^k for k = -44..44, each the double nearest to it (literals are rounded correctly).
inline constexpr std::array<double, 89> powers = {
    1e-44, 1e-43, 1e-42, 1e-41, 1e-40, 1e-39, 1e-38, 1e-37, 1e-36, 1e-35, 1e-34, 1e-33, 1e-32, 1e-31, 1e-30,
    1e-29, 1e-28, 1e-27, 1e-26, 1e-25, 1e-24, 1e-23, 1e-22, 1e-21, 1e-20, 1e-19, 1e-18, 1e-17, 1e-16, 1e-15,
    1e-14, 1e-13, 1e-12, 1e-11, 1e-10, 1e-9,  1e-8,  1e-7,  1e-6,  1e-5,  1e-4,  1e-3,  1e-2,  1e-1,  1e0,
    1e1,   1e2,   1e3,   1e4,   1e5,   1e6,   1e7,   1e8,   1e9,   1e10,  1e11,  1e12,  1e13,  1e14,  1e15,
    1e16,  1e17,  1e18,  1e19,  1e20,  1e21,  1e22,  1e23,  1e24,  1e25,  1e26,  1e27,  1e28,  1e29,  1e30,
    1e31,  1e32,  1e33,  1e34,  1e35,  1e36,  1e37,  1e38,  1e39,  1e40,  1e41,  1e42,  1e43,  1e44};

inline constexpr char digit_pairs[] =
    "00010203040506070809101112131415161718192021222324252627282930313233343536373839"
    "40414243444546474849505152535455565758596061626364656667686970717273747576777879"
    "8081828384858687888990919293949596979899";

template <int P>
char* exact(double v, char* out) {
  return std::to_chars(out, out + 32, v, std::chars_format::general, P).ptr;
}

// 10^n for n = 0..12.
inline constexpr std::array<std::uint64_t, 13> integer_powers = {
    1,         10,         100,         1000,         10000,         100000,        1000000,
    10000000,  100000000,  1000000000,  10000000000,  100000000000,  1000000000000};

inline void copy(char*& out, const char* from, int count) {
  std::memcpy(out, from, static_cast<std::size_t>(count));
  out += count;
}

}  // namespace significant_digits_detail

/// Writes v as "%.Pg" would at `out` (room for 32 characters) and returns the end.
template <int P>
char* significant_digits(double v, char* out) {
  static_assert(P >= 1 && P <= 12, "the error bound above holds for up to 12 digits");
  namespace d = significant_digits_detail;
  constexpr std::uint64_t top = d::integer_powers[P];  // m lies in [top / 10, top)
  const double a = std::abs(v);
  if (!(a >= 1e-30 && a < 1e30)) return d::exact<P>(v, out);
  std::uint64_t bits = 0;
  std::memcpy(&bits, &a, sizeof bits);
  const int e2 = static_cast<int>(bits >> 52) - 1023;  // a = 1.f 2^e2
  int x = (e2 * 78913) >> 18;  // floor(e2 log10 2) for |e2| < 1600: a's decimal exponent or one less
  auto scaled = [&] { return a * d::powers[static_cast<std::size_t>(P - 1 - x + 44)]; };
  double m = scaled();
  if (m >= static_cast<double>(top)) ++x, m = scaled();
  if (m < static_cast<double>(top / 10) - 0.5 || m >= static_cast<double>(top)) return d::exact<P>(v, out);
  const auto whole = static_cast<std::uint64_t>(m);  // m > 0: truncation is the floor
  const double fraction = m - static_cast<double>(whole);
  if (std::abs(fraction - 0.5) < 0x1p-10) return d::exact<P>(v, out);  // too near a tie to round here
  std::uint64_t q = whole + (fraction > 0.5 ? 1 : 0);
  if (q == top) q = top / 10, ++x;  // rounded up to the next decade
  char digits[12];
  int i = P;
  for (; i >= 2; q /= 100) i -= 2, std::memcpy(digits + i, d::digit_pairs + 2 * (q % 100), 2);
  if (i == 1) digits[0] = static_cast<char>('0' + q);
  int length = P;
  while (length > 1 && digits[length - 1] == '0') --length;

  if (v < 0) *out++ = '-';
  if (x < -4 || x >= P) {  // d.ddde-XX: exponent at least two digits (|x| <= 30 here)
    *out++ = digits[0];
    if (length > 1) *out++ = '.', d::copy(out, digits + 1, length - 1);
    *out++ = 'e';
    *out++ = x < 0 ? '-' : '+';
    d::copy(out, d::digit_pairs + 2 * std::abs(x), 2);
  } else if (x < 0) {  // 0.000ddd
    *out++ = '0';
    *out++ = '.';
    for (int zeros = 1; zeros < -x; ++zeros) *out++ = '0';
    d::copy(out, digits, length);
  } else {  // ddd or ddd.ddd
    const int point = x + 1;
    if (length <= point) return d::copy(out, digits, point), out;
    d::copy(out, digits, point);
    *out++ = '.';
    d::copy(out, digits + point, length - point);
  }
  return out;
}

}  // namespace stepframe::detail
