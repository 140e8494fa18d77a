// ANSI/AISC 360-16 member screening: each chapter against hand calculations
// with the Specification's equations (named beside each expected value; the
// equations as recalled, from memory), on section properties transcribed
// from the AISC Shapes Database v15.0 (American Institute of Steel
// Construction, 2017; the values of the AISC Steel Construction Manual, 15th
// ed., Part 1), rows of ../shared/reference/astm_shapes.csv as noted. Hand
// calculations are in kip and inch, E = 29000 ksi, G = 11200 ksi; the
// functions under test work in SI. Manual table values quoted as a second
// check are marked "from memory".

#include "frame_fixtures.hpp"
#include "stepframe/analysis/aisc360.hpp"
#include "stepframe/analysis/member_line.hpp"
#include "stepframe/analysis/section_shapes.hpp"
#include "stepframe/analysis/solve.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>
#include <string>

using namespace stepframe::analysis;
using namespace stepframe::analysis::aisc360;
using Catch::Matchers::Contains;

namespace {

constexpr double pi = std::numbers::pi;
constexpr double in = 0.0254, kip = 4448.2216152605, ksi = kip / (in * in), kip_in = kip * in;

Material astm_steel(double Fy_ksi) {
  Material m;
  m.name = "test ASTM steel";
  m.E = 29000 * ksi;
  m.G = 11200 * ksi;
  m.fy = Fy_ksi * ksi;
  m.density = 7850;
  return m;
}

/// A W shape with the database's properties (inch units in): web h = d - 2 kdes.
Section w_shape(double A, double d, double bf, double tw, double tf, double kdes, double Ix, double Zx, double Sx,
                double Iy, double Zy, double Sy, double J, double Cw) {
  Section s;
  s.designation = "W (database)";
  s.shape = SectionShape::rolled_i;
  s.A = A * in * in;
  s.depth = d * in;
  s.width = bf * in;
  s.Iy = Ix * std::pow(in, 4), s.Wpl_y = Zx * std::pow(in, 3), s.Wel_y = Sx * std::pow(in, 3);
  s.Iz = Iy * std::pow(in, 4), s.Wpl_z = Zy * std::pow(in, 3), s.Wel_z = Sy * std::pow(in, 3);
  s.J = J * std::pow(in, 4);
  s.Iw = Cw * std::pow(in, 6);
  s.parts = {{"web", PartKind::internal, (d - 2 * kdes) * in, tw * in},
             {"flange", PartKind::outstand, 0.5 * (bf - tw) * in, tf * in}};
  s.t_max = tf * in;
  return s;
}

// astm_shapes.csv rows W18X50, W12X65, W14X90, W8X31, W16X26.
Section W18X50() { return w_shape(14.7, 18, 7.5, 0.355, 0.57, 0.972, 800, 101, 88.9, 40.1, 16.6, 10.7, 1.24, 3040); }
Section W12X65() { return w_shape(19.1, 12.1, 12, 0.39, 0.605, 1.2, 533, 96.8, 87.9, 174, 44.1, 29.1, 2.18, 5780); }
Section W14X90() { return w_shape(26.5, 14, 14.5, 0.44, 0.71, 1.31, 999, 157, 143, 362, 75.6, 49.9, 4.06, 16000); }
Section W8X31() { return w_shape(9.13, 8, 8, 0.285, 0.435, 0.829, 110, 30.4, 27.5, 37.1, 14.1, 9.27, 0.536, 530); }
Section W16X26() { return w_shape(7.68, 15.7, 5.5, 0.25, 0.345, 0.747, 301, 44.2, 38.4, 9.59, 5.48, 3.49, 0.262, 565); }

double detail(const Details& d, const std::string& name) {
  for (const auto& [n, v] : d)
    if (n == name) return v;
  FAIL("no detail " << name);
  return 0;
}

const CheckResult& find(const std::vector<CheckResult>& checks, const std::string& name) {
  for (const auto& c : checks)
    if (c.check == name) return c;
  FAIL("no check " << name);
  return checks.front();
}

/// One member along x, pinned with twist held at both ends (the start also fixed along x).
FrameModel simple_member(const Section& s, const Material& m, double L) {
  FrameModel model;
  model.nodes = {{0, 0, 0}, {L, 0, 0}};
  model.sections = {s};
  model.materials = {m};
  model.elements = {{{0, 1}, 0, 0, 0.0}};
  model.supports = {test::support(0, {true, true, true, true, false, false}),
                    test::support(1, {false, true, true, true, false, false})};
  return model;
}

}  // namespace

