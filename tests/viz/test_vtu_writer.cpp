// The .vtu line model read back with VTK's own reader.

#include "stepframe/viz/surface_vtu_writer.hpp"
#include "stepframe/viz/vtu_writer.hpp"

#include <catch2/catch.hpp>
#include <Eigen/Geometry>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <cmath>
#include <filesystem>

using namespace stepframe;

TEST_CASE("the line model round-trips through VTK's XML reader") {
  // Two members (an L of two 2 m members, one element each) with hand-made
  // results: the writer must carry every number into the file unchanged.
  analysis::FrameModel model;
  model.nodes = {{0, 0, 0}, {2, 0, 0}, {2, 0, 2}};
  analysis::Section ipe;
  ipe.designation = "IPE300";
  model.sections = {ipe};
  model.materials = {analysis::Material{}};
  model.elements = {{{0, 1}, 0, 0, 0.0}, {{1, 2}, 0, 0, 0.0}};

  analysis::LoadResult result;
  result.name = "ULS";
  result.is_combination = true;
  for (int m = 0; m < 2; ++m) {
    analysis::LineResult mr;
    for (int k = 0; k < 3; ++k) {
      analysis::Station s;
      s.x = k * 1.0;
      s.position = m == 0 ? Eigen::Vector3d(k, 0, 0) : Eigen::Vector3d(2, 0, k);
      s.forces.setZero();
      s.displacement = Eigen::Vector3d(0.001 * m, 0.0, -0.002 * k);
      s.max_abs_stress = 1e6 * (10 * m + k);
      s.von_mises = 1.1e6 * (10 * m + k);
      s.forces(0) = -1e3 * k;
      mr.stations.push_back(s);
    }
    mr.max_abs_stress = 1e6 * (10 * m + 2);
    mr.max_von_mises = 1.1e6 * (10 * m + 2);
    result.members.push_back(mr);
  }

  const auto file = std::filesystem::temp_directory_path() / "stepframe-test-line-model.vtu";
  viz::write_line_model_vtu(file, model, result, {0.25, 0.75});

  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.string().c_str());
  reader->Update();
  vtkUnstructuredGrid* grid = reader->GetOutput();
  REQUIRE(grid->GetNumberOfCells() == 2);
  REQUIRE(grid->GetNumberOfPoints() == 6);
  CHECK(grid->GetCellType(0) == VTK_POLY_LINE);

  // Second member, middle station: 1 m up the vertical member from (2, 0, 0).
  double p[3];
  grid->GetPoint(4, p);
  CHECK(p[0] == Approx(2.0));
  CHECK(p[2] == Approx(1.0));

  auto* stress = grid->GetCellData()->GetArray("stress");
  REQUIRE(stress);
  CHECK(stress->GetTuple1(1) == Approx(13.2e6));  // the largest von Mises stress of member 1
  CHECK(grid->GetCellData()->GetArray("normal_stress")->GetTuple1(1) == Approx(12e6));
  CHECK(grid->GetCellData()->GetArray("utilisation")->GetTuple1(1) == Approx(0.75));
  REQUIRE(grid->GetCellData()->GetScalars());
  CHECK(std::string(grid->GetCellData()->GetScalars()->GetName()) == "stress");
  CHECK(grid->GetCellData()->GetArray("member_id")->GetTuple1(1) == 1);
  auto* section = vtkStringArray::SafeDownCast(grid->GetCellData()->GetAbstractArray("section"));
  REQUIRE(section);
  CHECK(section->GetValue(0) == "IPE300");

  auto* displacement = grid->GetPointData()->GetArray("displacement");
  REQUIRE(displacement);
  CHECK(displacement->GetNumberOfComponents() == 3);
  CHECK(displacement->GetComponent(5, 2) == Approx(-0.004));
  CHECK(displacement->GetComponent(3, 0) == Approx(0.001));
  CHECK(grid->GetPointData()->GetArray("von_mises")->GetTuple1(4) == Approx(12.1e6));
  CHECK(grid->GetPointData()->GetArray("N")->GetTuple1(5) == Approx(-2e3));
  std::filesystem::remove(file);
}

