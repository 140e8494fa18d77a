// The governing check of every member: the one with the largest utilisation.

#include "stepframe/run.hpp"

namespace stepframe {

std::vector<const analysis::CheckResult*> governing_checks(const Analysis& analysis) {
  std::vector<const analysis::CheckResult*> governing(analysis.built.model.members.size(), nullptr);
  for (const auto& c : analysis.checks)
    if (c.member != analysis::whole_frame && c.member < governing.size() &&
        (!governing[c.member] || c.utilisation > governing[c.member]->utilisation))
      governing[c.member] = &c;
  return governing;
}

}  // namespace stepframe
