// Natural frequencies through a run: analysis.modes with mass from a case's
// gravity loads and point masses, the modes in results.json, the report and
// vtk/natural_mode*.vtu, and the project's frequency limits as checks. The
// frequencies themselves are verified against published formulas in
// tests/verification/test_natural_frequencies.cpp; here the run must give
// what the analysis gives for the same model and mass.

#include "stepframe/analysis/load_mass.hpp"
#include "stepframe/analysis/natural_frequencies.hpp"
#include "stepframe/geometry/step_writer.hpp"
#include "stepframe/stepframe.hpp"
#include "run_options.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>
#include <vtkDoubleArray.h>
#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <cmath>
#include <numbers>
#include <string>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

using test::out_to;

// A platform frame in the XZ plane (invented test data): HEA 200 columns 4 m high, an IPE 300 beam 6 m long.
void write_portal(const test::ScratchDir& dir) {
  geometry::LineToWrite left{{0, 0, 0}, {0, 0, 4}, {}}, beam{{0, 0, 4}, {6, 0, 4}, {}}, right{{6, 0, 0}, {6, 0, 4}, {}};
  left.attributes.name = "HEA 200";
  right.attributes.name = "HEA 200";
  beam.attributes.name = "IPE 300";
  beam.attributes.layers = {"FLOOR"};
  geometry::write_step_wireframe(dir / "portal.stp", {left, beam, right}, "mm");
}

std::string project(const std::string& extra) {
  return R"(model: portal.stp
units: {length: m, force: kN, line_load: kN/m}
rules: [{where: {}, material: S355}]
supports: [{where: {z: 0}, fix: fixed}]
cases:
  - {name: G, self_weight: true}
  - {name: Q, member_loads: [{where: {layer: FLOOR}, w: [0, 0, -3]}]}
masses:
  - {near: [6, 0, 4], mass: 1.5 t}
)" + extra;
}

}  // namespace

TEST_CASE("analysis.modes: frequencies, mass and shapes in results.json, the report and VTK", "[plugin][modes]") {
  test::ScratchDir dir;
  write_portal(dir);
  const Results r = run_text(project("analysis: {modes: 4, mass_from: Q, buckling_modes: 0}\n"), dir.path(),
                             out_to(dir / "out"));
  INFO(r.message());
  REQUIRE(r.analysed());
  const auto& a = r.analysis();
  REQUIRE(a.modes);
  // The added mass: 3 kN/m over 6 m divided by g, and the 1.5 t point mass.
  const double added = 3e3 * 6 / analysis::standard_gravity + 1500;
  CHECK(a.added_mass == Approx(added).epsilon(1e-10));
  // The run gives what the analysis gives for the built model and that mass.
  const auto& model = a.built.model;
  analysis::AddedMass mass = analysis::mass_from_loads(model, {{1, 1.0}});
  for (std::size_t n = 0; n < model.nodes.size(); ++n) mass.at_node[n] += a.built.point_masses[n];
  analysis::ModalOptions options;
  options.modes = 4;
  const auto direct = analysis::natural_frequencies(model, mass, options);
  REQUIRE(a.modes->modes.size() == 4);
  const auto& doc = r.json();
  const auto& list = doc["modes"]["list"];
  REQUIRE(list.size() == 4);
  for (std::size_t i = 0; i < 4; ++i) {
    CHECK(a.modes->modes[i].frequency == Approx(direct.modes[i].frequency).epsilon(1e-9));
    CHECK(list[i]["frequency"].get<double>() == Approx(direct.modes[i].frequency).epsilon(1e-10));
    CHECK(list[i]["period"].get<double>() == Approx(1.0 / direct.modes[i].frequency).epsilon(1e-10));
  }
  CHECK(doc["modes"]["mass_from"] == "Q");
  CHECK(doc["modes"]["added_mass"].get<double>() == Approx(added).epsilon(1e-10));
  // Total mass: the members' steel (rho A L) and the added mass.
  CHECK(doc["modes"]["total_mass"].get<double>() == Approx(a.modes->total_mass));
  CHECK(a.modes->total_mass > added);
  // Each mode's shape as a VTK file with its frequency in the field data.
  for (std::size_t i = 0; i < 4; ++i) {
    const auto file = dir / "out" / "vtk" / ("natural_mode" + std::to_string(i + 1) + ".vtu");
    REQUIRE(std::filesystem::exists(file));
    vtkNew<vtkXMLUnstructuredGridReader> reader;
    reader->SetFileName(file.string().c_str());
    reader->Update();
    auto* grid = reader->GetOutput();
    REQUIRE(grid->GetPointData()->GetArray("mode_shape"));
    auto* f = grid->GetFieldData()->GetArray("frequency");
    REQUIRE(f);
    CHECK(f->GetTuple1(0) == Approx(list[i]["frequency"].get<double>()).epsilon(1e-10));  // results.json: 12 digits
  }
  const std::string report = test::read_text(dir / "out" / "report.html");
  CHECK_THAT(report, Contains("Natural frequencies") && Contains("modes-table"));
}

