#pragma once
// ANSI/AISC 360-16 (Specification for Structural Steel Buildings) screening of
// steel members: local buckling classification (B4.1, Tables B4.1a and
// B4.1b), tension (chapter D, yielding of the gross section), compression
// (chapter E: E3, E4, E7), flexure (chapter F: F2, F3, F6, F7, F8, F9, F10),
// shear (chapter G: G2, G3, G4, G5, G6) and combined forces (chapter H: H1,
// H2 for angles, H3 torsion of HSS), with the resistance factor phi (LRFD) or
// the safety factor Omega (ASD) of each chapter.
//
// The equations and their numbers are those of ANSI/AISC 360-16 as recalled
// (from memory: no copy of the Specification is in the reference folder; the
// one published design example that is, F.1-1A/B, is run end to end in
// tests/plugin/test_aisc360_examples.cpp). Stability follows the effective
// length method of Appendix 7 (7.2): K factors are the rules' `buckling`
// factors, required strengths are amplified by B1 (Appendix 8, 8.2.1) and,
// for a first-order result, by B2 (8.2.2, from the elastic critical load
// factor of the lowest sway buckling mode); the method is allowed while
// B2 <= 1.5 (7.2.1(b)), check_effective_length_method.
//
// Axes: the Specification's x (major) axis is the section's y axis here, its
// y (minor) axis the section's z axis (section.hpp); forces follow results.hpp
// (N > 0 tension). Every value is SI; E, Fy come from the member's material.

#include "stepframe/analysis/checks.hpp"
#include "stepframe/analysis/en1993.hpp"
#include "stepframe/analysis/frame_model.hpp"
#include "stepframe/analysis/material.hpp"
#include "stepframe/analysis/results.hpp"
#include "stepframe/analysis/section.hpp"

#include <string>
#include <utility>
#include <vector>

