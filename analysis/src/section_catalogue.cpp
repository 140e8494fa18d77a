// The built-in catalogue: data/sections/*.csv compiled in, rows of
// dimensions turned into Sections by the shape functions on lookup.

#include "section_catalogue_data.hpp"
#include "section_spec.hpp"
#include "stepframe/analysis/edit_distance.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/analysis/section_shapes.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstddef>
#include <map>
#include <numeric>
#include <stdexcept>
#include <string>
#include <system_error>

namespace stepframe::analysis {
namespace {

using detail::ShapeSpec;
using detail::SpecKind;

std::string_view trim(std::string_view s) {
  const auto blank = [](char c) { return c == ' ' || c == '\t' || c == '\r'; };
  while (!s.empty() && blank(s.front())) s.remove_prefix(1);
  while (!s.empty() && blank(s.back())) s.remove_suffix(1);
  return s;
}

std::vector<std::string_view> split_fields(std::string_view line) {
  std::vector<std::string_view> fields;
  std::size_t start = 0;
  while (true) {
    const std::size_t comma = line.find(',', start);
    fields.push_back(trim(line.substr(start, comma == std::string_view::npos ? std::string_view::npos : comma - start)));
    if (comma == std::string_view::npos) break;
    start = comma + 1;
  }
  return fields;
}

// The catalogue is part of the program: a malformed row is a build defect,
// reported with its file and line.
[[noreturn]] void bad_row(std::string_view file, std::size_t line, const std::string& what) {
  throw std::logic_error("section catalogue data/sections/" + std::string(file) + " line " + std::to_string(line) +
                         ": " + what);
}

double parse_value(std::string_view text, std::string_view file, std::size_t line) {
  double value = 0;
  const auto [end, error] = std::from_chars(text.data(), text.data() + text.size(), value);
  if (error != std::errc() || end != text.data() + text.size() || !(value >= 0)) {
    std::string what = "'";  // built piecewise: GCC 12 warns falsely (-Wrestrict) on "'" + std::string(...)
    what += text;
    what += "' is not a non-negative number";
    bad_row(file, line, what);
  }
  return value;
}

// How each CSV "# shape:" reads its columns.
struct TableShape {
  const char* name;
  const char* header;  ///< expected column header
  SpecKind kind;
};
constexpr TableShape table_shapes[] = {
    {"rolled_i", "designation,h,b,tw,tf,r", SpecKind::rolled_i},
    {"channel", "designation,h,b,tw,tf,r,r_toe,slope,tf_at", SpecKind::channel},
    {"angle", "designation,h,b,t,r,r_toe", SpecKind::angle},
    {"rhs_hot", "designation,h,b,t", SpecKind::rhs_hot},
    {"rhs_cold", "designation,h,b,t", SpecKind::rhs_cold},
    {"chs_hot", "designation,d,t", SpecKind::chs_hot},
    {"chs_cold", "designation,d,t", SpecKind::chs_cold},
    {"hss_rect", "designation,h,b,t", SpecKind::rhs_radii},
    {"hss_round", "designation,d,t", SpecKind::chs_cold},
};

constexpr double inch = 0.0254;         // exact by definition
constexpr double lb_per_ft = 1.488164;  // kg/m: 0.45359237 kg / 0.3048 m (exact definitions)

// ASTM A6/A6M: nominal depth of W shapes in inches and in millimetres (from memory of A6M).
std::string metric_w_alias(const std::string& designation) {
  static const std::map<int, int> nominal{{4, 100},  {5, 130},  {6, 150},  {8, 200},  {10, 250},  {12, 310},
                                          {14, 360}, {16, 410}, {18, 460}, {21, 530}, {24, 610},  {27, 690},
                                          {30, 760}, {33, 840}, {36, 920}, {40, 1000}, {44, 1100}};
  const std::size_t x = designation.find('X');
  if (designation.size() < 4 || designation[0] != 'W' || x == std::string::npos) return {};
  const int depth = std::stoi(designation.substr(1, x - 1));
  const double mass = std::stod(designation.substr(x + 1)) * lb_per_ft;
  const auto it = nominal.find(depth);
  if (it == nominal.end()) return {};
  // The mass to 0.1 kg/m (derived; A6M's own rounding may differ by a few tenths, so
  // find_catalogue_section accepts any metric mass within 1.5%).
  const double rounded = std::round(mass * 10) / 10;
  return "W" + std::to_string(it->second) + "X" + detail::format_number(rounded);
}

struct Table {
  std::string family, standard, units;
  const TableShape* shape = nullptr;
};

void parse_table(const detail::EmbeddedTable& table, std::vector<ShapeSpec>& out) {
  std::size_t line_number = 0;
  Table meta;
  bool header_seen = false;
  std::string_view rest = table.text;
  while (!rest.empty()) {
    const std::size_t newline = rest.find('\n');
    const std::string_view line = trim(rest.substr(0, newline));
    rest = newline == std::string_view::npos ? std::string_view() : rest.substr(newline + 1);
    ++line_number;
    if (line.empty()) continue;
    if (line.front() == '#') {
      // "# key: value" metadata lines; other comments are free text.
      const std::string_view body = trim(line.substr(1));
      const std::size_t colon = body.find(':');
      if (colon == std::string_view::npos) continue;
      const std::string_view key = trim(body.substr(0, colon));
      const std::string value(trim(body.substr(colon + 1)));
      if (key == "family") meta.family = value;
      else if (key == "standard") meta.standard = value;
      else if (key == "units") meta.units = value;
      else if (key == "shape") {
        const auto* it = std::find_if(std::begin(table_shapes), std::end(table_shapes),
                                      [&](const TableShape& s) { return value == s.name; });
        if (it == std::end(table_shapes)) bad_row(table.file, line_number, "unknown shape '" + value + "'");
        meta.shape = it;
      }
      continue;
    }
    const std::vector<std::string_view> fields = split_fields(line);
    if (!header_seen) {
      if (!meta.shape || meta.family.empty() || meta.standard.empty() || (meta.units != "mm" && meta.units != "in"))
        bad_row(table.file, line_number, "the comment header must give '# family:', '# shape:', '# standard:' and "
                                         "'# units: mm|in' before the column header");
      if (line != meta.shape->header)
        bad_row(table.file, line_number, std::string("expected the column header '") + meta.shape->header + "'");
      header_seen = true;
      continue;
    }
    const std::size_t columns = split_fields(meta.shape->header).size();
    if (fields.size() != columns) bad_row(table.file, line_number, "expected " + std::to_string(columns) + " fields");
    ShapeSpec spec;
    spec.designation = normalize_designation(fields[0]);
    if (spec.designation.empty()) bad_row(table.file, line_number, "empty designation");
    spec.family = meta.family;
    spec.standard = meta.standard;
    spec.kind = meta.shape->kind;
    const double unit = meta.units == "mm" ? 1e-3 : inch;
    for (std::size_t i = 1; i < columns; ++i) {
      const double value = parse_value(fields[i], table.file, line_number);
      const bool ratio = std::string_view(meta.shape->name) == "channel" && i == 7;  // slope is a ratio
      spec.v[i - 1] = ratio ? value : value * unit;
    }
    const std::string shape_name = meta.shape->name;
    if (shape_name == "hss_rect") {
      // AISC 360 B4.2: design wall 0.93 t; outside corner radius 2 t_des (from memory).
      const double tdes = 0.93 * spec.v[2];
      spec.v = {spec.v[0], spec.v[1], tdes, 2 * tdes, tdes};
    } else if (shape_name == "hss_round") {
      spec.v[1] *= 0.93;
    }
    if (spec.family == "W") spec.alias = metric_w_alias(spec.designation);
    const bool duplicate =
        std::any_of(out.begin(), out.end(), [&](const ShapeSpec& s) { return s.designation == spec.designation; });
    if (duplicate) bad_row(table.file, line_number, "designation " + spec.designation + " appears twice in the catalogue");
    // Each row's shape is built when a model asks for it, not here: building all of them took some 40 ms
    // of every run. That every row makes a valid shape is a test ("catalogue holds the EN and ASTM series").
    out.push_back(std::move(spec));
  }
}

// Parsed once, on first use; immutable afterwards.
struct Catalogue {
  std::vector<ShapeSpec> specs;
  std::vector<CatalogueEntry> entries;
  std::map<std::string, std::size_t> index;  ///< canonical designation and alias -> spec
};

const Catalogue& catalogue() {
  static const Catalogue c = [] {
    Catalogue all;
    for (const detail::EmbeddedTable& table : detail::embedded_section_tables()) parse_table(table, all.specs);
    for (std::size_t i = 0; i < all.specs.size(); ++i) {
      const ShapeSpec& s = all.specs[i];
      all.entries.push_back({s.designation, s.family, s.standard, s.alias});
      all.index.emplace(s.designation, i);
      if (!s.alias.empty()) all.index.emplace(s.alias, i);
    }
    return all;
  }();
  return c;
}

// Leading letters and the first number of a normalized designation ("HEB200" -> "HEB", 200).
std::pair<std::string, double> prefix_and_size(const std::string& s) {
  std::size_t i = 0;
  while (i < s.size() && std::isalpha(static_cast<unsigned char>(s[i]))) ++i;
  std::size_t j = i;
  while (j < s.size() && (std::isdigit(static_cast<unsigned char>(s[j])) || s[j] == '.')) ++j;
  double size = -1;
  if (j > i) std::from_chars(s.data() + i, s.data() + j, size);
  return {s.substr(0, i), size};
}

}  // namespace

namespace detail {

Section build_section(const ShapeSpec& spec) {
  const auto& v = spec.v;
  Section s;
  switch (spec.kind) {
    case SpecKind::rolled_i: s = rolled_i_section(spec.designation, {v[0], v[1], v[2], v[3], v[4]}); break;
    case SpecKind::channel:
      s = channel_section(spec.designation, {v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7]});
      break;
    case SpecKind::angle: s = angle_section(spec.designation, {v[0], v[1], v[2], v[3], v[4]}); break;
    case SpecKind::rhs_hot:
      s = rhs_section(spec.designation, rhs_dimensions(v[0], v[1], v[2], HollowForming::hot_finished));
      break;
    case SpecKind::rhs_cold:
      s = rhs_section(spec.designation, rhs_dimensions(v[0], v[1], v[2], HollowForming::cold_formed));
      break;
    case SpecKind::rhs_radii: s = rhs_section(spec.designation, {v[0], v[1], v[2], v[3], v[4]}); break;
    case SpecKind::chs_hot:
    case SpecKind::chs_cold: s = chs_section(spec.designation, {v[0], v[1]}); break;
    case SpecKind::flat: s = flat_section(spec.designation, {v[0], v[1]}); break;
    case SpecKind::round_bar: s = round_bar_section(spec.designation, v[0]); break;
  }
  s.family = spec.family;
  s.standard = spec.standard;
  return s;
}

}  // namespace detail

