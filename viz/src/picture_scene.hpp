#pragma once
// What a report picture shows, ready to draw: coloured polylines in model
// space and the points to report as labels. Internal to the viz stage; the
// two ways of drawing it (OpenGL offscreen, image canvas) share it.

#include "stepframe/viz/colour_scale.hpp"

#include <Eigen/Core>

#include <array>
#include <memory>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace stepframe::viz::detail {

struct ScenePoint {
  Eigen::Vector3d position;  ///< as drawn (deformed pictures: scaled displacement added) [m]
  Rgb colour{};
};
using ScenePolyline = std::vector<ScenePoint>;

struct PictureScene {
  int width = 0, height = 0;              ///< [px]
  std::vector<ScenePolyline> coloured;    ///< members
  std::vector<ScenePolyline> grey;        ///< the undeformed frame behind a deformed one (may be empty)
  std::vector<Eigen::Vector3d> anchors;   ///< model points whose place in the picture is wanted
};

/// A drawn scene: the PNG and where each anchor landed, in pixels from the top-left corner.
struct DrawnScene {
  std::vector<std::uint8_t> png;
  std::vector<std::array<double, 2>> anchors;
};

/// The dark line drawn under every member (CIELAB L* about 25, neutral).
inline constexpr Rgb casing_colour{60, 60, 60};

/// Orthographic view from above the (+X, -Y) corner: screen axes in global components.
inline const Eigen::Vector3d view_right = Eigen::Vector3d(1, 1, 0).normalized();
inline const Eigen::Vector3d view_up = Eigen::Vector3d(-0.35, 0.35, 1).normalized();

/// An offscreen OpenGL context (EGL, surfaceless) and the VTK window that
/// draws into it. Each call runs on a thread of its own, so the caller's
/// current context is left alone, and may come from any thread, one at a
/// time (the caller holds the process-wide rendering lock: VTK's rendering
/// is not thread-safe). The window is kept from one drawing to the next, and
/// with it the shader programs VTK compiled: compiling them is most of a
/// first drawing (about 0.1 s with Mesa's software renderer).
class OffscreenPictures {
 public:
  /// Throws std::runtime_error saying why no context can be had here.
  OffscreenPictures();
  ~OffscreenPictures();
  OffscreenPictures(const OffscreenPictures&) = delete;
  OffscreenPictures& operator=(const OffscreenPictures&) = delete;

  /// The scenes rendered in order. Throws std::runtime_error when OpenGL fails.
  std::vector<DrawnScene> draw(const std::vector<PictureScene>& scenes);

 private:
  struct Parts;
  std::unique_ptr<Parts> parts_;
};

/// The scene drawn on VTK's image canvas (no OpenGL).
DrawnScene draw_on_canvas(const PictureScene& scene);

}  // namespace stepframe::viz::detail
