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
#include <fstream>
#include <set>

namespace stepframe {
namespace {

// A file name from a case or combination name: letters, digits, '-', '_', '.'.
std::string file_stem(const std::string& name, std::set<std::string>& used) {
  std::string stem;
  for (char c : name)
    stem += std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '_' || c == '.' ? c : '_';
  if (stem.empty() || stem.front() == '.') stem = "result" + stem;
  std::string unique = stem;
  for (int i = 2; !used.insert(unique).second; ++i) unique = stem + "_" + std::to_string(i);
  return unique;
}

std::filesystem::path temporary_name(const std::filesystem::path& file) {
  return file.parent_path() / (file.filename().string() + ".tmp");
}

}  // namespace

std::filesystem::path default_out_dir(const std::filesystem::path& project_file) {
  return project_file.parent_path() / (project_file.stem().string() + "-results");
}

std::vector<std::filesystem::path> write_outputs(const Analysis& analysis, const std::filesystem::path& out_dir) {
  std::error_code ec;
  std::filesystem::create_directories(out_dir / "vtk", ec);
  if (ec) throw InputError(out_dir.string() + ": cannot create the output folder (" + ec.message() + ")");

  const auto& model = analysis.built.model;
  std::vector<std::filesystem::path> finals;
  // Each file is registered before it is written, so a failure removes every temporary file.
  auto start = [&](const std::filesystem::path& file) {
    finals.push_back(file);
    return temporary_name(file);
  };
  auto text_file = [&](const std::string& name, const std::string& text) {
    std::ofstream out(start(out_dir / name), std::ios::binary);
    out << text;
    if (!out.flush()) throw std::runtime_error((out_dir / name).string() + ": could not write");
  };
  // Governing utilisation per member, for colouring by verdict.
  std::vector<double> utilisation(model.members.size(), 0.0);
  for (const auto& c : analysis.checks)
    if (c.member != analysis::whole_frame) utilisation[c.member] = std::max(utilisation[c.member], c.utilisation);
  try {
    std::set<std::string> used;
    std::vector<viz::IndexEntry> index;
    for (const auto& result : analysis.results) {
      const std::string stem = file_stem(result.name, used);
      const std::filesystem::path line = std::filesystem::path("vtk") / (stem + ".vtu");
      const std::filesystem::path surface = std::filesystem::path("vtk") / (stem + ".surface.vtu");
      viz::write_line_model_vtu(start(out_dir / line), model, result, utilisation);
      viz::write_surface_vtu(start(out_dir / surface), model, result);
      index.push_back({"line model", result.name, line});
      index.push_back({"surface model", result.name, surface});
      for (std::size_t m = 0; m < result.buckling_modes.size(); ++m) {
        const std::filesystem::path mode = std::filesystem::path("vtk") / fmt::format("{}.mode{}.vtu", stem, m + 1);
        viz::write_mode_vtu(start(out_dir / mode), model, result, m);
        index.push_back({"buckling modes", fmt::format("{} mode {} (alpha = {:.3g})", result.name, m + 1,
                                                       result.buckling_modes[m].alpha),
                         mode});
      }
    }
    text_file("frame.vtm", viz::multiblock_index(index));
    text_file("checks.csv", checks_csv(analysis));
    text_file("takeoff.csv", takeoff_csv(analysis));
    text_file("end_forces.csv", end_forces_csv(analysis));
    text_file("report.html", report_html(analysis));
    text_file("results.json", results_json(analysis).dump(1) + "\n");
  } catch (...) {
    for (const auto& f : finals) std::filesystem::remove(temporary_name(f), ec);
    throw;
  }
  // Everything is complete: only now do the files take their real names.
  for (const auto& f : finals) std::filesystem::rename(temporary_name(f), f);
  spdlog::info("wrote {} files to {}", finals.size(), out_dir.string());
  return finals;
}

}  // namespace stepframe
