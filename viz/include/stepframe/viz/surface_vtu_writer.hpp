#pragma once
// The true-shape surface model: each element's section outline swept along
// it, coloured by the normal stress at each outline point, so the critical
// flange tip shows; and buckling modes as line models.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/natural_frequencies.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/viz/vtk_compression.hpp"

#include <cstddef>
#include <filesystem>

namespace stepframe::viz {

struct SurfaceOptions {
  /// Outlines drawn along each element, ends included (at least 2): the
  /// stresses and the deflected shape between them are interpolated by the
  /// viewer; the line model carries every station.
  std::size_t sections_per_element = 3;
  VtkCompression compression = VtkCompression::lz4;
};

/// Writes `result` as a surface (.vtu, binary, compressed, 32-bit floats):
/// at `sections_per_element` evenly spaced stations of every element the
/// outline of its section placed in the local y-z plane, consecutive outlines
/// joined by quads. The outline is Section::outline without the detail a
/// picture cannot show (points within 5% of the section's smaller extent of
/// the line through their neighbours are dropped: an I section keeps its
/// twelve corners), or a depth x width rectangle when the section has none.
/// Point data: "fibre_stress" (sigma = N/A + My z/Iy - Mz y/Iz at that outline
/// point [Pa]; active scalars), "displacement" (of each outline point [m]: the axis translation plus
/// the section's small rotation times the point's arm; warping left out).
/// Cell data: "member_id", "element_id".
/// Throws std::runtime_error naming the file on failure.
void write_surface_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                       const analysis::LoadResult& result, const SurfaceOptions& options = {});

/// Writes buckling mode `mode` of `result` as a line model (.vtu): each
/// element a polyline through seven evenly spaced points, point data
/// "mode_shape" (vector, largest translation 1; analysis::mode_translation),
/// field data "alpha" (the mode's load factor). Throws std::out_of_range when
/// the result has no such mode.
void write_mode_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                    const analysis::LoadResult& result, std::size_t mode,
                    VtkCompression compression = VtkCompression::lz4);

/// Writes a natural vibration mode (numbered from 1) as a line model like
/// write_mode_vtu: point data "mode_shape" (largest translation 1), field data
/// "frequency" [Hz], "period" [s], "mode_number", "mass_ratio_x/y/z".
void write_vibration_mode_vtu(const std::filesystem::path& file, const analysis::FrameModel& model,
                              const analysis::VibrationMode& mode, std::size_t number,
                              VtkCompression compression = VtkCompression::lz4);

}  // namespace stepframe::viz
