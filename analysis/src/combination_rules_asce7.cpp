// ASCE/SEI 7-16 basic load combinations, 2.3.1 (strength design) and 2.4.1
// (allowable stress design), the seismic ones excepted (see combination_rules.hpp).

#include "stepframe/analysis/combination_rules.hpp"

#include "combination_terms.hpp"

#include <stdexcept>

namespace stepframe::analysis {
namespace {

// The load symbols of ASCE/SEI 7-16 2.3 and 2.4 the categories stand for.
enum class Symbol { D, L, Lr, S, R, W, none };

Symbol symbol_of(ActionCategory c) {
  switch (c) {
    case ActionCategory::permanent: return Symbol::D;
    case ActionCategory::imposed_H: return Symbol::Lr;
    case ActionCategory::snow:
    case ActionCategory::snow_high: return Symbol::S;
    case ActionCategory::rain: return Symbol::R;
    case ActionCategory::wind: return Symbol::W;
    case ActionCategory::temperature:
    case ActionCategory::accidental: return Symbol::none;
    default: return Symbol::L;  // imposed A to G
  }
}

// One term of a combination: a choice among options (the standard's "(Lr or S or R)"), each a load and its factor.
using Term = std::vector<std::pair<Symbol, double>>;
struct Line {
  std::string number;  // as the standard numbers it
  double dead = 1.0;
  std::vector<Term> terms;
};

}  // namespace

std::vector<GeneratedCombination> asce7_combinations(const std::vector<ActionCase>& cases, const Asce7Options& options,
                                                     std::vector<std::string>* left_out) {
  bool any_dead = false;
  for (const auto& c : cases) {
    any_dead = any_dead || c.category == ActionCategory::permanent;
    if (symbol_of(c.category) == Symbol::none && left_out) left_out->push_back(c.name);
  }
  if (!any_dead) throw std::invalid_argument("ASCE/SEI 7 combinations need a dead load case (category: permanent)");

  // Groups of alternatives per load symbol (cases of one symbol in different groups act together).
  std::map<Symbol, std::vector<std::vector<std::size_t>>> groups;
  for (Symbol s : {Symbol::L, Symbol::Lr, Symbol::S, Symbol::R, Symbol::W})
    groups[s] = detail::action_groups(cases, [&](const ActionCase& c) { return symbol_of(c.category) == s; });

  using S = Symbol;
  const double l = options.live_accompanying;
  const Term roof_half{{S::Lr, 0.5}, {S::S, 0.5}, {S::R, 0.5}};
  // ASCE/SEI 7-16 2.3.1, combinations 1 to 5.
  const std::vector<Line> strength{
      {"1", 1.4, {}},
      {"2", 1.2, {{{S::L, 1.6}}, roof_half}},
      {"3", 1.2, {{{S::Lr, 1.6}, {S::S, 1.6}, {S::R, 1.6}}, {{S::L, l}, {S::W, 0.5}}}},
      {"4", 1.2, {{{S::W, 1.0}}, {{S::L, l}}, roof_half}},
      {"5", 0.9, {{{S::W, 1.0}}}},
  };
  // ASCE/SEI 7-16 2.4.1, combinations 1 to 7 (5: D + 0.6W; 6 is 6a of the standard).
  const Term roof_075{{S::Lr, 0.75}, {S::S, 0.75}, {S::R, 0.75}};
  const std::vector<Line> allowable{
      {"1", 1.0, {}},
      {"2", 1.0, {{{S::L, 1.0}}}},
      {"3", 1.0, {{{S::Lr, 1.0}, {S::S, 1.0}, {S::R, 1.0}}}},
      {"4", 1.0, {{{S::L, 0.75}}, roof_075}},
      {"5", 1.0, {{{S::W, 0.6}}}},
      {"6", 1.0, {{{S::L, 0.75}}, {{S::W, 0.75 * 0.6}}, roof_075}},
      {"7", 0.6, {{{S::W, 0.6}}}},
  };

  detail::CombinationCollector out(cases);
  auto generate = [&](const std::vector<Line>& lines, const std::string& prefix, const std::string& clause, bool sls) {
    for (const Line& line : lines) {
      // Each term takes one option or none; the option's groups each take one alternative or none.
      std::vector<std::size_t> option(line.terms.size(), 0);  // 0: none, k: option k-1
      while (true) {
        std::vector<std::vector<std::size_t>> slots_groups;
        std::vector<double> slot_factor;
        for (std::size_t t = 0; t < line.terms.size(); ++t) {
          if (option[t] == 0) continue;
          const auto& [symbol, factor] = line.terms[t][option[t] - 1];
          for (const auto& g : groups[symbol]) {
            slots_groups.push_back(g);
            slot_factor.push_back(factor);
          }
        }
        detail::for_each_choice(slots_groups, -1, [&](const std::vector<std::ptrdiff_t>& choice) {
          std::vector<double> f(cases.size(), 0.0);
          bool variable = false;
          for (std::size_t i = 0; i < cases.size(); ++i)
            if (cases[i].category == ActionCategory::permanent) f[i] = line.dead;
          for (std::size_t k = 0; k < choice.size(); ++k)
            if (choice[k] >= 0) {
              f[static_cast<std::size_t>(choice[k])] = slot_factor[k];
              variable = true;
            }
          // Dead load alone scaled below line 1 is never worse than line 1 (linear analysis): left out.
          if (variable || line.terms.empty())
            out.add(prefix + "-" + line.number, "ASCE/SEI 7-16 " + clause + " (" + line.number + ")", sls, "", f);
        });
        std::size_t t = 0;
        for (; t < option.size(); ++t) {
          if (++option[t] <= line.terms[t].size()) break;
          option[t] = 0;
        }
        if (t == option.size()) break;
      }
    }
  };
  if (options.strength) generate(strength, "LRFD", "2.3.1", false);
  if (options.allowable) generate(allowable, "ASD", "2.4.1", true);
  return out.take();
}

}  // namespace stepframe::analysis
