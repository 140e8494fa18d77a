// read_step and build_wireframe on hand-written STEP files, one for each way a
// CAD program exports a frame: curved members, edge-based and shell-based
// wireframes, nested assemblies with rotated placements, units in feet and
// metres, names and layers on different entities, files with surfaces.
// Every expected value follows from the numbers written in the file.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/wireframe.hpp"

#include <Eigen/Geometry>
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;

namespace {

const std::filesystem::path data = STEPFRAME_TEST_DATA;

bool close(const Eigen::Vector3d& a, const Eigen::Vector3d& b, double tolerance = 1e-9) {
  return (a - b).norm() <= tolerance * std::max(1.0, b.norm());
}

std::size_t count_code(const std::vector<sg::Diagnostic>& diagnostics, const std::string& code) {
  return static_cast<std::size_t>(std::count_if(diagnostics.begin(), diagnostics.end(),
                                                [&](const sg::Diagnostic& d) { return d.code == code; }));
}

const sg::WireMember& member_named(const sg::Wireframe& frame, const std::string& name) {
  const auto it = std::find_if(frame.members.begin(), frame.members.end(),
                               [&](const sg::WireMember& m) { return m.source.name == name; });
  REQUIRE(it != frame.members.end());
  return *it;
}

// Angle between two element directions, atan2(|a x b|, a . b).
double turn(const Eigen::Vector3d& a, const Eigen::Vector3d& b) { return std::atan2(a.cross(b).norm(), a.dot(b)); }

}  // namespace

