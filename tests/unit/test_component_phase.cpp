// The phase of each component (pattern/component_phase.hpp) against closed forms worked out by hand.
// Sources named beside each check: conventions.md "Phase centre" (a source displaced by d has its
// far field multiplied by exp(+j k r.d), exp(+j w t)); IEEE Std 145-2013 and Balanis, Antenna
// Theory, sec. 2.12 (E_R = (Et + j Ep)/sqrt2, E_L = (Et - j Ep)/sqrt2); Ludwig 1973 (Ludwig-3).
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "exports/cut_phase.hpp"
#include "exports/figure_text.hpp"
#include "importers/far_field_csv.hpp"
#include "pattern/component_phase.hpp"
#include "pattern/cut.hpp"
#include "pattern/install.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;

namespace {

// Wrap degrees into (-180, 180].
double wrap180(double d) {
    d = std::remainder(d, 360.0);
    return d <= -180 ? d + 360 : d;
}

// The difference of two phases, wrapped: 179.9 and -179.9 differ by 0.2 deg.
double phase_gap(double a, double b) { return std::abs(wrap180(a - b)); }

// A short dipole along z moved by d (wavelengths) along z: every sample times exp(+j 2 pi r.d).
FarFieldSet displaced_dipole(double d_wl, double step_deg) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(a, step_deg, 1e9);
    const Grid& g = s.grid;
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            const cplx turn = std::polar(1.0, 2 * pi * d_wl * std::cos(g.theta.value_deg(i) * deg));
            s.frequencies[0].e_theta[g.index(i, j)] *= turn;
            s.frequencies[0].e_phi[g.index(i, j)] *= turn;
        }
    return s;
}

}  // namespace

TEST_CASE("the phase of E_theta along a cut of a displaced source is k d cos(theta)", "[phase]") {
    // conventions.md "Phase centre": exp(+j k r.d); d = 0.3 wavelength along z, so the phase of
    // E_theta (sin(theta) > 0 for the short dipole, Balanis sec. 4.2) is 360 * 0.3 cos(theta) deg.
    FarFieldSet s = displaced_dipole(0.3, 2);
    auto i = install_pattern(s, InstallRequest{});  // estimates the interpolation centre, as every reader does
    REQUIRE(i);
    const CutSamples c = sample_cut(*i, 0, CutSpec::phi_cut(0), 0.5);
    const std::vector<double> ph = cut_phase_deg(*i, c, Component::theta);
    int checked = 0;
    for (std::size_t k = 0; k < ph.size(); ++k) {
        const double t = std::abs(c.angle_deg[k]);
        if (t < 5 || t > 175) continue;  // near the nulls on the axis
        REQUIRE_FALSE(std::isnan(ph[k]));
        CHECK(phase_gap(ph[k], 360 * 0.3 * std::cos(t * deg)) < 0.01);
        ++checked;
    }
    CHECK(checked > 600);
    // On the axis the field is zero: no phase (conventions.md "Honest figures").
    CHECK(std::isnan(ph[std::size_t(std::lround((0 - c.angle_deg[0]) / c.step_deg))]));
}

TEST_CASE("after moving the reference to the estimated phase centre the phase is flat over the beam", "[phase]") {
    // --phase-centre auto (install_pattern, PhaseReference::phase_centre) multiplies by
    // exp(-j k r.c) with c the estimate; for a displaced point source the phase is then constant
    // (conventions.md "Phase centre"). Tolerance 0.05 deg: the estimate is a least-squares fit on a 2 deg grid.
    FarFieldSet s = displaced_dipole(0.3, 2);
    InstallRequest r;
    r.reference = PhaseReference::phase_centre;
    auto i = install_pattern(s, r);
    REQUIRE(i);
    const CutSamples c = sample_cut(*i, 0, CutSpec::phi_cut(30), 0.5);
    const std::vector<double> ph = cut_phase_deg(*i, c, Component::theta);
    const std::vector<double> p = cut_power(*i, c, Component::theta);
    double ref = NAN;
    int checked = 0;
    for (std::size_t k = 0; k < ph.size(); ++k) {
        if (!(c.angle_deg[k] > 0) || !(p[k] >= 0.1 * 1.5)) continue;  // the main beam on one side: within 10 dB of D = 1.5
        if (std::isnan(ref)) ref = ph[k];
        CHECK(phase_gap(ph[k], ref) < 0.05);
        ++checked;
    }
    CHECK(checked > 200);
}

