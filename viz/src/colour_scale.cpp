#include "stepframe/viz/colour_scale.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

namespace stepframe::viz {
namespace {

using Lab = std::array<double, 3>;

// The anchors, CIELAB (L*, a*, b*), evenly spaced along each scale. Chosen for
// this project: lightness falls linearly, every anchor lies inside sRGB.
constexpr std::array<Lab, 5> utilisation_anchors{{
    {95, -2, 12},   // 0: ivory
    {80, 10, 42},   // 0.25: sand
    {64, 32, 48},   // 0.5: terracotta
    {45, 42, 22},   // 0.75: brick
    {27, 28, -10},  // 1: plum
}};
constexpr Lab above_limit{56, -4, -46};  // a clear blue, far from every scale colour
constexpr Lab not_checked{40, 0, 0};   // dark neutral grey
constexpr Lab undeformed{84, 0, 0};    // pale neutral grey
constexpr std::array<Lab, 3> signed_anchors{{
    {38, -18, -14},  // -1: deep teal
    {94, 0, 0},      // 0: light grey
    {38, 26, 44},    // +1: deep amber-brown
}};

// D65 reference white (CIE 15:2004), Y = 1.
constexpr double white_x = 0.95047, white_y = 1.0, white_z = 1.08883;

// sRGB transfer function and its inverse (IEC 61966-2-1).
double encode(double linear) {
  return linear <= 0.0031308 ? 12.92 * linear : 1.055 * std::pow(linear, 1 / 2.4) - 0.055;
}
double decode(double encoded) {
  return encoded <= 0.04045 ? encoded / 12.92 : std::pow((encoded + 0.055) / 1.055, 2.4);
}

// CIELAB -> 8-bit sRGB (CIE 15:2004 8.2.1 inverted; sRGB matrix of IEC 61966-2-1), clipped to the gamut.
Rgb to_rgb(const Lab& lab) {
  const double fy = (lab[0] + 16) / 116, fx = fy + lab[1] / 500, fz = fy - lab[2] / 200;
  constexpr double delta = 6.0 / 29.0;
  auto inverse = [&](double t) { return t > delta ? t * t * t : 3 * delta * delta * (t - 4.0 / 29.0); };
  const double x = white_x * inverse(fx), y = white_y * inverse(fy), z = white_z * inverse(fz);
  const double linear[3] = {3.2406 * x - 1.5372 * y - 0.4986 * z, -0.9689 * x + 1.8758 * y + 0.0415 * z,
                            0.0557 * x - 0.2040 * y + 1.0570 * z};
  Rgb out{};
  for (int c = 0; c < 3; ++c)
    out[static_cast<std::size_t>(c)] =
        static_cast<std::uint8_t>(std::lround(255 * std::clamp(encode(std::clamp(linear[c], 0.0, 1.0)), 0.0, 1.0)));
  return out;
}

// Linear interpolation in CIELAB along evenly spaced anchors, t in [0, 1].
template <std::size_t N>
Rgb along(const std::array<Lab, N>& anchors, double t) {
  const double s = std::clamp(t, 0.0, 1.0) * static_cast<double>(N - 1);
  const std::size_t k = std::min(static_cast<std::size_t>(s), N - 2);
  const double f = s - static_cast<double>(k);
  Lab lab{};
  for (std::size_t c = 0; c < 3; ++c) lab[c] = anchors[k][c] + f * (anchors[k + 1][c] - anchors[k][c]);
  return to_rgb(lab);
}

}  // namespace

Rgb utilisation_colour(double utilisation) {
  if (!(utilisation <= 1.0)) return above_limit_colour();  // above 1, or NaN
  return along(utilisation_anchors, utilisation);
}

Rgb above_limit_colour() { return to_rgb(above_limit); }

Rgb not_checked_colour() { return to_rgb(not_checked); }
Rgb undeformed_colour() { return to_rgb(undeformed); }

Rgb signed_colour(double fraction) {
  if (std::isnan(fraction)) fraction = 0;
  return along(signed_anchors, 0.5 * (std::clamp(fraction, -1.0, 1.0) + 1));
}

std::array<double, 3> cielab(const Rgb& colour) {
  // sRGB -> XYZ (IEC 61966-2-1) -> CIELAB (CIE 15:2004 8.2.1), D65.
  double linear[3];
  for (int c = 0; c < 3; ++c) linear[c] = decode(colour[static_cast<std::size_t>(c)] / 255.0);
  const double x = 0.4124 * linear[0] + 0.3576 * linear[1] + 0.1805 * linear[2];
  const double y = 0.2126 * linear[0] + 0.7152 * linear[1] + 0.0722 * linear[2];
  const double z = 0.0193 * linear[0] + 0.1192 * linear[1] + 0.9505 * linear[2];
  constexpr double delta = 6.0 / 29.0;
  auto f = [&](double t) { return t > delta * delta * delta ? std::cbrt(t) : t / (3 * delta * delta) + 4.0 / 29.0; };
  const double fx = f(x / white_x), fy = f(y / white_y), fz = f(z / white_z);
  return {116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)};
}

std::string hex(const Rgb& colour) { return fmt::format("#{:02x}{:02x}{:02x}", colour[0], colour[1], colour[2]); }

}  // namespace stepframe::viz
