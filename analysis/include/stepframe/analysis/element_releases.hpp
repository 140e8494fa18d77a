#pragma once
// End releases by static condensation.
//
// A released end action is zero, so the element's own displacement in that
// direction is free of the node's: with r the released and c the retained
// DOFs, f_r = k_rc u_c + k_rr u_r + f0_r = 0 gives
//   u_r = -k_rr^-1 (k_rc u_c + f0_r),
//   k*  = k_cc - k_cr k_rr^-1 k_rc,   f0* = f0_c - k_cr k_rr^-1 f0_r
// (static condensation, Guyan 1965; e.g. Przemieniecki 1968, sec. 9.4, common practice).
// Released rows and columns of k* and f0* are zero.

#include "stepframe/analysis/frame_element.hpp"

#include <array>
#include <optional>
#include <string>

namespace stepframe::analysis {

using EndReleases = std::array<std::array<bool, 6>, 2>;  ///< [start, end] x Dof, local axes

/// True when any action is released.
bool any_release(const EndReleases& releases);

/// Names the released directions that leave the element free to move as a
/// mechanism on its own (e.g. "rx at both ends"), or nothing when the releases
/// are admissible. Only the pattern matters, not the properties.
std::optional<std::string> release_mechanism(const EndReleases& releases);

/// Stiffness and fixed-end actions (forces the nodes exert on the element)
/// with the released DOFs condensed out. The releases must be admissible.
struct CondensedElement {
  Matrix12d k = Matrix12d::Zero();
  Vector12d fixed_end = Vector12d::Zero();
};
CondensedElement condense_releases(const Matrix12d& k, const Vector12d& fixed_end, const EndReleases& releases);

/// The element's own end displacements: the nodes' values at retained DOFs
/// and u_r (above) at the released ones, so that k u + fixed_end has zero
/// released entries.
Vector12d element_end_displacements(const Matrix12d& k, const Vector12d& fixed_end, const EndReleases& releases,
                                    const Vector12d& node_displacements);

}  // namespace stepframe::analysis
