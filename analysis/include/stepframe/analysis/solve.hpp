#pragma once
// Linear static analysis of a frame model: every case, then every combination.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstddef>
#include <functional>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::analysis {

/// Cases and combinations added to a model during its solve (see
/// SolveOptions::derive_loads).
struct DerivedLoads {
  std::vector<LoadCase> cases;             ///< appended after the model's own cases
  std::vector<Combination> combinations;   ///< appended after its own combinations; case indices count the new cases
};

struct SolveOptions {
  std::size_t stations = 21;  ///< stations per member for internal forces and deflections
  /// Buckling modes per combination (alpha_cr and mode shapes; every load
  /// case instead when the model has no combinations); 0 skips the buckling analysis.
  std::size_t buckling_modes = 3;
  std::size_t buckling_subdivisions = 6;  ///< elements per model element in the buckling analysis
  /// Second order (FrameModel::settings.second_order): converged when the
  /// displacements change by less than this fraction of their largest value.
  double second_order_tolerance = 1e-8;
  std::size_t second_order_max_iterations = 50;
  /// Called as the work goes on with the stage ("assembly", "factorisation",
  /// "recovery", "buckling") and the fraction of it done, in [0, 1]; each
  /// stage reports 0 when it starts. May be empty.
  std::function<void(std::string_view stage, double fraction)> progress;
  /// Loads that follow from the first-order results (the sway imperfection
  /// forces of EN 1993-1-1 5.3.2 follow from the column forces): called once,
  /// after the cases and combinations are solved to first order and before
  /// any recovery, second-order iteration or buckling analysis, with the model
  /// and those results (displacements, reactions and element loads; no member
  /// summaries yet). What it returns is solved on the same factorisation, as
  /// if the model had held it from the start, except that the derived cases,
  /// parts of the derived combinations, get no member summaries. May be empty.
  std::function<DerivedLoads(const FrameModel&, const std::vector<LoadResult>&)> derive_loads;
  /// BLAS threads the one large factorisation may run on (StiffnessFactor): a
  /// host that has idle cores at that moment offers them; 1 keeps OpenBLAS'
  /// own setting. Nothing else of the analysis computes during it.
  int factorisation_threads = 1;
};

/// A free direction of the structure: the frame is a mechanism there.
struct FreeDirection {
  std::size_t node = 0;
  int dof = 0;  ///< a Dof value
};

/// Thrown when the stiffness matrix is singular or nearly so; what() names
/// the node(s) and direction(s) so a user can add a support or a member.
class UnstableFrame : public std::runtime_error {
 public:
  UnstableFrame(const std::string& message, std::vector<FreeDirection> free)
      : std::runtime_error(message), free_directions(std::move(free)) {}
  std::vector<FreeDirection> free_directions;
};

/// Results of every load case (in model order, then the derived ones)
/// followed by every combination (in model order, then the derived ones). Cases are solved together (one factorisation, all load
/// vectors as one multi-column right-hand side); combinations are the
/// factored sums of the cases, or, when the model asks for second order, each
/// solved by P-Delta iteration. Buckling (alpha_cr and modes) is analysed for
/// every combination whose `buckling` is set (every case when there are no
/// combinations).
/// Throws UnstableFrame (also when a combination
/// exceeds its elastic critical load in second order), or
/// std::invalid_argument for an invalid model (see validate_model).
/// solve_beside_buckling (pending_buckling.hpp) leaves the buckling analysis
/// running beside the caller.
std::vector<LoadResult> solve(const FrameModel& model, const SolveOptions& options = {});

}  // namespace stepframe::analysis
