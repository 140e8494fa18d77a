#include "stepframe/viz/picture.hpp"

#include "picture_scene.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <mutex>

namespace stepframe::viz {
namespace {

/// VTK's rendering (OpenGL context, FreeType fonts, the render window's
/// teardown) is not safe on two threads at once: pictures are drawn one at a
/// time in the whole process. The lock guards that library state, nothing of ours.
std::mutex& rendering_lock() {
  static std::mutex lock;
  return lock;
}

}  // namespace

std::array<std::uint8_t, 3> stress_colour(double f) {
  f = std::clamp(f, 0.0, 1.0);
  // Piecewise linear through blue, cyan, green, yellow, red at 0, 1/4, 1/2, 3/4, 1.
  static constexpr double stops[5][3] = {{0, 0, 255}, {0, 200, 255}, {0, 190, 0}, {250, 210, 0}, {220, 0, 0}};
  const double s = f * 4;
  const int i = std::min(static_cast<int>(s), 3);
  const double t = s - i;
  std::array<std::uint8_t, 3> rgb{};
  for (int c = 0; c < 3; ++c)
    rgb[static_cast<std::size_t>(c)] = static_cast<std::uint8_t>(std::lround(stops[i][c] + t * (stops[i + 1][c] - stops[i][c])));
  return rgb;
}

Picture draw_stress_picture(const analysis::FrameModel& model, const analysis::LoadResult& result,
                            const PictureOptions& options) {
  Picture picture;
  picture.stress_max = options.stress_max;
  Eigen::Vector3d low = model.nodes.front(), high = model.nodes.front();
  for (const auto& p : model.nodes) low = low.cwiseMin(p), high = high.cwiseMax(p);
  const double span = std::max((high - low).norm(), 1e-6);
  // Every member's stations, recovered once (members spread over the cores).
  const auto chains = analysis::member_chains(model);
  std::vector<std::vector<analysis::Station>> lines(chains.size());
  // A picture a few hundred pixels wide needs few points: five per element keep the deflected
  // curve and the stress gradient, and a large frame draws several times faster than with every
  // station. The scale's top is the members' exact largest stress.
  constexpr std::size_t points_per_element = 5;
  analysis::parallel_for(chains.size(), [&](std::size_t m) {
    lines[m] =
        analysis::member_line(model, result, chains[m], analysis::LineDetail::stations, points_per_element).stations;
  });
  if (options.stress_max <= 0)
    for (const auto& member : result.members) picture.stress_max = std::max(picture.stress_max, member.max_von_mises);
  double largest_u = 0;
  for (const auto& stations : lines)
    for (const auto& st : stations) largest_u = std::max(largest_u, st.displacement.norm());
  // Deformed pictures show the largest displacement as 5% of the frame's extent.
  picture.deformation_scale = options.deformed && largest_u > 0 ? 0.05 * span / largest_u : 0.0;

  detail::PictureScene scene;
  scene.width = options.width;
  scene.height = options.height;
  scene.stress_max = picture.stress_max;
  for (const auto& stations : lines) {
    detail::ScenePolyline drawn, undeformed;
    for (const auto& st : stations) {
      drawn.push_back({st.position + picture.deformation_scale * st.displacement, st.von_mises});
      undeformed.push_back({st.position, 0.0});
    }
    scene.coloured.push_back(std::move(drawn));
    if (options.deformed) scene.grey.push_back(std::move(undeformed));
  }

  std::string why_not = "not asked for";
  const std::lock_guard<std::mutex> one_at_a_time(rendering_lock());
  if (auto png = options.opengl ? detail::render_with_opengl(scene, why_not) : std::nullopt) {
    picture.png = std::move(*png);
    picture.drawn_by = "OpenGL (offscreen)";
  } else {
    spdlog::debug("picture drawn on the image canvas: {}", why_not);
    picture.png = detail::draw_on_canvas(scene);
    picture.drawn_by = "image canvas";
  }
  return picture;
}

}  // namespace stepframe::viz
