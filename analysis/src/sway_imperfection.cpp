// EN 1993-1-1 5.3.2 sway imperfections as equivalent horizontal forces.

#include "stepframe/analysis/sway_imperfection.hpp"

#include "stepframe/analysis/element_loads.hpp"
#include "stepframe/analysis/element_recovery.hpp"
#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/analysis/member_line.hpp"

#include <algorithm>
#include <cmath>
#include <map>

namespace stepframe::analysis {

double height_reduction(double height) {
  // EN 1993-1-1 5.3.2(3) (5.5): alpha_h = 2 / sqrt(h), 2/3 <= alpha_h <= 1.0.
  if (!(height > 0)) return 1.0;
  return std::clamp(2.0 / std::sqrt(height), 2.0 / 3.0, 1.0);
}

double column_reduction(std::size_t columns) {
  // EN 1993-1-1 5.3.2(3) (5.5): alpha_m = sqrt(0.5 (1 + 1/m)).
  const double m = static_cast<double>(std::max<std::size_t>(columns, 1));
  return std::sqrt(0.5 * (1.0 + 1.0 / m));
}

namespace {

/// One column element: its lower and upper node and its mean compression [N] (tension negative).
struct ColumnElement {
  std::size_t bottom = 0, top = 0;
  double compression = 0;
};

std::vector<ColumnElement> column_elements(const FrameModel& model, const LoadResult& result) {
  std::vector<ColumnElement> out;
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const auto& nodes = model.elements[e].nodes;
    const Eigen::Vector3d& a = model.nodes[nodes[0]];
    const Eigen::Vector3d& b = model.nodes[nodes[1]];
    if (angle_from_vertical(a, b) > ambiguous_inclination) continue;
    const ElementState state = element_state(model, result, e);
    const Vector6d start = element_end_actions(state).head<6>();
    // Internal N (tension > 0) at both ends; the mean stands for the element (self weight varies along it).
    const double n0 = internal_forces_at(start, state.loads, 0.0)(0);
    const double n1 = internal_forces_at(start, state.loads, state.properties.length)(0);
    const bool rising = b.z() > a.z();
    out.push_back({rising ? nodes[0] : nodes[1], rising ? nodes[1] : nodes[0], -0.5 * (n0 + n1)});
  }
  return out;
}

/// m of 5.3.2(3) for sway along `axis`: column lines (elements sharing a plan position) grouped into rows
/// (vertical planes along the axis: the same coordinate across it, within the tolerance); in each row the
/// lines whose largest compression is at least half the row's average; the fewest over the rows (the row
/// with the largest phi governs, conservative for the whole structure).
std::size_t columns_in_a_row(const FrameModel& model, const std::vector<ColumnElement>& columns, int axis,
                             double tolerance) {
  // Column lines by plan position (rounded to the tolerance), each with its largest compression.
  std::map<std::pair<long long, long long>, std::pair<Eigen::Vector2d, double>> lines;
  for (const auto& c : columns) {
    const Eigen::Vector3d& p = model.nodes[c.bottom];
    const auto key = std::make_pair(std::llround(p.x() / tolerance), std::llround(p.y() / tolerance));
    auto [it, inserted] = lines.try_emplace(key, Eigen::Vector2d(p.x(), p.y()), c.compression);
    if (!inserted) it->second.second = std::max(it->second.second, c.compression);
  }
  // Rows: sorted by the coordinate across the axis, a new row after each gap above the tolerance.
  const int across = axis == 0 ? 1 : 0;
  std::vector<std::pair<double, double>> by_position;  // (coordinate across, compression)
  for (const auto& [key, line] : lines)
    if (line.second > 0) by_position.emplace_back(line.first(across), line.second);
  std::sort(by_position.begin(), by_position.end());
  std::size_t fewest = 0;
  for (std::size_t first = 0; first < by_position.size();) {
    std::size_t last = first + 1;
    while (last < by_position.size() && by_position[last].first - by_position[last - 1].first <= tolerance) ++last;
    double sum = 0;
    for (std::size_t k = first; k < last; ++k) sum += by_position[k].second;
    const double half_average = 0.5 * sum / static_cast<double>(last - first);
    const auto m = static_cast<std::size_t>(std::count_if(by_position.begin() + static_cast<std::ptrdiff_t>(first),
                                                          by_position.begin() + static_cast<std::ptrdiff_t>(last),
                                                          [&](const auto& l) { return l.second >= half_average; }));
    fewest = fewest == 0 ? m : std::min(fewest, m);
    first = last;
  }
  return std::max<std::size_t>(fewest, 1);
}

}  // namespace

std::array<SwayImperfection, 2> sway_imperfections(const FrameModel& model, const LoadResult& result,
                                                   std::optional<double> phi, double row_tolerance) {
  const std::vector<ColumnElement> columns = column_elements(model, result);
  double low = 0, high = 0;
  for (std::size_t k = 0; k < columns.size(); ++k) {
    const double zb = model.nodes[columns[k].bottom].z(), zt = model.nodes[columns[k].top].z();
    low = k == 0 ? zb : std::min(low, zb);
    high = k == 0 ? zt : std::max(high, zt);
  }
  // Total loads from the reactions (they balance the applied loads).
  Eigen::Vector3d reaction = Eigen::Vector3d::Zero();
  for (std::size_t n = 0; n < model.nodes.size(); ++n)
    reaction += result.reactions.segment<3>(static_cast<Eigen::Index>(6 * n));

  std::array<SwayImperfection, 2> out;
  for (int axis = 0; axis < 2; ++axis) {
    SwayImperfection& s = out[static_cast<std::size_t>(axis)];
    s.axis = axis;
    s.height = high - low;
    s.columns = columns_in_a_row(model, columns, axis, row_tolerance);
    s.alpha_h = height_reduction(s.height);
    s.alpha_m = column_reduction(s.columns);
    s.phi = phi ? *phi : basic_sway * s.alpha_h * s.alpha_m;  // (5.5)
    s.H_Ed = std::abs(reaction(axis));
    s.V_Ed = std::abs(reaction.z());
    s.exempt = !(s.V_Ed > 0) || s.H_Ed >= 0.15 * s.V_Ed;  // 5.3.2(4)
    // 5.3.2(7), Figure 5.4: phi N at the top of each column, phi N back at its bottom.
    std::map<std::size_t, double> push;
    for (const auto& c : columns) {
      push[c.top] += s.phi * c.compression;
      push[c.bottom] -= s.phi * c.compression;
    }
    for (const auto& [node, h] : push) {
      if (h == 0) continue;
      NodeLoad load;
      load.node = node;
      load.force(axis) = h;
      s.forces.push_back(load);
    }
  }
  return out;
}

}  // namespace stepframe::analysis
