// The embedding API: projects from text or built in code, model sources,
// progress, cancellation, log routing and results as values.

#include "stepframe/analysis/section.hpp"
#include "stepframe/geometry/occt_sources.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/stepframe.hpp"
#include "stepframe/tables.hpp"
#include "test_helpers.hpp"

#include <BRepBuilderAPI_MakeEdge.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <TDocStd_Document.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Edge.hxx>
#include <XCAFApp_Application.hxx>
#include <catch2/catch.hpp>
#include <gp_Pnt.hxx>
#include <spdlog/sinks/ostream_sink.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <atomic>
#include <cmath>
#include <sstream>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

constexpr double span = 6.0;  // m
constexpr double E = 210e9;   // Pa, EN 1993-1-1 3.2.6
constexpr double w = 10e3;    // N/m

/// One 6 m edge along X named "IPE 300" on layer BEAMS, in millimetres.
void write_beam(const std::filesystem::path& file) {
  geometry::LineToWrite line{{0, 0, 0}, {span, 0, 0}, {}};
  line.attributes.name = "IPE 300";
  line.attributes.layers = {"BEAMS"};
  geometry::write_step_wireframe(file, {line}, "mm");
}

/// The same simply supported beam as a project file (pin + roller, twist held at both ends).
const char* beam_yaml = R"(model: beam.stp
units: {length: m, force: kN, stress: MPa, line_load: kN/m}
rules:
  - where: {}
    material: S355
supports:
  - where: {x: 0}
    fix: [ux, uy, uz, rx]
  - where: {x: 6}
    fix: [uy, uz, rx]
cases:
  - name: W
    member_loads:
      - where: {layer: BEAMS}
        w: [0, 0, -10]
checks:
  stress: {combinations: [W]}
)";

/// The same project built in code (SI values).
Project beam_project(const std::filesystem::path& step) {
  CaseSpec load;
  load.name = "W";
  MemberLoadSpec udl;
  udl.where.layer = "BEAMS";
  udl.w = {0, 0, -w};
  load.member_loads.push_back(udl);
  NodeSelector start, end;
  start.x = 0.0;
  end.x = span;
  MemberSelector every;
  return ProjectBuilder("beam (built in code)")
      .model(step)
      .rule(every, std::nullopt, "S355")
      .support(start, {true, true, true, true, false, false})
      .support(end, {false, true, true, true, false, false})
      .load_case(load)
      .check_stress({"W"})
      .build();
}

double midspan_deflection(const nlohmann::json& results) {
  return results["results"][0]["members"][0]["max_local_deflection"].get<double>();
}

}  // namespace

TEST_CASE("a project built in code and the same project as text give the handbook beam") {
  // Midspan deflection 5 w L^4 / (384 E I) and moment w L^2 / 8: simply supported beam
  // under uniform load, Roark's Formulas for Stress and Strain, Table 8.1 case 2e.
  test::ScratchDir dir;
  write_beam(dir / "beam.stp");
  const auto ipe300 = analysis::find_catalogue_section("IPE300");
  REQUIRE(ipe300);
  const double expected_deflection = 5 * w * std::pow(span, 4) / (384 * E * ipe300->Iy);
  const double expected_stress = w * span * span / 8 / ipe300->Wy();

  const auto built = run(beam_project(dir / "beam.stp"));
  INFO(built.message());
  REQUIRE(built.status() == ExitStatus::pass);
  REQUIRE(built.analysed());
  CHECK(midspan_deflection(built.json()) == Approx(expected_deflection).epsilon(1e-6));
  CHECK(built.json()["results"][0]["members"][0]["max_abs_stress"].get<double>() ==
        Approx(expected_stress).epsilon(1e-6));
  CHECK(built.files().empty());  // no out_dir: nothing written
  CHECK(built.analysis().checks.size() == 1);
  CHECK_THAT(built.summary(), Contains("PASS"));

  const auto text = run_text(beam_yaml, dir.path());
  REQUIRE(text.status() == ExitStatus::pass);
  CHECK(midspan_deflection(text.json()) == Approx(expected_deflection).epsilon(1e-6));
  // Same numbers whichever way the project came in.
  CHECK(text.json()["results"] == built.json()["results"]);
  CHECK(text.json()["checks"] == built.json()["checks"]);
}

