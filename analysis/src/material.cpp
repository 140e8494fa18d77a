#include "stepframe/analysis/material.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <string>

namespace stepframe::analysis {
namespace {

constexpr double mpa = 1e6;
constexpr double gpa = 1e9;

// EN 1993-1-1 3.2.6(1): E = 210 000 N/mm^2, G = E / (2 (1 + nu)) ~ 81 000 N/mm^2.
constexpr double en_E = 210 * gpa;
constexpr double en_G = 81 * gpa;
// AISC 360 (Specification for Structural Steel Buildings), nomenclature:
// E = 29 000 ksi (~200 GPa), G = 11 200 ksi (~77.2 GPa).
constexpr double astm_E = 200 * gpa;
constexpr double astm_G = 77.2 * gpa;
// Steel density: 7850 kg/m^3 (common practice; EN 1991-1-1 Table A.4 lists
// 77.0-78.5 kN/m^3 for steel, from memory).
constexpr double steel_density = 7850;

struct Grade {
  const char* name;
  double fy;
  bool european;
};

// fy: EN 10025-2:2004 Table 7, minimum yield strength for nominal thickness <= 16 mm;
// ASTM A992/A992M Fy = 50 ksi [345 MPa]; ASTM A36/A36M Fy = 36 ksi [250 MPa].
constexpr std::array<Grade, 5> grades{{
    {"S235", 235 * mpa, true},
    {"S275", 275 * mpa, true},
    {"S355", 355 * mpa, true},
    {"A992", 345 * mpa, false},
    {"A36", 250 * mpa, false},
}};

// Upper case without spaces, and an EN 10025-2 quality suffix (JR, J0, J2, K2)
// dropped because it does not change the strength.
std::string grade_key(std::string_view name) {
  std::string key;
  for (const char c : name)
    if (!std::isspace(static_cast<unsigned char>(c))) key += static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  if (key.size() == 6 && key[0] == 'S') {
    const std::string suffix = key.substr(4);
    if (suffix == "JR" || suffix == "J0" || suffix == "J2" || suffix == "K2") key.resize(4);
  }
  return key;
}

}  // namespace

std::optional<Material> find_standard_material(std::string_view name) {
  const std::string key = grade_key(name);
  const auto it = std::find_if(grades.begin(), grades.end(), [&](const Grade& g) { return key == g.name; });
  if (it == grades.end()) return std::nullopt;
  Material m;
  m.name = it->name;
  m.E = it->european ? en_E : astm_E;
  m.G = it->european ? en_G : astm_G;
  m.fy = it->fy;
  m.density = steel_density;
  return m;
}

}  // namespace stepframe::analysis
