#pragma once
// The line model of one load case or combination as a VTK XML unstructured
// grid (.vtu): each member (as the CAD draws it) a polyline through its stations.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/viz/vtk_compression.hpp"

#include <cstddef>
#include <filesystem>
#include <string>
#include <vector>

namespace stepframe::viz {

struct LineModelOptions {
  /// Points along each element (ends included, at least 2), recovered here
  /// from the result: the deflected curve and the diagrams between them are
  /// interpolated by the viewer (results.json has the exact extremes).
  std::size_t points_per_element = 11;
  VtkCompression compression = VtkCompression::lz4;
  /// Per member: its piece mark, written as the cell array "mark" (none when empty).
  std::vector<std::string> marks{};
};

/// Writes `result` for `model` to `file` (binary, compressed appended data;
/// 32-bit floats). Points are the undeformed station positions [m],
/// `points_per_element` evenly spaced along each element.
/// Point data: "displacement" (vector [m]; warp by it to see the deformed shape,
///             which then follows the element's own interpolation),
///             "von_mises" (largest at the station [Pa]), "N" [N], "My", "Mz" [N m]
///             (internal forces, results.hpp convention).
/// Cell data:  "stress" (largest von Mises stress over the member [Pa]; the
///             active scalar, so any VTK viewer colours by it), "normal_stress"
///             (largest |sigma| [Pa]), "utilisation" (when given) and
///             "utilisation_colour" (its colour on stepframe's scale as sRGB
///             bytes: shown as they are, the report's colours), "member_id",
///             "section_id", "section" (designation), "mark" (piece mark, when given).
/// Writes exactly `file`; callers that need atomic output pass a temporary
/// name and rename it. Throws std::runtime_error naming the file on failure.
void write_line_model_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                          const analysis::LoadResult& result, const std::vector<double>& member_utilisation = {},
                          const LineModelOptions& options = {});

}  // namespace stepframe::viz