TEST_CASE("AISC 360 Table B4.1: W18x50 is compact, W12x65 has noncompact flanges in flexure") {
  const Material a992 = astm_steel(50);
  const double root = std::sqrt(29000.0 / 50);  // sqrt(E/Fy) = 24.08
  const auto w18 = elements(W18X50(), a992.E, a992.fy);
  REQUIRE(w18.size() == 2);
  CHECK(w18[0].ratio == Approx(7.5 / (2 * 0.57)));        // bf/2tf = 6.58 (Manual 6.57, from memory)
  CHECK(w18[1].ratio == Approx((18 - 2 * 0.972) / 0.355));  // h/tw = 45.2
  CHECK(w18[0].lambda_p == Approx(0.38 * root));             // Table B4.1b case 10
  CHECK(w18[0].lambda_r == Approx(1.0 * root));
  CHECK(w18[1].lambda_p == Approx(3.76 * root));             // case 15
  CHECK(w18[1].lambda_r == Approx(5.70 * root));
  CHECK(w18[0].lambda_r_a == Approx(0.56 * root));           // Table B4.1a case 1
  CHECK(w18[1].lambda_r_a == Approx(1.49 * root));           // case 5
  CHECK(flexural_class(w18, "flange") == Slenderness::compact);
  CHECK(flexural_class(w18, "web") == Slenderness::compact);
  // In compression the web is slender: h/tw = 45.2 > 1.49 sqrt(E/Fy) = 35.9 (Table B4.1a case 5; the Manual
  // marks W18x50 "slender for compression", from memory); a W14x90 column is not (h/tw = 25.9).
  CHECK(slender_in_compression(w18));
  CHECK_FALSE(slender_in_compression(elements(W14X90(), a992.E, a992.fy)));
  const auto w12 = elements(W12X65(), a992.E, a992.fy);
  CHECK(w12[0].ratio == Approx(9.92).epsilon(1e-3));  // bf/2tf = 12 / 1.21
  CHECK(flexural_class(w12, "flange") == Slenderness::noncompact);  // 9.15 < 9.92 <= 24.1
  // Rectangular HSS walls b = B - 3t (B4.1b(d)), cases 6, 17, 19; round HSS cases 9, 20.
  const auto hss = elements(*find_catalogue_section("HSS8X4X1/4"), a992.E, a992.fy);
  REQUIRE(hss.size() == 2);
  CHECK(hss[0].lambda_p == Approx(1.12 * root));
  CHECK(hss[1].lambda_p == Approx(2.42 * root));
  CHECK(hss[0].lambda_r_a == Approx(1.40 * root));
  const auto pipe = elements(chs_section("pipe", {0.3, 0.004}), a992.E, a992.fy);
  CHECK(pipe[0].ratio == Approx(75.0));
  CHECK(pipe[0].lambda_r_a == Approx(0.11 * 29000 / 50));
  CHECK(pipe[0].lambda_p == Approx(0.07 * 29000 / 50));
  CHECK(slender_in_compression(pipe));  // 75 > 63.8
}

TEST_CASE("AISC 360 D2: tensile yielding of a W8x31, LRFD and ASD") {
  // (D2-1) Pn = Fy Ag = 50 x 9.13 = 456.5 kip; phi_t Pn = 0.90 Pn = 410.9 kip; Pn / Omega_t = 456.5 / 1.67 = 273.4 kip.
  const Strength t = tension(W8X31(), 50 * ksi);
  CHECK(t.Rn == Approx(456.5 * kip));
  CHECK(t.available(Method::lrfd) == Approx(410.85 * kip));
  CHECK(t.available(Method::asd) == Approx(273.35 * kip).epsilon(1e-4));
  CHECK_THAT(t.clause, Contains("rupture") && Contains("not checked"));
}

TEST_CASE("AISC 360 E3: flexural buckling of a W14x90 and of a slender W8x31") {
  const Material a992 = astm_steel(50);
  // W14x90, Lc = 15 ft about both axes: Lc/ry = 180 / 3.696 = 48.7; Fe = pi^2 E / (Lc/r)^2 (E3-4) = 120.7 ksi;
  // Fy/Fe <= 2.25, so Fcr = 0.658^(Fy/Fe) Fy (E3-2) = 42.1 ksi; Pn = Fcr Ag (E3-1) = 1115 kip; phi_c Pn = 1004 kip
  // (Manual Table 4-1a, W14x90 at 15 ft: 1000 kip, from memory).
  const Section w14 = W14X90();
  const double ry = std::sqrt(362 / 26.5), slender = 180 / ry;
  const double Fe = pi * pi * 29000 / (slender * slender), Fcr = std::pow(0.658, 50 / Fe) * 50;
  const Strength c = compression_strength(w14, a992, {15 * 12 * in, 15 * 12 * in, 15 * 12 * in});
  CHECK(detail(c.details, "Fe") == Approx(Fe * ksi).epsilon(1e-6));
  CHECK(detail(c.details, "Fcr") == Approx(Fcr * ksi).epsilon(1e-6));
  CHECK(c.Rn == Approx(Fcr * 26.5 * kip).epsilon(1e-6));
  CHECK(c.available(Method::lrfd) / kip == Approx(1000).epsilon(0.01));
  CHECK_THAT(c.clause, Contains("E3") && Contains("E3-2"));
  // W8x31, Lc = 40 ft: Lc/ry = 480 / 2.016 = 238 > 4.71 sqrt(E/Fy) = 113, so Fcr = 0.877 Fe (E3-3).
  const Section w8 = W8X31();
  const double ry8 = std::sqrt(37.1 / 9.13), Fe8 = pi * pi * 29000 / std::pow(480 / ry8, 2);
  const Strength c8 = compression_strength(w8, a992, {480 * in, 480 * in, 480 * in});
  CHECK(detail(c8.details, "Fcr") == Approx(0.877 * Fe8 * ksi).epsilon(1e-6));
  CHECK_THAT(c8.clause, Contains("E3-3"));
  // ASD: Pn / 1.67 (E1).
  CHECK(c8.available(Method::asd) == Approx(c8.Rn / 1.67));
}

