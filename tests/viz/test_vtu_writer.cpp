// The .vtu line model read back with VTK's own reader.

#include "solved_frames.hpp"
#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/viz/surface_vtu_writer.hpp"
#include "stepframe/viz/colour_scale.hpp"
#include "stepframe/viz/vtu_writer.hpp"

#include <catch2/catch.hpp>
#include <Eigen/Geometry>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <cmath>
#include <filesystem>

using namespace stepframe;

TEST_CASE("the line model carries every station of every member into the file") {
  // An L of two members, one element each, solved: the file must hold the analysis' own stations
  // (member_line) as 32-bit floats, and the members' summaries as cell data.
  const analysis::FrameModel model = viz::testing::l_frame();
  const analysis::LoadResult result = viz::testing::solved(model);
  const auto chains = analysis::member_chains(model);

  const auto file = std::filesystem::temp_directory_path() / "stepframe-test-line-model.vtu";
  viz::LineModelOptions options;
  options.points_per_element = 7;
  viz::write_line_model_vtu(file, model, result, {0.25, 0.75}, options);

  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.string().c_str());
  reader->Update();
  vtkUnstructuredGrid* grid = reader->GetOutput();
  REQUIRE(grid->GetNumberOfCells() == 2);
  REQUIRE(grid->GetNumberOfPoints() == 2 * 7);
  CHECK(grid->GetCellType(0) == VTK_POLY_LINE);

  auto* displacement = grid->GetPointData()->GetArray("displacement");
  auto* von_mises = grid->GetPointData()->GetArray("von_mises");
  auto* axial = grid->GetPointData()->GetArray("N");
  auto* my = grid->GetPointData()->GetArray("My");
  auto* mz = grid->GetPointData()->GetArray("Mz");
  REQUIRE(displacement);
  REQUIRE(von_mises);
  REQUIRE(axial);
  REQUIRE(my);
  REQUIRE(mz);
  CHECK(displacement->GetNumberOfComponents() == 3);
  constexpr double single = 1e-6;  // 32-bit floats: about seven significant digits
  vtkIdType p = 0;
  for (std::size_t m = 0; m < chains.size(); ++m) {
    const analysis::LineResult line = analysis::member_line(model, result, chains[m], analysis::LineDetail::stations, 7);
    const double u_scale = result.displacements.cwiseAbs().maxCoeff();
    for (const auto& st : line.stations) {
      double xyz[3];
      grid->GetPoint(p, xyz);
      for (int c = 0; c < 3; ++c) {
        CHECK(xyz[c] == Approx(st.position(c)).margin(single));
        CHECK(displacement->GetComponent(p, c) == Approx(st.displacement(c)).margin(single * u_scale));
      }
      CHECK(von_mises->GetTuple1(p) == Approx(st.von_mises).epsilon(single));
      CHECK(axial->GetTuple1(p) == Approx(st.forces(0)).margin(single * 1e5));
      CHECK(my->GetTuple1(p) == Approx(st.forces(4)).margin(single * 1e5));
      CHECK(mz->GetTuple1(p) == Approx(st.forces(5)).margin(single * 1e5));
      ++p;
    }
    CHECK(grid->GetCellData()->GetArray("stress")->GetTuple1(static_cast<vtkIdType>(m)) ==
          Approx(result.members[m].max_von_mises).epsilon(single));
    CHECK(grid->GetCellData()->GetArray("normal_stress")->GetTuple1(static_cast<vtkIdType>(m)) ==
          Approx(result.members[m].max_abs_stress).epsilon(single));
  }
  // The second member's middle station sits 1 m up the vertical member from (2, 0, 0).
  double middle[3];
  grid->GetPoint(7 + 3, middle);
  CHECK(middle[0] == Approx(2.0));
  CHECK(middle[2] == Approx(1.0));
  CHECK(grid->GetCellData()->GetArray("utilisation")->GetTuple1(1) == Approx(0.75));
  // The report's colour of that utilisation, as bytes a viewer shows directly.
  auto* colour = grid->GetCellData()->GetArray("utilisation_colour");
  REQUIRE(colour);
  const auto expected = viz::utilisation_colour(0.75);
  for (int c = 0; c < 3; ++c) CHECK(colour->GetComponent(1, c) == expected[static_cast<std::size_t>(c)]);
  REQUIRE(grid->GetCellData()->GetScalars());
  CHECK(std::string(grid->GetCellData()->GetScalars()->GetName()) == "stress");
  CHECK(grid->GetCellData()->GetArray("member_id")->GetTuple1(1) == 1);
  auto* section = vtkStringArray::SafeDownCast(grid->GetCellData()->GetAbstractArray("section"));
  REQUIRE(section);
  CHECK(section->GetValue(0) == "BOX");
  // Shears and torque too, and the units and caution in field data.
  for (const char* name : {"Vy", "Vz", "T"}) CHECK(grid->GetPointData()->GetArray(name));
  auto* units = vtkStringArray::SafeDownCast(grid->GetFieldData()->GetAbstractArray("units"));
  REQUIRE(units);
  bool n_unit = false;
  for (vtkIdType i = 0; i < units->GetNumberOfValues(); ++i) n_unit |= units->GetValue(i).rfind("N: N", 0) == 0;
  CHECK(n_unit);
  auto* caution = vtkStringArray::SafeDownCast(grid->GetFieldData()->GetAbstractArray("caution"));
  REQUIRE(caution);
  CHECK(caution->GetValue(0).find("competent engineer") != std::string::npos);
  std::filesystem::remove(file);
}

