#pragma once
// An image encoded as PNG in memory.

#include <vtkImageData.h>

#include <cstdint>
#include <vector>

namespace stepframe::viz::detail {

/// The image (8-bit, 1 to 4 components: grey, grey and alpha, RGB, RGBA) as a PNG file's bytes
/// (ISO/IEC 15948), its top row first. Throws std::runtime_error for any other image.
std::vector<std::uint8_t> png_bytes(vtkImageData* image);

}  // namespace stepframe::viz::detail