namespace stepframe::analysis::aisc360 {

/// Design basis of B3.1 (LRFD: phi Rn >= Ru) or B3.2 (ASD: Rn / Omega >= Ra).
enum class Method { lrfd, asd };
const char* method_name(Method method);

/// The resistance factor phi and the safety factor Omega of one limit state.
struct Factors {
  double phi = 0.90;
  double omega = 1.67;
};
inline constexpr Factors tension_yielding{0.90, 1.67};  ///< D2(a)
inline constexpr Factors compression{0.90, 1.67};       ///< E1
inline constexpr Factors flexure{0.90, 1.67};           ///< F1(a)
inline constexpr Factors shear{0.90, 1.67};             ///< G1(a)
inline constexpr Factors shear_rolled_web{1.00, 1.50};  ///< G2.1(a), webs of rolled I with h/tw <= 2.24 sqrt(E/Fy)
inline constexpr Factors torsion{0.90, 1.67};           ///< H3.1

using Details = std::vector<std::pair<std::string, double>>;

/// A nominal strength with its limit state, factors and the values it stands on.
struct Strength {
  double Rn = 0;             ///< nominal strength [N or N m]; 0 when `covered` is false
  Factors factors{};
  std::string clause;        ///< section and equation, e.g. "E3 (E3-2)"
  Details details{};         ///< intermediate values, SI units or ratios
  bool covered = true;       ///< false: the member is outside this screening (e.g. a slender-web I)
  /// phi Rn (LRFD) or Rn / Omega (ASD).
  double available(Method method) const { return method == Method::lrfd ? factors.phi * Rn : Rn / factors.omega; }
};

// ---------------------------------------------------------------- B4.1

/// One element (plate) of a section as Table B4.1 sees it.
struct Element {
  std::string name;       ///< "flange", "web", "wall", "leg", "stem"
  double ratio = 0;       ///< width-to-thickness ratio lambda (b/t, h/tw, D/t)
  int count = 1;          ///< how many such elements the section has (E7 effective area)
  double width = 0;       ///< b (or h, D) [m]
  double t = 0;           ///< thickness [m]
  bool stiffened = false; ///< supported along both edges (Table B4.1, stiffened elements)
  int case_a = 0;         ///< case of Table B4.1a (axial compression)
  double lambda_r_a = 0;  ///< nonslender/slender limit in compression
  int case_b = 0;         ///< case of Table B4.1b (flexure); 0: the element is not in flexural compression
  double lambda_p = 0;    ///< compact/noncompact limit in flexure
  double lambda_r = 0;    ///< noncompact/slender limit in flexure
};

enum class Slenderness { compact, noncompact, slender };
const char* slenderness_name(Slenderness s);

/// The elements of a section with their Table B4.1a and B4.1b limits for
/// E and Fy: rolled and welded I (flange b = bf/2, web h), channels (b = bf),
/// angles (each leg b), tees (flange bf/2, stem d), rectangular HSS (walls
/// b = B - 3t, h = H - 3t, B4.1b(d)), round HSS (D/t). Empty for sections
/// given by their properties alone.
std::vector<Element> elements(const Section& section, double E, double Fy);

/// The element of that name ("web", "flange", "stem", "wall"), or nullptr.
const Element* find_element(const std::vector<Element>& elements, const std::string& name);

/// Table B4.1a: nonslender unless some element's ratio exceeds lambda_r.
bool slender_in_compression(const std::vector<Element>& elements);

/// Table B4.1b class of the named element ("flange", "web", ...) in flexure;
/// compact when the section has no such element.
Slenderness flexural_class(const std::vector<Element>& elements, const std::string& name);

// ---------------------------------------------------------------- D, E

/// D2(a) (D2-1): Pn = Fy Ag, tensile yielding on the gross section. Rupture
/// on the net section (D2(b), Fu Ae) needs net areas and shear lag factors
/// the wireframe does not carry: not checked (stated in the clause).
Strength tension(const Section& section, double Fy);

/// Critical stress of E3 for an elastic buckling stress Fe: Fcr = 0.658^(Fy/Fe) Fy
/// when Fy/Fe <= 2.25 (E3-2), else 0.877 Fe (E3-3).
double critical_stress(double Fy, double Fe);

/// Effective lengths Lc = K L [m].
struct EffectiveLengths {
  double x = 0;  ///< buckling about the major axis (section y)
  double y = 0;  ///< buckling about the minor axis (section z)
  double z = 0;  ///< torsional buckling (between twist restraints)
};

/// Chapter E: flexural buckling E3 (E3-1 to E3-4) about both axes; for open
/// sections also torsional or flexural-torsional buckling E4 (E4-2 doubly
/// symmetric, E4-3 singly symmetric, E4-4 unsymmetric: the lowest root of the
/// cubic, solved in closed form); with slender elements E7 (E7-1, effective
/// widths by E7-2, E7-3 with c1, c2 of Table E7.1; round HSS E7-6/E7-7).
/// Single angles are taken by E3/E4 (E5 needs the end connections).
Strength compression_strength(const Section& section, const Material& material, const EffectiveLengths& Lc);

// ---------------------------------------------------------------- F

/// Cb of F1 (F1-1) from the absolute moments of an unbraced segment:
/// 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB + 3 MC).
double lateral_torsional_factor(double Mmax, double MA, double MB, double MC);

/// Major-axis flexure (section y) for an unbraced length Lb and Cb:
/// F2 (doubly symmetric compact I and channels: yielding F2-1, LTB F2-2/F2-3
/// with Lp F2-5, Lr F2-6), F3 (compact web, noncompact or slender flanges:
/// F3-1, F3-2), F7 rectangular HSS (F7-1, F7-2, F7-3, web F7-5, LTB F7-10/F7-11),
/// F8 round HSS (F8-1 to F8-4), F9 tees (stem in tension or compression as
/// `stem_in_compression` says: F9-1 to F9-19), F10 single angles about the
/// major principal axis (F10-1 to F10-8; LTB for equal legs only). I sections
/// with noncompact or slender webs (F4, F5) are outside this screening.
Strength major_flexure(const Section& section, const Material& material, double Lb, double Cb,
                       bool stem_in_compression = false);

/// Minor-axis flexure (section z): F6 for I and channels (F6-1 to F6-4), F7
/// and F8 for HSS, F9 (tee about its axis of symmetry: yielding Mn = Fy Zy
/// <= 1.6 Fy Sy, flange local buckling F6-2 to F6-4; from memory), F10 for
/// angles about the minor principal axis (no LTB).
Strength minor_flexure(const Section& section, const Material& material);

// ---------------------------------------------------------------- G

/// Shear along the section's z (the web): G2.1 for I and channels (G2-1 with
/// Cv1 by G2-2 to G2-4, phi = 1.00 for rolled webs with h/tw <= 2.24
/// sqrt(E/Fy)), G3 (G3-1) for tee stems and angle legs, G4 (G4-1) for
/// rectangular HSS, G5 (G5-1) for round HSS over a shear length Lv.
Strength major_shear(const Section& section, const Material& material, double Lv);

/// Shear along the section's y: G6 (G6-1) for the flanges of I and channels,
/// G4 for rectangular HSS (walls along y), G5 for round HSS, G3 for angles
/// and tee flanges.
Strength minor_shear(const Section& section, const Material& material, double Lv);

/// Web shear buckling coefficient Cv2 of G2.2 (G2-9 to G2-11) for h/t and kv.
double shear_buckling_coefficient(double h_over_t, double kv, double E, double Fy);

// ---------------------------------------------------------------- H

/// H3.1 torsional strength of HSS: Tn = Fcr C (H3-1); round HSS Fcr by
/// H3-2a/b over length L, rectangular by H3-3 to H3-5; C of the H3.1 user
/// note. Not covered for other shapes.
Strength torsional_strength(const Section& section, const Material& material, double L);

/// H1.1 (H1-1a, H1-1b): the interaction of required over available axial
/// force and moments (ratios, each >= 0); also H2-1 for angles with the
/// ratios taken as stress ratios about the principal axes.
double interaction(double p, double mx, double my);

/// One member as the checks see it.
struct MemberInput {
  std::size_t member = 0;
  const Section* section = nullptr;
  Material material;  ///< with Fy for the section's thickest plate
  double length = 0;  ///< [m]
  en1993::BucklingLengths buckling;  ///< K factors (y: major, z: minor, lt: LTB and torsion)
  bool cantilever = false;  ///< one end free: Cb = 1.0 (F1(c))
  /// Sway amplification B2 of Appendix 8 applied to the moments and axial
  /// force (1 for a second-order result or when the factor is unknown).
  double B2 = 1.0;
};

/// The AISC 360 checks of one member under one load result, one CheckResult
/// each: "B4.1 classification" (only for a section outside this screening),
/// "D2 tension", "E compression", "F major flexure", "F minor flexure",
/// "G shear", "H3 torsion" (HSS with Tr > 0.2 Tc), "H1 interaction" (H2 for
/// angles). Details name the Specification's symbols (Lc_x, Fe, Fcr, Lp, Lr,
/// Cb, Mn, Cv1, B1, eq_H1_1a, ...). Value and limit are the required and the
/// available strengths (LRFD: phi Rn; ASD: Rn / Omega).
std::vector<CheckResult> check_member(const MemberInput& member, const LineResult& line, const std::string& combination,
                                      Method method);

/// The checks of every member under every listed result, worst per member
/// and check. `buckling` gives the K factors (empty: 1.0).
std::vector<CheckResult> check_members(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                       const std::vector<en1993::BucklingLengths>& buckling, Method method);

/// B2 of Appendix 8 (A-8-6) with Pstory / Pe,story = 1 / alpha_sway: 1 / (1 - alpha / alpha_sway),
/// alpha = 1.0 (LRFD) or 1.6 (ASD); infinite when alpha_sway <= alpha. alpha_sway is the load factor of
/// the lowest buckling mode that sways (moves some member's ends apart across its chord by a tenth of
/// the mode's largest translation or more); when none of the computed modes sways, the largest computed
/// one (the sway mode lies above it: conservative). check_members applies B2 to first-order results
/// (a sway variant "NAME.sway..." takes NAME's modes); second-order results take B2 = 1.
double sway_amplifier(double alpha_sway, Method method);

/// Appendix 7, 7.2.1(b): the effective length method is allowed when the
/// ratio of second-order to first-order drift, taken as B2, is at most 1.5.
/// One whole-frame result per result with buckling modes: value alpha / alpha_sway, limit 1/3.
std::vector<CheckResult> check_effective_length_method(const FrameModel& model,
                                                       const std::vector<const LoadResult*>& results, Method method);

}  // namespace stepframe::analysis::aisc360
