#pragma once
// The sections of report.html, one file each (report.cpp assembles the page):
// pictures (report_pictures.cpp), the browser view (report_view.cpp),
// calculation sheets (report_sheets.cpp), inputs (report_inputs.cpp).
// Internal to the plugin stage.

#include "stepframe/run.hpp"

#include <cstdint>
#include <string>
#include <vector>

namespace stepframe::report {

/// Text safe in HTML.
std::string esc(const std::string& text);

/// A number for people: `digits` significant digits, no exponent for ordinary magnitudes.
std::string num(double value, int digits = 4);

/// A check's value or limit in the unit people read ("Pa" -> MPa, "N" -> kN, "m" -> mm, "N*m" -> kN*m).
std::string with_unit(double value, const std::string& si_unit);

/// The same in the project's units when it works in US customary force units
/// (units.force kip or lbf): forces in kip (lbf), moments in kip*ft or kip*in
/// after units.length, stresses in ksi (psi), lengths in inches; else as above.
std::string with_unit(double value, const std::string& si_unit, const Project& project);

/// A member's length along its elements [m].
double member_length(const analysis::FrameModel& model, const analysis::Member& member);

/// Members ordered by their governing utilisation, largest first (unchecked last).
std::vector<std::size_t> members_by_utilisation(const Analysis& analysis);

/// A member's label for people: its CAD name, else its STEP entity, else "member N".
std::string member_label(const Analysis& analysis, std::size_t member);

/// The members whose calculation sheets the report shows: every failing one
/// (at most 50), the five with the largest utilisation, and those the
/// project's outputs.calculation_sheets names, in that order.
std::vector<std::size_t> sheet_members(const Analysis& analysis);

/// The id of a member's calculation sheet in the page ("sheet-12").
std::string sheet_anchor(std::size_t member);

/// The horizontal legend of the utilisation scale (as in every picture and the view).
std::string utilisation_legend(const std::string& title, bool show_not_checked);

std::string pictures_section(const Analysis& analysis);
/// Appends the 3D view (report_view.cpp) to `out`: its data is most of a large frame's report.
void append_browser_view_section(const Analysis& analysis, std::string& out);
std::string sheets_section(const Analysis& analysis);
std::string reactions_section(const Analysis& analysis);
/// Piece marks with their counts and the recommended precamber (report_shop.cpp).
std::string shop_section(const Analysis& analysis);
std::string inputs_section(const Analysis& analysis);
std::string modes_section(const Analysis& analysis);
std::string area_loads_section(const Analysis& analysis);  ///< report_area_loads.cpp; empty without area loads  ///< natural frequencies (report_modes.cpp); empty without them

/// RFC 4648 base64.
std::string base64(const std::vector<std::uint8_t>& bytes);

}  // namespace stepframe::report