TEST_CASE("AISC 360 E4: flexural-torsional buckling of a C8x11.5 by (E4-3)") {
  // astm_shapes.csv row C8X11.5: A 3.37, Ix 32.5, Iy 1.31, J 0.13, Cw 16.5, x 0.572, eo 0.697 (ro 3.41, H 0.862).
  // The shear centre lies xo = x + eo = 1.269 in from the centroid on the axis of symmetry (the section's y).
  Section c;
  c.designation = "C8X11.5 (database)";
  c.shape = SectionShape::channel;
  c.A = 3.37 * in * in, c.depth = 8 * in, c.width = 2.26 * in;
  c.Iy = 32.5 * std::pow(in, 4), c.Iz = 1.31 * std::pow(in, 4), c.J = 0.13 * std::pow(in, 4);
  c.Iw = 16.5 * std::pow(in, 6);
  c.Wel_y = 8.14 * std::pow(in, 3), c.Wpl_y = 9.63 * std::pow(in, 3);
  c.Wel_z = 0.775 * std::pow(in, 3), c.Wpl_z = 1.57 * std::pow(in, 3);
  c.shear_centre_y = -(0.572 + 0.697) * in;
  c.parts = {{"web", PartKind::internal, (8 - 2 * 0.938) * in, 0.22 * in}, {"flange", PartKind::outstand, 1.8 * in, 0.39 * in}};
  const Material a36 = astm_steel(36);
  const double L = 8 * 12;  // Lc = 8 ft about every axis and for twist [in]
  const double xo = 0.572 + 0.697, ro2 = xo * xo + (32.5 + 1.31) / 3.37, H = 1 - xo * xo / ro2;  // (E4-11), (E4-10)
  CHECK(std::sqrt(ro2) == Approx(3.41).epsilon(0.002));  // database ro
  CHECK(H == Approx(0.862).epsilon(0.002));                // database H
  const double Fex = pi * pi * 29000 / std::pow(L / std::sqrt(32.5 / 3.37), 2);                     // (E4-7)
  const double Fez = (pi * pi * 29000 * 16.5 / (L * L) + 11200 * 0.13) / (3.37 * ro2);             // (E4-9)
  const double Fe = (Fex + Fez) / (2 * H) * (1 - std::sqrt(1 - 4 * Fex * Fez * H / std::pow(Fex + Fez, 2)));  // (E4-3)
  const Strength s = compression_strength(c, a36, {L * in, L * in, L * in});
  CHECK(detail(s.details, "Fe_E4") == Approx(Fe * ksi).epsilon(1e-6));
  // Flexural buckling about the minor axis is lower still here (Fey = 12.1 ksi < Fe = 48.9 ksi): E3 governs.
  const double Fey = pi * pi * 29000 / std::pow(L / std::sqrt(1.31 / 3.37), 2);
  CHECK(detail(s.details, "Fe") == Approx(std::min(Fe, Fey) * ksi).epsilon(1e-6));
  CHECK_THAT(s.clause, Contains("E3"));
  // Braced about the minor axis at 3 ft but free to twist over 8 ft: Fey = 85.8 ksi, and the
  // flexural-torsional mode (Fe = 48.9 ksi) governs and E4 is named.
  const Strength short_strut = compression_strength(c, a36, {L * in, 36 * in, L * in});
  const double Fe_s = Fe;
  CHECK(detail(short_strut.details, "Fe") == Approx(Fe_s * ksi).epsilon(1e-6));
  CHECK_THAT(short_strut.clause, Contains("E4") && Contains("flexural-torsional"));
  CHECK(detail(short_strut.details, "Fcr") == Approx(critical_stress(36, Fe_s) * ksi).epsilon(1e-6));  // (E3-2) with Fe of E4
}

TEST_CASE("AISC 360 E7: a slender round HSS takes the effective area of (E7-7)") {
  // D = 300 mm, t = 4 mm, Fy = 50 ksi: D/t = 75 between 0.11 E/Fy = 63.8 and 0.45 E/Fy = 261:
  // Ae = [0.038 E / (Fy D/t) + 2/3] Ag (E7-7); Pn = Fcr Ae (E7-1).
  const Section pipe = chs_section("pipe", {0.3, 0.004});
  const Material m = astm_steel(50);
  const Strength s = compression_strength(pipe, m, {3.0, 3.0, 3.0});
  const double Ae = (0.038 * 29000 / (50 * 75) + 2.0 / 3.0) * pipe.A;
  CHECK(detail(s.details, "Ae") == Approx(Ae));
  CHECK(s.Rn == Approx(detail(s.details, "Fcr") * Ae));
  CHECK_THAT(s.clause, Contains("E7"));
  // A slender-web welded I: the web's effective width by (E7-3) with c1 = 0.18, c2 = 1.31 (Table E7.1 (a)).
  const Section plate_girder = welded_i_section("girder", {0.9, 0.006, 0.25, 0.02, 0.25, 0.02});
  const Strength g = compression_strength(plate_girder, m, {2.0, 2.0, 2.0});
  const double h = 0.86, t = 0.006, lambda = h / t, lambda_r = 1.49 * std::sqrt(29000.0 / 50);
  const double Fcr = detail(g.details, "Fcr"), Fel = std::pow(1.31 * lambda_r / lambda, 2) * m.fy;  // (E7-5)
  const double be = h * (1 - 0.18 * std::sqrt(Fel / Fcr)) * std::sqrt(Fel / Fcr);                     // (E7-3)
  CHECK(detail(g.details, "be_web") == Approx(be).epsilon(1e-9));
  CHECK(detail(g.details, "Ae") == Approx(plate_girder.A - (h - be) * t).epsilon(1e-9));
}

