// The PNG encoder of the report's pictures: what it writes reads back pixel for pixel through VTK's own
// PNG reader, top row first, with the colour type of ISO/IEC 15948 11.2.2 (IHDR) for 1 to 4 components.

#include "png_bytes.hpp"

#include <catch2/catch.hpp>

#include <vtkImageData.h>
#include <vtkNew.h>
#include <vtkPNGReader.h>

#include <cstdint>
#include <random>
#include <stdexcept>

namespace {

// An image of pseudo-random pixels with a few flat bands (as a rendered picture has).
vtkNew<vtkImageData> test_image(int width, int height, int components, unsigned seed) {
  vtkNew<vtkImageData> image;
  image->SetDimensions(width, height, 1);
  image->AllocateScalars(VTK_UNSIGNED_CHAR, components);
  std::mt19937 random(seed);
  for (int y = 0; y < height; ++y)
    for (int x = 0; x < width; ++x) {
      auto* p = static_cast<unsigned char*>(image->GetScalarPointer(x, y, 0));
      for (int c = 0; c < components; ++c)
        p[c] = static_cast<unsigned char>(y % 7 == 0 ? 40 * c + 17 : random() % 256);
    }
  return image;
}

}  // namespace

TEST_CASE("PNG bytes read back pixel for pixel, top row first, for 1 to 4 components", "[viz][png]") {
  // IHDR colour types, ISO/IEC 15948 11.2.2: 0 grey, 4 grey + alpha, 2 RGB, 6 RGBA.
  const int colour_type[] = {0, 4, 2, 6};
  for (int components = 1; components <= 4; ++components) {
    INFO(components << " components");
    const auto image = test_image(37, 23, components, 20261203u + static_cast<unsigned>(components));
    const std::vector<std::uint8_t> png = stepframe::viz::detail::png_bytes(image);
    REQUIRE(png.size() > 33);
    // The signature (5.2), then IHDR (11.2.2): width, height, bit depth 8 and the colour type.
    CHECK(png[0] == 0x89);
    CHECK(png[1] == 'P');
    CHECK(png[12] == 'I');
    CHECK(png[15] == 'R');
    CHECK(png[19] == 37);
    CHECK(png[23] == 23);
    CHECK(png[24] == 8);
    CHECK(png[25] == colour_type[components - 1]);
    vtkNew<vtkPNGReader> reader;
    reader->SetMemoryBuffer(png.data());
    reader->SetMemoryBufferLength(static_cast<vtkIdType>(png.size()));
    reader->Update();
    vtkImageData* back = reader->GetOutput();
    int dims[3];
    back->GetDimensions(dims);
    REQUIRE(dims[0] == 37);
    REQUIRE(dims[1] == 23);
    REQUIRE(back->GetNumberOfScalarComponents() == components);
    int differ = 0;
    for (int y = 0; y < 23; ++y)
      for (int x = 0; x < 37; ++x)
        for (int c = 0; c < components; ++c)
          differ += static_cast<unsigned char*>(back->GetScalarPointer(x, y, 0))[c] !=
                    static_cast<unsigned char*>(image->GetScalarPointer(x, y, 0))[c];
    CHECK(differ == 0);
  }
}

TEST_CASE("PNG bytes refuse images that are not 8-bit", "[viz][png]") {
  vtkNew<vtkImageData> image;
  image->SetDimensions(4, 4, 1);
  image->AllocateScalars(VTK_FLOAT, 3);
  CHECK_THROWS_AS(stepframe::viz::detail::png_bytes(image), std::runtime_error);
}
