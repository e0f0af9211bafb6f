// Figures against frequency, band edges (linear between samples), gain and axial-ratio bandwidth.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/band.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;

namespace {
// A set holding the given antennas at the given frequencies (same grid), in the order given.
FarFieldSet stack(const std::vector<ReferenceAntenna>& as, const std::vector<double>& f_hz, double step = 2.0) {
    FarFieldSet s;
    for (std::size_t k = 0; k < as.size(); ++k) {
        FarFieldSet one = synthesize(as[k], step, f_hz[k]);
        if (k == 0) s = one;
        else s.frequencies.push_back(one.frequencies[0]);
    }
    return s;
}
ReferenceAntenna crossed(double phase_deg) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = phase_deg;
    return a;
}
// Axial ratio on the axis of crossed dipoles fed with phase difference d: the ellipse's axes are
// |1 + e^{jd}| and |1 - e^{jd}| (sum of two orthogonal unit phasors), so AR = |cot(d/2)| or its
// inverse, whichever is >= 1 (common practice; Balanis sec. 2.12 polarisation ellipse).
double axis_ar_db(double d_deg) {
    const double c = std::abs(std::cos(d_deg * deg / 2)), s = std::abs(std::sin(d_deg * deg / 2));
    return 20 * std::log10(std::max(c, s) / std::min(c, s));
}
}  // namespace

TEST_CASE("band edges: linear interpolation between the samples, open at the ends", "[band]") {
    const std::vector<double> f{1.0e9, 1.1e9, 1.2e9, 1.3e9, 1.4e9};
    const std::vector<double> v{1.0, 4.0, 5.0, 3.0, 0.0};
    // Grown from the maximum (index 2) where v >= 2: lower crossing between 1.0 (v 1) and 1.1 (v 4)
    // at t = (2 - 4)/(1 - 4) = 2/3 of the way from 1.1 down: 1.1 - 0.0667 = 1.0333 GHz; upper
    // between 1.3 (v 3) and 1.4 (v 0): 1.3 + (2 - 3)/(0 - 3) * 0.1 = 1.3333 GHz. By hand.
    auto e = band_edges(f, v, 2, 2.0, false);
    REQUIRE(e);
    CHECK(e->lower_hz == Approx(1.1e9 - 0.1e9 * 2.0 / 3.0).epsilon(1e-12));
    CHECK(e->upper_hz == Approx(1.3e9 + 0.1e9 / 3.0).epsilon(1e-12));
    CHECK(!e->lower_open);
    CHECK(!e->upper_open);
    CHECK(e->centre_hz == Approx((e->lower_hz + e->upper_hz) / 2));
    CHECK(e->percent == Approx(100 * (e->upper_hz - e->lower_hz) / e->centre_hz));
    CHECK(e->interpolated);
    // The run reaches the first sample: that edge stays there and is open.
    auto o = band_edges(f, v, 2, 0.5, false);
    REQUIRE(o);
    CHECK(o->lower_open);
    CHECK(o->lower_hz == 1.0e9);
    CHECK(!o->upper_open);
    // The anchor itself must meet the condition.
    CHECK(!band_edges(f, v, 0, 2.0, false));
    // A sample without a value ends the run there, open.
    auto n = band_edges(f, {1.0, NAN, 5.0, 3.0, 0.0}, 2, 2.0, false);
    REQUIRE(n);
    CHECK(n->lower_open);
    CHECK(n->lower_hz == 1.2e9);
}

TEST_CASE("axial-ratio bandwidth of crossed dipoles whose feed phase drifts with frequency", "[band]") {
    // Phase -90 deg at 2.45 GHz, drifting 20 deg per 100 MHz: the axis AR follows |cot(d/2)|.
    std::vector<double> f;
    std::vector<ReferenceAntenna> as;
    for (int k = -3; k <= 3; ++k) {
        f.push_back(2.45e9 + k * 50e6);
        as.push_back(crossed(-90 + 10.0 * k));
    }
    const FarFieldSet s = stack(as, f);
    BandOptions o;
    o.direction_deg = std::make_pair(0.0, 0.0);
    const auto band = band_figures(s, o);
    REQUIRE(band.size() == 7);
    std::vector<double> fr, ar;
    for (const FrequencyFigures& b : band) {
        REQUIRE(b.ar_at_direction);
        REQUIRE(b.ar_at_direction->ar_db);
        fr.push_back(s.frequencies[b.freq_index].frequency_hz);
        ar.push_back(*b.ar_at_direction->ar_db);
    }
    for (std::size_t k = 0; k < 7; ++k) CHECK(ar[k] == Approx(axis_ar_db(-90 + 10.0 * (int(k) - 3))).margin(1e-9));
    // The closed form at the samples (d = -90 +- 30: AR = cot(30 deg) = 1.732, 4.77 dB; +- 20: 3.17 dB;
    // +- 10: 1.51 dB): the band is grown from 2.45 GHz, the 3 dB crossings lie between the +-10 and
    // +-20 deg samples, linearly interpolated in dB.
    const auto e = ar_bandwidth(fr, ar, 3.0);
    REQUIRE(e);
    const double a10 = axis_ar_db(-80), a20 = axis_ar_db(-70);
    const double t = (3.0 - a10) / (a20 - a10);
    CHECK(e->upper_hz == Approx(2.5e9 + t * 50e6).epsilon(1e-12));
    CHECK(e->lower_hz == Approx(2.4e9 - t * 50e6).epsilon(1e-12));
    CHECK(e->centre_hz == Approx(2.45e9).epsilon(1e-12));
    // AR bandwidth = 100 (f_hi - f_lo) / f_centre, the usual percentage (common practice).
    CHECK(e->percent == Approx(100 * (0.1e9 + 2 * t * 50e6) / 2.45e9).epsilon(1e-12));
}

