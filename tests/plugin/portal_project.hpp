#pragma once
// The portal the output tests run (invented test data): written as a STEP
// file and a project file into a scratch folder.

#include "stepframe/geometry/step_writer.hpp"
#include "test_helpers.hpp"

#include <Eigen/Core>

#include <string>

namespace stepframe::test {

/// A portal: two 3 m HEB 200 columns and a 5 m IPE 300 beam, fixed bases, a
/// vertical load on the beam and a sway load, two combinations and buckling.
inline void write_portal(const ScratchDir& dir, double beam_load_kN_per_m = 20) {
  auto line = [](Eigen::Vector3d a, Eigen::Vector3d b, const char* name, const char* layer) {
    geometry::LineToWrite l{a, b, {}};
    l.attributes.name = name;
    l.attributes.layers = {layer};
    l.attributes.product = "PORTAL";
    return l;
  };
  geometry::write_step_wireframe(dir / "portal.stp",
                                 {line({0, 0, 0}, {0, 0, 3}, "HE 200 B", "COLUMNS"),
                                  line({5, 0, 0}, {5, 0, 3}, "HE 200 B", "COLUMNS"),
                                  line({0, 0, 3}, {5, 0, 3}, "IPE 300", "BEAMS")},
                                 "mm");
  write_text(dir / "portal.yaml", R"(model: portal.stp
units: {length: m, force: kN, stress: MPa, line_load: kN/m}
rules:
  - where: {}
    material: S355
supports:
  - where: {z: 0}
    fix: fixed
cases:
  - name: G
    self_weight: true
    member_loads:
      - where: {layer: BEAMS}
        w: [0, 0, -)" + std::to_string(beam_load_kN_per_m) + R"(]
  - name: W
    node_loads:
      - near: [0, 0, 3]
        force: [8, 0, 0]
combinations:
  - name: ULS
    factors: {G: 1.35, W: 1.5}
  - name: SLS
    factors: {G: 1.0, W: 1.0}
analysis:
  buckling_modes: 2
checks:
  stress: {combinations: [ULS]}
  en1993: {combinations: [ULS]}
  stability: {combinations: [ULS]}
  deflection: {span_ratio: 300, combinations: [SLS]}
  drift: {storey_ratio: 300, combinations: [SLS]}
)");
}

}  // namespace stepframe::test
