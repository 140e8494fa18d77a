#pragma once
// The lifting check of a fabrication-stage piece: the member hangs from two
// slings at given fractions of its length, web vertical, under its self
// weight times a dynamic factor; it is a beam on two supports with overhangs
// bending about its strong axis (common practice for handling checks).

#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/en1993.hpp"
#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/section.hpp"

#include <array>
#include <vector>

namespace stepframe::analysis {

struct LiftingInput {
  std::size_t member = 0;
  const Section* section = nullptr;
  Material material;                   ///< fy for the section's thickest plate
  double length = 0;                   ///< [m]
  std::array<double, 2> points{0.2, 0.8};  ///< lifting points as fractions of the length, 0 <= a < b <= 1
  double dynamic_factor = 1.0;         ///< on the self weight (impact of lifting)
};

/// The largest sagging and hogging moments [N m] (both >= 0) of a member of length L under a uniform
/// load w [N/m] hanging from supports at a and b [m]: statics of a beam with overhangs (reactions from
/// the equilibrium of forces and moments; M(x) = -w x^2 / 2 + R_a <x - a> + R_b <x - b>).
std::array<double, 2> lifting_moments(double L, double w, double a, double b);

/// Two results for the member, combination "lifting": "lifting stress" (largest |M| / Wel,y <= fy /
/// gamma_M0, EN 1993-1-1 6.2.5 with the elastic modulus) and, for I sections and channels, "lifting
/// lateral-torsional buckling" between the slings (EN 1993-1-1 6.3.2.2 with Mcr of the moment diagram
/// between them, fork supports at the slings, load at the shear centre; M_Ed the largest |M| there
/// against M_b,Rd = chi_LT Wel,y fy / gamma_M1). The overhangs' own buckling is not checked.
std::vector<CheckResult> check_lifting(const LiftingInput& input, const en1993::PartialFactors& factors);

}  // namespace stepframe::analysis
