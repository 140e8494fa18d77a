#include "section_catalogue_data.hpp"
#include "stepframe/analysis/section.hpp"

#include <algorithm>
#include <charconv>
#include <cstddef>
#include <stdexcept>
#include <string>
#include <system_error>

namespace stepframe::analysis {
namespace {

constexpr double mm = 1e-3;  // catalogue dimensions are in millimetres

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

double parse_mm(std::string_view text, std::string_view file, std::size_t line) {
  double value = 0;
  const auto [end, error] = std::from_chars(text.data(), text.data() + text.size(), value);
  if (error != std::errc() || end != text.data() + text.size() || !(value >= 0)) {
    std::string what = "'";  // built piecewise: GCC 12 warns falsely (-Wrestrict) on "'" + std::string(...)
    what += text;
    what += "' is not a non-negative number";
    bad_row(file, line, what);
  }
  return value * mm;
}

// Rows "designation,h,b,tw,tf,r" of one CSV file; '#' starts a comment line,
// the first non-comment line is the column header.
void parse_table(const detail::EmbeddedTable& table, std::vector<Section>& out) {
  std::size_t line_number = 0;
  bool header_seen = false;
  std::string_view rest = table.text;
  while (!rest.empty()) {
    const std::size_t newline = rest.find('\n');
    const std::string_view line = trim(rest.substr(0, newline));
    rest = newline == std::string_view::npos ? std::string_view() : rest.substr(newline + 1);
    ++line_number;
    if (line.empty() || line.front() == '#') continue;
    const std::vector<std::string_view> fields = split_fields(line);
    if (!header_seen) {
      if (fields.size() != 6 || normalize_designation(fields[0]) != "DESIGNATION")
        bad_row(table.file, line_number, "expected the header 'designation,h,b,tw,tf,r'");
      header_seen = true;
      continue;
    }
    if (fields.size() != 6) bad_row(table.file, line_number, "expected 6 fields (designation,h,b,tw,tf,r)");
    RolledIDimensions d;
    d.h = parse_mm(fields[1], table.file, line_number);
    d.b = parse_mm(fields[2], table.file, line_number);
    d.tw = parse_mm(fields[3], table.file, line_number);
    d.tf = parse_mm(fields[4], table.file, line_number);
    d.r = parse_mm(fields[5], table.file, line_number);
    std::string designation = normalize_designation(fields[0]);
    if (designation.empty()) bad_row(table.file, line_number, "empty designation");
    const bool duplicate =
        std::any_of(out.begin(), out.end(), [&](const Section& s) { return s.designation == designation; });
    if (duplicate) bad_row(table.file, line_number, "designation " + designation + " appears twice in the catalogue");
    out.push_back(rolled_i_section(std::move(designation), d));
  }
}

// Parsed once, on first use; immutable afterwards.
const std::vector<Section>& catalogue() {
  static const std::vector<Section> sections = [] {
    std::vector<Section> all;
    for (const detail::EmbeddedTable& table : detail::embedded_section_tables()) parse_table(table, all);
    return all;
  }();
  return sections;
}

}  // namespace

std::optional<Section> find_catalogue_section(std::string_view designation) {
  const std::string key = normalize_designation(designation);
  const std::vector<Section>& all = catalogue();
  const auto it = std::find_if(all.begin(), all.end(), [&](const Section& s) { return s.designation == key; });
  if (it == all.end()) return std::nullopt;
  return *it;
}

std::vector<std::string> catalogue_designations() {
  std::vector<std::string> names;
  for (const Section& s : catalogue()) names.push_back(s.designation);
  return names;
}

}  // namespace stepframe::analysis
