#pragma once
// Shell-based wireframes (SHELL_BASED_WIREFRAME_SHAPE_REPRESENTATION, ISO
// 10303-42 shell_based_wireframe_model) are valid STEP that OCCT 7.6 does not
// know. Rewritten before parsing into the edge-based form OCCT does read,
// their edges keep their entity ids, names and layers.

#include <optional>
#include <string>
#include <string_view>

namespace stepframe::geometry::detail {

/// Cheap test: does the text mention a shell-based wireframe at all?
bool mentions_shell_wireframes(std::string_view step_text);

/// The text with every SHELL_BASED_WIREFRAME_MODEL turned into an
/// EDGE_BASED_WIREFRAME_MODEL (each WIRE_SHELL into a CONNECTED_EDGE_SET of the
/// edge curves of its loops, same entity number and name) and every
/// SHELL_BASED_WIREFRAME_SHAPE_REPRESENTATION into an
/// EDGE_BASED_WIREFRAME_SHAPE_REPRESENTATION. Each VERTEX_SHELL (which OCCT
/// 7.6 does not know either) becomes a GEOMETRIC_SET of its vertex's cartesian
/// point, same entity number and name, added to the representation's items so
/// OCCT makes the point a vertex; its vertex loop and vertex point stay as they
/// are. nullopt when there is nothing to rewrite.
std::optional<std::string> rewrite_shell_wireframes(std::string_view step_text);

}  // namespace stepframe::geometry::detail
