#pragma once
// The members of two revisions as one VTK XML unstructured grid (.vtu), each
// a polyline along its centreline, coloured by what the change did: the file
// `stepframe compare` writes (compare.vtu).

#include "stepframe/viz/colour_scale.hpp"
#include "stepframe/viz/vtk_compression.hpp"

#include <Eigen/Core>

#include <filesystem>
#include <limits>
#include <string>
#include <vector>

namespace stepframe::viz {

/// One member drawn: a member of the new revision, or a removed one where it was.
struct ChangeLine {
  std::vector<Eigen::Vector3d> points;  ///< [m] along the centreline
  int member = -1;                      ///< its id in its own revision's results.json
  int change_kind = 0;                  ///< compare.hpp ChangeKind value
  double before = std::numeric_limits<double>::quiet_NaN();  ///< governing utilisation, NaN when none
  double after = std::numeric_limits<double>::quiet_NaN();
  Rgb colour{};        ///< its colour in compare.html's pictures
  std::string label;   ///< CAD name or entity
};

/// Writes `lines` to `file` (binary, compressed appended data). Cell data:
/// "utilisation_change" (after - before; the active scalar; NaN where a side
/// is missing), "utilisation_before", "utilisation_after", "change_kind" (int,
/// the legend in the field data "change_kinds"), "change_colour" (sRGB bytes,
/// the page's colours), "member_id", "label". Field data also "units" and the
/// caution. Throws std::runtime_error naming the file on failure.
void write_change_vtu(const std::filesystem::path& file, const std::vector<ChangeLine>& lines,
                      const std::vector<std::string>& kind_names, VtkCompression compression = VtkCompression::lz4);

}  // namespace stepframe::viz
