// A large wireframe's STEP file read in two processes at once (each half of the members in one; see
// geometry/src/step_split.hpp) must give exactly what the whole read gives: the same edges in the same
// order with the same attributes and curve samples, the same labelled points and findings. Where the
// file's structure does not allow that, the text is not split, or the parts are not joined, and the
// file is read whole. Consistency tests: each compares the two ways of reading the same file; no
// published value is involved.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "step_model_bytes.hpp"
#include "step_split.hpp"
#include "test_support.hpp"

#include <catch2/catch.hpp>

#include <spdlog/fmt/fmt.h>
#include <spdlog/sinks/ringbuffer_sink.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <csignal>
#include <memory>
#include <utility>

#include <filesystem>
#include <fstream>
#include <optional>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;
namespace sd = stepframe::geometry::detail;
using sg::test::ScratchFolder;

namespace {

// Reads with the lists of `long_list` references or more cut, in two processes from `from` members.
sg::StepModel read_split(const std::filesystem::path& file, std::size_t from, std::size_t long_list = 4) {
  sg::StepReadOptions options;
  options.long_list = long_list;
  options.two_processes_from = from;
  return sg::read_step(file, options);
}

// As read_split, and whether the model was joined from two processes' halves (the read logs it).
std::pair<sg::StepModel, bool> read_split_logged(const std::filesystem::path& file, std::size_t from,
                                                 std::size_t long_list = 4) {
  const auto sink = std::make_shared<spdlog::sinks::ringbuffer_sink_mt>(64);
  auto& sinks = spdlog::default_logger()->sinks();
  sinks.push_back(sink);
  sg::StepModel model = read_split(file, from, long_list);
  sinks.pop_back();
  const std::vector<std::string> lines = sink->last_formatted();
  const bool joined = std::any_of(lines.begin(), lines.end(), [](const std::string& line) {
    return line.find("read in two processes") != std::string::npos;
  });
  return {std::move(model), joined};
}

std::filesystem::path write(const std::filesystem::path& file, const std::string& text) {
  std::ofstream(file, std::ios::binary) << text;
  return file;
}

// What may be changed in the invented frame below to test a refusal.
struct Variant {
  bool share_point = false;         // the first post of the second half stands on a foot of the first half
  bool zero_length = false;         // a post of the second half ends where it starts
  bool style_across = false;        // one styled item names a member of each half
  bool second_usage = false;        // a second assembly usage of the part
  bool loose_curve = false;         // a curve outside the members' representation
  bool broken_line = false;         // a line of the second half names a direction for its vector
};

// An invented yard of `n` posts in one part placed in an assembly, in millimetres: every third post an
// arc, every post's foot a named trimming point, every fourth post styled in a colour, all on layer
// POSTS, the second half also on layer EAST; the styled items listed by a presentation representation.
std::string yard(int n, const Variant& v = {}) {
  std::string data = R"(#1 = APPLICATION_CONTEXT('core data for automotive mechanical design processes');
#2 = APPLICATION_PROTOCOL_DEFINITION('international standard','automotive_design',2000,#1);
#3 = PRODUCT_CONTEXT('',#1,'mechanical');
#4 = PRODUCT('POSTS','POSTS','',(#3));
#5 = PRODUCT_DEFINITION_FORMATION('','',#4);
#6 = PRODUCT_DEFINITION_CONTEXT('part definition',#1,'design');
#7 = PRODUCT_DEFINITION('design','',#5,#6);
#8 = PRODUCT_DEFINITION_SHAPE('','',#7);
#9 = SHAPE_DEFINITION_REPRESENTATION(#8,#20);
#10 = ( LENGTH_UNIT() NAMED_UNIT(*) SI_UNIT(.MILLI.,.METRE.) );
#11 = ( NAMED_UNIT(*) PLANE_ANGLE_UNIT() SI_UNIT($,.RADIAN.) );
#12 = ( NAMED_UNIT(*) SI_UNIT($,.STERADIAN.) SOLID_ANGLE_UNIT() );
#13 = UNCERTAINTY_MEASURE_WITH_UNIT(LENGTH_MEASURE(1.E-07),#10,'distance_accuracy_value','');
#14 = ( GEOMETRIC_REPRESENTATION_CONTEXT(3) GLOBAL_UNCERTAINTY_ASSIGNED_CONTEXT((#13))
GLOBAL_UNIT_ASSIGNED_CONTEXT((#10,#11,#12)) REPRESENTATION_CONTEXT('','') );
#15 = CARTESIAN_POINT('',(0.,0.,0.));
#16 = DIRECTION('',(0.,0.,1.));
#17 = DIRECTION('',(1.,0.,0.));
#18 = AXIS2_PLACEMENT_3D('',#15,#16,#17);
#30 = PRODUCT('YARD','YARD','',(#3));
#31 = PRODUCT_DEFINITION_FORMATION('','',#30);
#32 = PRODUCT_DEFINITION('design','',#31,#6);
#33 = PRODUCT_DEFINITION_SHAPE('','',#32);
#34 = SHAPE_DEFINITION_REPRESENTATION(#33,#35);
#35 = SHAPE_REPRESENTATION('',(#18,#36),#14);
#36 = AXIS2_PLACEMENT_3D('',#37,#16,#17);
#37 = CARTESIAN_POINT('',(500.,0.,0.));
#38 = NEXT_ASSEMBLY_USAGE_OCCURRENCE('1','post row','',#32,#7,$);
#39 = ( REPRESENTATION_RELATIONSHIP('','',#20,#35) REPRESENTATION_RELATIONSHIP_WITH_TRANSFORMATION(#40)
SHAPE_REPRESENTATION_RELATIONSHIP() );
#40 = ITEM_DEFINED_TRANSFORMATION('','',#18,#36);
#41 = PRODUCT_DEFINITION_SHAPE('','',#38);
#42 = CONTEXT_DEPENDENT_SHAPE_REPRESENTATION(#39,#41);
)";
  std::vector<std::string> sets, east, styled;
  for (int k = 0; k < n; ++k) {
    const int b = 100 + 20 * k;
    const double x = 2000.0 * k;
    const bool second = k >= (n + 1) / 2;
    sets.push_back(fmt::format("#{}", b));
    if (second) east.push_back(fmt::format("#{}", b));
    data += fmt::format("#{} = GEOMETRIC_CURVE_SET('post {}',(#{}));\n", b, k, b + 1);
    if (k % 3 == 2) {
      data += fmt::format(
          "#{} = TRIMMED_CURVE('',#{},(PARAMETER_VALUE(0.)),(PARAMETER_VALUE(1.5707963267949)),.T.,.PARAMETER.);\n"
          "#{} = CIRCLE('',#{},1500.);\n#{} = AXIS2_PLACEMENT_3D('',#{},#{},#{});\n"
          "#{} = CARTESIAN_POINT('',({},0.,0.));\n#{} = DIRECTION('',(0.,1.,0.));\n#{} = DIRECTION('',(1.,0.,0.));\n",
          b + 1, b + 2, b + 2, b + 8, b + 8, b + 3, b + 5, b + 9, b + 3, x, b + 5, b + 9);
    } else {
      // Sharing: the first post of the second half stands on the foot point of the first half's last
      // straight post.
      int shared = (n + 1) / 2 - 1;
      while (shared % 3 == 2) --shared;
      const std::string foot = fmt::format("#{}", v.share_point && k == (n + 1) / 2 ? 100 + 20 * shared + 6 : b + 6);
      const double top = v.zero_length && k == n - 2 ? 0.0 : 3000.0;  // n - 2: a straight post (n = 30)
      data += fmt::format(
          "#{} = TRIMMED_CURVE('',#{},({}),(#{}),.T.,.CARTESIAN.);\n#{} = LINE('',#{},#{});\n"
          "#{} = CARTESIAN_POINT('',({},0.,0.));\n#{} = VECTOR('',#{},1.);\n#{} = DIRECTION('',(0.,0.,1.));\n"
          "#{} = CARTESIAN_POINT('foot {}',({},0.,0.));\n#{} = CARTESIAN_POINT('',({},0.,{}));\n",
          b + 1, b + 2, foot, b + 7, b + 2, b + 3, v.broken_line && k == n - 2 ? b + 5 : b + 4, b + 3, x, b + 4, b + 5,
          b + 5, b + 6, k, x, b + 7, x, top);
    }
    if (k % 4 == 1) {
      styled.push_back(fmt::format("#{}", b + 10));
      data += fmt::format(
          "#{} = STYLED_ITEM('',(#{}),#{});\n#{} = PRESENTATION_STYLE_ASSIGNMENT((#{}));\n"
          "#{} = CURVE_STYLE('',#{},POSITIVE_LENGTH_MEASURE(0.1),#{});\n"
          "#{} = DRAUGHTING_PRE_DEFINED_CURVE_FONT('continuous');\n#{} = COLOUR_RGB('',0.8,{:.1f},0.1);\n",
          b + 10, b + 11, b + 1, b + 11, b + 12, b + 12, b + 13, b + 14, b + 13, b + 14, 0.1 * (k % 7));
    }
  }
  if (v.style_across) {
    // A style of the first member overriding the styled item of the last: one entity naming members of
    // both halves, not through a list.
    const int last = 100 + 20 * (n - 1);
    REQUIRE((n - 1) % 4 == 1);
    data += fmt::format("#90 = OVER_RIDING_STYLED_ITEM('',(#131),#101,#{});\n", last + 10);
  }
  const auto join = [](const std::vector<std::string>& ids) {
    std::string out;
    for (const std::string& id : ids) out += (out.empty() ? "" : ",") + id;
    return out;
  };
  data += fmt::format("#20 = GEOMETRICALLY_BOUNDED_WIREFRAME_SHAPE_REPRESENTATION('',(#18,{}),#14);\n", join(sets));
  data += fmt::format("#21 = PRESENTATION_LAYER_ASSIGNMENT('POSTS','',({}));\n", join(sets));
  data += fmt::format("#22 = PRESENTATION_LAYER_ASSIGNMENT('EAST','',({}));\n", join(east));
  data += fmt::format("#23 = MECHANICAL_DESIGN_GEOMETRIC_PRESENTATION_REPRESENTATION('',({}),#14);\n", join(styled));
  if (v.second_usage) data += "#24 = NEXT_ASSEMBLY_USAGE_OCCURRENCE('2','post row again','',#32,#7,$);\n";
  if (v.loose_curve)
    data += "#25 = GEOMETRIC_CURVE_SET('loose',(#26));\n#26 = POLYLINE('',(#15,#37));\n";
  return "ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION(('invented post yard'),'2;1');\n"
         "FILE_NAME('yard.stp','2026-12-05T00:00:00',(''),(''),'','','');\n"
         "FILE_SCHEMA(('AUTOMOTIVE_DESIGN { 1 0 10303 214 1 1 1 1 }'));\nENDSEC;\nDATA;\n" +
         data + "ENDSEC;\nEND-ISO-10303-21;\n";
}

}  // namespace

