#pragma once
// One .vtm file that ties a run's VTK files together, so a viewer opens them
// as one tree: a block per kind of model, a data set per load result.

#include <filesystem>
#include <string>
#include <vector>

namespace stepframe::viz {

struct IndexEntry {
  std::string group;                ///< block name, e.g. "line model", "surface model", "buckling modes"
  std::string name;                 ///< data set name, e.g. "ULS-1"
  std::filesystem::path file;       ///< relative to the index file's folder
};

/// The text of a VTK XML multiblock index (vtkMultiBlockDataSet, version 1.0)
/// listing the entries grouped by `group`, in first-seen order.
std::string multiblock_index(const std::vector<IndexEntry>& entries);

}  // namespace stepframe::viz
