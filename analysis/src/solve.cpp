#include "stepframe/analysis/solve.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/buckling.hpp"
#include "stepframe/analysis/element_constants.hpp"
#include "stepframe/analysis/element_recovery.hpp"
#include "stepframe/analysis/load_vector.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/model_validation.hpp"
#include "stepframe/analysis/parallel.hpp"
#include "stepframe/analysis/pending_buckling.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <iterator>
#include <memory>
#include <optional>
#include <stdexcept>

namespace stepframe::analysis {
namespace {

using Sparse = Eigen::SparseMatrix<double>;

// What a case or combination is loaded with, before it is solved.
struct Loading {
  Eigen::VectorXd f;                // full global load vector
  Eigen::VectorXd settlement;       // full global enforced displacements (zero at free DOFs)
  std::vector<LoadTerm> terms;      // the element loads
};

bool has_any_support(const FrameModel& model) {
  return std::any_of(model.supports.begin(), model.supports.end(), [](const Support& s) {
    return std::any_of(s.fixed.begin(), s.fixed.end(), [](bool fixed) { return fixed; });
  });
}

// Enforced displacements of a case, full global vector.
Eigen::VectorXd settlement_vector(const FrameModel& model, const LoadCase& lc) {
  Eigen::VectorXd s = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(6 * model.nodes.size()));
  for (const Settlement& d : lc.settlements) s(global_dof(d.node, d.dof)) += d.value;
  return s;
}

// A load about a tied rotation (tie_released_rotations) has nothing to resist it.
void check_tied_loads(const std::vector<RotationTie>& ties, const std::string& name, const Eigen::VectorXd& f,
                      const FrameModel& model) {
  for (const RotationTie& tie : ties) {
    const double moment = f.segment<3>(global_dof(tie.node, rx)).dot(tie.axis);
    const double scale = f.cwiseAbs().maxCoeff();
    if (std::abs(moment) <= 1e-9 * std::max(scale, 1.0)) continue;
    const Eigen::Vector3d p = model.nodes[tie.node];
    char buffer[256];
    std::snprintf(buffer, sizeof buffer,
                  "the frame is unstable: in load case '%s' node %zu at (%.3f, %.3f, %.3f) m carries a moment about "
                  "(%.3f, %.3f, %.3f), but every member end there is released in that rotation; remove a release "
                  "or move the load",
                  name.c_str(), tie.node, p.x(), p.y(), p.z(), tie.axis.x(), tie.axis.y(), tie.axis.z());
    throw UnstableFrame(buffer, {FreeDirection{tie.node, rx}});
  }
}

// Reactions at the supported DOFs, R = K u - F (nodal equilibrium, common
// practice), and the force -k u of each spring on the structure.
Eigen::VectorXd reactions_of(const FrameModel& model, const Sparse& k_full, const DofNumbering& dofs,
                             const Eigen::VectorXd& u, const Eigen::VectorXd& f) {
  const Eigen::VectorXd residual = k_full * u - f;
  Eigen::VectorXd r = Eigen::VectorXd::Zero(residual.size());
  for (Eigen::Index g = 0; g < residual.size(); ++g)
    if (!dofs.is_free(g)) r(g) = residual(g);
  for (const Support& sup : model.supports)
    for (int d = 0; d < 6; ++d) {
      const double k = sup.spring[static_cast<std::size_t>(d)];
      const Eigen::Index g = global_dof(sup.node, d);
      if (k != 0.0 && dofs.is_free(g)) r(g) = -k * u(g);
    }
  return r;
}

// Every member's summary under a result, the members spread over the cores.
std::vector<LineSummary> summarise_members(const FrameModel& model, const std::vector<Member>& chains,
                                           const LoadResult& result) {
  std::vector<LineSummary> summaries(chains.size());
  parallel_for(chains.size(),
               [&](std::size_t m) { summaries[m] = member_line(model, result, chains[m], LineDetail::summary); });
  return summaries;
}

// The stiffness with springs and rotation ties, and its free block.
struct System {
  Sparse k_full;
  std::vector<RotationTie> ties;
  Sparse k_free;
};

System assemble_system(const FrameModel& model, const DofNumbering& dofs, const std::vector<double>* axial) {
  System s;
  s.k_full = assemble_stiffness(model, axial);
  s.ties = tie_released_rotations(s.k_full, dofs, model);
  s.k_free = free_block(s.k_full, dofs);
  return s;
}

// Axial force of each element at its midpoint [N], tension > 0.
std::vector<double> midpoint_axial_forces(const FrameModel& model, const LoadResult& r) {
  std::vector<double> n(model.elements.size());
  parallel_for(model.elements.size(), [&](std::size_t e) {
    const ElementState es = element_state(model, r, e);
    const Vector6d f0 = element_end_actions(es).head<6>();
    n[e] = internal_forces_at(f0, es.loads, 0.5 * es.properties.length)(0);
  });
  return n;
}

// P-Delta: K(N) u = F, with N from the previous iterate, until u settles.
// Returns the full stiffness of the last iterate (for the reactions).
Sparse second_order(const FrameModel& model, const DofNumbering& dofs, LoadResult& c, const Loading& loading,
                    const SolveOptions& options) {
  c.second_order = true;
  c.second_order_axial.assign(model.elements.size(), 0.0);
  Sparse k_used;
  Eigen::VectorXd previous = c.displacements;
  for (std::size_t it = 1; it <= options.second_order_max_iterations; ++it) {
    std::vector<double> axial = midpoint_axial_forces(model, c);
    System sys = assemble_system(model, dofs, &axial);
    try {
      const StiffnessFactor factor(sys.k_free, dofs, model.nodes);
      c.displacements =
          expand_free(factor.solve(free_part(loading.f - sys.k_full * loading.settlement, dofs)), dofs) + loading.settlement;
    } catch (const UnstableFrame&) {
      throw UnstableFrame("the frame is unstable under combination '" + c.name +
                              "' in second-order analysis: its loads reach the elastic critical load (the stiffness "
                              "reduced by the axial forces is singular); stiffen or brace the frame",
                          {});
    }
    c.second_order_axial = std::move(axial);
    c.second_order_iterations = it;
    k_used = std::move(sys.k_full);
    const double change = (c.displacements - previous).cwiseAbs().maxCoeff();
    const double size = c.displacements.cwiseAbs().maxCoeff();
    previous = c.displacements;
    if (change <= options.second_order_tolerance * std::max(size, 1e-300)) return k_used;
  }
  spdlog::warn("second-order analysis of '{}' did not settle in {} iterations; results are the last iterate", c.name,
               options.second_order_max_iterations);
  return k_used;
}

// The axial force along every element of a first-order result (the buckling
// analysis' load pattern): the element's start actions and its loads.
AxialForce axial_pattern(const FrameModel& model, const LoadResult& first_order) {
  auto start = std::make_shared<std::vector<Vector6d>>(model.elements.size());
  auto loads = std::make_shared<std::vector<LocalLoads>>(model.elements.size());
  parallel_for(model.elements.size(), [&](std::size_t e) {
    const ElementState es = element_state(model, first_order, e);
    (*start)[e] = element_end_actions(es).head<6>();
    (*loads)[e] = es.loads;
  });
  return [start, loads](std::size_t e, double x) { return internal_forces_at((*start)[e], (*loads)[e], x)(0); };
}

// A case's load vector, enforced displacements and element loads.
Loading case_loading(const FrameModel& model, const LoadCase& lc, const System& system) {
  Loading l;
  auto loads = std::make_shared<std::vector<LocalLoads>>(element_local_loads(model, lc));
  l.f = load_vector(model, lc, *loads);
  l.settlement = settlement_vector(model, lc);
  l.terms = {LoadTerm{1.0, std::move(loads)}};
  check_tied_loads(system.ties, lc.name, l.f, model);
  return l;
}

// The cases' displacements: every right-hand side F_f - K_fs u_s (enforced
// displacements u_s at the supported DOFs) solved in one pass on the factor.
std::vector<LoadResult> solve_cases(const std::vector<LoadCase>& cases, const Loading* loadings, const System& system,
                                    const DofNumbering& dofs, const StiffnessFactor& factor) {
  Eigen::MatrixXd rhs(dofs.free_count(), static_cast<Eigen::Index>(cases.size()));
  for (std::size_t i = 0; i < cases.size(); ++i)
    rhs.col(static_cast<Eigen::Index>(i)) = free_part(loadings[i].f - system.k_full * loadings[i].settlement, dofs);
  const Eigen::MatrixXd solutions = factor.solve(rhs);
  std::vector<LoadResult> results(cases.size());
  for (std::size_t i = 0; i < cases.size(); ++i) {
    results[i].name = cases[i].name;
    results[i].displacements = expand_free(solutions.col(static_cast<Eigen::Index>(i)), dofs) + loadings[i].settlement;
  }
  return results;
}

// A combination by superposition (linear analysis): u, F and enforced
// displacements summed with their factors; member loads are the cases' own,
// shared, with the factor attached.
std::pair<LoadResult, Loading> superpose(const Combination& combo, const std::vector<LoadResult>& results,
                                         const std::vector<Loading>& loadings) {
  const Eigen::Index size = results.front().displacements.size();
  LoadResult r;
  r.name = combo.name;
  r.is_combination = true;
  r.serviceability = combo.serviceability;
  r.displacements = Eigen::VectorXd::Zero(size);
  Loading l;
  l.f = Eigen::VectorXd::Zero(size);
  l.settlement = Eigen::VectorXd::Zero(size);
  for (const auto& [index, factor_value] : combo.factors) {
    r.displacements += factor_value * results[index].displacements;
    l.f += factor_value * loadings[index].f;
    l.settlement += factor_value * loadings[index].settlement;
    l.terms.push_back(LoadTerm{factor_value, loadings[index].terms.front().loads});
  }
  return {std::move(r), std::move(l)};
}

// The model with the derived loads (SolveOptions::derive_loads) added.
FrameModel with_derived(const FrameModel& model, DerivedLoads derived) {
  FrameModel extended = model;
  std::move(derived.cases.begin(), derived.cases.end(), std::back_inserter(extended.cases));
  std::move(derived.combinations.begin(), derived.combinations.end(), std::back_inserter(extended.combinations));
  validate_model(extended);
  return extended;
}

}  // namespace

