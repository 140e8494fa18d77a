#pragma once
// Collecting edges and labelled points from OCCT shapes, whatever they were
// read from (a STEP file, an XDE document, a caller's shape). Where the
// attributes come from is the `OriginLookup`'s business.

#include "stepframe/geometry/step_reader.hpp"

#include <Standard_Handle.hxx>
#include <Standard_Transient.hxx>
#include <TopLoc_Location.hxx>

#include <cstddef>
#include <array>
#include <optional>
#include <set>
#include <string>
#include <unordered_set>
#include <vector>

class TDF_Label;
class TDocStd_Document;
class TopoDS_Edge;
class TopoDS_Shape;

namespace stepframe::geometry::detail {

/// Where an edge came from: its attributes and, for STEP, the entity.
struct Origin {
  SourceInfo info;                     ///< product and assembly path left empty
  Handle(Standard_Transient) entity;   ///< null when unknown or not from STEP
};

/// Labels at the ends of an edge (and at polyline corners), in the order the
/// edge's break points run from its start.
struct CornerLabels {
  std::vector<std::optional<SourceInfo>> at;  ///< one per break point, or empty
};

class OriginLookup {
 public:
  virtual ~OriginLookup() = default;
  /// Attributes of an edge (unplaced geometry identifies it).
  virtual Origin edge(const TopoDS_Edge& edge) const = 0;
  /// A named or layered vertex's attributes; nullopt for an unlabelled vertex.
  virtual std::optional<SourceInfo> vertex(const TopoDS_Shape& vertex) const = 0;
  /// True when the edge runs against the direction its source defines
  /// (e.g. a STEP edge_curve with same_sense .F.).
  virtual bool runs_against_source(const TopoDS_Edge& /*edge*/, const Origin& /*origin*/) const { return false; }
  /// Labels of the edge's break points (vertices, trimming points, polyline
  /// corners), given how many break points there are.
  virtual CornerLabels corners(const Origin& /*origin*/, std::size_t /*break_points*/) const { return {}; }
};

/// What the walk collects and counts.
struct Harvest {
  const OriginLookup& origins;
  double metres_per_model_unit;  ///< the shapes' length unit in metres
  StepModel& model;
  std::unordered_set<const Standard_Transient*> reached;  ///< entities met, edge or not
  /// (entity, place in micrometres) of the points already kept.
  std::set<std::pair<std::string, std::array<long long, 3>>> labelled;
  std::size_t bodies = 0;
  std::size_t edges_seen = 0;
  std::size_t without_entity = 0;
};

/// Edges and labelled points of one placed part. Solids, shells and faces
/// (with their edges) are counted in `bodies` and left out.
void harvest_shape(const TopoDS_Shape& shape, const std::string& product, const std::string& assembly_path,
                   Harvest& harvest);

/// Walks an XDE document's assembly tree from its free shapes: every placed
/// component instance yields its own edges, with placements composed.
void harvest_document(const Handle(TDocStd_Document) & document, Harvest& harvest);

/// The name XDE keeps on a label, or "".
std::string label_name(const TDF_Label& label);

/// The warnings and info every reader adds after the walk ("bodies-skipped",
/// "edge-without-entity"); throws StepReadError naming `source` when no edge
/// was found.
void finish_harvest(const Harvest& harvest, const std::string& source, const std::string& advice);

}  // namespace stepframe::geometry::detail
