#include "stepframe/viz/browser_view.hpp"

#include <fmt/format.h>

namespace stepframe::viz {

std::string colour_scales_json() {
  constexpr int steps = 100;
  auto scale = [&](auto colour_of) {
    std::string out = "[";
    for (int i = 0; i <= steps; ++i) out += fmt::format("{}\"{}\"", i ? "," : "", hex(colour_of(i / double(steps))));
    return out + "]";
  };
  return fmt::format(R"({{"utilisation":{},"signed":{},"above_limit":"{}","not_checked":"{}"}})",
                     scale([](double t) { return utilisation_colour(t); }),
                     scale([](double t) { return signed_colour(2 * t - 1); }), hex(above_limit_colour()),
                     hex(not_checked_colour()));
}

}  // namespace stepframe::viz