TEST_CASE("turnstile fed in quadrature: the circular phases follow E_R = (Et + j Ep)/sqrt2", "[phase]") {
    // pattern/reference.hpp: currents x and exp(-j 90) y, E ~ -(p - (p.r) r), so by hand
    // Et = -cos(t) exp(-j p), Ep = j exp(-j p) and, with IEEE Std 145 / Balanis sec. 2.12,
    // E_R = -(1 + cos t) exp(-j p)/sqrt2 (phase 180 - p), E_L = (1 - cos t) exp(-j p)/sqrt2 (phase -p).
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = -90;
    const FarFieldSet s = synthesize(a, 5, 1e9);
    const FarField& f = s.frequencies[0];
    for (auto [t, p] : {std::pair{30.0, 20.0}, {60.0, 135.0}, {120.0, 250.0}, {150.0, 340.0}}) {
        const int i = int(t / 5), j = int(p / 5);
        const cplx et = f.e_theta[s.grid.index(i, j)], ep = f.e_phi[s.grid.index(i, j)];
        const double cp = std::cos(p * deg), sp = std::sin(p * deg);
        const double et_by_hand = std::arg(-std::cos(t * deg) * std::polar(1.0, -p * deg)) / deg;
        CHECK(phase_gap(component_phase_deg(et, ep, cp, sp, s.ludwig3_reference, Component::theta), et_by_hand) < 1e-9);
        CHECK(phase_gap(component_phase_deg(et, ep, cp, sp, s.ludwig3_reference, Component::phi), 90 - p) < 1e-9);
        CHECK(phase_gap(component_phase_deg(et, ep, cp, sp, s.ludwig3_reference, Component::rhcp), 180 - p) < 1e-9);
        CHECK(phase_gap(component_phase_deg(et, ep, cp, sp, s.ludwig3_reference, Component::lhcp), -p) < 1e-9);
        // Ludwig-3 x (Ludwig 1973): co = Et cos p - Ep sin p = -(cos t cos p + j sin p) exp(-j p).
        const cplx co = -cplx(std::cos(t * deg) * cp, sp) * std::polar(1.0, -p * deg);
        CHECK(phase_gap(component_phase_deg(et, ep, cp, sp, Ludwig3Reference::x, Component::co), std::arg(co) / deg) < 1e-9);
    }
    // Toward +z the field is pure right-hand: E_L is zero, so it has no phase (conventions.md "Honest figures").
    const cplx et0 = f.e_theta[s.grid.index(0, 0)], ep0 = f.e_phi[s.grid.index(0, 0)];
    CHECK(std::isnan(component_phase_deg(et0, ep0, 1, 0, s.ludwig3_reference, Component::lhcp)));
    CHECK_FALSE(std::isnan(component_phase_deg(et0, ep0, 1, 0, s.ludwig3_reference, Component::rhcp)));
}

TEST_CASE("a file declared exp(-i w t) gives negated phases", "[phase]") {
    // conventions.md "Time convention": a file in exp(-i w t) is conjugated on import. Conjugation
    // negates the phase of every linear part (theta, phi, Ludwig-3: real coefficients) and swaps
    // the hands: conj(Et + j Ep) = Et* - j Ep*, so E_R of the one is conj(E_L) of the other.
    std::string rows;
    for (int t : {0, 90, 180})
        for (int p : {0, 90, 180, 270}) rows += std::to_string(t) + "," + std::to_string(p) + ",0,30,-3,-125\n";
    const std::string head = "theta,phi,e_theta_db,e_theta_phase,e_phi_db,e_phi_phase\n";
    auto plus = parse_far_field_csv(head + rows, "plus.csv");
    auto minus = parse_far_field_csv("# time-convention: -iwt\n" + head + rows, "minus.csv");
    REQUIRE(plus);
    REQUIRE(minus);
    const std::size_t k = plus->grid.index(1, 1);
    auto swapped = [](Component c) {
        return c == Component::rhcp ? Component::lhcp : c == Component::lhcp ? Component::rhcp : c;
    };
    for (Component c : {Component::theta, Component::phi, Component::rhcp, Component::lhcp, Component::co, Component::cross}) {
        const double a = component_phase_deg(plus->frequencies[0].e_theta[k], plus->frequencies[0].e_phi[k], 0, 1,
                                             Ludwig3Reference::x, swapped(c));
        const double b = component_phase_deg(minus->frequencies[0].e_theta[k], minus->frequencies[0].e_phi[k], 0, 1,
                                              Ludwig3Reference::x, c);
        CHECK(phase_gap(a, -b) < 1e-9);
    }
    CHECK(component_phase_deg(plus->frequencies[0].e_theta[k], 0, 0, 1, Ludwig3Reference::x, Component::theta) ==
          Approx(30).margin(1e-9));
}

TEST_CASE("no phase where there is no field, for total, or in data without phase", "[phase]") {
    // conventions.md "Honest figures": a zero field has no phase; a part at most linear_threshold
    // of the total is rounding residue, not a phase.
    CHECK(std::isnan(component_phase_deg(0, 0, 1, 0, Ludwig3Reference::x, Component::theta)));
    CHECK(std::isnan(component_phase_deg(1, 0, 1, 0, Ludwig3Reference::x, Component::total)));
    CHECK(std::isnan(component_phase_deg(1, cplx(1e-7, 0), 1, 0, Ludwig3Reference::x, Component::phi)));  // -140 dB
    CHECK(component_phase_deg(1, cplx(0, 1e-5), 1, 0, Ludwig3Reference::x, Component::phi) == Approx(90));   // -100 dB
    // (-180, 180]: a negative real with a negative-zero imaginary part is 180, not -180.
    CHECK(component_phase_deg(cplx(-1, -0.0), 0, 1, 0, Ludwig3Reference::x, Component::theta) == 180);
    CHECK(exports::phase_text(-179.96, "deg") == "180.0 deg");
    CHECK(exports::phase_text(NAN, "deg") == "none: no field");
    FarFieldSet s = synthesize(ReferenceAntenna{}, 10, 1e9);
    CHECK_FALSE(phase_unavailable(s, Component::rhcp));
    CHECK(phase_unavailable(s, Component::total));
    s.content = FieldContent::magnitude_only;
    const auto why = phase_unavailable(s, Component::theta);
    REQUIRE(why);
    CHECK(why->find("no phase") != std::string::npos);
}

TEST_CASE("a phase line breaks where the phase wraps round, not where it only turns fast", "[phase]") {
    // common practice: wrapped phase in (-180, 180]; a jump of more than 180 deg between
    // neighbours is a wrap, not the antenna's phase.
    std::vector<double> x{0, 1, 2, 3, 4}, y{170, 179, -178, -100, NAN}, xo, yo;
    exports::break_at_wraps(x, y, xo, yo);
    REQUIRE(xo.size() == 6);
    CHECK(yo[2] != yo[2]);  // NaN between 179 and -178
    CHECK(xo[2] == 1.5);
    CHECK(yo[3] == -178);
    CHECK(yo[4] == -100);  // a 78 deg step is drawn
}