TEST_CASE("AISC 360 F1 (F1-1): Cb of common moment diagrams") {
  CHECK(lateral_torsional_factor(1, 1, 1, 1) == Approx(1.0));  // uniform moment
  // Simple span under uniform load, quarter points 0.75 / 1 / 0.75 of Mmax: Cb = 12.5 / 11 = 1.136
  // (Manual Table 3-1: 1.14, from memory).
  CHECK(lateral_torsional_factor(1, 0.75, 1, 0.75) == Approx(12.5 / 11));
  // Linear from M to zero: 12.5 / (2.5 + 2.25 + 2 + 0.75) = 1.667 (Table 3-1: 1.67, from memory).
  CHECK(lateral_torsional_factor(1, 0.75, 0.5, 0.25) == Approx(1.6667).epsilon(1e-4));
}

TEST_CASE("AISC 360 F2: W18x50 yielding (F.1-1A) and lateral-torsional buckling (F2-2, F2-3)") {
  const Section w = W18X50();
  const Material a992 = astm_steel(50);
  // Lb below Lp: Mn = Mp = Fy Zx (F2-1) = 5050 kip-in = 421 kip-ft; phi Mn = 379 kip-ft; Mn / Omega = 252 kip-ft
  // (AISC Design Examples v15.1, Example F.1-1A/B; aisc360_worked_examples.md).
  const Strength y = major_flexure(w, a992, 0, 1.0);
  CHECK(y.Rn / kip_in == Approx(5050).epsilon(1e-6));
  CHECK(y.available(Method::lrfd) / (12 * kip_in) == Approx(379).epsilon(0.002));
  CHECK(y.available(Method::asd) / (12 * kip_in) == Approx(252).epsilon(0.002));
  CHECK_THAT(y.clause, Contains("F2-1"));
  // Lp = 1.76 ry sqrt(E/Fy) (F2-5) = 69.9 in = 5.83 ft; rts^2 = sqrt(Iy Cw) / Sx (F2-7); c = 1 (F2-8a);
  // Lr (F2-6) = 203 in = 16.9 ft (Manual Table 3-2, W18x50: Lp = 5.83 ft, Lr = 16.9 ft, from memory).
  const double ry = std::sqrt(40.1 / 14.7), root = std::sqrt(29000.0 / 50);
  const double Lp = 1.76 * ry * root, rts = std::sqrt(std::sqrt(40.1 * 3040) / 88.9), ho = 18 - 0.57;
  const double jc = 1.24 / (88.9 * ho), k = 35.0 / 29000;
  const double Lr = 1.95 * rts * 29000 / 35 * std::sqrt(jc + std::sqrt(jc * jc + 6.76 * k * k));
  const Strength b = major_flexure(w, a992, 120 * in, 1.0);
  CHECK(detail(b.details, "Lp") == Approx(Lp * in).epsilon(1e-9));
  CHECK(detail(b.details, "Lr") == Approx(Lr * in).epsilon(1e-9));
  CHECK(Lp / 12 == Approx(5.83).epsilon(0.003));
  CHECK(Lr / 12 == Approx(16.9).epsilon(0.005));
  // Lb = 10 ft: Mn = Cb [Mp - (Mp - 0.7 Fy Sx)(Lb - Lp)/(Lr - Lp)] (F2-2).
  const double Mp = 5050, Mn2 = Mp - (Mp - 0.7 * 50 * 88.9) * (120 - Lp) / (Lr - Lp);
  CHECK(b.Rn / kip_in == Approx(Mn2).epsilon(1e-9));
  CHECK_THAT(b.clause, Contains("F2-2"));
  // Cb = 1.14 lifts it, capped at Mp.
  CHECK(major_flexure(w, a992, 120 * in, 1.14).Rn / kip_in == Approx(std::min(Mp, 1.14 * Mn2)));
  // Lb = 25 ft > Lr: Fcr = Cb pi^2 E / (Lb/rts)^2 sqrt(1 + 0.078 Jc/(Sx ho) (Lb/rts)^2) (F2-4), Mn = Fcr Sx (F2-3).
  const double lr = 300 / rts, Fcr = pi * pi * 29000 / (lr * lr) * std::sqrt(1 + 0.078 * jc * lr * lr);
  const Strength e = major_flexure(w, a992, 300 * in, 1.0);
  CHECK(e.Rn / kip_in == Approx(Fcr * 88.9).epsilon(1e-9));
  CHECK_THAT(e.clause, Contains("F2-3"));
}

