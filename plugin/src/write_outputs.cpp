#include "stepframe/run.hpp"
#include "stepframe/viz/vtu_writer.hpp"

#include <spdlog/spdlog.h>

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

  std::vector<std::filesystem::path> finals;
  std::set<std::string> used;
  try {
    for (const auto& result : analysis.results) {
      const auto file = out_dir / "vtk" / (file_stem(result.name, used) + ".vtu");
      finals.push_back(file);
      viz::write_line_model_vtu(temporary_name(file), analysis.built.model, result);
    }
    const auto json_file = out_dir / "results.json";
    finals.push_back(json_file);
    std::ofstream out(temporary_name(json_file));
    out << results_json(analysis).dump(1) << '\n';
    if (!out.flush()) throw std::runtime_error(json_file.string() + ": could not write");
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
