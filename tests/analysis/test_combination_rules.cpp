// Combinations generated from the rules of EN 1990 and ASCE/SEI 7-16 for a
// stated set of cases: G (permanent), Q (imposed, category B offices), S
// (snow, site at most 1000 m) and W (wind). Factors are those of the
// standards' equations and tables named beside each check. The EN 1990 Table
// A1.1 psi values and Table A1.2(B) partial factors are from memory (EN 1990:2002
// was not at hand to re-read); the ASCE/SEI 7-16 2.3.1 and 2.4.1 lines were
// read against the published text of those clauses. Counts follow stepframe's
// enumeration (each accompanying action present or absent, repeats dropped),
// counted by hand in the comments.

#include "stepframe/analysis/combination_rules.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <map>
#include <stdexcept>

using namespace stepframe::analysis;

namespace {

std::vector<ActionCase> office_cases() {
  return {{"G", ActionCategory::permanent, "", {}},
          {"Q", ActionCategory::imposed_B, "", {}},
          {"S", ActionCategory::snow, "", {}},
          {"W", ActionCategory::wind, "", {}}};
}

using Factors = std::map<std::string, double>;

Factors factors_of(const GeneratedCombination& c) { return {c.factors.begin(), c.factors.end()}; }

std::size_t count_prefix(const std::vector<GeneratedCombination>& all, const std::string& prefix) {
  return static_cast<std::size_t>(std::count_if(all.begin(), all.end(), [&](const GeneratedCombination& c) {
    return c.name.rfind(prefix + "-", 0) == 0;
  }));
}

// The generated combination with exactly these factors (compared to 1e-12), or null.
const GeneratedCombination* find(const std::vector<GeneratedCombination>& all, const std::string& prefix,
                                 const Factors& wanted) {
  for (const auto& c : all) {
    if (c.name.rfind(prefix + "-", 0) != 0) continue;
    const Factors f = factors_of(c);
    if (f.size() != wanted.size()) continue;
    bool same = true;
    for (const auto& [name, value] : wanted) same = same && f.count(name) && std::abs(f.at(name) - value) < 1e-12;
    if (same) return &c;
  }
  return nullptr;
}

}  // namespace

TEST_CASE("EN 1990 Table A1.1 recommended psi factors (from memory)", "[analysis][combination_rules]") {
  // EN 1990:2002 Annex A1 Table A1.1, values from memory.
  auto psi = [](ActionCategory c) { return *en1990_recommended_psi(c); };
  CHECK(psi(ActionCategory::imposed_B).psi0 == 0.7);
  CHECK(psi(ActionCategory::imposed_B).psi1 == 0.5);
  CHECK(psi(ActionCategory::imposed_B).psi2 == 0.3);
  CHECK(psi(ActionCategory::imposed_C).psi2 == 0.6);
  CHECK(psi(ActionCategory::imposed_E).psi0 == 1.0);
  CHECK(psi(ActionCategory::imposed_E).psi1 == 0.9);
  CHECK(psi(ActionCategory::imposed_E).psi2 == 0.8);
  CHECK(psi(ActionCategory::imposed_H).psi0 == 0.0);
  CHECK(psi(ActionCategory::snow).psi0 == 0.5);
  CHECK(psi(ActionCategory::snow).psi1 == 0.2);
  CHECK(psi(ActionCategory::snow_high).psi2 == 0.2);
  CHECK(psi(ActionCategory::wind).psi0 == 0.6);
  CHECK(psi(ActionCategory::wind).psi1 == 0.2);
  CHECK(psi(ActionCategory::temperature).psi1 == 0.5);
  CHECK_FALSE(en1990_recommended_psi(ActionCategory::rain));
  for (const auto& name : category_names()) CHECK(category_name(*parse_category(name)) == name);
}

