#pragma once
// The 12-DOF frame element in its local axes: Euler-Bernoulli, or Timoshenko
// when the properties carry shear areas.
//
// Local DOF order: [u1 v1 w1 rx1 ry1 rz1  u2 v2 w2 rx2 ry2 rz2], node 1 = start.
// u, v, w are translations along local x, y, z; rx, ry, rz rotations about them
// (right-hand rule). Bending in the x-y plane uses Iz with rz = dv/dx; bending
// in the x-z plane uses Iy with ry = -dw/dx (for Timoshenko elements rz and
// -ry are the rotations of the cross-section, the slopes then add the shear strain).

#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"

#include <Eigen/Core>

namespace stepframe::analysis {

using Matrix12d = Eigen::Matrix<double, 12, 12>;
using Vector12d = Eigen::Matrix<double, 12, 1>;

/// What the element stiffness depends on, SI units.
struct ElementProperties {
  double length = 0;  ///< [m]
  double E = 0;       ///< Young's modulus [Pa]
  double G = 0;       ///< shear modulus [Pa]
  double A = 0;       ///< area [m^2]
  double Iy = 0;      ///< second moment about local y [m^4]
  double Iz = 0;      ///< second moment about local z [m^4]
  double J = 0;       ///< St Venant torsion constant [m^4]
  double Asy = 0;     ///< shear area for shear along local y [m^2]; 0 = no shear deformation
  double Asz = 0;     ///< shear area for shear along local z [m^2]; 0 = no shear deformation
};

/// Shear area a section offers for Timoshenko bending: the section's Avy/Avz
/// when known, else 5/6 A (the solid rectangle's shear coefficient,
/// Timoshenko & Gere / Cowper 1966; a screening fallback for sections given
/// by properties alone).
double shear_area_y(const Section& section);
double shear_area_z(const Section& section);

/// Gathers the element properties of a member of the given section, material
/// and length; with shear_deformation the shear areas are filled in.
ElementProperties element_properties(const Section& section, const Material& material, double length,
                                     bool shear_deformation = false);

/// Element stiffness in local axes: local end forces = k * local end
/// displacements. With shear areas: Timoshenko bending, phi = 12 E I / (G As L^2).
Matrix12d local_stiffness(const ElementProperties& p);

/// Nodal loads equivalent (work-consistent) to a uniform load q over the whole
/// member, q in local axes [N/m]. They equal minus the fixed-end reactions:
/// qx L/2 axially, q L/2 transversely and end moments +-q L^2/12 in each plane.
Vector12d equivalent_nodal_loads(double length, const Eigen::Vector3d& q_local);

/// T = blockdiag(R, R, R, R) for the rotation R whose rows are the local unit
/// vectors (see local_axes), so that local vectors = T * global vectors.
Matrix12d transformation(const Eigen::Matrix3d& axes);

/// T^T k T (congruent transformation of a local element matrix to global
/// axes) with T = transformation(axes), worked out block by block: T is
/// block-diagonal, so the 3 x 3 block IJ is R^T k_IJ R (a quarter of the
/// multiplications of the dense triple product; equal to it up to rounding).
Matrix12d to_global(const Eigen::Matrix3d& axes, const Matrix12d& local);
/// T^T v: a local 12-vector in global axes, R^T on each 3-vector.
Vector12d to_global(const Eigen::Matrix3d& axes, const Vector12d& local);
/// T u: a global 12-vector in local axes, R on each 3-vector.
Vector12d to_local(const Eigen::Matrix3d& axes, const Vector12d& global);

/// Forces and moments the two nodes exert on the member, local axes:
/// f = k u_local - equivalent_nodal_loads(q_local).
Vector12d member_end_forces(const ElementProperties& p, const Vector12d& u_local,
                            const Eigen::Vector3d& q_local);

}  // namespace stepframe::analysis
