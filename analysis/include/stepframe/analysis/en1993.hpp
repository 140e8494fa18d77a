#pragma once
// EN 1993-1-1 (2005) screening of steel members: cross-section class
// (5.5, Table 5.2), cross-section resistance (6.2), flexural buckling
// (6.3.1), torsional and torsional-flexural buckling (6.3.1.4),
// lateral-torsional buckling (6.3.2) and bending with axial
// compression (6.3.3 with Annex B, method 2).
//
// Forces follow results.hpp (N > 0 tension; My about the strong axis y).
// Every function is pure; units SI.

#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/analysis/section.hpp"

#include <array>
#include <functional>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::analysis::en1993 {

/// Partial factors; defaults are the recommended values of 6.1(1) NOTE 2B.
struct PartialFactors {
  double gamma_M0 = 1.0;
  double gamma_M1 = 1.0;
};

/// Buckling curves of Table 6.1.
enum class Curve { a0, a, b, c, d };
const char* curve_name(Curve curve);

/// Imperfection factor alpha of Table 6.1.
double imperfection_factor(Curve curve);

/// Reduction factor chi of 6.3.1.2 (6.49), also chi_LT of 6.3.2.2 (6.56):
/// Phi = 0.5 [1 + alpha (lambda - 0.2) + lambda^2], chi = 1 / (Phi + sqrt(Phi^2 - lambda^2)) <= 1.
double reduction_factor(double slenderness, Curve curve);

/// epsilon = sqrt(235 MPa / fy) (Table 5.2).
double epsilon(double fy);

/// Class of one plate (Table 5.2). For internal parts `alpha` is the
/// compressed fraction of c in the plastic stress state and `psi` the ratio
/// of end stresses in the elastic state (1 = uniform compression, -1 = pure
/// bending); outstands, angle legs and tubes are taken in uniform compression.
int part_class(const SectionPart& part, double fy, double alpha = 1.0, double psi = 1.0);

/// The class 1, 2 and 3 limits of c/t for one plate (Table 5.2); a limit of
/// 0 means the table gives none for that class.
std::array<double, 3> part_limits(const SectionPart& part, double fy, double alpha = 1.0, double psi = 1.0);

struct Classification {
  int section_class = 1;
  /// The plate that sets the class: its name in the section classified (valid while that section lives)
  /// or a fixed text; a view, as a class is worked out at every station of every member and result.
  std::string_view governing_part;
  double class3_utilisation = 0;    ///< that plate's c/t over its class 3 limit (> 1 means class 4)
};

/// Class of a section under axial force N (tension > 0) and bending My:
/// webs of I, channel and hollow sections get alpha and psi from N and My;
/// flanges and other parts are taken in compression (conservative when the
/// stress state of a part is not computed). Sections without parts (given by
/// properties) are taken as class 3 (elastic resistance).
Classification classify(const Section& section, double fy, double N, double My);

/// classify() for one section and yield strength at many stations: what does
/// not change with the forces (epsilon, and the class of every plate but the
/// webs, which are taken in compression whatever the forces) is worked out
/// once. Gives what classify() gives, to the bit. Keeps references to the
/// section, which must outlive it.
class SectionClassifier {
 public:
  SectionClassifier(const Section& section, double fy);
  Classification operator()(double N, double My) const;

 private:
  struct Plate {
    const SectionPart* part = nullptr;
    bool web = false;   ///< alpha and psi from the forces (classify)
    int section_class = 1;  ///< the class of any other plate
    double class3 = 0;      ///< and its c/t over its class 3 limit
  };
  const Section* section_;
  double fy_ = 0, eps_ = 0;
  std::vector<Plate> plates_;
};

/// Design plastic resistances of a cross-section, shear reductions (6.2.8) included [N, N m].
struct PlasticResistances {
  double N = 0;   ///< Npl,Rd
  double My = 0;  ///< Mpl,y,Rd
  double Mz = 0;  ///< Mpl,z,Rd
};