TEST_CASE("EN 1990 6.10 with Table A1.2(B) factors for G, Q (B), S, W", "[analysis][combination_rules]") {
  const auto all = en1990_combinations(office_cases());
  // ULS 6.10 (gamma_G,sup 1.35, gamma_G,inf 1.00, gamma_Q 1.5: Table A1.2(B), from memory):
  // G alone, then per permanent factor 3 leading actions x 4 choices of the other two = 1 + 2 x 12.
  CHECK(count_prefix(all, "ULS-6.10") == 25);
  CHECK(factors_of(all.front()) == Factors{{"G", 1.35}});
  CHECK(all.front().name == "ULS-6.10-1");
  // Leading Q, accompanying S (1.5 x 0.5) and W (1.5 x 0.6).
  const auto* lead_q = find(all, "ULS-6.10", {{"G", 1.35}, {"Q", 1.5}, {"S", 0.75}, {"W", 0.9}});
  REQUIRE(lead_q);
  CHECK(lead_q->leading == "Q");
  CHECK(lead_q->rule == "EN 1990 6.10");
  CHECK_FALSE(lead_q->serviceability);
  // Uplift: permanent favourable (1.00), leading wind, accompanying Q (1.5 x 0.7).
  REQUIRE(find(all, "ULS-6.10", {{"G", 1.0}, {"W", 1.5}, {"Q", 1.05}}));
  REQUIRE(find(all, "ULS-6.10", {{"G", 1.0}, {"W", 1.5}}));
  // Characteristic 6.14b: G alone + 3 x 4 = 13; every factor at most 1.
  CHECK(count_prefix(all, "SLS-char") == 13);
  REQUIRE(find(all, "SLS-char", {{"G", 1.0}, {"S", 1.0}, {"Q", 0.7}, {"W", 0.6}}));
  // Frequent 6.15b: psi_1 on the leading, psi_2 on the others (S and W have psi_2 = 0, so those
  // choices repeat): {G + 0.5Q}, {G + 0.2S}, {G + 0.2S + 0.3Q}, {G + 0.2W}, {G + 0.2W + 0.3Q}.
  CHECK(count_prefix(all, "SLS-freq") == 5);
  REQUIRE(find(all, "SLS-freq", {{"G", 1.0}, {"W", 0.2}, {"Q", 0.3}}));
  // Quasi-permanent 6.16b: G + 0.3Q (G alone repeats the characteristic one).
  CHECK(count_prefix(all, "SLS-qp") == 1);
  REQUIRE(find(all, "SLS-qp", {{"G", 1.0}, {"Q", 0.3}}));
  CHECK(all.size() == 44);
  for (const auto& c : all) CHECK(c.serviceability == (c.name.rfind("SLS", 0) == 0));
}

TEST_CASE("EN 1990 6.10a and 6.10b with xi = 0.85 of Table A1.2(B)", "[analysis][combination_rules]") {
  En1990Options options;
  options.split_6_10ab = true;
  const auto all = en1990_combinations(office_cases(), options);
  // 6.10a: every variable action accompanying (gamma_Q psi_0), each present or absent: 2^3 = 8.
  CHECK(count_prefix(all, "ULS-6.10a") == 8);
  REQUIRE(find(all, "ULS-6.10a", {{"G", 1.35}, {"Q", 1.05}, {"S", 0.75}, {"W", 0.9}}));
  // 6.10b: xi gamma_G,sup = 0.85 x 1.35 = 1.1475 and gamma_G,inf = 1.00, 3 leading x 4 each: 24.
  CHECK(count_prefix(all, "ULS-6.10b") == 24);
  const auto* b = find(all, "ULS-6.10b", {{"G", 0.85 * 1.35}, {"Q", 1.5}, {"W", 0.9}});
  REQUIRE(b);
  CHECK(b->rule == "EN 1990 6.10b");
}

TEST_CASE("EN 1990 factors overridden as a national annex would", "[analysis][combination_rules]") {
  En1990Options options;
  options.gamma_G_sup = 1.2;
  options.gamma_Q = 1.4;
  options.favourable_permanent = false;
  options.psi = {{ActionCategory::wind, PsiFactors{0.5, 0.2, 0.0}}};
  auto cases = office_cases();
  cases[2].psi = PsiFactors{0.6, 0.3, 0.1};  // the case's own psi wins over the category's
  const auto all = en1990_combinations(cases, options);
  CHECK(count_prefix(all, "ULS-6.10") == 13);
  REQUIRE(find(all, "ULS-6.10", {{"G", 1.2}, {"Q", 1.4}, {"S", 1.4 * 0.6}, {"W", 1.4 * 0.5}}));
  REQUIRE(find(all, "SLS-qp", {{"G", 1.0}, {"Q", 0.3}, {"S", 0.1}}));
}

