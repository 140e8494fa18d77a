#pragma once
// Warping of open thin-walled sections from their mid-thickness line: the
// sectorial coordinate integrated along the walls (Vlasov's thin-walled beam
// theory, e.g. Timoshenko & Gere, Theory of Elastic Stability, ch. 5), for
// walls whose thickness varies linearly along their length (tapered flanges).

#include "stepframe/analysis/section.hpp"

#include <vector>

namespace stepframe::analysis {

/// One straight wall of an open section: its mid-thickness line from `from`
/// to `to` [m] and the wall thickness at both ends [m], linear in between.
struct ThinWall {
  SectionPoint from{};
  SectionPoint to{};
  double t_from = 0;
  double t_to = 0;
};

/// Warping constant and shear centre of an open thin-walled section.
struct ThinWalledWarping {
  double Iw = 0;               ///< warping constant about the shear centre [m^6]
  SectionPoint shear_centre{};  ///< in the coordinates of the walls [m]
};

/// The walls must form one unbranched path, each starting where the previous
/// one ends (a channel: flange, web, flange). Secondary warping across the wall
/// thickness is neglected (thin-walled theory). Throws std::invalid_argument
/// when the path is empty, broken or has no positive thickness.
ThinWalledWarping thin_walled_warping(const std::vector<ThinWall>& path);

}  // namespace stepframe::analysis