/// Bending and axial force on a class 1 or 2 rolled I or H section or a
/// rectangular hollow section (6.2.9.1): the reduced plastic moments (6.36)
/// to (6.40) and the biaxial criterion (6.41) with alpha, beta of 6.2.9.1(6).
/// Returns the utilisation as the linear sum (6.2) reads: the actions divided
/// by it just meet (6.41) (1 / the proportional load factor; above 1 fails),
/// or nothing for other shapes (the caller then uses the linear sum (6.2)).
std::optional<double> plastic_interaction(const Section& section, const PlasticResistances& resistances, double N,
                                          double My, double Mz);

/// Flexural buckling curves about y and z (Table 6.2).
struct FlexuralCurves {
  Curve y = Curve::c;
  Curve z = Curve::c;
};
FlexuralCurves flexural_curves(const Section& section, double fy);

/// Lateral-torsional buckling curve of 6.3.2.2 (Table 6.4).
Curve lateral_torsional_curve(const Section& section);

/// How chi_LT is worked out (6.3.2.1(2) lets the national annex choose).
enum class LateralTorsionalMethod {
  general,  ///< 6.3.2.2: Table 6.4 curves, lambda_LT,0 = 0.2, beta = 1 (every section)
  rolled,   ///< 6.3.2.3: rolled or equivalent welded I sections, Table 6.5 curves,
            ///< lambda_LT,0 and beta below; other sections fall back to 6.3.2.2
};
const char* method_name(LateralTorsionalMethod method);

/// The choice of lateral-torsional buckling method and its parameters.
struct LateralTorsionalOptions {
  LateralTorsionalMethod method = LateralTorsionalMethod::general;
  bool f_modification = false;  ///< 6.3.2.3(2) (6.58): chi_LT,mod = chi_LT / f (rolled method only)
  double lambda_0 = 0.4;        ///< lambda_LT,0 of 6.3.2.3(1), recommended value
  double beta = 0.75;           ///< beta of 6.3.2.3(1), recommended value
};

/// Lateral-torsional buckling curve of 6.3.2.3 (Table 6.5) for rolled and
/// welded I sections; nothing for other shapes (6.3.2.3 does not cover them).
std::optional<Curve> lateral_torsional_curve_rolled(const Section& section);

/// Reduction factor chi_LT of 6.3.2.3 (6.57):
/// Phi_LT = 0.5 [1 + alpha_LT (lambda_LT - lambda_LT,0) + beta lambda_LT^2],
/// chi_LT = 1 / (Phi_LT + sqrt(Phi_LT^2 - beta lambda_LT^2)) <= 1 and <= 1 / lambda_LT^2;
/// 1 for lambda_LT <= lambda_LT,0 (6.3.2.2(4)).
double reduction_factor_rolled(double slenderness, Curve curve, double lambda_0, double beta);

/// Correction factor kc of Table 6.6. A linear diagram (end moments psi Mh
/// and Mh) takes 1 / (1.33 - 0.33 psi); other diagrams take kc = 1 / sqrt(C1)
/// with C1 the ratio of the diagram's Mcr to that of uniform moment, both with
/// the load at the shear centre (the approximation ECCS TC8 gives beside
/// Table 6.6; from memory). Clamped to (0, 1].
double correction_factor_kc(bool linear, double psi, double C1);

/// f of 6.3.2.3(2) (6.58): f = 1 - 0.5 (1 - kc) [1 - 2 (lambda_LT - 0.8)^2] <= 1.
double modification_factor_f(double kc, double slenderness);

/// Elastic critical moment of a doubly symmetric I section, k = kw = 1 over
/// the unrestrained length L, with the load applied zg above the shear centre
/// (zg > 0 destabilising): the classic closed form (Timoshenko & Gere, Theory
/// of Elastic Stability, 2nd ed., 1961, ch. 6, for zg = 0) with the C1/C2
/// extension common in European practice (from memory):
/// Mcr = C1 pi^2 E Iz / L^2 [sqrt(Iw/Iz + L^2 G It / (pi^2 E Iz) + (C2 zg)^2) - C2 zg].
double critical_moment(double E, double G, double Iz, double Iw, double It, double L, double C1, double C2 = 0,
                       double zg = 0);

