#include "stepframe/analysis/solve.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/load_vector.hpp"
#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/element_recovery.hpp"
#include "stepframe/analysis/model_validation.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <stdexcept>

namespace stepframe::analysis {
namespace {

// Displacements, loads and member loads of one case or combination.
struct LoadState {
  std::string name;
  bool is_combination = false;
  Eigen::VectorXd f;                       // full global load vector
  std::vector<Eigen::Vector3d> q_local;    // uniform load per member, local axes
  Eigen::VectorXd u;                       // full global displacements
};

void report(const SolveOptions& options, double fraction) {
  if (options.progress) options.progress(std::clamp(fraction, 0.0, 1.0));
}

bool has_any_support(const FrameModel& model) {
  return std::any_of(model.supports.begin(), model.supports.end(), [](const Support& s) {
    return std::any_of(s.fixed.begin(), s.fixed.end(), [](bool fixed) { return fixed; });
  });
}

LoadResult recover(const FrameModel& model, const Eigen::SparseMatrix<double>& k_full, const DofNumbering& dofs,
                   const LoadState& state, std::size_t stations) {
  LoadResult result;
  result.name = state.name;
  result.is_combination = state.is_combination;
  result.displacements = state.u;

  // Reactions R = K u - F at the supported DOFs (nodal equilibrium, common practice).
  const Eigen::VectorXd residual = k_full * state.u - state.f;
  result.reactions = Eigen::VectorXd::Zero(residual.size());
  for (Eigen::Index g = 0; g < residual.size(); ++g)
    if (!dofs.is_free(g)) result.reactions(g) = residual(g);

  result.elements.reserve(model.elements.size());
  for (std::size_t m = 0; m < model.elements.size(); ++m) {
    const FrameElement& member = model.elements[m];
    const ElementGeometry geo = element_geometry(model, m);
    ElementState ms;
    ms.section = model.sections[member.section];
    ms.properties = element_properties(ms.section, model.materials[member.material], geo.length);
    ms.axes = geo.axes;
    ms.origin = model.nodes[member.nodes[0]];
    ms.end_displacements << state.u.segment<6>(global_dof(member.nodes[0], ux)),
        state.u.segment<6>(global_dof(member.nodes[1], ux));
    ms.q_local = state.q_local[m];
    result.elements.push_back(recover_element(ms, stations));
  }
  for (const Member& member : member_chains(model)) result.members.push_back(join_elements(member, result.elements));
  return result;
}

}  // namespace

std::vector<LoadResult> solve(const FrameModel& model, const SolveOptions& options) {
  validate_model(model);
  if (options.stations < 2) throw std::invalid_argument("SolveOptions::stations must be at least 2 (both member ends)");
  if (!has_any_support(model))
    throw UnstableFrame("the frame is unstable: it has no supports; fix at least one node against translation "
                        "and rotation",
                        {});
  spdlog::debug("analysing frame: {} nodes, {} members, {} load cases, {} combinations", model.nodes.size(),
               model.elements.size(), model.cases.size(), model.combinations.size());
  report(options, 0.0);

  // Assembly.
  const DofNumbering dofs = number_dofs(model);
  const Eigen::SparseMatrix<double> k_full = assemble_stiffness(model);
  const Eigen::SparseMatrix<double> k_free = free_block(k_full, dofs);
  std::vector<LoadState> states;
  states.reserve(model.cases.size() + model.combinations.size());
  for (const LoadCase& lc : model.cases) {
    LoadState s;
    s.name = lc.name;
    s.q_local = element_local_loads(model, lc);
    s.f = load_vector(model, lc, s.q_local);
    states.push_back(std::move(s));
  }
  spdlog::debug("assembled {} DOFs ({} free), {} stiffness non-zeros", k_full.rows(), dofs.free_count(),
                k_full.nonZeros());
  report(options, 0.2);

  // One factorisation, one solve per load case.
  const StiffnessFactor factor(k_free, dofs, model.nodes);
  report(options, 0.4);
  for (LoadState& s : states) s.u = expand_free(factor.solve(free_part(s.f, dofs)), dofs);
  report(options, 0.5);

  // Combinations by superposition (linear analysis): u, F and member loads are
  // summed with their factors; member results are recovered from the sums.
  for (const Combination& combo : model.combinations) {
    LoadState c;
    c.name = combo.name;
    c.is_combination = true;
    c.f = Eigen::VectorXd::Zero(k_full.rows());
    c.u = Eigen::VectorXd::Zero(k_full.rows());
    c.q_local.assign(model.elements.size(), Eigen::Vector3d::Zero());
    for (const auto& [index, factor_value] : combo.factors) {
      const LoadState& s = states[index];
      c.f += factor_value * s.f;
      c.u += factor_value * s.u;
      for (std::size_t m = 0; m < model.elements.size(); ++m) c.q_local[m] += factor_value * s.q_local[m];
    }
    states.push_back(std::move(c));
  }

  // Member recovery for every case and combination.
  std::vector<LoadResult> results;
  results.reserve(states.size());
  for (std::size_t i = 0; i < states.size(); ++i) {
    results.push_back(recover(model, k_full, dofs, states[i], options.stations));
    report(options, 0.5 + 0.5 * static_cast<double>(i + 1) / static_cast<double>(states.size()));
  }
  report(options, 1.0);
  spdlog::info("frame analysed: {} nodes, {} members, {} free DOFs, {} load cases, {} combinations",
               model.nodes.size(), model.elements.size(), dofs.free_count(), model.cases.size(),
               model.combinations.size());
  return results;
}

}  // namespace stepframe::analysis
