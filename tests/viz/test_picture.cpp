// Report pictures: real PNGs in the colours of the utilisation scale, whatever draws them, and
// member labels placed where the members are drawn.

#include "solved_frames.hpp"
#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/viz/colour_scale.hpp"
#include "stepframe/viz/picture.hpp"

#include <catch2/catch.hpp>
#include <vtkImageData.h>
#include <vtkNew.h>
#include <vtkPNGReader.h>

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <fstream>
#include <limits>
#include <map>
#include <thread>

using namespace stepframe;

namespace {

/// The decoded PNG: its size and the colour of every pixel, rows from the top.
struct Decoded {
  int width = 0, height = 0;
  std::vector<viz::Rgb> pixels;
  const viz::Rgb& at(int x, int y) const { return pixels[static_cast<std::size_t>(y * width + x)]; }
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
  REQUIRE(image->GetNumberOfScalarComponents() >= 3);
  Decoded d{dims[0], dims[1], {}};
  for (int y = dims[1] - 1; y >= 0; --y)  // VTK images: y up
    for (int x = 0; x < dims[0]; ++x) {
      const auto* p = static_cast<unsigned char*>(image->GetScalarPointer(x, y, 0));
      d.pixels.push_back({p[0], p[1], p[2]});
    }
  return d;
}

bool close(const viz::Rgb& a, const viz::Rgb& b, int tolerance = 6) {
  return std::abs(a[0] - b[0]) + std::abs(a[1] - b[1]) + std::abs(a[2] - b[2]) <= tolerance;
}

std::size_t count(const Decoded& d, const viz::Rgb& colour) {
  return static_cast<std::size_t>(std::count_if(d.pixels.begin(), d.pixels.end(), [&](const auto& p) { return close(p, colour); }));
}

/// Whether a pixel of `colour` lies within `radius` pixels of (x, y).
bool near(const Decoded& d, double x, double y, const viz::Rgb& colour, int radius = 4) {
  for (int dy = -radius; dy <= radius; ++dy)
    for (int dx = -radius; dx <= radius; ++dx) {
      const int px = static_cast<int>(std::lround(x)) + dx, py = static_cast<int>(std::lround(y)) + dy;
      if (px >= 0 && py >= 0 && px < d.width && py < d.height && close(d.at(px, py), colour)) return true;
    }
  return false;
}

}  // namespace

TEST_CASE("a picture coloured by member values shows the scale's colours, the flag and the labels where the members are") {
  const auto model = viz::testing::l_frame();
  const auto result = viz::testing::solved(model);
  for (const bool opengl : {true, false}) {
    viz::PictureOptions options;
    options.width = 400;
    options.height = 300;
    options.opengl = opengl;
    options.member_values = {0.3, 1.4};  // the second member above its limit
    options.labelled = {0, 1};
    const auto picture = viz::draw_frame_picture(model, result, options);
    INFO("drawn by " << picture.drawn_by);
    CHECK(picture.drawn_by == (opengl ? "OpenGL (offscreen)" : "image canvas"));
    if (const char* keep = std::getenv("STEPFRAME_KEEP_PICTURE"); keep && opengl)
      std::ofstream(keep, std::ios::binary)
          .write(reinterpret_cast<const char*>(picture.png.data()), static_cast<std::streamsize>(picture.png.size()));
    const Decoded d = decode(picture);
    REQUIRE(d.width == 400);
    REQUIRE(d.height == 300);
    const auto low = viz::utilisation_colour(0.3), flag = viz::above_limit_colour();
    CHECK(count(d, low) > 100);   // a 2 m member, 3 to 4 px wide
    CHECK(count(d, flag) > 100);
    REQUIRE(picture.labels.size() == 2);
    // Each label sits on its own member's colour: the renderer's projection, not a guess.
    CHECK(picture.labels[0].member == 0);
    CHECK(near(d, picture.labels[0].x * d.width, picture.labels[0].y * d.height, low));
    CHECK(near(d, picture.labels[1].x * d.width, picture.labels[1].y * d.height, flag));
    CHECK_FALSE(near(d, picture.labels[0].x * d.width, picture.labels[0].y * d.height, flag, 1));
  }
}

