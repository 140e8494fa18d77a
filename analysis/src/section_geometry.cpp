#include "stepframe/analysis/section_geometry.hpp"

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <numbers>
#include <stdexcept>

namespace stepframe::analysis {
namespace {

constexpr double pi = std::numbers::pi;

// Part of a ring on the side s = ny y + nz z >= s0 (Sutherland-Hodgman
// clipping against one half-plane). For a concave ring the result may run
// back and forth along the cut line; those edges cancel in Green's integrals.
SectionRing clip(const SectionRing& ring, double ny, double nz, double s0) {
  SectionRing out;
  const std::size_t n = ring.size();
  for (std::size_t i = 0; i < n; ++i) {
    const SectionPoint& p = ring[i];
    const SectionPoint& q = ring[(i + 1) % n];
    const double sp = ny * p.y + nz * p.z - s0, sq = ny * q.y + nz * q.z - s0;
    if (sp >= 0) out.push_back(p);
    if ((sp >= 0) != (sq >= 0)) {
      const double t = sp / (sp - sq);
      out.push_back({p.y + t * (q.y - p.y), p.z + t * (q.z - p.z)});
    }
  }
  return out;
}

// Area and first moment of s = ny y + nz z over the part of the region with s >= s0.
std::pair<double, double> area_and_moment_above(const std::vector<SectionRing>& rings, double ny, double nz,
                                                double s0) {
  std::vector<SectionRing> part;
  for (const SectionRing& ring : rings) part.push_back(clip(ring, ny, nz, s0));
  const AreaIntegrals a = area_integrals(part);
  return {a.A, a.A * (ny * a.cy + nz * a.cz)};
}

}  // namespace

SectionRing rounded_ring(const std::vector<RoundedCorner>& corners, int segments_per_quarter) {
  SectionRing ring;
  const std::size_t n = corners.size();
  for (std::size_t i = 0; i < n; ++i) {
    const RoundedCorner& c = corners[i];
    if (c.r <= 0) {
      ring.push_back({c.y, c.z});
      continue;
    }
    const RoundedCorner& a = corners[(i + n - 1) % n];
    const RoundedCorner& b = corners[(i + 1) % n];
    // Unit vectors from the corner towards its neighbours.
    double u1y = a.y - c.y, u1z = a.z - c.z, u2y = b.y - c.y, u2z = b.z - c.z;
    const double l1 = std::hypot(u1y, u1z), l2 = std::hypot(u2y, u2z);
    u1y /= l1, u1z /= l1, u2y /= l2, u2z /= l2;
    // Tangent circle (elementary geometry): the angle phi between the edges,
    // tangent points at r / tan(phi/2) from the corner, centre on the bisector
    // at r / sin(phi/2).
    const double phi = std::acos(std::clamp(u1y * u2y + u1z * u2z, -1.0, 1.0));
    const double d = c.r / std::tan(0.5 * phi);
    if (d > l1 + 1e-12 || d > l2 + 1e-12)
      throw std::invalid_argument("section outline: a corner radius is larger than its edges allow");
    double by = u1y + u2y, bz = u1z + u2z;
    const double lb = std::hypot(by, bz);
    by /= lb, bz /= lb;
    const double cy = c.y + by * c.r / std::sin(0.5 * phi), cz = c.z + bz * c.r / std::sin(0.5 * phi);
    const double a1 = std::atan2(c.z + u1z * d - cz, c.y + u1y * d - cy);
    double sweep = std::atan2(c.z + u2z * d - cz, c.y + u2y * d - cy) - a1;
    while (sweep > pi) sweep -= 2 * pi;
    while (sweep < -pi) sweep += 2 * pi;
    const int steps = std::max(1, static_cast<int>(std::ceil(std::abs(sweep) / (0.5 * pi) * segments_per_quarter - 1e-9)));
    for (int k = 0; k <= steps; ++k) {
      const double t = a1 + sweep * k / steps;
      ring.push_back({cy + c.r * std::cos(t), cz + c.r * std::sin(t)});
    }
  }
  return ring;
}

SectionRing circle_ring(double centre_y, double centre_z, double radius, int segments, bool anticlockwise) {
  SectionRing ring;
  for (int k = 0; k < segments; ++k) {
    const double t = 2 * pi * k / segments * (anticlockwise ? 1.0 : -1.0);
    ring.push_back({centre_y + radius * std::cos(t), centre_z + radius * std::sin(t)});
  }
  return ring;
}

AreaIntegrals area_integrals(const std::vector<SectionRing>& rings) {
  // Green's theorem over each edge (p, q) with c = p.y q.z - q.y p.z: the standard
  // polygon formulas for area, first and second moments (e.g. Bourke, "Calculating
  // the area and centroid of a polygon", 1988; common practice).
  double A = 0, Sy = 0, Sz = 0, Iyy0 = 0, Izz0 = 0, Iyz0 = 0;
  for (const SectionRing& ring : rings) {
    const std::size_t n = ring.size();
    for (std::size_t i = 0; i < n; ++i) {
      const SectionPoint& p = ring[i];
      const SectionPoint& q = ring[(i + 1) % n];
      const double c = p.y * q.z - q.y * p.z;
      A += c / 2;
      Sy += (p.y + q.y) * c / 6;                                            // integral of y dA
      Sz += (p.z + q.z) * c / 6;                                            // integral of z dA
      Izz0 += (p.y * p.y + p.y * q.y + q.y * q.y) * c / 12;                 // integral of y^2 dA
      Iyy0 += (p.z * p.z + p.z * q.z + q.z * q.z) * c / 12;                 // integral of z^2 dA
      Iyz0 += (p.y * q.z + 2 * p.y * p.z + 2 * q.y * q.z + q.y * p.z) * c / 24;  // integral of y z dA
    }
  }
  AreaIntegrals r;
  r.A = A;
  if (A == 0) return r;
  r.cy = Sy / A;
  r.cz = Sz / A;
  // Parallel-axis theorem to the centroid.
  r.Iyy = Iyy0 - A * r.cz * r.cz;
  r.Izz = Izz0 - A * r.cy * r.cy;
  r.Iyz = Iyz0 - A * r.cy * r.cz;
  return r;
}

double plastic_modulus(const std::vector<SectionRing>& rings, double ny, double nz) {
  double lo = 1e300, hi = -1e300;
  for (const SectionRing& ring : rings)
    for (const SectionPoint& p : ring) {
      const double s = ny * p.y + nz * p.z;
      lo = std::min(lo, s), hi = std::max(hi, s);
    }
  const AreaIntegrals all = area_integrals(rings);
  const double total = all.A;
  const double centroid = ny * all.cy + nz * all.cz;
  // The axis through the centroid halves a shape symmetric about it; otherwise the
  // equal-area axis by bisection (the area above it falls monotonically as it rises).
  double s0 = centroid;
  if (std::abs(area_and_moment_above(rings, ny, nz, centroid).first - 0.5 * total) > 1e-12 * total) {
    for (int iteration = 0; iteration < 100 && hi - lo > 1e-12 * (hi - lo + std::abs(hi)); ++iteration) {
      const double mid = 0.5 * (lo + hi);
      if (area_and_moment_above(rings, ny, nz, mid).first > 0.5 * total) lo = mid;
      else hi = mid;
    }
    s0 = 0.5 * (lo + hi);
  }
  // Wpl = first moment of the half above the axis + that of the half below
  // (EN 1993-1-1 6.2.5 plastic resistance, common practice).
  const auto [a_above, m_above] = area_and_moment_above(rings, ny, nz, s0);
  const double m_all = all.A * centroid;
  const double a_below = all.A - a_above, m_below = m_all - m_above;
  return (m_above - s0 * a_above) - (m_below - s0 * a_below);
}

std::vector<SectionRing> to_axes(const std::vector<SectionRing>& rings, double dy, double dz, double angle) {
  const double c = std::cos(angle), s = std::sin(angle);
  std::vector<SectionRing> out;
  for (const SectionRing& ring : rings) {
    SectionRing moved;
    for (const SectionPoint& p : ring) {
      const double y = p.y - dy, z = p.z - dz;
      moved.push_back({c * y + s * z, -s * y + c * z});  // rotation by -angle
    }
    out.push_back(std::move(moved));
  }
  return out;
}

std::vector<SectionPoint> convex_hull(std::vector<SectionPoint> points) {
  std::sort(points.begin(), points.end(),
            [](const SectionPoint& a, const SectionPoint& b) { return a.y < b.y || (a.y == b.y && a.z < b.z); });
  if (points.size() < 3) return points;
  const auto cross = [](const SectionPoint& o, const SectionPoint& a, const SectionPoint& b) {
    return (a.y - o.y) * (b.z - o.z) - (a.z - o.z) * (b.y - o.y);
  };
  std::vector<SectionPoint> hull(2 * points.size());
  std::size_t k = 0;
  const double eps = 1e-15;
  for (std::size_t i = 0; i < points.size(); ++i) {  // lower hull
    while (k >= 2 && cross(hull[k - 2], hull[k - 1], points[i]) <= eps) --k;
    hull[k++] = points[i];
  }
  for (std::size_t i = points.size() - 1, lower = k + 1; i-- > 0;) {  // upper hull
    while (k >= lower && cross(hull[k - 2], hull[k - 1], points[i]) <= eps) --k;
    hull[k++] = points[i];
  }
  hull.resize(k - 1);
  return hull;
}

}  // namespace stepframe::analysis
