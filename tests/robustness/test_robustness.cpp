// Bad and hostile inputs, one line each: what is given to the `stepframe`
// command, the exit status it must give and a fragment its message must hold.
// Every case is also checked to leave no output folder, staging folder or
// lock file behind. A failure names the line's label.

#include <catch2/catch.hpp>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <random>
#include <sstream>
#include <string>
#include <utility>
#include <vector>

#include <sys/stat.h>
#include <sys/wait.h>

namespace {

namespace fs = std::filesystem;

/// The valid starting point every line changes one thing of: a 6 m IPE 300
/// cantilever (tests/data/beam_6m_ipe300_mm.stp) under 1 kN/m.
const std::string base_head =
    "model: beam.stp\n"
    "units: {length: mm, force: kN, line_load: kN/m}\n"
    "rules:\n  - where: {name: \"IPE 300\"}\n    material: S355\n";
const std::string base_supports = "supports:\n  - where: {x: 0}\n    fix: fixed\n";
const std::string base_cases = "cases:\n  - name: W\n    member_loads:\n      - where: {}\n        w: [0, 0, -1]\n";

struct Case {
  std::string label;
  std::string command;    // after `stepframe`: {P} the project, {S} the STEP file, {D} the scratch folder
  std::string project;    // the project file's text; "" = the base project
  std::pair<std::string, std::string> step_edit;  // replace .first by .second in the base STEP text
  int status;
  std::string fragment;   // in stderr or stdout
};

std::string with_supports(const std::string& supports) { return base_head + supports + base_cases; }
std::string with_extra(const std::string& extra) { return base_head + base_supports + base_cases + extra; }
std::string base_project() { return with_extra(""); }
std::string with_load(const std::string& w) {
  return base_head + base_supports + "cases:\n  - name: W\n    member_loads:\n      - where: {}\n        w: [0, 0, " + w +
         "]\n";
}

// The curve of the base file: #33 the curve set, #34 the trimmed curve, #35 its line, #36 and #37 the
// line's point and direction vector, #40 the far end point.
const std::string curve_set = "#33 = GEOMETRIC_CURVE_SET('IPE 300',(#34));";
const std::string line_entity = "#35 = LINE('',#36,#37);";
const std::string far_end = "#40 = CARTESIAN_POINT('',(6.E+03,0.,0.));";

const std::string run = "run {P} --out {D}/out";

const std::vector<Case> cases = {
    // label | command | project | STEP edit | status | message fragment
    {"valid base project passes", run, "", {}, 0, "PASS"},
    // STEP exchange structure (checked before OCCT parses it)
    {"reference to an absent entity", run, "", {line_entity, "#35 = LINE('',#99998,#37);"}, 2, "#99998"},
    {"dangling basis curve", run, "", {"TRIMMED_CURVE('',#35,", "TRIMMED_CURVE('',#77777,"}, 2, "refers to #77777"},
    {"line whose point is the line", run, "", {line_entity, "#35 = LINE('',#35,#37);"}, 2, "#35 (line"},
    {"curve set listing itself", run, "", {curve_set, "#33 = GEOMETRIC_CURVE_SET('IPE 300',(#34,#33));"}, 2,
     "refers to itself"},
    {"reference cycle through three entities", run, "", {"#38 = DIRECTION('',(1.,0.,0.));", "#38 = VECTOR('',#35,1.);"},
     2, "refers back to itself through"},
    {"100000 nested parentheses", run, "",
     {far_end, "#40 = CARTESIAN_POINT(''," + std::string(100000, '(') + std::string(100000, ')') + ");"}, 2,
     "nest more than 100 levels"},
    {"NAN coordinate", run, "", {far_end, "#40 = CARTESIAN_POINT('',(NAN,0.,0.));"}, 2, "'NAN' stands where a value"},
    {"INF coordinate", run, "", {far_end, "#40 = CARTESIAN_POINT('',(INF,0.,0.));"}, 2, "'INF' stands where a value"},
    {"1E400 coordinate", run, "", {far_end, "#40 = CARTESIAN_POINT('',(1.E400,0.,0.));"}, 2,
     "1.E400 is beyond the range"},
    {"entity defined twice", run, "", {line_entity, line_entity + "\n#35 = LINE('',#36,#37);"}, 2,
     "#35 is defined twice"},
    {"parameter list not closed", run, "", {far_end, "#40 = CARTESIAN_POINT('',(6.E+03,0.,0.);"}, 2, "not closed"},
    // Found by fuzz_step_import (tests/data/fuzz/): OCCT crashes on an empty list in many entities,
    // and a NUL byte inside a keyword makes it read another entity than the one written.
    {"empty list in a direction", run, "", {"#38 = DIRECTION('',(1.,0.,0.));", "#38 = DIRECTION('',());"}, 2,
     "#38 (line 55): an empty list '()' in DIRECTION"},
    {"NUL bytes inside a keyword", run, "", {curve_set, std::string("#33 = GEOMETRIC_CURVE_SET\0\0('IPE 300',(#34));", 45)},
     2, "#33 (line 49): the text holds a control character (byte 0x00)"},
    {"unknown type where the assembly expects a representation", run, "",
     {"#10 = SHAPE_REPRESENTATION(", "#10 = SHAPPE_REPRESENTATION("}, 2,
     "OCCT could not read entity #3 (StepShape_ShapeDefinitionRepresentation"},
    {"a line whose point is a vector", run, "", {line_entity, "#35 = LINE('',#37,#37);"}, 2,
     "OCCT could not read entity #35 (StepGeom_Line: Parameter n0.2 (pnt) : Entity has illegal type)"},
    {"stray character after an entity number", run, "", {line_entity, "#35] = LINE('',#36,#37);"}, 2,
     "the character ']' cannot stand there"},
    {"missing comma between two parameters", run, "", {line_entity, "#35 = LINE(''#36,#37);"}, 2,
     "#35 (line 52): two parameters follow each other without a ',' between them"},
    {"malformed number in a point", run, "", {far_end, "#40 = CARTESIAN_POINT('',(6000..0.,0.,0.));"}, 2,
     "'6000..0.' is not a number as ISO 10303-21 writes one"},
    {"stray double quote before an entity number", run, "", {line_entity, "\"35 = LINE('',#36,#37);"}, 2,
     "line 52: a binary value outside any parameter list"},
    {"stray character in a binary value", run, "", {line_entity, "#35 = LINE('',#36,#37,\"0F A\");"}, 2,
     "#35 (line 52): a binary value (after '\"', line 52) holds the character ' ', not a hexadecimal digit"},
    {"comma inside an entity's keyword", run, "", {line_entity, "#35 = LI,NE('',#36,#37);"}, 2,
     "#35 (line 52): a ',' outside any parameter list; an entity instance is written #12 = KEYWORD(...);"},
    {"equals sign inside an entity's keyword", run, "", {line_entity, "#35 = L=INE('',#36,#37);"}, 2,
     "#35 (line 52): an '=' after anything but #12"},
    {"semicolon missing after an entity", run, "", {line_entity, "#35 = LINE('',#36,#37)"}, 2,
     "begins before a ';' ends #35"},
    // Tokens longer than OCCT's lexer reads (16382 characters): strings are cut, anything else refused.
    {"50000-character name cut with a warning", run,
     base_head.substr(0, base_head.find("rules:")) + "rules:\n  - where: {}\n    material: S355\n" + base_supports +
         base_cases,
     {curve_set, "#33 = GEOMETRIC_CURVE_SET('IPE 300 " + std::string(50000 - 8, 'x') + "',(#34));"}, 0,
     "a string of #33 (line 49) is 50000 characters long"},
    {"20000-character keyword", run, "", {far_end, "#40 = " + std::string(20000, 'P') + "('',(6.E+03,0.,0.));"}, 2,
     "#40 (line 57): a keyword, number or reference of more than 16000 characters"},
    {"escaped quote followed by a comma in a name", run,
     base_head.substr(0, base_head.find("rules:")) +
         "rules:\n  - where: {name: \"IPE 300 'A', east\"}\n    section: IPE300\n    material: S355\n" +
         base_supports + base_cases,
     {curve_set, "#33 = GEOMETRIC_CURVE_SET('IPE 300 ''A'', east',(#34));"}, 0, "PASS"},
    // Project file: what it is
    {"project is a folder", "run {D}", "", {}, 2, "directory"},
    {"project is a folder (inspect)", "inspect {D}/folder.yaml", "<folder>", {}, 2, "is a folder"},
    {"project is a FIFO", run, "<fifo>", {}, 2, "not a regular file"},
    {"project of 17 MiB", run, "<huge>", {}, 2, "more than the 16 MiB"},
    {"invalid UTF-8", run, base_project() + "# caf\xe9\n", {}, 2, "is not UTF-8"},
    {"duplicate top-level key", run, base_project() + "model: other.stp\n", {}, 2, "'model' appears a second time"},
    {"duplicate nested key", run, with_supports("supports:\n  - where: {x: 0}\n    fix: fixed\n    fix: pinned\n"), {},
     2, "'fix' appears a second time"},
    {"list as a key", run, base_project() + "? [a, b]\n: 1\n", {}, 2, "a key must be a plain name"},
    {"not YAML", run, "model: [beam.stp\n", {}, 2, "not valid YAML"},
    // Project file: numbers out of range
    {"merge_tolerance 1e9", run, base_project() + "merge_tolerance: 1e9\n", {}, 2, "at most 1 m"},
    {"merge_tolerance nan", run, base_project() + "merge_tolerance: nan\n", {}, 2, "merge_tolerance"},
    {"combination factor 1e308", run, with_extra("combinations:\n  - name: C\n    factors: {W: 1e308}\n"), {}, 2,
     "between -100 and 100"},
    {"spring 1e300", run,
     with_supports("supports:\n  - where: {x: 0}\n    fix: [ux, uy, uz, rx]\n    springs: {ry: 1e300, rz: 1e300}\n"),
     {}, 2, "above 1e15"},
    {"section A = 1e-300 (range)", run,
     "model: beam.stp\nunits: {length: mm, force: kN, line_load: kN/m}\n"
     "sections:\n  S: {A: 1e-300, Iy: 8e7, Iz: 6e6, J: 2e5, depth: 300, width: 150}\n"
     "rules:\n  - where: {}\n    section: S\n    material: S355\n" +
         base_supports + base_cases,
     {}, 2, "outside the plausible range"},
    {"load 1e308 kN: beyond the double range", run,
     with_load("-1e308"), {}, 2, "not a finite number"},
    {"load 1e300 kN/m: results not finite", run, with_load("-1e300"), {}, 2,
     "not finite (NaN or infinity)"},
    {"10001 load cases refused by count", run, "<many-cases>", {}, 2, "more than the 10000"},
    {"point mass 1e12 kg", run, with_extra("masses:\n  - {near: [6000, 0, 0], mass: 1e12}\n"), {}, 2, "at most 10000 t"},
    {"psi factor 1.5", run,
     base_head + base_supports + "cases:\n  - {name: G, category: permanent, self_weight: true}\n"
                 "  - {name: W, category: wind, psi: [1.5, 0.2, 0]}\n",
     {}, 2, "between 0 and 1"},
    {"modes 1e9", run, with_extra("analysis: {modes: 1e9}\n"), {}, 2, "from 0 (no natural frequencies) to 200"},
    {"area load without a unit", run,
     base_head + base_supports + "cases:\n  - name: W\n    area_loads: [{pressure: 2.5, plane: {z: 0}}]\n", {}, 2,
     "with its unit"},
    {"checks.aisc360.method not LRFD or ASD", run, with_extra("checks:\n  aisc360: {method: LSD}\n"), {}, 2,
     "expected LRFD"},
    // Selectors
    {"(a+)+b on a long name does not hang", run,
     base_head.substr(0, base_head.find("rules:")) + "rules:\n  - where: {name: \"(a+)+b\"}\n    material: S355\n" +
         base_supports + base_cases,
     {curve_set, "#33 = GEOMETRIC_CURVE_SET('" + std::string(2000, 'a') + "',(#34));"}, 2, "no section"},
    {"back-reference refused", run,
     base_head.substr(0, base_head.find("rules:")) + "rules:\n  - where: {name: \"(a)\\\\1\"}\n    material: S355\n" +
         base_supports + base_cases,
     {}, 2, "not a valid regular expression"},
    // Command line
    {"--tolerance -1", "inspect {S} --tolerance -1", "", {}, 2, "merge tolerance"},
    {"--tolerance nan", "inspect {S} --tolerance nan", "", {}, 2, "merge tolerance"},
    {"--tolerance 1e9", "inspect {S} --tolerance 1e9", "", {}, 2, "at most 1000"},
    // Revisions, fabrication, suggestions
    {"compare: a side that is not there", "compare {P} {D}/absent --out {D}/cmp", "", {}, 2, "absent: not found"},
    {"compare: a side that is not results.json", "compare {P} {S} --out {D}/cmp", "", {}, 2, "not valid JSON"},
    {"run --baseline that is not there", "run {P} --out {D}/out --baseline {D}/absent", "", {}, 2, "--baseline"},
    {"fabrication: camber of an unknown case", run, with_extra("fabrication:\n  camber: {load: DEAD}\n"), {}, 2,
     "fabrication.camber.load"},
    {"fabrication: lifting points out of order", run,
     with_extra("fabrication:\n  lifting: {points: [0.8, 0.2]}\n"), {}, 2, "0 <= a < b <= 1"},
    {"suggest: a section list naming nothing", "suggest {P} --out {D}/sug", with_extra("suggest:\n  sections: [XYZ]\n"),
     {}, 2, "neither a catalogue family"},
    // Output folder
    {"output folder holding other files", "run {P} --out {D}/notes", "<notes>", {}, 2, "not stepframe results"},
    {"output folder that cannot be made", "run {P} --out /sys/stepframe-robustness", "", {}, 2, "not writable"},
    {"output path is a file", "run {P} --out {D}/beam.stp", "", {}, 2, "not a folder"},
};

std::string read_text(const fs::path& file) {
  std::ifstream in(file, std::ios::binary);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

void write_text(const fs::path& file, const std::string& text) { std::ofstream(file, std::ios::binary) << text; }

std::string replace_all(std::string text, const std::string& what, const std::string& with) {
  for (std::size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + with.size()))
    text.replace(at, what.size(), with);
  return text;
}

}  // namespace