TEST_CASE("a wireframe read in two processes gives exactly what the whole read gives", "[step][two-processes]") {
  ScratchFolder scratch;
  const std::string text = yard(30);
  const auto file = write(scratch.path() / "yard.stp", text);

  // The text splits: each half keeps its own members, styled items and layer entries.
  const std::optional<std::string> first = sd::step_split_part(text, 20, 0), second = sd::step_split_part(text, 20, 1);
  REQUIRE(first);
  REQUIRE(second);
  const sg::StepModel whole = sg::read_step(file);
  const sg::StepModel one = sg::read_step_text(*first, "one"), other = sg::read_step_text(*second, "other");
  CHECK(one.edges.size() == 15);
  CHECK(other.edges.size() == 15);
  CHECK(one.edges.size() + other.edges.size() == whole.edges.size());

  // Read in two processes (30 members, from 20 on): every edge, point and finding the same, bit for bit.
  const auto [joined, two] = read_split_logged(file, 20);
  CHECK(two);
  sg::test::require_same_model(joined, whole);
  // And the frame has what the test means it to have: arcs, colours, named feet, both layers, a product
  // placed in an assembly.
  std::size_t arcs = 0, coloured = 0, east = 0;
  for (const sg::WireEdge& e : joined.edges) {
    arcs += e.curved() ? 1 : 0;
    coloured += e.source.colour.empty() ? 0 : 1;
    east += e.source.layers.size() == 2 ? 1 : 0;
    CHECK(e.source.product == "POSTS");
    CHECK(e.source.assembly_path == "YARD / post row");
  }
  CHECK(arcs == 10);
  CHECK(coloured == 8);
  CHECK(east == 15);
  CHECK(joined.points.size() == 20);
  // Fewer members than asked for: read whole.
  const auto [alone, split] = read_split_logged(file, 31);
  CHECK_FALSE(split);
  sg::test::require_same_model(alone, whole);
}

