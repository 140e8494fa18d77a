#include "stepframe/geometry/length_unit.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <utility>

namespace stepframe::geometry {

namespace {

struct UnitRow {
  std::string_view short_name;
  double metres;
};

// SI prefixes: ISO 80000-1 / SI brochure. Inch, foot, mile: international
// yard and pound agreement (1959), 1 yd = 0.9144 m exactly.
constexpr std::array<UnitRow, 8> unit_table{{
    {"mm", 1e-3},
    {"cm", 1e-2},
    {"m", 1.0},
    {"km", 1e3},
    {"um", 1e-6},
    {"inch", 0.0254},
    {"ft", 0.3048},
    {"mile", 1609.344},
}};

// Spellings met in STEP files (SI_UNIT prefix + name, CONVERSION_BASED_UNIT
// names) and in OCCT's unit dumps, upper-cased with separators removed.
constexpr std::array<std::pair<std::string_view, std::string_view>, 20> spellings{{
    {"MILLIMETRE", "mm"}, {"MILLIMETER", "mm"}, {"MM", "mm"},
    {"CENTIMETRE", "cm"}, {"CENTIMETER", "cm"}, {"CM", "cm"},
    {"METRE", "m"},       {"METER", "m"},       {"M", "m"},
    {"KILOMETRE", "km"},  {"KILOMETER", "km"},  {"KM", "km"},
    {"MICROMETRE", "um"}, {"MICROMETER", "um"}, {"MICRON", "um"},
    {"INCH", "inch"},     {"IN", "inch"},
    {"FOOT", "ft"},       {"FT", "ft"},
    {"MILE", "mile"},
}};

}  // namespace

std::optional<double> metres_per_unit(std::string_view unit) {
  const auto row = std::find_if(unit_table.begin(), unit_table.end(),
                                [&](const UnitRow& r) { return r.short_name == unit; });
  if (row == unit_table.end()) return std::nullopt;
  return row->metres;
}

std::optional<std::string> short_length_unit_name(std::string_view step_name) {
  std::string key;
  for (const char c : step_name) {
    if (std::isalpha(static_cast<unsigned char>(c)) != 0)
      key.push_back(static_cast<char>(std::toupper(static_cast<unsigned char>(c))));
  }
  const auto hit = std::find_if(spellings.begin(), spellings.end(),
                                [&](const auto& s) { return s.first == key; });
  if (hit == spellings.end()) return std::nullopt;
  return std::string(hit->second);
}

}  // namespace stepframe::geometry
