// The committed demo file data/demo/platform.stp (written by
// data/demo/generate_platform.cpp) must read back as the frame the generator
// describes. Its numbers are the invented demo scenario, not a published reference.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"

#include <catch2/catch.hpp>

#include <map>
#include <string>
#include <utility>

namespace sg = stepframe::geometry;

TEST_CASE("the demo pump platform reads back as 21 members on 16 nodes", "[step][demo]") {
  const sg::StepModel model = sg::read_step(std::filesystem::path(STEPFRAME_SOURCE_DIR) / "data/demo/platform.stp");
  CHECK(model.length_unit == "mm");
  CHECK(model.diagnostics.empty());
  REQUIRE(model.edges.size() == 21);

  // 6 columns, 8 primary beam pieces + 3 cross beams, 2 secondary beams, 2 braces.
  std::map<std::pair<std::string, std::string>, int> by_name_and_layer;
  for (const sg::WireEdge& e : model.edges) {
    CHECK(e.source.product == "P2-PLATFORM");
    REQUIRE(e.source.layers.size() == 1);
    ++by_name_and_layer[{e.source.name, e.source.layers.front()}];
  }
  CHECK(by_name_and_layer == std::map<std::pair<std::string, std::string>, int>{{{"HE 200 B", "COLUMNS"}, 6},
                                                                                  {{"IPE 300", "BEAMS"}, 11},
                                                                                  {{"IPE 200", "BEAMS"}, 2},
                                                                                  {{"brace", "BRACING"}, 2}});

  // Deck nodes at x = 0, 1.5, 3, 4.5, 6 on both long sides (10) and six column
  // feet: every member end lands on one of these 16 points.
  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
  CHECK(frame.nodes.size() == 16);
  CHECK(frame.members.size() == 21);
  CHECK(frame.diagnostics.empty());
}
