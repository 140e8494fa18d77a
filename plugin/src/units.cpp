#include "stepframe/units.hpp"

#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstdlib>
#include <string>

namespace stepframe {
namespace {

struct NamedUnit {
  std::string_view name;
  double si;
  Dimension dimension;
};

// Exact SI factors: inch = 0.0254 m and pound = 0.45359237 kg (international yard
// and pound agreement, 1959); lbf = pound x standard gravity 9.80665 m/s^2 (CGPM 1901).
constexpr double inch = 0.0254;
constexpr double lbf = 0.45359237 * 9.80665;

constexpr std::array<NamedUnit, 23> known_units{{
    {"m", 1.0, dimension::length},
    {"mm", 1e-3, dimension::length},
    {"cm", 1e-2, dimension::length},
    {"km", 1e3, dimension::length},
    {"in", inch, dimension::length},
    {"inch", inch, dimension::length},
    {"ft", 12 * inch, dimension::length},
    {"foot", 12 * inch, dimension::length},
    {"N", 1.0, dimension::force},
    {"kN", 1e3, dimension::force},
    {"MN", 1e6, dimension::force},
    {"lbf", lbf, dimension::force},
    {"kip", 1e3 * lbf, dimension::force},
    {"kg", 1.0, dimension::mass},
    {"t", 1e3, dimension::mass},
    {"lb", 0.45359237, dimension::mass},
    {"Pa", 1.0, dimension::stress},
    {"kPa", 1e3, dimension::stress},
    {"MPa", 1e6, dimension::stress},
    {"GPa", 1e9, dimension::stress},
    {"psi", lbf / (inch * inch), dimension::stress},
    {"ksi", 1e3 * lbf / (inch * inch), dimension::stress},
    {"kNm", 1e3, dimension::moment},
}};

Dimension scaled(Dimension d, int power) { return {d.length * power, d.force * power, d.mass * power}; }
Dimension plus(Dimension a, Dimension b) {
  return {a.length + b.length, a.force + b.force, a.mass + b.mass};
}

std::string_view trim(std::string_view s) {
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.front()))) s.remove_prefix(1);
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.back()))) s.remove_suffix(1);
  return s;
}

// One factor such as "mm2", "m^3" or "kN": a known unit name and an optional power.
std::optional<Unit> parse_factor(std::string_view text) {
  text = trim(text);
  std::size_t split = text.size();
  while (split > 0 && (std::isdigit(static_cast<unsigned char>(text[split - 1])) || text[split - 1] == '^'))
    --split;
  std::string_view name = text.substr(0, split);
  std::string_view power_text = text.substr(split);
  if (!power_text.empty() && power_text.front() == '^') power_text.remove_prefix(1);
  int power = 1;
  if (!power_text.empty()) {
    auto [ptr, ec] = std::from_chars(power_text.data(), power_text.data() + power_text.size(), power);
    if (ec != std::errc{} || ptr != power_text.data() + power_text.size()) return std::nullopt;
  }
  for (const auto& u : known_units) {
    if (u.name == name) return Unit{std::pow(u.si, power), scaled(u.dimension, power)};
  }
  return std::nullopt;
}

}  // namespace

std::string describe(Dimension d) {
  if (d == dimension::length) return "length";
  if (d == dimension::area) return "area";
  if (d == dimension::section_modulus) return "section modulus";
  if (d == dimension::second_moment) return "second moment of area";
  if (d == dimension::force) return "force";
  if (d == dimension::moment) return "moment";
  if (d == dimension::line_load) return "force per length";
  if (d == dimension::stress) return "stress";
  if (d == dimension::density) return "density (mass per volume)";
  if (d == dimension::mass) return "mass";
  if (d == dimension::none) return "plain number";
  return "length^" + std::to_string(d.length) + " force^" + std::to_string(d.force) + " mass^" +
         std::to_string(d.mass);
}

std::optional<Unit> parse_unit(std::string_view text) {
  text = trim(text);
  if (text.empty()) return std::nullopt;
  Unit result{1.0, dimension::none};
  int sign = 1;  // +1 before the first '/', -1 after it
  std::size_t start = 0;
  for (std::size_t i = 0; i <= text.size(); ++i) {
    const bool end = i == text.size();
    if (end || text[i] == '*' || text[i] == '/' || text[i] == '.' || text[i] == ' ') {
      const std::string_view part = text.substr(start, i - start);
      if (!trim(part).empty()) {
        auto factor = parse_factor(part);
        if (!factor) return std::nullopt;
        result.si *= std::pow(factor->si, sign);
        result.dimension = plus(result.dimension, scaled(factor->dimension, sign));
      } else if (!end && text[i] != ' ') {
        return std::nullopt;  // "kN//m", "*m"
      }
      if (!end && text[i] == '/') sign = -1;
      start = i + 1;
    }
  }
  return result;
}

std::optional<Quantity> parse_quantity(std::string_view text) {
  text = trim(text);
  const std::string owned(text);
  char* end = nullptr;
  const double value = std::strtod(owned.c_str(), &end);
  if (end == owned.c_str() || !std::isfinite(value)) return std::nullopt;
  const std::string_view rest = trim(std::string_view(owned).substr(static_cast<std::size_t>(end - owned.c_str())));
  if (rest.empty()) return Quantity{value, dimension::none};
  auto unit = parse_unit(rest);
  if (!unit) return std::nullopt;
  return Quantity{value * unit->si, unit->dimension};
}

double UnitSystem::si_per_bare(Dimension d) const {
  if (d == dimension::density) return 1.0;  // kg/m^3
  if (d == dimension::stress && stress) return stress->si;
  if (d == dimension::line_load && line_load) return line_load->si;
  return std::pow(length.si, d.length) * std::pow(force.si, d.force);
}

std::string UnitSystem::describe_bare(Dimension d) const {
  if (d == dimension::density) return "kg/m3";
  if (d == dimension::mass) return "kg";
  if (d == dimension::stress && stress) return stress_name;
  if (d == dimension::line_load && line_load) return line_load_name;
  std::string numerator, denominator;
  auto append = [](std::string& s, const std::string& unit, int power) {
    if (power == 0) return;
    if (!s.empty()) s += "*";
    s += unit;
    if (power > 1) s += std::to_string(power);
  };
  append(d.force >= 0 ? numerator : denominator, force_name, std::abs(d.force));
  append(d.length >= 0 ? numerator : denominator, length_name, std::abs(d.length));
  if (numerator.empty()) numerator = "1";
  return denominator.empty() ? numerator : numerator + "/" + denominator;
}

}  // namespace stepframe
