#pragma once
// Pictures of a load result for reports: the frame seen from above one
// corner, members drawn through their stations in the colours of the
// utilisation scale (colour_scale.hpp: 0 to 1 the same in every picture, one
// flag colour above 1), so a colour means the same thing in every picture.
// The legend is not drawn into the picture: the report draws it, horizontally,
// under the picture, and places the member labels over it where `labels` says.
// Rendered by VTK with OpenGL in an offscreen context (EGL without a window
// system: Mesa's software renderer on servers, no display needed) on a thread
// of its own, so a host application's current OpenGL context is left alone.
// Where no such context can be created, the same picture is drawn without
// OpenGL on VTK's image canvas. PNG encoded by VTK. Safe to call from several
// threads: the drawing itself is serialised process-wide (VTK's rendering is
// not thread-safe).

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstdint>
#include <memory>
#include <string>
#include <vector>

namespace stepframe::viz {

struct PictureOptions {
  int width = 960;
  int height = 600;
  bool deformed = false;  ///< draw the deformed shape over a pale undeformed one
  bool opengl = true;     ///< false: draw on the image canvas even where OpenGL is available
  /// One value per member (member_chains order) on the utilisation scale,
  /// drawn along the whole member: e.g. its governing utilisation. NaN: not
  /// checked (not_checked_colour). Empty: every point is coloured by its
  /// von Mises stress over fy (fy of the member's material for its section).
  std::vector<double> member_values;
  /// Members (member_chains order) whose mid-length the picture reports in `labels`.
  std::vector<std::size_t> labelled;
};

/// Where a labelled member's mid-length appears, as fractions of the
/// picture's width and height from its top-left corner.
struct PictureLabel {
  std::size_t member = 0;
  double x = 0, y = 0;
};

/// What was drawn.
struct Picture {
  std::vector<std::uint8_t> png;
  double deformation_scale = 0;     ///< displacements were multiplied by this (deformed pictures)
  double largest_displacement = 0;  ///< the largest displacement drawn [m]
  std::string drawn_by;             ///< "OpenGL (offscreen)" or "image canvas"
  std::vector<PictureLabel> labels; ///< one per PictureOptions::labelled member, in that order
};

/// Draws the members of `result` coloured as `options` say.
Picture draw_frame_picture(const analysis::FrameModel& model, const analysis::LoadResult& result,
                           const PictureOptions& options = {});

/// One picture of a batch: the result drawn (it must outlive the call) and how.
struct PictureRequest {
  const analysis::LoadResult* result = nullptr;
  PictureOptions options;
};

/// Draws several pictures of one model, as draw_frame_picture draws each, in
/// the order asked. One offscreen OpenGL context serves them all: most of a
/// first drawing in a context is compiling its shaders (about 0.1 s with
/// Mesa's software renderer), which the pictures after the first then skip.
std::vector<Picture> draw_frame_pictures(const analysis::FrameModel& model, const std::vector<PictureRequest>& requests);

/// Draws pictures as draw_frame_pictures does, in an offscreen context it
/// starts preparing the moment it is made, on a thread of its own: Mesa's
/// software renderer takes about a quarter of a second to load the first time
/// in a process, and VTK about a tenth to compile its shaders for a new
/// window. A run makes its renderer once it has read the STEP file (the read
/// may use both cores), so the report's pictures wait for neither. Where no context can be had, pictures
/// are drawn on the image canvas.
class PictureRenderer {
 public:
  PictureRenderer();   ///< returns at once; the preparation runs meanwhile
  ~PictureRenderer();  ///< waits for the preparation, if it still runs
  PictureRenderer(const PictureRenderer&) = delete;
  PictureRenderer& operator=(const PictureRenderer&) = delete;

  /// As draw_frame_pictures (waiting for the preparation first). Calls from
  /// several threads take turns.
  std::vector<Picture> draw(const analysis::FrameModel& model, const std::vector<PictureRequest>& requests);

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace stepframe::viz
