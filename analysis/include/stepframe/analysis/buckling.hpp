#pragma once
// Linear (bifurcation) buckling of a frame under load patterns.
//
// With K the elastic and Kg(N) the geometric stiffness of the axial forces
// N of a pattern, the critical load factors alpha solve
//   (K + alpha Kg) phi = 0,  i.e.  (-Kg) phi = (1/alpha) K phi,
// (linearised stability, e.g. Timoshenko & Gere, Theory of Elastic
// Stability, 2nd ed. 1961, ch. 2; EN 1993-1-1 5.2.1(3) alpha_cr). The largest
// eigenvalues mu = 1/alpha of the pencil, i.e. the alphas nearest zero, are
// found by iterations with K^-1 (-Kg), K factorised by CHOLMOD (below).
//
// One cubic element per member overestimates a member's own buckling load
// (by 21.6% for a pin-ended column: 12 E I / L^2 against pi^2 E I / L^2);
// the error falls fast as the member is divided (0.75% for two parts, 0.05%
// for four: the consistent geometric stiffness converges as the fourth power
// of the part length). The analysis is therefore adaptive, in two passes
// that share the static analysis' factorisation:
//  1. every pattern on the model's own elements; Rayleigh-Ritz on a coarser
//     space, so each alpha found is an upper bound. The first compressed
//     pattern is solved; every later one is only bounded, by Rayleigh-Ritz on
//     the first one's converged subspace (no solve; bounds from above again,
//     so the division below stays on the safe side). Bounds need no tight
//     solve: pass 1 iterates to 10 `tolerance`. Each pattern is then solved
//     to `tolerance` in pass 2, or here when no element needs dividing;
//  2. where an element, at the highest alpha wanted, carries more than
//     `part_load_ratio` of the Euler load of its parts (rho = alpha |N| l^2 /
//     (pi^2 E I_min) per part of length l; at most rho = 4, its own
//     fixed-ended load, so that a member buckling between held nodes is
//     found too), it is divided until no part does, and every pattern is
//     solved again on that refined model. The inner nodes of a divided
//     element are condensed into its end nodes element by element: that
//     gives back the undivided stiffness exactly, so the refined model needs
//     no factorisation of its own (see the condensed operator in the source).
// A part at rho = 0.1 is within about 0.12% of its exact stiffness, so
// alpha_cr comes out within a few tenths of a per cent of the converged
// value; elements in tension or barely compressed (beams) stay whole.
// The first compressed pattern is solved by block Krylov iteration from a
// deterministic pseudo-random block (each step one solve with a block of
// vectors, which on a large frame costs little more than a single one);
// pass 2 by block subspace iteration, its first pattern started from its
// pass-1 modes (two or three block solves), every later one from the block
// the pattern before converged to, which usually settles after one block
// solve. Spectra's Lanczos solver (one vector per solve) takes over when
// either does not settle.

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <Eigen/SparseCore>

#include <cstddef>
#include <functional>
#include <vector>

namespace stepframe::analysis {

struct BucklingOptions {
  std::size_t modes = 3;  ///< how many of the lowest positive alphas to find per pattern
  /// Largest share of its own Euler load a part of a divided element may
  /// carry at the highest alpha wanted (see above).
  double part_load_ratio = 0.1;
  std::size_t max_parts = 24;  ///< most parts an element is divided into
  double tolerance = 1e-5;     ///< relative accuracy of alpha_cr (of the other modes: 100 times looser)
};

/// Axial force N [N] (tension > 0) of a load pattern at distance x [m] from
/// the start of element `element`.
using AxialForce = std::function<double(std::size_t element, double x)>;

/// The model's elastic stiffness as the static analysis reduced and
/// factorised it (released rotations tied), to be reused by pass 1.
struct FactorisedStiffness {
  const Eigen::SparseMatrix<double>& k_free;
  const DofNumbering& dofs;
  const StiffnessFactor& factor;
};

/// The lowest positive critical load factors of each pattern with their
/// modes, lowest first; empty for a pattern that compresses nothing. Without
/// `stiffness` the model's stiffness is assembled and factorised here. The
/// model must be stable (see solve); throws UnstableFrame otherwise.
/// `progress`, when given, is told the fraction done (from this thread).
std::vector<std::vector<BucklingMode>> buckling_modes(const FrameModel& model, const std::vector<AxialForce>& patterns,
                                                      const BucklingOptions& options = {},
                                                      const FactorisedStiffness* stiffness = nullptr,
                                                      const std::function<void(double)>& progress = {});

/// Translation (global) of a mode at fraction t in [0, 1] along element
/// `element`: cubic Hermite interpolation of the translations and rotations
/// at the points the analysis divided the element into (exact for the
/// analysis' own shape functions), axial part linear.
Eigen::Vector3d mode_translation(const FrameModel& model, const BucklingMode& mode, std::size_t element, double t);

}  // namespace stepframe::analysis
