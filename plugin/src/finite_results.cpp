#include "finite_results.hpp"

#include "stepframe/errors.hpp"

#include <fmt/format.h>

#include <cmath>

namespace stepframe::detail {
namespace {

constexpr const char* advice =
    "the input holds a value far out of range (a load, a combination factor, a spring or a section property): "
    "check the project file's numbers and units";

[[noreturn]] void fail(const std::string& model, const std::string& what) {
  throw InputError(fmt::format("{}: the analysis gave a number that is not finite (NaN or infinity) for {}; {}",
                               model, what, advice));
}

bool finite(const Eigen::Ref<const Eigen::VectorXd>& v) { return v.allFinite(); }

}  // namespace

void require_finite_results(const std::vector<analysis::LoadResult>& results, const std::string& model) {
  for (const auto& r : results) {
    const std::string in = (r.is_combination ? "combination '" : "load case '") + r.name + "'";
    for (Eigen::Index i = 0; i < r.displacements.size(); ++i)
      if (!std::isfinite(r.displacements[i])) fail(model, fmt::format("the displacement of node {} in {}", i / 6, in));
    for (Eigen::Index i = 0; i < r.reactions.size(); ++i)
      if (!std::isfinite(r.reactions[i])) fail(model, fmt::format("the reaction at node {} in {}", i / 6, in));
    for (std::size_t m = 0; m < r.members.size(); ++m) {
      const auto& s = r.members[m];
      if (!finite(s.start_forces) || !finite(s.end_forces))
        fail(model, fmt::format("the end forces of member {} in {}", m, in));
      if (!std::isfinite(s.max_abs_stress) || !std::isfinite(s.max_von_mises))
        fail(model, fmt::format("the stresses of member {} in {}", m, in));
      if (!std::isfinite(s.max_local_deflection)) fail(model, fmt::format("the deflection of member {} in {}", m, in));
      for (const auto& e : s.extremes)
        if (!std::isfinite(e.min) || !std::isfinite(e.max))
          fail(model, fmt::format("the internal forces of member {} in {}", m, in));
    }
  }
}

void require_finite_buckling(const std::vector<analysis::LoadResult>& results, const std::string& model) {
  for (const auto& r : results)
    if (r.alpha_cr && !std::isfinite(*r.alpha_cr))
      fail(model, fmt::format("the critical load factor of {} '{}'", r.is_combination ? "combination" : "load case",
                              r.name));
}

void require_finite_checks(const std::vector<analysis::CheckResult>& checks, const std::string& model) {
  for (const auto& c : checks)
    if (!std::isfinite(c.value) || !std::isfinite(c.limit) || !std::isfinite(c.utilisation))
      fail(model, fmt::format("the {} check{} under '{}'", c.check,
                              c.member == analysis::whole_frame ? std::string(" of the frame")
                                                                : fmt::format(" of member {}", c.member),
                              c.combination));
}

}  // namespace stepframe::detail