TEST_CASE("a frame whose halves cannot be read apart exactly is read whole", "[step][two-processes]") {
  ScratchFolder scratch;
  struct Case {
    const char* what;
    Variant variant;
    bool splits;  // whether the text splits (the parts may still not join)
  };
  const std::vector<Case> cases{
      {"members of both halves share a point", {.share_point = true}, false},
      {"a styled item names members of both halves", {.style_across = true}, false},
      {"the part is placed twice", {.second_usage = true}, false},
      {"a curve lies outside the members", {.loose_curve = true}, false},
      {"a member of the second half has no length", {.zero_length = true}, true},
  };
  for (const Case& c : cases) {
    CAPTURE(c.what);
    const std::string text = yard(30, c.variant);
    CHECK(sd::step_split_part(text, 20, 0).has_value() == c.splits);
    const auto file = write(scratch.path() / "yard.stp", text);
    const auto [model, two] = read_split_logged(file, 20);
    CHECK_FALSE(two);
    sg::test::require_same_model(model, sg::read_step(file));
    if (c.variant.zero_length)
      CHECK(std::any_of(model.diagnostics.begin(), model.diagnostics.end(),
                        [](const sg::Diagnostic& d) { return d.code == "zero-length-edge"; }));
  }
  // The child's half fails to read (OCCT refuses a line of it) while this process's half reads: the file
  // is read whole, and refused as the whole read refuses it, word for word.
  Variant broken;
  broken.broken_line = true;
  const std::string text = yard(30, broken);
  REQUIRE(sd::step_split_part(text, 20, 1).has_value());
  const auto file = write(scratch.path() / "broken.stp", text);
  std::string refused;
  try {
    sg::read_step(file);
  } catch (const sg::StepReadError& e) {
    refused = e.what();
  }
  CHECK_THAT(refused, Catch::Contains("OCCT could not read entity"));
  CHECK_THROWS_WITH(read_split(file, 20), refused);
}

