#pragma once
// Running a project end to end: read, build, solve, check, write.

#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/natural_frequencies.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/analysis/sway_imperfection.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/geometry/wireframe.hpp"
#include "stepframe/model_builder.hpp"
#include "stepframe/project.hpp"
#include "stepframe/run_control.hpp"
#include "stepframe/shop_data.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <functional>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::viz {
class PictureRenderer;
}

namespace stepframe {

/// The caution every output carries.
inline constexpr std::string_view caution =
    "Screening aid only: a competent engineer must review these results; local codes and licensed practice govern.";

/// One ultimate combination's sway imperfection in one horizontal direction
/// (EN 1993-1-1 5.3.2): phi, the 5.3.2(4) verdict and the combinations solved
/// with the equivalent forces ("ULS.sway+X", "ULS.sway-X"; none when exempt).
struct SwayImperfectionRecord {
  std::string combination;
  analysis::SwayImperfection imperfection;  ///< with its forces towards +axis
  /// The load case of those forces ("ULS.swayX"), solved with the others but left out of
  /// Analysis::results (the forces are listed here); empty when exempt.
  std::string forces_case;
  std::vector<std::string> variants;  ///< the combination with the forces added, then subtracted
  /// analysis.sway_amplification: the combination's alpha_cr and the factor 1 / (1 - 1/alpha_cr) of
  /// EN 1993-1-1 5.2.2(5) its variants carry on the horizontal loads and these forces (1: none).
  std::optional<double> alpha_cr;
  double amplification = 1.0;
};

/// Everything a run computes, before anything is written.
struct Analysis {
  Project project;
  std::string file_length_unit;  ///< as the STEP file declares it
  geometry::Wireframe wireframe;
  BuiltModel built;
  std::vector<analysis::LoadResult> results;  ///< cases, then combinations
  std::vector<analysis::CheckResult> checks;
  /// Sway imperfections applied (analysis.sway_imperfection), per ultimate combination and direction.
  std::vector<SwayImperfectionRecord> sway_imperfections;
  /// Natural frequencies (analysis.modes), with the added mass they include; empty without modes.
  std::optional<analysis::ModalResult> modes;
  double added_mass = 0;  ///< [kg] from analysis.mass_from and masses: together
  ShopData shop;  ///< piece marks and precamber (shop_data.hpp)
  /// What draws the report's pictures: analyse_project makes it before reading the STEP file, so that
  /// its offscreen context is ready by the time the report is written. Null: the report makes its own.
  std::shared_ptr<viz::PictureRenderer> pictures;

