// The pictures of report.html: utilisation of every member with the governing
// ones labelled, the deformed shape under the serviceability combination the
// deflection check uses, and the stresses under the most stressed ultimate
// combination. All on the utilisation scale, with a horizontal legend below.

#include "report_parts.hpp"

#include "stepframe/analysis/member_line.hpp"
#include "stepframe/viz/picture.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <functional>
#include <limits>

namespace stepframe::report {
namespace {

constexpr double not_checked = std::numeric_limits<double>::quiet_NaN();

std::string figure(const viz::Picture& p, const std::string& id, const std::string& caption,
                   const std::string& legend, const Analysis& a) {
  std::string labels;
  for (const auto& l : p.labels)
    labels += fmt::format("<span class=\"label\" style=\"left:{:.2f}%;top:{:.2f}%\" title=\"{}\">{}</span>", 100 * l.x,
                          100 * l.y, esc(member_label(a, l.member)), l.member);
  return fmt::format(
      "<figure id=\"{}\"><div class=\"picture\"><img alt=\"{}\" src=\"data:image/png;base64,{}\">{}</div>"
      "<figcaption>{}</figcaption>{}</figure>\n",
      id, esc(caption), base64(p.png), labels, esc(caption), legend);
}

/// The result a picture of the deflection check shows: the combination of the
/// governing deflection check, else the result with the largest local deflection.
const analysis::LoadResult* deflection_result(const Analysis& a, std::string& why) {
  const analysis::CheckResult* worst = nullptr;
  for (const auto& c : a.checks)
    if (c.check == "deflection" && (!worst || c.utilisation > worst->utilisation)) worst = &c;
  if (worst)
    for (const auto& r : a.results)
      if (r.name == worst->combination) {
        why = "the serviceability result of the governing deflection check";
        return &r;
      }
  why = "no deflection check: the result with the largest deflection";
  const analysis::LoadResult* best = nullptr;
  double largest = -1;
  for (const auto& r : a.results)
    for (const auto& m : r.members)
      if (m.max_local_deflection > largest) largest = m.max_local_deflection, best = &r;
  return best;
}

/// The ultimate combination (or case, without combinations) with the largest von Mises / fy.
const analysis::LoadResult* stress_result(const Analysis& a) {
  const auto& model = a.built.model;
  const auto chains = analysis::member_chains(model);
  bool any_combination = std::any_of(a.results.begin(), a.results.end(), [](const auto& r) { return r.is_combination; });
  const std::vector<double> fy = analysis::member_yield_strengths(model, chains);
  const analysis::LoadResult* best = nullptr;
  double largest = -1;
  for (const auto& r : a.results) {
    if (any_combination && !r.is_combination) continue;
    for (std::size_t m = 0; m < r.members.size(); ++m)
      if (r.members[m].max_von_mises / fy[m] > largest) largest = r.members[m].max_von_mises / fy[m], best = &r;
  }
  return best;
}

}  // namespace

std::string pictures_section(const Analysis& a) {
  if (!a.project.outputs.pictures || a.results.empty()) return {};
  const auto& model = a.built.model;
  const auto governing = governing_checks(a);
  // The pictures are drawn together (one OpenGL context for all); each figure is written once drawn.
  std::vector<viz::PictureRequest> requests;
  std::vector<std::function<std::string(const viz::Picture&)>> figures;

  {  // Governing utilisation, the most utilised members labelled.
    viz::PictureOptions options;
    bool any_unchecked = false;
    for (const auto* c : governing) {
      options.member_values.push_back(c ? c->utilisation : not_checked);
      any_unchecked = any_unchecked || !c;
    }
    const auto order = members_by_utilisation(a);
    for (std::size_t m : order)
      if (governing[m] && options.labelled.size() < 8) options.labelled.push_back(m);
    const std::size_t labelled = options.labelled.size();
    requests.push_back({&a.results.front(), std::move(options)});
    figures.push_back([&a, labelled, any_unchecked](const viz::Picture& picture) {
      return figure(picture, "picture-utilisation",
                    fmt::format("Governing utilisation of every member (all checks, all results); the {} most utilised "
                                "members labelled by number",
                                labelled),
                    utilisation_legend("utilisation", any_unchecked), a);
    });
  }

  std::string why;
  if (const auto* service = deflection_result(a, why)) {  // The deformed shape, coloured by the deflection check.
    viz::PictureOptions options;
    options.deformed = true;
    options.member_values.assign(model.members.size(), not_checked);
    bool any_unchecked = false;
    for (const auto& c : a.checks)
      if (c.check == "deflection" && c.member < options.member_values.size()) options.member_values[c.member] = c.utilisation;
    for (double v : options.member_values) any_unchecked = any_unchecked || std::isnan(v);
    requests.push_back({service, std::move(options)});
    figures.push_back([&a, service, why, any_unchecked](const viz::Picture& picture) {
      const std::string legend =
          utilisation_legend("deflection / limit", any_unchecked) +
          fmt::format("<div class=\"legend\">Displacements drawn {} times their size (pale: undeformed); largest "
                      "displacement {} mm.</div>\n",
                      num(picture.deformation_scale, 3), num(picture.largest_displacement * 1e3, 3));
      return figure(picture, "picture-deformed", fmt::format("Deformed shape under {} ({})", service->name, why), legend,
                    a);
    });
  }

  if (const auto* strength = stress_result(a)) {
    requests.push_back({strength, {}});
    figures.push_back([&a, strength](const viz::Picture& picture) {
      return figure(picture, "picture-stress", "Von Mises stress over fy under " + strength->name + " (the most stressed)",
                    utilisation_legend("von Mises stress / fy", false), a);
    });
  }

  const std::vector<viz::Picture> pictures =
      a.pictures ? a.pictures->draw(model, requests) : viz::draw_frame_pictures(model, requests);
  std::string h = "<h2 id=\"pictures\">Pictures</h2>\n";
  for (std::size_t k = 0; k < pictures.size(); ++k) h += figures[k](pictures[k]);
  return h;
}

}  // namespace stepframe::report