TEST_CASE("a stress picture colours every point by von Mises over fy; members without a value are drawn as not checked") {
  const auto model = viz::testing::l_frame();
  const auto result = viz::testing::solved(model);
  const auto& el = model.elements.front();
  const double fy = analysis::material_for_section(model.materials[el.material], model.sections[el.section]).fy;
  // The largest ratio drawn: at a member's fixed end, where the stress is largest.
  double largest = 0;
  for (const auto& m : result.members) largest = std::max(largest, m.max_von_mises / fy);
  REQUIRE(largest > 0.01);
  viz::PictureOptions options;
  options.width = 400;
  options.height = 300;
  options.opengl = false;  // one colour per segment: its first point's
  const Decoded d = decode(viz::draw_frame_picture(model, result, options));
  // The colour of the largest ratio drawn appears (a segment starting at a fixed end carries it).
  const auto stations = analysis::member_line(model, result, analysis::member_chains(model)[0], analysis::LineDetail::stations, 5).stations;
  CHECK(count(d, viz::utilisation_colour(stations.front().von_mises / fy)) > 5);

  options.member_values = {std::numeric_limits<double>::quiet_NaN(), 0.5};
  const Decoded m = decode(viz::draw_frame_picture(model, result, options));
  CHECK(count(m, viz::not_checked_colour()) > 100);
  CHECK(count(m, viz::utilisation_colour(0.5)) > 100);
}

TEST_CASE("a deformed picture draws the undeformed frame behind it and reports its scale") {
  const auto model = viz::testing::l_frame();
  const auto result = viz::testing::solved(model);
  viz::PictureOptions options;
  options.width = 400;
  options.height = 300;
  options.deformed = true;
  options.opengl = false;
  options.member_values = {0.2, 0.2};
  const auto picture = viz::draw_frame_picture(model, result, options);
  double largest = 0;
  for (const auto& member : analysis::member_chains(model))
    for (const auto& st : analysis::member_line(model, result, member, analysis::LineDetail::stations, 5).stations)
      largest = std::max(largest, st.displacement.norm());
  CHECK(picture.largest_displacement == Approx(largest));
  // 5% of the frame's extent (the diagonal of its 2 m x 2 m bounding box) over the largest displacement.
  CHECK(picture.deformation_scale == Approx(0.05 * std::sqrt(8.0) / largest));
  const Decoded d = decode(picture);
  CHECK(count(d, viz::undeformed_colour()) > 50);
}

TEST_CASE("pictures drawn together in one context are the pictures drawn one by one") {
  // The batch reuses one OpenGL window for its pictures (and draws canvas pictures where asked): each
  // PNG must be byte for byte the one draw_frame_picture gives alone, labels included.
  const auto model = viz::testing::l_frame();
  const auto result = viz::testing::solved(model);
  std::vector<viz::PictureRequest> requests(4);
  for (auto& r : requests) {
    r.result = &result;
    r.options.width = 320;
    r.options.height = 240;
  }
  requests[0].options.member_values = {0.3, 1.2};
  requests[0].options.labelled = {1};
  requests[1].options.deformed = true;
  requests[1].options.member_values = {0.2, 0.2};
  requests[2].options.opengl = false;  // stress colours on the canvas, between two OpenGL pictures
  requests[3].options.width = 200;     // another size in the same window
  const std::vector<viz::Picture> together = viz::draw_frame_pictures(model, requests);
  REQUIRE(together.size() == requests.size());
  for (std::size_t k = 0; k < requests.size(); ++k) {
    const viz::Picture alone = viz::draw_frame_picture(model, result, requests[k].options);
    CHECK(together[k].drawn_by == alone.drawn_by);
    CHECK(together[k].png == alone.png);
    CHECK(together[k].deformation_scale == alone.deformation_scale);
    REQUIRE(together[k].labels.size() == alone.labels.size());
    for (std::size_t l = 0; l < alone.labels.size(); ++l) {
      CHECK(together[k].labels[l].x == alone.labels[l].x);
      CHECK(together[k].labels[l].y == alone.labels[l].y);
    }
    CHECK(decode(together[k]).width == requests[k].options.width);
  }
  CHECK(together[2].drawn_by == "image canvas");
}

TEST_CASE("a prepared renderer draws what draw_frame_pictures draws, and several may live on several threads") {
  const auto model = viz::testing::l_frame();
  const auto result = viz::testing::solved(model);
  viz::PictureRequest request{&result, {}};
  request.options.width = 300;
  request.options.height = 200;
  request.options.member_values = {0.4, 0.9};
  const std::vector<viz::Picture> expected = viz::draw_frame_pictures(model, {request});
  { viz::PictureRenderer unused; }  // made and dropped while preparing: nothing to draw, nothing left behind
  std::vector<std::vector<viz::Picture>> drawn(4);
  {
    std::vector<viz::PictureRenderer> renderers(4);
    std::vector<std::thread> threads;
    for (std::size_t t = 0; t < renderers.size(); ++t)
      threads.emplace_back([&, t] { drawn[t] = renderers[t].draw(model, {request, request}); });
    for (auto& thread : threads) thread.join();
  }
  for (const auto& pictures : drawn) {
    REQUIRE(pictures.size() == 2);
    for (const auto& picture : pictures) {
      CHECK(picture.drawn_by == expected.front().drawn_by);
      CHECK(picture.png == expected.front().png);
    }
  }
}
