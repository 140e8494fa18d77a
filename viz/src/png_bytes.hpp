#pragma once
// An image encoded as PNG in memory by VTK's writer.

#include <vtkImageData.h>
#include <vtkNew.h>
#include <vtkPNGWriter.h>
#include <vtkUnsignedCharArray.h>

#include <cstdint>
#include <vector>

namespace stepframe::viz::detail {

inline std::vector<std::uint8_t> png_bytes(vtkImageData* image) {
  vtkNew<vtkPNGWriter> writer;
  writer->SetInputData(image);
  writer->WriteToMemoryOn();
  writer->Write();
  vtkUnsignedCharArray* bytes = writer->GetResult();
  const auto* first = bytes->GetPointer(0);
  return {first, first + bytes->GetNumberOfTuples() * bytes->GetNumberOfComponents()};
}

}  // namespace stepframe::viz::detail
