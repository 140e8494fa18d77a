#pragma once
// Pictures of a load result for reports: the frame seen from above one
// corner, members drawn through their stations and coloured by stress.
// Drawn with VTK's image canvas (no display or OpenGL needed, so it works on
// build servers) and encoded as PNG by VTK.

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <array>
#include <cstdint>
#include <vector>

namespace stepframe::viz {

struct PictureOptions {
  int width = 960;
  int height = 600;
  bool deformed = false;     ///< draw the deformed shape over a grey undeformed one
  double stress_max = 0;     ///< colour scale top [Pa]; 0 = the result's largest von Mises stress
};

/// What was drawn: the PNG and the colour scale used.
struct Picture {
  std::vector<std::uint8_t> png;
  double stress_max = 0;         ///< [Pa], the colour scale's top (its bottom is 0)
  double deformation_scale = 0;  ///< displacements were multiplied by this (deformed pictures)
};

/// Colour of a value in [0, 1] on the scale the pictures and the report share:
/// blue (0) - cyan - green - yellow - red (1), as 8-bit RGB.
std::array<std::uint8_t, 3> stress_colour(double fraction);

/// Draws the members of `result` coloured by the von Mises stress at each station.
Picture draw_stress_picture(const analysis::FrameModel& model, const analysis::LoadResult& result,
                            const PictureOptions& options = {});

}  // namespace stepframe::viz
