// ANSI/AISC 360-16 member checks: the chapter D to G strengths station by
// station, chapter H interaction (H1.1, H2 for angles, H3.2 torsion of HSS)
// with the B1 and B2 amplifiers of Appendix 8, and the Appendix 7 condition
// of the effective length method. Equations as recalled (from memory).

#include "stepframe/analysis/aisc360.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/parallel.hpp"
#include "stepframe/analysis/worst_checks.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <map>
#include <numbers>
#include <optional>
#include <tuple>

namespace stepframe::analysis::aisc360 {
namespace {

constexpr double pi = std::numbers::pi;
constexpr int N_ = 0, Vy_ = 1, Vz_ = 2, T_ = 3, My_ = 4, Mz_ = 5;  // Station::forces components

/// The amplifier alpha of Appendix 8 (A-8-3, A-8-6): 1.0 for LRFD, 1.6 for ASD.
double alpha(Method method) { return method == Method::lrfd ? 1.0 : 1.6; }

/// A component of the internal forces at x, linear between the stations around it.
double value_at(const std::vector<Station>& st, double x, int c) {
  const auto after = std::lower_bound(st.begin(), st.end(), x, [](const Station& s, double v) { return s.x < v; });
  if (after == st.begin()) return st.front().forces(c);
  if (after == st.end()) return st.back().forces(c);
  const auto before = after - 1;
  const double span = after->x - before->x, t = span > 0 ? (x - before->x) / span : 0.0;
  return (1 - t) * before->forces(c) + t * after->forces(c);
}

/// One unbraced segment of the member for lateral-torsional buckling, with Cb of (F1-1) from the
/// member's own moment diagram and the major-axis strength for either sign of the moment.
struct Segment {
  double a = 0, b = 0, Cb = 1.0;
  Strength positive, negative;  ///< My > 0 and My < 0 (they differ for tees: stem in compression when My > 0)
};

std::vector<Segment> segments(const MemberInput& in, const LineResult& line) {
  const double L = in.length, Lb = std::max(in.buckling.lt, 0.0) * L;
  const std::size_t n = Lb > 0 ? static_cast<std::size_t>(std::max(1.0, std::ceil(L / Lb - 1e-6))) : 1;
  std::vector<Segment> out(n);
  for (std::size_t i = 0; i < n; ++i) {
    Segment& s = out[i];
    s.a = Lb > 0 ? static_cast<double>(i) * Lb : 0.0;
    s.b = i + 1 == n ? L : std::min(L, static_cast<double>(i + 1) * Lb);
    const double len = s.b - s.a;
    auto M = [&](double f) { return std::abs(value_at(line.stations, s.a + f * len, My_)); };
    double Mmax = std::max(M(0), M(1));
    for (const Station& st : line.stations)
      if (st.x >= s.a && st.x <= s.b) Mmax = std::max(Mmax, std::abs(st.forces(My_)));
    // F1: Cb = 1.0 for cantilevers whose free end is unbraced; (F1-1) otherwise, quarter points of the segment.
    s.Cb = in.cantilever || Mmax <= 0 ? 1.0 : lateral_torsional_factor(Mmax, M(0.25), M(0.5), M(0.75));
    s.positive = major_flexure(*in.section, in.material, len, s.Cb, true);
    s.negative = major_flexure(*in.section, in.material, len, s.Cb, false);
  }
  return out;
}

const Segment& segment_at(const std::vector<Segment>& segs, double x) {
  for (const Segment& s : segs)
    if (x <= s.b + 1e-9) return s;
  return segs.back();
}

/// Cm of Appendix 8 (A-8-4): 0.6 - 0.4 M1/M2 for a member without transverse loads (M1/M2 > 0 in
/// reverse curvature: with internal moments of one sign convention, M1/M2 = -psi); 1.0 with
/// transverse loads (the conservative value 8.2.1 allows).
double equivalent_moment_factor(const LineResult& line, int c) {
  const auto& st = line.stations;
  const double m0 = st.front().forces(c), m1 = st.back().forces(c), L = st.back().x;
  double peak = 0;
  for (const Station& s : st) peak = std::max(peak, std::abs(s.forces(c)));
  for (const Station& s : st)
    if (std::abs(s.forces(c) - (m0 + (m1 - m0) * s.x / L)) > 1e-3 * peak + 1e-9) return 1.0;
  const double big = std::abs(m0) >= std::abs(m1) ? m0 : m1, small = std::abs(m0) >= std::abs(m1) ? m1 : m0;
  const double psi = std::abs(big) > 1e-12 ? small / big : 1.0;
  return 0.6 + 0.4 * psi;
}

/// B1 of Appendix 8 (A-8-3): Cm / (1 - alpha Pr / Pe1) >= 1, Pe1 = pi^2 E I / (K1 L)^2 with K1 = 1 (A-8-5).
/// The denominator is kept above 1e-3 so a member beyond its elastic buckling load gets a large, finite
/// amplifier (and fails) rather than an infinite one.
double amplifier_b1(double Cm, double Pr, double E, double I, double L, Method method) {
  if (Pr <= 0) return 1.0;
  const double Pe1 = pi * pi * E * I / (L * L);
  return std::max(1.0, Cm / std::max(1 - alpha(method) * Pr / Pe1, 1e-3));
}

/// The load factor B2 stands on (A-8-6 with Pstory / Pe,story = 1 / alpha): that of the lowest buckling
/// mode that sways, i.e. moves the ends of some member apart across its chord by at least a tenth of the
/// mode's largest translation (nodes and points inside elements); when none of the computed modes sways,
/// the largest computed alpha, below which no sway mode lies (conservative). `sway` says which.
struct SwayFactor {
  double alpha = 0;
  bool sway = false;
};
std::optional<SwayFactor> sway_load_factor(const FrameModel& model, const std::vector<Member>& chains,
                                           const LoadResult& r) {
  if (r.buckling_modes.empty()) return std::nullopt;
  double largest = 0;
  for (const BucklingMode& mode : r.buckling_modes) {
    largest = std::max(largest, mode.alpha);
    double peak = 0;
    for (Eigen::Index n = 0; n < mode.displacements.size() / 6; ++n)
      peak = std::max(peak, mode.displacements.segment<3>(6 * n).norm());
    for (const auto& points : mode.inner_points)
      for (const Vector6d& p : points) peak = std::max(peak, p.head<3>().norm());
    double chord = 0;
    for (const Member& m : chains) {
      const std::size_t a = model.elements[m.elements.front()].nodes[0], b = model.elements[m.elements.back()].nodes[1];
      const Eigen::Vector3d axis = (model.nodes[b] - model.nodes[a]).normalized();
      const Eigen::Vector3d d = mode.displacements.segment<3>(static_cast<Eigen::Index>(6 * b)) -
                                mode.displacements.segment<3>(static_cast<Eigen::Index>(6 * a));
      chord = std::max(chord, (d - d.dot(axis) * axis).norm());
    }
    if (peak > 0 && chord >= 0.1 * peak) return SwayFactor{mode.alpha, true};
  }
  return SwayFactor{largest, false};
}

/// B2 per result, from its own modes or, for a sway variant "NAME.sway...", from NAME's; 1 for a
/// second-order result (P-Delta included) or without modes.
std::vector<std::optional<SwayFactor>> sway_factors(const FrameModel& model, const std::vector<const LoadResult*>& results) {
  const auto chains = member_chains(model);
  std::map<std::string, std::optional<SwayFactor>> own;
  for (const LoadResult* r : results) own[r->name] = sway_load_factor(model, chains, *r);
  std::vector<std::optional<SwayFactor>> out;
  for (const LoadResult* r : results) {
    const auto base = own.find(r->name.substr(0, r->name.find(".sway")));
    out.push_back(r->second_order || base == own.end() ? std::nullopt : base->second);
  }
  return out;
}

CheckResult make(const std::string& check, std::string clause, double station, double value, double limit,
                 const char* unit, Details details = {}) {
  CheckResult r;
  r.check = check;
  r.clause = std::move(clause);
  r.station = station;
  r.value = value;
  r.limit = limit;
  r.unit = unit;
  r.utilisation = limit > 0 ? value / limit : 0.0;
  r.pass = r.utilisation <= 1.0;
  r.details = std::move(details);
  return r;
}

/// The check a strength outside this screening becomes: its ratio over the bound it exceeds, failing.
CheckResult outside_screening(const std::string& check, const Strength& s) {
  double ratio = 1.0, bound = 0.0;
  for (const auto& [name, v] : s.details) {
    if (name == "ratio" || name == "D_t") ratio = v;
    if (name == "limit") bound = v;
  }
  if (!(bound > 0) || ratio <= bound) ratio = 1.0, bound = 0.999;  // no ratio to show: still a failure
  return make(check, "AISC 360-16 " + s.clause, 0, ratio, bound, "1", s.details);
}

std::string label(const Strength& s, Method m) {
  return fmt::format("AISC 360-16 {}; {} {}", s.clause, method_name(m),
                     m == Method::lrfd ? fmt::format("phi = {:.2f}", s.factors.phi)
                                       : fmt::format("Omega = {:.2f}", s.factors.omega));
}

Details with(Details d, std::initializer_list<std::pair<std::string, double>> more) {
  d.insert(d.end(), more.begin(), more.end());
  return d;
}

}  // namespace

std::vector<CheckResult> check_member(const MemberInput& in, const LineResult& line, const std::string& combination,
                                      Method method) {
  const Section& s = *in.section;
  const Material& mat = in.material;
  const double L = in.length, B2 = in.B2;
  const auto& st = line.stations;
  std::vector<CheckResult> out;

  // Required strengths: the analysis' forces, times B2 when the result is first order (Appendix 8:
  // Pr = Pnt + B2 Plt and Mr = B1 (Mnt + B2 Mlt), applied here to the whole force because the
  // analysis does not split it into no-translation and lateral-translation parts: conservative).
  double Pc_req = 0, Pt_req = 0;
  std::size_t kc = 0, kt = 0;
  for (std::size_t k = 0; k < st.size(); ++k) {
    const double N = B2 * st[k].forces(N_);
    if (-N > Pc_req) Pc_req = -N, kc = k;
    if (N > Pt_req) Pt_req = N, kt = k;
  }

  // Chapter D.
  const Strength tens = tension(s, mat.fy);
  const double Pt_av = tens.available(method);
  if (Pt_req > 0) out.push_back(make("D2 tension", label(tens, method), st[kt].x, Pt_req, Pt_av, "N", tens.details));

  // Chapter E, effective lengths Lc = K L from the rules' buckling factors (effective length method).
  const EffectiveLengths Lc{in.buckling.y * L, in.buckling.z * L, in.buckling.lt * L};
  const Strength comp = compression_strength(s, mat, Lc);
  const double Pc_av = comp.covered ? comp.available(method) : 0.0;
  if (Pc_req > 0) {
    if (!comp.covered) out.push_back(outside_screening("E compression", comp));
    else out.push_back(make("E compression", label(comp, method), st[kc].x, Pc_req, Pc_av, "N", comp.details));
  }

  // B1 per axis for members in compression (Appendix 8, 8.2.1).
  const double Cmx = equivalent_moment_factor(line, My_), Cmy = equivalent_moment_factor(line, Mz_);
  const double B1x = amplifier_b1(Cmx, Pc_req, mat.E, s.Iy, L, method);
  const double B1y = amplifier_b1(Cmy, Pc_req, mat.E, s.Iz, L, method);

  // Chapter F.
  const auto segs = segments(in, line);
  const Strength minor = minor_flexure(s, mat);
  const Strength* major_outside = nullptr;  // a segment's strength outside this screening
  for (const Segment& g : segs)
    for (const Strength* x : {&g.positive, &g.negative})
      if (!x->covered && !major_outside) major_outside = x;
  double worst_major = -1, worst_minor = -1;
  bool major_moment = false, minor_moment = false;
  CheckResult major_check, minor_check;
  for (const Station& p : st) {
    const double Mx = B1x * B2 * p.forces(My_), My = B1y * B2 * p.forces(Mz_);
    major_moment = major_moment || Mx != 0;
    minor_moment = minor_moment || My != 0;
    const Segment& g = segment_at(segs, p.x);
    const Strength& strength = Mx >= 0 ? g.positive : g.negative;
    if (!major_outside && Mx != 0) {
      const double Mc = strength.available(method), u = std::abs(Mx) / Mc;
      if (u > worst_major)
        worst_major = u, major_check = make("F major flexure", label(strength, method), p.x, std::abs(Mx), Mc, "N*m",
                                            with(strength.details, {{"Mrx", std::abs(Mx)}, {"B1x", B1x}, {"B2", B2}}));
    }
    if (minor.covered && My != 0) {
      const double Mc = minor.available(method), u = std::abs(My) / Mc;
      if (u > worst_minor)
        worst_minor = u, minor_check = make("F minor flexure", label(minor, method), p.x, std::abs(My), Mc, "N*m",
                                            with(minor.details, {{"Mry", std::abs(My)}, {"B1y", B1y}, {"B2", B2}}));
    }
  }
  if (major_outside && major_moment) out.push_back(outside_screening("F major flexure", *major_outside));
  if (!minor.covered && minor_moment) out.push_back(outside_screening("F minor flexure", minor));
  if (worst_major >= 0) out.push_back(major_check);
  if (worst_minor >= 0) out.push_back(minor_check);
  const bool flexure_covered = !major_outside && minor.covered;

  // Chapter G (both directions) and H3 torsion of HSS.
  const Strength vz = major_shear(s, mat, L), vy = minor_shear(s, mat, L);
  const Strength tor = torsional_strength(s, mat, L);
  const bool hss = s.shape == SectionShape::rhs || s.shape == SectionShape::chs;
  double worst_shear = -1, worst_torsion = -1;
  CheckResult shear_check, torsion_check;
  for (const Station& p : st) {
    const double Vz = B2 * std::abs(p.forces(Vz_)), Vy = B2 * std::abs(p.forces(Vy_)), T = B2 * std::abs(p.forces(T_));
    for (const auto& [V, str, axis] : {std::tuple{Vz, &vz, "z (along the web)"}, std::tuple{Vy, &vy, "y"}}) {
      if (!str->covered || V <= 0) continue;
      const double Vc = str->available(method), u = V / Vc;
      if (u > worst_shear)
        worst_shear = u, shear_check = make("G shear", label(*str, method) + ", shear along " + axis, p.x, V, Vc, "N",
                                            str->details);
    }
    if (hss && tor.covered && T > 0) {
      const double Tc = tor.available(method), u = T / Tc;
      if (u > worst_torsion)
        worst_torsion = u, torsion_check = make("H3 torsion", label(tor, method), p.x, T, Tc, "N*m", tor.details);
    }
  }
  if (worst_shear >= 0) out.push_back(shear_check);
  if (worst_torsion >= 0) out.push_back(torsion_check);

  // Chapter H: H1.1 (H1-1a, H1-1b) station by station with the strengths of that station's segment;
  // angles by H2 (H2-1, the ratios summed: about principal axes the stress ratios equal the force
  // ratios); HSS with Tr > 0.2 Tc by H3.2 (H3-6).
  const bool any_moment = worst_major >= 0 || worst_minor >= 0;
  // Torsion above 0.2 Tc somewhere brings in (H3-6) even without axial force.
  const bool twisted = worst_torsion > 0.2;
  if (flexure_covered && comp.covered && any_moment && (Pc_req > 0 || Pt_req > 0 || twisted)) {
    double worst = -1;
    CheckResult h;
    for (const Station& p : st) {
      const double N = B2 * p.forces(N_);
      const double Mx = B1x * B2 * p.forces(My_), My = B1y * B2 * p.forces(Mz_);
      const Segment& g = segment_at(segs, p.x);
      const double Mcx = (Mx >= 0 ? g.positive : g.negative).available(method), Mcy = minor.available(method);
      const double Pc = N < 0 ? Pc_av : Pt_av, pr = std::abs(N) / Pc;
      const double mx = std::abs(Mx) / Mcx, my = std::abs(My) / Mcy;
      const double T = B2 * std::abs(p.forces(T_));
      const bool twisting = hss && tor.covered && T > 0.2 * tor.available(method);
      double u = 0;
      std::string clause;
      Details d{{"Pr", std::abs(N)}, {"Pc", Pc}, {"Mrx", std::abs(Mx)}, {"Mcx", Mcx}, {"Mry", std::abs(My)},
                {"Mcy", Mcy},       {"Cm_x", Cmx}, {"Cm_y", Cmy},       {"B1x", B1x},  {"B1y", B1y},
                {"B2", B2}};
      if (twisting) {
        // (H3-6) (Pr/Pc + Mr/Mc) + (Vr/Vc + Tr/Tc)^2 <= 1, with Vr/Vc the larger of the two directions.
        const double v = std::max(vz.covered ? B2 * std::abs(p.forces(Vz_)) / vz.available(method) : 0.0,
                                  vy.covered ? B2 * std::abs(p.forces(Vy_)) / vy.available(method) : 0.0);
        const double t = T / tor.available(method);
        u = pr + mx + my + (v + t) * (v + t);
        clause = "H3.2 (H3-6), torsion Tr > 0.2 Tc";
        d.insert(d.end(), {{"Vr_Vc", v}, {"Tr_Tc", t}, {"eq_H3_6", u}});
      } else if (s.shape == SectionShape::angle) {
        u = pr + mx + my;  // (H2-1) |fra/Fca + frbw/Fcbw + frbz/Fcbz| <= 1, principal axes
        clause = "H2 (H2-1), single angle about its principal axes";
        d.push_back({"eq_H2_1", u});
      } else {
        u = interaction(pr, mx, my);
        clause = pr >= 0.2 ? "H1.1 (H1-1a)" : "H1.1 (H1-1b)";
        d.push_back({pr >= 0.2 ? "eq_H1_1a" : "eq_H1_1b", u});
      }
      if (u > worst) {
        worst = u;
        h = make("H interaction",
                 fmt::format("AISC 360-16 {} {}; required strengths with B1 = {:.3f}/{:.3f} (x/y, Appendix 8 A-8-3) "
                             "and B2 = {:.3f}; {}",
                             clause, N < 0 ? "in compression" : N > 0 ? "in tension" : "without axial force", B1x, B1y, B2, method_name(method)),
                 p.x, u, 1.0, "1", std::move(d));
      }
    }
    out.push_back(std::move(h));
  }
  for (auto& r : out) r.combination = combination, r.member = in.member;
  return out;
}

double sway_amplifier(double alpha_cr, Method method) {
  // (A-8-6) B2 = 1 / (1 - alpha Pstory / Pe,story) >= 1, Pstory / Pe,story = 1 / alpha_cr.
  const double ratio = alpha(method) / alpha_cr;
  return ratio < 1 ? 1.0 / (1 - ratio) : std::numeric_limits<double>::infinity();
}

std::vector<CheckResult> check_effective_length_method(const FrameModel& model,
                                                       const std::vector<const LoadResult*>& results, Method method) {
  const auto chains = member_chains(model);
  std::vector<CheckResult> out;
  for (const LoadResult* r : results) {
    const auto f = sway_load_factor(model, chains, *r);
    if (!f) continue;
    // B2 <= 1.5 is alpha / alpha_sway <= 1/3: checked in that form so the value stays finite.
    const double ratio = alpha(method) / f->alpha;
    CheckResult c = make("C effective length method",
                         fmt::format("AISC 360-16 Appendix 7, 7.2.1(b): the effective length method (K = the rules' "
                                     "buckling factors) is allowed while B2 <= 1.5 (A-8-6, Pstory/Pe,story = 1/alpha of "
                                     "{}), i.e. alpha/alpha_sway <= 1/3 with alpha = {:.1f} ({}); B2 = {:.3f}. The direct "
                                     "analysis method of chapter C is not offered",
                                     f->sway ? "the lowest sway buckling mode"
                                             : "the highest computed buckling mode: none of them sways, so this bounds it",
                                     alpha(method), method_name(method), sway_amplifier(f->alpha, method)),
                         0, ratio, 1.0 / 3.0, "1",
                         {{"alpha_sway", f->alpha}, {"sway_mode", f->sway ? 1.0 : 0.0}, {"alpha", alpha(method)}});
    if (ratio < 1) c.details.push_back({"B2", sway_amplifier(f->alpha, method)});
    c.member = whole_frame;
    c.combination = r->name;
    out.push_back(std::move(c));
  }
  return out;
}

std::vector<CheckResult> check_members(const FrameModel& model, const std::vector<const LoadResult*>& results,
                                       const std::vector<en1993::BucklingLengths>& buckling, Method method) {
  const auto chains = member_chains(model);
  // A member end is free when one element end and no support meet there (a cantilever's tip).
  std::vector<int> ends(model.nodes.size(), 0);
  for (const auto& e : model.elements) ++ends[e.nodes[0]], ++ends[e.nodes[1]];
  for (const auto& sp : model.supports)
    if (std::any_of(sp.fixed.begin(), sp.fixed.end(), [](bool f) { return f; }) ||
        std::any_of(sp.spring.begin(), sp.spring.end(), [](double k) { return k > 0; }))
      ends[sp.node] += 2;
  // B2 per result (capped so a frame beyond its sway buckling load fails with finite numbers).
  std::vector<double> b2;
  for (const auto& f : sway_factors(model, results)) b2.push_back(f ? std::min(sway_amplifier(f->alpha, method), 1e3) : 1.0);
  std::vector<WorstByCheck> worst(chains.size());
  parallel_for(chains.size(), [&](std::size_t m) {
    const FrameElement& first = model.elements[chains[m].elements.front()];
    const std::size_t start = first.nodes[0], end = model.elements[chains[m].elements.back()].nodes[1];
    MemberInput in;
    in.member = m;
    in.section = &model.sections[first.section];
    in.material = material_for_section(model.materials[first.material], *in.section);
    if (m < buckling.size()) in.buckling = buckling[m];
    in.cantilever = (ends[start] == 1) != (ends[end] == 1);
    for (std::size_t i = 0; i < results.size(); ++i) {
      const LineResult line = member_line(model, *results[i], chains[m], LineDetail::forces);
      in.length = line.length;
      in.B2 = b2[i];
      keep_worst(worst[m], check_member(in, line, results[i]->name, method));
    }
  });
  return flatten(std::move(worst));
}

}  // namespace stepframe::analysis::aisc360