// curved_members_m.stp, all in metres.
TEST_CASE("arcs, splines and composite curves become curved members divided by turn", "[step][curves]") {
  const sg::StepModel model = sg::read_step(data / "curved_members_m.stp");
  CHECK(model.length_unit == "m");
  CHECK(model.metres_per_unit == 1.0);
  // Arch, parabola, three straight pieces of the degree-1 spline, and the
  // composite curve's line and arc.
  REQUIRE(model.edges.size() == 7);
  for (const sg::WireEdge& e : model.edges) {
    CHECK(e.source.product == "CANOPY");
    CHECK(e.source.layers == std::vector<std::string>{"S-ROOF"});  // layer on the curve set
  }

  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
  REQUIRE(frame.members.size() == 7);

  SECTION("the half circle: 180 / 5 = 36 elements, every node on the circle") {
    const sg::WireMember& arch = member_named(frame, "arch rib");
    CHECK(arch.curved);
    CHECK(arch.source.entity == "#60");
    REQUIRE(arch.nodes.size() == 37);
    CHECK(close(frame.nodes[arch.nodes.front()], {5, 0, 0}));
    CHECK(close(frame.nodes[arch.nodes.back()], {-5, 0, 0}));
    // Circle of radius 5 m about the origin in the x-z plane (ISO 10303-42, circle).
    for (const std::size_t n : arch.nodes) {
      CHECK(frame.nodes[n].norm() == Approx(5.0).epsilon(1e-9));
      CHECK(frame.nodes[n].y() == Approx(0.0).margin(1e-12));
      CHECK(frame.nodes[n].z() >= -1e-12);  // over the top, not under
    }
    // Each element turns by 5 degrees, to within the 0.25 degree spacing of
    // the samples the nodes are picked from.
    for (std::size_t k = 2; k < arch.nodes.size(); ++k) {
      const Eigen::Vector3d a = frame.nodes[arch.nodes[k - 1]] - frame.nodes[arch.nodes[k - 2]];
      const Eigen::Vector3d b = frame.nodes[arch.nodes[k]] - frame.nodes[arch.nodes[k - 1]];
      CHECK(turn(a, b) * 180 / std::numbers::pi == Approx(5.0).margin(0.26));
    }
    // The member's length is the sum of its chords: 36 chords of 2 R sin(2.5 deg)
    // (chord of a circular arc, common practice), within 0.1 % of the arc pi R.
    const double chords = 36 * 2 * 5 * std::sin(2.5 * std::numbers::pi / 180);
    CHECK(sg::path_length(frame, arch) == Approx(chords).epsilon(1e-3));
    CHECK(sg::path_length(frame, arch) == Approx(5 * std::numbers::pi).epsilon(1e-3));
  }

  SECTION("the quadratic spline: nodes on its parabola") {
    // A degree-2 B-spline with knots (0,0,0,1,1,1) is the Bezier curve
    // (1-t)^2 P0 + 2t(1-t) P1 + t^2 P2 (ISO 10303-42, b_spline_curve); with
    // P0 = (0,3,0), P1 = (2,3,4), P2 = (4,3,0): x = 4t, z = 8t(1-t) = x(4-x)/2.
    const sg::WireMember& purlin = member_named(frame, "purlin curve");
    CHECK(purlin.curved);
    // Its slope dz/dx = 2 - x runs from 2 to -2, so the tangent turns by
    // 2 atan(2) = 126.87 degrees: ceil(126.87 / 5) = 26 elements.
    CHECK(purlin.nodes.size() == 27);
    for (const std::size_t n : purlin.nodes) {
      const Eigen::Vector3d& p = frame.nodes[n];
      CHECK(p.y() == Approx(3.0));
      CHECK(p.z() == Approx(p.x() * (4 - p.x()) / 2).margin(1e-9));
    }
  }

  SECTION("a degree-1 spline is one straight member per span") {
    std::vector<const sg::WireMember*> ties;
    for (const auto& m : frame.members)
      if (m.source.name == "tie") ties.push_back(&m);
    REQUIRE(ties.size() == 3);
    const std::vector<Eigen::Vector3d> corners{{0, 6, 0}, {1, 6, 0}, {2, 6, 1}, {3, 6, 1}};
    for (std::size_t i = 0; i < 3; ++i) {
      CHECK_FALSE(ties[i]->curved);
      REQUIRE(ties[i]->nodes.size() == 2);
      CHECK(close(frame.nodes[ties[i]->nodes[0]], corners[i]));
      CHECK(close(frame.nodes[ties[i]->nodes[1]], corners[i + 1]));
      CHECK(ties[i]->source.entity == "#80");
    }
  }

  SECTION("a composite curve gives its straight piece and its quarter circle") {
    std::vector<const sg::WireMember*> pieces;
    for (const auto& m : frame.members)
      if (m.source.name == "edge trim") pieces.push_back(&m);
    REQUIRE(pieces.size() == 2);
    CHECK_FALSE(pieces[0]->curved);
    CHECK(close(frame.nodes[pieces[0]->nodes.front()], {0, 10, 0}));
    CHECK(close(frame.nodes[pieces[0]->nodes.back()], {2, 10, 0}));
    CHECK(pieces[1]->curved);
    CHECK(pieces[1]->nodes.size() == 19);  // 90 / 5 = 18 elements
    CHECK(pieces[1]->nodes.front() == pieces[0]->nodes.back());
    CHECK(close(frame.nodes[pieces[1]->nodes.back()], {3, 11, 0}));
    for (const std::size_t n : pieces[1]->nodes)
      CHECK((frame.nodes[n] - Eigen::Vector3d(2, 11, 0)).norm() == Approx(1.0).epsilon(1e-9));
  }

  SECTION("a coarser turn gives fewer elements") {
    sg::WireframeOptions options;
    options.merge_tolerance = 1e-3;
    options.curve_max_turn = 15 * std::numbers::pi / 180;
    const sg::Wireframe coarse = sg::build_wireframe(model, options);
    CHECK(member_named(coarse, "arch rib").nodes.size() == 13);  // 180 / 15 = 12 elements
  }
  // Four parts (arch, parabola, tie, trim) touch nowhere: one warning each.
  CHECK(count_code(frame.diagnostics, "disconnected-part") == 4);
}

