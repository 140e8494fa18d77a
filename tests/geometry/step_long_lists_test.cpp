// Long lists of references (a large frame's SHAPE_REPRESENTATION, its layers)
// are cut before OCCT parses the text and put back after it
// (step_long_lists.hpp): reading a file that way must give exactly what
// OCCT's own parse of the whole text gives. Consistency tests: each compares
// the two ways of reading the same file, no published value is involved.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/step_structure.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "test_support.hpp"

#include <catch2/catch.hpp>

#include <fstream>
#include <limits>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

namespace sg = stepframe::geometry;
using sg::test::ScratchFolder;

namespace {

constexpr std::size_t whole = std::numeric_limits<std::size_t>::max();  // no list cut

// A grid of `n` columns and the beams between them, on three layers, one part:
// OCCT's writer lists every member in one SHAPE_REPRESENTATION and each layer's
// members in one PRESENTATION_LAYER_ASSIGNMENT.
std::vector<sg::LineToWrite> grid(int n) {
  std::vector<sg::LineToWrite> lines;
  for (int i = 0; i < n; ++i) {
    const Eigen::Vector3d base(3.0 * (i % 40), 4.0 * (i / 40), 0.0);
    sg::SourceInfo column;
    column.name = "COL " + std::to_string(i);
    column.layers = {i % 3 == 0 ? "CORNER" : "COLUMNS"};
    column.product = "HALL";
    lines.push_back({base, base + Eigen::Vector3d(0, 0, 5.0), column});
    if (i % 40 != 39) {
      sg::SourceInfo beam;
      beam.name = "BEAM " + std::to_string(i);
      beam.layers = {"BEAMS"};
      beam.product = "HALL";
      lines.push_back({base + Eigen::Vector3d(0, 0, 5.0), base + Eigen::Vector3d(3.0, 0, 5.0), beam});
    }
  }
  return lines;
}

std::string text_of(const std::filesystem::path& file) {
  std::ifstream in(file, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

std::string refusal(const std::filesystem::path& file, std::size_t long_list) {
  try {
    sg::read_step(file, long_list);
  } catch (const sg::StepReadError& e) {
    return e.what();
  }
  return {};
}

}  // namespace

TEST_CASE("a file with long lists of references reads the same with the lists cut and put back", "[step][lists]") {
  ScratchFolder scratch;
  const auto file = scratch.path() / "hall.stp";
  const std::vector<sg::LineToWrite> lines = grid(1200);  // 1200 columns, 1170 beams
  sg::write_step_wireframe(file, lines, "mm");

  // The lists the check notes: the representation of all 2370 curve sets (and its placement), and the
  // layers' (1/3 and 2/3 of the columns, all beams); lists of 100 items or fewer are left alone.
  const sg::StepRewrites found = sg::check_step_structure(text_of(file), "<test>", 100);
  std::size_t representation = 0, layers = 0;
  for (const sg::StepLongList& l : found.long_lists) {
    CAPTURE(l.type, l.items.size());
    if (l.type == "SHAPE_REPRESENTATION" && l.items.size() == lines.size() + 1) ++representation;
    if (l.type == "PRESENTATION_LAYER_ASSIGNMENT") {
      CHECK(l.parameter == 2);
      CHECK((l.items.size() == 400 || l.items.size() == 800 || l.items.size() == 1170));
      ++layers;
    }
  }
  CHECK(representation == 1);
  CHECK(layers == 3);

  const sg::StepModel cut = sg::read_step(file, 100);
  const sg::StepModel parsed_whole = sg::read_step(file, whole);
  sg::test::require_same_model(cut, parsed_whole);
  REQUIRE(cut.edges.size() == lines.size());
  // And what was written comes back: every edge its line's name and layer.
  std::size_t beams = 0;
  for (const sg::WireEdge& e : cut.edges) {
    REQUIRE(e.source.layers.size() == 1);
    const bool is_beam = e.source.name.rfind("BEAM ", 0) == 0;
    CHECK(e.source.layers.front() == (is_beam ? "BEAMS" : e.source.layers.front()));
    beams += is_beam ? 1 : 0;
  }
  CHECK(beams == 1170);
}

TEST_CASE("a long list with an item OCCT refuses is read by OCCT whole, with OCCT's message", "[step][lists]") {
  ScratchFolder scratch;
  const auto file = scratch.path() / "hall.stp";
  sg::write_step_wireframe(file, grid(300), "mm");
  std::string text = text_of(file);
  // The representation's list names the application context in place of one of its items: OCCT's reader
  // refuses the representation; so must the reading with the lists cut, with the same words.
  const std::smatch context = [&] {
    std::smatch m;
    REQUIRE(std::regex_search(text, m, std::regex(R"((#\d+) = APPLICATION_CONTEXT\()")));
    return m;
  }();
  std::smatch rep;
  REQUIRE(std::regex_search(text, rep, std::regex(R"(SHAPE_REPRESENTATION\('[^']*',\(#\d+,(#\d+),)")));
  text.replace(static_cast<std::size_t>(rep.position(1)), static_cast<std::size_t>(rep.length(1)), context.str(1));
  const auto broken = scratch.path() / "broken.stp";
  std::ofstream(broken, std::ios::binary) << text;

  const std::string cut = refusal(broken, 100), parsed_whole = refusal(broken, whole);
  CHECK_THAT(parsed_whole, Catch::Contains("OCCT could not read entity"));
  CHECK(cut == parsed_whole);
}

TEST_CASE("the structure check notes only plain lists of references standing as a parameter", "[step][lists]") {
  const std::string text =
      "#1 = SHAPE_REPRESENTATION('',(#10,#11,#12),#9);\n"     // noted: parameter 1, three references
      "#2 = LAYERED('a',(#10,$,#11));\n"                      // an unset item: not only references
      "#3 = NESTED('b',(#10,(#11,#12),#12));\n"               // a list inside the list
      "#4 = TYPED('c',(#10,LABEL('x'),#11));\n"               // a typed value inside the list
      "#5 = (GEOMETRIC_SET('',(#10,#11,#12)) NAMED(''));\n"   // a complex instance's records
      "#6 = SHORT('',(#10,#11));\n"                           // fewer than three
      "#7 = PRESENTATION_LAYER_ASSIGNMENT('L','',(#10,\n#11,\n#12));\n"  // noted: parameter 2, over three lines
      "#9 = CONTEXT('');\n#10 = P(1.);\n#11 = P(2.);\n#12 = P(3.);\n";
  const sg::StepRewrites found = sg::check_step_structure(text, "<test>", 3);
  REQUIRE(found.long_lists.size() == 2);
  const sg::StepLongList& rep = found.long_lists[0];
  CHECK(rep.entity == 1);
  CHECK(rep.type == "SHAPE_REPRESENTATION");
  CHECK(rep.parameter == 1);
  CHECK(rep.items == std::vector<std::uint64_t>{10, 11, 12});
  CHECK(text.substr(rep.begin, rep.end + 1 - rep.begin) == "(#10,#11,#12)");
  const sg::StepLongList& layer = found.long_lists[1];
  CHECK(layer.entity == 7);
  CHECK(layer.parameter == 2);
  CHECK(layer.items == std::vector<std::uint64_t>{10, 11, 12});
  CHECK(text.substr(layer.begin, layer.end + 1 - layer.begin) == "(#10,\n#11,\n#12)");
}
