#pragma once
// Pictures of a load result for reports: the frame seen from above one
// corner, members drawn through their stations and coloured by stress, with a
// colour bar. Rendered by VTK with OpenGL in an offscreen context (EGL without
// a window system: Mesa's software renderer on servers, no display needed) on
// a thread of its own, so a host application's current OpenGL context is left
// alone. Where no such context can be created, the same picture is drawn
// without OpenGL on VTK's image canvas (lines only, no colour bar). PNG
// encoded by VTK. Safe to call from several threads: the drawing itself is
// serialised process-wide (VTK's rendering is not thread-safe).

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <array>
#include <cstdint>
#include <string>
#include <vector>

namespace stepframe::viz {

struct PictureOptions {
  int width = 960;
  int height = 600;
  bool deformed = false;     ///< draw the deformed shape over a grey undeformed one
  double stress_max = 0;     ///< colour scale top [Pa]; 0 = the result's largest von Mises stress
  bool opengl = true;        ///< false: draw on the image canvas even where OpenGL is available
};

/// What was drawn: the PNG and the colour scale used.
struct Picture {
  std::vector<std::uint8_t> png;
  double stress_max = 0;         ///< [Pa], the colour scale's top (its bottom is 0)
  double deformation_scale = 0;  ///< displacements were multiplied by this (deformed pictures)
  std::string drawn_by;          ///< "OpenGL (offscreen)" or "image canvas"
};

/// Colour of a value in [0, 1] on the scale the pictures and the report share:
/// blue (0) - cyan - green - yellow - red (1), as 8-bit RGB.
std::array<std::uint8_t, 3> stress_colour(double fraction);

/// Draws the members of `result` coloured by the von Mises stress at each station.
Picture draw_stress_picture(const analysis::FrameModel& model, const analysis::LoadResult& result,
                            const PictureOptions& options = {});

}  // namespace stepframe::viz
