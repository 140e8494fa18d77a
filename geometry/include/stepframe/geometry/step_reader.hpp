#pragma once
// Reading a STEP wireframe into straight edges in metres.

#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/source_info.hpp"

#include <Eigen/Core>

#include <filesystem>
#include <stdexcept>
#include <string>
#include <vector>

namespace stepframe::geometry {

/// A straight edge of the wireframe, end points in metres (global axes after
/// every assembly placement is applied).
struct WireEdge {
  Eigen::Vector3d start;
  Eigen::Vector3d end;
  SourceInfo source;
};

/// Everything read from one STEP file.
struct StepModel {
  std::filesystem::path file;
  std::string length_unit;         ///< the unit the file declares, e.g. "mm", "m", "inch"
  double metres_per_unit = 1e-3;   ///< factor from the file's length unit to metres
  std::vector<WireEdge> edges;
  std::vector<Diagnostic> diagnostics;  ///< skipped curves, dropped zero-length edges, ...
};

/// Thrown when the file cannot be read at all (missing, not STEP, no usable edges).
/// what() names the file and says what to do.
class StepReadError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

/// Reads a STEP file with OCCT's XDE reader. Collects straight edges from
/// geometric curve sets and edge-based wireframes, with their attributes.
///
/// - Every placed instance of a part yields its own edges, in global axes.
/// - Coordinates are converted to metres whatever unit the file declares;
///   `length_unit` and `metres_per_unit` report the declared unit.
/// - A line is one edge; a polyline (or any degree-1 B-spline) gives one edge
///   per span, all with the polyline's entity id. An edge runs from its STEP
///   edge_start to edge_end; a curve of a curve set in its own sense.
/// - Diagnostics (all warnings unless noted), by code:
///   "curved-edge-skipped" a non-straight curve or edge, named by entity;
///   "unbounded-curve-skipped" an untrimmed line or curve;
///   "zero-length-edge" an edge or curve with no length, dropped;
///   "curve-not-translated" a curve or edge OCCT gave no edge for;
///   "bodies-skipped" how many solids, shells and faces were ignored;
///   "no-length-unit" no unit declared, millimetres assumed;
///   "mixed-length-units" (info) parts declare different units;
///   "edge-without-entity" (info) edges not traced to a STEP entity.
///
/// Throws StepReadError for a missing or unparsable file, or one with no
/// straight edge. OCCT's STEP translator keeps process-wide settings and
/// messages: do not read or write STEP files from several threads at once.
StepModel read_step(const std::filesystem::path& file);

}  // namespace stepframe::geometry
