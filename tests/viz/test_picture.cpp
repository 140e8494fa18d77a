// Report pictures: not blank, and the colour scale spans the stresses drawn.

#include "solved_frames.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/viz/picture.hpp"

#include <catch2/catch.hpp>
#include <vtkImageData.h>
#include <vtkNew.h>
#include <vtkPNGReader.h>

#include <cstdlib>
#include <fstream>
#include <algorithm>
#include <set>

using namespace stepframe;

namespace {

// The smallest and largest von Mises stress of the segments a picture draws (five points per
// element; a segment shows the mean of its ends on the canvas, and every value between them in
// OpenGL's interpolated colours).
std::pair<double, double> drawn_von_mises(const analysis::FrameModel& model, const analysis::LoadResult& result) {
  double low = 1e300, high = 0;
  for (const auto& member : analysis::member_chains(model)) {
    const auto stations = analysis::member_line(model, result, member, analysis::LineDetail::stations, 5).stations;
    for (std::size_t k = 0; k + 1 < stations.size(); ++k) {
      const double mean = 0.5 * (stations[k].von_mises + stations[k + 1].von_mises);
      low = std::min(low, mean), high = std::max(high, mean);
    }
  }
  return {low, high};
}

}  // namespace

namespace {

/// Decodes the PNG and counts its non-white pixels and the colours they show.
struct Decoded {
  int width = 0, height = 0;
  std::size_t coloured = 0;
  std::set<std::array<int, 3>> colours;
};

Decoded decode(const viz::Picture& picture) {
  REQUIRE(picture.png.size() > 100);
  CHECK(picture.png[1] == 'P');  // PNG signature, ISO/IEC 15948 5.2
  CHECK(picture.png[2] == 'N');
  vtkNew<vtkPNGReader> reader;
  reader->SetMemoryBuffer(picture.png.data());
  reader->SetMemoryBufferLength(static_cast<vtkIdType>(picture.png.size()));
  reader->Update();
  vtkImageData* image = reader->GetOutput();
  int dims[3];
  image->GetDimensions(dims);
  Decoded d{dims[0], dims[1], 0, {}};
  REQUIRE(image->GetNumberOfScalarComponents() >= 3);
  for (int y = 0; y < dims[1]; ++y)
    for (int x = 0; x < dims[0]; ++x) {
      const auto* p = static_cast<unsigned char*>(image->GetScalarPointer(x, y, 0));
      if (p[0] == 255 && p[1] == 255 && p[2] == 255) continue;
      ++d.coloured;
      d.colours.insert({p[0], p[1], p[2]});
    }
  return d;
}

}  // namespace

TEST_CASE("the stress picture is a real PNG with the colour scale drawn") {
  // Both ways of drawing: OpenGL offscreen (EGL on Mesa, which setup.sh installs) and the image canvas.
  for (const bool opengl : {true, false}) {
    viz::PictureOptions options{400, 300, false, 0};
    options.opengl = opengl;
    const auto model = viz::testing::l_frame();
    const auto result = viz::testing::solved(model);
    const auto picture = viz::draw_stress_picture(model, result, options);
    INFO("drawn by " << picture.drawn_by);
    CHECK(picture.drawn_by == (opengl ? "OpenGL (offscreen)" : "image canvas"));
    double largest = 0;  // the scale's top: the members' exact largest stress
    for (const auto& m : result.members) largest = std::max(largest, m.max_von_mises);
    CHECK(picture.stress_max == Approx(largest));
    const auto [low_stress, high_stress] = drawn_von_mises(model, result);
    if (const char* keep = std::getenv("STEPFRAME_KEEP_PICTURE"); keep && opengl)
      std::ofstream(keep, std::ios::binary)
          .write(reinterpret_cast<const char*>(picture.png.data()), static_cast<std::streamsize>(picture.png.size()));

    const Decoded d = decode(picture);
    REQUIRE(d.width == 400);
    REQUIRE(d.height == 300);
    CHECK(d.coloured > 500);  // two members, 3 to 4 px wide
    // The colours of the lowest and the highest stress drawn both appear.
    const auto low = viz::stress_colour(low_stress / largest), high = viz::stress_colour(high_stress / largest);
    auto shows = [&](const std::array<std::uint8_t, 3>& c) {
      return std::any_of(d.colours.begin(), d.colours.end(), [&](const std::array<int, 3>& p) {
        return std::abs(p[0] - c[0]) + std::abs(p[1] - c[1]) + std::abs(p[2] - c[2]) <= 6;
      });
    };
    CHECK(shows(low));
    CHECK(shows(high));
  }
}

TEST_CASE("the colour scale runs from blue to red") {
  CHECK(viz::stress_colour(0.0) == std::array<std::uint8_t, 3>{0, 0, 255});
  CHECK(viz::stress_colour(1.0) == std::array<std::uint8_t, 3>{220, 0, 0});
  CHECK(viz::stress_colour(-1.0) == viz::stress_colour(0.0));
}
