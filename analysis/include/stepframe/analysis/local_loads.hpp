#pragma once
// A load on one element in its local axes (what element_loads.hpp works with).

#include <Eigen/Core>

#include <vector>

namespace stepframe::analysis {

/// One load on an element, local axes: a distributed load varying linearly
/// from q_a at distance a to q_b at distance b [N/m], or a point force q_a [N]
/// at distance a (then b is ignored). 0 <= a <= b <= L.
struct LocalLoad {
  bool point = false;
  double a = 0;
  double b = 0;
  Eigen::Vector3d q_a = Eigen::Vector3d::Zero();
  Eigen::Vector3d q_b = Eigen::Vector3d::Zero();
};
using LocalLoads = std::vector<LocalLoad>;

}  // namespace stepframe::analysis
