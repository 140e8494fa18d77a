// ANSI/AISC 360-16 chapter F: flexure. F1 (Cb), F2 and F3 (doubly symmetric
// I and channels, major axis), F6 (minor axis), F7 (rectangular HSS), F8
// (round HSS), F9 (tees), F10 (single angles). Equations as recalled from
// the Specification (from memory).

#include "stepframe/analysis/aisc360.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <numbers>

namespace stepframe::analysis::aisc360 {
namespace {

constexpr double pi = std::numbers::pi;

/// The element of that name with the largest ratio (the flange of a mono-symmetric I, the longer angle leg).
const Element* worst(const std::vector<Element>& els, const std::string& name) {
  const Element* w = nullptr;
  for (const auto& e : els)
    if (e.name.find(name) != std::string::npos && (!w || e.ratio > w->ratio)) w = &e;
  return w;
}

Slenderness class_of(const Element& e) {
  return e.ratio <= e.lambda_p ? Slenderness::compact : e.ratio <= e.lambda_r ? Slenderness::noncompact : Slenderness::slender;
}

/// Linear transition between Mp at lambda_p and Mr at lambda_r, as (F3-1), (F6-2), (F9-14) write it.
double transition(double Mp, double Mr, const Element& e) {
  return Mp - (Mp - Mr) * (e.ratio - e.lambda_p) / (e.lambda_r - e.lambda_p);
}

Strength outside(std::string clause, double beyond, double bound) {
  Strength st;
  st.factors = flexure;
  st.covered = false;
  st.clause = std::move(clause);
  st.details = {{"ratio", beyond}, {"limit", bound}};
  return st;
}

/// The limit states' nominal moments; the least governs.
struct Governing {
  double Mn = 0;
  std::string clause;
  void offer(double M, std::string c) {
    if (clause.empty() || M < Mn) Mn = M, clause = std::move(c);
  }
};

Strength finish(Governing g, Details details, const std::string& scope) {
  Strength st;
  st.factors = flexure;  // F1(a): phi_b = 0.90, Omega_b = 1.67
  st.Rn = g.Mn;
  st.clause = scope + ", governed by " + g.clause;
  details.push_back({"Mn", g.Mn});
  st.details = std::move(details);
  return st;
}

/// Largest |z| of the outline on the positive (+1) or negative (-1) side of the centroid [m].
double fibre(const Section& s, int side) {
  double c = 0;
  for (const auto& ring : s.outline)
    for (const auto& p : ring) c = std::max(c, side * p.z);
  return c > 0 ? c : 0.5 * s.depth;
}

/// Elastic modulus of a thin-walled box about its axis when an area dA of its compression flange,
/// at d1 from the centroid, is lost (F7.2(c): Se with the effective width be): the centroid moves
/// e = dA d1 / (A - dA) away from that flange; I' = I - dA d1^2 - (A - dA) e^2 (elementary statics).
double reduced_modulus(double I, double A, double depth, double dA, double d1) {
  const double e = dA * d1 / (A - dA);
  const double I_e = I - dA * d1 * d1 - (A - dA) * e * e;
  return I_e / (0.5 * depth + e);
}

/// F7 for a rectangular HSS about an axis with flanges `fl` (walls across the axis) and webs `wb`.
Strength hss_rect(const Section& s, const Material& m, const Element& fl, const Element& wb, double Z, double S,
                  double I, double depth, double r_lat, double Lb, double Cb, bool major) {
  const double E = m.E, Fy = m.fy, Mp = Fy * Z;  // (F7-1)
  Governing g;
  g.offer(Mp, "F7.1 yielding (F7-1)");
  Details d{{"Mp", Mp}, {"b_t", fl.ratio}, {"h_t", wb.ratio}};
  switch (class_of(fl)) {
    case Slenderness::compact: break;
    case Slenderness::noncompact:  // (F7-2)
      g.offer(std::min(Mp, Mp - (Mp - Fy * S) * (3.57 * fl.ratio * std::sqrt(Fy / E) - 4.0)),
              "F7.2 flange local buckling (F7-2)");
      break;
    case Slenderness::slender: {
      // (F7-4) be = 1.92 t sqrt(E/Fy) [1 - 0.38 / (b/t) sqrt(E/Fy)] <= b; (F7-3) Mn = Fy Se.
      const double be = std::min(fl.width, 1.92 * fl.t * std::sqrt(E / Fy) * (1 - 0.38 / fl.ratio * std::sqrt(E / Fy)));
      const double Se = reduced_modulus(I, s.A, depth, (fl.width - be) * fl.t, 0.5 * (depth - fl.t));
      d.insert(d.end(), {{"be", be}, {"Se", Se}});
      g.offer(Fy * Se, "F7.2 flange local buckling (F7-3)");
      break;
    }
  }
  switch (class_of(wb)) {
    case Slenderness::compact: break;
    case Slenderness::noncompact:  // (F7-5)
      g.offer(std::min(Mp, Mp - (Mp - Fy * S) * (0.305 * wb.ratio * std::sqrt(Fy / E) - 0.738)),
              "F7.3 web local buckling (F7-5)");
      break;
    case Slenderness::slender:
      return outside(fmt::format("F7.3: rectangular HSS with a slender web (h/t = {:.1f} > {:.1f}): outside this "
                                 "screening",
                                 wb.ratio, wb.lambda_r),
                     wb.ratio, wb.lambda_r);
  }
  if (major && Lb > 0) {
    // F7.4 lateral-torsional buckling: Lp = 0.13 E ry sqrt(J Ag) / Mp (F7-12),
    // Lr = 2 E ry sqrt(J Ag) / (0.7 Fy Sx) (F7-13).
    const double root = std::sqrt(s.J * s.A);
    const double Lp = 0.13 * E * r_lat * root / Mp, Lr = 2 * E * r_lat * root / (0.7 * Fy * S);
    d.insert(d.end(), {{"Lb", Lb}, {"Lp", Lp}, {"Lr", Lr}, {"Cb", Cb}});
    if (Lb > Lp && Lb <= Lr)
      g.offer(std::min(Mp, Cb * (Mp - (Mp - 0.7 * Fy * S) * (Lb - Lp) / (Lr - Lp))), "F7.4 lateral-torsional buckling (F7-10)");
    else if (Lb > Lr)
      g.offer(std::min(Mp, 2 * E * Cb * root / (Lb / r_lat)), "F7.4 lateral-torsional buckling (F7-11)");
  }
  return finish(g, d, major ? "F7 rectangular HSS, major axis" : "F7 rectangular HSS, minor axis");
}

/// F8 round HSS (either axis).
Strength hss_round(const Section& s, const Material& m, const Element& wall) {
  const double E = m.E, Fy = m.fy, S = s.Wy(), Mp = Fy * s.Wpl_y;
  if (wall.ratio >= 0.45 * E / Fy)
    return outside(fmt::format("F8: round HSS with D/t = {:.1f} beyond 0.45 E/Fy = {:.1f}: outside this screening",
                               wall.ratio, 0.45 * E / Fy),
                   wall.ratio, 0.45 * E / Fy);
  Governing g;
  g.offer(Mp, "F8.1 yielding (F8-1)");
  switch (class_of(wall)) {
    case Slenderness::compact: break;
    case Slenderness::noncompact:  // (F8-2) Mn = (0.021 E / (D/t) + Fy) S
      g.offer((0.021 * E / wall.ratio + Fy) * S, "F8.2 local buckling (F8-2)");
      break;
    case Slenderness::slender:  // (F8-3) Mn = Fcr S, (F8-4) Fcr = 0.33 E / (D/t)
      g.offer(0.33 * E / wall.ratio * S, "F8.2 local buckling (F8-3)");
      break;
  }
  return finish(g, {{"Mp", Mp}, {"D_t", wall.ratio}}, "F8 round HSS");
}

}  // namespace

double lateral_torsional_factor(double Mmax, double MA, double MB, double MC) {
  // (F1-1) Cb = 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB + 3 MC), absolute values.
  const double den = 2.5 * Mmax + 3 * MA + 4 * MB + 3 * MC;
  return den > 0 ? 12.5 * Mmax / den : 1.0;
}

Strength major_flexure(const Section& s, const Material& m, double Lb, double Cb, bool stem_in_compression) {
  const double E = m.E, Fy = m.fy;
  const auto els = elements(s, E, Fy);
  switch (s.shape) {
    case SectionShape::rolled_i:
    case SectionShape::welded_i:
    case SectionShape::channel: {
      const Element *web = find_element(els, "web"), *flange = worst(els, "flange");
      if (!web || !flange) break;
      if (find_element(els, "bottom flange"))
        return outside("F4/F5: I section with unequal flanges: outside this screening (F2 and F3 need double symmetry)",
                       flange->ratio, find_element(els, "flange")->ratio);
      if (class_of(*web) != Slenderness::compact)
        return outside(fmt::format("F4/F5: {} web (h/tw = {:.1f} > lambda_pw = {:.1f}): outside this screening",
                                   slenderness_name(class_of(*web)), web->ratio, web->lambda_p),
                       web->ratio, web->lambda_p);
      const double Sx = s.Wy(), Zx = s.Wpl_y, Mp = Fy * Zx;  // (F2-1)
      const double tf = flange->t, ho = s.depth - tf;
      // (F2-7) rts^2 = sqrt(Iy Cw) / Sx; (F2-8a) c = 1 for doubly symmetric I; (F2-8b) c = ho/2 sqrt(Iy/Cw) for channels.
      const double rts = std::sqrt(std::sqrt(s.Iz * s.Iw) / Sx);
      const double c = s.shape == SectionShape::channel ? 0.5 * ho * std::sqrt(s.Iz / s.Iw) : 1.0;
      const double Lp = 1.76 * s.iz() * std::sqrt(E / Fy);  // (F2-5)
      const double jc = s.J * c / (Sx * ho), k = 0.7 * Fy / E;
      const double Lr = 1.95 * rts * E / (0.7 * Fy) * std::sqrt(jc + std::sqrt(jc * jc + 6.76 * k * k));  // (F2-6)
      Governing g;
      g.offer(Mp, "F2.1 yielding (F2-1)");
      Details d{{"Mp", Mp}, {"Sx", Sx}, {"Zx", Zx}, {"Lb", Lb}, {"Lp", Lp}, {"Lr", Lr}, {"rts", rts},
                {"ho", ho}, {"c", c},   {"Cb", Cb}};
      if (Lb > Lp && Lb <= Lr) {
        g.offer(std::min(Mp, Cb * (Mp - (Mp - 0.7 * Fy * Sx) * (Lb - Lp) / (Lr - Lp))),
                "F2.2 lateral-torsional buckling (F2-2)");
      } else if (Lb > Lr) {
        // (F2-4) Fcr = Cb pi^2 E / (Lb/rts)^2 sqrt(1 + 0.078 Jc / (Sx ho) (Lb/rts)^2); (F2-3) Mn = Fcr Sx <= Mp.
        const double lr = Lb / rts;
        const double Fcr = Cb * pi * pi * E / (lr * lr) * std::sqrt(1 + 0.078 * jc * lr * lr);
        d.push_back({"Fcr", Fcr});
        g.offer(std::min(Mp, Fcr * Sx), "F2.2 lateral-torsional buckling (F2-3)");
      }
      d.push_back({"bf_2tf", flange->ratio});
      std::string scope = "F2 doubly symmetric compact I or channel, major axis";
      if (class_of(*flange) == Slenderness::noncompact) {
        scope = "F3 compact web, noncompact flanges";
        g.offer(transition(Mp, 0.7 * Fy * Sx, *flange), "F3.2 flange local buckling (F3-1)");
      } else if (class_of(*flange) == Slenderness::slender) {
        scope = "F3 compact web, slender flanges";
        const double kc = std::clamp(4.0 / std::sqrt(web->ratio), 0.35, 0.76);  // Table B4.1 note [a]
        g.offer(0.9 * E * kc * Sx / (flange->ratio * flange->ratio), "F3.2 flange local buckling (F3-2)");
      }
      return finish(g, d, scope);
    }
    case SectionShape::rhs: {
      const Element *web = find_element(els, "web"), *flange = find_element(els, "flange");
      if (!web || !flange) break;
      return hss_rect(s, m, *flange, *web, s.Wpl_y, s.Wy(), s.Iy, s.depth, s.iz(), Lb, Cb, true);
    }
    case SectionShape::chs:
      if (const Element* wall = find_element(els, "wall")) return hss_round(s, m, *wall);
      break;
    case SectionShape::tee: {
      const Element *stem = find_element(els, "stem"), *flange = find_element(els, "flange");
      if (!stem || !flange) break;
      const double Sx = s.Wy(), My = Fy * Sx;  // Sx to the farther fibre (the stem's tip): the smaller modulus
      const double Iy = s.Iz, d = s.depth;
      Governing g;
      Details det{{"My", My}, {"Lb", Lb}};
      // B of (F9-11) / (F9-13): +2.3 (d/Lb) sqrt(Iy/J) with the stem in tension, minus with it in compression.
      auto Mcr = [&](double B) {
        return 1.95 * E / Lb * std::sqrt(Iy * s.J) * (B + std::sqrt(1 + B * B));  // (F9-10)
      };
      if (!stem_in_compression) {
        const double Mp = std::min(Fy * s.Wpl_y, 1.6 * My);  // (F9-2)
        g.offer(Mp, "F9.1 yielding (F9-2)");
        const double Lp = 1.76 * s.iz() * std::sqrt(E / Fy);  // (F9-8)
        const double Lr = 1.95 * (E / Fy) * std::sqrt(Iy * s.J) / Sx * std::sqrt(2.36 * (Fy / E) * d * Sx / s.J + 1);  // (F9-9)
        det.insert(det.end(), {{"Mp", Mp}, {"Lp", Lp}, {"Lr", Lr}});
        if (Lb > Lp && Lb <= Lr) g.offer(Mp - (Mp - My) * (Lb - Lp) / (Lr - Lp), "F9.2 lateral-torsional buckling (F9-6)");
        else if (Lb > Lr) g.offer(Mcr(2.3 * d / Lb * std::sqrt(Iy / s.J)), "F9.2 lateral-torsional buckling (F9-7)");
        // F9.3 flange local buckling, flange in compression: Sxc to the flange's outer fibre.
        const double Sxc = s.Iy / fibre(s, +1);
        if (class_of(*flange) == Slenderness::noncompact)
          g.offer(std::min(1.6 * My, transition(Mp, 0.7 * Fy * Sxc, *flange)), "F9.3 flange local buckling (F9-14)");
        else if (class_of(*flange) == Slenderness::slender)
          g.offer(0.7 * E * Sxc / (flange->ratio * flange->ratio), "F9.3 flange local buckling (F9-15)");
      } else {
        g.offer(My, "F9.1 yielding, stem in compression (F9-4)");
        if (Lb > 0) g.offer(std::min(My, Mcr(-2.3 * d / Lb * std::sqrt(Iy / s.J))), "F9.2 lateral-torsional buckling (F9-12)");
        // F9.4 local buckling of the stem in compression: Mn = Fcr Sx (F9-16) with Fcr of (F9-17) to (F9-19).
        const double dt = stem->ratio, root = std::sqrt(E / Fy);
        const double Fcr = dt <= 0.84 * root   ? Fy
                           : dt <= 1.52 * root ? (1.43 - 0.515 * dt / root) * Fy
                                               : 1.52 * E / (dt * dt);
        det.push_back({"Fcr_stem", Fcr});
        g.offer(Fcr * Sx, dt <= 0.84 * root ? "F9.4 stem local buckling (F9-17)"
                          : dt <= 1.52 * root ? "F9.4 stem local buckling (F9-18)"
                                              : "F9.4 stem local buckling (F9-19)");
      }
      return finish(g, det, stem_in_compression ? "F9 tee, stem in compression" : "F9 tee, stem in tension");
    }
    case SectionShape::angle: {
      const Element* leg = worst(els, "leg");
      if (!leg) break;
      const double Sw = s.Wy(), My = Fy * Sw;
      Governing g;
      g.offer(1.5 * My, "F10.1 yielding (F10-1)");
      Details d{{"My", My}, {"Lb", Lb}, {"Cb", Cb}, {"b_t", leg->ratio}};
      double h = 0, b = 0;
      for (const auto& e : els) h = std::max(h, e.width), b = b == 0 ? e.width : std::min(b, e.width);
      if (Lb > 0) {
        if (std::abs(h - b) > 1e-9)
          return outside(fmt::format("F10.2: lateral-torsional buckling of an unequal-leg angle about its major principal "
                                     "axis needs beta_w (F10-5), not computed: outside this screening (legs {:.4g} / {:.4g} m)",
                                     h, b),
                         h / b, 1.0);
        // (F10-4) equal legs, major principal axis: Mcr = 9 E Ag rz t Cb / (8 Lb), rz the minor principal radius.
        const double Mcr = 9 * E * s.A * s.iz() * leg->t * Cb / (8 * Lb);
        d.push_back({"Mcr", Mcr});
        if (My / Mcr <= 1.0)
          g.offer(std::min(1.5 * My, (1.92 - 1.17 * std::sqrt(My / Mcr)) * My), "F10.2 lateral-torsional buckling (F10-2)");
        else
          g.offer((0.92 - 0.17 * Mcr / My) * Mcr, "F10.2 lateral-torsional buckling (F10-3)");
      }
      // F10.3 leg local buckling, Sc taken as the smaller elastic modulus (conservative).
      if (class_of(*leg) == Slenderness::noncompact)
        g.offer(Fy * Sw * (2.43 - 1.72 * leg->ratio * std::sqrt(Fy / E)), "F10.3 leg local buckling (F10-6)");
      else if (class_of(*leg) == Slenderness::slender)
        g.offer(0.71 * E / (leg->ratio * leg->ratio) * Sw, "F10.3 leg local buckling (F10-7)");
      return finish(g, d, "F10 single angle, major principal axis");
    }
    default: break;
  }
  // Flats, bars and sections given by properties: the elastic moment, no lateral-torsional buckling.
  Governing g;
  g.offer(Fy * s.Wy(), "first yield Fy S (section without Table B4.1 elements: no local or lateral-torsional "
                       "buckling checked)");
  return finish(g, {{"S", s.Wy()}}, "F major axis");
}

Strength minor_flexure(const Section& s, const Material& m) {
  const double E = m.E, Fy = m.fy;
  const auto els = elements(s, E, Fy);
  const double Sy = s.Wz(), Zy = s.Wpl_z;
  switch (s.shape) {
    case SectionShape::rolled_i:
    case SectionShape::welded_i:
    case SectionShape::channel:
    case SectionShape::tee: {
      const Element* flange = worst(els, "flange");
      if (!flange) break;
      // (F6-1) Mp = Fy Zy <= 1.6 Fy Sy; flange local buckling (F6-2), slender (F6-3) with Fcr = 0.69 E / lambda^2 (F6-4).
      // Tees bent about their axis of symmetry are taken the same way (from memory).
      const double Mp = std::min(Fy * Zy, 1.6 * Fy * Sy);
      Governing g;
      g.offer(Mp, "F6.1 yielding (F6-1)");
      if (class_of(*flange) == Slenderness::noncompact)
        g.offer(transition(Mp, 0.7 * Fy * Sy, *flange), "F6.2 flange local buckling (F6-2)");
      else if (class_of(*flange) == Slenderness::slender)
        g.offer(0.69 * E / (flange->ratio * flange->ratio) * Sy, "F6.2 flange local buckling (F6-3)");
      return finish(g, {{"Mp", Mp}, {"Sy", Sy}, {"Zy", Zy}, {"b_t", flange->ratio}}, "F6 minor axis");
    }
    case SectionShape::rhs: {
      const Element *web = find_element(els, "web"), *flange = find_element(els, "flange");
      if (!web || !flange) break;
      // About the minor axis the walls of height H are the flanges and those of width B the webs:
      // their ratios take the flange (case 17) and web (case 19) limits of Table B4.1b.
      Element fl = *web, wb = *flange;
      fl.lambda_p = flange->lambda_p, fl.lambda_r = flange->lambda_r;
      wb.lambda_p = web->lambda_p, wb.lambda_r = web->lambda_r;
      return hss_rect(s, m, fl, wb, Zy, Sy, s.Iz, s.width, 0, 0, 1.0, false);
    }
    case SectionShape::chs:
      if (const Element* wall = find_element(els, "wall")) return hss_round(s, m, *wall);
      break;
    case SectionShape::angle: {
      const Element* leg = worst(els, "leg");
      if (!leg) break;
      // F10 about the minor principal axis: no lateral-torsional buckling; yielding (F10-1) and leg local buckling.
      const double My = Fy * Sy;
      Governing g;
      g.offer(1.5 * My, "F10.1 yielding (F10-1)");
      if (class_of(*leg) == Slenderness::noncompact)
        g.offer(Fy * Sy * (2.43 - 1.72 * leg->ratio * std::sqrt(Fy / E)), "F10.3 leg local buckling (F10-6)");
      else if (class_of(*leg) == Slenderness::slender)
        g.offer(0.71 * E / (leg->ratio * leg->ratio) * Sy, "F10.3 leg local buckling (F10-7)");
      return finish(g, {{"My", My}, {"b_t", leg->ratio}}, "F10 single angle, minor principal axis");
    }
    default: break;
  }
  Governing g;
  g.offer(Fy * Sy, "first yield Fy S (section without Table B4.1 elements)");
  return finish(g, {{"S", Sy}}, "F minor axis");
}

}  // namespace stepframe::analysis::aisc360
