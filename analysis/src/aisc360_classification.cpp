// ANSI/AISC 360-16 B4.1: width-to-thickness ratios and their limits,
// Table B4.1a (members in axial compression) and Table B4.1b (members in
// flexure). Limits as recalled from the Specification (from memory).

#include "stepframe/analysis/aisc360.hpp"

#include <algorithm>
#include <cmath>

namespace stepframe::analysis::aisc360 {
namespace {

const SectionPart* part(const Section& s, const std::string& name) {
  for (const auto& p : s.parts)
    if (p.name == name) return &p;
  return nullptr;
}

}  // namespace

const char* method_name(Method method) { return method == Method::lrfd ? "LRFD" : "ASD"; }

const char* slenderness_name(Slenderness s) {
  switch (s) {
    case Slenderness::compact: return "compact";
    case Slenderness::noncompact: return "noncompact";
    case Slenderness::slender: return "slender";
  }
  return "slender";
}

std::vector<Element> elements(const Section& s, double E, double Fy) {
  const double r = std::sqrt(E / Fy);  // sqrt(E/Fy), the scale of Table B4.1
  std::vector<Element> out;
  auto add = [&](std::string name, double width, double t, int count, bool stiffened, int case_a, double lra,
                 int case_b, double lp, double lr) {
    out.push_back({std::move(name), width / t, count, width, t, stiffened, case_a, lra, case_b, lp, lr});
  };
  switch (s.shape) {
    case SectionShape::rolled_i: {
      const SectionPart *web = part(s, "web"), *flange = part(s, "flange");
      if (!web || !flange) break;
      // Flanges: b = bf / 2 (B4.1a(a)); cases 1 and 10. Web: h = d - 2k, the clear distance less the fillets; 5, 15.
      add("flange", 0.5 * s.width, flange->t, 4, false, 1, 0.56 * r, 10, 0.38 * r, 1.0 * r);
      add("web", web->c, web->t, 1, true, 5, 1.49 * r, 15, 3.76 * r, 5.70 * r);
      break;
    }
    case SectionShape::welded_i: {
      const SectionPart *web = part(s, "web"), *top = part(s, "top flange"), *bottom = part(s, "bottom flange");
      if (!web || !top || !bottom) break;
      // Built-up I: kc = 4 / sqrt(h/tw), 0.35 <= kc <= 0.76 (Table B4.1 note [a]); cases 2 and 11 with
      // FL = 0.7 Fy (F4.2(c)(6) for Sxt/Sxc >= 0.7, taken here for every built-up I).
      const double kc = std::clamp(4.0 / std::sqrt(web->c / web->t), 0.35, 0.76);
      const double lr_a = 0.64 * std::sqrt(kc * E / Fy), lr_b = 0.95 * std::sqrt(kc * E / (0.7 * Fy));
      // bf / 2 of each flange from its outstand (b - tw) / 2: b/2 = c + tw / 2.
      const bool same = std::abs(top->c - bottom->c) < 1e-9 && std::abs(top->t - bottom->t) < 1e-9;
      add("flange", top->c + 0.5 * web->t, top->t, same ? 4 : 2, false, 2, lr_a, 11, 0.38 * r, lr_b);
      if (!same) add("bottom flange", bottom->c + 0.5 * web->t, bottom->t, 2, false, 2, lr_a, 11, 0.38 * r, lr_b);
      add("web", web->c, web->t, 1, true, 5, 1.49 * r, 15, 3.76 * r, 5.70 * r);
      break;
    }
    case SectionShape::channel: {
      const SectionPart *web = part(s, "web"), *flange = part(s, "flange");
      if (!web || !flange) break;
      // Channels: b = bf, the full flange width (B4.1a(a)(2)); cases 1, 10; web cases 5, 15.
      add("flange", s.width, flange->t, 2, false, 1, 0.56 * r, 10, 0.38 * r, 1.0 * r);
      add("web", web->c, web->t, 1, true, 5, 1.49 * r, 15, 3.76 * r, 5.70 * r);
      break;
    }
    case SectionShape::tee: {
      const SectionPart *flange = part(s, "flange"), *stem = part(s, "stem");
      if (!flange || !stem) break;
      // Tee flange b = bf / 2 (cases 1, 10); stem d = the full depth (cases 4, 14).
      add("flange", 0.5 * s.width, flange->t, 2, false, 1, 0.56 * r, 10, 0.38 * r, 1.0 * r);
      add("stem", s.depth, stem->t, 1, false, 4, 0.75 * r, 14, 0.84 * r, 1.52 * r);
      break;
    }
    case SectionShape::angle:
      // Single angle legs: b = the full leg (cases 3, 12).
      for (const auto& p : s.parts) add(p.name, p.c, p.t, 1, false, 3, 0.45 * r, 12, 0.54 * r, 0.91 * r);
      break;
    case SectionShape::rhs: {
      const SectionPart *web = part(s, "web"), *flange = part(s, "flange");
      if (!web || !flange) break;
      // Rectangular HSS walls, b = B - 3t and h = H - 3t when the corner radius is not known
      // (B4.1b(d)); case 6 in compression, flanges case 17 and webs case 19 in flexure.
      add("flange", flange->c, flange->t, 2, true, 6, 1.40 * r, 17, 1.12 * r, 1.40 * r);
      add("web", web->c, web->t, 2, true, 6, 1.40 * r, 19, 2.42 * r, 5.70 * r);
      break;
    }
    case SectionShape::chs: {
      const SectionPart* wall = part(s, "wall");
      if (!wall) break;
      // Round HSS D/t: case 9 (0.11 E/Fy) and case 20 (0.07 E/Fy, 0.31 E/Fy).
      add("wall", wall->c, wall->t, 1, true, 9, 0.11 * E / Fy, 20, 0.07 * E / Fy, 0.31 * E / Fy);
      break;
    }
    default: break;  // flats, bars and sections given by properties: no element to classify
  }
  return out;
}

const Element* find_element(const std::vector<Element>& els, const std::string& name) {
  for (const auto& e : els)
    if (e.name == name) return &e;
  return nullptr;
}

bool slender_in_compression(const std::vector<Element>& elements) {
  return std::any_of(elements.begin(), elements.end(), [](const Element& e) { return e.ratio > e.lambda_r_a; });
}

Slenderness flexural_class(const std::vector<Element>& elements, const std::string& name) {
  Slenderness worst = Slenderness::compact;
  for (const auto& e : elements) {
    if (e.name.find(name) == std::string::npos || e.case_b == 0) continue;
    const Slenderness c = e.ratio <= e.lambda_p ? Slenderness::compact
                          : e.ratio <= e.lambda_r ? Slenderness::noncompact
                                                  : Slenderness::slender;
    worst = std::max(worst, c);
  }
  return worst;
}

}  // namespace stepframe::analysis::aisc360
