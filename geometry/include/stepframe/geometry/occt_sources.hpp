#pragma once
// Reading a wireframe from OCCT objects a pipeline already holds in memory:
// a shape with attributes the caller supplies, or an XDE document. No file is
// written. This header needs OCCT's headers; step_reader.hpp does not.

#include "stepframe/geometry/source_info.hpp"
#include "stepframe/geometry/step_reader.hpp"

#include <Standard_Handle.hxx>
#include <TDocStd_Document.hxx>
#include <TopoDS_Shape.hxx>

#include <string>
#include <utility>
#include <vector>

namespace stepframe::geometry {

/// Attributes a caller attaches to a shape and its sub-shapes.
struct ShapeAttributes {
  std::string display_name = "<shape>";  ///< how messages and StepModel::file name the shape
  std::string length_unit = "mm";        ///< the shape's coordinate unit, reported as StepModel::length_unit
  double metres_per_unit = 1e-3;         ///< size of that unit in metres
  /// Per sub-shape (an edge, a wire, a compound, a vertex, or the shape
  /// itself): entity label, name, layers, product, colour (assembly_path is
  /// ignored). A sub-shape is found by TopoDS_Shape::IsSame, else by its
  /// underlying geometry (IsPartner), so an entry for an edge also covers its
  /// placed copies. An edge without an entry of its own takes each field from
  /// the nearest container that sets it (name, product, colour) and the layers
  /// of every container. An edge with no entity label anywhere is named
  /// "edge N" (N counts from 1 in exploration order). A vertex with an entry
  /// of its own that gives a name or layers is a labelled point.
  std::vector<std::pair<TopoDS_Shape, SourceInfo>> items;
};

/// The edges of `shape` as read_step gives them (straight pieces and curved
/// edges, labelled points; solids and faces skipped with one warning), in metres.
/// Throws StepReadError naming `attributes.display_name` when the shape is
/// null or has no usable edge, or the unit is not a positive length.
StepModel read_shape(const TopoDS_Shape& shape, const ShapeAttributes& attributes);

/// The edges of an XDE document (as STEPCAFControl_Reader or a CAD pipeline
/// fills it), walked like a STEP file's: assemblies and placements, names of
/// sub-shape labels, layers (XCAFDoc_LayerTool), curve colours
/// (XCAFDoc_ColorTool), product names from the part labels. Coordinates are
/// in the document's length unit (XCAFDoc_DocumentTool::GetLengthUnit;
/// millimetres when it has none, with a "no-length-unit" warning). An edge's
/// `entity` is the entry of the label that names it (e.g. "0:1:1:2:1"), else
/// "edge N". Throws StepReadError for a null document or one with no usable edge.
StepModel read_xde_document(const Handle(TDocStd_Document) & document, const std::string& display_name = "<XDE document>");

}  // namespace stepframe::geometry
