#include "stepframe/analysis/area_loads.hpp"

#include <Eigen/Geometry>

#include <algorithm>
#include <array>
#include <cmath>
#include <map>
#include <numbers>
#include <stdexcept>

namespace stepframe::analysis {
namespace {

using V2 = Eigen::Vector2d;
using Polygon = std::vector<V2>;

double cross(const V2& a, const V2& b) { return a.x() * b.y() - a.y() * b.x(); }

// Signed area (shoelace formula; positive counter-clockwise).
double signed_area(const Polygon& p) {
  double a = 0;
  for (std::size_t i = 0; i < p.size(); ++i) a += cross(p[i], p[(i + 1) % p.size()]);
  return 0.5 * a;
}

V2 centroid(const Polygon& p) {
  // Centroid of a polygon: sum (p_i + p_i+1) cross(p_i, p_i+1) / (6 A).
  V2 c = V2::Zero();
  for (std::size_t i = 0; i < p.size(); ++i) c += (p[i] + p[(i + 1) % p.size()]) * cross(p[i], p[(i + 1) % p.size()]);
  return c / (6 * signed_area(p));
}

// Even-odd ray test.
bool inside(const Polygon& p, const V2& q) {
  bool in = false;
  for (std::size_t i = 0, j = p.size() - 1; i < p.size(); j = i++)
    if ((p[i].y() > q.y()) != (p[j].y() > q.y()) &&
        q.x() < (p[j].x() - p[i].x()) * (q.y() - p[i].y()) / (p[j].y() - p[i].y()) + p[i].x())
      in = !in;
  return in;
}

bool convex(const Polygon& p) {
  const double sign = signed_area(p) > 0 ? 1 : -1;
  for (std::size_t i = 0; i < p.size(); ++i) {
    const V2 a = p[(i + 1) % p.size()] - p[i], b = p[(i + 2) % p.size()] - p[(i + 1) % p.size()];
    if (sign * cross(a, b) < -1e-12 * a.norm() * b.norm()) return false;
  }
  return true;
}

// Sutherland-Hodgman: the part of `subject` inside the convex counter-clockwise polygon `clip`.
Polygon clip_convex(Polygon subject, const Polygon& clip) {
  for (std::size_t i = 0; i < clip.size() && !subject.empty(); ++i) {
    const V2 a = clip[i], b = clip[(i + 1) % clip.size()];
    auto side = [&](const V2& q) { return cross(b - a, q - a); };
    Polygon out;
    for (std::size_t k = 0; k < subject.size(); ++k) {
      const V2 p = subject[k], q = subject[(k + 1) % subject.size()];
      const double sp = side(p), sq = side(q);
      if (sp >= 0) out.push_back(p);
      if ((sp >= 0) != (sq >= 0)) out.push_back(p + (q - p) * (sp / (sp - sq)));
    }
    subject = std::move(out);
  }
  return subject;
}

// A straight side of a panel: consecutive collinear elements from corner `from` to corner `to`.
struct Side {
  V2 from, to;
  struct Piece {
    std::size_t element;
    double s0, s1;  // along the side
    bool forward;   // the element runs from -> to
  };
  std::vector<Piece> pieces;
  double length() const { return (to - from).norm(); }
};

struct Face {
  std::vector<std::size_t> nodes;
  std::vector<std::size_t> elements;  // elements[i] joins nodes[i] and nodes[i + 1]
  Polygon outline;
};

// Distance of q from the segment a-b, and the position of its foot along it.
double segment_distance(const V2& a, const V2& b, const V2& q, double* along) {
  const V2 d = b - a;
  const double t = std::clamp((q - a).dot(d) / d.squaredNorm(), 0.0, 1.0);
  if (along) *along = t * d.norm();
  return (a + t * d - q).norm();
}

}  // namespace

AreaLoadResult distribute_area_load(const FrameModel& model, const AreaLoadInput& in) {
  const Eigen::Vector3d n = in.normal.normalized();
  // In-plane axes: e1 along the projection of global X (else Y), e2 = n x e1.
  Eigen::Vector3d e1 = Eigen::Vector3d::UnitX() - n.x() * n;
  if (e1.norm() < 1e-6) e1 = Eigen::Vector3d::UnitY() - n.y() * n;
  e1.normalize();
  const Eigen::Vector3d e2 = n.cross(e1);
  auto to2 = [&](const Eigen::Vector3d& p) { return V2((p - in.origin).dot(e1), (p - in.origin).dot(e2)); };
  auto to3 = [&](const V2& q) { return Eigen::Vector3d(in.origin + q.x() * e1 + q.y() * e2); };

  // The planar graph of the elements in the plane.
  std::map<std::size_t, std::vector<std::pair<std::size_t, std::size_t>>> adjacent;  // node -> (neighbour, element)
  for (std::size_t e : in.elements) {
    const auto [a, b] = model.elements.at(e).nodes;
    if (std::abs((model.nodes[a] - in.origin).dot(n)) > in.tolerance || std::abs((model.nodes[b] - in.origin).dot(n)) > in.tolerance)
      continue;
    adjacent[a].emplace_back(b, e);
    adjacent[b].emplace_back(a, e);
  }
  // Members ending free (a cantilever) bound no panel: pruned until every node has two or more.
  for (bool pruned = true; pruned;) {
    pruned = false;
    for (auto it = adjacent.begin(); it != adjacent.end();) {
      if (it->second.size() >= 2) {
        ++it;
        continue;
      }
      for (const auto& link : it->second) {
        auto& list = adjacent[link.first];
        const auto member = link.second;  // a plain name: clang 14 cannot capture a structured binding
        list.erase(std::remove_if(list.begin(), list.end(), [&](const auto& x) { return x.second == member; }),
                   list.end());
      }
      it = adjacent.erase(it);
      pruned = true;
    }
  }
  std::map<std::size_t, V2> at;
  for (auto& [node, list] : adjacent) {
    at[node] = to2(model.nodes[node]);
    const V2 p = at[node];
    std::sort(list.begin(), list.end(), [&](const auto& x, const auto& y) {
      const V2 dx = to2(model.nodes[x.first]) - p, dy = to2(model.nodes[y.first]) - p;
      return std::atan2(dx.y(), dx.x()) < std::atan2(dy.y(), dy.x());
    });
  }
  // Faces: from each half-edge u -> v, turn at v to the neighbour just clockwise of u (the face on the left).
  std::map<std::pair<std::size_t, std::size_t>, bool> used;
  std::vector<Face> faces;
  for (const auto& [start, list] : adjacent)
    for (const auto& [first, first_element] : list) {
      if (used[{start, first}]) continue;
      Face f;
      std::size_t u = start, v = first, e = first_element;
      while (!used[{u, v}]) {
        used[{u, v}] = true;
        f.nodes.push_back(u);
        f.elements.push_back(e);
        const auto& around = adjacent.at(v);
        const auto back = std::find_if(around.begin(), around.end(), [&](const auto& x) { return x.first == u && x.second == e; });
        const auto k = static_cast<std::size_t>(back - around.begin());
        const auto& next = around[(k + around.size() - 1) % around.size()];
        u = v;
        v = next.first;
        e = next.second;
      }
      for (std::size_t node : f.nodes) f.outline.push_back(at[node]);
      if (signed_area(f.outline) > in.tolerance * in.tolerance) faces.push_back(std::move(f));
    }

  Polygon region;
  for (const auto& p : in.region) region.push_back(to2(p));
  std::vector<Polygon> openings;
  for (const auto& o : in.openings) {
    Polygon q;
    for (const auto& p : o) q.push_back(to2(p));
    if (signed_area(q) < 0) std::reverse(q.begin(), q.end());
    openings.push_back(std::move(q));
  }
  V2 along = V2(in.beams_along.dot(e1), in.beams_along.dot(e2));
  if (along.norm() > 0) along.normalize();

  AreaLoadResult out;
  const Eigen::Vector3d dir = in.direction.normalized();
  for (const Face& face : faces) {
    if (!region.empty() && !inside(region, centroid(face.outline))) continue;
    // Sides: consecutive collinear elements joined.
    std::vector<Side> sides;
    for (std::size_t i = 0; i < face.nodes.size(); ++i) {
      const V2 a = face.outline[i], b = face.outline[(i + 1) % face.outline.size()];
      const std::size_t e = face.elements[i];
      const bool forward = model.elements[e].nodes[0] == face.nodes[i];
      if (!sides.empty()) {
        Side& last = sides.back();
        const V2 d0 = (last.to - last.from).normalized(), d1 = (b - a).normalized();
        if (std::abs(cross(d0, d1)) < 1e-6 && d0.dot(d1) > 0) {
          last.pieces.push_back({e, last.length(), last.length() + (b - a).norm(), forward});
          last.to = b;
          continue;
        }
      }
      sides.push_back({a, b, {{e, 0.0, (b - a).norm(), forward}}});
    }
    if (sides.size() > 1) {  // the first and last sides may be one straight line
      Side& first = sides.front();
      Side& last = sides.back();
      const V2 d0 = (last.to - last.from).normalized(), d1 = (first.to - first.from).normalized();
      if (std::abs(cross(d0, d1)) < 1e-6 && d0.dot(d1) > 0) {
        const double shift = last.length();
        for (auto& piece : first.pieces) piece.s0 += shift, piece.s1 += shift;
        first.pieces.insert(first.pieces.begin(), last.pieces.begin(), last.pieces.end());
        first.from = last.from;
        sides.pop_back();
      }
    }
    const double panel_area = signed_area(face.outline);
    // Openings inside this panel: exact by clipping where the panel is convex.
    double open_area = 0;
    const bool is_convex = convex(face.outline);
    bool has_opening = false;
    for (const auto& o : openings) {
      const double a = is_convex ? std::abs(signed_area(clip_convex(o, face.outline))) : 0.0;
      if (a > 0 || (!is_convex && (inside(face.outline, o.front()) || inside(o, face.outline.front())))) has_opening = true;
      open_area += a;
    }
    const bool rectangle =
        sides.size() == 4 && std::all_of(sides.begin(), sides.end(), [&](const Side& s) {
          const std::size_t k = static_cast<std::size_t>(&s - sides.data());
          const V2 d0 = (s.to - s.from).normalized(), d1 = (sides[(k + 1) % 4].to - sides[(k + 1) % 4].from).normalized();
          return std::abs(d0.dot(d1)) < 1e-6;
        });
    auto parallel = [&](const Side& s) { return std::abs((s.to - s.from).normalized().dot(along)) > std::cos(std::numbers::pi / 180); };

    Panel panel;
    for (const auto& q : face.outline) panel.outline.push_back(to3(q));
    const std::size_t panel_index = out.panels.size();
    std::vector<PanelMemberLoad> loads;
    // Adds w(s) varying linearly from wa at sa to wb at sb along a side, on its elements.
    auto add = [&](const Side& side, double sa, double sb, double wa, double wb) {
      for (const auto& piece : side.pieces) {
        const double s0 = std::max(sa, piece.s0), s1 = std::min(sb, piece.s1);
        if (s1 - s0 <= 1e-12) continue;
        auto w = [&](double s) { return wa + (wb - wa) * (s - sa) / (sb - sa); };
        const double len = piece.s1 - piece.s0;
        ElementLoad l;
        l.element = piece.element;
        l.axes = LoadAxes::global;
        // Positions along the element, as fractions of its length in the plane times its own length.
        const auto [n0, n1] = model.elements[piece.element].nodes;
        const double scale = (model.nodes[n1] - model.nodes[n0]).norm() / len;
        if (piece.forward) {
          l.a = (s0 - piece.s0) * scale, l.b = (s1 - piece.s0) * scale;
          l.w_start = w(s0) * dir, l.w_end = w(s1) * dir;
        } else {
          l.a = (len - (s1 - piece.s0)) * scale, l.b = (len - (s0 - piece.s0)) * scale;
          l.w_start = w(s1) * dir, l.w_end = w(s0) * dir;
        }
        l.a = std::max(l.a, 0.0);
        l.b = std::min(l.b, len * scale);
        loads.push_back({panel_index, l});
      }
    };
    const double p = in.pressure;
    if (rectangle && !has_opening && in.two_way) {
      panel.method = "two-way, 45-degree split";
      const double b = std::min(sides[0].length(), sides[1].length());
      for (const Side& s : sides) {
        // Width of the trapezoid (or triangle) at s: min(s, L - s, b / 2).
        const double L = s.length(), h = 0.5 * b;
        if (L - 2 * h > 1e-9) {
          add(s, 0, h, 0, p * h);
          add(s, h, L - h, p * h, p * h);
          add(s, L - h, L, p * h, 0);
        } else {
          add(s, 0, 0.5 * L, 0, p * 0.5 * L);
          add(s, 0.5 * L, L, p * 0.5 * L, 0);
        }
      }
    } else if (rectangle && !has_opening && !in.two_way) {
      panel.method = "one-way";
      std::vector<const Side*> carrying;
      for (const Side& s : sides)
        if (parallel(s)) carrying.push_back(&s);
      if (carrying.size() != 2)
        throw std::invalid_argument("a one-way panel has no two sides along beams_along; give the beams' direction");
      const double b = panel_area / carrying[0]->length();  // distance between the two sides
      for (const Side* s : carrying) add(*s, 0, s->length(), 0.5 * p * b, 0.5 * p * b);
    } else {
      // General tributary split: every grid cell of the panel to its nearest side (one-way: the nearest side
      // along beams_along), then piecewise-uniform per side in bins.
      panel.method = in.two_way ? "two-way, nearest side" : "one-way, nearest side along the beams";
      std::vector<std::size_t> candidates;
      for (std::size_t k = 0; k < sides.size(); ++k)
        if (in.two_way || parallel(sides[k])) candidates.push_back(k);
      if (candidates.empty())
        throw std::invalid_argument("a one-way panel has no side along beams_along; give the beams' direction");
      constexpr int bins = 12;
      std::vector<std::array<double, bins>> force(sides.size());
      for (auto& f : force) f.fill(0.0);
      V2 low = face.outline[0], high = face.outline[0];
      for (const auto& q : face.outline) low = low.cwiseMin(q), high = high.cwiseMax(q);
      const double h = std::sqrt(panel_area) / 80;
      double sampled_open = 0;
      for (double x = low.x() + 0.5 * h; x < high.x(); x += h)
        for (double y = low.y() + 0.5 * h; y < high.y(); y += h) {
          const V2 q(x, y);
          if (!inside(face.outline, q)) continue;
          if (std::any_of(openings.begin(), openings.end(), [&](const Polygon& o) { return inside(o, q); })) {
            sampled_open += h * h;
            continue;
          }
          std::size_t best = candidates[0];
          double best_d = 1e300, best_s = 0;
          for (std::size_t k : candidates) {
            double s = 0;
            const double d = segment_distance(sides[k].from, sides[k].to, q, &s);
            if (d < best_d) best_d = d, best = k, best_s = s;
          }
          const auto bin = std::min(bins - 1, static_cast<int>(best_s / sides[best].length() * bins));
          force[best][static_cast<std::size_t>(bin)] += p * h * h;
        }
      if (!is_convex) open_area = sampled_open;
      for (std::size_t k = 0; k < sides.size(); ++k) {
        const double width = sides[k].length() / bins;
        for (int i = 0; i < bins; ++i)
          if (force[k][static_cast<std::size_t>(i)] != 0.0)
            add(sides[k], i * width, (i + 1) * width, force[k][static_cast<std::size_t>(i)] / width,
                force[k][static_cast<std::size_t>(i)] / width);
      }
    }
    panel.area = panel_area - open_area;
    // The loads' total made exactly p x area (the grid's and round-off's remainder scaled away).
    double total = 0;
    for (const auto& l : loads) total += 0.5 * (l.load.w_start + l.load.w_end).dot(dir) * (l.load.b - l.load.a);
    const double wanted = p * panel.area;
    if (total != 0.0)
      for (auto& l : loads) {
        l.load.w_start *= wanted / total;
        l.load.w_end *= wanted / total;
      }
    out.area += panel.area;
    out.panels.push_back(std::move(panel));
    out.loads.insert(out.loads.end(), loads.begin(), loads.end());
  }
  if (out.panels.empty())
    throw std::invalid_argument("no panel found: no closed outline of members lies in the plane (and region)");
  out.total_force = in.pressure * out.area;
  return out;
}

}  // namespace stepframe::analysis
