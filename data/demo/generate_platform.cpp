// Writes the demo frame as a STEP wireframe in millimetres.
//
// Invented scenario: pump platform P2 at the Larchmoor water treatment works
// (fictional). A steel platform 6.0 m long (x, two bays of 3.0 m) and 4.0 m
// wide (y, one bay), deck at z = 3.5 m, on six columns, braced in the first
// bay of both long sides.
//
// Usage: stepframe_demo_generator [output.stp]   (default data/demo/platform.stp)

#include "stepframe/geometry/step_writer.hpp"

#include <spdlog/spdlog.h>

#include <exception>
#include <filesystem>
#include <string>
#include <vector>

namespace {

using stepframe::geometry::LineToWrite;
using stepframe::geometry::SourceInfo;

constexpr double deck = 3.5;  // m
const std::string product = "P2-PLATFORM";

void add(std::vector<LineToWrite>& lines, Eigen::Vector3d a, Eigen::Vector3d b, const std::string& name,
         const std::string& layer) {
  SourceInfo attributes;
  attributes.name = name;
  attributes.layers = {layer};
  attributes.product = product;
  lines.push_back(LineToWrite{a, b, attributes});
}

std::vector<LineToWrite> platform() {
  std::vector<LineToWrite> lines;
  const double xs[] = {0.0, 3.0, 6.0};
  const double ys[] = {0.0, 4.0};

  for (const double y : ys)
    for (const double x : xs) add(lines, {x, y, 0.0}, {x, y, deck}, "HE 200 B", "COLUMNS");

  // Primary beams along x, split at the bay mid-points where the secondary
  // beams land, so every beam end is a node.
  const double primary_stations[] = {0.0, 1.5, 3.0, 4.5, 6.0};
  for (const double y : ys)
    for (int i = 0; i < 4; ++i)
      add(lines, {primary_stations[i], y, deck}, {primary_stations[i + 1], y, deck}, "IPE 300", "BEAMS");

  for (const double x : xs) add(lines, {x, 0.0, deck}, {x, 4.0, deck}, "IPE 300", "BEAMS");
  for (const double x : {1.5, 4.5}) add(lines, {x, 0.0, deck}, {x, 4.0, deck}, "IPE 200", "BEAMS");

  for (const double y : ys) add(lines, {0.0, y, 0.0}, {3.0, y, deck}, "brace", "BRACING");
  return lines;
}

}  // namespace

int main(int argc, char** argv) {
  const std::filesystem::path output = argc > 1 ? argv[1] : "data/demo/platform.stp";
  try {
    const std::vector<LineToWrite> lines = platform();
    stepframe::geometry::write_step_wireframe(output, lines, "mm");
    spdlog::info("pump platform P2: {} members written to {}", lines.size(), output.string());
  } catch (const std::exception& error) {
    spdlog::error("{}", error.what());
    return 1;
  }
  return 0;
}
