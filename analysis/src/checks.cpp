#include "stepframe/analysis/checks.hpp"

#include <algorithm>

namespace stepframe::analysis {
namespace {

// Keeps, per member, the result with the largest utilisation.
void keep_worst(std::vector<CheckResult>& worst, CheckResult candidate) {
  auto& slot = worst[candidate.member];
  if (slot.combination.empty() || candidate.utilisation > slot.utilisation) slot = std::move(candidate);
}

// Runs `check(member index, member chain, member result)` for every member of
// every result and keeps the worst per member.
template <class Check>
std::vector<CheckResult> worst_over(const FrameModel& model, const std::vector<const LoadResult*>& results, Check check) {
  if (results.empty()) return {};
  const auto chains = member_chains(model);
  std::vector<CheckResult> worst(chains.size());
  for (const LoadResult* result : results)
    for (std::size_t m = 0; m < chains.size(); ++m) {
      CheckResult r = check(chains[m], result->members[m]);
      r.member = m;
      r.combination = result->name;
      r.utilisation = r.value / r.limit;
      keep_worst(worst, std::move(r));
    }
  for (auto& r : worst) r.pass = r.utilisation <= 1.0;
  return worst;
}

}  // namespace

std::vector<CheckResult> check_stress(const FrameModel& model, const std::vector<const LoadResult*>& results) {
  return worst_over(model, results, [&](const Member& member, const LineResult& line) {
    const auto peak = std::max_element(line.stations.begin(), line.stations.end(),
                                       [](const Station& a, const Station& b) { return a.max_abs_stress < b.max_abs_stress; });
    CheckResult r;
    r.check = "stress";
    r.clause = "EN 1993-1-1 6.2.1(5), normal stress at extreme fibres, gamma_M0 = 1.0";
    r.station = peak == line.stations.end() ? 0.0 : peak->x;
    r.value = line.max_abs_stress;
    r.limit = model.materials[model.elements[member.elements.front()].material].fy;
    return r;
  });
}

std::vector<CheckResult> check_deflection(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                          double span_ratio) {
  return worst_over(model, results, [&](const Member&, const LineResult& line) {
    CheckResult r;
    r.check = "deflection";
    r.clause = "EN 1993-1-1 7.2, local deflection <= L/" + std::to_string(static_cast<long>(span_ratio));
    r.station = line.max_local_deflection_at;
    r.value = line.max_local_deflection;
    r.limit = line.stations.back().x / span_ratio;  // the member's length
    return r;
  });
}

}  // namespace stepframe::analysis
