#include "stepframe/analysis/checks.hpp"

#include <algorithm>

namespace stepframe::analysis {
namespace {

double member_length(const FrameModel& model, const FrameMember& m) {
  return (model.nodes[m.nodes[1]] - model.nodes[m.nodes[0]]).norm();
}

// Keeps, per member, the result with the largest utilisation.
void keep_worst(std::vector<CheckResult>& worst, CheckResult candidate) {
  auto& slot = worst[candidate.member];
  if (slot.combination.empty() || candidate.utilisation > slot.utilisation) slot = std::move(candidate);
}

}  // namespace

std::vector<CheckResult> check_stress(const FrameModel& model, const std::vector<const LoadResult*>& results) {
  std::vector<CheckResult> worst(model.members.size());
  for (const LoadResult* result : results)
    for (std::size_t m = 0; m < model.members.size(); ++m) {
      const auto& stations = result->members[m].stations;
      const auto peak = std::max_element(stations.begin(), stations.end(), [](const Station& a, const Station& b) {
        return a.max_abs_stress < b.max_abs_stress;
      });
      const double fy = model.materials[model.members[m].material].fy;
      CheckResult r;
      r.member = m;
      r.check = "stress";
      r.clause = "EN 1993-1-1 6.2.1(5), normal stress at extreme fibres, gamma_M0 = 1.0";
      r.combination = result->name;
      r.station = peak == stations.end() ? 0.0 : peak->x;
      r.value = result->members[m].max_abs_stress;
      r.limit = fy;
      r.utilisation = r.value / r.limit;
      keep_worst(worst, std::move(r));
    }
  for (auto& r : worst) r.pass = r.utilisation <= 1.0;
  return results.empty() ? std::vector<CheckResult>{} : worst;
}

std::vector<CheckResult> check_deflection(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                          double span_ratio) {
  std::vector<CheckResult> worst(model.members.size());
  for (const LoadResult* result : results)
    for (std::size_t m = 0; m < model.members.size(); ++m) {
      const double length = member_length(model, model.members[m]);
      CheckResult r;
      r.member = m;
      r.check = "deflection";
      r.clause = "EN 1993-1-1 7.2, local deflection <= L/" + std::to_string(static_cast<long>(span_ratio));
      r.combination = result->name;
      r.station = result->members[m].max_local_deflection_at;
      r.value = result->members[m].max_local_deflection;
      r.limit = length / span_ratio;
      r.utilisation = r.value / r.limit;
      keep_worst(worst, std::move(r));
    }
  for (auto& r : worst) r.pass = r.utilisation <= 1.0;
  return results.empty() ? std::vector<CheckResult>{} : worst;
}

}  // namespace stepframe::analysis
