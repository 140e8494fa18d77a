#pragma once
// Reading a STEP wireframe into edges in metres: straight pieces, and curved
// edges (arcs, splines) as finely sampled curves.

#include "stepframe/geometry/diagnostic.hpp"
#include "stepframe/geometry/source_info.hpp"
#include "stepframe/geometry/step_structure.hpp"

#include <Eigen/Core>

#include <filesystem>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::geometry {

/// A point on a curved edge and the total turn of the curve's tangent from the
/// edge's start up to it [rad] (0 at the start, growing along the edge).
struct CurveSample {
  Eigen::Vector3d point;
  double turn = 0.0;
};

/// An edge of the wireframe, end points in metres (global axes after every
/// assembly placement is applied).
struct WireEdge {
  Eigen::Vector3d start;
  Eigen::Vector3d end;
  SourceInfo source;
  /// Empty for a straight edge. For a curved edge (arc, spline): points on the
  /// curve from `start` to `end` (both included), so close together that the
  /// tangent turns by at most about 0.25 degree from one to the next.
  std::vector<CurveSample> curve;

  bool curved() const { return !curve.empty(); }
};

/// A point the file names or puts on a layer: a cartesian point of a curve
/// set, a vertex of an edge, a trimming point, a polyline corner or the vertex
/// of a vertex shell (named on the vertex, its point or the shell). Points
/// select nodes in a project (`where: {point_name: ...}`).
struct LabelledPoint {
  Eigen::Vector3d at;   ///< metres, global axes
  SourceInfo source;    ///< entity = the point or vertex entity; name, layers, product
};

/// Everything read from one STEP file (or in-memory model).
struct StepModel {
  std::filesystem::path file;      ///< the file, or the display name of an in-memory source
  std::string length_unit;         ///< the unit the file declares, e.g. "mm", "m", "inch"
  double metres_per_unit = 1e-3;   ///< factor from the file's length unit to metres
  std::vector<WireEdge> edges;
  std::vector<LabelledPoint> points;
  std::vector<Diagnostic> diagnostics;  ///< skipped curves, dropped zero-length edges, ...
};

/// Thrown when the file cannot be read at all (missing, not STEP, no usable edges).
/// what() names the file and says what to do.
class StepReadError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

/// Reads a STEP file with OCCT's XDE reader. Collects the edges of geometric
/// curve sets (geometrically bounded wireframes), edge-based and shell-based
/// wireframes, and loose edges and wires, with their attributes.
///
/// - Every placed instance of a part yields its own edges, in global axes;
///   assemblies may nest to any depth and place parts with rotations.
/// - Coordinates are converted to metres whatever unit the file declares;
///   `length_unit` and `metres_per_unit` report the declared unit.
/// - A line is one edge; a polyline (or any degree-1 B-spline) gives one edge
///   per span, all with the polyline's entity id. Arcs, circles, ellipses,
///   B-splines of higher degree and curved pieces of composite curves give one
///   curved edge each (see WireEdge::curve). An edge runs from its STEP
///   edge_start to edge_end; a curve of a curve set in its own sense.
/// - Attributes: the entity's own name, else the nearest set, model or
///   representation that holds it; layers of the entity and of each of those;
///   the product of the part and its assembly path.
/// - Named or layered points become `points`.
/// - Diagnostics (all warnings unless noted), by code:
///   "unbounded-curve-skipped" an untrimmed line or curve;
///   "zero-length-edge" an edge or curve with no length, dropped;
///   "curve-not-translated" a curve or edge OCCT gave no edge for;
///   "bodies-skipped" how many solids, shells and faces were ignored (one warning);
///   "no-length-unit" no unit declared, millimetres assumed;
///   "mixed-length-units" (info) parts declare different units;
///   "edge-without-entity" (info) edges not traced to a STEP entity;
///   "step-string-shortened" a string longer than OCCT reads (max_step_token), cut.
///
/// Throws StepReadError for a missing or unparsable file, or one with no
/// usable edge. OCCT's STEP translator keeps process-wide settings and
/// messages: do not read or write STEP files from several threads at once.
StepModel read_step(const std::filesystem::path& file);
/// How read_step goes about a file; the model read is the same whatever they say.
struct StepReadOptions {
  /// Lists of references of this many items or more are cut before OCCT parses the file and put back
  /// after (step_structure.hpp; SIZE_MAX: none cut).
  std::size_t long_list = long_step_list;
  /// When not 0: a file whose members (curve sets or curves of one representation) number at least
  /// this many is read in two processes at once, this one and a child made with fork(), each reading
  /// about half the members (a 10,000-member file in about two thirds of the time). The file's
  /// structure must let the halves be read apart and joined exactly (one representation lists the
  /// members, placed once; members share no entity; no findings about single members); otherwise,
  /// and whenever the child fails, the file is read whole in this process. Only for a process that
  /// runs no other thread which could hold a lock the child needs (the command line sets it); 0 (the
  /// default) reads in this process only.
  std::size_t two_processes_from = 0;
};

/// As read_step, the way `options` say.
StepModel read_step(const std::filesystem::path& file, const StepReadOptions& options);
/// As read_step with only `long_list` set in the options (SIZE_MAX: no list cut).
StepModel read_step(const std::filesystem::path& file, std::size_t long_list);

/// The same for the text of a STEP file held in memory (ISO 10303-21).
/// `display_name` stands for the file in messages and in StepModel::file.
StepModel read_step_text(std::string_view step_text, std::string display_name);

}  // namespace stepframe::geometry
