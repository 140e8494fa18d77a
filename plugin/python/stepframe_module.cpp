// The `stepframe` Python module: run a project given as a path or a dict,
// get results as dicts, watch progress with a Python callable.
//
//   import stepframe
//   r = stepframe.run("platform.yaml", progress=lambda stage, f: print(stage, f))
//   r["exit_status"], r["results"]["members"][0]["section"]

#include "stepframe/api.hpp"
#include "stepframe/inspect.hpp"

#include <pybind11/eval.h>
#include <pybind11/functional.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>
#include <spdlog/sinks/base_sink.h>

#include <filesystem>
#include <fstream>
#include <memory>
#include <mutex>
#include <optional>
#include <sstream>
#include <string>

namespace py = pybind11;

namespace {

/// nlohmann::json -> Python objects (dict, list, str, int, float, bool, None).
py::object to_python(const nlohmann::json& j) {
  switch (j.type()) {
    case nlohmann::json::value_t::object: {
      py::dict d;
      for (const auto& [key, value] : j.items()) d[py::str(key)] = to_python(value);
      return d;
    }
    case nlohmann::json::value_t::array: {
      py::list l;
      for (const auto& value : j) l.append(to_python(value));
      return l;
    }
    case nlohmann::json::value_t::string: return py::str(j.get<std::string>());
    case nlohmann::json::value_t::boolean: return py::bool_(j.get<bool>());
    case nlohmann::json::value_t::number_integer: return py::int_(j.get<long long>());
    case nlohmann::json::value_t::number_unsigned: return py::int_(j.get<unsigned long long>());
    case nlohmann::json::value_t::number_float: return py::float_(j.get<double>());
    default: return py::none();
  }
}

/// A log sink that calls a Python callable log(level, message) with the GIL held.
class PythonSink : public spdlog::sinks::base_sink<std::mutex> {
 public:
  explicit PythonSink(py::function callback) : log_(std::move(callback)) {}
  ~PythonSink() override {
    py::gil_scoped_acquire gil;
    log_ = py::function();
  }

 protected:
  void sink_it_(const spdlog::details::log_msg& msg) override {
    const auto level = spdlog::level::to_string_view(msg.level);
    const std::string text(msg.payload.data(), msg.payload.size());
    py::gil_scoped_acquire gil;
    try {
      log_(std::string(level.data(), level.size()), text);
    } catch (py::error_already_set&) {
      // A failing log handler must not stop the analysis; its error is dropped.
    }
  }
  void flush_() override {}

 private:
  py::function log_;
};

/// Progress and cancellation from Python: progress(stage, fraction) returning
/// False cancels; an exception it raises (or Ctrl-C) cancels and is re-raised
/// once the run has stopped.
struct PythonControl {
  py::object progress = py::none();
  std::optional<py::error_already_set> error;

