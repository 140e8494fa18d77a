#pragma once
// stepframe's C++ API in one include: projects (read or built in code), model
// sources, runs with progress, cancellation and log routing, and results.
// The C ABI is stepframe/stepframe.h; the command line is `stepframe --help`.

#include "stepframe/api.hpp"
#include "stepframe/errors.hpp"
#include "stepframe/inspect.hpp"
#include "stepframe/model_source.hpp"
#include "stepframe/project.hpp"
#include "stepframe/project_builder.hpp"
#include "stepframe/project_reader.hpp"
#include "stepframe/run.hpp"
#include "stepframe/run_control.hpp"
