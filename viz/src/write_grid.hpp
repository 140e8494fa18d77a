#pragma once
// Writes an unstructured grid as binary, zlib-compressed VTK XML.

#include <vtkNew.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <filesystem>
#include <stdexcept>

namespace stepframe::viz::detail {

inline void write_grid(const std::filesystem::path& file, vtkUnstructuredGrid* grid) {
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(file.string().c_str());
  writer->SetInputData(grid);
  writer->SetDataModeToAppended();
  writer->EncodeAppendedDataOff();
  writer->SetCompressorTypeToZLib();
  if (writer->Write() != 1) throw std::runtime_error(file.string() + ": could not write the VTK file");
}

}  // namespace stepframe::viz::detail