TEST_CASE("AISC 360 F3 and F6: W12x65 flange local buckling about both axes") {
  const Section w = W12X65();
  const Material a992 = astm_steel(50);
  const double root = std::sqrt(29000.0 / 50), lambda = 12 / (2 * 0.605), lp = 0.38 * root, lr = 1.0 * root;
  // (F3-1) Mn = Mp - (Mp - 0.7 Fy Sx)(lambda - lambda_pf)/(lambda_rf - lambda_pf) = 4750 kip-in;
  // phi Mn = 356 kip-ft (Manual Table 3-2 for W12x65, which is noncompact in flexure: 356, from memory).
  const double Mp = 50 * 96.8, Mn = Mp - (Mp - 0.7 * 50 * 87.9) * (lambda - lp) / (lr - lp);
  const Strength f = major_flexure(w, a992, 0, 1.0);
  CHECK(f.Rn / kip_in == Approx(Mn).epsilon(1e-9));
  CHECK(f.available(Method::lrfd) / (12 * kip_in) == Approx(356).epsilon(0.002));
  CHECK_THAT(f.clause, Contains("F3") && Contains("F3-1"));
  // Minor axis: Mp = min(Fy Zy, 1.6 Fy Sy) (F6-1) = 2205; (F6-2) with 0.7 Fy Sy.
  const double Mpy = std::min(50 * 44.1, 1.6 * 50 * 29.1), Mny = Mpy - (Mpy - 0.7 * 50 * 29.1) * (lambda - lp) / (lr - lp);
  const Strength m = minor_flexure(w, a992);
  CHECK(m.Rn / kip_in == Approx(Mny).epsilon(1e-9));
  CHECK_THAT(m.clause, Contains("F6-2"));
  // A compact W18x50 about its minor axis: Mn = Fy Zy = 830 kip-in (F6-1; 1.6 Fy Sy = 856 does not bind).
  CHECK(minor_flexure(W18X50(), a992).Rn / kip_in == Approx(830));
}

TEST_CASE("AISC 360 F7 and F8: hollow sections") {
  const Material m = astm_steel(50);
  // HSS8x8x1/4 (catalogue section, design wall 0.93 x 0.25 in): b/t = (8 - 3 t)/t = 33.4, between
  // lambda_p = 1.12 sqrt(E/Fy) = 27.0 and lambda_r = 1.40 sqrt(E/Fy) = 33.7: noncompact flange,
  // Mn = Mp - (Mp - Fy S)(3.57 b/t sqrt(Fy/E) - 4.0) (F7-2).
  const auto hss = find_catalogue_section("HSS8X8X1/4");
  REQUIRE(hss);
  const double t = hss->parts[1].t, bt = (8 * in - 3 * t) / t;
  CHECK(bt == Approx(hss->parts[1].ratio()));
  const double Mp = m.fy * hss->Wpl_y, My = m.fy * hss->Wy();
  const Strength f = major_flexure(*hss, m, 0, 1.0);
  CHECK(f.Rn == Approx(Mp - (Mp - My) * (3.57 * bt * std::sqrt(50.0 / 29000) - 4.0)).epsilon(1e-9));
  CHECK_THAT(f.clause, Contains("F7-2"));
  // Slender flange: an 8 x 8 x 3/16 wall (t = 0.174 in): be = 1.92 t sqrt(E/Fy) [1 - 0.38/(b/t) sqrt(E/Fy)] (F7-4),
  // Mn = Fy Se (F7-3); Se with the lost flange width, by statics of the thin-walled box.
  const Section thin = rhs_section("HSS8x8x3/16", {8 * in, 8 * in, 0.174 * in, 0.348 * in, 0.174 * in});
  const Strength s = major_flexure(thin, m, 0, 1.0);
  const double tt = 0.174 * in, b = 8 * in - 3 * tt, root = std::sqrt(29000.0 / 50);
  const double be = 1.92 * tt * root * (1 - 0.38 / (b / tt) * root);
  CHECK(detail(s.details, "be") == Approx(be).epsilon(1e-9));
  const double dA = (b - be) * tt, d1 = 0.5 * (8 * in - tt), e = dA * d1 / (thin.A - dA);
  const double Se = (thin.Iy - dA * d1 * d1 - (thin.A - dA) * e * e) / (4 * in + e);
  CHECK(s.Rn == Approx(m.fy * Se).epsilon(1e-9));
  CHECK(Se < thin.Wy());
  // Round HSS, D/t = 75 (noncompact: 40.6 < 75 <= 180): Mn = (0.021 E/(D/t) + Fy) S (F8-2), below Mp.
  const Section pipe = chs_section("pipe", {0.3, 0.004});
  const Strength r = major_flexure(pipe, m, 0, 1.0);
  CHECK(r.Rn == Approx((0.021 * 29000 / 75 + 50) * ksi * pipe.Wy()).epsilon(1e-9));
  CHECK(r.Rn < m.fy * pipe.Wpl_y);
  CHECK_THAT(r.clause, Contains("F8-2"));
}

