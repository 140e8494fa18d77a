#include "stepframe/analysis/material.hpp"

#include "stepframe/analysis/section.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <initializer_list>
#include <string>

namespace stepframe::analysis {
namespace {

constexpr double mpa = 1e6;
constexpr double gpa = 1e9;
constexpr double mm = 1e-3;
constexpr double ksi = 6.894757293e6;  // Pa: 1000 lbf/in^2 (exact definitions of lbf and inch)
constexpr double inch = 0.0254;

// EN 1993-1-1 3.2.6(1): E = 210 000 N/mm^2, nu = 0.3, G = E / (2 (1 + nu)) ~ 81 000 N/mm^2,
// alpha = 12e-6 per K.
constexpr double en_E = 210 * gpa;
constexpr double en_G = 81 * gpa;
// AISC 360 (Specification for Structural Steel Buildings), nomenclature:
// E = 29 000 ksi (~200 GPa), G = 11 200 ksi (~77.2 GPa) (from memory).
constexpr double astm_E = 200 * gpa;
constexpr double astm_G = 77.2 * gpa;
// Thermal expansion 6.5e-6 per degree F (AISC Manual, from memory) = 11.7e-6 per K.
constexpr double astm_alpha = 11.7e-6;
// Steel density: 7850 kg/m^3 (common practice; EN 1991-1-1 Table A.4 lists
// 77.0-78.5 kN/m^3 for steel, from memory).
constexpr double steel_density = 7850;

struct Grade {
  const char* name;
  const char* standard;
  bool european;
  std::vector<StrengthBand> bands;
  std::vector<StrengthBand> round_bands{};
};

// Rows {t_max [mm], fy [MPa], fu [MPa]}.
std::vector<StrengthBand> en_bands(std::initializer_list<std::array<double, 3>> rows) {
  std::vector<StrengthBand> out;
  for (const auto& r : rows) out.push_back({r[0] * mm, r[1] * mpa, r[2] * mpa});
  return out;
}
// Rows {t_max [in], Fy [ksi], Fu [ksi]}.
std::vector<StrengthBand> astm_bands(std::initializer_list<std::array<double, 3>> rows) {
  std::vector<StrengthBand> out;
  for (const auto& r : rows) out.push_back({r[0] * inch, r[1] * ksi, r[2] * ksi});
  return out;
}

const std::vector<Grade>& grades() {
  // Built once; immutable.
  static const std::vector<Grade> all = [] {
    std::vector<Grade> g;
    // EN 10025-2:2004 Table 7, minimum yield strength ReH by nominal thickness
    // (<= 16, 40, 63, 80, 100, 150, 200, 250 mm) and Table 7 tensile strength Rm
    // (lower limit; 3..100, 100..150, 150..250 mm). The bands are those of the
    // standard; the values are from memory.
    g.push_back({"S235", "EN 10025-2", true,
                 en_bands({{16, 235, 360}, {40, 225, 360}, {63, 215, 360}, {80, 215, 360}, {100, 215, 360},
                           {150, 195, 350}, {200, 185, 340}, {250, 175, 340}})});
    g.push_back({"S275", "EN 10025-2", true,
                 en_bands({{16, 275, 410}, {40, 265, 410}, {63, 255, 410}, {80, 245, 410}, {100, 235, 410},
                           {150, 225, 400}, {200, 215, 380}, {250, 205, 380}})});
    g.push_back({"S355", "EN 10025-2", true,
                 en_bands({{16, 355, 470}, {40, 345, 470}, {63, 335, 470}, {80, 325, 470}, {100, 315, 470},
                           {150, 295, 450}, {200, 285, 450}, {250, 275, 450}})});
    // EN 10025-2:2019 Table 7 (S460 added in that edition), up to 150 mm; from memory.
    g.push_back({"S460", "EN 10025-2:2019", true,
                 en_bands({{16, 460, 540}, {40, 440, 540}, {63, 420, 540}, {80, 400, 540}, {100, 390, 540},
                           {150, 390, 530}})});
    // EN 10210-1:2006 Table A.3 / B.3 (hot finished hollow sections, <= 16, 40, 63,
    // 80, 100, 120 mm); EN 10219-1 cold formed sections (t <= 40 mm) have the same
    // first two bands. From memory.
    g.push_back({"S235H", "EN 10210-1 / EN 10219-1", true,
                 en_bands({{16, 235, 360}, {40, 225, 360}, {63, 215, 360}, {80, 215, 360}, {100, 215, 360},
                           {120, 195, 350}})});
    g.push_back({"S275H", "EN 10210-1 / EN 10219-1", true,
                 en_bands({{16, 275, 410}, {40, 265, 410}, {63, 255, 410}, {80, 245, 410}, {100, 235, 410},
                           {120, 225, 400}})});
    g.push_back({"S355H", "EN 10210-1 / EN 10219-1", true,
                 en_bands({{16, 355, 470}, {40, 345, 470}, {63, 335, 470}, {80, 325, 470}, {100, 315, 470},
                           {120, 295, 450}})});
    g.push_back({"S420H", "EN 10210-1 / EN 10219-1", true,
                 en_bands({{16, 420, 520}, {40, 400, 520}, {63, 390, 520}, {80, 370, 520}, {100, 360, 520},
                           {120, 340, 500}})});
    g.push_back({"S460H", "EN 10210-1 / EN 10219-1", true,
                 en_bands({{16, 460, 540}, {40, 440, 540}, {63, 430, 540}, {80, 410, 540}, {100, 400, 540},
                           {120, 380, 530}})});
    // ASTM A992/A992M: Fy = 50 ksi, Fu = 65 ksi (all W shapes).
    g.push_back({"A992", "ASTM A992", false, astm_bands({{1e3, 50, 65}})});
    // ASTM A36/A36M: Fy = 36 ksi, Fu = 58 ksi; plates over 8 in: Fy = 32 ksi (from memory).
    g.push_back({"A36", "ASTM A36", false, astm_bands({{8, 36, 58}, {1e3, 32, 58}})});
    // ASTM A572/A572M Grade 50: Fy = 50 ksi, Fu = 65 ksi (shapes and plates to 4 in).
    g.push_back({"A572GR50", "ASTM A572", false, astm_bands({{1e3, 50, 65}})});
    // ASTM A500 (AISC Manual Table 2-4, from memory): Grade B rectangular Fy = 46 ksi,
    // round 42 ksi, Fu = 58 ksi; Grade C rectangular 50 ksi, round 46 ksi, Fu = 62 ksi.
    g.push_back({"A500GRB", "ASTM A500", false, astm_bands({{1e3, 46, 58}}), astm_bands({{1e3, 42, 58}})});
    g.push_back({"A500GRC", "ASTM A500", false, astm_bands({{1e3, 50, 62}}), astm_bands({{1e3, 46, 62}})});
    return g;
  }();
  return all;
}

// Upper case without spaces, dots, hyphens and underscores; quality suffixes
// that do not change the strength dropped (EN 10025-2 JR, J0, J2, K2; EN 10025-3/4
// and EN 10210 N, NL, M, ML); ASTM grade spellings unified ("A572-50" -> "A572GR50").
std::string grade_key(std::string_view name) {
  std::string key;
  for (const char c : name)
    if (!std::isspace(static_cast<unsigned char>(c)) && c != '.' && c != '-' && c != '_')
      key += static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  if (key.size() >= 4 && key[0] == 'S' && std::isdigit(static_cast<unsigned char>(key[1]))) {
    const bool hollow = key.back() == 'H';
    std::string base = key.substr(0, 4);
    std::string suffix = key.substr(4, key.size() - 4 - (hollow ? 1 : 0));
    for (const char* q : {"JR", "J0", "J2", "K2", "NL", "ML", "N", "M"})
      if (suffix == q) suffix.clear();
    if (suffix.empty()) return base + (hollow ? "H" : "");
    return key;
  }
  for (const char* g : {"A572", "A500"}) {
    if (key.rfind(g, 0) != 0) continue;
    std::string rest = key.substr(4);
    if (rest.rfind("GRADE", 0) == 0) rest = rest.substr(5);
    else if (rest.rfind("GR", 0) == 0) rest = rest.substr(2);
    return std::string(g) + "GR" + rest;
  }
  return key;
}

}  // namespace

std::optional<Material> find_standard_material(std::string_view name) {
  const std::string key = grade_key(name);
  const auto& all = grades();
  const auto it = std::find_if(all.begin(), all.end(), [&](const Grade& g) { return key == g.name; });
  if (it == all.end()) return std::nullopt;
  Material m;
  m.name = it->name;
  m.standard = it->standard;
  m.E = it->european ? en_E : astm_E;
  m.G = it->european ? en_G : astm_G;
  m.nu = 0.3;  // EN 1993-1-1 3.2.6(1); AISC uses 0.3 as well (from memory)
  m.thermal_expansion = it->european ? 12e-6 : astm_alpha;
  m.bands = it->bands;
  m.round_bands = it->round_bands;
  m.fy = it->bands.front().fy;
  m.fu = it->bands.front().fu;
  m.density = steel_density;
  return m;
}

std::vector<std::string> standard_material_names() {
  std::vector<std::string> names;
  for (const Grade& g : grades()) names.emplace_back(g.name);
  return names;
}

Material material_for_thickness(const Material& material, double t) {
  Material m = material;
  if (m.bands.empty()) return m;
  const auto it = std::find_if(m.bands.begin(), m.bands.end(), [&](const StrengthBand& b) { return t <= b.t_max + 1e-9; });
  const StrengthBand& band = it == m.bands.end() ? m.bands.back() : *it;
  m.fy = band.fy;
  m.fu = band.fu;
  return m;
}

Material material_for_section(const Material& material, const Section& section) {
  Material m = material;
  if (!m.round_bands.empty() && (section.shape == SectionShape::chs)) m.bands = m.round_bands;
  return material_for_thickness(m, section.t_max);
}

}  // namespace stepframe::analysis
