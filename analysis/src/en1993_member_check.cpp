// EN 1993-1-1 (2005) member checks: 5.5, 6.2, 6.3.1, 6.3.2 and 6.3.3 (Annex B).

#include "stepframe/analysis/en1993.hpp"
#include "stepframe/analysis/diagram_integrals_cache.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"
#include "stepframe/analysis/worst_checks.hpp"

#include <fmt/compile.h>
#include <fmt/format.h>

#include <algorithm>
#include <array>
#include <cmath>
#include <functional>
#include <map>
#include <numbers>
#include <optional>
#include <string_view>

namespace stepframe::analysis::en1993 {
namespace {

constexpr double pi = std::numbers::pi;
constexpr int N_ = 0, Vy_ = 1, Vz_ = 2, My_ = 4, Mz_ = 5;  // Station::forces components

/// A moment diagram along the member: linear or not, its end moments, span moment and peak.
struct Diagram {
  bool linear = true;
  double Mh = 0;     ///< the larger end moment, signed [N m]
  double psi = 1.0;  ///< the other end moment over Mh (1 = uniform moment)
  double Ms = 0;     ///< span moment for Table B.3: the interior peak when it exceeds |Mh|, else the moment at
                     ///< mid-length, signed [N m]
  double peak = 0;   ///< largest |M| [N m]
  std::size_t peak_station = 0;
};

Diagram diagram(const LineResult& line, int component) {
  Diagram d;
  const auto& st = line.stations;
  const double m0 = st.front().forces(component), m1 = st.back().forces(component), length = st.back().x;
  for (std::size_t k = 0; k < st.size(); ++k)
    if (std::abs(st[k].forces(component)) > d.peak) d.peak = std::abs(st[k].forces(component)), d.peak_station = k;
  for (const Station& s : st) {
    const double straight = m0 + (m1 - m0) * s.x / length;
    if (std::abs(s.forces(component) - straight) > 1e-3 * d.peak + 1e-9) d.linear = false;
  }
  d.Mh = std::abs(m0) >= std::abs(m1) ? m0 : m1;
  const double other = std::abs(m0) >= std::abs(m1) ? m1 : m0;
  d.psi = std::abs(d.Mh) > 1e-12 ? std::clamp(other / d.Mh, -1.0, 1.0) : 1.0;
  const double peak_signed = st[d.peak_station].forces(component);
  if (d.peak > std::abs(d.Mh)) {
    d.Ms = peak_signed;
  } else {
    // Mid-length moment, interpolated between the two stations around it.
    const auto after = std::lower_bound(st.begin(), st.end(), 0.5 * length,
                                        [](const Station& s, double x) { return s.x < x; });
    const auto before = after == st.begin() ? after : after - 1;
    const double span = after->x - before->x, t = span > 0 ? (0.5 * length - before->x) / span : 0.0;
    d.Ms = (1 - t) * before->forces(component) + t * after->forces(component);
  }
  return d;
}

/// Cm of Table B.3 for one axis; a member that sways about that axis (buckling length factor above 1,
/// which only a sway mode gives: common practice) takes Cm = 0.9 (Table B.3, last line; from memory).
double equivalent_moment_factor(const Diagram& d, double length_factor) {
  if (length_factor > 1.0) return 0.9;
  return d.linear ? cm_linear(d.psi) : cm_span(d.Mh, d.psi, d.Ms);
}

/// Elastic or plastic modulus by class (6.2.5(2)): Wpl for classes 1 and 2, Wel for class 3 (and 4, see 5.5).
double modulus_y(const Section& s, int cls) { return cls <= 2 && s.Wpl_y > 0 ? s.Wpl_y : s.Wy(); }
double modulus_z(const Section& s, int cls) { return cls <= 2 && s.Wpl_z > 0 ? s.Wpl_z : s.Wz(); }

// Mcr of the diagram (critical_moment_for_diagram), with the integrals of its positions that the member
// keeps (its load results share its stations) or shares with members at the same positions; or only a
// lower bound on it when `bound_suffices` says that settles the check (critical_moment_or_bound, from the
// member's latest Mcr solved exactly).
CriticalMomentEstimate critical_moment_of(const LateralTorsionalStiffness& k, const MemberInput& in,
                                          const std::vector<DiagramPoint>& points, double load_height,
                                          const std::function<bool(double)>& bound_suffices = nullptr) {
  if (!in.integrals) return {critical_moment_for_diagram(k, points, load_height), true};
  const DiagramIntegrals& integrals = in.integrals->at(points);
  if (!in.mcr_reference || !bound_suffices) return {critical_moment_for_diagram(k, integrals, points, load_height), true};
  return critical_moment_or_bound(k, integrals, points, load_height, *in.mcr_reference, bound_suffices);
}

bool is_open(SectionShape shape) {
  return shape == SectionShape::rolled_i || shape == SectionShape::welded_i || shape == SectionShape::channel ||
         shape == SectionShape::tee || shape == SectionShape::angle;
}
bool has_lateral_torsional_buckling(const Section& s) {
  return (s.shape == SectionShape::rolled_i || s.shape == SectionShape::welded_i || s.shape == SectionShape::channel) &&
         s.Iw > 0;
}

CheckResult result(const std::string& check, std::string clause, double station, double value, double limit,
                   const char* unit = "1") {
  CheckResult r;
  r.check = check;
  r.unit = unit;
  r.clause = std::move(clause);
  r.station = station;
  r.value = value;
  r.limit = limit;
  r.utilisation = limit > 0 ? value / limit : 0.0;
  r.pass = r.utilisation <= 1.0;
  return r;
}

}  // namespace

std::vector<CheckResult> check_member(const MemberInput& in, const LineResult& line, const std::string& combination,
                                      const PartialFactors& f, const LateralTorsionalOptions& ltb,
                                      const std::vector<CheckResult>* kept) {
  // Whether a result of `check` with this value and limit is wanted: without `kept` always, else
  // only when it would replace the one kept (keep_worst keeps the first of equals). The others
  // are left out before their words are formatted.
  auto kept_utilisation = [kept](std::string_view check) -> std::optional<double> {
    if (kept)
      for (const CheckResult& k : *kept)
        if (k.check == check) return k.utilisation;
    return std::nullopt;
  };
  auto may_replace = [&](std::string_view check, double u) {
    const std::optional<double> k = kept_utilisation(check);
    return !k || u > *k;
  };
  auto wanted = [&](std::string_view check, double value, double limit) {
    return may_replace(check, limit > 0 ? value / limit : 0.0);  // u as result() below
  };
  const Section& s = *in.section;
  const double fy = in.material.fy, E = in.material.E, G = in.material.G;
  const double L = in.length;
  const SectionClassifier classify_under(s, fy);  // the class at each station, and the member's
  std::vector<CheckResult> out;

  // 5.5 classification and 6.2 cross-section resistance, station by station. The class shows in
  // the 6.2 clause; a class 4 section (outside this screening) is a failing check of its own.
  // The worst station of each is kept as numbers; its result is worded once, after the loop.
  double worst_section = -1, worst_shear = -1, worst_class = -1;
  const Station* class_station = nullptr;
  Classification class_worst;
  std::array<double, 5> shear_worst{};  // station, Vy, Vz, Vpl_y_Rd, Vpl_z_Rd
  // The member's kept 6.2 utilisation: this result replaces it only through a station above it, so
  // a station whose linear sum (an upper bound, below) is not above it needs no plastic solve either.
  const double section_kept = kept_utilisation("6.2 cross-section").value_or(-1.0);
  struct {
    bool plastic = false;
    Classification cls;
    double x = 0;
    std::array<double, 7> at{};  // N, My, Mz, N_Rd, My_Rd, Mz_Rd, linear sum
  } section_worst;
  for (const Station& st : line.stations) {
    const double N = st.forces(N_), My = st.forces(My_), Mz = st.forces(Mz_);
    const double Vy = std::abs(st.forces(Vy_)), Vz = std::abs(st.forces(Vz_));
    const Classification cls = classify_under(N, My);
    if (cls.section_class == 4 && cls.class3_utilisation > worst_class)
      worst_class = cls.class3_utilisation, class_station = &st, class_worst = cls;
    const double NRd = s.A * fy / f.gamma_M0;  // (6.6) and (6.10)
    double MyRd = modulus_y(s, cls.section_class) * fy / f.gamma_M0;  // (6.13), (6.14)
    double MzRd = modulus_z(s, cls.section_class) * fy / f.gamma_M0;
    // 6.2.6 (6.18): Vpl,Rd = Av (fy / sqrt 3) / gamma_M0; 6.2.8: rho = (2 V / Vpl - 1)^2 reduces the
    // bending resistance when V > 0.5 Vpl (applied to the whole modulus: conservative).
    const double VplZ = s.Avz * fy / std::sqrt(3.0) / f.gamma_M0, VplY = s.Avy * fy / std::sqrt(3.0) / f.gamma_M0;
    if (VplZ > 0 && Vz > 0.5 * VplZ) MyRd *= 1.0 - std::pow(std::min(2 * Vz / VplZ - 1, 1.0), 2);
    if (VplY > 0 && Vy > 0.5 * VplY) MzRd *= 1.0 - std::pow(std::min(2 * Vy / VplY - 1, 1.0), 2);
    // Class 1 and 2 I and rectangular hollow sections: the plastic interaction of 6.2.9.1; otherwise the
    // linear sum (6.2), valid for every class 1 to 3 section. The linear sum bounds the plastic
    // utilisation from above, so a station where it cannot beat the worst so far, or the member's kept
    // result, needs no plastic solve (its linear sum stands in: never above what the result must beat).
    const double linear = std::abs(N) / NRd + std::abs(My) / MyRd + std::abs(Mz) / MzRd;
    const std::optional<double> plastic = cls.section_class <= 2 && linear > std::max(worst_section, section_kept)
                                              ? plastic_interaction(s, {NRd, MyRd, MzRd}, N, My, Mz)
                                              : std::nullopt;
    const double u = plastic ? *plastic : linear;
    if (u > worst_section) {
      worst_section = u;
      section_worst = {plastic.has_value(), cls, st.x, {N, My, Mz, NRd, MyRd, MzRd, linear}};
    }
    if (VplZ > 0 && VplY > 0) {
      const double uv = std::max(Vz / VplZ, Vy / VplY);
      if (uv > worst_shear) worst_shear = uv, shear_worst = {st.x, Vy, Vz, VplY, VplZ};
    }
  }
  if (class_station && wanted("5.5 classification", worst_class, 1.0))
    out.push_back(
        result("5.5 classification",
               fmt::format(FMT_COMPILE("EN 1993-1-1 5.5, Table 5.2: class {} ({}); class 4 needs effective properties "
                                       "(EN 1993-1-5), not covered"),
                           class_worst.section_class, class_worst.governing_part),
               class_station->x, worst_class, 1.0));
  if (wanted("6.2 cross-section", worst_section, 1.0)) {
    const auto& w = section_worst.at;
    CheckResult section_check = result("6.2 cross-section",
                                       fmt::format(FMT_COMPILE("EN 1993-1-1 {}, with 6.2.8 shear; class {} ({})"),
                                                   section_worst.plastic ? "6.2.9.1 (6.36)-(6.41), plastic N + My + Mz"
                                                                         : "6.2.1(7) eq. (6.2), N + My + Mz",
                                                   section_worst.cls.section_class, section_worst.cls.governing_part),
                                       section_worst.x, worst_section, 1.0);
    section_check.details = {{"class", section_worst.cls.section_class},
                             {"N_Ed", w[0]},
                             {"My_Ed", w[1]},
                             {"Mz_Ed", w[2]},
                             {"N_Rd", w[3]},
                             {"My_Rd", w[4]},
                             {"Mz_Rd", w[5]},
                             {"u_linear", w[6]}};
    out.push_back(std::move(section_check));
  }
  if (worst_shear >= 0 && wanted("6.2.6 shear", worst_shear, 1.0)) {
    CheckResult shear = result("6.2.6 shear", "EN 1993-1-1 6.2.6 eq. (6.17), plastic shear resistance",
                               shear_worst[0], worst_shear, 1.0);
    shear.details = {{"Vy_Ed", shear_worst[1]},
                     {"Vz_Ed", shear_worst[2]},
                     {"Vpl_y_Rd", shear_worst[3]},
                     {"Vpl_z_Rd", shear_worst[4]}};
    out.push_back(std::move(shear));
  }

  // Member buckling.
  double NEd = 0;  // largest compression
  std::size_t n_station = 0;
  for (std::size_t k = 0; k < line.stations.size(); ++k)
    if (-line.stations[k].forces(N_) > NEd) NEd = -line.stations[k].forces(N_), n_station = k;
  const Diagram my = diagram(line, My_), mz = diagram(line, Mz_);
  const FlexuralCurves curves = flexural_curves(s, fy);
  const double NRk = s.A * fy;
  // 6.3.1.2 (6.50): lambda = sqrt(A fy / Ncr), Ncr = pi^2 E I / (k L)^2.
  const double Ly = in.buckling.y * L, Lz = in.buckling.z * L;
  const double lambda_y = std::sqrt(NRk / (pi * pi * E * s.Iy / (Ly * Ly)));
  const double lambda_z = std::sqrt(NRk / (pi * pi * E * s.Iz / (Lz * Lz)));
  const double chi_y = reduction_factor(lambda_y, curves.y), chi_z = reduction_factor(lambda_z, curves.z);

  if (const double NbRd = std::min(chi_y, chi_z) * NRk / f.gamma_M1;  // (6.47)
      NEd > 0 && wanted("6.3.1 flexural buckling", NEd, NbRd)) {
    CheckResult r =
        result("6.3.1 flexural buckling",
               fmt::format(FMT_COMPILE("EN 1993-1-1 6.3.1, curves {}/{} (y/z), chi_y = {:.3f}, chi_z = {:.3f}, "
                                       "Lcr = {:.3g}/{:.3g} m"),
                           curve_name(curves.y), curve_name(curves.z), chi_y, chi_z, Ly, Lz),
               line.stations[n_station].x, NEd, NbRd, "N");
    r.details = {{"L_cr_y", Ly},     {"L_cr_z", Lz},        {"lambda_y", lambda_y},
                 {"lambda_z", lambda_z}, {"alpha_y", imperfection_factor(curves.y)},
                 {"alpha_z", imperfection_factor(curves.z)}, {"chi_y", chi_y}, {"chi_z", chi_z},
                 {"N_b_Rd", NbRd}};
    out.push_back(std::move(r));
  }

  // 6.3.1.4: open sections can also buckle by twisting (torsional, or torsional-flexural when the shear
  // centre is off the centroid); chi from the z-axis curve of Table 6.2 (6.3.1.4(2)).
  double chi_t = 1.0;
  const double lT = in.buckling.lt * L;
  if (NEd > 0 && is_open(s.shape) && s.J > 0) {
    const double Ncr = torsional_flexural_critical_force(s, E, G, Ly, Lz, lT);
    const double lambda_t = std::sqrt(NRk / Ncr);  // (6.52)
    chi_t = reduction_factor(lambda_t, curves.z);
    if (wanted("6.3.1.4 torsional buckling", NEd, chi_t * NRk / f.gamma_M1))
      out.push_back(
          result("6.3.1.4 torsional buckling",
                 fmt::format(FMT_COMPILE("EN 1993-1-1 6.3.1.4, {} buckling, Ncr = {:.4g} kN (EN 1993-1-3 6.2.3), "
                                         "curve {}, chi = {:.3f}, lT = {:.3g} m"),
                             shear_centre_off_centroid(s) ? "torsional-flexural" : "torsional", Ncr / 1e3,
                             curve_name(curves.z), chi_t, lT),
                 line.stations[n_station].x, NEd, chi_t * NRk / f.gamma_M1, "N"));
  }

  const int cls_member = classify_under(-NEd, my.peak).section_class;
  const double Wy = modulus_y(s, cls_member), Wz = modulus_z(s, cls_member);
  // 6.3.3 (6.61), (6.62) with the interaction factors of Annex B (method 2), for members in compression;
  // everything but chi_LT is known here.
  const double Cmy = equivalent_moment_factor(my, in.buckling.y), Cmz = equivalent_moment_factor(mz, in.buckling.z);
  const double Cmlt = Cmy;
  const bool plastic = cls_member <= 2;
  // n_z takes the smaller of the flexural and the torsional chi (conservative: 6.3.3(4) names only
  // the flexural one, but a section that twists first cannot reach it).
  const double n_y = NEd / (chi_y * NRk / f.gamma_M1), n_z = NEd / (std::min(chi_z, chi_t) * NRk / f.gamma_M1);
  const bool i_section = s.shape == SectionShape::rolled_i || s.shape == SectionShape::welded_i;
  // Table B.1.
  const double kyy = plastic ? Cmy * (1 + std::min(lambda_y - 0.2, 0.8) * n_y) : Cmy * (1 + 0.6 * std::min(lambda_y, 1.0) * n_y);
  const double kzz = plastic ? (i_section ? Cmz * (1 + std::min(2 * lambda_z - 0.6, 1.4) * n_z)
                                          : Cmz * (1 + std::min(lambda_z - 0.2, 0.8) * n_z))
                             : Cmz * (1 + 0.6 * std::min(lambda_z, 1.0) * n_z);
  const double kyz = plastic ? 0.6 * kzz : kzz;
  double kzy = plastic ? 0.6 * kyy : 0.8 * kyy;
  if (is_open(s.shape)) {
    // Table B.2: members susceptible to torsional deformations.
    const double c = plastic ? 0.1 : 0.05, lz = std::min(lambda_z, 1.0);
    kzy = 1 - c * lz * n_z / (Cmlt - 0.25);
    if (plastic && lambda_z < 0.4) kzy = std::min(0.6 + lambda_z, kzy);
  }
  const double MyRk = Wy * fy, MzRk = Wz * fy;
  // (6.61) and (6.62) for a chi_LT: both fall as it rises.
  auto interaction = [&](double chi_lt) -> std::array<double, 2> {
    return {n_y + kyy * my.peak / (chi_lt * MyRk / f.gamma_M1) + kyz * mz.peak / (MzRk / f.gamma_M1),
            n_z + kzy * my.peak / (chi_lt * MyRk / f.gamma_M1) + kzz * mz.peak / (MzRk / f.gamma_M1)};
  };

  double chi_lt = 1.0;
  bool lateral_torsional_bounded = false;  // 6.3.2 and 6.3.3 settled by a bound on Mcr: neither can govern
  if (has_lateral_torsional_buckling(s) && my.peak > 0) {
    // Span loads (a curved diagram) are taken on the top flange, towards the shear centre: the conservative
    // default when the model does not say where they act.
    const double zg = my.linear ? 0.0 : 0.5 * s.depth;
    const bool ends_only = std::abs(in.buckling.lt - 1.0) < 1e-12;
    // 6.3.2.3 where the options ask for it and the section is an I section; 6.3.2.2 otherwise.
    const std::optional<Curve> rolled_curve =
        ltb.method == LateralTorsionalMethod::rolled ? lateral_torsional_curve_rolled(s) : std::nullopt;
    const LateralTorsionalMethod method = rolled_curve ? LateralTorsionalMethod::rolled : LateralTorsionalMethod::general;
    const Curve curve = rolled_curve ? *rolled_curve : lateral_torsional_curve(s);
    const double lambda_0 = rolled_curve ? ltb.lambda_0 : 0.2, beta = rolled_curve ? ltb.beta : 1.0;
    const double alpha_lt = imperfection_factor(curve);
    // chi_LT of a slenderness, before 6.3.2.3(2): (6.56) or (6.57); it falls as the slenderness rises.
    auto chi_of = [&](double lambda_lt) {
      return rolled_curve ? reduction_factor_rolled(lambda_lt, curve, lambda_0, beta)
                          : (lambda_lt <= 0.2 ? 1.0 : reduction_factor(lambda_lt, curve));  // 6.3.2.2(4)
    };
    std::vector<DiagramPoint> points;
    double Mcr = 0;
    if (ends_only) {
      // Restrained at the member ends only: Mcr of the member's own moment diagram (energy method).
      points.reserve(line.stations.size());
      for (const Station& st : line.stations) points.push_back({st.x, st.forces(My_), st.forces(Vz_)});
      // Whether Mcr >= lower settles that neither 6.3.2 nor 6.3.3 of this result can replace the member's
      // kept ones: then its eigenproblem is left out. chi_LT only rises with Mcr, and 6.3.2.3(2) (f <= 1)
      // can only raise it, to at most 1 / lambda_LT^2; both utilisations fall as chi_LT rises. A margin of
      // 1e-9 covers the rounding of the formulas on the way.
      auto cannot_govern = [&](double lower) {
        const double lambda_above = std::sqrt(Wy * fy / lower);
        double chi_below = chi_of(lambda_above);
        if (rolled_curve && ltb.f_modification) chi_below = std::min(chi_below, 1.0 / (lambda_above * lambda_above));
        const double margin = 1 + 1e-9;
        if (may_replace("6.3.2 lateral-torsional buckling", margin * my.peak / (chi_below * Wy * fy / f.gamma_M1)))
          return false;
        if (NEd <= 0) return true;
        if (kyy < 0 || kzy < 0) return false;  // (far beyond failure) 6.3.3 would then rise with chi_LT
        const auto [u61, u62] = interaction(chi_below);
        return !may_replace("6.3.3 interaction", margin * std::max(u61, u62));
      };
      const CriticalMomentEstimate estimate = critical_moment_of({E, G, s.Iz, s.Iw, s.J}, in, points, zg, cannot_govern);
      Mcr = estimate.value;
      lateral_torsional_bounded = !estimate.exact;
    } else {
      // Restraints inside the member: the diagram between them is not known here, so uniform moment (C1 = 1,
      // the lowest) over the unrestrained length is the conservative default.
      Mcr = critical_moment(E, G, s.Iz, s.Iw, s.J, lT, 1.0, my.linear ? 0.0 : 0.454, zg);
    }
    if (!lateral_torsional_bounded) {
      const double lambda_lt = std::sqrt(Wy * fy / Mcr);  // (6.56)
      // Phi_LT = 0.5 [1 + alpha_LT (lambda_LT - lambda_LT,0) + beta lambda_LT^2]: (6.56) with lambda_LT,0 = 0.2,
      // beta = 1, or (6.57).
      const double phi_lt = 0.5 * (1 + alpha_lt * (lambda_lt - lambda_0) + beta * lambda_lt * lambda_lt);
      chi_lt = chi_of(lambda_lt);
      const double chi_lt_unmodified = chi_lt;
      std::optional<std::array<double, 2>> modified;  // kc, f of 6.3.2.3(2)
      if (rolled_curve && ltb.f_modification) {
        // 6.3.2.3(2): kc of Table 6.6 from the diagram; C1 (for curved diagrams) with the load at the shear centre.
        double C1 = 1.0;
        if (!my.linear && ends_only)
          C1 = critical_moment_of({E, G, s.Iz, s.Iw, s.J}, in, points, 0.0).value /
               critical_moment(E, G, s.Iz, s.Iw, s.J, lT, 1.0);
        const double kc = ends_only ? correction_factor_kc(my.linear, my.psi, C1) : 1.0;
        const double f_mod = modification_factor_f(kc, lambda_lt);
        chi_lt = std::min({chi_lt / f_mod, 1.0, 1.0 / (lambda_lt * lambda_lt)});  // (6.58)
        modified = {kc, f_mod};
      }
      const double MbRd = chi_lt * Wy * fy / f.gamma_M1;  // (6.55)
      if (wanted("6.3.2 lateral-torsional buckling", my.peak, MbRd)) {
        std::vector<std::pair<std::string, double>> details{
            {"Mcr", Mcr},          {"W_y", Wy},      {"lambda_LT", lambda_lt}, {"alpha_LT", alpha_lt},
            {"lambda_LT_0", lambda_0}, {"beta", beta}, {"Phi_LT", phi_lt},     {"chi_LT", chi_lt_unmodified}};
        if (modified) details.insert(details.end(), {{"kc", (*modified)[0]}, {"f", (*modified)[1]}, {"chi_LT_mod", chi_lt}});
        details.insert(details.end(), {{"M_Ed", my.peak}, {"M_b_Rd", MbRd}});
        const std::string basis =
            ends_only
                ? fmt::format(
                      FMT_COMPILE("Mcr of the member's moment diagram, fork supports at its ends {:.3g} m apart and "
                                  "no restraint between{}"),
                      lT, my.linear ? "" : "; span loads on the top flange (conservative default)")
                : fmt::format(FMT_COMPILE("conservative default over the unrestrained length {:.3g} m: C1 = 1.0{}"), lT,
                              my.linear ? "" : ", span loads on the top flange (C2 = 0.454)");
        const std::string modification =
            modified ? fmt::format(FMT_COMPILE(", f = {:.3f} (kc = {:.3f}, 6.58)"), (*modified)[1], (*modified)[0])
                     : std::string();
        CheckResult r =
            result("6.3.2 lateral-torsional buckling",
                   fmt::format(FMT_COMPILE("EN 1993-1-1 {}{}, curve {}, Mcr = {:.4g} kN*m, chi_LT = {:.3f}{}; {}"),
                               method_name(method),
                               ltb.method == LateralTorsionalMethod::rolled && !rolled_curve
                                   ? " (6.3.2.3 covers I sections only)"
                                   : "",
                               curve_name(curve), Mcr / 1e3, chi_lt, modification, basis),
                   line.stations[my.peak_station].x, my.peak, MbRd, "N*m");
        r.details = std::move(details);
        out.push_back(std::move(r));
      }
    }
  }

  if (NEd > 0 && !lateral_torsional_bounded) {
    const auto [u61, u62] = interaction(chi_lt);
    if (wanted("6.3.3 interaction", std::max(u61, u62), 1.0)) {
      CheckResult r = result(
          "6.3.3 interaction",
          fmt::format(FMT_COMPILE("EN 1993-1-1 6.3.3 eq. ({}), Annex B: kyy = {:.3f}, kyz = {:.3f}, kzy = {:.3f}, "
                                  "kzz = {:.3f}, Cmy = {:.2f}, Cmz = {:.2f}"),
                      u61 >= u62 ? "6.61" : "6.62", kyy, kyz, kzy, kzz, Cmy, Cmz),
          line.stations[my.peak_station].x, std::max(u61, u62), 1.0);
      r.details = {{"N_Ed", NEd},
                   {"M_y_Ed", my.peak},
                   {"M_z_Ed", mz.peak},
                   {"chi_y", chi_y},
                   {"chi_z", std::min(chi_z, chi_t)},
                   {"chi_LT", chi_lt},
                   {"N_b_y_Rd", chi_y * NRk / f.gamma_M1},
                   {"N_b_z_Rd", std::min(chi_z, chi_t) * NRk / f.gamma_M1},
                   {"M_b_Rd", chi_lt * MyRk / f.gamma_M1},
                   {"C_my", Cmy},
                   {"C_mz", Cmz},
                   {"C_mLT", Cmlt},
                   {"k_yy", kyy},
                   {"k_yz", kyz},
                   {"k_zy", kzy},
                   {"k_zz", kzz},
                   {"eq_6_61", u61},
                   {"eq_6_62", u62}};
      out.push_back(std::move(r));
    }
  }
  for (auto& r : out) r.combination = combination, r.member = in.member;
  return out;
}

std::vector<CheckResult> check_members(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                       const std::vector<BucklingLengths>& buckling, const PartialFactors& factors,
                                       const LateralTorsionalOptions& ltb) {
  const auto chains = member_chains(model);
  // Per member, the worst result of each check over the results, ordered by check name; the
  // members are independent, so they are spread over the cores and joined in member order.
  std::vector<WorstByCheck> worst(chains.size());
  DiagramIntegralsCache shared_integrals;
  parallel_for(chains.size(), [&](std::size_t m) {
    const FrameElement& first = model.elements[chains[m].elements.front()];
    MemberInput in;
    in.member = m;
    in.section = &model.sections[first.section];
    in.material = material_for_section(model.materials[first.material], *in.section);
    if (m < buckling.size()) in.buckling = buckling[m];
    MemberIntegrals integrals{&shared_integrals, nullptr};
    in.integrals = &integrals;
    CriticalMomentReference mcr_reference;
    in.mcr_reference = &mcr_reference;
    for (const LoadResult* r : results) {
      const LineResult line = member_line(model, *r, chains[m], LineDetail::forces);
      in.length = line.length;
      keep_worst(worst[m], check_member(in, line, r->name, factors, ltb, &worst[m]));
    }
  });
  return flatten(std::move(worst));
}

}  // namespace stepframe::analysis::en1993