TEST_CASE("run_file writes the same results.json the results object holds") {
  test::ScratchDir dir;
  write_beam(dir / "beam.stp");
  test::write_text(dir / "beam.yaml", beam_yaml);
  RunOptions options;
  options.out_dir = dir / "out";
  const auto results = run_file(dir / "beam.yaml", options);
  REQUIRE(results.status() == ExitStatus::pass);
  REQUIRE(std::filesystem::exists(dir / "out" / "results.json"));
  const auto on_disk = nlohmann::json::parse(test::read_text(dir / "out" / "results.json"));
  CHECK(on_disk == results.json());
  const auto& files = results.files();
  CHECK(std::find(files.begin(), files.end(), dir / "out" / "results.json") != files.end());
  CHECK(std::find(files.begin(), files.end(), dir / "out" / "vtk" / "W.vtu") != files.end());
}

TEST_CASE("read_project_text resolves the model against base_dir and names the text in errors") {
  test::ScratchDir dir;
  const auto project = read_project_text(beam_yaml, dir.path(), "pipeline step 7");
  CHECK(project.model == dir.path() / "beam.stp");
  CHECK(project.cases.size() == 1);
  CHECK(project.cases[0].member_loads[0].w.z() == Approx(-w));  // 10 kN/m in SI

  std::string bad = beam_yaml;
  bad += "colour_scheme: blue\n";
  try {
    read_project_text(bad, dir.path(), "pipeline step 7");
    FAIL("no InputError");
  } catch (const InputError& e) {
    CHECK_THAT(e.what(), Contains("pipeline step 7:18") && Contains("unknown key 'colour_scheme'"));
  }
  const auto broken = run_text("model: [unclosed", dir.path());
  CHECK(broken.status() == ExitStatus::bad_input);
  CHECK_THAT(broken.message(), Contains("not valid YAML"));
  CHECK(broken.json()["status"] == "error");
  CHECK(broken.json()["exit_status"] == 2);
  CHECK_THROWS_AS(broken.analysis(), std::logic_error);
}

TEST_CASE("the project builder validates names as the project reader does") {
  const auto error_of = [](const ProjectBuilder& builder) -> std::string {
    try {
      builder.build();
    } catch (const InputError& e) {
      return e.what();
    }
    return "no error";
  };
  CHECK_THAT(error_of(ProjectBuilder("p")), Contains("p: the project defines no load case"));
  CHECK_THAT(error_of(ProjectBuilder("p").load_case("G", true).load_case("G", false)),
             Contains("cases[1]: a second load case is named 'G'"));
  CHECK_THAT(error_of(ProjectBuilder("p").load_case("Dead", true).combination("ULS", {{"Daed", 1.35}})),
             Contains("no load case is named 'Daed'") && Contains("did you mean 'Dead'"));
  CHECK_THAT(error_of(ProjectBuilder("p").load_case("G", true).check_stress({"ULS"})),
             Contains("checks.stress: no load case or combination is named 'ULS'"));
  CHECK_THAT(error_of(ProjectBuilder("p").load_case("G", true).rule({}, std::nullopt)),
             Contains("rules[0] sets none of section, material, roll"));
  CHECK_THAT(error_of(ProjectBuilder("p").load_case("G", true).merge_tolerance(0)), Contains("merge_tolerance"));
  CHECK_THAT(error_of(ProjectBuilder("p").load_case("G", true).curve_max_turn(2.0)), Contains("curve_max_turn"));
  const auto geometry = ProjectBuilder("p").load_case("G", true).curve_max_turn(0.05).join_crossings(true).build();
  CHECK(geometry.curve_max_turn == Approx(0.05));
  CHECK(geometry.join_crossings);

  // Without checks: stresses under every combination, as in a project file.
  const auto p = ProjectBuilder("p").load_case("G", true).load_case("Q", false).combination("ULS", {{"G", 1.35}, {"Q", 1.5}}).build();
  REQUIRE(p.checks.stress);
  CHECK(p.checks.stress->combinations == std::vector<std::string>{"ULS"});
  CHECK_FALSE(p.checks.deflection);
}

