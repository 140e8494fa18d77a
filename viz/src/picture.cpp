#include "stepframe/viz/picture.hpp"

#include "picture_scene.hpp"
#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"
#include "stepframe/viz/colour_scale.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <cmath>
#include <future>
#include <limits>
#include <memory>
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

// The scenes of a batch, and the figures of each picture that do not need the drawing.
struct Batch {
  std::vector<Picture> pictures;
  std::vector<detail::PictureScene> scenes;
};

Batch scenes_of(const analysis::FrameModel& model, const std::vector<PictureRequest>& requests) {
  Batch batch;
  for (const auto& request : requests) {
    auto [picture, scene] = scene_of(model, *request.result, request.options);
    batch.pictures.push_back(std::move(picture));
    batch.scenes.push_back(std::move(scene));
  }
  return batch;
}

// Draws the batch: the pictures that may use OpenGL together in `gl` (null: none here, `why_not` says
// why), the rest, or all of them where OpenGL fails, on the image canvas. Under the rendering lock.
std::vector<Picture> draw_batch(Batch batch, const std::vector<PictureRequest>& requests,
                                detail::OffscreenPictures* gl, std::string why_not) {
  std::vector<detail::PictureScene> with_opengl;
  for (std::size_t k = 0; k < requests.size(); ++k)
    if (requests[k].options.opengl) with_opengl.push_back(batch.scenes[k]);
  std::vector<detail::DrawnScene> drawn;
  if (gl && !with_opengl.empty()) try {
      drawn = gl->draw(with_opengl);
    } catch (const std::runtime_error& e) {
      why_not = e.what();
    }
  for (std::size_t k = 0, next = 0; k < requests.size(); ++k) {
    const PictureOptions& options = requests[k].options;
    Picture& picture = batch.pictures[k];
    detail::DrawnScene scene;
    if (options.opengl && !drawn.empty()) {
      scene = std::move(drawn[next++]);
      picture.drawn_by = "OpenGL (offscreen)";
    } else {
      spdlog::debug("picture drawn on the image canvas: {}", options.opengl ? why_not : "not asked for");
      scene = detail::draw_on_canvas(batch.scenes[k]);
      picture.drawn_by = "image canvas";
    }
    picture.png = std::move(scene.png);
    for (std::size_t l = 0; l < options.labelled.size(); ++l)
      picture.labels.push_back({options.labelled[l], scene.anchors[l][0] / options.width, scene.anchors[l][1] / options.height});
  }
  return std::move(batch.pictures);
}

// A scene with every kind of line the pictures draw (grey, coloured, cased), so that drawing it
// compiles every shader program they use. Small: the framebuffer of a full picture takes another
// 30 ms or so to set up, and the preparation runs beside the STEP reader, which it should not slow.
detail::PictureScene warm_up_scene() {
  detail::PictureScene scene;
  scene.width = scene.height = 16;
  scene.grey.push_back({{Eigen::Vector3d::Zero(), undeformed_colour()}, {Eigen::Vector3d::UnitX(), undeformed_colour()}});
  scene.coloured.push_back({{Eigen::Vector3d::Zero(), utilisation_colour(0)}, {Eigen::Vector3d::UnitY(), utilisation_colour(1)}});
  return scene;
}

}  // namespace

std::vector<Picture> draw_frame_pictures(const analysis::FrameModel& model,
                                         const std::vector<PictureRequest>& requests) {
  Batch batch = scenes_of(model, requests);
  const std::lock_guard<std::mutex> one_at_a_time(rendering_lock());
  std::unique_ptr<detail::OffscreenPictures> gl;  // goes before the lock is released
  std::string why_not = "not asked for";
  if (std::any_of(requests.begin(), requests.end(), [](const auto& r) { return r.options.opengl; })) try {
      gl = std::make_unique<detail::OffscreenPictures>();
    } catch (const std::runtime_error& e) {
      why_not = e.what();
    }
  return draw_batch(std::move(batch), requests, gl.get(), why_not);
}

Picture draw_frame_picture(const analysis::FrameModel& model, const analysis::LoadResult& result,
                           const PictureOptions& options) {
  return std::move(draw_frame_pictures(model, {{&result, options}}).front());
}

struct PictureRenderer::Impl {
  std::mutex turn;  // one drawing at a time on this renderer
  std::future<std::unique_ptr<detail::OffscreenPictures>> preparing;
  std::unique_ptr<detail::OffscreenPictures> gl;  // once prepared; null where no context can be had
  std::string why_not;
  bool prepared = false;

  detail::OffscreenPictures* ready() {
    if (!prepared) {
      gl = preparing.get();
      prepared = true;
    }
    return gl.get();
  }
};

PictureRenderer::PictureRenderer() : impl_(std::make_unique<Impl>()) {
  impl_->preparing = std::async(std::launch::async, [impl = impl_.get()] {
    const std::lock_guard<std::mutex> one_at_a_time(rendering_lock());
    std::unique_ptr<detail::OffscreenPictures> gl;
    try {
      gl = std::make_unique<detail::OffscreenPictures>();
      gl->draw({warm_up_scene()});
    } catch (const std::runtime_error& e) {
      impl->why_not = e.what();
      gl.reset();
      spdlog::debug("no offscreen OpenGL for pictures: {}", impl->why_not);
    }
    return gl;
  });
}

PictureRenderer::~PictureRenderer() {
  const std::lock_guard<std::mutex> turn(impl_->turn);
  std::unique_ptr<detail::OffscreenPictures> gl = impl_->prepared ? std::move(impl_->gl) : impl_->preparing.get();
  const std::lock_guard<std::mutex> one_at_a_time(rendering_lock());
  gl.reset();
}

std::vector<Picture> PictureRenderer::draw(const analysis::FrameModel& model,
                                           const std::vector<PictureRequest>& requests) {
  Batch batch = scenes_of(model, requests);
  const std::lock_guard<std::mutex> turn(impl_->turn);
  detail::OffscreenPictures* gl = impl_->ready();
  const std::lock_guard<std::mutex> one_at_a_time(rendering_lock());
  return draw_batch(std::move(batch), requests, gl, gl ? "not asked for" : impl_->why_not);
}

}  // namespace stepframe::viz
