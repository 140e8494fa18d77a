#include "stepframe/analysis/solve.hpp"

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/buckling.hpp"
#include "stepframe/analysis/element_geometry.hpp"
#include "stepframe/analysis/element_recovery.hpp"
#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/load_vector.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/model_validation.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <stdexcept>

namespace stepframe::analysis {
namespace {

using Sparse = Eigen::SparseMatrix<double>;

// Displacements, loads and member loads of one case or combination.
struct LoadState {
  std::string name;
  bool is_combination = false;
  Eigen::VectorXd f;                 // full global load vector
  Eigen::VectorXd settlement;        // full global enforced displacements (zero at free DOFs)
  std::vector<LocalLoads> loads;     // per element, local axes
  Eigen::VectorXd u;                 // full global displacements
  bool second_order = false;
  std::size_t iterations = 0;
  std::vector<double> axial;         // per element: axial force of the second-order stiffness
};

void report(const SolveOptions& options, double fraction) {
  if (options.progress) options.progress(std::clamp(fraction, 0.0, 1.0));
}

bool has_any_support(const FrameModel& model) {
  return std::any_of(model.supports.begin(), model.supports.end(), [](const Support& s) {
    return std::any_of(s.fixed.begin(), s.fixed.end(), [](bool fixed) { return fixed; });
  });
}

ElementState element_state(const FrameModel& model, std::size_t e, const LoadState& state) {
  const FrameElement& element = model.elements[e];
  const ElementGeometry geo = element_geometry(model, e);
  ElementState es;
  es.section = model.sections[element.section];
  es.properties = element_properties(es.section, model.materials[element.material], geo.length,
                                     model.settings.shear_deformation);
  es.axes = geo.axes;
  es.origin = model.nodes[element.nodes[0]];
  es.end_displacements << state.u.segment<6>(global_dof(element.nodes[0], ux)),
      state.u.segment<6>(global_dof(element.nodes[1], ux));
  es.loads = state.loads[e];
  es.releases = element.releases;
  if (state.second_order) {
    es.second_order = true;
    es.axial_force = state.axial[e];
  }
  return es;
}

// Axial force of each element at its midpoint [N], tension > 0.
std::vector<double> midpoint_axial_forces(const FrameModel& model, const LoadState& state) {
  std::vector<double> n(model.elements.size());
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const ElementState es = element_state(model, e, state);
    const Vector6d f0 = element_end_actions(es).head<6>();
    n[e] = internal_forces_at(f0, es.loads, 0.5 * es.properties.length)(0);
  }
  return n;
}

// Enforced displacements of a case, full global vector.
Eigen::VectorXd settlement_vector(const FrameModel& model, const LoadCase& lc) {
  Eigen::VectorXd s = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(6 * model.nodes.size()));
  for (const Settlement& d : lc.settlements) s(global_dof(d.node, d.dof)) += d.value;
  return s;
}

// A load about a tied rotation (tie_released_rotations) has nothing to resist it.
void check_tied_loads(const std::vector<RotationTie>& ties, const LoadState& s, const FrameModel& model) {
  for (const RotationTie& tie : ties) {
    const double moment = s.f.segment<3>(global_dof(tie.node, rx)).dot(tie.axis);
    const double scale = s.f.cwiseAbs().maxCoeff();
    if (std::abs(moment) <= 1e-9 * std::max(scale, 1.0)) continue;
    const Eigen::Vector3d p = model.nodes[tie.node];
    char buffer[256];
    std::snprintf(buffer, sizeof buffer,
                  "the frame is unstable: in load case '%s' node %zu at (%.3f, %.3f, %.3f) m carries a moment about "
                  "(%.3f, %.3f, %.3f), but every member end there is released in that rotation; remove a release "
                  "or move the load",
                  s.name.c_str(), tie.node, p.x(), p.y(), p.z(), tie.axis.x(), tie.axis.y(), tie.axis.z());
    throw UnstableFrame(buffer, {FreeDirection{tie.node, rx}});
  }
}

