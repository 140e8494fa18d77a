#pragma once
// report.html: one self-contained page a person reads first: the verdict and
// the caution, a summary, pictures, the members by utilisation, the model's
// diagnostics and the inputs the run used.

#include "stepframe/run.hpp"

#include <string>

namespace stepframe {

/// The whole page (pictures embedded as PNG data URIs; no external files).
std::string report_html(const Analysis& analysis);

}  // namespace stepframe