// portal_edges_ft.stp: CONVERSION_BASED_UNIT 'FOOT' = 0.3048 m (international
// yard and pound agreement, 1959); the portal is 20 ft wide and 15 ft high.
TEST_CASE("an edge-based wireframe in feet with named vertices", "[step][units][points]") {
  const sg::StepModel model = sg::read_step(data / "portal_edges_ft.stp");
  CHECK(model.length_unit == "ft");
  CHECK(model.metres_per_unit == Approx(0.3048).epsilon(1e-12));
  REQUIRE(model.edges.size() == 3);
  const double ft = 0.3048;
  // EDGE_CURVE #72 runs from vertex #67 (20, 0, 0) ft up to #66 (20, 0, 15) ft.
  CHECK(model.edges[2].source.entity == "#72");
  CHECK(close(model.edges[2].start, Eigen::Vector3d(20, 0, 0) * ft));
  CHECK(close(model.edges[2].end, Eigen::Vector3d(20, 0, 15) * ft));
  for (const sg::WireEdge& e : model.edges) {
    // No names on the edges or their set: the representation's name; the
    // product name carries the designation; the layer sits on the edge set.
    CHECK(e.source.name == "portal");
    CHECK(e.source.product == "W12X26 PORTAL");
    CHECK(e.source.layers == std::vector<std::string>{"S-FRAME"});
  }
  // Named vertices (#64, #67) and layered ones (#65, #66), each once.
  REQUIRE(model.points.size() == 4);
  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
  REQUIRE(frame.labels.size() == 4);
  auto label = [&](const std::string& entity) {
    const auto it = std::find_if(frame.labels.begin(), frame.labels.end(),
                                 [&](const sg::NodeLabel& l) { return l.source.entity == entity; });
    REQUIRE(it != frame.labels.end());
    return *it;
  };
  CHECK(label("#64").source.name == "FOOT-W");
  CHECK(close(frame.nodes[label("#64").node], {0, 0, 0}));
  CHECK(label("#67").source.name == "FOOT-E");
  CHECK(close(frame.nodes[label("#67").node], Eigen::Vector3d(20, 0, 0) * ft));
  CHECK(label("#65").source.layers == std::vector<std::string>{"KNEES"});
  CHECK(close(frame.nodes[label("#66").node], Eigen::Vector3d(20, 0, 15) * ft));
  CHECK(frame.diagnostics.empty());
}

// truss_shell_m.stp: a SHELL_BASED_WIREFRAME_SHAPE_REPRESENTATION (ISO 10303-42
// shell_based_wireframe_model), which OCCT 7.6 does not translate itself.
TEST_CASE("a shell-based wireframe keeps its edges, names and layers", "[step][shell]") {
  const sg::StepModel model = sg::read_step(data / "truss_shell_m.stp");
  CHECK(model.length_unit == "m");
  REQUIRE(model.edges.size() == 3);
  struct Expected {
    const char* entity;
    Eigen::Vector3d start, end;
    const char* name;
  };
  // #72 runs from vertex #67 (2,0,3) to #65 (0,0,0) although its line points
  // up (same_sense .F.); unnamed edges take the wire shell's name.
  const std::vector<Expected> expected{{"#70", {0, 0, 0}, {4, 0, 0}, "bottom chord"},
                                       {"#71", {4, 0, 0}, {2, 0, 3}, "triangle"},
                                       {"#72", {2, 0, 3}, {0, 0, 0}, "triangle"}};
  for (std::size_t i = 0; i < expected.size(); ++i) {
    CAPTURE(i);
    CHECK(model.edges[i].source.entity == expected[i].entity);
    CHECK(close(model.edges[i].start, expected[i].start));
    CHECK(close(model.edges[i].end, expected[i].end));
    CHECK(model.edges[i].source.name == expected[i].name);
    CHECK(model.edges[i].source.layers == std::vector<std::string>{"S-TRUSS"});
    CHECK(model.edges[i].source.product == "TRUSS-T1");
  }
  // The vertex shell 'apex' marks vertex #67 at (2, 0, 3): a labelled point
  // with the shell's name, known by the vertex's entity.
  REQUIRE(model.points.size() == 1);
  CHECK(model.points[0].source.entity == "#67");
  CHECK(model.points[0].source.name == "apex");
  CHECK(close(model.points[0].at, {2, 0, 3}));
  CHECK(model.diagnostics.empty());
  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
  CHECK(frame.nodes.size() == 3);
  CHECK(frame.members.size() == 3);
  REQUIRE(frame.labels.size() == 1);
  CHECK(close(frame.nodes[frame.labels[0].node], {2, 0, 3}));
}

