#pragma once
// How the VTK files are compressed.

namespace stepframe::viz {

/// Compression of the binary data blocks of a VTK XML file. Every VTK reader
/// (VTK 8.2 and later) reads all three.
enum class VtkCompression {
  lz4,   ///< fast: about ten times faster to write than zlib, files about a third larger (default)
  zlib,  ///< smaller files, slow to write
  none,  ///< largest files, fastest to write
};

}  // namespace stepframe::viz