TEST_CASE("robustness: every bad input gives its status and message and leaves no output") {
  const auto& c = GENERATE(from_range(cases));
  SECTION(c.label) {
    std::random_device random;
    const fs::path dir = fs::temp_directory_path() / ("stepframe-robustness-" + std::to_string(random()));
    fs::create_directories(dir);
    std::string step = read_text(fs::path(STEPFRAME_TEST_DATA) / "beam_6m_ipe300_mm.stp");
    REQUIRE(!step.empty());
    if (!c.step_edit.first.empty()) {
      const auto at = step.find(c.step_edit.first);
      REQUIRE(at != std::string::npos);
      step.replace(at, c.step_edit.first.size(), c.step_edit.second);
    }
    write_text(dir / "beam.stp", step);
    fs::path project = dir / "p.yaml";
    if (c.project == "<fifo>") {
      REQUIRE(::mkfifo(project.c_str(), 0644) == 0);
    } else if (c.project == "<folder>") {
      fs::create_directories(dir / "folder.yaml");
    } else if (c.project == "<huge>") {
      write_text(project, base_project() + "# " + std::string(17u << 20, 'x') + "\n");
    } else if (c.project == "<many-cases>") {
      std::string text = base_head + base_supports + "cases:\n";
      for (int i = 0; i < 10001; ++i) text += "  - {name: C" + std::to_string(i) + "}\n";
      write_text(project, text);
    } else if (c.project == "<notes>") {
      write_text(project, base_project());
      fs::create_directories(dir / "notes");
      write_text(dir / "notes" / "notes.txt", "keep me");
    } else {
      write_text(project, c.project.empty() ? base_project() : c.project);
    }
    std::string command = replace_all(c.command, "{P}", "\"" + project.string() + "\"");
    command = replace_all(command, "{S}", "\"" + (dir / "beam.stp").string() + "\"");
    command = replace_all(command, "{D}", dir.string());
    const std::string full = std::string("\"") + STEPFRAME_EXE + "\" " + command + " >\"" +
                             (dir / "stdout.txt").string() + "\" 2>\"" + (dir / "stderr.txt").string() + "\"";
    const int raw = std::system(full.c_str());
    const int status = WIFEXITED(raw) ? WEXITSTATUS(raw) : -1;
    const std::string out = read_text(dir / "stdout.txt"), err = read_text(dir / "stderr.txt");
    INFO("stepframe " << command << "\nstdout: " << out.substr(0, 2000) << "\nstderr: " << err.substr(0, 2000));
    CHECK(status == c.status);
    CHECK((out.find(c.fragment) != std::string::npos || err.find(c.fragment) != std::string::npos));
    if (c.status >= 2) {
      CHECK_FALSE(fs::exists(dir / "out"));  // no half-written output
      if (c.project == "<notes>") CHECK(read_text(dir / "notes" / "notes.txt") == "keep me");
    }
    for (const auto& entry : fs::directory_iterator(dir))  // no staging folder or lock left
      CHECK(entry.path().filename().string().find(".stepframe-") == std::string::npos);
    std::error_code ec;
    fs::remove_all(dir, ec);
  }
}