TEST_CASE("band figures agree with summarize() and come out in ascending frequency", "[band]") {
    // A physical half-wave dipole at 1 GHz (L = 0.15 m) over 0.8..1.2 GHz: L / lambda = f L / c.
    const double c0 = 299792458.0, len = 0.15;
    std::vector<double> f{1.2e9, 0.8e9, 1.0e9};  // deliberately out of order
    std::vector<ReferenceAntenna> as;
    for (double hz : f) {
        ReferenceAntenna a;
        a.kind = ReferenceKind::dipole;
        a.length_wl = len * hz / c0;
        as.push_back(a);
    }
    const FarFieldSet s = stack(as, f);
    BandOptions o;
    o.environments.push_back(*environment_preset("uniform"));
    const auto band = band_figures(s, o);
    REQUIRE(band.size() == 3);
    CHECK(band[0].freq_index == 1);
    CHECK(band[1].freq_index == 2);
    CHECK(band[2].freq_index == 0);
    for (const FrequencyFigures& b : band) {
        const PatternSummary r = summarize(s, b.freq_index);
        CHECK(b.summary.peak_db == r.peak_db);
        CHECK(b.summary.hpbw_elevation_deg == r.hpbw_elevation_deg);
        // Lossless closed-form data: MEG in the uniform environment is -3.01 dB (Taga 1990, conventions.md).
        REQUIRE(b.meg.size() == 1);
        REQUIRE(b.meg[0].meg);
        CHECK(10 * std::log10(*b.meg[0].meg) == Approx(-3.0103).margin(2e-3));
        // Linear dipole: no AR beamwidth, with a reason.
        CHECK(!b.ar_beamwidth_elevation.width_deg);
        CHECK(!b.ar_beamwidth_elevation.unavailable_reason.empty());
    }
    // The directivity rises with electrical length: 0.4 lambda < 0.5 lambda < 0.6 lambda (Balanis sec. 4.5).
    CHECK(band[0].summary.peak_db < band[1].summary.peak_db);
    CHECK(band[1].summary.peak_db < band[2].summary.peak_db);
    // Gain bandwidth grown from the highest sample (1.2 GHz, the last): open at the top.
    std::vector<double> fr, pk;
    for (const FrequencyFigures& b : band) {
        fr.push_back(s.frequencies[b.freq_index].frequency_hz);
        pk.push_back(b.summary.peak_db);
    }
    const auto g = gain_bandwidth(fr, pk, 1.0);
    REQUIRE(g);
    CHECK(g->upper_open);
    CHECK(g->upper_hz == 1.2e9);
}

TEST_CASE("pair figures: a z dipole against an x dipole are uncorrelated at every shared frequency", "[band]") {
    // conventions.md check (Vaughan & Andersen 1987): z dipole against x dipole, uniform environment: rho_e = 0.
    ReferenceAntenna z;
    z.kind = ReferenceKind::short_dipole;
    ReferenceAntenna x = z;
    x.orientation = rotation_y(90 * deg);
    const FarFieldSet a = stack({z, z}, {1e9, 2e9});
    const FarFieldSet b = stack({x, x, x}, {1e9, 1.5e9, 2.004e9});  // 2.004 GHz within 0.5 % of 2 GHz
    const auto p = band_pair_figures(a, b, {*environment_preset("uniform")});
    REQUIRE(p.size() == 2);
    CHECK(p[1].index_b == 2);
    for (const auto& q : p) {
        REQUIRE(q.per_environment[0].ecc);
        CHECK(*q.per_environment[0].ecc == Approx(0).margin(1e-9));
        // Independent equal branches, selection at 1 % outage, exact: 10 log10(ln 0.9 / ln 0.99) = 10.205 dB
        // (two-branch Rayleigh selection, Schwartz, Bennett & Stein 1966; pattern/combining.hpp).
        // (The two MEG differ in the fourth digit on the grid, hence the margin.)
        CHECK(*q.per_environment[0].diversity_gain_db == Approx(10 * std::log10(std::log(0.9) / std::log(0.99))).margin(1e-3));
    }
}

// issue 17: a band whose beam stays at the zenith names its planes by their phi (the band panel's
// menu and the band plot's legends, exports::beam_plane_text); one frequency off the pole is enough
// to keep the usual names. Crossed dipoles in the xy-plane peak on the z axis (Balanis sec. 4.7,
// turnstile: common practice); a half-wave dipole along z peaks on the horizon.
TEST_CASE("peaks_at_pole: every frequency's peak at a pole, and not for an empty band", "[band][pole]") {
    const FarFieldSet turnstile = stack({crossed(-90), crossed(-80)}, {2.4e9, 2.5e9});
    const auto zen = band_figures(turnstile, BandOptions{});
    REQUIRE(zen.size() == 2);
    CHECK(peaks_at_pole(zen));
    ReferenceAntenna dip;
    dip.kind = ReferenceKind::dipole;
    const auto mixed = band_figures(stack({crossed(-90), dip}, {2.4e9, 2.5e9}), BandOptions{});
    REQUIRE(mixed.size() == 2);
    CHECK(mixed[0].summary.peak_at_pole);
    CHECK_FALSE(mixed[1].summary.peak_at_pole);
    CHECK_FALSE(peaks_at_pole(mixed));
    CHECK_FALSE(peaks_at_pole(std::vector<FrequencyFigures>{}));
}