/// Section and material stiffnesses that resist lateral-torsional buckling.
struct LateralTorsionalStiffness {
  double E = 0, G = 0;           ///< [Pa]
  double Iz = 0, Iw = 0, It = 0;  ///< minor-axis second moment [m^4], warping constant [m^6], St Venant constant [m^4]
};

/// One point of a member's strong-axis moment diagram.
struct DiagramPoint {
  double x = 0;  ///< along the member [m]
  double M = 0;  ///< My [N m]
  double V = 0;  ///< Vz [N]; the drop of V between points is the transverse load on that interval
};

/// Elastic critical moment (largest |M| of the diagram at buckling) of a
/// doubly symmetric member with fork supports at its ends and no restraint
/// between them, under the moment diagram given by the points (any shape:
/// end moments, span loads, point loads), by the energy method with `terms`
/// sine terms each for lateral displacement and twist (Timoshenko & Gere,
/// Theory of Elastic Stability, 2nd ed., 1961, 6.3). The transverse loads act
/// `load_height` above the shear centre, towards it (destabilising; 0 = at the
/// shear centre). Infinite when the diagram has no moment. Ten terms (the
/// default; at most 32) agree with twenty-four within 0.01% for end moments,
/// a uniform load and a central point load, at the shear centre or on the
/// top flange of an IPE 300 over 6 m.
double critical_moment_for_diagram(const LateralTorsionalStiffness& stiffness, const std::vector<DiagramPoint>& diagram,
                                   double load_height = 0, int terms = 10);

/// What critical_moment_for_diagram works out from the points' positions
/// alone: the sine series' integrals against each point's share of a
/// piecewise-linear diagram. Worked out once for a member's stations, they
/// serve every load result on it.
struct DiagramIntegrals {
  std::vector<double> x;  ///< the points' positions [m], ascending
  int terms = 10;
  /// Per point p, the n x n block int phi_p(x) (i pi / L)^2 sin_i sin_j dx of the moment term (phi_p
  /// the point's share of a linear interpolation; n = terms), column-major, one block after another.
  std::vector<double> moment;
  /// Per interval, sin_i sin_j at its middle (the load-height term), n x n each.
  std::vector<double> load;
};

/// The integrals for diagrams with points at `x` (ascending, at least two).
DiagramIntegrals diagram_integrals(std::vector<double> x, int terms = 10);

/// Whether the diagram's points lie exactly at `x`, one each.
bool lie_at(const std::vector<DiagramPoint>& diagram, const std::vector<double>& x);

/// critical_moment_for_diagram with the positions' integrals worked out
/// beforehand; throws std::invalid_argument unless the diagram's points lie
/// at `integrals.x`.
double critical_moment_for_diagram(const LateralTorsionalStiffness& stiffness, const DiagramIntegrals& integrals,
                                   const std::vector<DiagramPoint>& diagram, double load_height = 0);

/// What the diagrams last solved exactly on a member leave for bounding the
/// next one's Mcr: each one's scaled matrix S = K^-1/2 G K^-1/2 (Mcr = max|M| /
/// lambda_max(S)) and that largest eigenvalue, and what S is made of.
struct CriticalMomentReference {
  /// One diagram solved exactly.
  struct Solved {
    std::vector<double> s;  ///< S, 2 terms x 2 terms, column-major
    double mu = 0;          ///< lambda_max(S)
    double size = 0;        ///< ||S||_F
    double peak = 0;        ///< max|M| of its diagram [N m]
    /// S is linear in these weights (the diagram's M at each point, then Q zg on each interval) ...
    std::vector<double> weights;
  };
  /// The latest diagrams solved, oldest first: at most `keep`. Empty: nothing solved yet. The last one
  /// alone is often far from the next diagram (a combination's sway variants come after every
  /// combination); on the 1,086-member bench frame with 12 combinations, keeping 2 left 4,298 of 6,644
  /// eigenproblems, 4 left 3,983 and more than 4 no fewer.
  std::vector<Solved> solved;
  std::size_t keep = 4;
  std::vector<double> x;  ///< the points' positions (every diagram of the member's)
  /// ... and one unit of each weight changes S by at most this (Frobenius norm of its scaled block).
  std::vector<double> unit_changes;
  std::vector<double> scratch;  ///< room for a diagram's weights (no allocation per diagram)
};

