#pragma once
// The plain-text tables a run writes beside results.json, for spreadsheets
// and fabrication: one function per file, each returning the CSV text.
// Units are named in every column header (people read these files).

#include "stepframe/run.hpp"

#include <string>

namespace stepframe {

/// A unit people read and the factor from SI to it: "Pa" -> MPa (1e-6),
/// "m" -> mm, "N" -> kN, "N*m" -> kN*m; a ratio ("1") stays as it is (name "").
struct PeopleUnit {
  std::string name;
  double factor = 1;
};
PeopleUnit people_unit(const std::string& si_unit);
/// The same in the project's units: a project whose `units.force` is kip or
/// lbf reads ksi (psi), in, kip (lbf) and kip*ft or kip*in (after
/// `units.length`: ft, else in); every other project the metric units above.
PeopleUnit people_unit(const std::string& si_unit, const Project& project);

/// checks.csv: one row per member: governing utilisation, the checked value
/// and its limit in the unit named beside them, check, clause, combination and
/// station, plus pass/fail.
std::string checks_csv(const Analysis& analysis);

/// takeoff.csv: one row per member: section, material, centreline length
/// (the CAD edge: not yet a cut length), mass per metre and mass.
std::string takeoff_csv(const Analysis& analysis);

/// takeoff_by_section.csv: per section the member count, total centreline
/// length and mass, then the overall total.
std::string takeoff_by_section_csv(const Analysis& analysis);

/// reactions.csv: the support reactions (foundation loads) of every case and
/// combination, per supported node, global axes.
std::string reactions_csv(const Analysis& analysis);

/// end_forces.csv: per member end, the envelope (largest and smallest value
/// over the combinations, or over the cases when there are none) of N, Vy,
/// Vz, T, My, Mz with the governing combination: connection design forces.
std::string end_forces_csv(const Analysis& analysis);

/// cutlist.csv (shop_tables.cpp): one row per piece mark (shop_data.hpp): section, material,
/// centreline length (the longest of the mark; connection allowances are the detailer's), count, mass
/// per metre, each and in all, recommended precamber, and the members; sorted by section and length,
/// then the total.
std::string cutlist_csv(const Analysis& analysis);

/// connections.csv (shop_tables.cpp): per node where member ends meet, one row per member end with
/// the largest and smallest of N, Vy, Vz, T, My, Mz over the combinations (over the cases when there
/// are none) and the combination that gives each: the forces each connection is designed for.
std::string connections_csv(const Analysis& analysis);

}  // namespace stepframe
