#pragma once
// A generated multi-storey steel building for the benchmarks: a STEP
// wireframe (one curve per member, section designations as curve names,
// layers COLUMNS, BEAMS, SECONDARY and BRACING) and the project file that
// analyses it. The building is invented; sizes and loads are round values.
//
// Every storey of every 6 m x 6 m bay has a column, a main beam along X and
// one along Y (rigid joints: moment frames both ways), and a secondary beam
// along Y at mid-bay, pinned to the X beams it splits (T-junctions), so a
// building has about 0.5 nodes (3 DOFs) per member. The facades are braced
// by single diagonals in every third bay. Storeys are 3.5 m.

#include <cstddef>
#include <filesystem>
#include <string>

namespace stepframe::bench {

struct BuildingSize {
  int bays_x = 18;
  int bays_y = 18;
  int storeys = 8;
};

/// About `members` members: 2 log10(members) storeys (at least 2), and a
/// square plan of as many bays as it takes.
BuildingSize building_size_for(std::size_t members);

/// Members the building has (CAD edges).
std::size_t building_member_count(const BuildingSize& size);

/// Writes the building as `building.stp` into `folder` (created if needed)
/// with OCCT's STEP writer. Returns the member count.
std::size_t write_building_model(const std::filesystem::path& folder, const BuildingSize& size);

/// What a project file for the building asks beyond the base analysis.
struct ProjectVariant {
  std::size_t extra_cases = 0;         ///< further load cases (line loads on the beams), in no combination
  std::size_t extra_combinations = 0;  ///< further ultimate combinations of G, Q and W
  bool buckling = true;                ///< false: analysis.buckling_modes 0 and no stability check
};

/// Writes `<name>.yaml` beside building.stp: load cases G (self weight, 3 kN/m
/// on every beam), Q (4 kN/m on every beam) and W (10 kN at every node of the
/// -X facade along +X), combinations ULS-1 and ULS-2, every check, and what
/// the variant adds. Returns the file.
std::filesystem::path write_building_project(const std::filesystem::path& folder, const std::string& name,
                                             const ProjectVariant& variant = {});

}  // namespace stepframe::bench
