#pragma once
// The true-shape surface model: each element's section outline swept along
// it, coloured by the normal stress at each outline point, so the critical
// flange tip shows.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <filesystem>

namespace stepframe::viz {

/// Writes `result` as a surface (.vtu, binary, zlib-compressed): at every
/// station of every element the outline of its section (Section::outline, or
/// a depth x width rectangle when the section has none) placed in the local
/// y-z plane, consecutive outlines joined by quads.
/// Point data: "fibre_stress" (sigma = N/A + My z/Iy - Mz y/Iz at that outline
/// point [Pa]; active scalars), "displacement" (of each outline point [m]: the axis translation plus
/// the section's small rotation times the point's arm; warping left out).
/// Cell data: "member_id", "element_id".
/// Throws std::runtime_error naming the file on failure.
void write_surface_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                       const analysis::LoadResult& result);

/// Writes buckling mode `mode` of `result` as a line model (.vtu): each
/// element a polyline through the points it was divided into, point data
/// "mode_shape" (vector, largest translation 1), field data "alpha" (the mode's
/// load factor). Throws std::out_of_range when the result has no such mode.
void write_mode_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                    const analysis::LoadResult& result, std::size_t mode);

}  // namespace stepframe::viz
