#pragma once
// Writes an unstructured grid as binary, compressed VTK XML (appended data,
// 32-bit ids and headers: half the size of 64-bit ones for any model that
// fits in 2^31 points).

#include "stepframe/viz/vtk_compression.hpp"

#include <vtkNew.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <filesystem>
#include <stdexcept>

namespace stepframe::viz::detail {

inline void write_grid(const std::filesystem::path& file, vtkUnstructuredGrid* grid, VtkCompression compression) {
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(file.string().c_str());
  writer->SetInputData(grid);
  writer->SetDataModeToAppended();
  writer->EncodeAppendedDataOff();
  writer->SetHeaderTypeToUInt32();
  writer->SetIdTypeToInt32();
  switch (compression) {
    case VtkCompression::lz4:
      writer->SetCompressorTypeToLZ4();
      break;
    case VtkCompression::zlib:
      writer->SetCompressorTypeToZLib();
      break;
    case VtkCompression::none:
      writer->SetCompressorTypeToNone();
      break;
  }
  if (writer->Write() != 1) throw std::runtime_error(file.string() + ": could not write the VTK file");
}

}  // namespace stepframe::viz::detail
