#pragma once
// The plain-text tables a run writes beside results.json, for spreadsheets
// and fabrication: one function per file, each returning the CSV text.
// Units are named in every column header (people read these files).

#include "stepframe/run.hpp"

#include <string>

namespace stepframe {

/// checks.csv: one row per member: governing utilisation, check, clause,
/// combination and station, plus pass/fail.
std::string checks_csv(const Analysis& analysis);

/// takeoff.csv: one row per member (section, material, cut length, mass),
/// then a total per section and an overall total.
std::string takeoff_csv(const Analysis& analysis);

/// end_forces.csv: per member end, the envelope (largest and smallest value
/// over the combinations, or over the cases when there are none) of N, Vy,
/// Vz, T, My, Mz with the governing combination: connection design forces.
std::string end_forces_csv(const Analysis& analysis);

}  // namespace stepframe
