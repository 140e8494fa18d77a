#pragma once
// Properties of plane regions bounded by polygons: the integration behind
// every shape in section_shapes.hpp. Arcs (root radii, corner radii) are
// turned into polygons first with rounded_ring.

#include "stepframe/analysis/section.hpp"

#include <vector>

namespace stepframe::analysis {

/// A polygon corner with an optional radius: the corner is replaced by the
/// circular arc of that radius tangent to both adjacent edges.
struct RoundedCorner {
  double y = 0;
  double z = 0;
  double r = 0;  ///< [m]; 0 keeps the sharp corner
};

/// The polygon through `corners` with each radius replaced by an arc of
/// `segments_per_quarter` chords per 90 degrees. The arc's chord end points lie
/// on the circle.
SectionRing rounded_ring(const std::vector<RoundedCorner>& corners, int segments_per_quarter);

/// A circle of `segments` chords (a multiple of 4, a vertex on each axis).
SectionRing circle_ring(double centre_y, double centre_z, double radius, int segments, bool anticlockwise = true);

/// Area integrals of a region: outer rings anticlockwise, holes clockwise
/// (signed areas add up). Second moments about the centroid.
struct AreaIntegrals {
  double A = 0;      ///< area
  double cy = 0;     ///< centroid
  double cz = 0;
  double Iyy = 0;    ///< integral of (z - cz)^2 dA: second moment about the y axis through the centroid
  double Izz = 0;    ///< integral of (y - cy)^2 dA
  double Iyz = 0;    ///< integral of (y - cy)(z - cz) dA (product of inertia)
};

/// Green's theorem over the polygon edges (exact for polygons).
AreaIntegrals area_integrals(const std::vector<SectionRing>& rings);

/// Plastic section modulus for bending whose neutral axis is perpendicular to
/// the unit direction (ny, nz): the axis that halves the area, then the sum of
/// the first moments of both halves about it [m^3].
double plastic_modulus(const std::vector<SectionRing>& rings, double ny, double nz);

/// Rings moved by (-dy, -dz) and turned by -angle: coordinates in axes that
/// are turned by `angle` (anticlockwise) and placed at (dy, dz).
std::vector<SectionRing> to_axes(const std::vector<SectionRing>& rings, double dy, double dz, double angle);

/// Vertices of the convex hull of all points, anticlockwise (Andrew's monotone chain).
std::vector<SectionPoint> convex_hull(std::vector<SectionPoint> points);

}  // namespace stepframe::analysis
