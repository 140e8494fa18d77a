#pragma once
// Loads on one element in its local axes, and what they do to it: their
// repeated integrals (the "load functions" behind every exact result between
// the nodes), the displacement state they cause along the element, and their
// fixed-end actions.
//
// A load is described by Macaulay (singularity) functions (Macaulay, Messenger
// of Mathematics 48, 1919; e.g. Gere & Timoshenko, Mechanics of Materials,
// "discontinuity functions"): a distributed load varying linearly over [a, b]
// is a step of q_a at a plus a ramp from a, minus the same continued from b;
// a point force is a Dirac term at a. Every integral is then closed-form.

#include "stepframe/analysis/frame_element.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/local_loads.hpp"
#include "stepframe/analysis/results.hpp"

#include <Eigen/Core>
#include <Eigen/LU>

#include <vector>

namespace stepframe::analysis {

/// A uniform load over the whole element [0, L].
LocalLoad uniform_local_load(double length, const Eigen::Vector3d& q_local);

/// The loads scaled by a factor (for combinations).
LocalLoads scaled(const LocalLoads& loads, double factor);

/// j-th repeated integral over [0, x] of the load intensity, per local
/// direction (j >= 1), counting the loads at s < x:
///   j = 1: the resultant of the loads on [0, x);
///   j = 2: their moment about the point x, sum q(s) (x - s);
///   j = 3, 4: further integrals, for slopes and deflections.
Eigen::Vector3d load_integral(const LocalLoads& loads, int j, double x);

/// Sum of all the loads' resultants, local axes [N].
Eigen::Vector3d load_total(const LocalLoads& loads);

/// Load intensity [N/m] at x (distributed loads only), local axes.
Eigen::Vector3d load_intensity(const LocalLoads& loads, double x);

/// Positions where a load starts, stops or acts (sorted, within [0, L], with 0 and L).
std::vector<double> load_breakpoints(const LocalLoads& loads, double length);

/// Displacement state (u, v, w, rx, ry, rz; local axes) at x of an element
/// whose start has the state d0 and carries the start actions f0 (force and
/// moment the start node exerts on the element, local axes), under `loads`.
/// Exact for Euler-Bernoulli bending and, when p.Asy/p.Asz are positive, for
/// Timoshenko bending (shear strain V/(G As)): it integrates the statically
/// exact moments and shears of the free body [0, x] twice (EIz rz' = Mz,
/// v' = rz + Vy/(G Asy); EIy ry' = My, w' = -ry + Vz/(G Asz); EA u' = N; GJ rx' = T).
Vector6d element_state_at(const ElementProperties& p, const Vector6d& d0, const Vector6d& f0,
                          const LocalLoads& loads, double x);

/// Internal forces (N, Vy, Vz, T, My, Mz; results.hpp convention) at x from
/// the start actions f0 and the loads: statics of the free body [0, x].
Vector6d internal_forces_at(const Vector6d& f0, const LocalLoads& loads, double x);

/// The state and the internal forces at one point of an element.
struct ElementPoint {
  Vector6d state;   ///< element_state_at
  Vector6d forces;  ///< internal_forces_at
};

/// element_state_at and internal_forces_at at x with one pass over the loads
/// (the values are theirs, bit for bit).
ElementPoint element_point_at(const ElementProperties& p, const Vector6d& d0, const Vector6d& f0,
                              const LocalLoads& loads, double x);

/// Fixed-end actions: the forces the two (fully fixed) nodes exert on the
/// element under the loads, local axes, start then end. Exact for any load
/// here: the start actions make the cantilever's end state vanish (the
/// flexibility of the element from element_state_at), the end actions follow
/// from equilibrium.
Vector12d fixed_end_actions(const ElementProperties& p, const LocalLoads& loads);

/// The cantilever's flexibility (its end state under unit start actions, no
/// loads: column i is element_state_at for f0 = e_i at x = L), factorised. It
/// depends on the element alone, so a caller recovering one element under many
/// load results can work it out once.
using CantileverFlexibility = Eigen::PartialPivLU<Eigen::Matrix<double, 6, 6>>;
CantileverFlexibility cantilever_flexibility(const ElementProperties& p);

/// fixed_end_actions with the element's cantilever_flexibility(p) given: the
/// same numbers, bit for bit.
Vector12d fixed_end_actions(const ElementProperties& p, const LocalLoads& loads,
                            const CantileverFlexibility& flexibility);

/// End actions from the start actions by equilibrium of the whole element.
Vector12d end_actions_from_start(const ElementProperties& p, const Vector6d& f0, const LocalLoads& loads);

/// A model-level element load (global, local or projected axes, partial or
/// point) as a local load on an element with the given axes (rows: local x,
/// y, z) and length. Throws std::invalid_argument when a or b lie outside the element.
LocalLoad to_local(const ElementLoad& load, const Eigen::Matrix3d& axes, double length);

}  // namespace stepframe::analysis