/// Mcr, or a lower bound on it.
struct CriticalMomentEstimate {
  double value = 0;    ///< [N m]
  bool exact = true;   ///< false: value is a lower bound (the eigenproblem was not solved)
};

/// critical_moment_for_diagram, or only a lower bound on it when the caller's
/// `bound_suffices(lower)` says that bound settles its question (a check that
/// cannot govern). The bound needs no eigenproblem: lambda_max moves by at most
/// the norm of the change of S (Weyl's inequality, lambda_max(A + E) <=
/// lambda_max(A) + ||E||_2 <= lambda_max(A) + ||E||_F; Golub & Van Loan,
/// Matrix Computations, 4th ed. 2013, 8.1.2; from memory), so Mcr >= max|M| /
/// (t mu_ref + ||S - t S_ref||_F) for any t > 0 (lambda_max(t S_ref) = t mu_ref),
/// with a margin of 1e-12 ||S||_F for rounding; the smaller of t = 1 and
/// t = max|M| / max|M|_ref is taken, so a diagram of the reference's shape at
/// another size is bounded by its own Mcr. ||S - t S_ref||_F is first bounded
/// without building S, by the weights' changes times their unit changes (the
/// triangle inequality), the least over the diagrams `reference` keeps, then
/// taken from S itself against the one that gave the least. An exact solution
/// joins `reference` (the oldest it keeps leaves when it is full); a bound leaves it.
/// A reference belongs to one member: its stiffness, length and stations.
CriticalMomentEstimate critical_moment_or_bound(const LateralTorsionalStiffness& stiffness,
                                                const DiagramIntegrals& integrals,
                                                const std::vector<DiagramPoint>& diagram, double load_height,
                                                CriticalMomentReference& reference,
                                                const std::function<bool(double)>& bound_suffices);

/// Equivalent uniform moment factor Cm of Annex B Table B.3 for a linear
/// diagram: 0.6 + 0.4 psi >= 0.4.
double cm_linear(double psi);

/// Equivalent uniform moment factor Cm of Annex B Table B.3 for a diagram
/// with end moments Mh (the larger in size) and psi Mh and the span moment Ms
/// (signed, same convention): alpha_s = Ms / Mh when |Ms| <= |Mh|, else
/// alpha_h = Mh / Ms. The uniform-load column is used for every span load: it
/// is never below the concentrated-load column (Table B.3, from memory).
double cm_span(double Mh, double psi, double Ms);

/// Elastic critical force of torsional buckling (6.3.1.4), as EN 1993-1-3
/// 6.2.3(5) eq. (6.33a) gives it: Ncr,T = (G It + pi^2 E Iw / lT^2) / i0^2,
/// i0^2 = iy^2 + iz^2 + y0^2 + z0^2 with (y0, z0) the shear centre from the centroid.
double torsional_critical_force(const Section& section, double E, double G, double lT);

/// True when the shear centre lies off the centroid (beyond rounding): twist
/// then couples with flexural buckling (torsional-flexural rather than torsional).
bool shear_centre_off_centroid(const Section& section);

/// Lowest elastic critical force of the buckling modes that twist the member
/// (6.3.1.4): torsional buckling for sections whose shear centre is the
/// centroid; otherwise the torsional-flexural mode, the lowest root of
/// i0^2 (N - Ny)(N - Nz)(N - NT) - N^2 y0^2 (N - Nz) - N^2 z0^2 (N - Ny) = 0
/// (Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., 1961, 5.3), where
/// an offset along an axis couples the twist with buckling about that axis.
/// With one offset zero the uncoupled flexural mode is left to 6.3.1.2 and the
/// coupled pair gives EN 1993-1-3 (6.35). Ny, Nz = pi^2 E I / Lcr^2.
double torsional_flexural_critical_force(const Section& section, double E, double G, double Lcr_y, double Lcr_z,
                                         double lT);

