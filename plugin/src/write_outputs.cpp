#include "output_folder.hpp"
#include "stepframe/report.hpp"
#include "stepframe/run.hpp"
#include "stepframe/tables.hpp"
#include "stepframe/viz/multiblock_index.hpp"
#include "stepframe/viz/surface_vtu_writer.hpp"
#include "stepframe/viz/vtu_writer.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cctype>
#include <cerrno>
#include <fstream>
#include <future>
#include <set>

namespace stepframe {
namespace {

// A file name from a case or combination name: letters, digits, '-', '_', '.'.
std::string file_stem(const std::string& name, std::set<std::string>& used) {
  std::string stem;
  for (char c : name)
    stem += std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '_' || c == '.' || c == '+' ? c : '_';
  if (stem.empty() || stem.front() == '.') stem = "result" + stem;
  std::string unique = stem;
  for (int i = 2; !used.insert(unique).second; ++i) unique = stem + "_" + std::to_string(i);
  return unique;
}

// Writes `text` whole as `name` in `dir` (out_dir's staging folder) and adds the name to `list`.
void text_file(const std::filesystem::path& dir, const std::filesystem::path& out_dir,
               std::vector<std::filesystem::path>& list, const std::string& name, const std::string& text) {
  std::ofstream out(dir / name, std::ios::binary);
  out << text;
  if (!out.flush()) throw detail::output_failure(out_dir / name, errno);
  list.push_back(name);
}

}  // namespace

std::vector<std::filesystem::path> detail::write_check_free_tables(const Analysis& analysis,
                                                                   const StagingFolder& staging,
                                                                   const std::filesystem::path& out_dir) {
  std::vector<std::filesystem::path> files;
  auto table = [&](const std::string& name, const std::string& text) {
    text_file(staging.path(), out_dir, files, name, text);
  };
  table("takeoff.csv", takeoff_csv(analysis));
  table("takeoff_by_section.csv", takeoff_by_section_csv(analysis));
  table("reactions.csv", reactions_csv(analysis));
  table("end_forces.csv", end_forces_csv(analysis));
  table("cutlist.csv", cutlist_csv(analysis));
  table("connections.csv", connections_csv(analysis));
  return files;
}

std::filesystem::path default_out_dir(const std::filesystem::path& project_file) {
  return project_file.parent_path() / (project_file.stem().string() + "-results");
}

std::vector<std::filesystem::path> write_outputs(const Analysis& analysis, const std::filesystem::path& out_dir,
                                                 const RunControl& control) {
  const detail::OutputFolderLock lock(out_dir);
  return detail::write_outputs_locked(analysis, out_dir, control);
}

std::vector<std::filesystem::path> detail::write_outputs_locked(const Analysis& analysis,
                                                                const std::filesystem::path& out_dir,
                                                                const RunControl& control) {
  // Everything goes into a fresh staging folder that replaces out_dir whole at the end.
  StagingFolder staging(out_dir);
  return write_outputs_into(analysis, staging, out_dir, {}, control);
}

std::vector<std::filesystem::path> detail::write_outputs_into(const Analysis& analysis, StagingFolder& staging,
                                                              const std::filesystem::path& out_dir,
                                                              std::vector<std::filesystem::path> tables_written,
                                                              const RunControl& control) {
  const std::filesystem::path& dir = staging.path();
  const auto& model = analysis.built.model;
  const OutputsSpec& outputs = analysis.project.outputs;
  // A text file of the folder, written whole; its name relative to the folder is added to `list`.
  auto text_file = [&](std::vector<std::filesystem::path>& list, const std::string& name, const std::string& text) {
    stepframe::text_file(dir, out_dir, list, name, text);
  };
  // Governing utilisation per member (0 where no check applies), for colouring by verdict.
  std::vector<double> utilisation(model.members.size(), 0.0);
  const auto governing = governing_checks(analysis);
  for (std::size_t m = 0; m < governing.size(); ++m)
    if (governing[m]) utilisation[m] = governing[m]->utilisation;
  const ResultSelection selected(analysis);
  const std::vector<bool> line_models = selected(outputs.line_models);
  const std::vector<bool> surfaces = selected(outputs.surfaces);
  const std::vector<bool> buckling_modes = selected.with_combinations(selected(outputs.buckling_modes));
  // Four writers run side by side, each with files of its own: the report (its pictures on a thread of
  // their own), the tables, results.json, and the VTK files on this thread. They read the analysis only
  // and call no one back; progress is reported from this thread alone. results.json has a thread of its
  // own because it is the longest single text file (when it still held every result's details, some 10 s
  // of a 100,000-member run's writing): behind the tables it finished alone, after every other writer.
  auto report = std::async(std::launch::async, [&analysis] { return report_html(analysis); });
  auto tables = std::async(std::launch::async, [&] {
    std::vector<std::filesystem::path> files;
    text_file(files, "checks.csv", checks_csv(analysis));
    if (tables_written.empty()) tables_written = write_check_free_tables(analysis, staging, out_dir);
    files.insert(files.end(), tables_written.begin(), tables_written.end());
    return files;
  });
  auto json = std::async(std::launch::async, [&] {
    std::ofstream out(dir / "results.json", std::ios::binary);
    write_results_json(analysis, [&](std::string_view piece) { out.write(piece.data(), static_cast<std::streamsize>(piece.size())); });
    if (!out.flush()) throw output_failure(out_dir / "results.json", errno);
  });
  std::vector<std::filesystem::path> written;  // relative to the folder, in a fixed order
  try {
    std::set<std::string> used;
    std::vector<viz::IndexEntry> index;
    for (std::size_t i = 0; i < analysis.results.size(); ++i) {
      control.report("vtk", static_cast<double>(i) / static_cast<double>(analysis.results.size()));
      const auto& result = analysis.results[i];
      const std::string stem = file_stem(result.name, used);
      const std::filesystem::path line = std::filesystem::path("vtk") / (stem + ".vtu");
      const std::filesystem::path surface = std::filesystem::path("vtk") / (stem + ".surface.vtu");
      if (line_models[i]) {
        viz::write_line_model_vtu(dir / line, model, result, utilisation,
                                  {outputs.line_model_points, outputs.compression, analysis.shop.marks});
        written.push_back(line);
        index.push_back({"line model", result.name, line});
      }
      if (surfaces[i]) {
        viz::SurfaceOptions surface_options;
        surface_options.compression = outputs.compression;
        surface_options.sections_per_element = outputs.surface_sections;
        viz::write_surface_vtu(dir / surface, model, result, surface_options);
        written.push_back(surface);
        index.push_back({"surface model", result.name, surface});
      }
      if (!buckling_modes[i]) continue;
      for (std::size_t m = 0; m < result.buckling_modes.size(); ++m) {
        const std::filesystem::path mode = std::filesystem::path("vtk") / fmt::format("{}.mode{}.vtu", stem, m + 1);
        viz::write_mode_vtu(dir / mode, model, result, m, outputs.compression);
        written.push_back(mode);
        index.push_back({"buckling modes", fmt::format("{} mode {} (alpha = {:.3g})", result.name, m + 1,
                                                       result.buckling_modes[m].alpha),
                         mode});
      }
    }
    // Natural vibration modes (analysis.modes): one line model each.
    if (analysis.modes)
      for (std::size_t m = 0; m < analysis.modes->modes.size(); ++m) {
        const auto& mode = analysis.modes->modes[m];
        const std::filesystem::path file = std::filesystem::path("vtk") / (file_stem(fmt::format("natural_mode{}", m + 1), used) + ".vtu");
        viz::write_vibration_mode_vtu(dir / file, model, mode, m + 1, outputs.compression);
        written.push_back(file);
        index.push_back({"natural modes", fmt::format("mode {} ({:.3g} Hz)", m + 1, mode.frequency), file});
      }
    if (!index.empty()) text_file(written, "frame.vtm", viz::multiblock_index(index));
    control.report("tables", 0);
    const auto table_files = tables.get();
    written.insert(written.end(), table_files.begin(), table_files.end());
    control.report("results.json", 0);
    json.get();
    written.push_back("results.json");
    control.report("report", 0);
    text_file(written, "report.html", report.get());
    control.throw_if_cancelled();  // the last moment a cancel (or a signal) leaves the old results in place
  } catch (const std::runtime_error& e) {
    if (tables.valid()) tables.wait();
    if (json.valid()) json.wait();
    if (report.valid()) report.wait();
    // A VTK writer that failed: the disk's or the folder's fault is bad input, anything else ours.
    if (dynamic_cast<const InputError*>(&e) == nullptr && dynamic_cast<const Cancelled*>(&e) == nullptr &&
        output_unwritable(dir))
      throw output_failure(out_dir, 0);
    throw;
  }
  // Everything is complete: only now does the new folder replace the old one, in one step.
  staging.commit();
  std::vector<std::filesystem::path> finals;
  for (const auto& f : written) finals.push_back(out_dir / f);
  spdlog::info("wrote {} files to {}", finals.size(), out_dir.string());
  if (control.progress) control.progress("report", 1.0);  // the run is complete: no cancelling now
  return finals;
}

}  // namespace stepframe
