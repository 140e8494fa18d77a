#include "stepframe/analysis/element_recovery.hpp"

#include "stepframe/analysis/geometric_stiffness.hpp"

#include <Eigen/Geometry>
#include <boost/math/tools/minima.hpp>

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <stdexcept>

namespace stepframe::analysis {
namespace {

// Torsional shear stress per unit torque [1/m^3] (see section_stress).
double torsion_factor(const Section& s) {
  const double t = s.t_max > 0 ? s.t_max : std::min(s.depth, s.width);  // shapes always give t_max
  switch (s.shape) {
    case SectionShape::rolled_i:
    case SectionShape::welded_i:
    case SectionShape::channel:
    case SectionShape::angle:
    case SectionShape::tee:
    case SectionShape::flat:
      return t / s.J;  // thin open section: tau = T t / J
    case SectionShape::rhs: {
      const double am = (s.depth - t) * (s.width - t);  // area enclosed by the wall's mid-line
      return 1.0 / (2.0 * am * t);                      // Bredt: tau = T / (2 A_m t)
    }
    case SectionShape::chs:
    case SectionShape::round_bar:
      return 0.5 * s.depth / s.J;  // circular shaft, exact: tau = T r / J at the outer surface
    case SectionShape::custom:
      break;
  }
  // Given by properties: the stated torsion modulus, else the thickest plate of an open thin-walled
  // section (tau = T t / J), else nothing is known and torsion is left out (the model builder warns).
  if (s.Wt > 0) return 1.0 / s.Wt;
  if (s.t_max > 0) return s.t_max / s.J;
  return 0.0;
}

// Root of the quadratic through (x_k, v_k), k = 0..2, inside [lo, hi].
void quadratic_roots(double x0, double x1, double x2, double v0, double v1, double v2, double lo, double hi,
                     std::vector<double>& out) {
  // Newton form: v(x) = v0 + d1 (x - x0) + d2 (x - x0)(x - x1).
  const double d01 = (v1 - v0) / (x1 - x0), d12 = (v2 - v1) / (x2 - x1);
  const double d2 = (d12 - d01) / (x2 - x0);
  // In powers of s = x - x0: d2 s^2 + (d01 - d2 (x1 - x0)) s + v0 = 0.
  const double a = d2, b = d01 - d2 * (x1 - x0), c = v0;
  const double scale = std::abs(v0) + std::abs(v1) + std::abs(v2);
  if (scale == 0) return;
  auto keep = [&](double s) {
    const double x = x0 + s;
    if (x > lo && x < hi) out.push_back(x);
  };
  if (std::abs(a) * (hi - lo) * (hi - lo) <= 1e-12 * scale) {
    if (std::abs(b) * (hi - lo) > 1e-12 * scale) keep(-c / b);
    return;
  }
  const double disc = b * b - 4 * a * c;
  if (disc < 0) return;
  const double q = -0.5 * (b + std::copysign(std::sqrt(disc), b));
  keep(q / a);
  if (q != 0) keep(c / q);
}

}  // namespace

SectionStress section_stress(const Section& s, const Vector6d& f) {
  SectionStress out;
  // Normal stress sigma = N/A + My z/Iy - Mz y/Iz (results.hpp sign convention).
  auto sigma = [&](double y, double z) { return f(0) / s.A + f(4) * z / s.Iy - f(5) * y / s.Iz; };
  if (!s.stress_points.empty()) {
    for (const SectionPoint& p : s.stress_points) out.max_abs_normal = std::max(out.max_abs_normal, std::abs(sigma(p.y, p.z)));
  } else {
    // Bounding-box corners with the elastic moduli: |N|/A + |My|/Wy + |Mz|/Wz
    // (doubly symmetric box; common practice).
    out.max_abs_normal = std::abs(f(0)) / s.A + std::abs(f(4)) / s.Wy() + std::abs(f(5)) / s.Wz();
  }
  const double avy = s.Avy > 0 ? s.Avy : s.A, avz = s.Avz > 0 ? s.Avz : s.A;
  out.shear = std::abs(f(1)) / avy + std::abs(f(2)) / avz + std::abs(f(3)) * torsion_factor(s);
  // EN 1993-1-1 6.2.1(5): (sigma/fy)^2 + 3 (tau/fy)^2 <= 1, i.e. sqrt(sigma^2 + 3 tau^2) <= fy.
  out.von_mises = std::sqrt(out.max_abs_normal * out.max_abs_normal + 3 * out.shear * out.shear);
  return out;
}

double max_fibre_stress(const Section& section, const Vector6d& forces) {
  return section_stress(section, forces).max_abs_normal;
}

namespace {

struct Recovery {
  Vector12d u;      // the element's own end displacements, local axes
  Vector12d end;    // end actions, local axes
};

Recovery solve_ends(const ElementState& s) {
  Matrix12d k = local_stiffness(s.properties);
  if (s.second_order) k += local_geometric_stiffness(s.properties, s.axial_force);
  const Vector12d fe = s.flexibility ? fixed_end_actions(s.properties, s.loads, *s.flexibility)
                                      : fixed_end_actions(s.properties, s.loads);
  const Vector12d u_nodes = to_local(s.axes, s.end_displacements);
  Recovery r;
  r.u = element_end_displacements(k, fe, s.releases, u_nodes);
  r.end = k * r.u + fe;  // superposition of deformation and fixed-end actions (common practice)
  return r;
}

}  // namespace

Vector12d element_end_actions(const ElementState& state) { return solve_ends(state).end; }

LineResult recover_element(const ElementState& s, std::size_t stations, LineDetail detail) {
  if (stations < 2) throw std::invalid_argument("recover_element: at least 2 stations are needed (both ends)");
  const double L = s.properties.length;
  const Recovery ends = solve_ends(s);
  const Vector6d f0 = ends.end.head<6>();
  const Vector6d d0 = ends.u.head<6>();
  LineResult result;
  result.length = L;
  const bool keep_stations = detail != LineDetail::summary;
  if (keep_stations) result.stations.reserve(stations);
  auto station_x = [&](std::size_t k) {  // the last station exactly at L (no rounding drift)
    return k + 1 == stations ? L : L * static_cast<double>(k) / static_cast<double>(stations - 1);
  };
  if (detail == LineDetail::forces && !s.second_order) {
    // First order: the forces follow from the start actions and the loads alone (statics).
    for (std::size_t k = 0; k < stations; ++k) {
      Station& st = result.stations.emplace_back();
      st.x = station_x(k);
      st.position = s.origin + st.x * s.axes.row(0).transpose();
      st.forces = internal_forces_at(f0, s.loads, st.x);
    }
    result.start_forces = result.stations.front().forces;
    result.end_forces = result.stations.back().forces;
    return result;
  }
  // The beam equations carried from the start end at the far end agree with the
  // end displacements up to rounding in first order; in second order the
  // element's P-delta makes them differ slightly, and the difference is spread
  // linearly so the deformed axis meets both nodes.
  const Vector6d closure = ends.u.tail<6>() - element_state_at(s.properties, d0, f0, s.loads, L);

  // (u, v, w, rx, ry, rz) at x, local axes, from the beam equations' state there.
  auto closed = [&](const Vector6d& state, double x) -> Vector6d { return state + (x / L) * closure; };
  auto state_local = [&](double x) -> Vector6d {
    return closed(element_state_at(s.properties, d0, f0, s.loads, x), x);
  };
  auto displacement_local = [&](double x) -> Eigen::Vector3d { return state_local(x).head<3>(); };
  const Eigen::Vector3d start_displacement = displacement_local(0);
  // The forces at x, from the first-order forces there (internal_forces_at), where the axis has the
  // displacement u (used in second order only).
  auto with_p_delta = [&](Vector6d f, const Eigen::Vector3d& u) -> Vector6d {
    if (s.second_order) {
      // Moments about the displaced cut point: (x e_x + dd) x F0 adds dd x F0,
      // dd = lateral displacement of the axis from the start (P-delta).
      const Eigen::Vector3d dd = u - start_displacement;
      f(4) += dd.z() * f0(0);
      f(5) -= dd.y() * f0(0);
    }
    return f;
  };
  auto forces_at = [&](double x) -> Vector6d {
    return with_p_delta(internal_forces_at(f0, s.loads, x), s.second_order ? displacement_local(x) : start_displacement);
  };

  // Full detail: the distance of the deformed axis from the line through the deformed ends at each station,
  // in local axes as the stations are recovered, keeping the two largest (refined below).
  const bool full = detail == LineDetail::full || detail == LineDetail::summary;
  const Eigen::Vector3d& a = start_displacement;
  const Eigen::Vector3d chord =
      full ? Eigen::Vector3d(Eigen::Vector3d(L, 0, 0) + displacement_local(L) - a) : Eigen::Vector3d::Zero();
  const double chord_length = chord.norm();
  auto offset_of = [&](double x, const Eigen::Vector3d& u) {
    const Eigen::Vector3d p = Eigen::Vector3d(x, 0, 0) + u - a;
    return chord_length > 0 ? chord.cross(p).norm() / chord_length : p.norm();
  };
  std::array<std::size_t, 2> peaks{0, 0};
  std::array<double, 2> heights{-1, -1};

  for (std::size_t k = 0; k < stations; ++k) {
    const double x = station_x(k);
    const ElementPoint point = element_point_at(s.properties, d0, f0, s.loads, x);  // one pass over the loads
    const Vector6d state = closed(point.state, x);
    if (full) {
      const double distance = offset_of(x, state.head<3>());
      if (distance > heights[0]) peaks[1] = peaks[0], heights[1] = heights[0], peaks[0] = k, heights[0] = distance;
      else if (distance > heights[1]) peaks[1] = k, heights[1] = distance;
    }
    const Vector6d forces = with_p_delta(point.forces, state.head<3>());
    const SectionStress stress = section_stress(*s.section, forces);
    if (k == 0) result.start_forces = forces;
    if (k + 1 == stations) result.end_forces = forces;
    result.max_abs_stress = std::max(result.max_abs_stress, stress.max_abs_normal);
    if (stress.von_mises > result.max_von_mises) result.max_von_mises = stress.von_mises, result.max_von_mises_at = x;
    if (!keep_stations) continue;
    Station& st = result.stations.emplace_back();
    st.x = x;
    st.position = s.origin + x * s.axes.row(0).transpose();
    st.forces = forces;
    st.displacement = s.axes.transpose() * state.head<3>();
    st.rotation = s.axes.transpose() * state.tail<3>();
    st.max_abs_stress = stress.max_abs_normal;
    st.max_shear_stress = stress.shear;
    st.von_mises = stress.von_mises;
  }
  if (!full) return result;  // stations, or forces in second order

  // Candidate points of the extremes: ends, load breakpoints, and the zero
  // crossings of the shears (for moments) and of the load intensity (for
  // shears), found from the exact quadratic / linear pieces between breakpoints.
  const std::vector<double> breaks = load_breakpoints(s.loads, L);
  // Each breakpoint, and per piece at most two shear roots, two intensity roots and two points just inside it.
  std::vector<double> candidates;
  candidates.reserve(7 * breaks.size());
  candidates.assign(breaks.begin(), breaks.end());
  for (std::size_t i = 0; i + 1 < breaks.size(); ++i) {
    const double lo = breaks[i], hi = breaks[i + 1], h = hi - lo;
    if (!(h > 0)) continue;
    const double xa = lo + 0.25 * h, xb = lo + 0.5 * h, xc = lo + 0.75 * h;
    const Vector6d fa = internal_forces_at(f0, s.loads, xa), fb = internal_forces_at(f0, s.loads, xb),
                   fc = internal_forces_at(f0, s.loads, xc);
    for (int comp : {1, 2}) quadratic_roots(xa, xb, xc, fa(comp), fb(comp), fc(comp), lo, hi, candidates);
    const Eigen::Vector3d qa = load_intensity(s.loads, xa), qc = load_intensity(s.loads, xc);
    for (int comp : {1, 2}) {
      const double slope = (qc(comp) - qa(comp)) / (xc - xa);
      if (slope != 0) {
        const double x = xa - qa(comp) / slope;
        if (x > lo && x < hi) candidates.push_back(x);
      }
    }
    // Just inside each piece as well, to catch both sides of a point load.
    candidates.push_back(lo + 1e-9 * h);
    candidates.push_back(hi - 1e-9 * h);
  }
  for (int c = 0; c < 6; ++c) {
    DiagramExtreme& e = result.extremes[static_cast<std::size_t>(c)];
    e.max = e.min = result.start_forces(c);
    e.x_max = e.x_min = 0;
  }
  for (double x : candidates) {
    const Vector6d f = forces_at(x);
    for (int c = 0; c < 6; ++c) {
      DiagramExtreme& e = result.extremes[static_cast<std::size_t>(c)];
      if (f(c) > e.max) e.max = f(c), e.x_max = x;
      if (f(c) < e.min) e.min = f(c), e.x_min = x;
    }
    const SectionStress stress = section_stress(*s.section, f);
    result.max_abs_stress = std::max(result.max_abs_stress, stress.max_abs_normal);
    if (stress.von_mises > result.max_von_mises) result.max_von_mises = stress.von_mises, result.max_von_mises_at = x;
  }

  // Distance of the deformed axis from the line through the deformed ends: largest at a station,
  // then refined by Brent's method (parabolic steps with golden-section safeguards; Brent, Algorithms
  // for Minimization without Derivatives, 1973, ch. 5; Boost.Math's brent_find_minima) within one
  // station spacing either side of the two largest stations (the offset is smooth and unimodal there;
  // two, so that a second hump of nearly the same height is not missed).
  auto offset = [&](double x) { return offset_of(x, displacement_local(x)); };
  result.max_local_deflection = heights[0];
  result.max_local_deflection_at = station_x(peaks[0]);
  const double step = L / static_cast<double>(stations - 1);
  for (int which = 0; which < 2; ++which) {
    if (!(heights[static_cast<std::size_t>(which)] > 0)) continue;
    // A second station next to the first is on the same hump: the first bracket covers it.
    if (which == 1 && (peaks[1] + 1 == peaks[0] || peaks[0] + 1 == peaks[1])) continue;
    const double centre = station_x(peaks[static_cast<std::size_t>(which)]);
    const double lo = std::max(0.0, centre - step), hi = std::min(L, centre + step);
    // x to 2^-23 of itself: at a smooth maximum the value is then within about 1e-14 of the peak's.
    std::uintmax_t iterations = 60;
    const auto [x, negative] =
        boost::math::tools::brent_find_minima([&](double at) { return -offset(at); }, lo, hi, 24, iterations);
    const double distance = -negative;
    if (distance > result.max_local_deflection) {
      result.max_local_deflection = distance;
      result.max_local_deflection_at = x;
    }
  }
  if (!(result.max_local_deflection > 0)) result.max_local_deflection = 0, result.max_local_deflection_at = 0;
  return result;
}

}  // namespace stepframe::analysis
