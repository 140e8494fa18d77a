#pragma once
// Mcr integrals shared by the members whose stations lie at the same positions.

#include "stepframe/analysis/en1993.hpp"

#include <cstddef>
#include <map>
#include <memory>
#include <mutex>
#include <vector>

namespace stepframe::analysis::en1993 {

/// The Mcr integrals (diagram_integrals) of many members' stations, worked out
/// once for each set of positions: in a regular frame most members share their
/// length and stations with others (a storey's beams of one span, a column
/// line), and the integrals depend on the positions alone. Safe to use from
/// several threads. Keeps at most `capacity` sets (about 33 kB each for 21
/// stations), so that a frame whose members all differ holds no more than that.
class DiagramIntegralsCache {
 public:
  explicit DiagramIntegralsCache(std::size_t capacity = 256) : capacity_(capacity) {}

  /// The integrals for points at `x` (ascending, at least two): the kept ones
  /// when these exact positions were asked for before, else worked out (and
  /// kept while there is room). The same numbers either way.
  std::shared_ptr<const DiagramIntegrals> at(std::vector<double> x);

 private:
  std::size_t capacity_;
  std::mutex mutex_;
  std::map<std::vector<double>, std::shared_ptr<const DiagramIntegrals>> kept_;
};

/// One member's Mcr integrals from one load result to the next: its results
/// share its stations, so the set last used serves until the positions change;
/// then the shared cache (when given) or diagram_integrals gives the next.
struct MemberIntegrals {
  DiagramIntegralsCache* shared = nullptr;
  std::shared_ptr<const DiagramIntegrals> last;

  /// The integrals for a diagram with points at these positions.
  const DiagramIntegrals& at(const std::vector<DiagramPoint>& diagram);
};

}  // namespace stepframe::analysis::en1993
