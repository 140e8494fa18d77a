// Every output file of a run, read back: VTK files with VTK's own readers,
// the report against results.json, the tables against the model.

#include "portal_project.hpp"
#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkFieldData.h>
#include <vtkMultiBlockDataSet.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLMultiBlockDataReader.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <map>
#include <regex>
#include <sstream>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

vtkSmartPointer<vtkUnstructuredGrid> read_vtu(const std::filesystem::path& file) {
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.string().c_str());
  reader->Update();
  vtkSmartPointer<vtkUnstructuredGrid> grid = reader->GetOutput();
  return grid;
}

std::vector<std::vector<std::string>> csv_rows(const std::string& text) {
  std::vector<std::vector<std::string>> rows;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) {
    std::vector<std::string> row;
    std::istringstream fields(line);
    for (std::string f; std::getline(fields, f, ',');) row.push_back(f);
    rows.push_back(row);
  }
  return rows;
}

// Runs `stepframe run` on dir/portal.yaml into dir/out with more options; the folder, once the run
// has written it (exit status 0 or 1).
std::filesystem::path run_portal(const test::ScratchDir& dir, const std::string& options) {
  const auto out = dir / "out";
  const auto r = test::run_stepframe(
      "run \"" + (dir / "portal.yaml").string() + "\" --out \"" + out.string() + "\"" + options, dir);
  INFO(r.out << r.err);
  REQUIRE((r.status == 0 || r.status == 1));
  return out;
}

}  // namespace

