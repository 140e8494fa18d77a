#pragma once
// Tests look at every station of every element and member; the solver keeps
// only summaries and recovers lines on demand (member_line.hpp). A result
// with every line recovered, for tests.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/results.hpp"

#include <vector>

namespace stepframe::testing {

/// A load result with its lines: `elements` per model element and `members`
/// per member chain, stations included (`members` hides the summaries).
struct Recovered : analysis::LoadResult {
  std::vector<analysis::LineResult> elements;
  std::vector<analysis::LineResult> members;
};

inline Recovered recovered(const analysis::FrameModel& model, const analysis::LoadResult& result) {
  Recovered r;
  static_cast<analysis::LoadResult&>(r) = result;
  for (std::size_t e = 0; e < model.elements.size(); ++e) r.elements.push_back(analysis::element_line(model, result, e));
  for (const auto& member : analysis::member_chains(model)) r.members.push_back(analysis::member_line(model, result, member));
  return r;
}

/// recovered() for every result of a solve.
inline std::vector<Recovered> recovered(const analysis::FrameModel& model, const std::vector<analysis::LoadResult>& results) {
  std::vector<Recovered> out;
  for (const auto& r : results) out.push_back(recovered(model, r));
  return out;
}

}  // namespace stepframe::testing