TEST_CASE("EN 1990 alternatives in a group never meet; accidental 6.11b", "[analysis][combination_rules]") {
  std::vector<ActionCase> cases{{"G", ActionCategory::permanent, "", {}},
                                {"Q", ActionCategory::imposed_B, "", {}},
                                {"W+X", ActionCategory::wind, "wind", {}},
                                {"W-X", ActionCategory::wind, "wind", {}},
                                {"Impact", ActionCategory::accidental, "", {}}};
  const auto all = en1990_combinations(cases);
  for (const auto& c : all) {
    const auto f = factors_of(c);
    CHECK_FALSE((f.count("W+X") && f.count("W-X")));
    CHECK((f.count("Impact") == 0 || c.name.rfind("ACC-6.11", 0) == 0));
  }
  // 6.10: G alone; leading Q with wind absent, +X or -X (3); leading W+X or W-X with Q absent or present (4);
  // twice (gamma_G,sup and gamma_G,inf): 1 + 2 x 7.
  CHECK(count_prefix(all, "ULS-6.10") == 15);
  // 6.11b: G + A_d alone; leading Q with psi_1 = 0.5 and W (psi_2 = 0) absent, +X, -X (one after repeats);
  // leading wind with psi_1 = 0.2 and Q at psi_2 = 0.3 or absent (4): 1 + 1 + 4 = 6.
  CHECK(count_prefix(all, "ACC-6.11") == 6);
  REQUIRE(find(all, "ACC-6.11", {{"G", 1.0}, {"Impact", 1.0}, {"W-X", 0.2}, {"Q", 0.3}}));
  REQUIRE(find(all, "ACC-6.11", {{"G", 1.0}, {"Impact", 1.0}, {"Q", 0.5}}));
  CHECK_THROWS_AS(en1990_combinations({{"Q", ActionCategory::imposed_A, "", {}}}), std::invalid_argument);
  CHECK_THROWS_AS(en1990_combinations({{"G", ActionCategory::permanent, "", {}}, {"R", ActionCategory::rain, "", {}}}),
                  std::invalid_argument);
}

TEST_CASE("ASCE/SEI 7-16 2.3.1 strength combinations for D, L, S, W", "[analysis][combination_rules]") {
  // ASCE/SEI 7-16 2.3.1: (1) 1.4D; (2) 1.2D + 1.6L + 0.5(Lr or S or R); (3) 1.2D + 1.6(Lr or S or R) + (L or 0.5W);
  // (4) 1.2D + 1.0W + L + 0.5(Lr or S or R); (5) 0.9D + 1.0W.
  Asce7Options options;
  options.allowable = false;
  const auto all = asce7_combinations(office_cases(), options);
  // (1) 1; (2) 1.6L, 0.5S, both: 3; (3) 1.6S, L, 0.5W, 1.6S + L, 1.6S + 0.5W: 5;
  // (4) non-empty subsets of {W, L, 0.5S} less L alone and 0.5S alone (in 3 and 2): 5; (5) 1.
  CHECK(count_prefix(all, "LRFD-1") == 1);
  CHECK(count_prefix(all, "LRFD-2") == 3);
  CHECK(count_prefix(all, "LRFD-3") == 5);
  CHECK(count_prefix(all, "LRFD-4") == 5);
  CHECK(count_prefix(all, "LRFD-5") == 1);
  CHECK(all.size() == 15);
  REQUIRE(find(all, "LRFD-1", {{"G", 1.4}}));
  REQUIRE(find(all, "LRFD-2", {{"G", 1.2}, {"Q", 1.6}, {"S", 0.5}}));
  REQUIRE(find(all, "LRFD-3", {{"G", 1.2}, {"S", 1.6}, {"W", 0.5}}));
  const auto* four = find(all, "LRFD-4", {{"G", 1.2}, {"W", 1.0}, {"Q", 1.0}, {"S", 0.5}});
  REQUIRE(four);
  CHECK(four->rule == "ASCE/SEI 7-16 2.3.1 (4)");
  CHECK_FALSE(four->serviceability);
  REQUIRE(find(all, "LRFD-5", {{"G", 0.9}, {"W", 1.0}}));
  // Exception 1 of 2.3.1: 0.5 on L in (3) and (4).
  options.live_accompanying = 0.5;
  REQUIRE(find(asce7_combinations(office_cases(), options), "LRFD-4", {{"G", 1.2}, {"W", 1.0}, {"Q", 0.5}}));
}

TEST_CASE("ASCE/SEI 7-16 2.4.1 allowable stress combinations for D, L, S, W", "[analysis][combination_rules]") {
  // ASCE/SEI 7-16 2.4.1: (1) D; (2) D + L; (3) D + (Lr or S or R); (4) D + 0.75L + 0.75(Lr or S or R);
  // (5) D + 0.6W; (6a) D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R); (7) 0.6D + 0.6W.
  Asce7Options options;
  options.strength = false;
  std::vector<std::string> left_out;
  auto cases = office_cases();
  cases.push_back({"T", ActionCategory::temperature, "", {}});
  const auto all = asce7_combinations(cases, options, &left_out);
  CHECK(left_out == std::vector<std::string>{"T"});
  // (1) 1, (2) 1, (3) 1, (4) 3, (5) 1, (6) 7 non-empty subsets less the 3 of (4): 4, (7) 1.
  CHECK(all.size() == 12);
  CHECK(count_prefix(all, "ASD-6") == 4);
  REQUIRE(find(all, "ASD-6", {{"G", 1.0}, {"Q", 0.75}, {"W", 0.45}, {"S", 0.75}}));
  REQUIRE(find(all, "ASD-7", {{"G", 0.6}, {"W", 0.6}}));
  for (const auto& c : all) CHECK(c.serviceability);
}