TEST_CASE("the surface model moves each outline point with the axis and the section's rotation") {
  // The L frame's vertical member carries a torque and bending: at each drawn station the outline
  // point at arm r moves by u + theta x r (small rotations, plane sections stay plane: common
  // practice), u and theta the analysis' own station values (element_line).
  const analysis::FrameModel model = viz::testing::l_frame();
  const analysis::LoadResult result = viz::testing::solved(model);
  viz::SurfaceOptions options;
  options.sections_per_element = 3;
  const auto file = std::filesystem::temp_directory_path() / "stepframe-test-surface.vtu";
  viz::write_surface_vtu(file, model, result, options);
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.string().c_str());
  reader->Update();
  vtkUnstructuredGrid* grid = reader->GetOutput();
  REQUIRE(grid->GetNumberOfPoints() == 2 * 3 * 4);  // 4 outline corners at 3 stations of 2 elements
  REQUIRE(grid->GetNumberOfCells() == 2 * 2 * 4);
  auto* displacement = grid->GetPointData()->GetArray("displacement");
  auto* fibre = grid->GetPointData()->GetArray("fibre_stress");
  REQUIRE(displacement);
  REQUIRE(fibre);
  const analysis::Section& box = model.sections[0];
  const double u_scale = result.displacements.cwiseAbs().maxCoeff();
  for (std::size_t e = 0; e < 2; ++e) {
    const analysis::LineResult line = analysis::element_line(model, result, e, 3);
    const Eigen::Vector3d axis_start = model.nodes[model.elements[e].nodes[0]];
    for (vtkIdType k = 0; k < 12; ++k) {
      const vtkIdType i = static_cast<vtkIdType>(12 * e) + k;
      const auto& st = line.stations[static_cast<std::size_t>(k / 4)];
      double p[3], d[3];
      grid->GetPoint(i, p);
      displacement->GetTuple(i, d);
      const Eigen::Vector3d arm = Eigen::Vector3d(p[0], p[1], p[2]) - st.position;
      CHECK((st.position - axis_start).norm() == Approx(st.x));
      CHECK(arm.norm() == Approx(std::hypot(0.05, 0.15)).epsilon(1e-6));  // a corner of the rectangle
      const Eigen::Vector3d expected = st.displacement + st.rotation.cross(arm);
      for (int c = 0; c < 3; ++c) CHECK(d[c] == Approx(expected(c)).margin(1e-6 * u_scale));
      // sigma = N/A + My z / Iy - Mz y / Iz in the element's local axes (results.hpp).
      const Eigen::Matrix3d axes = analysis::local_axes(model.nodes[model.elements[e].nodes[0]],
                                                        model.nodes[model.elements[e].nodes[1]], 0.0);
      const double y = axes.row(1).dot(arm), z = axes.row(2).dot(arm);
      const double sigma = st.forces(0) / box.A + st.forces(4) * z / box.Iy - st.forces(5) * y / box.Iz;
      CHECK(fibre->GetTuple1(i) == Approx(sigma).margin(1e-6 * 1e9));
    }
  }
  std::filesystem::remove(file);
}
