#pragma once
// Section shapes: dimensions in, a complete Section out (section.hpp).
//
// Every function computes A, Iy, Iz, J, Iw, Wel, Wpl, shear areas, the shear
// centre, the outline, stress points and the plate c/t ratios from the
// dimensions alone; the sources of the formulas are named in the
// implementation. Area, second moments and plastic moduli of shapes with
// radii come from the exact outline (arcs as 32 chords per quarter circle,
// which changes them by less than 1e-5 relative). All lengths in metres.
// Impossible dimensions throw std::invalid_argument naming the designation.

#include "stepframe/analysis/section.hpp"

#include <string>

namespace stepframe::analysis {

/// Rolled I or H section, parallel flanges (EN 10365 notation).
struct RolledIDimensions {
  double h = 0, b = 0, tw = 0, tf = 0, r = 0;  ///< depth, flange width, web, flange, root radius
};
Section rolled_i_section(std::string designation, const RolledIDimensions& d);

/// Welded I section (plate girder), flanges may differ; fillet welds ignored.
struct WeldedIDimensions {
  double h = 0, tw = 0;              ///< overall depth, web thickness
  double b_top = 0, tf_top = 0;      ///< top flange (towards +z)
  double b_bottom = 0, tf_bottom = 0;
};
Section welded_i_section(std::string designation, const WeldedIDimensions& d);

/// Channel: web on the -y side, flanges towards +y. `flange_slope` is the
/// inner-face slope of a tapered flange (0.08 for UPN up to 300 mm, 0.05 above,
/// 1/6 for ASTM C shapes), 0 for parallel flanges (UPE). The flange thickness
/// tf of a tapered flange is measured at `tf_at` from the back of the web: b/2
/// for UPN up to 300 mm, (b + tw)/2 (half-way along the outstand) for larger UPN
/// (DIN 1026-1 drawings, from memory) and for ASTM C shapes (the AISC Manual's
/// average flange thickness, from memory); ignored for parallel flanges.
struct ChannelDimensions {
  double h = 0, b = 0, tw = 0, tf = 0, r = 0;  ///< depth, flange width, web, flange, root radius
  double r_toe = 0;                            ///< radius at the flange toe (inner side)
  double flange_slope = 0;
  double tf_at = 0;  ///< where tf is measured, from the back of the web (tapered flanges)
};
Section channel_section(std::string designation, const ChannelDimensions& d);

/// Angle: leg h along z, leg b along y (h >= b), thickness t, root radius r,
/// toe radius r_toe (EN 10056-1 notation r1, r2). Section axes are the
/// principal axes; principal_angle turns the leg axes onto them.
struct AngleDimensions {
  double h = 0, b = 0, t = 0, r = 0, r_toe = 0;
};
Section angle_section(std::string designation, const AngleDimensions& d);

/// Tee: flange (width b, thickness tf) on top (+z), stem thickness tw, overall
/// depth h, root radius r.
struct TeeDimensions {
  double h = 0, b = 0, tw = 0, tf = 0, r = 0;
};
Section tee_section(std::string designation, const TeeDimensions& d);

/// How a hollow section was formed: decides the corner radii.
enum class HollowForming {
  hot_finished,  ///< EN 10210-2: outer radius 1.5 t, inner 1.0 t
  cold_formed,   ///< EN 10219-2: outer radius 2 t (t <= 6 mm), 2.5 t (t <= 10 mm), 3 t; inner = outer - t
};

/// Rectangular or square hollow section: depth h along z, width b along y,
/// wall t, corner radii outside and inside.
struct RhsDimensions {
  double h = 0, b = 0, t = 0, r_out = 0, r_in = 0;
};
/// Corner radii the standards use for calculating properties.
RhsDimensions rhs_dimensions(double h, double b, double t, HollowForming forming);
Section rhs_section(std::string designation, const RhsDimensions& d);

/// Circular hollow section: outside diameter d, wall t.
struct ChsDimensions {
  double d = 0, t = 0;
};
Section chs_section(std::string designation, const ChsDimensions& d);

/// Flat bar or plate: thickness t along y, width b along z (so y is the strong axis).
struct FlatDimensions {
  double t = 0, b = 0;
};
Section flat_section(std::string designation, const FlatDimensions& d);

/// Solid round bar of diameter d.
Section round_bar_section(std::string designation, double d);

/// A section known only by its properties (project file `sections:`): the
/// outline is the depth x width rectangle, used for drawing and stress points.
Section custom_section(std::string designation, double A, double Iy, double Iz, double J, double depth, double width);

}  // namespace stepframe::analysis
