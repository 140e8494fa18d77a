// The colour scales: lightness checked in CIELAB (CIE 15:2004, D65; sRGB of
// IEC 61966-2-1), the conversions against the standards' reference points.

#include "stepframe/viz/colour_scale.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>

using namespace stepframe::viz;

TEST_CASE("CIELAB of sRGB reference colours (IEC 61966-2-1 primaries, D65 white)") {
  // White is L* = 100, a* = b* = 0 by definition of the D65-relative CIELAB; black is L* = 0.
  const auto white = cielab({255, 255, 255});
  CHECK(white[0] == Approx(100).margin(0.05));
  CHECK(white[1] == Approx(0).margin(0.05));
  CHECK(white[2] == Approx(0).margin(0.05));
  CHECK(cielab({0, 0, 0})[0] == Approx(0).margin(1e-9));
  // sRGB red, green and blue: L* 53.24, 87.73, 32.30 (common practice: the published values for the
  // sRGB primaries under D65, from memory).
  CHECK(cielab({255, 0, 0})[0] == Approx(53.24).margin(0.1));
  CHECK(cielab({0, 255, 0})[0] == Approx(87.73).margin(0.1));
  CHECK(cielab({0, 0, 255})[0] == Approx(32.30).margin(0.1));
}

TEST_CASE("the utilisation scale darkens steadily from 0 to 1 and flags above 1") {
  // Lightness falls at every step and about evenly (the anchors fall 16 to 19 L* per quarter), so
  // the scale reads in greyscale and for colour-blind readers.
  constexpr int steps = 40;
  double previous = cielab(utilisation_colour(0.0))[0];
  CHECK(previous == Approx(95).margin(1.0));
  for (int i = 1; i <= steps; ++i) {
    const double l = cielab(utilisation_colour(static_cast<double>(i) / steps))[0];
    const double drop = previous - l;
    INFO("step to " << static_cast<double>(i) / steps);
    CHECK(drop > 0.9);   // always darker
    CHECK(drop < 2.85);  // never a jump: 68 L* over 40 steps is 1.7 each
    previous = l;
  }
  CHECK(previous == Approx(27).margin(1.0));
  // Above the limit: one flag colour, far from every colour of the scale (CIE76 difference > 40).
  const auto flag = cielab(above_limit_colour());
  CHECK(utilisation_colour(1.0001) == above_limit_colour());
  CHECK(utilisation_colour(5.0) == above_limit_colour());
  CHECK(utilisation_colour(std::numeric_limits<double>::quiet_NaN()) == above_limit_colour());
  CHECK(utilisation_colour(-0.5) == utilisation_colour(0.0));
  for (int i = 0; i <= steps; ++i) {
    const auto c = cielab(utilisation_colour(static_cast<double>(i) / steps));
    CHECK(std::hypot(c[0] - flag[0], c[1] - flag[1], c[2] - flag[2]) > 40);
  }
}

TEST_CASE("the signed scale is light at zero and darkens equally both ways") {
  CHECK(cielab(signed_colour(0.0))[0] == Approx(94).margin(1.0));
  for (int i = 1; i <= 20; ++i) {
    const double f = i / 20.0;
    const double minus = cielab(signed_colour(-f))[0], plus = cielab(signed_colour(f))[0];
    CHECK(minus < cielab(signed_colour(-(i - 1) / 20.0))[0]);
    CHECK(plus < cielab(signed_colour((i - 1) / 20.0))[0]);
    CHECK(minus == Approx(plus).margin(1.5));  // the same lightness for the same magnitude
  }
  // Negative and positive ends are told apart by hue: far apart in a*, b*.
  const auto neg = cielab(signed_colour(-1)), pos = cielab(signed_colour(1));
  CHECK(std::hypot(neg[1] - pos[1], neg[2] - pos[2]) > 50);
  CHECK(hex(Rgb{255, 16, 0}) == "#ff1000");
}
