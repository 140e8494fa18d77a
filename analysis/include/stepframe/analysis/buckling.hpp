#pragma once
// Linear (bifurcation) buckling of a frame under a load pattern.
//
// With K the elastic and Kg(N) the geometric stiffness of the axial forces
// N of the pattern, the critical load factors alpha solve
//   (K + alpha Kg) phi = 0,  i.e.  (-Kg) phi = (1/alpha) K phi,
// (linearised stability, e.g. Timoshenko & Gere, Theory of Elastic
// Stability, 2nd ed. 1961, ch. 2; EN 1993-1-1 5.2.1(3) alpha_cr). The largest
// eigenvalues mu = 1/alpha of the pencil, i.e. the alphas nearest zero, are
// found with Spectra's Lanczos solver in regular-inverse mode, K factorised
// once by CHOLMOD (the shift-invert of the buckling pencil about zero).
// Every element is divided into `subdivisions` elements for this analysis
// only, so that one element per column still gives the Euler load: the
// consistent geometric stiffness of 4 elements is within 0.1% of the exact
// pinned-pinned load (and the error falls as 1/n^2).

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstddef>
#include <functional>
#include <vector>

namespace stepframe::analysis {

struct BucklingOptions {
  std::size_t modes = 3;         ///< how many of the lowest positive alphas to find
  std::size_t subdivisions = 6;  ///< elements per model element in the buckling analysis
};

/// Axial force N [N] (tension > 0) of the load pattern at distance x [m]
/// from the start of element `element`.
using AxialForce = std::function<double(std::size_t element, double x)>;

/// The lowest positive critical load factors of the pattern with their modes,
/// lowest first; empty when nothing is compressed. The model must be stable
/// (see solve); throws UnstableFrame otherwise.
std::vector<BucklingMode> buckling_modes(const FrameModel& model, const AxialForce& axial,
                                         const BucklingOptions& options = {});

}  // namespace stepframe::analysis