TEST_CASE("a process whose children are reaped for it reads the file whole", "[step][two-processes]") {
  // With SIGCHLD ignored the system collects the child itself: its exit status is lost, so its half is
  // not trusted and the whole text is read (POSIX, waitpid: ECHILD when children are not kept).
  ScratchFolder scratch;
  const auto file = write(scratch.path() / "yard.stp", yard(30));
  const sg::StepModel whole = sg::read_step(file);
  const auto before = std::signal(SIGCHLD, SIG_IGN);
  const auto [model, two] = read_split_logged(file, 20);
  std::signal(SIGCHLD, before);
  CHECK_FALSE(two);
  sg::test::require_same_model(model, whole);
  // With SIGCHLD as it was, the same file is joined from its halves.
  CHECK(read_split_logged(file, 20).second);
}

TEST_CASE("a large written wireframe is read in two processes as it is read whole", "[step][two-processes]") {
  // OCCT's own writer's layout (write_step_wireframe): one part in an assembly, names and layers.
  ScratchFolder scratch;
  std::vector<sg::LineToWrite> lines;
  for (int i = 0; i < 1500; ++i) {
    sg::SourceInfo s;
    s.name = fmt::format("M{}", i);
    s.layers = {i % 5 == 0 ? "BRACING" : "COLUMNS"};
    s.product = "SHED";
    const Eigen::Vector3d a(6.0 * (i % 30), 5.0 * (i / 30), 0.0);
    lines.push_back({a, a + Eigen::Vector3d(0.5, 0.25, 4.0), s});
  }
  const auto file = scratch.path() / "shed.stp";
  sg::write_step_wireframe(file, lines, "mm");
  REQUIRE(sd::step_split_part(sg::test::read_text(file), 1000, 1).has_value());
  const sg::StepModel whole = sg::read_step(file);
  REQUIRE(whole.edges.size() == 1500);
  const auto [joined, two] = read_split_logged(file, 1000, sg::long_step_list);
  CHECK(two);
  sg::test::require_same_model(joined, whole);
}

TEST_CASE("every test file reads the same whether or not it may be read in two processes", "[step][two-processes]") {
  // The test files are small frames whose members share points (a post's top is a rafter's end): none
  // splits, so each is read whole either way, with the same model or the same refusal.
  for (const auto& entry : std::filesystem::directory_iterator(STEPFRAME_TEST_DATA)) {
    if (entry.path().extension() != ".stp") continue;
    CAPTURE(entry.path().filename().string());
    std::optional<sg::StepModel> whole;
    std::string refused;
    try {
      whole = sg::read_step(entry.path());
    } catch (const sg::StepReadError& e) {
      refused = e.what();
    }
    if (!whole) {
      CHECK_THROWS_WITH(read_split(entry.path(), 2, 2), refused);
      continue;
    }
    sg::test::require_same_model(read_split(entry.path(), 2, 2), *whole);
  }
}

TEST_CASE("a model sent as bytes comes back the same, and a cut message is refused", "[step][two-processes]") {
  const std::string text = yard(12);
  sd::ModelWithMessages sent{sg::read_step_text(text, "yard"), {"a message", ""}};
  sent.model.diagnostics.push_back({sg::Severity::warning, "code", "message", {"#1", "#2"}, Eigen::Vector3d(1, 2, 3)});
  const std::string bytes = sd::to_bytes(sent);
  const std::optional<sd::ModelWithMessages> back = sd::from_bytes(bytes);
  REQUIRE(back);
  sg::test::require_same_model(back->model, sent.model);
  CHECK(back->occt_messages == sent.occt_messages);
  for (std::size_t cut : {std::size_t{0}, std::size_t{7}, bytes.size() / 2, bytes.size() - 1})
    CHECK_FALSE(sd::from_bytes(std::string_view(bytes).substr(0, cut)).has_value());
  CHECK_FALSE(sd::from_bytes(bytes + "x").has_value());
}
