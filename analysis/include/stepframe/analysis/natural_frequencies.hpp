#pragma once
// Natural frequencies and mode shapes of a frame: the lowest eigenpairs of
//   K phi = omega^2 M phi
// with K the elastic stiffness and M the consistent mass (mass_matrix.hpp),
// both on the free DOFs; f = omega / (2 pi). Every element is divided into
// `parts` equal elements first, since one cubic element per span is too
// stiff for vibration (a simply supported beam as one element gives its first
// frequency 11% high; four parts bring it within 0.1%: the consistent-mass
// element's error falls as the fourth power of its length, common practice).
// The eigenproblem is solved by Lanczos iteration in shift-invert mode
// (Spectra's SymGEigsShiftSolver, shift 0: (K^-1 M) phi = phi / omega^2, K
// factorised by CHOLMOD), or for small systems densely (K = L L^T,
// L^-1 M L^-T symmetric: exact to round-off, and M may be singular there).
//
// Participation (e.g. Chopra, Dynamics of Structures, 4th ed. 2012,
// sec. 13.2.5): with r_d the unit translation of every free node along
// global axis d, the effective modal mass of mode i is
//   M_eff,i,d = (phi_i^T M r_d)^2 / (phi_i^T M phi_i),
// and over all modes they sum to r_d^T M r_d, the mass that moves along d
// (mass sitting on supports held in d does not).

#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/mass_matrix.hpp"
#include "stepframe/analysis/results.hpp"

#include <array>
#include <cstddef>
#include <functional>
#include <vector>

namespace stepframe::analysis {

struct ModalOptions {
  std::size_t modes = 6;         ///< how many of the lowest modes
  std::size_t parts = 4;         ///< equal parts every element is divided into
  std::size_t dense_limit = 300; ///< free DOFs up to which the dense solver is used (0: always Lanczos)
  double tolerance = 1e-10;      ///< Lanczos convergence (relative, on 1 / omega^2)
};

struct VibrationMode {
  double omega = 0;       ///< circular frequency [rad/s]
  double frequency = 0;   ///< [Hz]
  std::array<double, 3> effective_mass{};  ///< along global X, Y, Z [kg]
  std::array<double, 3> mass_ratio{};      ///< effective_mass / ModalResult::moving_mass
  /// The shape, scaled so that its largest translation is 1, in the form of
  /// buckling modes (displacements at the model's nodes, inner_points at the
  /// points the analysis divided each element at), so mode_translation applies;
  /// `alpha` is unused (0).
  BucklingMode shape;
};

struct ModalResult {
  std::vector<VibrationMode> modes;     ///< lowest first
  std::array<double, 3> moving_mass{};  ///< r_d^T M r_d along X, Y, Z [kg]
  double total_mass = 0;                ///< all the mass of the model, supports included [kg]
  std::size_t parts = 0;                ///< parts every element was divided into
};

/// The lowest natural frequencies of the model with its members' own mass
/// and `added`. Throws UnstableFrame for a mechanism (as solve),
/// std::invalid_argument when there is no mass at a free DOF at all.
ModalResult natural_frequencies(const FrameModel& model, const AddedMass& added = {}, const ModalOptions& options = {},
                                const std::function<void(double)>& progress = {});

}  // namespace stepframe::analysis