// ring_edge_m.stp (one closed EDGE_CURVE on a circle of radius 5 m about
// (0, 0, 4)) and ring_trimmed_m.stp (a circle of radius 3 m about (20, 0, 6)
// trimmed from 0 to 2 pi): each ring is one curved member closing on itself.
TEST_CASE("a closed circle is one curved member whose nodes close on themselves", "[step][curves][rings]") {
  struct Ring {
    const char* file;
    const char* entity;
    double radius;
    Eigen::Vector3d centre;
  };
  for (const Ring& ring : {Ring{"ring_edge_m.stp", "#70", 5.0, {0, 0, 4}}, Ring{"ring_trimmed_m.stp", "#101", 3.0, {20, 0, 6}}}) {
    CAPTURE(ring.file);
    const sg::StepModel model = sg::read_step(data / ring.file);
    REQUIRE(model.edges.size() == 1);
    CHECK(model.edges[0].curved());
    CHECK(model.edges[0].source.entity == ring.entity);
    CHECK(model.diagnostics.empty());
    const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
    REQUIRE(frame.members.size() == 1);
    const sg::WireMember& m = frame.members[0];
    CHECK(m.curved);
    // 360 degrees at most 5 degrees per element: 72 elements, 72 distinct nodes.
    REQUIRE(m.nodes.size() == 73);
    CHECK(m.nodes.front() == m.nodes.back());
    CHECK(frame.nodes.size() == 72);
    CHECK(close(frame.nodes[m.nodes.front()], ring.centre + Eigen::Vector3d(ring.radius, 0, 0)));
    for (const std::size_t n : m.nodes) CHECK(std::abs((frame.nodes[n] - ring.centre).norm() - ring.radius) < 1e-9);
    // Elements of 5 degrees: 72 chords of 2 R sin(2.5 deg) (chord of a circular
    // arc, elementary geometry), 0.03 % short of 2 pi R. Nodes sit on the curve
    // sample nearest each 5-degree mark (samples about 0.25 degree apart), which
    // changes the sum of the chords only in the second order: 1e-6 here.
    const double chord = 2.0 * ring.radius * std::sin(2.5 * std::numbers::pi / 180.0);
    CHECK(sg::path_length(frame, m) == Approx(72.0 * chord).epsilon(1e-6));
    CHECK(sg::path_length(frame, m) == Approx(2.0 * std::numbers::pi * ring.radius).epsilon(5e-4));
    CHECK(frame.diagnostics.empty());
  }
}

// mixed_units_assembly.stp: an assembly in mm places a mm part and an inch part.
TEST_CASE("parts declaring different length units in one assembly land in metres", "[step][assembly][units]") {
  const sg::StepModel model = sg::read_step(data / "mixed_units_assembly.stp");
  REQUIRE(model.edges.size() == 2);
  // The column: 3000 mm; the rafter: (100, 0, 50) in at 25.4 mm per inch (the
  // inch as defined in 1959, and in the file), placed 3000 mm along x.
  const sg::WireEdge& column = model.edges[0].source.product == "COLUMN" ? model.edges[0] : model.edges[1];
  const sg::WireEdge& rafter = model.edges[0].source.product == "RAFTER" ? model.edges[0] : model.edges[1];
  CHECK(close(column.start, {0, 0, 0}));
  CHECK(close(column.end, {0, 0, 3}));
  CHECK(close(rafter.start, {3, 0, 0}));
  CHECK(close(rafter.end, {3 + 100 * 0.0254, 0, 50 * 0.0254}));
  CHECK(column.source.assembly_path == "LEAN-TO / column");
  CHECK(rafter.source.assembly_path == "LEAN-TO / rafter");
  CHECK(rafter.source.name == "IPE 200");
  // The first unit declared is the file's; the mix is noted.
  CHECK(model.length_unit == "mm");
  CHECK(count_code(model.diagnostics, "mixed-length-units") == 1);
}

// bay_vertex_shells_mm.stp: vertex shells of a shell-based wireframe name
// column bases, by the vertex point's name or the shell's; one has no label.
TEST_CASE("named or layered vertex shells become labelled points", "[step][shell][points]") {
  const sg::StepModel model = sg::read_step(data / "bay_vertex_shells_mm.stp");
  REQUIRE(model.edges.size() == 4);
  CHECK(model.diagnostics.empty());
  REQUIRE(model.points.size() == 2);
  auto point = [&](const std::string& entity) -> const sg::LabelledPoint& {
    const auto it = std::find_if(model.points.begin(), model.points.end(),
                                 [&](const sg::LabelledPoint& p) { return p.source.entity == entity; });
    REQUIRE(it != model.points.end());
    return *it;
  };
  // Vertex point #66 carries the name and the layer itself.
  CHECK(point("#66").source.name == "BASE-A");
  CHECK(point("#66").source.layers == std::vector<std::string>{"ANCHORS"});
  CHECK(close(point("#66").at, {0, 0, 0}));
  // Vertex #67 takes both from its vertex shell #53; 5000 mm = 5 m.
  CHECK(point("#67").source.name == "BASE-B");
  CHECK(point("#67").source.layers == std::vector<std::string>{"ANCHORS"});
  CHECK(point("#67").source.product == "PLANT-BAY");
  CHECK(close(point("#67").at, {5, 0, 0}));
  // The frame's nodes carry the labels.
  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
  CHECK(frame.members.size() == 4);
  REQUIRE(frame.labels.size() == 2);
  for (const sg::NodeLabel& label : frame.labels)
    CHECK(close(frame.nodes[label.node], label.source.name == "BASE-A" ? Eigen::Vector3d(0, 0, 0)
                                                                        : Eigen::Vector3d(5, 0, 0)));
}

