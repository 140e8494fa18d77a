#include "stepframe/analysis/frame_element.hpp"

namespace stepframe::analysis {

double shear_area_y(const Section& section) { return section.Avy > 0 ? section.Avy : 5.0 / 6.0 * section.A; }
double shear_area_z(const Section& section) { return section.Avz > 0 ? section.Avz : 5.0 / 6.0 * section.A; }

ElementProperties element_properties(const Section& section, const Material& material, double length,
                                     bool shear_deformation) {
  ElementProperties p;
  p.length = length;
  p.E = material.E;
  p.G = material.G;
  p.A = section.A;
  p.Iy = section.Iy;
  p.Iz = section.Iz;
  p.J = section.J;
  if (shear_deformation) {
    p.Asy = shear_area_y(section);
    p.Asz = shear_area_z(section);
  }
  return p;
}

Matrix12d local_stiffness(const ElementProperties& p) {
  // Standard 3D frame stiffness, Przemieniecki, Theory of Matrix Structural
  // Analysis (1968), eq. 5.115, with shear-deformation parameters
  // phi = 12 E I / (G As L^2) (zero for Euler-Bernoulli).
  const double L = p.length, L2 = L * L, L3 = L2 * L;
  Matrix12d k = Matrix12d::Zero();

  // Axial: EA/L (bar element).
  const double ea = p.E * p.A / L;
  k(0, 0) = k(6, 6) = ea;
  k(0, 6) = -ea;

  // Torsion: GJ/L (uniform St Venant torsion).
  const double gj = p.G * p.J / L;
  k(3, 3) = k(9, 9) = gj;
  k(3, 9) = -gj;

  // Bending in x-y (DOFs v1=1, rz1=5, v2=7, rz2=11), Iz, rz = dv/dx.
  const double phi_y = p.Asy > 0 ? 12 * p.E * p.Iz / (p.G * p.Asy * L2) : 0.0;
  const double ez = p.E * p.Iz / (1 + phi_y);
  k(1, 1) = k(7, 7) = 12 * ez / L3;
  k(1, 7) = -12 * ez / L3;
  k(1, 5) = k(1, 11) = 6 * ez / L2;
  k(5, 7) = k(7, 11) = -6 * ez / L2;
  k(5, 5) = k(11, 11) = (4 + phi_y) * ez / L;
  k(5, 11) = (2 - phi_y) * ez / L;

  // Bending in x-z (DOFs w1=2, ry1=4, w2=8, ry2=10), Iy, ry = -dw/dx: the
  // translation-rotation couplings change sign with respect to the x-y plane.
  const double phi_z = p.Asz > 0 ? 12 * p.E * p.Iy / (p.G * p.Asz * L2) : 0.0;
  const double ey = p.E * p.Iy / (1 + phi_z);
  k(2, 2) = k(8, 8) = 12 * ey / L3;
  k(2, 8) = -12 * ey / L3;
  k(2, 4) = k(2, 10) = -6 * ey / L2;
  k(4, 8) = k(8, 10) = 6 * ey / L2;
  k(4, 4) = k(10, 10) = (4 + phi_z) * ey / L;
  k(4, 10) = (2 - phi_z) * ey / L;

  // Mirror the upper triangle.
  for (int i = 0; i < 12; ++i)
    for (int j = 0; j < i; ++j) k(i, j) = k(j, i);
  return k;
}

Vector12d equivalent_nodal_loads(double length, const Eigen::Vector3d& q) {
  // Fixed-end actions of a uniformly loaded beam (w L/2 and w L^2/12; standard
  // beam theory, common practice), taken with the opposite sign as nodal loads.
  // The moment signs follow from integrating q times the Hermite shape
  // functions: +qy L^2/12 about z at the start for rz = dv/dx, and the mirror
  // image -qz L^2/12 about y for ry = -dw/dx.
  const double L = length, half = 0.5 * L, twelfth = L * L / 12.0;
  Vector12d f = Vector12d::Zero();
  f(0) = q.x() * half;
  f(6) = q.x() * half;
  f(1) = q.y() * half;
  f(7) = q.y() * half;
  f(5) = q.y() * twelfth;
  f(11) = -q.y() * twelfth;
  f(2) = q.z() * half;
  f(8) = q.z() * half;
  f(4) = -q.z() * twelfth;
  f(10) = q.z() * twelfth;
  return f;
}

Matrix12d transformation(const Eigen::Matrix3d& axes) {
  // Block-diagonal rotation of the four 3-vectors of a 12-DOF element (common practice).
  Matrix12d t = Matrix12d::Zero();
  for (int b = 0; b < 4; ++b) t.block<3, 3>(3 * b, 3 * b) = axes;
  return t;
}

Matrix12d to_global(const Eigen::Matrix3d& axes, const Matrix12d& local) {
  Matrix12d out;
  for (int i = 0; i < 4; ++i)
    for (int j = 0; j < 4; ++j)
      out.block<3, 3>(3 * i, 3 * j).noalias() = axes.transpose() * (local.block<3, 3>(3 * i, 3 * j) * axes);
  return out;
}

Vector12d to_global(const Eigen::Matrix3d& axes, const Vector12d& local) {
  Vector12d out;
  for (int i = 0; i < 4; ++i) out.segment<3>(3 * i).noalias() = axes.transpose() * local.segment<3>(3 * i);
  return out;
}

Vector12d to_local(const Eigen::Matrix3d& axes, const Vector12d& global) {
  Vector12d out;
  for (int i = 0; i < 4; ++i) out.segment<3>(3 * i).noalias() = axes * global.segment<3>(3 * i);
  return out;
}

Vector12d member_end_forces(const ElementProperties& p, const Vector12d& u_local,
                            const Eigen::Vector3d& q_local) {
  // Superposition of the deformation forces and the fixed-end reactions (common practice).
  return local_stiffness(p) * u_local - equivalent_nodal_loads(p.length, q_local);
}

}  // namespace stepframe::analysis
