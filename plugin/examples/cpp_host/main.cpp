// A pipeline step that checks a frame with stepframe's C++ API:
//   cpp_host PROJECT.yaml [OUT_DIR]
// Progress goes to stderr, the run's log into this program's own sink, and
// the exit status is stepframe's (0 pass, 1 a check fails, 2 bad input, 3 unstable).

#include <stepframe/stepframe.hpp>

#include <spdlog/sinks/ostream_sink.h>

#include <algorithm>
#include <iostream>
#include <sstream>

int main(int argc, char** argv) {
  if (argc < 2) {
    std::cerr << "usage: cpp_host PROJECT.yaml [OUT_DIR]\n";
    return 2;
  }
  std::ostringstream log;
  stepframe::RunOptions options;
  if (argc > 2) options.out_dir = argv[2];
  options.control.progress = [](std::string_view stage, double fraction) {
    if (fraction == 0.0) std::cerr << "[cpp_host] " << stage << "\n";
  };
  options.control.log_sink = std::make_shared<spdlog::sinks::ostream_sink_mt>(log);

  const auto results = stepframe::run_file(argv[1], options);
  if (!results.analysed()) {
    std::cerr << "[cpp_host] " << results.message() << "\n";
    return static_cast<int>(results.status());
  }
  const auto& json = results.json();
  double worst = 0;
  for (const auto& check : json["checks"]) worst = std::max(worst, check["utilisation"].get<double>());
  std::cout << "stepframe " << stepframe::library_version() << ": " << json["status"].get<std::string>() << ", "
            << json["members"].size() << " members, " << json["results"].size() << " results, "
            << "highest utilisation " << worst << "\n";
  const std::string captured = log.str();
  std::cout << "log lines captured: " << std::count(captured.begin(), captured.end(), '\n') << "\n";
  return static_cast<int>(results.status());
}
