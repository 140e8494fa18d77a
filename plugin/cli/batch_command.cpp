#include "batch_command.hpp"

#include "progress_display.hpp"
#include "stepframe/batch.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/run.hpp"

#include <spdlog/spdlog.h>

#include <iostream>

namespace stepframe::cli {

CLI::App* add_batch_command(CLI::App& app, BatchCommandOptions& options) {
  auto* batch = app.add_subcommand(
      "batch",
      "Run many projects, each in a process of its own, a few at a time. Writes DIR/<project>/ (each project's "
      "results, as `run` writes them), DIR/batch.json (every project's verdict, governing utilisation, time and "
      "input SHA-256), DIR/batch.xml (JUnit XML, one test case per project) and DIR/logs/. Exit status: the worst "
      "of the projects' (crashes and timeouts count as 4).");
  batch->add_option("PROJECTS", options.inputs, "Project files (.yaml), glob patterns, or manifests (one project path per line)")
      ->required();
  batch->add_option("--out", options.out, "Output folder of the batch")->required();
  batch->add_option("-j,--jobs", options.jobs, "Projects run at once")->capture_default_str()->check(CLI::Range(1u, 256u));
  batch->add_option("--timeout", options.timeout, "Seconds a project may run before it is stopped")->check(CLI::PositiveNumber);
  batch->add_flag("--force", options.force, "Run every project, also those unchanged since the last batch into --out");
  return batch;
}

int batch_command(const BatchCommandOptions& options, bool show_progress) {
  std::vector<std::filesystem::path> projects;
  try {
    projects = batch_projects(options.inputs);
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  }
  ProgressDisplay display(show_progress);
  auto progress = display.callback();
  BatchOptions batch;
  batch.out_dir = options.out;
  batch.executable = std::filesystem::read_symlink("/proc/self/exe");  // this very program runs each project
  batch.jobs = options.jobs;
  batch.timeout = options.timeout;
  batch.force = options.force;
  batch.progress = [&](std::size_t done, std::size_t total, const std::string&) {
    progress("batch", static_cast<double>(done) / static_cast<double>(total));
  };
  spdlog::info("batch: {} projects, {} at a time, into {}", projects.size(), batch.jobs, options.out.string());
  BatchReport report;
  try {
    report = run_batch(projects, batch);
  } catch (const InputError& e) {
    display.clear();
    spdlog::error("{}", e.what());
    return static_cast<int>(ExitStatus::bad_input);
  }
  display.clear();
  std::cout << batch_summary_text(report) << "\nbatch record: " << (options.out / "batch.json").string() << ", "
            << (options.out / "batch.xml").string() << "\n\n"
            << caution << "\n";
  return report.exit_status;
}

}  // namespace stepframe::cli
