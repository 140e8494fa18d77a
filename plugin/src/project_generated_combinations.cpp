// `combinations: [{generate: {...}}]`: combinations written by the rules of
// EN 1990 or ASCE/SEI 7 for the cases' categories (README "Generated combinations").

#include "project_blocks.hpp"

#include "stepframe/analysis/combination_rules.hpp"

#include <spdlog/spdlog.h>

#include <stdexcept>

namespace stepframe::detail {

analysis::PsiFactors read_psi(const Reader& r, const YAML::Node& node, const std::string& path) {
  if (!node.IsSequence() || node.size() != 3) r.fail(node, path, "expected [psi0, psi1, psi2], e.g. [0.7, 0.5, 0.3]");
  analysis::PsiFactors psi{r.number(node[0], path + "[0]", dimension::none), r.number(node[1], path + "[1]", dimension::none),
                           r.number(node[2], path + "[2]", dimension::none)};
  for (double v : {psi.psi0, psi.psi1, psi.psi2})
    if (!(v >= 0 && v <= 1)) r.fail(node, path, "psi factors lie between 0 and 1 (EN 1990 4.1.3)");
  return psi;
}

namespace {

// A partial or combination factor between 0 and 10 (a typing error beyond).
double read_factor(const Reader& r, const YAML::Node& node, const std::string& path) {
  const double v = r.number(node, path, dimension::none);
  if (!(v >= 0 && v <= 10)) r.fail(node, path, "a partial factor lies between 0 and 10, e.g. 1.35");
  return v;
}

analysis::En1990Options read_en1990(const Reader& r, const YAML::Node& node, const std::string& path) {
  analysis::En1990Options o;
  if (const auto u = node["ultimate"]) {
    const auto v = r.text(u, path + ".ultimate");
    if (v == "6.10a/b" || v == "6.10ab") o.split_6_10ab = true;
    else if (v != "6.10") r.fail(u, path + ".ultimate", "expected \"6.10\" or \"6.10a/b\" (EN 1990 6.4.3.2), got '" + v + "'");
  }
  const std::pair<const char*, double*> factors[] = {
      {"gamma_G_sup", &o.gamma_G_sup}, {"gamma_G_inf", &o.gamma_G_inf}, {"gamma_Q", &o.gamma_Q}, {"xi", &o.xi}};
  for (const auto& [key, target] : factors)
    if (node[key]) *target = read_factor(r, node[key], path + "." + key);
  if (node["favourable_permanent"]) o.favourable_permanent = r.boolean(node["favourable_permanent"], path + ".favourable_permanent");
  if (const auto psi = node["psi"]) {
    r.expect_map(psi, path + ".psi");
    for (const auto& item : psi) {
      const auto name = item.first.as<std::string>();
      const auto category = analysis::parse_category(name);
      if (!category || *category == analysis::ActionCategory::permanent || *category == analysis::ActionCategory::accidental)
        r.fail(item.first, path + ".psi." + name,
               "'" + name + "' is not a variable action's category" + did_you_mean(name, analysis::category_names()));
      o.psi.emplace_back(*category, read_psi(r, item.second, path + ".psi." + name));
    }
  }
  if (const auto sls = node["serviceability"]) {
    r.expect_list(sls, path + ".serviceability");
    o.characteristic = o.frequent = o.quasi_permanent = false;
    for (std::size_t i = 0; i < sls.size(); ++i) {
      const auto v = r.text(sls[i], Reader::index(path + ".serviceability", i));
      if (v == "characteristic") o.characteristic = true;
      else if (v == "frequent") o.frequent = true;
      else if (v == "quasi_permanent") o.quasi_permanent = true;
      else r.fail(sls[i], Reader::index(path + ".serviceability", i), "expected characteristic, frequent or quasi_permanent");
    }
  }
  if (node["accidental"]) o.accidental = r.boolean(node["accidental"], path + ".accidental");
  if (const auto lead = node["accidental_leading"]) {
    const auto v = r.text(lead, path + ".accidental_leading");
    if (v != "frequent" && v != "quasi_permanent")
      r.fail(lead, path + ".accidental_leading", "expected frequent (psi_1, recommended) or quasi_permanent (psi_2)");
    o.accidental_leading_psi1 = v == "frequent";
  }
  return o;
}

analysis::Asce7Options read_asce7(const Reader& r, const YAML::Node& node, const std::string& path) {
  analysis::Asce7Options o;
  if (const auto sets = node["sets"]) {
    r.expect_list(sets, path + ".sets");
    o.strength = o.allowable = false;
    for (std::size_t i = 0; i < sets.size(); ++i) {
      const auto v = r.text(sets[i], Reader::index(path + ".sets", i));
      if (v == "strength") o.strength = true;
      else if (v == "allowable") o.allowable = true;
      else r.fail(sets[i], Reader::index(path + ".sets", i), "expected strength (2.3.1) or allowable (2.4.1)");
    }
  }
  if (const auto l = node["live_factor"]) {
    o.live_accompanying = r.number(l, path + ".live_factor", dimension::none);
    if (o.live_accompanying != 1.0 && o.live_accompanying != 0.5)
      r.fail(l, path + ".live_factor", "2.3.1 allows 1.0, or 0.5 where L0 <= 100 psf (exception 1)");
  }
  return o;
}

}  // namespace

std::vector<CombinationSpec> read_generated_combinations(const Reader& r, const YAML::Node& node,
                                                         const std::string& path, const std::vector<CaseSpec>& cases) {
  r.expect_map(node, path);
  if (!node["standard"]) r.fail(node, path, "generated combinations need standard: EN 1990 or ASCE 7");
  const auto standard = r.text(node["standard"], path + ".standard");
  const bool en = standard == "EN 1990" || standard == "EN1990";
  if (!en && standard != "ASCE 7" && standard != "ASCE/SEI 7")
    r.fail(node["standard"], path + ".standard", "expected EN 1990 or ASCE 7, got '" + standard + "'");
  if (en)
    r.check_keys(node, path, {"standard", "ultimate", "gamma_G_sup", "gamma_G_inf", "favourable_permanent", "gamma_Q", "xi",
                              "psi", "serviceability", "accidental", "accidental_leading"});
  else
    r.check_keys(node, path, {"standard", "sets", "live_factor"});

  std::vector<analysis::ActionCase> actions;
  for (const auto& c : cases) {
    if (!c.category)
      r.fail(node, path,
             "load case '" + c.name + "' (" + c.origin.describe() +
                 ") needs category: for generated combinations (permanent, imposed_A to imposed_H, snow, snow_high, "
                 "wind, temperature, rain, accidental)");
    actions.push_back({c.name, *c.category, c.group, c.psi});
  }
  std::vector<analysis::GeneratedCombination> generated;
  try {
    if (en) {
      generated = analysis::en1990_combinations(actions, read_en1990(r, node, path));
    } else {
      std::vector<std::string> left_out;
      generated = analysis::asce7_combinations(actions, read_asce7(r, node, path), &left_out);
      for (const auto& name : left_out)
        spdlog::warn("{}: load case '{}' has no load symbol in the basic combinations of ASCE/SEI 7-16 2.3.1 and 2.4.1 "
                     "and is in none of the generated combinations; combine it by hand",
                     r.where(node, path).describe(), name);
    }
  } catch (const std::invalid_argument& e) {
    r.fail(node, path, e.what());
  }
  std::vector<CombinationSpec> out;
  for (auto& g : generated) {
    CombinationSpec c;
    c.name = std::move(g.name);
    c.factors = std::move(g.factors);
    c.origin = r.where(node, path);
    c.serviceability = g.serviceability;
    c.rule = std::move(g.rule);
    c.leading = std::move(g.leading);
    out.push_back(std::move(c));
  }
  return out;
}

}  // namespace stepframe::detail