TEST_CASE("AISC 360 G2, G4, G5: shear strength") {
  const Material a992 = astm_steel(50);
  // W18x50: h/tw = 45.2 <= 2.24 sqrt(E/Fy) = 53.9: phi_v = 1.00, Cv1 = 1.0 (G2.1(a), G2-2);
  // Vn = 0.6 Fy Aw Cv1 (G2-1) with Aw = d tw = 6.39 in2: 191.7 kip (Manual Table 3-2, phi Vn = 192 kip, from memory).
  const Strength v = major_shear(W18X50(), a992, 1.0);
  CHECK(v.Rn / kip == Approx(0.6 * 50 * 18 * 0.355));
  CHECK(v.available(Method::lrfd) == Approx(v.Rn));
  CHECK(v.available(Method::asd) == Approx(v.Rn / 1.50));
  // W16x26: h/tw = 56.8 > 53.9, so G2.1(b): phi_v = 0.90; kv = 5.34, h/tw <= 1.10 sqrt(kv E/Fy) = 61.2: Cv1 = 1.0
  // (G2-3); Vn = 0.6 x 50 x 15.7 x 0.25 = 117.8 kip, phi Vn = 106 kip (Manual Table 3-2, 106 kip, from memory).
  const Strength v16 = major_shear(W16X26(), a992, 1.0);
  CHECK(v16.factors.phi == 0.90);
  CHECK(v16.available(Method::lrfd) / kip == Approx(0.9 * 117.75));
  // A deep thin web, h/tw = 150: Cv1 = 1.10 sqrt(kv E/Fy) / (h/tw) (G2-4).
  const Section girder = welded_i_section("girder", {0.924, 0.006, 0.25, 0.012, 0.25, 0.012});
  const Strength vg = major_shear(girder, a992, 1.0);
  CHECK(detail(vg.details, "Cv1") == Approx(1.10 * std::sqrt(5.34 * 29000 / 50) / 150).epsilon(1e-9));
  // G2.2 Cv2 (G2-9 to G2-11) with kv = 5: limits 59.2 and 73.8.
  CHECK(shear_buckling_coefficient(50, 5, 29000, 50) == 1.0);
  CHECK(shear_buckling_coefficient(65, 5, 29000, 50) == Approx(1.10 * std::sqrt(5 * 29000.0 / 50) / 65));
  CHECK(shear_buckling_coefficient(90, 5, 29000, 50) == Approx(1.51 * 5 * 29000 / (90.0 * 90 * 50)));
  // G4 rectangular HSS: Aw = 2 h t, h = H - 3t (G4-1).
  const auto hss = find_catalogue_section("HSS8X4X1/4");
  const double t = hss->parts[0].t;
  CHECK(major_shear(*hss, a992, 1.0).Rn == Approx(0.6 * a992.fy * 2 * (8 * in - 3 * t) * t));
  // G5 round HSS: Vn = Fcr Ag / 2 (G5-1), Fcr = 0.6 Fy for a stocky tube (G5-2a/b exceed it).
  const Section pipe = chs_section("pipe", {0.2, 0.008});
  CHECK(major_shear(pipe, a992, 2.0).Rn == Approx(0.6 * a992.fy * pipe.A / 2));
}

TEST_CASE("AISC 360 H1 and H3: interaction equations and HSS torsion") {
  // (H1-1a) Pr/Pc >= 0.2: 0.5 + 8/9 (0.3 + 0.1) = 0.856; (H1-1b) Pr/Pc < 0.2: 0.1/2 + 0.5 + 0.2 = 0.75.
  CHECK(interaction(0.5, 0.3, 0.1) == Approx(0.5 + 8.0 / 9 * 0.4));
  CHECK(interaction(0.1, 0.5, 0.2) == Approx(0.75));
  // H3.1 HSS6x6x3/8, A500 Gr. C (Fy = 50 ksi), t = 0.349 in: C = 2 (B - t)(H - t) t - 4.5 (4 - pi) t^3 = 22.1 in3
  // (astm_shapes.csv HSS6X6X3/8: C = 22.1); h/t = 14.2 <= 2.45 sqrt(E/Fy): Fcr = 0.6 Fy (H3-3); Tn = Fcr C (H3-1).
  const auto hss = find_catalogue_section("HSS6X6X3/8");
  REQUIRE(hss);
  const Strength t = torsional_strength(*hss, astm_steel(50), 3.0);
  CHECK(detail(t.details, "C") / std::pow(in, 3) == Approx(22.1).epsilon(0.003));
  CHECK(t.Rn == Approx(0.6 * 50 * ksi * detail(t.details, "C")));
  // Round: C = pi (D - t)^2 t / 2 (H3.1 user note), Fcr = 0.6 Fy for a stocky tube (H3-2a/b).
  const Section pipe = chs_section("pipe", {0.2, 0.008});
  const Strength tr = torsional_strength(pipe, astm_steel(50), 2.0);
  CHECK(tr.Rn == Approx(0.6 * 50 * ksi * pi * 0.192 * 0.192 * 0.008 / 2));
}

TEST_CASE("AISC 360 member check: a W18x50 beam-column, Cb from its own diagram, B1 and H1-1a") {
  // 20 ft W18x50 (database properties), pinned with fork ends, no bracing between (Lb = L), under a
  // uniform load of 2 kip/ft and 150 kip compression. Cb of (F1-1) from the computed diagram = 1.136.
  // The member alone (B2 = 1: a member of a braced frame); check_members' B2 is tested below.
  const Section w = W18X50();
  const Material a992 = astm_steel(50);
  const double L = 240 * in, P = 150 * kip, q = 2 * kip / (12 * in);
  FrameModel model = simple_member(w, a992, L);
  LoadCase lc;
  lc.name = "LRFD";
  lc.node_loads = {{1, Eigen::Vector3d(-P, 0, 0), Eigen::Vector3d::Zero()}};
  lc.element_loads = {{0, Eigen::Vector3d(0, 0, -q)}};
  model.cases = {lc};
  const auto results = solve(model);
  MemberInput member;
  member.section = &model.sections[0];
  member.material = a992;
  member.length = L;
  const auto line = member_line(model, results[0], member_chains(model)[0], LineDetail::stations);
  const auto checks = check_member(member, line, "LRFD", Method::lrfd);
  const auto& f = find(checks, "F major flexure");
  CHECK(detail(f.details, "Cb") == Approx(12.5 / 11).epsilon(1e-3));
  // Lb = 20 ft > Lr = 16.9 ft: F2-3 with Cb.
  CHECK_THAT(f.clause, Contains("F2-3"));
  const double Cb = detail(f.details, "Cb");
  const Strength b = major_flexure(w, a992, L, Cb);
  // B1 = Cm / (1 - Pr/Pe1) (A-8-3), Cm = 1.0 with the transverse load, Pe1 = pi^2 E Ix / L^2 (A-8-5).
  const double Pe1 = pi * pi * 29000 * 800 / (240.0 * 240) * kip, B1 = 1 / (1 - P / Pe1);
  const auto& h = find(checks, "H interaction");
  CHECK(detail(h.details, "B1x") == Approx(B1).epsilon(1e-6));
  const Strength c = compression_strength(w, a992, {L, L, L});
  const double Mu = q * L * L / 8 * B1;
  const double pr = P / c.available(Method::lrfd), mx = Mu / b.available(Method::lrfd);
  REQUIRE(pr >= 0.2);
  CHECK(h.utilisation == Approx(pr + 8.0 / 9.0 * mx).epsilon(1e-4));  // (H1-1a) at mid-span
  CHECK(detail(h.details, "eq_H1_1a") == Approx(h.utilisation));
  CHECK(find(checks, "E compression").limit == Approx(c.available(Method::lrfd)));
  CHECK(find(checks, "G shear").value == Approx(q * L / 2).epsilon(1e-6));
}