TEST_CASE("a run writes every output, and each reads back consistently") {
  test::ScratchDir dir;
  test::write_portal(dir);
  const auto out = dir / "out";
  const auto r = test::run_stepframe("run \"" + (dir / "portal.yaml").string() + "\" --out \"" + out.string() + "\"", dir);
  INFO(r.out << r.err);
  REQUIRE((r.status == 0 || r.status == 1));
  const auto j = nlohmann::json::parse(test::read_text(out / "results.json"));
  REQUIRE(j["members"].size() == 3);

  // By default a line model is written for every case and combination and, of ULS's four
  // sway-imperfection variants, for the one with the largest member utilisation (results.json's checks).
  std::map<std::string, double> utilisation;
  for (const auto& c : j["checks"])
    if (c["member"].is_number()) {
      double& u = utilisation[c["combination"].get<std::string>()];
      u = std::max(u, c["utilisation"].get<double>());
    }
  std::vector<std::string> variants;
  for (const auto& record : j["sway_imperfections"])
    for (const auto& name : record["variants"]) variants.push_back(name.get<std::string>());
  REQUIRE(variants.size() == 4);
  std::string governing_variant = variants.front();
  for (const auto& v : variants)
    if (utilisation[v] > utilisation[governing_variant]) governing_variant = v;
  REQUIRE(utilisation[governing_variant] > 0);  // a variant governs some member check

  SECTION("a line model for every case and combination, and for ULS's governing sway variant") {
    for (const auto& result : j["results"]) {
      const auto name = result["name"].get<std::string>();
      const bool variant = std::find(variants.begin(), variants.end(), name) != variants.end();
      INFO(name);
      CHECK(std::filesystem::exists(out / "vtk" / (name + ".vtu")) == (!variant || name == governing_variant));
    }
  }
  SECTION("results.json details the governing result, whose line model carries its numbers") {
    // By default results.json holds node displacements and member summaries of the governing results
    // only: here ULS's governing sway variant (the largest utilisation, and ULS's alpha_cr).
    std::vector<std::string> detailed;
    for (const auto& result : j["results"]) {
      const auto name = result["name"].get<std::string>();
      if (!result.contains("members")) {
        CHECK(result["left_out"] == nlohmann::json::array({"displacements", "members"}));
        continue;
      }
      detailed.push_back(name);
      const auto file = out / "vtk" / (name + ".vtu");
      const auto grid = read_vtu(file);
      REQUIRE(grid->GetNumberOfCells() == 3);
      CHECK(grid->GetNumberOfPoints() == 3 * 7);  // seven points per element by default (outputs.line_model_points)
      auto* stress = grid->GetCellData()->GetArray("stress");
      REQUIRE(stress);
      CHECK(std::string(grid->GetCellData()->GetScalars()->GetName()) == "stress");
      for (int m = 0; m < 3; ++m)  // VTK files hold 32-bit floats: about seven significant digits
        CHECK(stress->GetTuple1(m) == Approx(result["members"][m]["max_von_mises"].get<double>()).epsilon(1e-7));
      REQUIRE(grid->GetPointData()->GetArray("displacement"));
      REQUIRE(grid->GetPointData()->GetArray("N"));
      REQUIRE(grid->GetCellData()->GetArray("utilisation"));
    }
    CHECK(detailed == std::vector<std::string>{governing_variant});
  }
  SECTION("one surface model, of the governing result, and it shows the fibre stresses") {
    // The governing results: the largest member utilisation (ULS's governing sway variant here) and
    // the lowest alpha_cr (ULS, which its governing variant stands for): one surface, none of ULS
    // without its imperfections.
    const auto worst = std::max_element(utilisation.begin(), utilisation.end(),
                                        [](const auto& a, const auto& b) { return a.second < b.second; });
    REQUIRE(worst->first == governing_variant);
    REQUIRE(j["results"][2]["name"] == "ULS");
    REQUIRE(j["results"][3]["name"] == "SLS");
    REQUIRE(j["results"][2]["alpha_cr"].is_number());  // the only alpha_cr (SLS asks for no buckling analysis)
    REQUIRE(j["results"][3]["alpha_cr"].is_null());
    std::vector<std::string> surfaces;
    for (const auto& e : std::filesystem::directory_iterator(out / "vtk"))
      if (e.path().filename().string().ends_with(".surface.vtu")) surfaces.push_back(e.path().filename().string());
    CHECK(surfaces == std::vector<std::string>{governing_variant + ".surface.vtu"});
    const auto grid = read_vtu(out / "vtk" / (governing_variant + ".surface.vtu"));
    REQUIRE(grid->GetNumberOfCells() > 50);  // three members, outlines at three sections of each element
    auto* fibre = grid->GetPointData()->GetArray("fibre_stress");
    REQUIRE(fibre);
    double range[2];
    fibre->GetRange(range);
    CHECK(range[0] < 0);  // compression and tension fibres both show
    CHECK(range[1] > 0);
    // The extreme fibre stress cannot exceed the largest normal stress of the line model.
    const auto line = read_vtu(out / "vtk" / (governing_variant + ".vtu"));
    double normal[2];
    line->GetCellData()->GetArray("normal_stress")->GetRange(normal);
    CHECK(std::max(-range[0], range[1]) <= normal[1] * (1 + 1e-9));
  }
  SECTION("buckling modes (ULS's: the combination of the governing variant) and the multiblock index") {
    REQUIRE(j["results"][2]["alpha_cr"].is_number());
    const auto mode = read_vtu(out / "vtk" / "ULS.mode1.vtu");
    REQUIRE(mode->GetPointData()->GetArray("mode_shape"));
    CHECK(mode->GetFieldData()->GetArray("alpha")->GetTuple1(0) ==
          Approx(j["results"][2]["alpha_cr"].get<double>()).epsilon(1e-11));  // results.json: twelve digits
    vtkNew<vtkXMLMultiBlockDataReader> reader;
    reader->SetFileName((out / "frame.vtm").string().c_str());
    reader->Update();
    auto* blocks = vtkMultiBlockDataSet::SafeDownCast(reader->GetOutput());
    REQUIRE(blocks);
    REQUIRE(blocks->GetNumberOfBlocks() == 3);  // line, surface, modes
    auto* lines = vtkMultiBlockDataSet::SafeDownCast(blocks->GetBlock(0));
    REQUIRE(lines);
    CHECK(lines->GetNumberOfBlocks() == 5);  // G, W, ULS, SLS and ULS's governing sway-imperfection variant
  }
  SECTION("the report's verdict and utilisation match results.json") {
    const auto html = test::read_text(out / "report.html");
    std::smatch m;
    REQUIRE(std::regex_search(html, m, std::regex("data-status=\"(pass|fail)\"")));
    CHECK(m[1] == j["status"].get<std::string>());
    double max_u = 0;
    for (const auto& c : j["checks"]) max_u = std::max(max_u, c["utilisation"].get<double>());
    REQUIRE(std::regex_search(html, m, std::regex("id=\"max-utilisation\">([0-9.]+)<")));
    CHECK(std::stod(m[1]) == Approx(max_u).margin(5e-4));
    CHECK_THAT(html, Contains("competent engineer") && Contains("data:image/png;base64,"));
    CHECK_THAT(html, Contains("computed from nominal dimensions and must be checked against the current edition"));
  }
  SECTION("tables: checks, take-off, reactions and end forces") {
    const auto checks = csv_rows(test::read_text(out / "checks.csv"));
    REQUIRE(checks.size() == 4);  // header + 3 members
    CHECK(checks[0][5] == "value");
    CHECK(checks[0][6] == "limit");
    CHECK(checks[0][7] == "unit");
    for (std::size_t row = 1; row < 4; ++row)  // value / limit is the utilisation shown
      CHECK(std::stod(checks[row][5]) / std::stod(checks[row][6]) == Approx(std::stod(checks[row][4])).margin(1e-4));
    const auto takeoff = csv_rows(test::read_text(out / "takeoff.csv"));
    CHECK(takeoff.size() == 4);  // one table: header + 3 members
    CHECK(takeoff[0][5] == "centreline_length_mm");
    CHECK(takeoff[0][6] == "kg_per_m");
    // Total mass = sum of A rho L (IPE 300: 42.2 kg/m, HEB 200: 61.3 kg/m, EN 10365).
    const auto sections = csv_rows(test::read_text(out / "takeoff_by_section.csv"));
    double expected = 0;
    for (const auto& member : j["members"]) expected += member["length"].get<double>();
    const auto& total = sections.back();
    REQUIRE(total[0] == "TOTAL");
    CHECK(std::stod(total[2]) == Approx(expected).epsilon(1e-6));
    CHECK(std::stod(total[3]) == Approx(2 * 3 * 61.3 + 5 * 42.2).epsilon(0.01));
    const auto ends = csv_rows(test::read_text(out / "end_forces.csv"));
    CHECK(ends.size() == 1 + 3 * 2 * 6);
    // Reactions: per supported node and result, equal to results.json's (kN).
    const auto reactions = csv_rows(test::read_text(out / "reactions.csv"));
    const auto& first = j["results"][0]["reactions"][0];
    REQUIRE(reactions.size() == 1 + 2 * j["results"].size());  // two supported nodes
    CHECK(std::stoul(reactions[1][0]) == first["node"].get<std::size_t>());
    CHECK(std::stod(reactions[1][8]) == Approx(first["force"][2].get<double>() / 1e3).margin(1e-3));
  }
  SECTION("the frame stability and EN 1993 checks are in results.json") {
    bool stability = false, buckling = false;
    for (const auto& c : j["checks"]) {
      if (c["check"] == "frame stability") stability = c["member"].is_null();
      if (c["check"] == "6.3.1 flexural buckling") buckling = true;
    }
    CHECK(stability);
    CHECK(buckling);
  }
}