// Reactions at the supported DOFs, R = K u - F (nodal equilibrium, common
// practice), and the force -k u of each spring on the structure.
Eigen::VectorXd reactions_of(const FrameModel& model, const Sparse& k_full, const DofNumbering& dofs,
                             const LoadState& s) {
  const Eigen::VectorXd residual = k_full * s.u - s.f;
  Eigen::VectorXd r = Eigen::VectorXd::Zero(residual.size());
  for (Eigen::Index g = 0; g < residual.size(); ++g)
    if (!dofs.is_free(g)) r(g) = residual(g);
  for (const Support& sup : model.supports)
    for (int d = 0; d < 6; ++d) {
      const double k = sup.spring[static_cast<std::size_t>(d)];
      const Eigen::Index g = global_dof(sup.node, d);
      if (k != 0.0 && dofs.is_free(g)) r(g) = -k * s.u(g);
    }
  return r;
}

LoadResult recover(const FrameModel& model, const Sparse& k_full, const DofNumbering& dofs, const LoadState& state,
                   std::size_t stations) {
  LoadResult result;
  result.name = state.name;
  result.is_combination = state.is_combination;
  result.displacements = state.u;
  result.reactions = reactions_of(model, k_full, dofs, state);
  result.second_order = state.second_order;
  result.second_order_iterations = state.iterations;
  result.elements.reserve(model.elements.size());
  for (std::size_t e = 0; e < model.elements.size(); ++e)
    result.elements.push_back(recover_element(element_state(model, e, state), stations));
  for (const Member& member : member_chains(model)) result.members.push_back(join_elements(member, result.elements));
  return result;
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

// P-Delta: K(N) u = F, with N from the previous iterate, until u settles.
void second_order(const FrameModel& model, const DofNumbering& dofs, LoadState& c, const SolveOptions& options,
                  Sparse& k_used) {
  c.second_order = true;
  c.axial.assign(model.elements.size(), 0.0);
  Eigen::VectorXd previous = c.u;
  for (std::size_t it = 1; it <= options.second_order_max_iterations; ++it) {
    c.axial = midpoint_axial_forces(model, c);
    System sys = assemble_system(model, dofs, &c.axial);
    try {
      const StiffnessFactor factor(sys.k_free, dofs, model.nodes);
      c.u = expand_free(factor.solve(free_part(c.f - sys.k_full * c.settlement, dofs)), dofs) + c.settlement;
    } catch (const UnstableFrame&) {
      throw UnstableFrame("the frame is unstable under combination '" + c.name +
                              "' in second-order analysis: its loads reach the elastic critical load (the stiffness "
                              "reduced by the axial forces is singular); stiffen or brace the frame",
                          {});
    }
    c.iterations = it;
    k_used = std::move(sys.k_full);
    const double change = (c.u - previous).cwiseAbs().maxCoeff();
    const double size = c.u.cwiseAbs().maxCoeff();
    previous = c.u;
    if (change <= options.second_order_tolerance * std::max(size, 1e-300)) return;
  }
  spdlog::warn("second-order analysis of '{}' did not settle in {} iterations; results are the last iterate", c.name,
               options.second_order_max_iterations);
}

void add_buckling(const FrameModel& model, const LoadState& state, LoadResult& result, const SolveOptions& options) {
  // Axial forces of the (first-order) state along each element.
  std::vector<Vector6d> start_actions(model.elements.size());
  LoadState first = state;
  first.second_order = false;
  for (std::size_t e = 0; e < model.elements.size(); ++e)
    start_actions[e] = element_end_actions(element_state(model, e, first)).head<6>();
  const AxialForce axial = [&](std::size_t e, double x) {
    return internal_forces_at(start_actions[e], state.loads[e], x)(0);
  };
  BucklingOptions bo;
  bo.modes = options.buckling_modes;
  bo.subdivisions = options.buckling_subdivisions;
  result.buckling_modes = buckling_modes(model, axial, bo);
  if (!result.buckling_modes.empty()) result.alpha_cr = result.buckling_modes.front().alpha;
}

}  // namespace

