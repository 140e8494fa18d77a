// The limit state of a combination that does not say (`combinations[i].kind`).

#include "stepframe/project.hpp"

#include <algorithm>
#include <cctype>

namespace stepframe {

bool default_serviceability(const std::string& name, const std::vector<std::pair<std::string, double>>& factors) {
  std::string lower = name;
  std::transform(lower.begin(), lower.end(), lower.begin(), [](unsigned char c) { return std::tolower(c); });
  auto says = [&](const char* word) { return lower.find(word) != std::string::npos; };
  if (says("sls") || says("serv") || says("char")) return true;
  if (says("uls")) return false;
  // EN 1990 6.5.3: characteristic, frequent and quasi-permanent combinations have factors of at most 1
  // (psi factors and unit permanent loads); ultimate ones carry gamma factors above 1 (EN 1990 6.4.3.2).
  return !factors.empty() &&
         std::all_of(factors.begin(), factors.end(), [](const auto& f) { return f.second <= 1.0; });
}

}  // namespace stepframe