TEST_CASE("outputs.line_models: all writes every sway variant's line model; --vtk combinations overrides it") {
  test::ScratchDir dir;
  test::write_portal(dir);
  const std::string project = test::read_text(dir / "portal.yaml");
  test::write_text(dir / "portal.yaml", project + "outputs: {line_models: all}\n");
  auto line_models = [&](const std::string& options) {
    const auto out = run_portal(dir, options);
    std::vector<std::string> names;
    for (const auto& f : std::filesystem::directory_iterator(out / "vtk")) {
      const auto name = f.path().filename().string();
      if (name.find(".surface.") == std::string::npos && name.find(".mode") == std::string::npos) names.push_back(name);
    }
    std::sort(names.begin(), names.end());
    return names;
  };
  CHECK(line_models("") == std::vector<std::string>{"G.vtu", "SLS.vtu", "ULS.sway+X.vtu", "ULS.sway+Y.vtu",
                                                    "ULS.sway-X.vtu", "ULS.sway-Y.vtu", "ULS.vtu", "W.vtu"});
  CHECK(line_models(" --vtk combinations").size() == 5);  // G, W, ULS, SLS and ULS's governing variant
  CHECK(read_vtu(dir / "out" / "vtk" / "G.vtu")->GetNumberOfPoints() == 3 * 7);  // seven points per element
  test::write_text(dir / "portal.yaml", project + "outputs: {line_model_points: 11}\n");
  CHECK(read_vtu(run_portal(dir, "") / "vtk" / "G.vtu")->GetNumberOfPoints() == 3 * 11);

  test::write_text(dir / "portal.yaml", project + "outputs: {line_models: all, surfaces: each}\n");
  const auto r = test::run_stepframe("run \"" + (dir / "portal.yaml").string() + "\"", dir);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("expected all, combinations, governing or none, got 'each'"));
}