TEST_CASE("progress reports every stage in order, and cancelling stops the run before anything is written") {
  test::ScratchDir dir;
  write_beam(dir / "beam.stp");
  test::write_text(dir / "beam.yaml", beam_yaml);

  std::vector<std::pair<std::string, double>> seen;
  RunOptions options;
  options.out_dir = dir / "out";
  options.control.progress = [&](std::string_view stage, double f) { seen.emplace_back(stage, f); };
  REQUIRE(run_file(dir / "beam.yaml", options).status() == ExitStatus::pass);
  std::vector<std::string> stages;
  for (const auto& [stage, f] : seen) {
    CHECK(f >= 0.0);
    CHECK(f <= 1.0);
    if (stages.empty() || stages.back() != stage) stages.push_back(stage);
  }
  CHECK(stages == std::vector<std::string>{"project", "geometry", "wireframe", "model", "assembly", "factorisation", "recovery",
                                           "checks", "buckling", "checks", "vtk", "tables", "results.json", "report"});
  CHECK(seen.back() == std::pair<std::string, double>{"report", 1.0});

  SECTION("a cancel callback stops the run inside the solver") {
    options.out_dir = dir / "cancelled";
    options.control.cancel = [&] { return !seen.empty() && seen.back().first == "factorisation"; };
    seen.clear();
    const auto results = run_file(dir / "beam.yaml", options);
    CHECK(results.status() == ExitStatus::cancelled);
    CHECK_THAT(results.message(), Contains("cancelled"));
    CHECK(results.json()["status"] == "cancelled");
    CHECK(seen.back().first == "factorisation");
    CHECK_FALSE(std::filesystem::exists(dir / "cancelled" / "results.json"));
  }
  SECTION("a flag set beforehand stops the run at its first stage") {
    std::atomic<bool> stop{true};
    options.out_dir = dir / "flagged";
    options.control.cancel_flag = &stop;
    seen.clear();
    CHECK(run_file(dir / "beam.yaml", options).status() == ExitStatus::cancelled);
    REQUIRE(seen.size() == 1);
    CHECK(seen[0].first == "project");
    CHECK_FALSE(std::filesystem::exists(dir / "flagged"));
  }
}

TEST_CASE("results_solved: the checks wait for the buckling analysis, and the tables written then are final") {
  test::ScratchDir dir;
  write_beam(dir / "beam.stp");
  test::write_text(dir / "beam.yaml", beam_yaml);
  RunOptions options;
  options.out_dir = dir / "out";
  int calls = 0;
  options.control.results_solved = [&](const Analysis& a) {
    ++calls;
    CHECK(a.checks.empty());
    REQUIRE(a.results.size() == 1);
    CHECK(a.results[0].name == "W");
    CHECK(a.shop.marks.size() == 1);
  };
  // A factor of a few kB: the checks run beside the buckling analysis and nothing waits.
  REQUIRE(run_file(dir / "beam.yaml", options).status() == ExitStatus::pass);
  CHECK(calls == 0);

  // As a large frame's run: the checks wait, and the run writes the tables that need no check meanwhile
  // (run_guarded's own results_solved, after the caller's), each as the finished analysis gives it.
  options.control.checks_beside_buckling_bytes = 0;
  std::vector<std::string> stages;
  options.control.progress = [&](std::string_view stage, double) {
    if (stages.empty() || stages.back() != stage) stages.emplace_back(stage);
  };
  const auto results = run_file(dir / "beam.yaml", options);
  REQUIRE(results.status() == ExitStatus::pass);
  CHECK(calls == 1);
  CHECK(stages == std::vector<std::string>{"project", "geometry", "wireframe", "model", "assembly", "factorisation",
                                           "recovery", "buckling", "checks", "vtk", "tables", "results.json",
                                           "report"});
  const Analysis& a = results.analysis();
  CHECK(test::read_text(dir / "out" / "takeoff.csv") == takeoff_csv(a));
  CHECK(test::read_text(dir / "out" / "takeoff_by_section.csv") == takeoff_by_section_csv(a));
  CHECK(test::read_text(dir / "out" / "reactions.csv") == reactions_csv(a));
  CHECK(test::read_text(dir / "out" / "end_forces.csv") == end_forces_csv(a));
  CHECK(test::read_text(dir / "out" / "cutlist.csv") == cutlist_csv(a));
  CHECK(test::read_text(dir / "out" / "connections.csv") == connections_csv(a));
  CHECK(test::read_text(dir / "out" / "checks.csv") == checks_csv(a));

  SECTION("a run cancelled after those tables leaves no folder and no staging folder behind") {
    bool solved = false;
    options.out_dir = dir / "cancelled";
    options.control.results_solved = [&](const Analysis&) { solved = true; };
    options.control.cancel = [&] { return solved; };
    CHECK(run_file(dir / "beam.yaml", options).status() == ExitStatus::cancelled);
    CHECK(solved);
    CHECK_FALSE(std::filesystem::exists(dir / "cancelled"));
    for (const auto& entry : std::filesystem::directory_iterator(dir.path()))
      CHECK(entry.path().filename().string().find("stepframe-tmp") == std::string::npos);
  }
}

