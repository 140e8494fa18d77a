#pragma once
// Helpers the plain-text tables share (tables.cpp, shop_tables.cpp, shop_data.cpp).

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/results.hpp"

#include <cstddef>
#include <limits>
#include <string>
#include <vector>

namespace stepframe::detail {

/// RFC 4180 quoting for text fields.
inline std::string csv_field(const std::string& text) {
  if (text.find_first_of(",\"\n") == std::string::npos) return text;
  std::string out = "\"";
  for (char c : text) out += c == '"' ? std::string("\"\"") : std::string(1, c);
  return out + "\"";
}

/// A member's length along its elements [m].
inline double member_length(const analysis::FrameModel& model, std::size_t member) {
  double length = 0;
  for (std::size_t e : model.members[member].elements) {
    const auto& el = model.elements[e];
    length += (model.nodes[el.nodes[1]] - model.nodes[el.nodes[0]]).norm();
  }
  return length;
}

/// The results the design tables go over: the combinations when there are any, else the cases.
inline std::vector<const analysis::LoadResult*> design_results(const std::vector<analysis::LoadResult>& results) {
  std::vector<const analysis::LoadResult*> pool;
  for (const auto& r : results)
    if (r.is_combination) pool.push_back(&r);
  if (pool.empty())
    for (const auto& r : results) pool.push_back(&r);
  return pool;
}

/// The largest and smallest of one end force component of a member over `pool`, and the results that
/// give them (the first of equals; null when `pool` is empty).
struct EndForceEnvelope {
  double high = -std::numeric_limits<double>::infinity(), low = std::numeric_limits<double>::infinity();
  const analysis::LoadResult *high_by = nullptr, *low_by = nullptr;
};

/// `end` 0 the member's start, 1 its end; `component` 0..5 as in results.hpp (N, Vy, Vz, T, My, Mz).
inline EndForceEnvelope end_force_envelope(const std::vector<const analysis::LoadResult*>& pool, std::size_t member,
                                           int end, int component) {
  EndForceEnvelope e;
  for (const auto* r : pool) {
    const auto& line = r->members[member];
    const double v = (end == 0 ? line.start_forces : line.end_forces)(component);
    if (v > e.high) e.high = v, e.high_by = r;
    if (v < e.low) e.low = v, e.low_by = r;
  }
  return e;
}

/// A result's name as a CSV field, empty for none.
inline std::string csv_name(const analysis::LoadResult* result) { return result ? csv_field(result->name) : std::string(); }

}  // namespace stepframe::detail
