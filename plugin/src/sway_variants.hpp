#pragma once
// EN 1993-1-1 5.3.2 sway imperfections as variants of the ultimate
// combinations (analysis.sway_imperfection; README "Checks").

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/pending_buckling.hpp"
#include "stepframe/analysis/solve.hpp"
#include "stepframe/project.hpp"
#include "stepframe/run.hpp"

#include <vector>

namespace stepframe::detail {

/// The results of a solve with the sway imperfections and what was done.
struct SwaySolution {
  /// As analysis::solve_beside_buckling gives them for the extended model: the buckling analysis may
  /// still run (solution.buckling).
  analysis::Solution solution;
  std::vector<SwayImperfectionRecord> records;  ///< per ultimate combination and direction
};

/// Solves `model` (analysis::solve_beside_buckling with `options`) with EN 1993-1-1 5.3.2 sway
/// imperfections: for every ultimate combination and each horizontal
/// direction (X, Y), phi and the equivalent horizontal forces from the
/// combination's first-order column forces and, unless 5.3.2(4) exempts it, a
/// load case with the forces ("ULS.swayX") and two combinations, the original
/// plus and minus them ("ULS.sway+X", "ULS.sway-X"; no buckling analysis of
/// their own: the forces change no axial force). The forces' cases are solved
/// on the model's one factorisation; only `analysis.sway_amplification`
/// (EN 1993-1-1 5.2.2(5), which needs each combination's alpha_cr first) costs
/// a first-order pass of its own. The cases and combinations made are added to
/// `model`, so it matches the results, and the checks of `project` that name a
/// combination also run under its variants. A plain solve when the project
/// switches imperfections off or has no ultimate combination.
SwaySolution solve_with_sway_imperfections(Project& project, analysis::FrameModel& model,
                                           const analysis::SolveOptions& options);

}  // namespace stepframe::detail