  ExitStatus status() const;  ///< pass or check_failed
};

/// Reads the project and its STEP file, builds the model, solves and checks.
/// Throws InputError (bad input), geometry::StepReadError (unreadable STEP),
/// analysis::UnstableFrame (mechanism), Cancelled (the control asked to stop).
Analysis analyse_project(const std::filesystem::path& project_file, const RunControl& control = {});

/// The same for a project already in memory whose model is already read
/// (from any source): builds the model, solves and checks.
Analysis analyse_model(Project project, const geometry::StepModel& step, const RunControl& control = {});
/// The same, letting go of `step` once its wireframe is built.
Analysis analyse_model(Project project, geometry::StepModel&& step, const RunControl& control = {});

/// Writes the results.json document (schema stepframe-results/1; README
/// "results.json") as text, handing it to `sink` in pieces of about a
/// megabyte: a building-sized document is never held whole.
void write_results_json(const Analysis& analysis, const std::function<void(std::string_view)>& sink);

/// The results.json document as one string.
std::string results_json_text(const Analysis& analysis);

/// The results.json document parsed (for embedding; large for large models).
nlohmann::json results_json(const Analysis& analysis);

/// The `checks` array of results.json, every check with its clause and details
/// (as outputs.check_details: all writes it).
nlohmann::json checks_json(const std::vector<analysis::CheckResult>& checks);

/// Writes results.json, the tables, the report and the VTK files the
/// project's `outputs` ask for under `out_dir` (vtk/NAME.vtu, ...). Every file
/// is written under a temporary name first and renamed only when all are
/// complete. Reports the stages "vtk", "tables", "results.json" and "report"
/// to `control` ("report" 1 when every file is in place). Returns the files written.
std::vector<std::filesystem::path> write_outputs(const Analysis& analysis, const std::filesystem::path& out_dir,
                                                 const RunControl& control = {});

/// The governing check of every member (its largest utilisation, the first of
/// equals), nullptr where no check applies; index = member. What checks.csv
/// lists, the report ranks by, and results.json details by default.
std::vector<const analysis::CheckResult*> governing_checks(const Analysis& analysis);

/// The results the `governing` output selection writes, as indices into
/// analysis.results: the combination (case, when there are no combinations)
/// of the largest member utilisation and the one with the lowest alpha_cr,
/// where a combination with sway-imperfection variants (EN 1993-1-1 5.3.2)
/// is represented by the variant that governs it.
std::vector<std::size_t> governing_results(const Analysis& analysis);

/// Which of analysis.results each output selection picks, worked out once
/// from the analysis (its checks and sway variants) for every selection asked.
class ResultSelection {
 public:
  explicit ResultSelection(const Analysis& analysis);
  /// One flag per result: every one (all), none, the governing results
  /// (governing), or every case and combination with, of a combination's
  /// sway-imperfection variants, the one that governs it (the largest member
  /// utilisation among them) besides the governing results (combinations).
  std::vector<bool> operator()(VtkSelection selection) const;
  /// `selected` with the combination of each selected sway variant added
  /// (a variant's buckling modes are its combination's).
  std::vector<bool> with_combinations(std::vector<bool> selected) const;

 private:
  std::vector<std::size_t> governing_;
  std::vector<std::size_t> combination_of_;  ///< per result: a variant's combination, else -1
  std::vector<bool> ungoverning_variants_;
};

/// The default output folder: "<project stem>-results" beside the project file.
std::filesystem::path default_out_dir(const std::filesystem::path& project_file);

/// What a whole run came to: the status a caller exits with and, when the
/// analysis ran, its results and the files written.
struct RunOutcome {
  ExitStatus status = ExitStatus::bad_input;
  std::string message;  ///< for bad input or an unstable frame: what is wrong and what to do
  std::optional<Analysis> analysis;
  std::vector<std::filesystem::path> files;
};

/// analyse_project + write_outputs, with every failure mapped to its exit
/// status and message (nothing is written unless the analysis completes).
/// `out_dir` empty means default_out_dir(project_file). `vtk`, when given,
/// sets every kind of VTK file (line models, surfaces, buckling modes) to
/// that selection, `result_details` results.json's details of results
/// (outputs.result_details) and `check_details` of checks
/// (outputs.check_details), whatever the project's `outputs` say.
RunOutcome run_project(const std::filesystem::path& project_file, const std::filesystem::path& out_dir = {},
                       const RunControl& control = {}, std::optional<VtkSelection> vtk = std::nullopt,
                       std::optional<VtkSelection> result_details = std::nullopt,
                       std::optional<CheckDetails> check_details = std::nullopt);

/// Runs `analyse` (with `control`, to which it adds the writing of the tables
/// that need no check while the checks wait for the buckling analysis:
/// RunControl::results_solved), writes the outputs
/// under `out_dir` unless it is empty, and maps every failure to its exit
/// status and message (`context` names the input in messages that do not
/// already). Routes the log to control.log_sink for the duration. run_project
/// and the embedding API share it.
RunOutcome run_guarded(const std::function<Analysis(const RunControl&)>& analyse, const std::filesystem::path& out_dir,
                       const RunControl& control, const std::string& context,
                       std::optional<VtkSelection> vtk = std::nullopt,
                       std::optional<VtkSelection> result_details = std::nullopt,
                       std::optional<CheckDetails> check_details = std::nullopt);

/// A short human summary: status, governing member and check, per-result extremes.
std::string summary_text(const Analysis& analysis);

}  // namespace stepframe