TEST_CASE("the run's log goes to the caller's sink and the default logger is restored") {
  test::ScratchDir dir;
  write_beam(dir / "beam.stp");
  std::ostringstream captured;
  const auto before = spdlog::default_logger();
  RunOptions options;
  options.control.log_sink = std::make_shared<spdlog::sinks::ostream_sink_mt>(captured);
  options.control.log_level = spdlog::level::info;
  REQUIRE(run_text(beam_yaml, dir.path(), options).status() == ExitStatus::pass);
  CHECK(spdlog::default_logger() == before);
  CHECK_THAT(captured.str(), Contains("1 members, 2 nodes"));

  // A failure is logged by the caller, not the library: the message comes back in the results.
  captured.str("");
  std::string unstable = beam_yaml;
  unstable.replace(unstable.find("[ux, uy, uz, rx]"), 16, "[ux, uy, uz]");
  unstable.replace(unstable.find("[uy, uz, rx]"), 12, "[uy, uz]");
  const auto results = run_text(unstable, dir.path(), options);
  CHECK(results.status() == ExitStatus::unstable);
  CHECK_THAT(results.message(), Contains("rx"));
  CHECK(spdlog::default_logger() == before);
}

TEST_CASE("model sources: STEP text, an OCCT shape and an XDE document give what the file gives") {
  test::ScratchDir dir;
  write_beam(dir / "beam.stp");
  const auto project = beam_project(dir / "elsewhere.stp");  // the source below takes precedence
  const auto from_file = run(project, StepFile{dir / "beam.stp"});
  REQUIRE(from_file.status() == ExitStatus::pass);
  const auto& expected = from_file.json()["results"];
  const auto ipe300 = analysis::find_catalogue_section("IPE300");
  REQUIRE(ipe300);
  // Roark's Formulas for Stress and Strain, Table 8.1 case 2e: 5 w L^4 / (384 E I).
  CHECK(midspan_deflection(from_file.json()) ==
        Approx(5 * w * std::pow(span, 4) / (384 * E * ipe300->Iy)).epsilon(1e-6));

  SECTION("STEP text held in memory") {
    const auto results = run(project, StepText{test::read_text(dir / "beam.stp"), "beam in memory"});
    INFO(results.message());
    REQUIRE(results.status() == ExitStatus::pass);
    CHECK(results.json()["results"] == expected);
    CHECK(results.json()["model"]["file"] == "beam in memory");
    const auto broken = run(project, StepText{"ISO-10303-21;\nnot really\n", "broken text"});
    CHECK(broken.status() == ExitStatus::bad_input);
    CHECK_THAT(broken.message(), Contains("broken text"));
  }
  SECTION("an OCCT shape with attributes the caller supplies") {
    // The same 6 m edge, in millimetres, named and layered through the attribute list.
    const TopoDS_Edge edge = BRepBuilderAPI_MakeEdge(gp_Pnt(0, 0, 0), gp_Pnt(6000, 0, 0)).Edge();
    auto attributes = std::make_shared<geometry::ShapeAttributes>();
    attributes->display_name = "beam shape";
    geometry::SourceInfo info;
    info.entity = "pipeline-edge-1";
    info.name = "IPE 300";
    info.layers = {"BEAMS"};
    attributes->items.emplace_back(edge, info);
    const auto results = run(project, ShapeModel{std::make_shared<TopoDS_Shape>(edge), attributes});
    INFO(results.message());
    REQUIRE(results.status() == ExitStatus::pass);
    CHECK(results.json()["results"] == expected);
    CHECK(results.json()["members"][0]["source"]["entity"] == "pipeline-edge-1");
    CHECK(run(project, ShapeModel{}).status() == ExitStatus::bad_input);  // no shape: bad input, not a crash
  }
  SECTION("an XDE document a pipeline already holds") {
    Handle(TDocStd_Document) document;
    XCAFApp_Application::GetApplication()->NewDocument("MDTV-XCAF", document);
    STEPCAFControl_Reader reader;
    reader.SetNameMode(true);
    reader.SetLayerMode(true);
    REQUIRE(reader.ReadFile((dir / "beam.stp").c_str()) == IFSelect_RetDone);
    REQUIRE(reader.Transfer(document));
    // The document keeps the layer; the curve set's name stays in the STEP file, so the
    // section is set by a layer rule here.
    auto by_layer = project;
    Rule rule;
    rule.where.layer = "BEAMS";
    rule.section = "IPE300";
    by_layer.rules.push_back(rule);
    const auto results = run(by_layer, XdeDocument{document.get(), "beam document"});
    INFO(results.message());
    REQUIRE(results.status() == ExitStatus::pass);
    CHECK(results.json()["results"] == expected);
    CHECK(results.json()["members"][0]["source"]["layers"][0] == "BEAMS");
    CHECK(results.json()["model"]["file"] == "beam document");
    CHECK(run(project, XdeDocument{}).status() == ExitStatus::bad_input);  // null document
  }
}