TEST_CASE("run --result-details sets results.json's details whatever the project's outputs: block says") {
  test::ScratchDir dir;
  test::write_portal(dir);
  const std::string project = test::read_text(dir / "portal.yaml");
  test::write_text(dir / "portal.yaml", project + "outputs: {result_details: none}\n");
  // The results written with their node displacements and member summaries.
  auto detailed = [&](const std::string& options) {
    const auto j = nlohmann::json::parse(test::read_text(run_portal(dir, options) / "results.json"));
    std::size_t count = 0;
    for (const auto& result : j["results"]) count += result.contains("members") ? 1 : 0;
    CHECK(j["results"].size() == 8);  // G, W, ULS, SLS and ULS's four sway variants
    return count;
  };
  CHECK(detailed("") == 0);
  CHECK(detailed(" --result-details all") == 8);
  CHECK(detailed(" --result-details combinations") == 5);  // G, W, ULS, SLS and ULS's governing variant
  const auto r = test::run_stepframe("run \"" + (dir / "portal.yaml").string() + "\" --result-details some", dir);
  CHECK(r.status != 0);
  CHECK_THAT(r.err, Contains("--result-details"));
}

TEST_CASE("results.json: clause texts and intermediate values for the governing and failing checks, or every check") {
  test::ScratchDir dir;
  test::write_portal(dir);
  const std::string project = test::read_text(dir / "portal.yaml");
  auto checks = [&](const std::string& options) {
    return nlohmann::json::parse(test::read_text(run_portal(dir, options) / "results.json"))["checks"];
  };
  const auto thin = checks("");
  const auto every = checks(" --check-details all");
  REQUIRE(thin.size() == every.size());
  REQUIRE(thin.size() > 6);  // three members, several checks each, and the frame checks
  // Each member's governing entry: its largest utilisation, the first of equals.
  std::map<std::size_t, std::size_t> governing;
  for (std::size_t i = 0; i < every.size(); ++i) {
    if (every[i]["member"].is_null()) continue;
    const auto m = every[i]["member"].get<std::size_t>();
    if (!governing.count(m) || every[i]["utilisation"].get<double>() > every[governing[m]]["utilisation"].get<double>())
      governing[m] = i;
  }
  REQUIRE(governing.size() == 3);
  std::size_t without = 0;
  for (std::size_t i = 0; i < every.size(); ++i) {
    INFO(every[i].dump());
    CHECK(every[i].contains("clause"));
    const bool kept = every[i]["member"].is_null() || !every[i]["pass"].get<bool>() ||
                      governing[every[i]["member"].get<std::size_t>()] == i;
    if (kept) {
      CHECK(thin[i] == every[i]);
    } else {
      ++without;
      nlohmann::json bare = every[i];
      bare.erase("clause");
      bare.erase("details");
      CHECK(thin[i] == bare);  // member, check, result, station, value, limit, utilisation and verdict stay
    }
  }
  CHECK(without > 0);

  SECTION("the project's outputs: block, and the command line over it") {
    test::write_text(dir / "portal.yaml", project + "outputs: {check_details: all}\n");
    CHECK(checks("") == every);
    CHECK(checks(" --check-details governing") == thin);
  }
  SECTION("a bad value names the key or the option") {
    test::write_text(dir / "portal.yaml", project + "outputs: {check_details: some}\n");
    auto r = test::run_stepframe("run \"" + (dir / "portal.yaml").string() + "\"", dir);
    CHECK(r.status == 2);
    CHECK_THAT(r.err, Contains("outputs.check_details") && Contains("expected all or governing, got 'some'"));
    test::write_text(dir / "portal.yaml", project);
    r = test::run_stepframe("run \"" + (dir / "portal.yaml").string() + "\" --check-details some", dir);
    CHECK(r.status != 0);
    CHECK_THAT(r.err, Contains("--check-details"));
  }
}

TEST_CASE("results.json: every failing check keeps its clause text and intermediate values by default") {
  test::ScratchDir dir;
  test::write_portal(dir, 140);  // 140 kN/m on the 5 m IPE 300 beam: several of its checks fail
  const auto j = nlohmann::json::parse(test::read_text(run_portal(dir, "") / "results.json"));
  std::map<std::size_t, std::size_t> failing_per_member;
  for (const auto& c : j["checks"]) {
    if (c["pass"].get<bool>()) continue;
    INFO(c.dump());
    CHECK(c.contains("clause"));
    if (c["member"].is_number()) ++failing_per_member[c["member"].get<std::size_t>()];
  }
  // At least one member fails more than one check: a failing check that does not govern its member.
  REQUIRE(!failing_per_member.empty());
  CHECK(std::max_element(failing_per_member.begin(), failing_per_member.end(),
                         [](const auto& a, const auto& b) { return a.second < b.second; })->second > 1);
}
