// Writes the demo frame as a STEP wireframe in millimetres.
//
// Invented scenario: pump platform P2 at the Larchmoor water treatment works
// (fictional). A steel platform 6.0 m long (x, two bays of 3.0 m) and 4.0 m
// wide (y, one bay), deck at z = 3.5 m, on six columns, braced in the first
// bay of both long sides.
//
// Usage: stepframe_demo_generator [output.stp] [--us]   (default data/demo/platform.stp)
//
// With --us, the same platform as a US fabricator's CAD would hold it (the
// invented variant data/demo/platform_us.yaml runs to AISC 360): written in
// inches, members named by their W-shape designations.

#include "stepframe/geometry/step_writer.hpp"

#include <spdlog/spdlog.h>

#include <exception>
#include <filesystem>
#include <string>
#include <vector>

namespace {

using stepframe::geometry::LineToWrite;
using stepframe::geometry::SourceInfo;

const std::string product = "P2-PLATFORM";

void add(std::vector<LineToWrite>& lines, Eigen::Vector3d a, Eigen::Vector3d b, const std::string& name,
         const std::string& layer) {
  SourceInfo attributes;
  attributes.name = name;
  attributes.layers = {layer};
  attributes.product = product;
  lines.push_back(LineToWrite{a, b, attributes});
}

/// The CAD names of the three member families and the platform's size [m]:
/// two bays of `bay` along x, one of `width` along y, deck at `deck`.
struct Variant {
  std::string column, primary, secondary;
  double bay, width, deck;
};
constexpr double ft = 0.3048;
const Variant european{"HE 200 B", "IPE 300", "IPE 200", 3.0, 4.0, 3.5};
// Redrawn in feet: two 10 ft bays, 13 ft wide, deck at 11 ft 6 in.
const Variant us{"W8X31", "W12X26", "W8X18", 10 * ft, 13 * ft, 11.5 * ft};

std::vector<LineToWrite> platform(const Variant& names) {
  std::vector<LineToWrite> lines;
  const double deck = names.deck, b = names.bay, w = names.width;
  const double xs[] = {0.0, b, 2 * b};
  const double ys[] = {0.0, w};

  for (const double y : ys)
    for (const double x : xs) add(lines, {x, y, 0.0}, {x, y, deck}, names.column, "COLUMNS");

  // Primary beams along x, split at the bay mid-points where the secondary
  // beams land, so every beam end is a node.
  const double primary_stations[] = {0.0, 0.5 * b, b, 1.5 * b, 2 * b};
  for (const double y : ys)
    for (int i = 0; i < 4; ++i)
      add(lines, {primary_stations[i], y, deck}, {primary_stations[i + 1], y, deck}, names.primary, "BEAMS");

  for (const double x : xs) add(lines, {x, 0.0, deck}, {x, w, deck}, names.primary, "BEAMS");
  for (const double x : {0.5 * b, 1.5 * b}) add(lines, {x, 0.0, deck}, {x, w, deck}, names.secondary, "BEAMS");

  for (const double y : ys) add(lines, {0.0, y, 0.0}, {b, y, deck}, "brace", "BRACING");
  return lines;
}

}  // namespace

int main(int argc, char** argv) {
  const std::filesystem::path output = argc > 1 ? argv[1] : "data/demo/platform.stp";
  try {
    const bool us_variant = argc > 2 && std::string(argv[2]) == "--us";
    const std::vector<LineToWrite> lines = platform(us_variant ? us : european);
    stepframe::geometry::write_step_wireframe(output, lines, us_variant ? "inch" : "mm");
    spdlog::info("pump platform P2: {} members written to {}", lines.size(), output.string());
  } catch (const std::exception& error) {
    spdlog::error("{}", error.what());
    return 1;
  }
  return 0;
}