// yard_nested_assembly_mm.stp: YARD places BAY twice, BAY places FRAME twice.
// BAY's second placement is 5000 mm along y; YARD's second turns the bay 90
// degrees about z (axis z, ref_direction y) at (20000, 0, 0), so a bay point
// (x, y, z) lands at (20000 - y, x, z) (ISO 10303-42, axis2_placement_3d).
TEST_CASE("a part placed four times through nested assemblies with a rotation", "[step][assembly]") {
  const sg::StepModel model = sg::read_step(data / "yard_nested_assembly_mm.stp");
  REQUIRE(model.edges.size() == 8);
  struct Expected {
    const char* path;
    Eigen::Vector3d foot, knee, tip;  // column (foot -> knee), beam (knee -> tip), metres
  };
  const std::vector<Expected> expected{
      {"YARD / bay 1 / frame 1", {0, 0, 0}, {0, 0, 3}, {4, 0, 3}},
      {"YARD / bay 1 / frame 2", {0, 5, 0}, {0, 5, 3}, {4, 5, 3}},
      {"YARD / bay 2 / frame 1", {20, 0, 0}, {20, 0, 3}, {20, 4, 3}},
      {"YARD / bay 2 / frame 2", {15, 0, 0}, {15, 0, 3}, {15, 4, 3}},
  };
  for (const Expected& e : expected) {
    CAPTURE(e.path);
    const auto column = std::find_if(model.edges.begin(), model.edges.end(), [&](const sg::WireEdge& w) {
      return w.source.assembly_path == e.path && w.source.name == "column";
    });
    const auto beam = std::find_if(model.edges.begin(), model.edges.end(), [&](const sg::WireEdge& w) {
      return w.source.assembly_path == e.path && w.source.name == "beam";
    });
    REQUIRE(column != model.edges.end());
    REQUIRE(beam != model.edges.end());
    CHECK(close(column->start, e.foot));
    CHECK(close(column->end, e.knee));
    CHECK(close(beam->start, e.knee));
    CHECK(close(beam->end, e.tip));
    CHECK(column->source.entity == "#60");
    CHECK(beam->source.entity == "#61");
    CHECK(beam->source.product == "FRAME");
    CHECK(beam->source.layers == std::vector<std::string>{"S-YARD"});
  }
  // Four instances that touch nowhere: four parts of two members each.
  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
  CHECK(frame.members.size() == 8);
  REQUIRE(count_code(frame.diagnostics, "disconnected-part") == 4);
  for (const sg::Diagnostic& d : frame.diagnostics) {
    CHECK(d.code == "disconnected-part");
    CHECK_THAT(d.message, Catch::Contains("2 members"));
    CHECK(d.entities == std::vector<std::string>{"#60", "#61"});
  }
}

TEST_CASE("surfaces beside the members are skipped with one warning", "[step][bodies]") {
  const sg::StepModel model = sg::read_step(data / "deck_with_plate_mm.stp");
  REQUIRE(model.edges.size() == 2);  // the two beams, none of the plate's three edges
  CHECK(model.edges[0].source.name == "IPE 200");
  REQUIRE(model.diagnostics.size() == 1);
  CHECK(model.diagnostics[0].code == "bodies-skipped");
  CHECK(model.diagnostics[0].severity == sg::Severity::warning);
  CHECK_THAT(model.diagnostics[0].message, Catch::StartsWith("1 solid or surface bodies"));
}

// arc_only_mm.stp: a single half circle of radius 1200 mm, the whole model.
TEST_CASE("a model that is one arc is one curved member", "[step][curves]") {
  const sg::StepModel model = sg::read_step(data / "arc_only_mm.stp");
  REQUIRE(model.edges.size() == 1);
  CHECK(model.edges[0].source.name == "arch");  // its curve set's name
  const sg::Wireframe frame = sg::build_wireframe(model, 1e-3);
  REQUIRE(frame.members.size() == 1);
  REQUIRE(frame.members[0].nodes.size() == 37);  // 180 / 5 = 36 elements
  for (const std::size_t n : frame.members[0].nodes) CHECK(frame.nodes[n].norm() == Approx(1.2).epsilon(1e-9));
  CHECK(frame.diagnostics.empty());
}
