#include "stepframe/viz/picture.hpp"

#include "picture_scene.hpp"
#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"
#include "stepframe/viz/colour_scale.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <mutex>
#include <utility>

namespace stepframe::viz {
namespace {

/// VTK's rendering (OpenGL context, the render window's teardown) is not safe
/// on two threads at once: pictures are drawn one at a time in the whole
/// process. The lock guards that library state, nothing of ours.
std::mutex& rendering_lock() {
  static std::mutex lock;
  return lock;
}

/// The point halfway along a polyline, as drawn.
Eigen::Vector3d halfway(const detail::ScenePolyline& line) {
  double length = 0;
  for (std::size_t k = 0; k + 1 < line.size(); ++k) length += (line[k + 1].position - line[k].position).norm();
  double left = 0.5 * length;
  for (std::size_t k = 0; k + 1 < line.size(); ++k) {
    const double piece = (line[k + 1].position - line[k].position).norm();
    if (piece >= left && piece > 0) return line[k].position + (left / piece) * (line[k + 1].position - line[k].position);
    left -= piece;
  }
  return line.front().position;
}

// What one picture shows, ready to draw, and the figures of it that do not need the drawing.
std::pair<Picture, detail::PictureScene> scene_of(const analysis::FrameModel& model, const analysis::LoadResult& result,
                                                  const PictureOptions& options) {
  Picture picture;
  Eigen::Vector3d low = model.nodes.front(), high = model.nodes.front();
  for (const auto& p : model.nodes) low = low.cwiseMin(p), high = high.cwiseMax(p);
  const double span = std::max((high - low).norm(), 1e-6);
  // Every member's stations, recovered once (members spread over the cores).
  const auto chains = analysis::member_chains(model);
  std::vector<std::vector<analysis::Station>> lines(chains.size());
  // A picture a few hundred pixels wide needs few points: five per element keep the deflected
  // curve and the stress gradient, and a large frame draws several times faster than with every station.
  constexpr std::size_t points_per_element = 5;
  const bool by_member = !options.member_values.empty();
  if (by_member && !options.deformed) {
    // Nothing drawn depends on the result: the elements' end nodes are the whole picture.
    for (std::size_t m = 0; m < chains.size(); ++m) {
      const auto& elements = chains[m].elements;
      lines[m].resize(elements.size() + 1);
      lines[m][0].position = model.nodes[model.elements[elements[0]].nodes[0]];
      for (std::size_t k = 0; k < elements.size(); ++k) lines[m][k + 1].position = model.nodes[model.elements[elements[k]].nodes[1]];
    }
  } else {
    analysis::parallel_for(chains.size(), [&](std::size_t m) {
      lines[m] =
          analysis::member_line(model, result, chains[m], analysis::LineDetail::stations, points_per_element).stations;
    });
  }
  for (const auto& stations : lines)
    for (const auto& st : stations) picture.largest_displacement = std::max(picture.largest_displacement, st.displacement.norm());
  // Deformed pictures show the largest displacement as 5% of the frame's extent.
  picture.deformation_scale =
      options.deformed && picture.largest_displacement > 0 ? 0.05 * span / picture.largest_displacement : 0.0;

  detail::PictureScene scene;
  scene.width = options.width;
  scene.height = options.height;
  // Stress pictures: von Mises over the fy the checks use for each member (EN 1993-1-1 3.2.1).
  const std::vector<double> yield = analysis::member_yield_strengths(model, chains);
  for (std::size_t m = 0; m < lines.size(); ++m) {
    const double fy = yield[m];
    const double member_value = by_member && m < options.member_values.size()
                                    ? options.member_values[m] : std::numeric_limits<double>::quiet_NaN();
    detail::ScenePolyline drawn, undeformed;
    for (const auto& st : lines[m]) {
      const double value = by_member ? member_value : st.von_mises / fy;
      drawn.push_back({st.position + picture.deformation_scale * st.displacement,
                       std::isnan(value) ? not_checked_colour() : utilisation_colour(value)});
      undeformed.push_back({st.position, undeformed_colour()});
    }
    scene.coloured.push_back(std::move(drawn));
    if (options.deformed) scene.grey.push_back(std::move(undeformed));
  }
  for (std::size_t m : options.labelled) scene.anchors.push_back(halfway(scene.coloured.at(m)));

  return {std::move(picture), std::move(scene)};
}

}  // namespace

std::vector<Picture> draw_frame_pictures(const analysis::FrameModel& model,
                                         const std::vector<PictureRequest>& requests) {
  std::vector<Picture> pictures;
  std::vector<detail::PictureScene> scenes;
  for (const auto& request : requests) {
    auto [picture, scene] = scene_of(model, *request.result, request.options);
    pictures.push_back(std::move(picture));
    scenes.push_back(std::move(scene));
  }
  // The pictures that may use OpenGL are drawn together, in one context; the rest, or all of them
  // where no context can be had, on the image canvas.
  std::vector<detail::PictureScene> with_opengl;
  for (std::size_t k = 0; k < requests.size(); ++k)
    if (requests[k].options.opengl) with_opengl.push_back(scenes[k]);
  std::string why_not = "not asked for";
  const std::lock_guard<std::mutex> one_at_a_time(rendering_lock());
  auto drawn = with_opengl.empty() ? std::nullopt : detail::render_with_opengl(with_opengl, why_not);
  for (std::size_t k = 0, next = 0; k < requests.size(); ++k) {
    const PictureOptions& options = requests[k].options;
    Picture& picture = pictures[k];
    detail::DrawnScene scene;
    if (options.opengl && drawn) {
      scene = std::move((*drawn)[next++]);
      picture.drawn_by = "OpenGL (offscreen)";
    } else {
      spdlog::debug("picture drawn on the image canvas: {}", options.opengl ? why_not : "not asked for");
      scene = detail::draw_on_canvas(scenes[k]);
      picture.drawn_by = "image canvas";
    }
    picture.png = std::move(scene.png);
    for (std::size_t l = 0; l < options.labelled.size(); ++l)
      picture.labels.push_back({options.labelled[l], scene.anchors[l][0] / options.width, scene.anchors[l][1] / options.height});
  }
  return pictures;
}

Picture draw_frame_picture(const analysis::FrameModel& model, const analysis::LoadResult& result,
                           const PictureOptions& options) {
  return std::move(draw_frame_pictures(model, {{&result, options}}).front());
}

void prepare_picture_rendering() {
  detail::PictureScene scene;
  scene.width = scene.height = 16;
  scene.grey.push_back({{Eigen::Vector3d::Zero(), undeformed_colour()}, {Eigen::Vector3d::UnitX(), undeformed_colour()}});
  std::string why_not;
  const std::lock_guard<std::mutex> one_at_a_time(rendering_lock());
  if (!detail::render_with_opengl({scene}, why_not)) spdlog::debug("no offscreen OpenGL to prepare: {}", why_not);
}

}  // namespace stepframe::viz
