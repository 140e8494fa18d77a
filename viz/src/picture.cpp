#include "stepframe/viz/picture.hpp"

#include <vtkImageCanvasSource2D.h>
#include <vtkImageData.h>
#include <vtkNew.h>
#include <vtkPNGWriter.h>
#include <vtkUnsignedCharArray.h>

#include <algorithm>
#include <cmath>

namespace stepframe::viz {
namespace {

// Orthographic view from above the (+X, -Y) corner: screen axes in global components.
struct View {
  Eigen::Vector3d right = Eigen::Vector3d(1, 1, 0).normalized();
  Eigen::Vector3d up = Eigen::Vector3d(-0.35, 0.35, 1).normalized();
};

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
  const View view;
  picture.stress_max = options.stress_max;
  double span = 0, largest_u = 0;
  Eigen::Vector3d low = model.nodes.front(), high = model.nodes.front();
  for (const auto& p : model.nodes) low = low.cwiseMin(p), high = high.cwiseMax(p);
  span = std::max((high - low).norm(), 1e-6);
  for (const auto& line : result.members)
    for (const auto& st : line.stations) {
      if (options.stress_max <= 0) picture.stress_max = std::max(picture.stress_max, st.von_mises);
      largest_u = std::max(largest_u, st.displacement.norm());
    }
  // Deformed pictures show the largest displacement as 5% of the frame's extent.
  picture.deformation_scale = options.deformed && largest_u > 0 ? 0.05 * span / largest_u : 0.0;

  // Screen coordinates of every station, undeformed and as drawn.
  auto project = [&](const Eigen::Vector3d& p) { return Eigen::Vector2d(p.dot(view.right), p.dot(view.up)); };
  Eigen::Vector2d lo(1e300, 1e300), hi(-1e300, -1e300);
  for (const auto& line : result.members)
    for (const auto& st : line.stations)
      for (const Eigen::Vector3d& p : {st.position, Eigen::Vector3d(st.position + picture.deformation_scale * st.displacement)}) {
        const Eigen::Vector2d q = project(p);
        lo = lo.cwiseMin(q), hi = hi.cwiseMax(q);
      }
  const double margin = 30;
  const double scale = std::min((options.width - 2 * margin) / std::max(hi.x() - lo.x(), 1e-9),
                                (options.height - 2 * margin) / std::max(hi.y() - lo.y(), 1e-9));
  const Eigen::Vector2d centre = 0.5 * (lo + hi);
  auto pixel = [&](const Eigen::Vector3d& p) {
    const Eigen::Vector2d q = (project(p) - centre) * scale;
    return std::array<int, 2>{static_cast<int>(std::lround(0.5 * options.width + q.x())),
                              static_cast<int>(std::lround(0.5 * options.height + q.y()))};  // VTK images: y up
  };

  vtkNew<vtkImageCanvasSource2D> canvas;
  canvas->SetScalarTypeToUnsignedChar();
  canvas->SetNumberOfScalarComponents(3);
  canvas->SetExtent(0, options.width - 1, 0, options.height - 1, 0, 0);
  canvas->SetDrawColor(255, 255, 255);
  canvas->FillBox(0, options.width - 1, 0, options.height - 1);
  auto segment = [&](std::array<int, 2> a, std::array<int, 2> b, int thickness) {
    for (int dx = -thickness / 2; dx <= thickness / 2; ++dx)
      for (int dy = -thickness / 2; dy <= thickness / 2; ++dy) canvas->DrawSegment(a[0] + dx, a[1] + dy, b[0] + dx, b[1] + dy);
  };
  if (options.deformed) {
    canvas->SetDrawColor(200, 200, 200);
    for (const auto& line : result.members)
      for (std::size_t k = 0; k + 1 < line.stations.size(); ++k)
        segment(pixel(line.stations[k].position), pixel(line.stations[k + 1].position), 1);
  }
  for (const auto& line : result.members)
    for (std::size_t k = 0; k + 1 < line.stations.size(); ++k) {
      const auto& a = line.stations[k];
      const auto& b = line.stations[k + 1];
      const double stress = 0.5 * (a.von_mises + b.von_mises);
      const auto rgb = stress_colour(picture.stress_max > 0 ? stress / picture.stress_max : 0.0);
      canvas->SetDrawColor(rgb[0], rgb[1], rgb[2]);
      segment(pixel(a.position + picture.deformation_scale * a.displacement),
              pixel(b.position + picture.deformation_scale * b.displacement), 3);
    }
  canvas->Update();

  vtkNew<vtkPNGWriter> writer;
  writer->SetInputConnection(canvas->GetOutputPort());
  writer->WriteToMemoryOn();
  writer->Write();
  vtkUnsignedCharArray* bytes = writer->GetResult();
  picture.png.assign(bytes->GetPointer(0), bytes->GetPointer(0) + bytes->GetNumberOfTuples() * bytes->GetNumberOfComponents());
  return picture;
}

}  // namespace stepframe::viz
