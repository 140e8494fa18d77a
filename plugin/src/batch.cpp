// The batch stage: projects run by `stepframe run` in child processes, a few
// at a time, and what they came to in batch.json and batch.xml (JUnit).

#include "stepframe/batch.hpp"

#include "child_process.hpp"
#include "file_digest.hpp"
#include "stepframe/api.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/project_reader.hpp"
#include "stepframe/run.hpp"
#include "stepframe/viz/markup.hpp"

#include <fmt/format.h>
#include <glob.h>
#include <nlohmann/json.hpp>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <deque>
#include <list>
#include <fstream>
#include <map>
#include <set>
#include <sstream>
#include <thread>

namespace stepframe {
namespace {

namespace fs = std::filesystem;

constexpr int internal_error = 4;

std::string read_file(const fs::path& file) {
  std::ifstream in(file, std::ios::binary);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

/// Written under a temporary name and renamed: never half a file under the final name.
void write_file(const fs::path& file, const std::string& text) {
  const fs::path temporary = file.string() + ".tmp";
  {
    std::ofstream out(temporary, std::ios::binary);
    out << text;
    if (!out.flush()) throw InputError(file.string() + ": cannot write (disk full or not writable?)");
  }
  fs::rename(temporary, file);
}

bool is_project_name(const fs::path& p) { return p.extension() == ".yaml" || p.extension() == ".yml"; }

/// Subfolder names: each project's file name without extension, "-2", "-3"... when taken.
std::vector<std::string> folder_names(const std::vector<fs::path>& projects) {
  std::vector<std::string> names;
  std::set<std::string> taken;
  for (const auto& p : projects) {
    std::string name = p.stem().string();
    for (int k = 2; taken.count(name); ++k) name = p.stem().string() + "-" + std::to_string(k);
    taken.insert(name);
    names.push_back(name);
  }
  return names;
}

std::string outcome_of(int status) {
  switch (status) {
    case 0: return "pass";
    case 1: return "fail";
    case 2: return "bad input";
    case 3: return "unstable";
    case 5: return "cancelled";
    default: return "internal error";
  }
}

/// What `stepframe run --json` printed, into the entry.
void read_summary(BatchEntry& e, const std::string& stdout_text, const std::string& stderr_text) {
  nlohmann::json j;
  try {
    j = nlohmann::json::parse(stdout_text);
  } catch (const std::exception&) {
    e.message = stderr_text.empty() ? "no summary from the run" : stderr_text;
    return;
  }
  if (j.value("status", "") == "error") {
    e.message = j.value("message", "");
    return;
  }
  const nlohmann::json* worst = nullptr;
  for (const auto& c : j["checks"]) {
    if (!worst || c["utilisation"].get<double>() > (*worst)["utilisation"].get<double>()) worst = &c;
    if (!c["pass"].get<bool>())
      e.failing.push_back(fmt::format("{} {} under {}: utilisation {:.3f} ({})",
                                      c["member"].is_null() ? "frame" : fmt::format("member {}", c["member"].get<std::size_t>()),
                                      c["check"].get<std::string>(), c["combination"].get<std::string>(),
                                      c["utilisation"].get<double>(), c["clause"].get<std::string>()));
  }
  if (worst) {
    e.governing_utilisation = (*worst)["utilisation"].get<double>();
    e.governing = fmt::format("{} {} under {}",
                              (*worst)["member"].is_null() ? "frame" : fmt::format("member {}", (*worst)["member"].get<std::size_t>()),
                              (*worst)["check"].get<std::string>(), (*worst)["combination"].get<std::string>());
  }
}

nlohmann::json entry_json(const BatchEntry& e) {
  nlohmann::json j{{"name", e.name},
                   {"project", e.project.string()},
                   {"project_sha256", e.project_sha256},
                   {"model_sha256", e.model_sha256},
                   {"exit_status", e.exit_status},
                   {"outcome", e.outcome},
                   {"governing_utilisation", nullptr},
                   {"governing", e.governing},
                   {"failing", e.failing},
                   {"message", e.message},
                   {"seconds", e.seconds},
                   {"skipped", e.skipped}};
  if (e.governing_utilisation) j["governing_utilisation"] = *e.governing_utilisation;
  return j;
}

BatchEntry entry_from_json(const nlohmann::json& j) {
  BatchEntry e;
  e.name = j.value("name", "");
  e.project = j.value("project", "");
  e.project_sha256 = j.value("project_sha256", "");
  e.model_sha256 = j.value("model_sha256", "");
  e.exit_status = j.value("exit_status", internal_error);
  e.outcome = j.value("outcome", "");
  if (j.contains("governing_utilisation") && j["governing_utilisation"].is_number())
    e.governing_utilisation = j["governing_utilisation"].get<double>();
  e.governing = j.value("governing", "");
  e.failing = j.value("failing", std::vector<std::string>{});
  e.message = j.value("message", "");
  e.seconds = j.value("seconds", 0.0);
  return e;
}

/// The previous batch's entries by name, when it ran with this program version.
std::map<std::string, BatchEntry> previous_batch(const fs::path& out_dir) {
  std::map<std::string, BatchEntry> previous;
  const auto file = out_dir / "batch.json";
  if (!fs::exists(file)) return previous;
  try {
    const auto j = nlohmann::json::parse(read_file(file));
    if (j.value("version", "") != library_version()) return previous;
    for (const auto& p : j["projects"]) previous[p.value("name", "")] = entry_from_json(p);
  } catch (const std::exception& e) {
    spdlog::warn("{}: not a readable batch record ({}); every project runs", file.string(), e.what());
  }
  return previous;
}

std::string xml(const std::string& text) { return viz::escape_markup(text); }

}  // namespace

std::vector<fs::path> batch_projects(const std::vector<std::string>& arguments) {
  std::vector<fs::path> projects;
  for (const auto& argument : arguments) {
    if (argument.find_first_of("*?[") != std::string::npos) {
      glob_t found{};
      const int r = ::glob(argument.c_str(), 0, nullptr, &found);
      if (r == 0)
        for (std::size_t i = 0; i < found.gl_pathc; ++i) projects.emplace_back(found.gl_pathv[i]);
      ::globfree(&found);
      if (r != 0) throw InputError("'" + argument + "' matches no file; check the pattern");
      continue;
    }
    const fs::path path = argument;
    if (!fs::is_regular_file(path)) throw InputError(argument + ": no such file; give project files, patterns or manifests");
    if (is_project_name(path)) {
      projects.push_back(path);
      continue;
    }
    std::ifstream in(path);  // a manifest: one project per line
    if (!in) throw InputError(argument + ": cannot be read; check its permissions");
    std::string line;
    for (int number = 1; std::getline(in, line); ++number) {
      line = line.substr(0, line.find('#'));
      line.erase(0, line.find_first_not_of(" \t\r"));
      line.erase(line.find_last_not_of(" \t\r") + 1);
      if (line.empty()) continue;
      const fs::path project = fs::path(line).is_absolute() ? fs::path(line) : path.parent_path() / line;
      if (!fs::is_regular_file(project))
        throw InputError(fmt::format("{}:{}: {} is not a file; fix the manifest line", argument, number, project.string()));
      projects.push_back(project);
    }
  }
  if (projects.empty()) throw InputError("no project to run: give project files (.yaml), patterns or manifests");
  return projects;
}

BatchReport run_batch(const std::vector<fs::path>& projects, const BatchOptions& options) {
  const auto started = std::chrono::steady_clock::now();
  fs::create_directories(options.out_dir / "logs");
  const auto names = folder_names(projects);
  const auto previous = options.force ? std::map<std::string, BatchEntry>{} : previous_batch(options.out_dir);

  BatchReport report;
  report.entries.resize(projects.size());
  std::deque<std::size_t> waiting;
  std::size_t finished = 0;
  for (std::size_t i = 0; i < projects.size(); ++i) {
    auto& e = report.entries[i];
    e.project = projects[i];
    e.name = names[i];
    e.project_sha256 = detail::file_sha256(projects[i]);
    try {
      e.model_sha256 = detail::file_sha256(read_project(projects[i]).model);
    } catch (const std::exception&) {
      e.model_sha256 = "";  // the run will say what is wrong with the project
    }
    const auto before = previous.find(e.name);
    const bool unchanged = before != previous.end() && !e.model_sha256.empty() &&
                           before->second.project_sha256 == e.project_sha256 &&
                           before->second.model_sha256 == e.model_sha256 && before->second.exit_status != internal_error &&
                           fs::exists(options.out_dir / e.name / "results.json");
    if (unchanged) {
      const auto keep_project = e.project;
      e = before->second;
      e.project = keep_project;
      e.skipped = true;
      ++finished;
      if (options.progress) options.progress(finished, projects.size(), e.name);
    } else {
      waiting.push_back(i);
    }
  }

  struct Running {
    std::size_t index;
    detail::ChildProcess child;
    fs::path stdout_file, stderr_file;
  };
  std::list<Running> running;  // a list: a finished child leaves from anywhere, nothing moves
  const unsigned jobs = std::max(1u, options.jobs);
  while (!waiting.empty() || !running.empty()) {
    while (!waiting.empty() && running.size() < jobs) {
      const std::size_t i = waiting.front();
      waiting.pop_front();
      const auto& e = report.entries[i];
      const fs::path out = options.out_dir / "logs" / (e.name + ".summary.json"), err = options.out_dir / "logs" / (e.name + ".log");
      running.push_back({i,
                         detail::ChildProcess({options.executable.string(), "-q", "run", e.project.string(), "--out",
                                               (options.out_dir / e.name).string(), "--json", "--no-progress"},
                                              out, err),
                         out, err});
    }
    std::this_thread::sleep_for(std::chrono::milliseconds(20));
    for (auto it = running.begin(); it != running.end();) {
      auto& e = report.entries[it->index];
      const bool late = options.timeout && it->child.seconds() > *options.timeout;
      if (!it->child.finished() && !late) {
        ++it;
        continue;
      }
      if (late && !it->child.finished()) {
        it->child.stop();
        e.exit_status = internal_error;
        e.outcome = "timeout";
        e.message = fmt::format("stopped after {:.0f} s (--timeout)", *options.timeout);
      } else if (!it->child.exit_status()) {
        e.exit_status = internal_error;
        e.outcome = "crashed";
        e.message = fmt::format("ended by signal {} ({}); see logs/{}.log", it->child.signal(), strsignal(it->child.signal()), e.name);
      } else {
        e.exit_status = *it->child.exit_status();
        e.outcome = outcome_of(e.exit_status);
        read_summary(e, read_file(it->stdout_file), read_file(it->stderr_file));
      }
      e.seconds = it->child.seconds();
      std::error_code ignored;
      fs::remove(it->stdout_file, ignored);
      ++finished;
      if (options.progress) options.progress(finished, projects.size(), e.name);
      it = running.erase(it);
    }
  }

  for (const auto& e : report.entries) report.exit_status = std::max(report.exit_status, e.exit_status);
  report.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - started).count();
  write_file(options.out_dir / "batch.json", batch_json(report));
  write_file(options.out_dir / "batch.xml", batch_junit_xml(report));
  return report;
}

std::string batch_json(const BatchReport& report) {
  nlohmann::json j{{"schema", "stepframe-batch/1"},
                   {"version", library_version()},
                   {"caution", caution},
                   {"exit_status", report.exit_status},
                   {"seconds", report.seconds},
                   {"projects", nlohmann::json::array()}};
  for (const auto& e : report.entries) j["projects"].push_back(entry_json(e));
  return j.dump(1) + "\n";
}

std::string batch_junit_xml(const BatchReport& report) {
  std::size_t failures = 0, errors = 0;
  std::string cases;
  for (const auto& e : report.entries) {
    cases += fmt::format("  <testcase classname=\"stepframe.batch\" name=\"{}\" file=\"{}\" time=\"{:.3f}\">\n", xml(e.name),
                         xml(e.project.string()), e.seconds);
    const std::string governing =
        e.governing_utilisation ? fmt::format("governing utilisation {:.3f}: {}", *e.governing_utilisation, e.governing) : "";
    if (e.outcome == "fail" || e.outcome == "unstable") {
      ++failures;
      const std::string what = e.outcome == "fail" ? fmt::format("{} {} fail{}", e.failing.size(),
                                                                 e.failing.size() == 1 ? "check" : "checks",
                                                                 e.failing.size() == 1 ? "s" : "")
                                                   : "the frame is unstable: " + e.message;
      std::string body;
      for (const auto& f : e.failing) body += f + "\n";
      cases += fmt::format("    <failure type=\"{}\" message=\"{}\">{}</failure>\n", xml(e.outcome), xml(what), xml(body + e.message));
    } else if (e.outcome != "pass") {
      ++errors;
      cases += fmt::format("    <error type=\"{}\" message=\"{}\">{}</error>\n", xml(e.outcome), xml(e.outcome + ": " + e.message), xml(e.message));
    }
    cases += fmt::format("    <system-out>{}{}</system-out>\n  </testcase>\n", xml(governing),
                         e.skipped ? xml(" (unchanged since the last batch: not run again)") : "");
  }
  return fmt::format(
      "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<testsuites name=\"stepframe batch\" tests=\"{0}\" failures=\"{1}\" "
      "errors=\"{2}\" time=\"{3:.3f}\">\n <testsuite name=\"stepframe\" tests=\"{0}\" failures=\"{1}\" errors=\"{2}\" "
      "time=\"{3:.3f}\">\n  <properties>\n   <property name=\"stepframe version\" value=\"{4}\"/>\n   <property "
      "name=\"caution\" value=\"{5}\"/>\n  </properties>\n{6} </testsuite>\n</testsuites>\n",
      report.entries.size(), failures, errors, report.seconds, xml(std::string(library_version())),
      xml(std::string(caution)), cases);
}

std::string batch_summary_text(const BatchReport& report) {
  std::size_t width = 7;
  for (const auto& e : report.entries) width = std::max(width, e.name.size());
  std::string out = fmt::format("{:<{}}  {:<14} {:>6}  {:>8}  {}\n", "project", width, "outcome", "util.", "seconds", "governing");
  for (const auto& e : report.entries)
    out += fmt::format("{:<{}}  {:<14} {:>6}  {:>8.1f}  {}\n", e.name, width, e.outcome + (e.skipped ? " *" : ""),
                       e.governing_utilisation ? fmt::format("{:.2f}", *e.governing_utilisation) : "-", e.seconds,
                       e.governing.empty() ? e.message : e.governing);
  std::map<std::string, std::size_t> counts;
  for (const auto& e : report.entries) ++counts[e.outcome];
  std::vector<std::string> parts;
  for (const auto& [outcome, n] : counts) parts.push_back(fmt::format("{} {}", n, outcome));
  out += fmt::format("\n{} {}: {} in {:.1f} s", report.entries.size(), report.entries.size() == 1 ? "project" : "projects",
                     fmt::join(parts, ", "), report.seconds);
  if (std::any_of(report.entries.begin(), report.entries.end(), [](const auto& e) { return e.skipped; }))
    out += " (* unchanged since the last batch: not run again; --force runs them)";
  return out + "\n";
}

}  // namespace stepframe