  stepframe::RunControl control(py::object log) {
    stepframe::RunControl c;
    c.progress = [this](std::string_view stage, double fraction) {
      py::gil_scoped_acquire gil;
      if (error) return;
      try {
        if (PyErr_CheckSignals() != 0) throw py::error_already_set();
        if (!progress.is_none()) {
          const py::object answer = progress(std::string(stage), fraction);
          if (answer.is(py::bool_(false))) cancelled_by_answer = true;
        }
      } catch (py::error_already_set& e) {
        error = std::move(e);
      }
    };
    c.cancel = [this] { return cancelled_by_answer || error.has_value(); };
    if (!log.is_none()) c.log_sink = std::make_shared<PythonSink>(log.cast<py::function>());
    c.log_level = spdlog::level::debug;
    return c;
  }
  bool cancelled_by_answer = false;
};

/// A project file's text, for running it on a model given as STEP text.
std::string read_text_file(const std::string& path) {
  std::ifstream in(path);
  if (!in) throw py::value_error(path + ": cannot open the project file; check the path");
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

std::string parent_of(const std::string& path) {
  const auto parent = std::filesystem::path(path).parent_path();
  return parent.empty() ? std::string(".") : parent.string();
}

py::dict to_dict(const stepframe::Results& results) {
  py::dict d;
  d["exit_status"] = static_cast<int>(results.status());
  d["message"] = results.message();
  d["results"] = to_python(results.json());
  py::list files;
  for (const auto& f : results.files()) files.append(f.string());
  d["files"] = files;
  d["summary"] = results.summary();
  return d;
}

py::dict run(const py::object& project, const py::object& out_dir, const py::object& base_dir,
             const py::object& step_text, const py::object& progress, const py::object& log) {
  stepframe::RunOptions options;
  if (!out_dir.is_none()) options.out_dir = py::str(out_dir).cast<std::string>();
  PythonControl python;
  python.progress = progress;
  options.control = python.control(log);

  std::optional<stepframe::Results> results;
  if (!step_text.is_none() || py::isinstance<py::dict>(project)) {
    // A dict is written as JSON, which the project reader reads as YAML.
    const std::string text = py::isinstance<py::dict>(project)
                                 ? py::module_::import("json").attr("dumps")(project).cast<std::string>()
                                 : read_text_file(py::str(project).cast<std::string>());
    const std::string base = base_dir.is_none() ? (py::isinstance<py::dict>(project) ? std::string(".") : parent_of(py::str(project).cast<std::string>()))
                                                : py::str(base_dir).cast<std::string>();
    std::optional<stepframe::StepText> step;
    if (!step_text.is_none()) step = stepframe::StepText{step_text.cast<std::string>(), "<STEP text>"};
    py::gil_scoped_release release;
    results.emplace(step ? stepframe::run_text(text, base, *step, options) : stepframe::run_text(text, base, options));
  } else {
    const std::string path = py::str(project).cast<std::string>();  // str or os.PathLike
    py::gil_scoped_release release;
    results.emplace(stepframe::run_file(path, options));
  }
  if (python.error) throw std::move(*python.error);
  return to_dict(*results);
}

py::object inspect(const py::object& model, const std::optional<double>& tolerance_mm) {
  const std::string path = py::str(model).cast<std::string>();
  nlohmann::json j;
  {
    py::gil_scoped_release release;
    try {
      // A project file is inspected with its own settings and rules (as `stepframe inspect X.yaml`).
      const auto inspection =
          stepframe::is_project_file(path)
              ? stepframe::inspect_project(path, tolerance_mm ? std::optional<double>(*tolerance_mm * 1e-3) : std::nullopt)
              : stepframe::inspect_step(path, tolerance_mm.value_or(1.0) * 1e-3);
      j = stepframe::inspection_json(inspection);
    } catch (const stepframe::geometry::StepReadError& e) {
      j = nlohmann::json{{"error", e.what()}};
    } catch (const stepframe::InputError& e) {
      j = nlohmann::json{{"error", e.what()}};
    }
  }
  if (j.contains("error")) throw py::value_error(j["error"].get<std::string>());
  return to_python(j);
}

}  // namespace

namespace stepframe::python {
std::string_view python_batch_source();  // plugin/python/batch.py, compiled in
}

PYBIND11_MODULE(stepframe, m) {
  m.doc() = "stepframe: analyse steel frames drawn as STEP wireframes (screening aid; a competent engineer "
            "must review the results).";
  m.attr("__version__") = std::string(stepframe::library_version());
  m.attr("CAUTION") = std::string(stepframe::caution);
  m.attr("PASS") = 0;
  m.attr("CHECK_FAILED") = 1;
  m.attr("BAD_INPUT") = 2;
  m.attr("UNSTABLE") = 3;
  m.attr("CANCELLED") = 5;

  m.def("run", &run, py::arg("project"), py::kw_only(), py::arg("out_dir") = py::none(),
        py::arg("base_dir") = py::none(), py::arg("step_text") = py::none(), py::arg("progress") = py::none(),
        py::arg("log") = py::none(),
        R"(Run a project and return what it came to.

project   a project file path (str or os.PathLike), or a dict with the project file's keys
          (units as in a project file; a relative 'model' is found in base_dir, default '.').
out_dir   folder for results.json and vtk/*.vtu; None writes nothing.
base_dir  where a relative 'model' is found (default: '.' for a dict, the file's folder for a path).
step_text the model as STEP text held in memory (str); the project's 'model' then only names it.
progress  callable(stage: str, fraction: float); returning False cancels the run, and an
          exception it raises cancels the run and is raised again here.
log       callable(level: str, message: str) receiving the run's log instead of stderr.

Returns a dict: exit_status (0 pass, 1 a check fails, 2 bad input, 3 unstable, 5 cancelled),
message (what went wrong, else ''), results (the results.json document as dicts and lists,
or {'status': 'error', ...}), files (written paths), summary (the text `stepframe run` prints).)");
  m.def("inspect", &inspect, py::arg("model"), py::arg("tolerance_mm") = py::none(),
        "What a STEP file holds, as `stepframe inspect --json` prints it; given a project file (.yaml, .yml),\n"
        "the wireframe its settings build and the members its rules leave without a section or material\n"
        "('unassigned_members'). tolerance_mm: the merge tolerance (default 1 mm, or the project's).\n"
        "Raises ValueError when a file cannot be read.");
  // stepframe.batch and its helpers, in Python, run in the module's own namespace.
  py::exec(std::string(stepframe::python::python_batch_source()), m.attr("__dict__"));
}