std::vector<LoadResult> solve(const FrameModel& model, const SolveOptions& options) {
  validate_model(model);
  if (options.stations < 2) throw std::invalid_argument("SolveOptions::stations must be at least 2 (both member ends)");
  if (!has_any_support(model))
    throw UnstableFrame("the frame is unstable: it has no supports; fix at least one node against translation "
                        "and rotation",
                        {});
  spdlog::debug("analysing frame: {} nodes, {} elements, {} load cases, {} combinations", model.nodes.size(),
                model.elements.size(), model.cases.size(), model.combinations.size());
  report(options, 0.0);

  // Assembly.
  const DofNumbering dofs = number_dofs(model);
  const System system = assemble_system(model, dofs, nullptr);
  std::vector<LoadState> states;
  states.reserve(model.cases.size() + model.combinations.size());
  for (const LoadCase& lc : model.cases) {
    LoadState s;
    s.name = lc.name;
    s.loads = element_local_loads(model, lc);
    s.f = load_vector(model, lc, s.loads);
    s.settlement = settlement_vector(model, lc);
    check_tied_loads(system.ties, s, model);
    states.push_back(std::move(s));
  }
  spdlog::debug("assembled {} DOFs ({} free), {} stiffness non-zeros", system.k_full.rows(), dofs.free_count(),
                system.k_full.nonZeros());
  report(options, 0.2);

  // One factorisation; every case's right-hand side F_f - K_fs u_s (enforced
  // displacements u_s at the supported DOFs) solved in one pass.
  const StiffnessFactor factor(system.k_free, dofs, model.nodes);
  report(options, 0.4);
  Eigen::MatrixXd rhs(dofs.free_count(), static_cast<Eigen::Index>(states.size()));
  for (std::size_t i = 0; i < states.size(); ++i)
    rhs.col(static_cast<Eigen::Index>(i)) = free_part(states[i].f - system.k_full * states[i].settlement, dofs);
  const Eigen::MatrixXd solutions = factor.solve(rhs);
  for (std::size_t i = 0; i < states.size(); ++i)
    states[i].u = expand_free(solutions.col(static_cast<Eigen::Index>(i)), dofs) + states[i].settlement;
  report(options, 0.5);

  // Combinations by superposition (linear analysis): u, F, enforced
  // displacements and member loads are summed with their factors.
  const std::size_t case_count = states.size();
  for (const Combination& combo : model.combinations) {
    LoadState c;
    c.name = combo.name;
    c.is_combination = true;
    c.f = Eigen::VectorXd::Zero(system.k_full.rows());
    c.u = Eigen::VectorXd::Zero(system.k_full.rows());
    c.settlement = Eigen::VectorXd::Zero(system.k_full.rows());
    c.loads.assign(model.elements.size(), {});
    for (const auto& [index, factor_value] : combo.factors) {
      const LoadState& s = states[index];
      c.f += factor_value * s.f;
      c.u += factor_value * s.u;
      c.settlement += factor_value * s.settlement;
      for (std::size_t e = 0; e < model.elements.size(); ++e) {
        const LocalLoads part = scaled(s.loads[e], factor_value);
        c.loads[e].insert(c.loads[e].end(), part.begin(), part.end());
      }
    }
    states.push_back(std::move(c));
  }

  // Member recovery for every case and combination; second order and buckling per combination.
  std::vector<LoadResult> results;
  results.reserve(states.size());
  for (std::size_t i = 0; i < states.size(); ++i) {
    LoadState& s = states[i];
    const bool combination = i >= case_count;
    LoadState linear = s;  // first-order state: the buckling analysis takes its axial forces
    if (combination && model.settings.second_order) {
      Sparse k_second;
      second_order(model, dofs, s, options, k_second);
      results.push_back(recover(model, k_second, dofs, s, options.stations));
      spdlog::info("combination '{}': second-order (P-Delta) analysis settled in {} iterations", s.name, s.iterations);
    } else {
      results.push_back(recover(model, system.k_full, dofs, s, options.stations));
    }
    const bool wants_buckling = combination || model.combinations.empty();
    if (options.buckling_modes > 0 && wants_buckling) {
      add_buckling(model, linear, results.back(), options);
      if (results.back().alpha_cr) spdlog::info("'{}': alpha_cr = {:.3f}", s.name, *results.back().alpha_cr);
    }
    report(options, 0.5 + 0.5 * static_cast<double>(i + 1) / static_cast<double>(states.size()));
  }
  report(options, 1.0);
  spdlog::info("frame analysed: {} nodes, {} elements, {} free DOFs, {} load cases, {} combinations",
               model.nodes.size(), model.elements.size(), dofs.free_count(), model.cases.size(),
               model.combinations.size());
  return results;
}

}  // namespace stepframe::analysis