Solution solve_beside_buckling(const FrameModel& given, const SolveOptions& options) {
  auto report = [&](std::string_view stage, double fraction) {
    if (options.progress) options.progress(stage, std::clamp(fraction, 0.0, 1.0));
  };
  validate_model(given);
  if (options.stations < 2) throw std::invalid_argument("SolveOptions::stations must be at least 2 (both member ends)");
  if (!has_any_support(given))
    throw UnstableFrame("the frame is unstable: it has no supports; fix at least one node against translation "
                        "and rotation",
                        {});
  spdlog::debug("analysing frame: {} nodes, {} elements, {} load cases, {} combinations", given.nodes.size(),
                given.elements.size(), given.cases.size(), given.combinations.size());

  // Assembly: the stiffness and every case's loads.
  report("assembly", 0.0);
  const DofNumbering dofs = number_dofs(given);
  System system = assemble_system(given, dofs, nullptr);
  std::vector<Loading> loadings;
  for (const LoadCase& lc : given.cases) loadings.push_back(case_loading(given, lc, system));
  spdlog::debug("assembled {} DOFs ({} free), {} stiffness non-zeros", system.k_full.rows(), dofs.free_count(),
                system.k_full.nonZeros());

  // One factorisation for everything that follows.
  report("factorisation", 0.0);
  const auto factor =
      std::make_shared<const StiffnessFactor>(system.k_free, dofs, given.nodes, options.factorisation_threads);
  std::vector<LoadResult> results = solve_cases(given.cases, loadings.data(), system, dofs, *factor);

  // Loads derived from the first-order results: their cases solved on the same factor.
  std::optional<FrameModel> extended;
  if (options.derive_loads) {
    std::vector<LoadResult> first = results;
    for (std::size_t i = 0; i < first.size(); ++i) first[i].element_loads = loadings[i].terms;
    for (const Combination& combo : given.combinations) {
      auto [r, l] = superpose(combo, results, loadings);
      r.element_loads = l.terms;
      first.push_back(std::move(r));
      loadings.push_back(std::move(l));
    }
    for (std::size_t i = 0; i < first.size(); ++i)
      first[i].reactions = reactions_of(given, system.k_full, dofs, first[i].displacements, loadings[i].f);
    loadings.resize(given.cases.size());
    DerivedLoads derived = options.derive_loads(given, first);
    if (!derived.cases.empty() || !derived.combinations.empty()) {
      extended = with_derived(given, std::move(derived));
      for (std::size_t i = given.cases.size(); i < extended->cases.size(); ++i)
        loadings.push_back(case_loading(*extended, extended->cases[i], system));
      auto more = solve_cases({extended->cases.begin() + static_cast<std::ptrdiff_t>(given.cases.size()),
                               extended->cases.end()},
                              loadings.data() + given.cases.size(), system, dofs, *factor);
      std::move(more.begin(), more.end(), std::back_inserter(results));
    }
  }
  const FrameModel& model = extended ? *extended : given;

  // Combinations by superposition.
  results.reserve(model.cases.size() + model.combinations.size());
  for (const Combination& combo : model.combinations) {
    auto [r, l] = superpose(combo, results, loadings);
    results.push_back(std::move(r));
    loadings.push_back(std::move(l));
  }

  // Results are the cases, then the combinations in model order.
  auto wants_buckling = [&](std::size_t i) {
    if (model.combinations.empty()) return true;
    return i >= model.cases.size() && model.combinations[i - model.cases.size()].buckling;
  };
  for (std::size_t i = 0; i < results.size(); ++i) {
    results[i].stations = options.stations;
    results[i].element_loads = loadings[i].terms;
  }

  // Buckling of every combination that asks for it (every case when there are none), from their
  // first-order axial forces, all sharing the factorised stiffness and one refined model: on a
  // thread of its own, beside the recovery below (which needs neither the factor nor k_free).
  Solution solution;
  if (options.buckling_modes > 0) {
    std::vector<AxialForce> patterns;
    std::vector<std::string> names;
    for (std::size_t i = 0; i < results.size(); ++i)
      if (wants_buckling(i)) {
        patterns.push_back(axial_pattern(model, results[i]));
        names.push_back(results[i].name);
      }
    BucklingOptions bo;
    bo.modes = options.buckling_modes;
    if (!patterns.empty())
      solution.buckling = PendingBuckling(model, std::move(patterns), std::move(names), bo, std::move(system.k_free),
                                          dofs, factor);
  }

  // Recovery of every case and combination (second order first where asked), each element's
  // geometry, properties and flexibility worked out once for them all.
  const auto constants = std::make_shared<const std::vector<ElementConstants>>(element_constants(model, results));
  for (LoadResult& r : results) r.element_constants = constants;
  const auto chains = member_chains(model);
  for (std::size_t i = 0; i < results.size(); ++i) {
    report("recovery", static_cast<double>(i) / static_cast<double>(results.size()));
    LoadResult& r = results[i];
    if (r.is_combination && model.settings.second_order) {
      const Sparse k_second = second_order(model, dofs, r, loadings[i], options);
      r.reactions = reactions_of(model, k_second, dofs, r.displacements, loadings[i].f);
      spdlog::info("combination '{}': second-order (P-Delta) analysis settled in {} iterations", r.name,
                   r.second_order_iterations);
    } else {
      r.reactions = reactions_of(model, system.k_full, dofs, r.displacements, loadings[i].f);
    }
    // A derived case exists as a part of derived combinations: displacements and reactions only.
    const bool derived_case = i >= given.cases.size() && i < model.cases.size();
    if (!derived_case) r.members = summarise_members(model, chains, r);
  }

  auto counted = [](std::size_t n, const char* word) { return fmt::format("{} {}{}", n, word, n == 1 ? "" : "s"); };
  spdlog::info("frame analysed: {} nodes, {} elements, {} free DOFs, {}, {}{}", model.nodes.size(),
               model.elements.size(), dofs.free_count(), counted(given.cases.size(), "load case"),
               counted(given.combinations.size(), "combination"),
               extended ? fmt::format(" (and {}, {} derived from the first-order results)",
                                      counted(model.cases.size() - given.cases.size(), "case"),
                                      counted(model.combinations.size() - given.combinations.size(), "combination"))
                        : std::string());
  solution.results = std::move(results);
  return solution;
}

std::vector<LoadResult> solve(const FrameModel& model, const SolveOptions& options) {
  Solution solution = solve_beside_buckling(model, options);
  if (solution.buckling.pending()) {
    auto report = [&](double f) {
      if (options.progress) options.progress("buckling", f);
    };
    report(0.0);
    solution.buckling.attach(solution.results, report);
  }
  return std::move(solution.results);
}

}  // namespace stepframe::analysis