/// Buckling lengths as factors of the member length.
struct BucklingLengths {
  double y = 1.0;   ///< flexural buckling about y
  double z = 1.0;   ///< flexural buckling about z
  double lt = 1.0;  ///< unrestrained length for lateral-torsional buckling, also the torsional
                    ///< buckling length lT of 6.3.1.4 (length between twist restraints)
};

struct MemberIntegrals;  // diagram_integrals_cache.hpp

/// One member as the checks see it.
struct MemberInput {
  std::size_t member = 0;
  const Section* section = nullptr;
  Material material;  ///< with fy for the section's thickest plate
  double length = 0;  ///< [m]
  BucklingLengths buckling;
  /// Where the check finds the Mcr integrals of the member's stations and
  /// keeps them from one load result to the next (check_members gives one per
  /// member, all drawing on one shared cache); null: worked out for each result.
  MemberIntegrals* integrals = nullptr;
  /// Where the check keeps the member's latest Mcr solved exactly, to bound the
  /// next result's from below and leave out the eigenproblem of a result whose
  /// 6.3.2 and 6.3.3 checks cannot govern (check_members gives one per member);
  /// null: every Mcr solved. Used only together with `integrals`.
  CriticalMomentReference* mcr_reference = nullptr;
};

/// The EN 1993-1-1 checks of every member under every listed result, the
/// worst result of each check kept per member. `buckling` gives each member's
/// buckling length factors (empty: 1.0 everywhere). Each member's fy is that
/// of its section's thickest plate (material_for_section).
std::vector<CheckResult> check_members(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                       const std::vector<BucklingLengths>& buckling, const PartialFactors& factors,
                                       const LateralTorsionalOptions& ltb = {});

/// The EN 1993-1-1 checks of one member under one load result, one
/// CheckResult each: "5.5 classification" (only for a class 4 section: its
/// c/t over the class 3 limit, failing), "6.2 cross-section" (N + My + Mz:
/// 6.2.9.1 for class 1 and 2 I and RHS sections, else eq. 6.2; with the
/// shear reduction of 6.2.8), "6.2.6 shear", "6.3.1 flexural buckling",
/// "6.3.1.4 torsional buckling" (open sections in compression: torsional or
/// torsional-flexural), "6.3.2 lateral-torsional buckling", "6.3.3 interaction"
/// (6.61, 6.62; Cm of Table B.3 from each diagram, 0.9 for an axis whose
/// buckling length factor exceeds 1, i.e. a sway mode).
/// Checks that do not apply (no compression, closed sections for LTB) are
/// left out. `combination` is copied into the results. Each result carries
/// the intermediate values of its verdict in `details` (e.g. the LTB check:
/// Mcr, lambda_LT, alpha_LT, Phi_LT, chi_LT, M_b_Rd; the interaction: chi_y,
/// chi_z, chi_LT, k_yy, k_yz, k_zy, k_zz, eq_6_61, eq_6_62). `ltb` chooses
/// 6.3.2.2 or 6.3.2.3 for chi_LT; the LTB clause text names the one used.
/// `kept`, when given, holds the results already kept for this member from
/// other load results (keep_worst, worst_checks.hpp): a check that would not
/// replace the kept one of its name (its utilisation not above it) is left
/// out, without formatting its words, as keep_worst would drop it anyway.
std::vector<CheckResult> check_member(const MemberInput& member, const LineResult& line, const std::string& combination,
                                      const PartialFactors& factors, const LateralTorsionalOptions& ltb = {},
                                      const std::vector<CheckResult>* kept = nullptr);

}  // namespace stepframe::analysis::en1993
