#pragma once
// What a report picture shows, ready to draw: polylines in model space with a
// stress per point, and the colour scale. Internal to the viz stage; the two
// ways of drawing it (OpenGL offscreen, image canvas) share it.

#include <Eigen/Core>

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace stepframe::viz::detail {

struct ScenePoint {
  Eigen::Vector3d position;  ///< as drawn (deformed pictures: scaled displacement added) [m]
  double stress = 0;         ///< von Mises [Pa]
};
using ScenePolyline = std::vector<ScenePoint>;

struct PictureScene {
  int width = 0, height = 0;            ///< [px]
  std::vector<ScenePolyline> coloured;  ///< members, coloured by stress
  std::vector<ScenePolyline> grey;      ///< the undeformed frame behind a deformed one (may be empty)
  double stress_max = 0;                ///< top of the colour scale [Pa]; its bottom is 0
};

/// Orthographic view from above the (+X, -Y) corner: screen axes in global components.
inline const Eigen::Vector3d view_right = Eigen::Vector3d(1, 1, 0).normalized();
inline const Eigen::Vector3d view_up = Eigen::Vector3d(-0.35, 0.35, 1).normalized();

/// The scene rendered by OpenGL in an offscreen (EGL, surfaceless) context as
/// PNG bytes, or nothing when no such context can be had here (`why_not` says why).
std::optional<std::vector<std::uint8_t>> render_with_opengl(const PictureScene& scene, std::string& why_not);

/// The scene drawn on VTK's image canvas (no OpenGL) as PNG bytes.
std::vector<std::uint8_t> draw_on_canvas(const PictureScene& scene);

}  // namespace stepframe::viz::detail
