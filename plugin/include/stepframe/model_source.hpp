#pragma once
// Where the wireframe of a run comes from: a STEP file, STEP text held in
// memory, an OCCT shape with attributes supplied by the caller, or an OCCT
// XDE document. Pipelines that already hold shapes need not write a file.

#include "stepframe/geometry/source_info.hpp"
#include "stepframe/geometry/step_reader.hpp"

#include <filesystem>
#include <memory>
#include <string>
#include <variant>

class TopoDS_Shape;
class TDocStd_Document;

namespace stepframe::geometry {
struct ShapeAttributes;  // stepframe/geometry/occt_sources.hpp (needs OCCT's headers)
}

namespace stepframe {

/// A STEP file on disk.
struct StepFile {
  std::filesystem::path path;
};

/// The text of a STEP file held in memory (ISO 10303-21).
struct StepText {
  std::string text;
  std::string display_name = "<memory>";  ///< how messages name it
};

/// An OCCT shape whose edges are the members, with the attributes the caller
/// supplies: its length unit, a display name and, per sub-shape, entity
/// label, name, layers, product and colour (geometry::ShapeAttributes in
/// stepframe/geometry/occt_sources.hpp, which says how sub-shapes are matched).
/// Null attributes mean millimetres and none at all.
struct ShapeModel {
  std::shared_ptr<const TopoDS_Shape> shape;
  std::shared_ptr<const geometry::ShapeAttributes> attributes;
};

/// An OCCT XDE document (as STEPCAFControl_Reader or a CAD pipeline fills it);
/// names, layers and colours are read from it as from a file. Not owned: the
/// document must outlive the run and be held by an OCCT handle somewhere (as
/// every document an OCCT application creates is).
struct XdeDocument {
  const TDocStd_Document* document = nullptr;
  std::string display_name = "<XDE document>";
};

using ModelSource = std::variant<StepFile, StepText, ShapeModel, XdeDocument>;

/// How messages name the source.
std::string describe(const ModelSource& source);

/// Reads the source into edges in metres with their attributes (as
/// geometry::read_step, read_step_text, read_shape or read_xde_document do).
/// Throws geometry::StepReadError when it cannot be read (a null shape or
/// document included), and SourceNotAvailable for a kind of source this
/// build cannot read (none at present; kept for sources added later).
geometry::StepModel read_model_source(const ModelSource& source);

/// The kind of model source is not supported by this build of the library.
class SourceNotAvailable : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

}  // namespace stepframe
