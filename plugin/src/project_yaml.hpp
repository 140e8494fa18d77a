#pragma once
// Walking a project file's YAML tree with the key path and line at hand, so
// that every error names both (shared by the readers of the top-level blocks).

#include "stepframe/errors.hpp"
#include "stepframe/project.hpp"
#include "stepframe/suggest.hpp"
#include "stepframe/units.hpp"

#include <Eigen/Core>
#include <yaml-cpp/yaml.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <string>
#include <vector>

namespace stepframe::detail {

/// Walks the YAML tree with the key path and line at hand, so that every
/// error names both.
class Reader {
 public:
  explicit Reader(std::filesystem::path file) : file_(std::move(file)) {}

  [[noreturn]] void fail(const YAML::Node& node, const std::string& key, const std::string& what) const {
    throw InputError(where(node, key).describe() + ": " + what);
  }

  SourceLine where(const YAML::Node& node, const std::string& key) const {
    const int line = node.IsDefined() && node.Mark().line >= 0 ? node.Mark().line + 1 : 0;
    return {file_, line, key};
  }

  void expect_map(const YAML::Node& node, const std::string& key) const {
    if (!node.IsMap()) fail(node, key, "expected a mapping of keys to values");
  }
  void expect_list(const YAML::Node& node, const std::string& key) const {
    if (!node.IsSequence()) fail(node, key, "expected a list");
  }

  /// Every key of `node` must be one of `allowed`.
  void check_keys(const YAML::Node& node, const std::string& path, const std::vector<std::string>& allowed) const {
    expect_map(node, path);
    for (const auto& item : node) {
      const auto key = item.first.as<std::string>();
      if (std::find(allowed.begin(), allowed.end(), key) == allowed.end()) {
        std::string known;
        for (const auto& a : allowed) known += (known.empty() ? "" : ", ") + a;
        fail(item.first, join(path, key),
             "unknown key '" + key + "'" + did_you_mean(key, allowed) + " (known here: " + known + ")");
      }
    }
  }

  std::string text(const YAML::Node& node, const std::string& key) const {
    if (!node.IsScalar()) fail(node, key, "expected a single value");
    return node.as<std::string>();
  }

  bool boolean(const YAML::Node& node, const std::string& key) const {
    bool value = false;
    if (!node.IsScalar() || !YAML::convert<bool>::decode(node, value))
      fail(node, key, "expected true or false, got '" + (node.IsScalar() ? node.Scalar() : "") + "'");
    return value;
  }

  /// A number of the given dimension, SI. Bare numbers are in the file's units.
  double number(const YAML::Node& node, const std::string& key, Dimension dim) const {
    if (!node.IsScalar()) fail(node, key, "expected a number, e.g. " + example(dim));
    const auto q = parse_quantity(node.Scalar());
    if (!q) fail(node, key, "'" + node.Scalar() + "' is not a number with a known unit, e.g. " + example(dim));
    if (q->dimension != dimension::none && !(q->dimension == dim))
      fail(node, key,
           "'" + node.Scalar() + "' is a " + describe(q->dimension) + " but a " + describe(dim) + " is needed, e.g. " +
               example(dim));
    const double value = q->dimension == dimension::none ? q->value * units_.si_per_bare(dim) : q->value;
    // NaN, infinity and numbers beyond the double range (1e400) never reach the analysis.
    if (!std::isfinite(value)) fail(node, key, "'" + node.Scalar() + "' is not a finite number");
    return value;
  }

  Eigen::Vector3d vector3(const YAML::Node& node, const std::string& key, Dimension dim) const {
    if (!node.IsSequence() || node.size() != 3) fail(node, key, "expected three values [x, y, z]");
    return {number(node[0], key + "[0]", dim), number(node[1], key + "[1]", dim), number(node[2], key + "[2]", dim)};
  }

  std::string example(Dimension dim) const {
    const char* with_unit = dim == dimension::length          ? "\"3.5 m\""
                            : dim == dimension::force         ? "\"20 kN\""
                            : dim == dimension::moment        ? "\"12 kN*m\""
                            : dim == dimension::line_load     ? "\"4.5 kN/m\""
                            : dim == dimension::stress        ? "\"210 GPa\""
                            : dim == dimension::density       ? "\"7850 kg/m3\""
                            : dim == dimension::area          ? "\"5380 mm2\""
                            : dim == dimension::second_moment ? "\"8.356e7 mm4\""
                            : dim == dimension::section_modulus ? "\"2.3e4 mm3\""
                            : dim == dimension::mass          ? "\"850 kg\""
                                                              : "\"1.0\"";
    return std::string("a bare number in ") + units_.describe_bare(dim) + " or a string with its unit such as " +
           with_unit;
  }

  static std::string join(const std::string& path, const std::string& key) {
    return path.empty() ? key : path + "." + key;
  }
  static std::string index(const std::string& path, std::size_t i) { return path + "[" + std::to_string(i) + "]"; }

  UnitSystem units_;
  const std::filesystem::path file_;
};

}  // namespace stepframe::detail
