#include "stepframe/analysis/diagram_integrals_cache.hpp"

#include <utility>

namespace stepframe::analysis::en1993 {

std::shared_ptr<const DiagramIntegrals> DiagramIntegralsCache::at(std::vector<double> x) {
  {
    const std::lock_guard lock(mutex_);
    if (const auto found = kept_.find(x); found != kept_.end()) return found->second;
  }
  // Worked out outside the lock: another thread may do the same positions meanwhile, and the first
  // to finish is kept (both give the same numbers).
  auto made = std::make_shared<const DiagramIntegrals>(diagram_integrals(x));
  const std::lock_guard lock(mutex_);
  if (kept_.size() >= capacity_) return made;
  return kept_.try_emplace(std::move(x), std::move(made)).first->second;
}

const DiagramIntegrals& MemberIntegrals::at(const std::vector<DiagramPoint>& diagram) {
  if (last && lie_at(diagram, last->x)) return *last;
  std::vector<double> x;
  x.reserve(diagram.size());
  for (const auto& p : diagram) x.push_back(p.x);
  last = shared ? shared->at(std::move(x)) : std::make_shared<const DiagramIntegrals>(diagram_integrals(std::move(x)));
  return *last;
}

}  // namespace stepframe::analysis::en1993