TEST_CASE("AISC 360 effective length method: allowed while B2 <= 1.5, B2 from the lowest sway mode") {
  // (A-8-6) B2 = 1 / (1 - alpha Pstory/Pe,story), alpha = 1.0 (LRFD) or 1.6 (ASD); at a load factor of 4:
  // B2 = 1.333 (LRFD, allowed) and 1.667 (ASD, not allowed: Appendix 7, 7.2.1(b)).
  CHECK(sway_amplifier(4, Method::lrfd) == Approx(4.0 / 3));
  CHECK(sway_amplifier(4, Method::asd) == Approx(1 / (1 - 0.4)));
  // A 12 ft W8x31 flagpole column: it buckles by swaying, Pcr = pi^2 E Iy / (2 L)^2 = 127.9 kip (Euler,
  // K = 2; Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., 1961, 2.1); 32 kip on it: alpha = 4.0.
  const Material a992 = astm_steel(50);
  const double L = 144 * in, Pcr = pi * pi * 29000 * 37.1 / std::pow(2 * 144.0, 2) * kip;
  FrameModel column;
  column.nodes = {{0, 0, 0}, {0, 0, L}};
  column.sections = {W8X31()};
  column.materials = {a992};
  column.elements = {{{0, 1}, 0, 0, 0.0}};
  column.supports = {test::support(0, test::fixed_all)};
  LoadCase lc;
  lc.name = "P";
  lc.node_loads = {{1, Eigen::Vector3d(0, 0, -32 * kip), Eigen::Vector3d::Zero()}};
  column.cases = {lc};
  const auto results = solve(column);
  REQUIRE(results[0].alpha_cr);
  CHECK(*results[0].alpha_cr == Approx(Pcr / (32 * kip)).epsilon(0.01));
  const auto lrfd = check_effective_length_method(column, {&results[0]}, Method::lrfd);
  REQUIRE(lrfd.size() == 1);
  CHECK(detail(lrfd[0].details, "sway_mode") == 1.0);
  CHECK(detail(lrfd[0].details, "B2") == Approx(1 / (1 - 32 * kip / Pcr)).epsilon(0.01));
  CHECK(lrfd[0].pass);
  CHECK(lrfd[0].member == whole_frame);
  CHECK_FALSE(check_effective_length_method(column, {&results[0]}, Method::asd)[0].pass);
  CHECK_THAT(lrfd[0].clause, Contains("effective length method") && Contains("direct analysis"));
  // The same member's B2 reaches its other checks: the required axial force is B2 P.
  const auto checks = check_members(column, {&results[0]}, {}, Method::lrfd);
  CHECK(find(checks, "E compression").value == Approx(32 * kip * detail(lrfd[0].details, "B2")).epsilon(1e-6));
  // A member pinned at both ends buckles without sway: no mode sways, and the largest computed alpha is used.
  FrameModel strut = simple_member(W8X31(), a992, L);
  strut.cases = {lc};
  strut.cases[0].node_loads = {{1, Eigen::Vector3d(-32 * kip, 0, 0), Eigen::Vector3d::Zero()}};
  const auto strut_results = solve(strut);
  const auto braced = check_effective_length_method(strut, {&strut_results[0]}, Method::lrfd);
  REQUIRE(braced.size() == 1);
  CHECK(detail(braced[0].details, "sway_mode") == 0.0);
  CHECK(detail(braced[0].details, "alpha_sway") == Approx(strut_results[0].buckling_modes.back().alpha));
}

