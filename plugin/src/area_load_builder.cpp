#include "area_load_builder.hpp"

#include "stepframe/errors.hpp"

#include <stdexcept>

namespace stepframe::detail {

analysis::AreaLoadResult build_area_load(const analysis::FrameModel& model, const AreaLoadSpec& spec,
                                         std::vector<std::size_t> elements, double tolerance) {
  analysis::AreaLoadInput in;
  in.pressure = spec.pressure;
  in.elements = std::move(elements);
  in.openings = spec.openings;
  in.two_way = spec.two_way;
  in.beams_along = spec.beams_along;
  in.tolerance = tolerance;
  if (!spec.polygon.empty()) {
    // The polygon's plane: its centroid and Newell's normal (exact for a planar polygon, common practice).
    Eigen::Vector3d normal = Eigen::Vector3d::Zero(), centre = Eigen::Vector3d::Zero();
    for (std::size_t i = 0; i < spec.polygon.size(); ++i) {
      const Eigen::Vector3d& a = spec.polygon[i];
      const Eigen::Vector3d& b = spec.polygon[(i + 1) % spec.polygon.size()];
      normal += Eigen::Vector3d((a.y() - b.y()) * (a.z() + b.z()), (a.z() - b.z()) * (a.x() + b.x()),
                                (a.x() - b.x()) * (a.y() + b.y()));
      centre += a / static_cast<double>(spec.polygon.size());
    }
    if (normal.norm() < 1e-12)
      throw InputError(spec.origin.describe() + ": the polygon has no area (its points lie on a line)");
    for (const auto& p : spec.polygon)
      if (std::abs((p - centre).dot(normal.normalized())) > tolerance)
        throw InputError(spec.origin.describe() + ": the polygon's points do not lie in one plane");
    in.origin = centre;
    in.normal = normal.normalized();
    in.region = spec.polygon;
  } else {
    const int axis = spec.plane_x ? 0 : spec.plane_y ? 1 : 2;
    in.normal = Eigen::Vector3d::Unit(axis);
    in.origin = Eigen::Vector3d::Zero();
    in.origin(axis) = spec.plane_x ? *spec.plane_x : spec.plane_y ? *spec.plane_y : *spec.plane_z;
  }
  // The normal points upwards (or along +X, +Y for a vertical plane); a positive pressure pushes against it.
  const Eigen::Vector3d& n = in.normal;
  const bool flip = n.z() < -1e-12 || (std::abs(n.z()) <= 1e-12 && (n.x() < -1e-12 || (std::abs(n.x()) <= 1e-12 && n.y() < 0)));
  if (flip) in.normal = -in.normal;
  in.direction = spec.normal ? Eigen::Vector3d(-in.normal) : Eigen::Vector3d(-Eigen::Vector3d::UnitZ());
  try {
    return analysis::distribute_area_load(model, in);
  } catch (const std::invalid_argument& e) {
    throw InputError(spec.origin.describe() + ": " + e.what() +
                     "; check the plane or polygon and that the members bounding each panel lie in it");
  }
}

}  // namespace stepframe::detail
