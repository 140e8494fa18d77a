// EN 1993-1-1 (2005) 5.5: classification of cross-sections (Table 5.2).

#include "stepframe/analysis/en1993.hpp"

#include <algorithm>
#include <array>
#include <cmath>

namespace stepframe::analysis::en1993 {
namespace {

// Limits of an internal compression part (Table 5.2 sheet 1) for classes 1 and 2
// under plastic compressed fraction alpha, and class 3 under elastic stress ratio psi.
double internal_limit(int cls, double eps, double alpha, double psi) {
  if (cls == 1) return alpha > 0.5 ? 396 * eps / (13 * alpha - 1) : 36 * eps / alpha;
  if (cls == 2) return alpha > 0.5 ? 456 * eps / (13 * alpha - 1) : 41.5 * eps / alpha;
  return psi > -1 ? 42 * eps / (0.67 + 0.33 * psi) : 62 * eps * (1 - psi) * std::sqrt(-psi);
}

bool is_web(const SectionPart& part) { return part.name.find("web") != std::string::npos; }

}  // namespace

double epsilon(double fy) { return std::sqrt(235e6 / fy); }  // Table 5.2, fy in Pa

namespace {

// part_limits with epsilon worked out by the caller (once per section, not once per part).
std::array<double, 3> limits_for(const SectionPart& part, double eps, double alpha, double psi) {
  switch (part.kind) {
    case PartKind::internal: {
      const double a = std::clamp(alpha, 1e-9, 1.0), p = std::min(psi, 1.0);
      return {internal_limit(1, eps, a, p), internal_limit(2, eps, a, p), internal_limit(3, eps, a, p)};
    }
    case PartKind::outstand:  // Table 5.2 sheet 2, outstand flange in uniform compression
      return {9 * eps, 10 * eps, 14 * eps};
    case PartKind::angle_leg:  // Table 5.2 sheet 3, angles: h/t <= 15 epsilon for class 3 only
      return {0.0, 0.0, 15 * eps};
    case PartKind::tube:  // Table 5.2 sheet 3, tubular sections: d/t
      return {50 * eps * eps, 70 * eps * eps, 90 * eps * eps};
  }
  return {0.0, 0.0, 0.0};
}

// The class of a part in compression of slenderness c/t = `ratio` whose limits are given (Table 5.2: the
// first class whose limit c/t meets).
int class_within(double ratio, const std::array<double, 3>& limits) {
  for (int cls = 1; cls <= 3; ++cls)
    if (ratio <= limits[static_cast<std::size_t>(cls - 1)]) return cls;
  return 4;
}

}  // namespace

std::array<double, 3> part_limits(const SectionPart& part, double fy, double alpha, double psi) {
  return limits_for(part, epsilon(fy), alpha, psi);
}

int part_class(const SectionPart& part, double fy, double alpha, double psi) {
  if (part.kind == PartKind::internal && alpha <= 0) return 1;  // the part is not in compression
  return class_within(part.ratio(), part_limits(part, fy, alpha, psi));
}

Classification classify(const Section& s, double fy, double N, double My) { return SectionClassifier(s, fy)(N, My); }

SectionClassifier::SectionClassifier(const Section& s, double fy) : section_(&s), fy_(fy), eps_(epsilon(fy)) {
  plates_.reserve(s.parts.size());
  for (const SectionPart& part : s.parts) {
    Plate p;
    p.part = &part;
    p.web = part.kind == PartKind::internal && is_web(part);
    if (!p.web) {
      // Taken in uniform compression (alpha = psi = 1), whatever the forces.
      const auto limits = limits_for(part, eps_, 1.0, 1.0);
      p.section_class = class_within(part.ratio(), limits);
      p.class3 = part.ratio() / limits[2];
    }
    plates_.push_back(p);
  }
}

Classification SectionClassifier::operator()(double N, double My) const {
  const Section& s = *section_;
  Classification result;
  if (plates_.empty()) {
    result.section_class = 3;
    result.governing_part = "section given by properties: elastic resistance";
    return result;
  }
  const double compression = -N;  // compression positive from here on
  for (const Plate& plate : plates_) {
    int cls = plate.section_class;
    double class3 = plate.class3;
    if (plate.web) {
      const SectionPart& part = *plate.part;
      // Plastic neutral axis of a symmetric web under N and M: alpha = 0.5 (1 + N / (fy c t)).
      double alpha = std::clamp(0.5 * (1.0 + compression / (fy_ * part.c * part.t)), 0.0, 1.0);
      // Elastic stresses at the web ends, compression positive: N/A +- M (c/2) / Iy.
      const double axial = compression / s.A;
      const double bending = s.Iy > 0 ? std::abs(My) * 0.5 * part.c / s.Iy : 0.0;
      const double sigma1 = axial + bending, sigma2 = axial - bending;
      if (sigma1 <= 0) alpha = 0.0;  // the whole web is in tension
      double psi = sigma1 > 0 ? sigma2 / sigma1 : 1.0;
      if (std::abs(compression) < 1e-9 && std::abs(My) < 1e-9) alpha = 1.0, psi = 1.0;  // unloaded: take compression
      // As part_class, with the class 3 margin kept.
      const bool in_tension = alpha <= 0;
      const double ratio = part.ratio();
      const auto limits = in_tension ? std::array<double, 3>{} : limits_for(part, eps_, alpha, psi);
      cls = in_tension ? 1 : class_within(ratio, limits);
      class3 = in_tension ? 0.0 : ratio / limits[2];
    }
    if (cls > result.section_class || (cls == result.section_class && class3 > result.class3_utilisation)) {
      result.section_class = std::max(cls, result.section_class);
      result.governing_part = plate.part->name;  // a view: no copy per part and station
      result.class3_utilisation = class3;
    }
  }
  if (result.governing_part.empty()) result.governing_part = s.parts.front().name;
  return result;
}

}  // namespace stepframe::analysis::en1993
