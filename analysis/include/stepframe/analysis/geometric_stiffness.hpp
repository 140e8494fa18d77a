#pragma once
// Geometric (initial-stress) stiffness of the 12-DOF frame element.

#include "stepframe/analysis/frame_element.hpp"

namespace stepframe::analysis {

/// Consistent geometric stiffness in local axes (DOF order of frame_element.hpp)
/// of an element carrying the axial force N (tension > 0): the cubic Hermite
/// shape functions in the second-order work N/2 int (v'^2 + w'^2) dx
/// (Przemieniecki, Theory of Matrix Structural Analysis, 1968, ch. 15). The
/// total stiffness is k + kg: compression softens. The torsional (Wagner) term
/// N Ip / (A L) is left out on purpose: without a warping degree of freedom it
/// would produce pure torsional modes at G J A / Ip that ignore the warping
/// stiffness of open sections; torsional and lateral-torsional buckling
/// belong to the member checks.
Matrix12d local_geometric_stiffness(const ElementProperties& p, double axial_force);

}  // namespace stepframe::analysis