TEST_CASE("the surface model moves each outline point with the axis and the section's rotation") {
  // One 2 m element along x with a 0.3 x 0.1 rectangle (a section given by properties) and hand-made
  // results: at the end station the axis moves and the section turns. Small rotations: an outline point
  // at arm r moves by u + theta x r (rigid section, plane sections stay plane: common practice).
  analysis::FrameModel model;
  model.nodes = {{0, 0, 0}, {2, 0, 0}};
  analysis::Section box;
  box.designation = "BOX";
  box.A = 0.03, box.Iy = 2.25e-4, box.Iz = 2.5e-5, box.depth = 0.3, box.width = 0.1;
  model.sections = {box};
  model.materials = {analysis::Material{}};
  model.elements = {{{0, 1}, 0, 0, 0.0}};

  analysis::LoadResult result;
  result.name = "turned";
  analysis::LineResult line;
  for (int k = 0; k < 2; ++k) {
    analysis::Station s;
    s.x = 2.0 * k;
    s.position = Eigen::Vector3d(2.0 * k, 0, 0);
    s.displacement = Eigen::Vector3d(0, 0, -0.01 * k);
    s.rotation = Eigen::Vector3d(0.02 * k, 0.005 * k, 0);  // twist and slope at the far end
    s.forces(4) = 9e3 * (1 - k);                          // My: sigma = My z / Iy
    line.stations.push_back(s);
  }
  result.elements = {line};
  result.members = {line};

  const auto file = std::filesystem::temp_directory_path() / "stepframe-test-surface.vtu";
  viz::write_surface_vtu(file, model, result);
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.string().c_str());
  reader->Update();
  vtkUnstructuredGrid* grid = reader->GetOutput();
  REQUIRE(grid->GetNumberOfPoints() == 8);  // 4 outline corners at 2 stations
  REQUIRE(grid->GetNumberOfCells() == 4);
  auto* displacement = grid->GetPointData()->GetArray("displacement");
  auto* fibre = grid->GetPointData()->GetArray("fibre_stress");
  REQUIRE(displacement);
  REQUIRE(fibre);
  for (vtkIdType i = 0; i < 8; ++i) {
    double p[3], d[3];
    grid->GetPoint(i, p);
    displacement->GetTuple(i, d);
    const Eigen::Vector3d arm(0, p[1], p[2]);  // the axis runs along x through the origin
    const auto& st = line.stations[i < 4 ? 0 : 1];
    const Eigen::Vector3d expected = st.displacement + st.rotation.cross(arm);
    CHECK(d[0] == Approx(expected.x()).margin(1e-15));
    CHECK(d[1] == Approx(expected.y()).margin(1e-15));
    CHECK(d[2] == Approx(expected.z()).margin(1e-15));
    CHECK(std::abs(p[2]) == Approx(0.15));
    CHECK(fibre->GetTuple1(i) == Approx(st.forces(4) * p[2] / box.Iy).margin(1e-6));
  }
  // The corner at y = 0.05, z = 0.15 of the far end, worked by hand: the twist 0.02 moves it by
  // (0, -0.02 * 0.15, 0.02 * 0.05), the slope 0.005 about y by (0.005 * 0.15, 0, 0), the axis by (0, 0, -0.01).
  int found = 0;
  for (vtkIdType i = 4; i < 8; ++i) {
    double p[3], d[3];
    grid->GetPoint(i, p);
    if (std::abs(p[1] - 0.05) > 1e-12 || std::abs(p[2] - 0.15) > 1e-12) continue;
    ++found;
    displacement->GetTuple(i, d);
    CHECK(d[0] == Approx(0.00075));
    CHECK(d[1] == Approx(-0.003));
    CHECK(d[2] == Approx(-0.009));
  }
  CHECK(found == 1);
  std::filesystem::remove(file);
}
