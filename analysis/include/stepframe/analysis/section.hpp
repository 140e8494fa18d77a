#pragma once
// Cross-section properties used by the frame element, the stress recovery, the
// code checks and the 3D view.
//
// Section axes: the origin is the centroid; y and z are the principal axes,
// y the major one wherever the shape has a strong axis; the section's depth
// runs along z and its width along y (EN 1993-1-1 1.7 axis convention). For an
// angle, y and z are the principal axes u and v, turned by `principal_angle`
// from the leg axes. Every length is in metres.
//
// The shapes that compute a Section from dimensions are in section_shapes.hpp;
// the polygon integration behind them is in section_geometry.hpp.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::analysis {

/// A point in the section plane, section axes [m].
struct SectionPoint {
  double y = 0;
  double z = 0;
};

/// A closed polygon in the section plane (the last point joins the first).
using SectionRing = std::vector<SectionPoint>;

/// Which plate of a section a width-to-thickness ratio belongs to, in the
/// terms of EN 1993-1-1 Table 5.2.
enum class PartKind {
  internal,   ///< internal compression part (web, RHS wall), sheet 1
  outstand,   ///< outstand flange or stem, sheet 2
  angle_leg,  ///< leg of an angle, sheet 3 (c is the leg length h or b)
  tube,       ///< circular hollow section, sheet 3 (c is the outside diameter d)
};

/// One plate of a section with the ratio a classification needs.
struct SectionPart {
  std::string name{};                  ///< "web", "top flange", "leg b", ...
  PartKind kind = PartKind::internal;  ///< which sheet of EN 1993-1-1 Table 5.2 applies
  double c = 0;                        ///< flat width (or d for tubes) [m]
  double t = 0;                        ///< thickness [m]
  double ratio() const { return c / t; }  ///< c/t (d/t for tubes)
};

/// What a section's geometry is; decides which checks and formulas apply.
enum class SectionShape { custom, rolled_i, welded_i, channel, angle, tee, rhs, chs, flat, round_bar };

/// Lower-case name of a shape ("rolled_i", "chs", ...), for output.
std::string_view shape_name(SectionShape shape);

struct Section {
  std::string designation;  ///< e.g. "IPE300", or the project's own name
  double A = 0;             ///< area [m^2]
  double Iy = 0;            ///< second moment about y (strong axis) [m^4]
  double Iz = 0;            ///< second moment about z (weak axis) [m^4]
  double J = 0;             ///< St Venant torsion constant [m^4]
  double depth = 0;         ///< extent along local z [m]
  double width = 0;         ///< extent along local y [m]

  // Everything below is filled by the shape functions (section_shapes.hpp);
  // a section given by its properties alone leaves it at zero / empty.
  SectionShape shape = SectionShape::custom;
  std::string family{};    ///< catalogue series, e.g. "IPE", "HEB", "W", "SHS"
  std::string standard{};  ///< the standard the shape and its dimensions follow
  double Iw = 0;           ///< warping constant [m^6] (0 for closed and solid shapes)
  double Wel_y = 0;        ///< elastic modulus about y: Iy / max|z| of the outline [m^3]
  double Wel_z = 0;        ///< elastic modulus about z: Iz / max|y| of the outline [m^3]
  double Wpl_y = 0;        ///< plastic modulus about y [m^3]
  double Wpl_z = 0;        ///< plastic modulus about z [m^3]
  double Avy = 0;          ///< shear area for a shear force along y [m^2] (EN 1993-1-1 6.2.6(3))
  double Avz = 0;          ///< shear area for a shear force along z [m^2]
  double principal_angle = 0;  ///< angle from the shape's leg/flange axes to y, anticlockwise [rad]
  double shear_centre_y = 0;   ///< shear centre relative to the centroid, along y [m]
  double shear_centre_z = 0;   ///< shear centre relative to the centroid, along z [m]
  double t_max = 0;            ///< thickest plate: decides fy (EN 10025-2 Table 7) [m]
  /// Torsion modulus T / tau_max [m^3] when a section given by its properties
  /// states it; 0 otherwise (shapes compute tau from their own geometry).
  double Wt = 0;
  std::vector<SectionPart> parts{};          ///< plates with their c/t ratios
  std::vector<SectionPoint> stress_points{};  ///< corners of the convex hull: where |sigma| peaks
  /// Outline for drawing: the first ring is the outer boundary (anticlockwise
  /// in y-z), further rings are holes (clockwise).
  std::vector<SectionRing> outline{};

  /// Elastic section modulus about y [m^3]: Wel_y, or Iy / (depth / 2) when
  /// only properties were given.
  double Wy() const { return Wel_y > 0 ? Wel_y : Iy / (0.5 * depth); }
  /// Elastic section modulus about z [m^3]: Wel_z, or Iz / (width / 2).
  double Wz() const { return Wel_z > 0 ? Wel_z : Iz / (0.5 * width); }
  /// Radius of gyration about y, sqrt(Iy / A) [m].
  double iy() const;
  /// Radius of gyration about z, sqrt(Iz / A) [m].
  double iz() const;
  /// Mass per metre length for a material density [kg/m].
  double mass_per_metre(double density) const { return A * density; }
};

/// Canonical spelling of a designation: upper case; spaces, hyphens,
/// underscores and non-decimal dots removed; "x" between numbers written "X";
/// a European wide-flange series letter written after the size moved before
/// it ("ipe-300" -> "IPE300", "HE 200 B" -> "HEB200", "HE200B" -> "HEB200",
/// "W12x26" -> "W12X26").
std::string normalize_designation(std::string_view designation);

/// The section a designation names: a row of the built-in catalogue
/// (data/sections/*.csv, compiled in), or a shape whose dimensions are
/// written in the designation ("SHS 100x100x5", "CHS 219.1x8", "PL20x300",
/// "L100x100x10", "HSS6x6x3/8"). Accepts the spellings people type (see
/// normalize_designation; metric W shapes such as "W310x38.7"). Nothing when
/// the designation names no section.
std::optional<Section> find_catalogue_section(std::string_view designation);

/// One catalogue row, for listings.
struct CatalogueEntry {
  std::string designation;  ///< canonical spelling
  std::string family;       ///< "IPE", "HEA", "W", "CHS", ...
  std::string standard;     ///< the standard named in the CSV header
  std::string alias;        ///< another accepted spelling (metric W shapes), or empty
};

/// Every catalogue row, in catalogue order.
const std::vector<CatalogueEntry>& catalogue_entries();

/// Every designation in the built-in catalogue, canonical spelling.
std::vector<std::string> catalogue_designations();

/// Catalogue rows matching a query: the normalized query is a prefix of the
/// designation, its family or its alias, or a substring of the designation
/// ("IPE" lists every IPE, "HEB2" HEB200..HEB280, "W12" the W12 shapes).
std::vector<CatalogueEntry> search_catalogue(std::string_view query);

/// Up to `n` catalogue designations nearest to an unknown one, for "did you
/// mean" messages: same family first, then by edit distance of the
/// normalized spelling and by nominal size.
std::vector<std::string> nearest_designations(std::string_view designation, std::size_t n = 3);

/// What every listing of built-in section properties says with them: they are
/// computed from the standards' nominal dimensions, not taken from their tables
/// (README, "How close section properties are to published tables").
inline constexpr std::string_view catalogue_caution =
    "Section properties are computed from nominal dimensions and must be checked against the current edition of "
    "the standard.";

}  // namespace stepframe::analysis
