#pragma once
// Writing a wireframe to STEP with names and layers (used by the demo
// generator and by the round-trip tests).

#include "stepframe/geometry/source_info.hpp"

#include <Eigen/Core>

#include <filesystem>
#include <string>
#include <vector>

namespace stepframe::geometry {

/// One line to write: end points in metres and the attributes to attach
/// (name, layers, product; entity and colour are ignored).
struct LineToWrite {
  Eigen::Vector3d start;
  Eigen::Vector3d end;
  SourceInfo attributes;
};

/// Writes the lines as a STEP AP214 wireframe in the given length unit
/// ("mm", "m" or "inch"). Lines sharing a product name become one part.
/// Throws std::runtime_error naming the file when writing fails.
///
/// Each part is a compound of edges placed (by translation to its first point)
/// as a component of one top assembly named after the file. A line's name and
/// layers go on the geometric curve set that holds it, so read_step gives back
/// the same name, layers and product; lines with an empty product go into a
/// part called "wireframe". The file is written under a temporary name
/// ("<file>.tmp") and renamed when complete. Throws std::invalid_argument for
/// any other unit. OCCT's writer parameters are process-wide: they are set
/// for the call and restored after it, so do not write from several threads at once.
void write_step_wireframe(const std::filesystem::path& file, const std::vector<LineToWrite>& lines,
                          const std::string& length_unit);

}  // namespace stepframe::geometry
