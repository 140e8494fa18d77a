#include "stepframe/analysis/frequency_checks.hpp"

#include "stepframe/analysis/assembly.hpp"

#include <algorithm>
#include <cmath>
#include <fmt/format.h>
#include <limits>

namespace stepframe::analysis {
namespace {

// Largest translation of a mode at the points of the given elements.
double largest_on(const VibrationMode& mode, const FrameModel& model, const std::vector<std::size_t>& elements) {
  double largest = 0;
  for (std::size_t e : elements) {
    for (std::size_t node : model.elements[e].nodes)
      largest = std::max(largest, mode.shape.displacements.segment<3>(global_dof(node, ux)).norm());
    if (e < mode.shape.inner_points.size())
      for (const auto& p : mode.shape.inner_points[e]) largest = std::max(largest, p.head<3>().norm());
  }
  return largest;
}

}  // namespace

std::vector<CheckResult> check_frequencies(const FrameModel& model, const ModalResult& modes,
                                           const std::vector<FrequencyLimit>& limits, const std::string& mass_label) {
  const auto chains = member_chains(model);
  const double highest = modes.modes.empty() ? 0.0 : modes.modes.back().frequency;
  std::vector<CheckResult> out;
  for (const auto& limit : limits) {
    std::vector<std::size_t> elements;
    if (limit.members.empty()) {
      for (std::size_t e = 0; e < model.elements.size(); ++e) elements.push_back(e);
    } else {
      for (std::size_t m : limit.members) elements.insert(elements.end(), chains[m].elements.begin(), chains[m].elements.end());
    }
    // Frequencies of the modes that move these members, lowest first.
    std::vector<double> moving;
    for (const auto& mode : modes.modes)
      if (largest_on(mode, model, elements) >= engaged_share) moving.push_back(mode.frequency);

    CheckResult c;
    c.member = whole_frame;
    c.combination = mass_label;
    c.unit = "Hz";
    c.clause = "project limit (common practice)";
    if (limit.min_hz) {
      c.check = "lowest natural frequency " + limit.label;
      c.limit = *limit.min_hz;
      if (moving.empty()) {
        // No mode found moves them: their lowest mode lies above the highest found.
        if (highest < *limit.min_hz)
          throw ModesTooFew(fmt::format("{}: none of the {} modes found (up to {:.3g} Hz) moves the members and the "
                                        "highest is below the limit {:.3g} Hz",
                                        limit.label, modes.modes.size(), highest, *limit.min_hz));
        c.value = highest;
        c.details.emplace_back("modes_found", static_cast<double>(modes.modes.size()));
      } else {
        c.value = moving.front();
      }
      c.utilisation = c.limit / c.value;
      c.pass = c.utilisation <= 1.0;
      c.details.emplace_back("f_min", c.limit);
      out.push_back(c);
    }
    if (limit.running_hz) {
      const double run = *limit.running_hz, upper = run * (1 + limit.band);
      if (highest < upper)
        throw ModesTooFew(fmt::format("{}: the {} modes found reach only {:.3g} Hz, below the upper end {:.3g} Hz of "
                                      "the band around {:.3g} Hz",
                                      limit.label, modes.modes.size(), highest, upper, run));
      c.check = "frequency separation " + limit.label;
      double nearest = std::numeric_limits<double>::infinity();
      for (double f : moving)
        if (std::abs(f - run) < std::abs(nearest - run)) nearest = f;
      if (!std::isfinite(nearest)) nearest = highest;  // none moves them below the highest found: clear of the band
      c.value = nearest;
      c.limit = run;
      const double distance = std::abs(nearest - run) / run;
      c.utilisation = limit.band / std::max(distance, 1e-6);  // a mode right at the running frequency: 1e6 band widths
      c.pass = distance >= limit.band;
      c.details = {{"f_running", run}, {"band", limit.band}, {"f_lower", run * (1 - limit.band)}, {"f_upper", upper},
                   {"distance", distance}};
      out.push_back(c);
    }
  }
  return out;
}

}  // namespace stepframe::analysis
