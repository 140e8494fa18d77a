// What `compare` writes: compare.json, the terminal summary, and the folder
// with compare.json, compare.html and compare.vtu.

#include "output_folder.hpp"
#include "stepframe/compare.hpp"
#include "stepframe/run.hpp"
#include "stepframe/viz/change_vtu.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <cerrno>
#include <fstream>

namespace stepframe {
namespace {

nlohmann::json optional_number(const std::optional<double>& v) { return v ? nlohmann::json(*v) : nlohmann::json(); }
nlohmann::json optional_vector(const std::optional<Eigen::Vector3d>& v) {
  return v ? nlohmann::json{v->x(), v->y(), v->z()} : nlohmann::json();
}

std::string optional_text(const std::optional<double>& v) { return v ? fmt::format("{:.3f}", *v) : std::string("-"); }

}  // namespace

nlohmann::json comparison_json(const Comparison& c) {
  nlohmann::json j;
  j["schema"] = "stepframe-compare/1";
  j["caution"] = caution;
  j["old"] = c.old_label;
  j["new"] = c.new_label;
  j["options"] = {{"tolerance", c.options.tolerance}, {"move_limit", c.options.move_limit},
                  {"max_increase", c.options.max_increase}};
  j["status"] = c.status() == ExitStatus::pass ? "pass" : "fail";
  j["exit_status"] = static_cast<int>(c.status());
  j["gate_failures"] = c.gate_failures;
  nlohmann::json counts;
  for (int k = 0; k <= static_cast<int>(ChangeKind::removed); ++k)
    counts[std::string(to_string(static_cast<ChangeKind>(k)))] = c.count(static_cast<ChangeKind>(k));
  counts["newly_failing"] = std::count_if(c.members.begin(), c.members.end(), [](const auto& d) { return d.newly_failing(); });
  j["counts"] = counts;
  nlohmann::json by_section = nlohmann::json::array();
  for (const auto& [section, mass] : c.mass_by_section)
    by_section.push_back({{"section", section}, {"old", mass[0]}, {"new", mass[1]}, {"change", mass[1] - mass[0]}});
  j["mass"] = {{"old", c.old_mass}, {"new", c.new_mass}, {"change", c.new_mass - c.old_mass}, {"by_section", by_section}};
  nlohmann::json members = nlohmann::json::array();
  for (const auto& d : c.members) {
    nlohmann::json m{{"kind", to_string(d.kind)},
                     {"label", d.label},
                     {"old", d.old_ids},
                     {"new", d.new_ids},
                     {"matched_by", d.old_ids.empty() || d.new_ids.empty() ? "none" : d.by_identity ? "identity" : "geometry"},
                     {"reversed", d.reversed},
                     {"moved", d.moved},
                     {"changes", d.changes},
                     {"before", optional_number(d.before)},
                     {"after", optional_number(d.after)},
                     {"change", d.before && d.after ? nlohmann::json(*d.after - *d.before) : nlohmann::json()},
                     {"newly_failing", d.newly_failing()},
                     {"checks", nlohmann::json::array()}};
    for (const auto& k : d.checks)
      m["checks"].push_back({{"check", k.check},
                             {"before", optional_number(k.before)},
                             {"after", optional_number(k.after)},
                             {"failed_before", k.failed_before},
                             {"fails_after", k.fails_after}});
    members.push_back(std::move(m));
  }
  j["members"] = std::move(members);
  j["frame_checks"] = nlohmann::json::array();
  for (const auto& f : c.frame_checks)
    j["frame_checks"].push_back({{"check", f.check}, {"combination", f.combination}, {"before", optional_number(f.before)},
                                 {"after", optional_number(f.after)}, {"failed_before", f.failed_before},
                                 {"fails_after", f.fails_after}});
  j["supports"] = nlohmann::json::array();
  for (const auto& s : c.supports) j["supports"].push_back({{"at", {s.at.x(), s.at.y(), s.at.z()}}, {"change", s.change}});
  j["loads"] = nlohmann::json::array();
  for (const auto& l : c.loads)
    j["loads"].push_back({{"case", l.name}, {"change", l.change}, {"old_force", optional_vector(l.old_force)},
                          {"new_force", optional_vector(l.new_force)}, {"old_moment", optional_vector(l.old_moment)},
                          {"new_moment", optional_vector(l.new_moment)}});
  return j;
}

std::string comparison_text(const Comparison& c) {
  std::string out = fmt::format("compare {} -> {}: {}\n", c.old_label, c.new_label,
                                c.status() == ExitStatus::pass ? "nothing got worse beyond the threshold"
                                                               : "WORSE: the gate fails");
  out += fmt::format("members: {} unchanged, {} modified, {} moved, {} split, {} merged, {} added, {} removed\n",
                     c.count(ChangeKind::unchanged), c.count(ChangeKind::modified), c.count(ChangeKind::moved),
                     c.count(ChangeKind::split), c.count(ChangeKind::merged), c.count(ChangeKind::added),
                     c.count(ChangeKind::removed));
  out += fmt::format("mass: {:.1f} kg -> {:.1f} kg ({:+.1f} kg)\n", c.old_mass, c.new_mass, c.new_mass - c.old_mass);
  if (!c.supports.empty()) out += fmt::format("supports changed: {}\n", c.supports.size());
  for (const auto& l : c.loads) out += fmt::format("load case {}: {}\n", l.name, l.change);
  for (const auto& g : c.gate_failures) out += "  " + g + "\n";
  std::size_t shown = 0;
  for (const auto& d : c.members) {
    if (d.largest_increase() <= 0 || shown == 5) continue;
    if (shown++ == 0) out += "largest increases:\n";
    out += fmt::format("  {:<24} {} -> {}\n", d.label, optional_text(d.before), optional_text(d.after));
  }
  return out;
}

std::vector<std::filesystem::path> write_comparison(const Comparison& c, const std::filesystem::path& out_dir) {
  const detail::OutputFolderLock lock(out_dir);
  detail::StagingFolder staging(out_dir);
  const auto& dir = staging.path();
  std::error_code ignored;
  std::filesystem::remove(dir / "vtk", ignored);  // the staging folder's, for run outputs
  auto text_file = [&](const std::string& name, const std::string& text) {
    std::ofstream out(dir / name, std::ios::binary);
    out << text;
    if (!out.flush()) throw detail::output_failure(out_dir / name, errno);
  };
  text_file("compare.json", comparison_json(c).dump(1) + "\n");
  text_file("compare.html", comparison_html(c));
  std::vector<viz::ChangeLine> lines;
  const double largest = largest_change(c);
  const double nan = std::numeric_limits<double>::quiet_NaN();
  for (const auto& d : c.members) {
    const bool removed = d.new_ids.empty();
    for (std::size_t id : removed ? d.old_ids : d.new_ids)
      lines.push_back({removed ? c.old_paths[id] : c.new_paths[id], static_cast<int>(id), static_cast<int>(d.kind),
                       d.before.value_or(nan), d.after.value_or(nan),
                       removed ? viz::undeformed_colour() : change_colour(d, largest), d.label});
  }
  std::vector<std::string> kinds;
  for (int k = 0; k <= static_cast<int>(ChangeKind::removed); ++k) kinds.emplace_back(to_string(static_cast<ChangeKind>(k)));
  try {
    viz::write_change_vtu(dir / "compare.vtu", lines, kinds);
  } catch (const std::runtime_error&) {
    if (detail::output_unwritable(dir)) throw detail::output_failure(out_dir / "compare.vtu", 0);
    throw;
  }
  staging.commit();
  spdlog::info("wrote compare.json, compare.html and compare.vtu to {}", out_dir.string());
  return {out_dir / "compare.json", out_dir / "compare.html", out_dir / "compare.vtu"};
}

}  // namespace stepframe