std::optional<Section> find_catalogue_section(std::string_view designation) {
  const std::string key = normalize_designation(designation);
  if (key.empty()) return std::nullopt;
  const Catalogue& c = catalogue();
  if (const auto it = c.index.find(key); it != c.index.end()) return detail::build_section(c.specs[it->second]);
  // Metric W shape written with a mass that rounds differently from the alias:
  // the W shape of that nominal depth whose mass is within 1.5%.
  if (const auto metric = detail::parse_metric_w(key)) {
    const auto [depth, mass] = *metric;
    for (const ShapeSpec& s : c.specs) {
      if (s.family != "W" || s.alias.empty()) continue;
      const auto alias = detail::parse_metric_w(s.alias);
      if (alias && alias->first == depth && std::abs(alias->second - mass) <= 0.015 * mass)
        return detail::build_section(s);
    }
    return std::nullopt;
  }
  if (auto spec = detail::parse_dimension_designation(key)) {
    // An angle in the catalogue written with its legs the other way round, or
    // a hollow section row: the catalogue row (with its radii) wins.
    if (const auto it = c.index.find(spec->designation); it != c.index.end())
      return detail::build_section(c.specs[it->second]);
    if (spec->kind == SpecKind::angle) {
      const std::size_t x1 = spec->designation.find('X'), x2 = spec->designation.rfind('X');
      const std::string swapped = "L" + spec->designation.substr(x1 + 1, x2 - x1 - 1) + "X" +
                                  spec->designation.substr(1, x1 - 1) + spec->designation.substr(x2);
      if (const auto it = c.index.find(swapped); it != c.index.end()) return detail::build_section(c.specs[it->second]);
    }
    return detail::build_section(*spec);
  }
  return std::nullopt;
}

