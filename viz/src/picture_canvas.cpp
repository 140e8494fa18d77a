// Report pictures without OpenGL: lines drawn on VTK's image canvas.

#include "picture_scene.hpp"
#include "png_bytes.hpp"
#include "stepframe/viz/picture.hpp"

#include <vtkImageCanvasSource2D.h>
#include <vtkNew.h>

#include <algorithm>
#include <array>
#include <cmath>

namespace stepframe::viz::detail {

DrawnScene draw_on_canvas(const PictureScene& scene) {
  // Screen coordinates: the view's orthographic projection fitted into the picture with a margin.
  auto project = [](const Eigen::Vector3d& p) { return Eigen::Vector2d(p.dot(view_right), p.dot(view_up)); };
  Eigen::Vector2d lo(1e300, 1e300), hi(-1e300, -1e300);
  for (const auto* lines : {&scene.coloured, &scene.grey})
    for (const auto& line : *lines)
      for (const auto& p : line) {
        const Eigen::Vector2d q = project(p.position);
        lo = lo.cwiseMin(q), hi = hi.cwiseMax(q);
      }
  const double margin = 30;
  const double scale = std::min((scene.width - 2 * margin) / std::max(hi.x() - lo.x(), 1e-9),
                                (scene.height - 2 * margin) / std::max(hi.y() - lo.y(), 1e-9));
  const Eigen::Vector2d centre = 0.5 * (lo + hi);
  auto pixel = [&](const Eigen::Vector3d& p) {
    const Eigen::Vector2d q = (project(p) - centre) * scale;
    return std::array<int, 2>{static_cast<int>(std::lround(0.5 * scene.width + q.x())),
                              static_cast<int>(std::lround(0.5 * scene.height + q.y()))};  // VTK images: y up
  };

  vtkNew<vtkImageCanvasSource2D> canvas;
  canvas->SetScalarTypeToUnsignedChar();
  canvas->SetNumberOfScalarComponents(3);
  canvas->SetExtent(0, scene.width - 1, 0, scene.height - 1, 0, 0);
  canvas->SetDrawColor(255, 255, 255);
  canvas->FillBox(0, scene.width - 1, 0, scene.height - 1);
  auto segment = [&](std::array<int, 2> a, std::array<int, 2> b, int thickness) {
    for (int dx = -thickness / 2; dx <= thickness / 2; ++dx)
      for (int dy = -thickness / 2; dy <= thickness / 2; ++dy) canvas->DrawSegment(a[0] + dx, a[1] + dy, b[0] + dx, b[1] + dy);
  };
  auto draw = [&](const std::vector<ScenePolyline>& lines, int thickness) {
    for (const auto& line : lines)
      for (std::size_t k = 0; k + 1 < line.size(); ++k) {
        const auto& c = line[k].colour;  // a segment takes its first point's colour
        canvas->SetDrawColor(c[0], c[1], c[2]);
        segment(pixel(line[k].position), pixel(line[k + 1].position), thickness);
      }
  };
  draw(scene.grey, 1);
  canvas->SetDrawColor(casing_colour[0], casing_colour[1], casing_colour[2]);  // cased: the palest colours show on white
  for (const auto& line : scene.coloured)
    for (std::size_t k = 0; k + 1 < line.size(); ++k) segment(pixel(line[k].position), pixel(line[k + 1].position), 5);
  draw(scene.coloured, 3);
  canvas->Update();
  DrawnScene drawn{png_bytes(canvas->GetOutput()), {}};
  for (const auto& anchor : scene.anchors) {
    const auto [x, y] = pixel(anchor);
    drawn.anchors.push_back({static_cast<double>(x), static_cast<double>(scene.height - 1 - y)});  // y from the top
  }
  return drawn;
}

}  // namespace stepframe::viz::detail
