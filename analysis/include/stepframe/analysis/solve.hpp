#pragma once
// Linear static analysis of a frame model: every case, then every combination.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstddef>
#include <functional>
#include <stdexcept>
#include <string>
#include <vector>

namespace stepframe::analysis {

struct SolveOptions {
  std::size_t stations = 21;  ///< stations per member for internal forces and deflections
  /// Called with a fraction in [0, 1] as the work goes on; may be empty.
  std::function<void(double)> progress;
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

/// Results of every load case (in model order) followed by every combination
/// (in model order). Throws UnstableFrame, or std::invalid_argument for a
/// model that refers to missing nodes, sections or materials.
std::vector<LoadResult> solve(const FrameModel& model, const SolveOptions& options = {});

}  // namespace stepframe::analysis
