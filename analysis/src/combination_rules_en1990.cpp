// EN 1990 combinations of actions for buildings (see combination_rules.hpp).

#include "stepframe/analysis/combination_rules.hpp"

#include "combination_terms.hpp"

#include <stdexcept>

namespace stepframe::analysis {
namespace {

bool is_variable(const ActionCase& c) {
  return c.category != ActionCategory::permanent && c.category != ActionCategory::accidental;
}

// The psi factors of a case: its own, else the options' for its category, else Table A1.1's.
PsiFactors psi_of(const ActionCase& c, const En1990Options& options) {
  if (c.psi) return *c.psi;
  for (const auto& [category, psi] : options.psi)
    if (category == c.category) return psi;
  if (const auto psi = en1990_recommended_psi(c.category)) return *psi;
  throw std::invalid_argument("load case '" + c.name + "' (" + category_name(c.category) +
                              ") has no psi factors in EN 1990 Table A1.1: give them as psi: [psi0, psi1, psi2]");
}

}  // namespace

std::vector<GeneratedCombination> en1990_combinations(const std::vector<ActionCase>& cases,
                                                      const En1990Options& options) {
  const auto permanent = detail::action_groups(cases, [](const ActionCase& c) { return c.category == ActionCategory::permanent; });
  if (permanent.empty())
    throw std::invalid_argument("EN 1990 combinations need a permanent load case (category: permanent)");
  const auto variable = detail::action_groups(cases, is_variable);
  const auto accidental = detail::action_groups(cases, [](const ActionCase& c) { return c.category == ActionCategory::accidental; });
  std::vector<PsiFactors> psi(cases.size());
  for (std::size_t i = 0; i < cases.size(); ++i)
    if (is_variable(cases[i])) psi[i] = psi_of(cases[i], options);

  detail::CombinationCollector out(cases);
  // Every permanent case (all groups, all members of a group: they are one source) times gamma.
  auto with_permanent = [&](double gamma) {
    std::vector<double> f(cases.size(), 0.0);
    for (const auto& g : permanent)
      for (std::size_t i : g) f[i] = gamma;
    return f;
  };
  // One combination per leading variable case and choice of accompanying ones:
  // base + lead(leading) x leading + accompany(i) x each accompanying case i.
  using Factor = std::function<double(std::size_t)>;
  auto with_leading = [&](const std::string& prefix, const std::string& rule, bool sls, const std::vector<double>& base,
                          const Factor& lead, const Factor& accompany) {
    for (std::size_t g = 0; g < variable.size(); ++g)
      for (std::size_t leading : variable[g])
        detail::for_each_choice(variable, static_cast<std::ptrdiff_t>(g), [&](const std::vector<std::ptrdiff_t>& choice) {
          std::vector<double> f = base;
          f[leading] = lead(leading);
          for (auto i : choice)
            if (i >= 0) f[static_cast<std::size_t>(i)] = accompany(static_cast<std::size_t>(i));
          out.add(prefix, rule, sls, cases[leading].name, f);
        });
  };
  const double gq = options.gamma_Q;
  const Factor gamma_q = [&](std::size_t) { return gq; };
  const Factor accompany_psi0 = [&](std::size_t i) { return gq * psi[i].psi0; };
  const Factor psi0 = [&](std::size_t i) { return psi[i].psi0; };
  const Factor psi1 = [&](std::size_t i) { return psi[i].psi1; };
  const Factor psi2 = [&](std::size_t i) { return psi[i].psi2; };

  // Ultimate, persistent and transient design situations (6.4.3.2; Table A1.2(B)).
  if (!options.split_6_10ab) {
    // 6.10: gamma_G G + gamma_Q Q_1 + sum gamma_Q psi_0 Q_i (and the permanent actions alone).
    out.add("ULS-6.10", "EN 1990 6.10", false, "", with_permanent(options.gamma_G_sup));
    with_leading("ULS-6.10", "EN 1990 6.10", false, with_permanent(options.gamma_G_sup), gamma_q, accompany_psi0);
    if (options.favourable_permanent)
      with_leading("ULS-6.10", "EN 1990 6.10, permanent favourable", false, with_permanent(options.gamma_G_inf), gamma_q,
                   accompany_psi0);
  } else {
    // 6.10a: gamma_G G + sum gamma_Q psi_0 Q_i (every variable action accompanying; none: G alone).
    detail::for_each_choice(variable, -1, [&](const std::vector<std::ptrdiff_t>& choice) {
      std::vector<double> f = with_permanent(options.gamma_G_sup);
      for (auto i : choice)
        if (i >= 0) f[static_cast<std::size_t>(i)] = accompany_psi0(static_cast<std::size_t>(i));
      out.add("ULS-6.10a", "EN 1990 6.10a", false, "", f);
    });
    // 6.10b: xi gamma_G,sup G + gamma_Q Q_1 + sum gamma_Q psi_0 Q_i; favourable permanent actions keep gamma_G,inf.
    with_leading("ULS-6.10b", "EN 1990 6.10b", false, with_permanent(options.xi * options.gamma_G_sup), gamma_q, accompany_psi0);
    if (options.favourable_permanent)
      with_leading("ULS-6.10b", "EN 1990 6.10b, permanent favourable", false, with_permanent(options.gamma_G_inf), gamma_q,
                   accompany_psi0);
  }

  // Accidental design situation (6.4.3.3, Eq. 6.11b): G + A_d + (psi_1,1 or psi_2,1) Q_1 + sum psi_2,i Q_i.
  if (options.accidental)
    for (const auto& g : accidental)
      for (std::size_t a : g) {
        std::vector<double> base = with_permanent(1.0);
        base[a] = 1.0;
        const std::string rule = "EN 1990 6.11b, accidental " + cases[a].name;
        out.add("ACC-6.11", rule, false, "", base);
        with_leading("ACC-6.11", rule, false, base, options.accidental_leading_psi1 ? psi1 : psi2, psi2);
      }

  // Serviceability (6.5.3): characteristic 6.14b, frequent 6.15b, quasi-permanent 6.16b; permanent factor 1.
  const auto g1 = with_permanent(1.0);
  if (options.characteristic) {
    out.add("SLS-char", "EN 1990 6.14b", true, "", g1);
    with_leading("SLS-char", "EN 1990 6.14b", true, g1, [](std::size_t) { return 1.0; }, psi0);
  }
  if (options.frequent) {
    out.add("SLS-freq", "EN 1990 6.15b", true, "", g1);
    with_leading("SLS-freq", "EN 1990 6.15b", true, g1, psi1, psi2);
  }
  if (options.quasi_permanent)
    detail::for_each_choice(variable, -1, [&](const std::vector<std::ptrdiff_t>& choice) {
      std::vector<double> f = g1;
      for (auto i : choice)
        if (i >= 0) f[static_cast<std::size_t>(i)] = psi[static_cast<std::size_t>(i)].psi2;
      out.add("SLS-qp", "EN 1990 6.16b", true, "", f);
    });
  return out.take();
}

}  // namespace stepframe::analysis
