// The `checks:` block of a project file: which checks run, under which
// results, with which limits and methods.

#include "project_blocks.hpp"

namespace stepframe::detail {
namespace {

std::vector<std::string> read_name_list(const Reader& r, const YAML::Node& node, const std::string& path,
                                        const std::vector<std::string>& known) {
  r.expect_list(node, path);
  std::vector<std::string> names;
  for (std::size_t i = 0; i < node.size(); ++i) {
    const auto name = r.text(node[i], Reader::index(path, i));
    if (std::find(known.begin(), known.end(), name) == known.end())
      r.fail(node[i], Reader::index(path, i),
             "no load case or combination is named '" + name + "'" + did_you_mean(name, known));
    names.push_back(name);
  }
  return names;
}

double positive_ratio(const Reader& r, const YAML::Node& value, const std::string& path, const char* example) {
  const double ratio = r.number(value, path, dimension::none);
  if (!(ratio > 0)) r.fail(value, path, std::string("must be positive, e.g. ") + example);
  return ratio;
}

En1993CheckSpec read_en1993(const Reader& r, const YAML::Node& e, std::vector<std::string> names) {
  r.check_keys(e, "checks.en1993", {"combinations", "ltb_method", "f_modification"});
  En1993CheckSpec spec{std::move(names)};
  using analysis::en1993::LateralTorsionalMethod;
  if (const auto m = e["ltb_method"]) {
    const std::string value = r.text(m, "checks.en1993.ltb_method");
    if (value == "general") spec.ltb.method = LateralTorsionalMethod::general;
    else if (value == "rolled") spec.ltb.method = LateralTorsionalMethod::rolled;
    else
      r.fail(m, "checks.en1993.ltb_method",
             "expected general (EN 1993-1-1 6.3.2.2) or rolled (6.3.2.3, rolled or equivalent welded I sections), "
             "got '" + value + "'");
  }
  if (const auto f = e["f_modification"]) {
    spec.ltb.f_modification = r.boolean(f, "checks.en1993.f_modification");
    if (spec.ltb.f_modification && spec.ltb.method != LateralTorsionalMethod::rolled)
      r.fail(f, "checks.en1993.f_modification",
             "the f modification (EN 1993-1-1 6.3.2.3(2)) belongs to the rolled method; add ltb_method: rolled");
  }
  return spec;
}

Aisc360CheckSpec read_aisc360(const Reader& r, const YAML::Node& a, std::vector<std::string> names) {
  r.check_keys(a, "checks.aisc360", {"combinations", "method"});
  Aisc360CheckSpec spec{std::move(names)};
  if (const auto m = a["method"]) {
    const std::string value = r.text(m, "checks.aisc360.method");
    if (value == "LRFD" || value == "lrfd") spec.method = analysis::aisc360::Method::lrfd;
    else if (value == "ASD" || value == "asd") spec.method = analysis::aisc360::Method::asd;
    else
      r.fail(m, "checks.aisc360.method",
             "expected LRFD (load and resistance factor design, AISC 360-16 B3.1) or ASD (allowable strength design, "
             "B3.2), got '" + value + "'");
  }
  return spec;
}

}  // namespace

ChecksSpec read_checks(const Reader& r, const YAML::Node& node, const std::vector<std::string>& cases,
                       const std::vector<CombinationSpec>& combinations) {
  std::vector<std::string> names = cases, ultimate, serviceability;
  for (const auto& c : combinations) {
    names.push_back(c.name);
    (c.serviceability ? serviceability : ultimate).push_back(c.name);
  }
  // Without `combinations:`, the combinations of the check's limit state; all results when there are none
  // of that kind (every case when there are no combinations at all).
  auto defaults = [&](bool sls) {
    const auto& kind = sls ? serviceability : ultimate;
    if (!kind.empty()) return kind;
    return combinations.empty() ? cases : names;
  };
  ChecksSpec p;
  if (!node) {
    p.stress = StressCheckSpec{defaults(false)};
    return p;
  }
  r.check_keys(node, "checks",
               {"stress", "deflection", "en1993", "aisc360", "drift", "stability", "frequency", "partial_factors"});
  auto names_for = [&](const YAML::Node& check, const std::string& path, bool sls = false) {
    return check["combinations"] ? read_name_list(r, check["combinations"], path + ".combinations", names)
                                 : defaults(sls);
  };
  if (const auto s = node["stress"]) {
    r.check_keys(s, "checks.stress", {"combinations"});
    p.stress = StressCheckSpec{names_for(s, "checks.stress")};
  }
  if (const auto d = node["deflection"]) {
    r.check_keys(d, "checks.deflection", {"span_ratio", "combinations"});
    DeflectionCheckSpec spec;
    if (d["span_ratio"]) spec.span_ratio = positive_ratio(r, d["span_ratio"], "checks.deflection.span_ratio", "300 for L/300");
    spec.combinations = names_for(d, "checks.deflection", true);
    p.deflection = spec;
  }
  if (const auto e = node["en1993"]) p.en1993 = read_en1993(r, e, names_for(e, "checks.en1993"));
  if (const auto a = node["aisc360"]) p.aisc360 = read_aisc360(r, a, names_for(a, "checks.aisc360"));
  if (const auto d = node["drift"]) {
    r.check_keys(d, "checks.drift", {"storey_ratio", "combinations"});
    DriftCheckSpec spec;
    if (d["storey_ratio"]) spec.storey_ratio = positive_ratio(r, d["storey_ratio"], "checks.drift.storey_ratio", "300 for h/300");
    spec.combinations = names_for(d, "checks.drift", true);
    p.drift = spec;
  }
  if (const auto st = node["stability"]) {
    r.check_keys(st, "checks.stability", {"alpha_cr_min", "combinations"});
    StabilityCheckSpec spec;
    if (st["alpha_cr_min"])
      spec.alpha_cr_min = positive_ratio(r, st["alpha_cr_min"], "checks.stability.alpha_cr_min", "10 (EN 1993-1-1 5.2.1(3))");
    spec.combinations = names_for(st, "checks.stability");
    p.stability = spec;
  }
  if (const auto f = node["frequency"]) p.frequency = read_frequency_checks(r, f, "checks.frequency");
  if (const auto f = node["partial_factors"]) {
    r.check_keys(f, "checks.partial_factors", {"gamma_M0", "gamma_M1"});
    if (f["gamma_M0"]) p.gamma_M0 = positive_ratio(r, f["gamma_M0"], "checks.partial_factors.gamma_M0", "1.0");
    if (f["gamma_M1"]) p.gamma_M1 = positive_ratio(r, f["gamma_M1"], "checks.partial_factors.gamma_M1", "1.0");
  }
  return p;
}

}  // namespace stepframe::detail
