#include "curve_sampling.hpp"

#include <Adaptor3d_Curve.hxx>
#include <GeomAbs_Shape.hxx>
#include <gp_Pnt.hxx>
#include <gp_Vec.hxx>

#include <algorithm>
#include <cmath>
#include <utility>

namespace stepframe::geometry::detail {

namespace {

struct Station {
  double u;
  gp_Pnt point;
  gp_Vec tangent;  // unit, or zero where the derivative vanishes
};

Station station(const Adaptor3d_Curve& curve, double u) {
  gp_Pnt p;
  gp_Vec d1;
  curve.D1(u, p, d1);
  const double length = d1.Magnitude();
  return {u, p, length > 0.0 ? d1 / length : gp_Vec(0, 0, 0)};
}

// Angle between two unit tangents; 0 when either is undefined.
double turn_between(const gp_Vec& a, const gp_Vec& b) {
  if (a.SquareMagnitude() == 0.0 || b.SquareMagnitude() == 0.0) return 0.0;
  return std::atan2(a.Crossed(b).Magnitude(), a.Dot(b));
}

// Appends the stations after `from` up to and including `to`, bisecting while
// the tangent turns more than `limit` over a piece. The mid station is checked
// too, so a piece whose end tangents agree but whose middle bends is split.
void refine(const Adaptor3d_Curve& curve, const Station& from, const Station& to, double limit, int depth,
            std::vector<Station>& out) {
  constexpr int max_depth = 24;  // 2^24 pieces per initial interval: far below any modelling length
  const Station mid = station(curve, 0.5 * (from.u + to.u));
  const double turn = turn_between(from.tangent, mid.tangent) + turn_between(mid.tangent, to.tangent);
  if (turn <= limit || depth >= max_depth) {
    out.push_back(to);
    return;
  }
  refine(curve, from, mid, limit, depth + 1, out);
  refine(curve, mid, to, limit, depth + 1, out);
}

}  // namespace

std::vector<CurveSample> sample_curve(const Adaptor3d_Curve& curve, double max_step_turn) {
  const double first = curve.FirstParameter();
  const double last = curve.LastParameter();
  // Start from several pieces per smooth span so no bend hides between two
  // tangents that happen to agree.
  const int spans = std::max(1, curve.NbIntervals(GeomAbs_C2));
  const int pieces = 8 * spans;
  std::vector<Station> stations{station(curve, first)};
  for (int i = 1; i <= pieces; ++i) {
    const double u = i == pieces ? last : first + (last - first) * i / pieces;
    const Station next = station(curve, u);
    const Station from = stations.back();
    refine(curve, from, next, max_step_turn, 0, stations);
  }
  std::vector<CurveSample> samples;
  samples.reserve(stations.size());
  double turn = 0.0;
  for (std::size_t i = 0; i < stations.size(); ++i) {
    if (i > 0) turn += turn_between(stations[i - 1].tangent, stations[i].tangent);
    const gp_Pnt& p = stations[i].point;
    samples.push_back({Eigen::Vector3d(p.X(), p.Y(), p.Z()), turn});
  }
  return samples;
}

std::vector<CurveSample> reversed(const std::vector<CurveSample>& samples) {
  std::vector<CurveSample> out(samples.rbegin(), samples.rend());
  const double total = samples.empty() ? 0.0 : samples.back().turn;
  for (CurveSample& s : out) s.turn = total - s.turn;
  return out;
}

}  // namespace stepframe::geometry::detail