TEST_CASE("checks.frequency: a lowest frequency and a band around a running frequency", "[plugin][modes]") {
  test::ScratchDir dir;
  write_portal(dir);
  // First find the frequencies, then set limits either side of them.
  const Results first = run_text(project("analysis: {modes: 6, mass_from: Q, buckling_modes: 0}\n"), dir.path());
  REQUIRE(first.analysed());
  const auto& modes = first.analysis().modes->modes;
  const double f1 = modes[0].frequency;
  auto run_with = [&](const std::string& checks, int n = 6) {
    return run_text(project("analysis: {modes: " + std::to_string(n) + ", mass_from: Q, buckling_modes: 0}\n" + checks),
                    dir.path());
  };
  {
    const Results r = run_with("checks: {frequency: [{min_hz: " + std::to_string(0.9 * f1) + "}]}\n");
    REQUIRE(r.analysed());
    REQUIRE(r.analysis().checks.size() == 1);
    const auto& c = r.analysis().checks[0];
    CHECK(c.value == Approx(f1).epsilon(1e-9));
    CHECK(c.utilisation == Approx(0.9).epsilon(1e-6));
    CHECK(c.pass);
    CHECK(c.unit == "Hz");
  }
  {
    const Results r = run_with("checks: {frequency: [{min_hz: " + std::to_string(1.1 * f1) + "}]}\n");
    REQUIRE(r.analysed());
    CHECK_FALSE(r.analysis().checks[0].pass);
    CHECK(r.status() == ExitStatus::check_failed);
  }
  {
    // A machine running 5% above the first mode: inside a +-20% band.
    const Results r = run_with("checks: {frequency: [{running_hz: " + std::to_string(1.05 * f1) + ", band: 0.2}]}\n");
    REQUIRE(r.analysed());
    const auto& c = r.analysis().checks[0];
    CHECK_FALSE(c.pass);
    CHECK(c.value == Approx(f1).epsilon(1e-9));
    CHECK(c.utilisation == Approx(0.2 / (0.05 / 1.05)).epsilon(1e-4));  // running_hz written to 6 decimals
  }
  {
    // Modes too few to decide: the band reaches beyond the highest mode found.
    const Results r = run_with("checks: {frequency: [{running_hz: " + std::to_string(modes[1].frequency) + "}]}\n", 2);
    CHECK(r.status() == ExitStatus::bad_input);
    CHECK_THAT(r.message(), Contains("raise analysis.modes") && Contains("checks.frequency[0]"));
  }
}

TEST_CASE("masses and modes: errors name the key and what to write", "[plugin][modes]") {
  test::ScratchDir dir;
  write_portal(dir);
  auto message = [&](const std::string& text) { return run_text(text, dir.path()).message(); };
  CHECK_THAT(message(project("analysis: {modes: 4, mass_from: QP}\n")),
             Contains("analysis.mass_from") && Contains("no load case or combination is named 'QP'"));
  CHECK_THAT(message(project("checks: {frequency: [{min_hz: 3}]}\n")), Contains("add analysis: {modes: N}"));
  CHECK_THAT(message(project("analysis: {mass_from: Q}\n")), Contains("add modes: N"));
  CHECK_THAT(message(project("analysis: {modes: 2}\nchecks: {frequency: [{band: 0.1}]}\n")),
             Contains("band belongs to running_hz"));
  CHECK_THAT(message(R"(model: portal.stp
cases: [{name: G, self_weight: true}]
supports: [{where: {z: 0}, fix: fixed}]
masses: [{near: [3, 0, 4]}]
)"),
             Contains("masses[0]") && Contains("needs mass:"));
}
