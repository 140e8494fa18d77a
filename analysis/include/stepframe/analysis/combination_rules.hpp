#pragma once
// Combinations of load cases generated from the rules of a code: EN 1990
// (6.4.3.2 Eq. 6.10 or 6.10a/6.10b, 6.4.3.3 Eq. 6.11b, 6.5.3 Eqs. 6.14b,
// 6.15b, 6.16b, with the recommended values of Annex A1 Tables A1.1 and
// A1.2(B)) and ASCE/SEI 7-16 (2.3.1 strength design, 2.4.1 allowable stress
// design). Pure functions of the cases' categories and the factors; every
// factor can be overridden, since national annexes and jurisdictions differ.
//
// Each variable action is either the leading one, accompanying, or absent:
// a favourable variable action is taken as zero (EN 1990 6.4.3.2(3) note
// on favourable actions; ASCE/SEI 7-16 2.4.1 "effects of one or more loads
// not acting shall be considered", applied to 2.3.1 as well: common practice).
// Cases sharing a `group` are alternatives (wind from +X or from -X): at
// most one of them is in a combination. All permanent cases take gamma_G,sup
// together or gamma_G,inf together (EN 1990 A1.3.1(4): permanent actions
// from one source take one factor). Combinations with the same factors as
// one generated before under the same rule are dropped.

#include <array>
#include <optional>
#include <string>
#include <utility>
#include <vector>

namespace stepframe::analysis {

/// What kind of action a load case holds (EN 1990 Table A1.1 rows; ASCE/SEI 7 symbols in brackets).
enum class ActionCategory {
  permanent,   ///< G [D]
  imposed_A,   ///< domestic, residential [L]
  imposed_B,   ///< offices [L]
  imposed_C,   ///< congregation areas [L]
  imposed_D,   ///< shopping areas [L]
  imposed_E,   ///< storage areas [L]
  imposed_F,   ///< traffic areas, vehicle weight <= 30 kN [L]
  imposed_G,   ///< traffic areas, 30 kN < vehicle weight <= 160 kN [L]
  imposed_H,   ///< roofs [Lr]
  snow,        ///< sites at altitude H <= 1000 m [S]
  snow_high,   ///< Finland, Iceland, Norway, Sweden, or altitude H > 1000 m [S]
  wind,        ///< [W]
  temperature, ///< non-fire (not in ASCE/SEI 7's basic combinations)
  rain,        ///< [R] (no row in EN 1990 Table A1.1: give its psi factors)
  accidental,  ///< A_d (EN 1990 6.4.3.3; not in ASCE/SEI 7's basic combinations)
};

/// The project-file spelling of each category: "permanent", "imposed_A" ... "accidental".
std::string category_name(ActionCategory category);
/// The category of a spelling, or nothing.
std::optional<ActionCategory> parse_category(const std::string& name);
/// Every spelling, for messages.
std::vector<std::string> category_names();

/// Combination factors psi_0, psi_1, psi_2 (EN 1990 4.1.3, 6.4.3, 6.5.3).
struct PsiFactors {
  double psi0 = 0, psi1 = 0, psi2 = 0;
};

/// The recommended values of EN 1990 Annex A1 Table A1.1 for buildings, or
/// nothing for permanent, accidental and rain (no row).
std::optional<PsiFactors> en1990_recommended_psi(ActionCategory category);

/// A load case as the generator sees it.
struct ActionCase {
  std::string name;
  ActionCategory category = ActionCategory::permanent;
  std::string group;               ///< cases sharing a non-empty group are alternatives
  std::optional<PsiFactors> psi;   ///< the case's own psi factors (else the options', else Table A1.1)
};

/// One generated combination.
struct GeneratedCombination {
  std::string name;                                      ///< e.g. "ULS-6.10-3", "LRFD-2.3.1-4b"
  std::string rule;                                      ///< e.g. "EN 1990 6.10b", "ASCE/SEI 7-16 2.3.1 (3)"
  bool serviceability = false;                           ///< the kind checks use it for
  std::string leading;                                   ///< the leading variable case (EN 1990), or empty
  std::vector<std::pair<std::string, double>> factors;   ///< (case, factor), in the cases' order, no zeros
};

/// EN 1990 options: recommended values of Table A1.2(B) and A1.1 unless overridden.
struct En1990Options {
  bool split_6_10ab = false;     ///< 6.10a and 6.10b instead of 6.10
  double gamma_G_sup = 1.35;     ///< Table A1.2(B), unfavourable permanent
  double gamma_G_inf = 1.00;     ///< Table A1.2(B), favourable permanent
  bool favourable_permanent = true;  ///< also combinations with gamma_G_inf
  double gamma_Q = 1.5;          ///< Table A1.2(B), leading and accompanying variable (0 where favourable)
  double xi = 0.85;              ///< Table A1.2(B) note, reduction of unfavourable permanent in 6.10b
  /// psi factors by category, replacing Table A1.1's (a case's own psi still wins).
  std::vector<std::pair<ActionCategory, PsiFactors>> psi;
  bool characteristic = true, frequent = true, quasi_permanent = true;  ///< 6.14b, 6.15b, 6.16b
  bool accidental = true;        ///< 6.11b for every accidental case
  /// 6.11b: the leading variable action with psi_1 (frequent, the note's recommendation) or psi_2.
  bool accidental_leading_psi1 = true;
};

/// The EN 1990 combinations of the cases: ultimate (6.10 or 6.10a/6.10b),
/// accidental (6.11b, kind ultimate), serviceability (characteristic 6.14b,
/// frequent 6.15b, quasi-permanent 6.16b). Throws std::invalid_argument when a
/// variable case has no psi factors (rain without `psi`) or there is no permanent case.
std::vector<GeneratedCombination> en1990_combinations(const std::vector<ActionCase>& cases,
                                                      const En1990Options& options = {});

/// ASCE/SEI 7 options.
struct Asce7Options {
  bool strength = true;    ///< 2.3.1 (kind ultimate)
  bool allowable = true;   ///< 2.4.1 (service-level loads: kind serviceability, see README)
  /// 2.3.1 exception 1: the factor on L in combinations 3 and 4 may be 0.5 where L0 <= 100 psf
  /// (not garages or places of public assembly).
  double live_accompanying = 1.0;
};

/// The ASCE/SEI 7-16 basic combinations of the cases, the seismic ones
/// (2.3.6, 2.4.5) excepted. Cases whose category has no symbol in them
/// (temperature, accidental) are left out and named in `left_out`. Throws
/// std::invalid_argument when there is no permanent case.
std::vector<GeneratedCombination> asce7_combinations(const std::vector<ActionCase>& cases,
                                                     const Asce7Options& options = {},
                                                     std::vector<std::string>* left_out = nullptr);

}  // namespace stepframe::analysis
