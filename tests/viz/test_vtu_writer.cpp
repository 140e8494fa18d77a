// The .vtu line model read back with VTK's own reader.

#include "stepframe/viz/vtu_writer.hpp"

#include <catch2/catch.hpp>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

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