const std::vector<CatalogueEntry>& catalogue_entries() { return catalogue().entries; }

std::vector<std::string> catalogue_designations() {
  std::vector<std::string> names;
  for (const CatalogueEntry& e : catalogue().entries) names.push_back(e.designation);
  return names;
}

std::vector<CatalogueEntry> search_catalogue(std::string_view query) {
  const std::string q = normalize_designation(query);
  const auto& entries = catalogue().entries;
  std::vector<CatalogueEntry> out;
  const auto starts = [&](const std::string& s) { return s.compare(0, q.size(), q) == 0; };
  for (const CatalogueEntry& e : entries)
    if (starts(e.designation) || e.family == q || (!e.alias.empty() && starts(e.alias))) out.push_back(e);
  if (out.empty() && !q.empty())
    for (const CatalogueEntry& e : entries)
      if (e.designation.find(q) != std::string::npos) out.push_back(e);
  return out;
}

std::vector<std::string> nearest_designations(std::string_view designation, std::size_t n) {
  const std::string key = normalize_designation(designation);
  const auto [prefix, size] = prefix_and_size(key);
  struct Scored {
    bool same_family;
    double size_gap;
    std::size_t distance;
    std::string name;
  };
  std::vector<Scored> scored;
  for (const CatalogueEntry& e : catalogue().entries) {
    const auto [candidate_prefix, candidate_size] = prefix_and_size(e.designation);
    const bool same = !prefix.empty() && candidate_prefix == prefix;
    const double gap = same && size > 0 && candidate_size > 0 ? std::abs(std::log(candidate_size / size)) : 1e9;
    scored.push_back({same, gap, edit_distance(key, e.designation), e.designation});
  }
  std::stable_sort(scored.begin(), scored.end(), [](const Scored& a, const Scored& b) {
    if (a.same_family != b.same_family) return a.same_family;
    if (a.size_gap != b.size_gap) return a.size_gap < b.size_gap;
    return a.distance < b.distance;
  });
  std::vector<std::string> out;
  const std::size_t limit = std::max<std::size_t>(2, key.size() / 2);
  for (const Scored& s : scored) {
    if (out.size() == n) break;
    if (!s.same_family && s.distance > limit) continue;
    out.push_back(s.name);
  }
  return out;
}

}  // namespace stepframe::analysis
