#pragma once
// A braced portal written as revisions (invented test data): a project and
// its STEP file in a folder of their own, with one change each, for the
// tests of `compare` and `run --baseline`.

#include "stepframe/geometry/step_writer.hpp"
#include "test_helpers.hpp"

#include <Eigen/Core>

#include <string>
#include <vector>

namespace stepframe::test {

struct RevisionLine {
  Eigen::Vector3d a, b;
  std::string name;
  std::string layer;  ///< COLUMNS, BEAMS or BRACES: what the project's rules select by
};

/// The checked revision: columns C1 (x = 0) and C2 (x = 5 m), 3 m high, fixed at their bases; beam B1 on
/// top; brace X1 from the foot of C1 to the head of C2. Sections by layer: COLUMNS HEB 200, BEAMS IPE 300,
/// BRACES CHS 60.3x4 pinned at both ends (so that revisions without CAD names still have sections).
inline std::vector<RevisionLine> base_revision() {
  return {{{0, 0, 0}, {0, 0, 3}, "C1", "COLUMNS"},
          {{5, 0, 0}, {5, 0, 3}, "C2", "COLUMNS"},
          {{0, 0, 3}, {5, 0, 3}, "B1", "BEAMS"},
          {{0, 0, 0}, {5, 0, 3}, "X1", "BRACES"}};
}

/// Writes `lines` as DIR/frame.stp and DIR/frame.yaml (beam section `beam`, a vertical load of
/// `beam_load` kN/m on the beams, 40 kN sway at the head of C1) and returns the project file.
inline std::filesystem::path write_revision(const std::filesystem::path& dir, const std::vector<RevisionLine>& lines,
                                            const std::string& beam = "IPE300", double beam_load = 20) {
  std::filesystem::create_directories(dir);
  std::vector<geometry::LineToWrite> edges;
  for (const auto& l : lines) {
    geometry::LineToWrite e{l.a, l.b, {}};
    e.attributes.name = l.name;
    e.attributes.layers = {l.layer};
    e.attributes.product = "FRAME";
    edges.push_back(e);
  }
  geometry::write_step_wireframe(dir / "frame.stp", edges, "mm");
  write_text(dir / "frame.yaml", R"(model: frame.stp
units: {length: m, force: kN, stress: MPa, line_load: kN/m}
rules:
  - where: {}
    material: S355
  - where: {layer: COLUMNS}
    section: HEB200
  - where: {layer: BEAMS}
    section: )" + beam + R"(
  - where: {layer: BRACES}
    section: CHS60.3X4
    release: {start: [ry, rz], end: [ry, rz]}
supports:
  - where: {z: 0}
    fix: fixed
cases:
  - name: G
    self_weight: true
    member_loads:
      - where: {layer: BEAMS}
        w: [0, 0, -)" + std::to_string(beam_load) + R"(]
  - name: W
    node_loads:
      - near: [0, 0, 3]
        force: [40, 0, 0]
combinations:
  - name: ULS
    factors: {G: 1.35, W: 1.5}
analysis:
  buckling_modes: 1
checks:
  stress: {combinations: [ULS]}
  en1993: {combinations: [ULS]}
)");
  return dir / "frame.yaml";
}

}  // namespace stepframe::test
