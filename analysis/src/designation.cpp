// Designations as people type them: the canonical spelling, and shapes whose
// dimensions are written in the designation itself.

#include "section_spec.hpp"
#include "stepframe/analysis/section.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstddef>
#include <regex>
#include <string>

namespace stepframe::analysis {
namespace {

constexpr double mm = 1e-3;
constexpr double inch = 0.0254;  // exact by definition

bool is_digit(char c) { return std::isdigit(static_cast<unsigned char>(c)) != 0; }
bool is_alpha(char c) { return std::isalpha(static_cast<unsigned char>(c)) != 0; }

// "HE200B" / "HE200AA" (size before the series letter) -> "HEB200" / "HEAA200".
std::string series_letter_first(const std::string& s) {
  if (s.size() < 4 || s.compare(0, 2, "HE") != 0 || !is_digit(s[2])) return s;
  std::size_t i = 2;
  while (i < s.size() && (is_digit(s[i]) || s[i] == '.')) ++i;
  if (i == s.size()) return s;
  for (std::size_t j = i; j < s.size(); ++j)
    if (!is_alpha(s[j])) return s;
  return "HE" + s.substr(i) + s.substr(2, i - 2);
}

// "12", "6.3", "3/8" -> value; nothing for anything else.
std::optional<double> parse_number(const std::string& text) {
  const auto slash = text.find('/');
  if (slash != std::string::npos) {
    const auto num = parse_number(text.substr(0, slash)), den = parse_number(text.substr(slash + 1));
    if (!num || !den || *den == 0) return std::nullopt;
    return *num / *den;
  }
  double value = 0;
  const auto [end, error] = std::from_chars(text.data(), text.data() + text.size(), value);
  if (error != std::errc() || end != text.data() + text.size()) return std::nullopt;
  return value;
}

}  // namespace

std::string normalize_designation(std::string_view designation) {
  // Upper case without separators (spaces, hyphens, underscores); the
  // multiplication sign and '*' between sizes written 'X'.
  std::string packed;
  for (std::size_t i = 0; i < designation.size(); ++i) {
    const char c = designation[i];
    if (std::isspace(static_cast<unsigned char>(c)) || c == '-' || c == '_') continue;
    if (c == '\xC3' && i + 1 < designation.size() && designation[i + 1] == '\x97') {  // UTF-8 U+00D7
      packed += 'X';
      ++i;
      continue;
    }
    packed += c == '*' ? 'X' : static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  }
  // A dot survives only as a decimal point ("I.P.E." -> "IPE"; "X.280" -> "X0.280").
  std::string out;
  for (std::size_t i = 0; i < packed.size(); ++i) {
    if (packed[i] == '.') {
      const bool next_digit = i + 1 < packed.size() && is_digit(packed[i + 1]);
      if (!next_digit) continue;
      if (i == 0 || packed[i - 1] == 'X') out += '0';
      else if (!is_digit(packed[i - 1])) continue;
    }
    out += packed[i];
  }
  return series_letter_first(out);
}

namespace detail {

std::string format_number(double value) {
  char buffer[32];
  const auto [end, error] = std::to_chars(buffer, buffer + sizeof buffer, std::round(value * 1000) / 1000,
                                          std::chars_format::fixed, 3);
  std::string s(buffer, error == std::errc() ? end : buffer);
  while (!s.empty() && s.back() == '0') s.pop_back();
  if (!s.empty() && s.back() == '.') s.pop_back();
  return s;
}

std::optional<std::pair<double, double>> parse_metric_w(const std::string& normalized) {
  static const std::regex metric_w(R"(W(\d{3,4})X(\d+(?:\.\d+)?))");
  std::smatch m;
  if (!std::regex_match(normalized, m, metric_w)) return std::nullopt;
  const auto depth = parse_number(m[1]), mass = parse_number(m[2]);
  if (!depth || !mass) return std::nullopt;
  return std::pair{*depth, *mass};
}

std::optional<ShapeSpec> parse_dimension_designation(const std::string& key) {
  static const std::string num = R"((\d+(?:\.\d+)?))";
  static const std::string frac = R"((\d+/\d+|\d+(?:\.\d+)?))";
  static const std::regex hollow_rect("(SHS|RHS)" + num + "X" + num + "(?:X" + num + ")?(HF|CF)?");
  static const std::regex chs("CHS" + num + "X" + num + "(HF|CF)?");
  static const std::regex flat("(?:PL|FL|FLAT)" + num + "X" + num);
  static const std::regex round_bar("(?:RD|ROUND)" + num);
  static const std::regex angle("L" + frac + "X" + frac + "X" + frac);
  static const std::regex hss_rect("HSS" + frac + "X" + frac + "X" + frac);
  static const std::regex hss_round("HSS" + frac + "X" + frac);
  // Cheap test first: every such designation has a digit (most attribute values have none).
  if (std::none_of(key.begin(), key.end(), is_digit)) return std::nullopt;
  std::smatch m;
  ShapeSpec spec;
  const auto n = [&](std::size_t i) { return parse_number(m[i]).value_or(0.0); };
  const auto in_range = [](double x, double lo, double hi) { return x >= lo && x <= hi; };

  if (std::regex_match(key, m, hollow_rect)) {
    const bool square = m[1] == "SHS";
    const bool two = !m[4].matched;
    if (two && !square) return std::nullopt;
    const double h = n(2), b = two ? h : n(3), t = two ? n(3) : n(4);
    if (square && h != b) return std::nullopt;
    if (!in_range(t, 1, 60) || !in_range(h, 10, 1200) || !in_range(b, 10, 1200) || 2 * t >= std::min(h, b))
      return std::nullopt;
    const bool hot = m[5] == "HF";
    spec.family = square ? "SHS" : "RHS";
    spec.designation = spec.family + format_number(h) + "X" + format_number(b) + "X" + format_number(t) + (hot ? "HF" : "");
    spec.standard = hot ? "EN 10210-2:2006" : "EN 10219-2:2006";
    spec.kind = hot ? SpecKind::rhs_hot : SpecKind::rhs_cold;
    spec.v = {h * mm, b * mm, t * mm};
    return spec;
  }
  if (std::regex_match(key, m, chs)) {
    const double d = n(1), t = n(2);
    if (!in_range(t, 0.5, 100) || !in_range(d, 5, 3000) || 2 * t > d) return std::nullopt;
    const bool hot = m[3] == "HF";
    spec.family = "CHS";
    spec.designation = "CHS" + format_number(d) + "X" + format_number(t) + (hot ? "HF" : "");
    spec.standard = hot ? "EN 10210-2:2006" : "EN 10219-2:2006";
    spec.kind = hot ? SpecKind::chs_hot : SpecKind::chs_cold;
    spec.v = {d * mm, t * mm};
    return spec;
  }
  if (std::regex_match(key, m, flat)) {
    const double t = std::min(n(1), n(2)), b = std::max(n(1), n(2));
    if (!in_range(t, 1, 200) || !in_range(b, 5, 5000)) return std::nullopt;
    spec.family = "PL";
    spec.designation = "PL" + format_number(t) + "X" + format_number(b);
    spec.standard = "EN 10058 / EN 10029";
    spec.kind = SpecKind::flat;
    spec.v = {t * mm, b * mm};
    return spec;
  }
  if (std::regex_match(key, m, round_bar)) {
    const double d = n(1);
    if (!in_range(d, 3, 500)) return std::nullopt;
    spec.family = "RD";
    spec.designation = "RD" + format_number(d);
    spec.standard = "EN 10060";
    spec.kind = SpecKind::round_bar;
    spec.v = {d * mm};
    return spec;
  }
  if (std::regex_match(key, m, angle)) {
    const double a = n(1), b = n(2), t = n(3);
    // Inch sizes (ASTM A6) are written with fractions or are at most 12 in long.
    const bool inches = key.find('/') != std::string::npos || std::max(a, b) <= 12;
    const double unit = inches ? inch : mm;
    const double h = std::max(a, b) * unit, w = std::min(a, b) * unit, tt = t * unit;
    if (!(tt > 0) || 3 * tt >= w || w < 0.015) return std::nullopt;
    spec.family = "L";
    spec.designation = std::string("L") + m[1].str() + "X" + m[2].str() + "X" + m[3].str();
    spec.standard = inches ? "ASTM A6 (root radius taken as t)" : "EN 10056-1 (root radius taken as t)";
    spec.kind = SpecKind::angle;
    // Not a catalogue row: root radius t and toe radius t/2, about what
    // EN 10056-1 rolls (common practice).
    spec.v = {h, w, tt, tt, inches ? 0.0 : 0.5 * tt};
    return spec;
  }
  if (std::regex_match(key, m, hss_rect)) {
    const double h = n(1), b = n(2), t = n(3);
    if (!in_range(t, 0.05, 1.0) || !in_range(h, 1, 40) || !in_range(b, 1, 40) || 2 * t >= std::min(h, b))
      return std::nullopt;
    spec.family = "HSS";
    spec.designation = "HSS" + m[1].str() + "X" + m[2].str() + "X" + m[3].str();
    spec.standard = "ASTM A500 (design wall 0.93 t, AISC 360 B4.2)";
    spec.kind = SpecKind::rhs_radii;
    // AISC 360 B4.2: design wall thickness 0.93 t for electric-resistance-welded
    // HSS; outside corner radius 2 t_des for properties (AISC Manual, from memory).
    const double tdes = 0.93 * t * inch;
    spec.v = {h * inch, b * inch, tdes, 2 * tdes, tdes};
    return spec;
  }
  if (std::regex_match(key, m, hss_round)) {
    const double d = n(1), t = n(2);
    if (!in_range(t, 0.05, 1.0) || !in_range(d, 1, 40) || 2 * t >= d) return std::nullopt;
    spec.family = "HSS";
    spec.designation = "HSS" + m[1].str() + "X" + m[2].str();
    spec.standard = "ASTM A500 (design wall 0.93 t, AISC 360 B4.2)";
    spec.kind = SpecKind::chs_cold;
    spec.v = {d * inch, 0.93 * t * inch};
    return spec;
  }
  return std::nullopt;
}

}  // namespace detail
}  // namespace stepframe::analysis
