#pragma once
// Area loads: a pressure on the panels a plane's members bound, turned into
// member loads.
//
// Panels are the bounded faces of the members lying in the plane (the
// elements as edges of a planar graph, each face traced by turning to the
// next edge clockwise at every node). A panel's load goes to its sides:
//  - two-way, rectangular panel without openings: the 45-degree split, each
//    side carrying p times the width of its trapezoid or triangle at every
//    point, min(s, L - s, b / 2) for a side of length L at distance s from
//    its corner and b the shorter side (the classic yield-line tributary
//    areas, common practice);
//  - one-way, rectangular panel without openings: the two sides along
//    `beams_along` carry p b / 2 each, b the distance between them (common
//    practice);
//  - any other panel (other shapes, or openings): the general tributary
//    split, every part of the panel going to its nearest side (two-way) or
//    the nearest side along `beams_along` (one-way) - for a rectangle that
//    is the same 45-degree split - integrated on a fine grid of points and
//    applied per side as piecewise-uniform loads;
// and in every case the loads are scaled so that their total is exactly
// p times the loaded area (panel less openings).

#include "stepframe/analysis/frame_model.hpp"

#include <Eigen/Core>

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace stepframe::analysis {

struct AreaLoadInput {
  double pressure = 0;  ///< [Pa]
  /// The plane: a point on it and its unit normal.
  Eigen::Vector3d origin = Eigen::Vector3d::Zero();
  Eigen::Vector3d normal = Eigen::Vector3d::UnitZ();
  /// Elements that may bound panels (they must lie in the plane, within `tolerance`).
  std::vector<std::size_t> elements;
  /// Only panels whose centroid lies inside this outline are loaded (empty: every panel).
  std::vector<Eigen::Vector3d> region;
  std::vector<std::vector<Eigen::Vector3d>> openings;  ///< outlines left unloaded
  /// Direction of the load, unit, global (e.g. -Z); positive pressure acts along it.
  Eigen::Vector3d direction = -Eigen::Vector3d::UnitZ();
  bool two_way = true;
  Eigen::Vector3d beams_along = Eigen::Vector3d::UnitX();  ///< one-way: the sides along this take the load
  double tolerance = 1e-3;  ///< [m]
};

/// One generated member load (global axes, intensity per member length).
struct PanelMemberLoad {
  std::size_t panel = 0;
  ElementLoad load;  ///< axes global; a and b along the element
};

struct Panel {
  std::vector<Eigen::Vector3d> outline;  ///< corners in order
  double area = 0;                       ///< loaded area: the panel's less its openings [m^2]
  std::string method;                    ///< "two-way 45-degree", "one-way", "tributary (nearest side)"
};

struct AreaLoadResult {
  std::vector<Panel> panels;
  std::vector<PanelMemberLoad> loads;
  double area = 0;         ///< loaded area in all [m^2]
  double total_force = 0;  ///< pressure x area [N]
};

/// The panels and member loads of one area load. Throws std::invalid_argument
/// (naming what is wrong) when no panel is found or one-way loading finds no
/// side along beams_along.
AreaLoadResult distribute_area_load(const FrameModel& model, const AreaLoadInput& input);

}  // namespace stepframe::analysis