TEST_CASE("AISC 360 F9, F10, G3, G6: tees, single angles and weak-axis shear") {
  const Material m = astm_steel(50);
  // Tee (welded dimensions, 8 in deep, 6 in x 0.5 in flange, 0.3 in stem), stem in tension, Lb = 0:
  // Mn = Mp = Fy Zx <= 1.6 My (F9-2), My = Fy Sx.
  const Section tee = tee_section("T8", {8 * in, 6 * in, 0.3 * in, 0.5 * in, 0.0});
  const Strength tension_stem = major_flexure(tee, m, 0, 1.0, false);
  CHECK(tension_stem.Rn == Approx(std::min(m.fy * tee.Wpl_y, 1.6 * m.fy * tee.Wy())));
  // Stem in compression: Mn = My (F9-4), or less by stem local buckling, d/tw = 26.7 between
  // 0.84 sqrt(E/Fy) = 20.2 and 1.52 sqrt(E/Fy) = 36.6: Fcr = (1.43 - 0.515 (d/tw) sqrt(Fy/E)) Fy (F9-18).
  const double dt = 8 / 0.3, Fcr = (1.43 - 0.515 * dt * std::sqrt(50.0 / 29000)) * m.fy;
  const Strength compression_stem = major_flexure(tee, m, 0, 1.0, true);
  CHECK(compression_stem.Rn == Approx(std::min(m.fy, Fcr) * tee.Wy()));
  CHECK_THAT(compression_stem.clause, Contains("F9-18"));
  // G3: Vn = 0.6 Fy d tw Cv2 (G3-1), kv = 1.2: d/tw = 26.7 <= 1.10 sqrt(kv E/Fy) = 29.0, Cv2 = 1 (G2-9).
  CHECK(major_shear(tee, m, 1.0).Rn == Approx(0.6 * m.fy * 8 * in * 0.3 * in));
  // Equal-leg angle L4x4x1/2 about its major principal axis, Lb = 6 ft, Cb = 1:
  // Mcr = 9 E Ag rz t Cb / (8 Lb) (F10-4); My/Mcr <= 1: Mn = (1.92 - 1.17 sqrt(My/Mcr)) My <= 1.5 My (F10-2).
  const auto angle = find_catalogue_section("L4X4X1/2");
  REQUIRE(angle);
  const double Lb = 72 * in, My = m.fy * angle->Wy();
  const double Mcr = 9 * m.E * angle->A * angle->iz() * 0.5 * in / (8 * Lb);
  REQUIRE(My / Mcr <= 1.0);
  const Strength a = major_flexure(*angle, m, Lb, 1.0);
  CHECK(a.Rn == Approx(std::min(1.5 * My, (1.92 - 1.17 * std::sqrt(My / Mcr)) * My)));
  CHECK(detail(a.details, "Mcr") == Approx(Mcr));
  // About the minor principal axis: yielding only, Mn = 1.5 My (F10-1); b/t = 8 is compact (0.54 sqrt(E/Fy) = 13).
  CHECK(minor_flexure(*angle, m).Rn == Approx(1.5 * m.fy * angle->Wz()));
  // An unequal-leg angle bent about its major axis needs beta_w: outside this screening.
  CHECK_FALSE(major_flexure(*find_catalogue_section("L6X4X1/2"), m, Lb, 1.0).covered);
  // G6 weak-axis shear of a W18x50: 0.6 Fy (2 bf tf) Cv2 (G6-1), kv = 1.2, bf/2tf = 6.58: Cv2 = 1; 256.5 kip.
  CHECK(minor_shear(W18X50(), m, 1.0).Rn / kip == Approx(0.6 * 50 * 2 * 7.5 * 0.57));
}

TEST_CASE("AISC 360 H3.2: an HSS under torsion above 0.2 Tc takes (H3-6)") {
  // A 10 ft HSS6x6x3/8 cantilever in A500 Gr. C (Fy = 50 ksi) under a 200 kip-in torque and a 5 kip end load.
  const auto hss = find_catalogue_section("HSS6X6X3/8");
  REQUIRE(hss);
  const Material m = astm_steel(50);
  const double L = 120 * in, T = 200 * kip_in, V = 5 * kip;
  FrameModel model;
  model.nodes = {{0, 0, 0}, {L, 0, 0}};
  model.sections = {*hss};
  model.materials = {m};
  model.elements = {{{0, 1}, 0, 0, 0.0}};
  model.supports = {test::support(0, test::fixed_all)};
  LoadCase lc;
  lc.name = "T";
  lc.node_loads = {{1, Eigen::Vector3d(0, 0, -V), Eigen::Vector3d(T, 0, 0)}};
  model.cases = {lc};
  const auto results = solve(model);
  MemberInput member;
  member.section = &model.sections[0];
  member.material = m;
  member.length = L;
  member.cantilever = true;
  const auto line = member_line(model, results[0], member_chains(model)[0], LineDetail::stations);
  const auto checks = check_member(member, line, "T", Method::lrfd);
  const Strength tor = torsional_strength(*hss, m, L);
  const double Tc = tor.available(Method::lrfd), Tr_Tc = T / Tc;
  REQUIRE(Tr_Tc > 0.2);
  CHECK(find(checks, "H3 torsion").utilisation == Approx(Tr_Tc).epsilon(1e-6));
  // At the root: Mr = V L; (H3-6) (Pr/Pc + Mr/Mc) + (Vr/Vc + Tr/Tc)^2 with Pr = 0.
  const double Mc = major_flexure(*hss, m, L, 1.0).available(Method::lrfd), Vc = major_shear(*hss, m, L).available(Method::lrfd);
  const double expected = V * L / Mc + std::pow(V / Vc + Tr_Tc, 2);
  const auto& h = find(checks, "H interaction");
  CHECK_THAT(h.clause, Contains("H3-6"));
  CHECK(h.utilisation == Approx(expected).epsilon(1e-4));
}
