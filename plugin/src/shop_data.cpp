// Piece marks, precamber and the fabrication-stage checks (shop_data.hpp).

#include "stepframe/shop_data.hpp"

#include "stepframe/analysis/lifting.hpp"
#include "table_helpers.hpp"
#include "stepframe/analysis/local_axes.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <map>
#include <numbers>
#include <numeric>
#include <tuple>

namespace stepframe {
namespace {

const Eigen::Vector3d& member_start(const analysis::FrameModel& model, const analysis::Member& member) {
  return model.nodes[model.elements[member.elements.front()].nodes[0]];
}
const Eigen::Vector3d& member_end(const analysis::FrameModel& model, const analysis::Member& member) {
  return model.nodes[model.elements[member.elements.back()].nodes[1]];
}

// C vertical, B within 5 degrees of horizontal, D any other slope (our own letters).
char kind_letter(const Eigen::Vector3d& a, const Eigen::Vector3d& b) {
  if (analysis::is_vertical(a, b)) return 'C';
  constexpr double beam_slope = 5.0 * std::numbers::pi / 180.0;
  return analysis::angle_from_vertical(a, b) >= std::numbers::pi / 2 - beam_slope ? 'B' : 'D';
}

}  // namespace

ShopData shop_data(const Project& project, const BuiltModel& built, const std::vector<analysis::LoadResult>& results) {
  const auto& model = built.model;
  const std::size_t n = model.members.size();
  ShopData shop;
  shop.camber.assign(n, 0.0);
  shop.permanent_deflection.assign(n, 0.0);
  const auto& fab = project.fabrication;
  if (fab.camber) {
    const auto it = std::find_if(results.begin(), results.end(), [&](const auto& r) { return r.name == fab.camber->load; });
    if (it != results.end())
      for (std::size_t m = 0; m < n; ++m) {
        if (analysis::is_vertical(member_start(model, model.members[m]), member_end(model, model.members[m]))) continue;
        const double d = it->members[m].max_local_deflection;
        shop.permanent_deflection[m] = d;
        // Rounded down to the shop's increment, so the beam is never cambered beyond its computed deflection.
        if (d > fab.camber->threshold) shop.camber[m] = std::floor(d / fab.camber->increment + 1e-9) * fab.camber->increment;
      }
  }

  // Members with the same key, sorted by length, grouped while within the tolerance of the group's first.
  struct Piece {
    char letter;
    std::string section, material;
    std::array<std::array<bool, 6>, 2> releases;
    double camber, length;
    std::size_t member;
  };
  std::vector<Piece> pieces;
  for (std::size_t m = 0; m < n; ++m) {
    const auto& member = model.members[m];
    const auto& first = model.elements[member.elements.front()];
    std::array<std::array<bool, 6>, 2> releases{first.releases[0], model.elements[member.elements.back()].releases[1]};
    if (releases[1] < releases[0]) std::swap(releases[0], releases[1]);  // the same piece turned end for end
    pieces.push_back({kind_letter(member_start(model, member), member_end(model, member)),
                      model.sections[first.section].designation, model.materials[first.material].name, releases,
                      shop.camber[m], detail::member_length(model, m), m});
  }
  auto key = [](const Piece& p) { return std::tie(p.letter, p.section, p.material, p.releases, p.camber); };
  std::sort(pieces.begin(), pieces.end(), [&](const Piece& a, const Piece& b) {
    return key(a) != key(b) ? key(a) < key(b) : std::tie(a.length, a.member) < std::tie(b.length, b.member);
  });
  shop.marks.assign(n, "");
  std::map<char, int> numbers;
  const Piece* group = nullptr;
  std::string mark;
  for (const auto& p : pieces) {
    if (!group || key(*group) != key(p) || p.length - group->length > fab.mark_tolerance) {
      group = &p;
      mark = fmt::format("{}{}", p.letter, ++numbers[p.letter]);
    }
    shop.marks[p.member] = mark;
  }
  return shop;
}

std::vector<analysis::CheckResult> fabrication_checks(const Project& project, const BuiltModel& built) {
  const auto& fab = project.fabrication;
  const auto& model = built.model;
  const analysis::en1993::PartialFactors factors{project.checks.gamma_M0, project.checks.gamma_M1};
  std::vector<analysis::CheckResult> out;
  auto limit_check = [&](std::size_t m, const char* check, double value, double limit, const char* unit) {
    analysis::CheckResult c;
    c.member = m;
    c.check = check;
    c.clause = "project fabrication limit (shop and transport)";
    c.combination = "fabrication";
    c.value = value, c.limit = limit, c.unit = unit;
    c.utilisation = value / limit;
    c.pass = c.utilisation <= 1;
    out.push_back(std::move(c));
  };
  for (std::size_t m = 0; m < model.members.size(); ++m) {
    const auto& first = model.elements[model.members[m].elements.front()];
    const auto& section = model.sections[first.section];
    const double length = detail::member_length(model, m);
    const double mass = section.A * model.materials[first.material].density * length;  // kg = A rho L
    if (fab.max_length) limit_check(m, "handling length", length, *fab.max_length, "m");
    if (fab.max_mass) limit_check(m, "handling mass", mass, *fab.max_mass, "kg");
    if (fab.lifting && length > fab.lifting->min_length) {
      analysis::LiftingInput in;
      in.member = m;
      in.section = &section;
      in.material = analysis::material_for_section(model.materials[first.material], section);
      in.length = length;
      in.points = fab.lifting->points;
      in.dynamic_factor = fab.lifting->dynamic_factor;
      const auto lifting = analysis::check_lifting(in, factors);
      out.insert(out.end(), lifting.begin(), lifting.end());
    }
  }
  return out;
}

}  // namespace stepframe
