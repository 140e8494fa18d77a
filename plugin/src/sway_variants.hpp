#pragma once
// EN 1993-1-1 5.3.2 sway imperfections as variants of the ultimate
// combinations (analysis.sway_imperfection; README "Checks").

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/solve.hpp"
#include "stepframe/project.hpp"
#include "stepframe/run.hpp"

#include <vector>

namespace stepframe::detail {

/// For every ultimate combination of `model` and each horizontal direction
/// (X, Y): phi and the equivalent horizontal forces from a first-order solve
/// of the combination, and, unless 5.3.2(4) exempts it, a load case with the
/// forces ("ULS.swayX") and two combinations, the original plus and minus
/// them ("ULS.sway+X", "ULS.sway-X"; no buckling
/// analysis of their own: the forces change no axial force). The checks of
/// `project` that name a combination also run under its variants. Nothing
/// when the project switches imperfections off or has no ultimate combination.
/// `options` gives the progress callback.
std::vector<SwayImperfectionRecord> add_sway_imperfections(Project& project, analysis::FrameModel& model,
                                                           const analysis::SolveOptions& options);

}  // namespace stepframe::detail
