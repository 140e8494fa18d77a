#include "stepframe/analysis/checks.hpp"

#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>

namespace stepframe::analysis {
namespace {

// Runs `check(member index, member chain, member summary, result)` for every
// member of every result and keeps the worst per member, the members spread
// over the cores; `check` may return a result with an empty `check` name to
// skip a member. `clause(member index, member chain, kept result)` then words the clause of
// each kept result only (formatting it for every result would cost more than
// the check).
template <class Check, class Clause>
std::vector<CheckResult> worst_over(const FrameModel& model, const std::vector<const LoadResult*>& results, Check check,
                                    Clause clause) {
  if (results.empty()) return {};
  const auto chains = member_chains(model);
  std::vector<CheckResult> worst(chains.size());
  parallel_for(chains.size(), [&](std::size_t m) {
    CheckResult& slot = worst[m];
    for (const LoadResult* result : results) {
      CheckResult r = check(m, chains[m], result->members[m], *result);
      if (r.check.empty()) continue;
      r.utilisation = r.value / r.limit;
      if (slot.check.empty() || r.utilisation > slot.utilisation) slot = std::move(r), slot.combination = result->name;
    }
    if (slot.check.empty()) return;
    slot.member = m;
    slot.pass = slot.utilisation <= 1.0;
    slot.clause = clause(m, chains[m], slot);
  });
  std::vector<CheckResult> out;
  for (auto& r : worst)
    if (!r.check.empty()) out.push_back(std::move(r));
  return out;
}

// Number of element ends at each node, and whether it is supported: a member
// end with one element end and no support is free.
std::vector<bool> free_ends(const FrameModel& model) {
  std::vector<int> ends(model.nodes.size(), 0);
  for (const auto& e : model.elements) ++ends[e.nodes[0]], ++ends[e.nodes[1]];
  for (const auto& s : model.supports)
    if (std::any_of(s.fixed.begin(), s.fixed.end(), [](bool f) { return f; }) ||
        std::any_of(s.spring.begin(), s.spring.end(), [](double k) { return k > 0; }))
      ends[s.node] += 2;
  std::vector<bool> free(model.nodes.size());
  for (std::size_t n = 0; n < free.size(); ++n) free[n] = ends[n] == 1;
  return free;
}

// The translation of a node under a result, global [m].
Eigen::Vector3d translation(const LoadResult& result, std::size_t node) {
  return result.displacements.segment<3>(static_cast<Eigen::Index>(6 * node));
}

}  // namespace

std::vector<CheckResult> check_stress(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                      double gamma_M0) {
  const std::vector<double> fy = member_yield_strengths(model, member_chains(model));
  return worst_over(
      model, results,
      [&](std::size_t m, const Member&, const LineSummary& line, const LoadResult&) {
        CheckResult r;
        r.check = "stress";
        r.unit = "Pa";
        r.station = line.max_von_mises_at;
        r.value = line.max_von_mises;
        r.limit = fy[m] / gamma_M0;
        return r;
      },
      [&](std::size_t, const Member&, const CheckResult& r) {
        return fmt::format("EN 1993-1-1 6.2.1(5), von Mises at the section's stress points <= fy / gamma_M0 "
                           "(fy = {:.0f} MPa, gamma_M0 = {:.2f})",
                           r.limit * gamma_M0 / 1e6, gamma_M0);
      });
}

std::vector<CheckResult> check_deflection(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                          const std::vector<double>& span_ratios) {
  const auto free = free_ends(model);
  if (!results.empty() && span_ratios.size() < member_chains(model).size())
    throw std::out_of_range("check_deflection: one span ratio per member is needed");
  auto cantilever = [&](const Member& member) {
    return free[model.elements[member.elements.front()].nodes[0]] != free[model.elements[member.elements.back()].nodes[1]];
  };
  return worst_over(
      model, results,
      [&](std::size_t m, const Member& member, const LineSummary& line, const LoadResult& result) {
        const std::size_t start = model.elements[member.elements.front()].nodes[0];
        const std::size_t end = model.elements[member.elements.back()].nodes[1];
        const double ratio = span_ratios[m], length = line.length;
        CheckResult r;
        r.check = "deflection";
        r.unit = "m";
        if (cantilever(member)) {
          // The free end's movement across the member relative to its root (includes the root's rotation).
          const bool free_end = free[end];
          const std::size_t tip = free_end ? end : start, root = free_end ? start : end;
          const Eigen::Vector3d axis = (model.nodes[end] - model.nodes[start]).normalized();
          const Eigen::Vector3d d = translation(result, tip) - translation(result, root);
          r.station = free_end ? length : 0.0;
          r.value = (d - d.dot(axis) * axis).norm();
          r.limit = 2 * length / ratio;
        } else {
          r.station = line.max_local_deflection_at;
          r.value = line.max_local_deflection;
          r.limit = length / ratio;
        }
        return r;
      },
      [&](std::size_t m, const Member& member, const CheckResult&) {
        return cantilever(member) ? fmt::format("EN 1993-1-1 7.2, cantilever tip deflection <= 2L/{:g}", span_ratios[m])
                                  : fmt::format("EN 1993-1-1 7.2, local deflection <= L/{:g}", span_ratios[m]);
      });
}

std::vector<CheckResult> check_drift(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                     double storey_ratio) {
  const std::string clause = fmt::format("storey drift <= h/{:g} (EN 1990 A1.4.3, limit set by the project)",
                                         storey_ratio);
  return worst_over(
      model, results,
      [&](std::size_t, const Member& member, const LineSummary& line, const LoadResult& result) {
        CheckResult r;
        const std::size_t start = model.elements[member.elements.front()].nodes[0];
        const std::size_t end = model.elements[member.elements.back()].nodes[1];
        const Eigen::Vector3d chord = model.nodes[end] - model.nodes[start];
        if (std::abs(chord.z()) < 0.99 * chord.norm()) return r;  // not a column: no drift check
        const Eigen::Vector3d sway = translation(result, end) - translation(result, start);
        r.check = "drift";
        r.unit = "m";
        r.station = line.length;
        r.value = sway.head<2>().norm();
        r.limit = std::abs(chord.z()) / storey_ratio;
        return r;
      },
      [&](std::size_t, const Member&, const CheckResult&) { return clause; });
}

std::vector<CheckResult> check_frame_stability(const std::vector<const LoadResult*>& results, double alpha_cr_min) {
  std::vector<CheckResult> out;
  for (const LoadResult* result : results) {
    if (!result->alpha_cr) continue;
    CheckResult r;
    r.member = whole_frame;
    r.check = "frame stability";
    r.combination = result->name;
    r.value = *result->alpha_cr;
    // First order: alpha_cr must reach the limit. Second order (P-Delta) already carries the
    // amplification, so only alpha_cr > 1 (the frame stands at all) is asked for.
    r.limit = result->second_order ? 1.0 : alpha_cr_min;
    r.utilisation = r.limit / *result->alpha_cr;
    r.pass = r.utilisation <= 1.0;
    r.clause = result->second_order
                   ? "EN 1993-1-1 5.2.1(3): second-order effects included by the P-Delta analysis; alpha_cr > 1"
                   : fmt::format("EN 1993-1-1 5.2.1(3): alpha_cr >= {:g} for a first-order analysis; otherwise ask "
                                 "for analysis: {{second_order: true}}",
                                 alpha_cr_min);
    out.push_back(std::move(r));
  }
  return out;
}

}  // namespace stepframe::analysis
