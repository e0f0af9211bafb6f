// Figures an engineer can sign (conventions.md, "Honest figures"): the thresholds that decide a
// polarisation state, zero fields, ratios against nulls and efficiencies above 100 %.
#include <catch2/catch.hpp>

#include <cmath>
#include <functional>

#include "exports/figure_text.hpp"
#include "pattern/cut.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/reference.hpp"
#include "pattern/summary.hpp"

using namespace ellipsa;

namespace {
// A full-sphere set from a closed-form field (E_theta, E_phi) of (theta, phi) in radians.
FarFieldSet closed_form(double step_deg, const std::function<std::pair<cplx, cplx>(double, double)>& f,
                        Quantity q = Quantity::directivity) {
    FarFieldSet s;
    s.quantity = q;
    s.grid = full_sphere_grid(step_deg, step_deg);
    s.frequencies.resize(1);
    s.frequencies[0].frequency_hz = 1e9;
    s.frequencies[0].e_theta.resize(s.grid.size());
    s.frequencies[0].e_phi.resize(s.grid.size());
    for (int i = 0; i < s.grid.theta.count; ++i)
        for (int j = 0; j < s.grid.phi.count; ++j) {
            const auto e = f(s.grid.theta.value_deg(i) * deg, s.grid.phi.value_deg(j) * deg);
            s.frequencies[0].e_theta[s.grid.index(i, j)] = e.first;
            s.frequencies[0].e_phi[s.grid.index(i, j)] = e.second;
        }
    return s;
}

PolarisationState crossed_dipoles_at(double t_deg, double p_deg) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    const double t = t_deg * deg, p = p_deg * deg;
    const CVec3 e = local_field(a, direction(t, p));
    return decompose(dot(e, theta_hat(t, p)), dot(e, phi_hat(p)), p, Ludwig3Reference::x);
}
}  // namespace

TEST_CASE("the linear and near-circular thresholds are the documented values", "[honest][polarisation]") {
    CHECK(20 * std::log10(linear_axial_ratio) == Approx(linear_axial_ratio_db).margin(1e-12));
    CHECK(20 * std::log10(circular_axial_ratio) == Approx(circular_axial_ratio_db).margin(1e-12));
}

TEST_CASE("crossed dipoles: elliptical below 40 dB axial ratio, linear above", "[honest][polarisation]") {
    // conventions.md closed form: AR = 1 / |cos t| at angle t from the common normal, every azimuth.
    for (double t_deg : {10.0, 45.0, 80.0, 89.0, 89.4, 89.5, 89.9, 90.0, 100.0, 170.0})
        for (double p_deg : {0.0, 37.0, 200.0}) {
            const PolarisationState s = crossed_dipoles_at(t_deg, p_deg);
            const double ar_db = -20 * std::log10(std::abs(std::cos(t_deg * deg)));
            INFO("t " << t_deg << " phi " << p_deg << " AR " << ar_db << " dB");
            if (ar_db < linear_axial_ratio_db) {
                CHECK((s.sense == Sense::right || s.sense == Sense::left));
                REQUIRE(s.axial_ratio_db);
                CHECK(*s.axial_ratio_db == Approx(ar_db).margin(1e-6));
                CHECK(exports::polarisation_text(s.sense, s.axial_ratio_db).find("-hand, axial ratio") != std::string::npos);
            } else {
                CHECK(s.sense == Sense::linear);
                CHECK_FALSE(s.axial_ratio_db);
                CHECK(exports::polarisation_text(s.sense, s.axial_ratio_db) == "linear (axial ratio above 40 dB)");
            }
        }
}

TEST_CASE("near circular the tilt is undefined and says so", "[honest][polarisation]") {
    // AR = 1/cos t: 0.1 dB at t = acos(10^(-0.1/20)) = 8.68 deg.
    const PolarisationState c = crossed_dipoles_at(0, 0);  // exactly circular
    CHECK(std::isnan(c.tilt_deg));
    CHECK(std::isnan(crossed_dipoles_at(8.0, 30).tilt_deg));  // AR 0.085 dB
    CHECK(std::isfinite(crossed_dipoles_at(9.5, 30).tilt_deg));  // AR 0.12 dB
    CHECK(exports::tilt_text(c.tilt_deg, c.sense, "deg") == "undefined (near circular: axial ratio below 0.1 dB)");
    // A linear field keeps its tilt: along theta-hat 0, along phi-hat 90 (conventions.md).
    CHECK(decompose(1.0, 0.0, 0, Ludwig3Reference::x).tilt_deg == Approx(0.0).margin(1e-12));
    CHECK(decompose(0.0, 1.0, 0, Ludwig3Reference::x).tilt_deg == Approx(90.0));
}

TEST_CASE("a zero field has no direction, sense or tilt", "[honest][summary]") {
    // conventions.md: a field that is exactly zero has no direction, no sense and no tilt.
    FarFieldSet z = closed_form(10, [](double, double) { return std::pair<cplx, cplx>{0.0, 0.0}; });
    const PatternSummary r = summarize(z, 0);
    CHECK(r.zero_field);
    CHECK(std::isinf(r.peak_db));
    REQUIRE(r.sense);
    CHECK(*r.sense == Sense::none);
    CHECK(std::isnan(r.tilt_deg));
    CHECK_FALSE(r.axial_ratio_db);
    CHECK_FALSE(r.hpbw_elevation_deg);
    CHECK_FALSE(r.front_to_back_db);
    CHECK(exports::peak_text(r, "dBi", "deg") == "none (zero field)");
    CHECK(exports::polarisation_text(*r.sense, r.axial_ratio_db) == "zero field (no polarisation)");
}

TEST_CASE("front-to-back against an exact null is a bound, not a number", "[honest][summary]") {
    // A cardioid field (1 + cos t) / 2 has an exact null at t = 180 deg (common practice, Kraus).
    FarFieldSet c = closed_form(2, [](double t, double) { return std::pair<cplx, cplx>{0.5 * (1 + std::cos(t)), 0.0}; });
    const PatternSummary r = summarize(c, 0);
    CHECK_FALSE(r.front_to_back_db);
    REQUIRE(r.front_to_back_above_db);
    CHECK(*r.front_to_back_above_db == null_ratio_bound_db);
    // 30 dB against a back lobe is a number (no bound).
    const RatioDb x = ratio_db(1000.0, 1.0);
    REQUIRE(x.db);
    CHECK(*x.db == Approx(30.0));
    CHECK_FALSE(x.above_db);
    CHECK(ratio_db(1.0, 1e-7).above_db);  // 70 dB: beyond the bound
    CHECK_FALSE(ratio_db(0.0, 1.0).db);
    CHECK_FALSE(ratio_db(0.0, 1.0).above_db);
}

TEST_CASE("efficiency above 100 % from gain data is flagged, the figures kept", "[honest][summary]") {
    // A half-wave dipole's directivity read as gain has efficiency 1 (Balanis sec. 4.6); 114.8 % is
    // the scale error the issue found: flagged, and directivity still computed.
    FarFieldSet d = synthesize(ReferenceAntenna{}, 5, 1e9);
    d.quantity = Quantity::gain;
    PatternSummary r = summarize(d, 0);
    REQUIRE(r.power.radiation_efficiency);
    CHECK(*r.power.radiation_efficiency == Approx(1.0).margin(0.005));  // a 5-degree grid integrates within 0.5 %
    CHECK_FALSE(r.efficiency_above_100);
    for (auto& e : d.frequencies[0].e_theta) e *= std::sqrt(1.148);
    for (auto& e : d.frequencies[0].e_phi) e *= std::sqrt(1.148);
    r = summarize(d, 0);
    CHECK(r.efficiency_above_100);
    REQUIRE(r.directivity_dbi);
    CHECK(*r.directivity_dbi == Approx(2.15).margin(0.02));
    CHECK(exports::efficiency_warning_text(*r.power.radiation_efficiency).find("114.8 %") != std::string::npos);
}

TEST_CASE("numbers that round to zero never print as -0", "[honest][text]") {
    CHECK(exports::fixed(-0.0004, 2) == "0.00");
    CHECK(exports::fixed(-0.0, 1) == "0.0");
    CHECK(exports::fixed(-0.006, 2) == "-0.01");
    CHECK(exports::fixed(std::nan(""), 2) == "n/a");
}

TEST_CASE("a zero power is reported as none, never -inf dB", "[honest][text]") {
    CHECK(exports::level_text(-INFINITY, 2, "dBi") == "none (zero field)");
    CHECK(exports::level_text(2.149, 2, "dBi") == "2.15 dBi");
    CHECK(exports::level_text(-0.001, 2, "dBic") == "0.00 dBic");
}

TEST_CASE("a cut angle is shown once per direction, in the cut's documented range", "[honest][text]") {
    // pattern/cut.hpp: a phi = const cut runs theta -180..180 round a closed loop, so -180 and +180
    // are one direction (the nadir); a conical cut runs phi 0..360, where 360 is 0.
    const CutSpec phi0 = CutSpec::phi_cut(0), cone = CutSpec::theta_cut(90);
    CHECK(exports::cut_angle_text(phi0, -180.0, 1, "deg") == "180.0 deg");
    CHECK(exports::cut_angle_text(phi0, -179.96, 1, "deg") == "180.0 deg");  // rounds to -180.0 first
    CHECK(exports::cut_angle_text(phi0, -179.9, 1, "deg") == "-179.9 deg");
    CHECK(exports::cut_angle_text(phi0, 180.0, 1, "deg") == "180.0 deg");
    CHECK(exports::cut_angle_text(phi0, -90.0, 1, "\u00b0") == "-90.0\u00b0");
    CHECK(exports::cut_angle_text(cone, 359.98, 1, "deg") == "0.0 deg");
    CHECK(exports::cut_angle_text(cone, 270.0, 1, "deg") == "270.0 deg");
}

namespace {
// Power of a closed cut sampled every step_deg (angles -180..180), from a function of the angle.
struct Cut {
    std::vector<double> angle_deg, power;
};
Cut cut_of(double step_deg, const std::function<double(double)>& p) {
    Cut c;
    const int n = int(std::lround(360 / step_deg));
    for (int k = 0; k < n; ++k) {
        c.angle_deg.push_back(-180 + k * step_deg);
        c.power.push_back(p(-180 + k * step_deg));
    }
    return c;
}
// Uniform array factor |sin(N psi / 2) / (N sin(psi / 2))|^2, psi = k d cos(t) + beta (Balanis sec. 6.3).
double array_factor(int n, double d_wl, double beta, double t_deg) {
    const double psi = 2 * pi * d_wl * std::cos(t_deg * deg) + beta;
    const double den = n * std::sin(psi / 2);
    if (std::abs(den) < 1e-12) return 1.0;
    const double a = std::sin(n * psi / 2) / den;
    return a * a;
}
}  // namespace

TEST_CASE("uniform broadside array: first side lobe -13.26 dB, its mirror is the main beam", "[honest][beam]") {
    // Balanis sec. 6.3: a uniform N-element array's first side lobe is -13.26 dB for large N
    // (N = 50, d = lambda/2 along z). The phi = const cut crosses the broadside beam at theta = +-90.
    const Cut c = cut_of(0.05, [](double a) { return array_factor(50, 0.5, 0, std::abs(a)); });
    const BeamFigures b = beam_figures(c.angle_deg, c.power, -1, true);
    CHECK(b.mirror_beam);
    REQUIRE(b.sidelobe_db);
    CHECK(*b.sidelobe_db == Approx(-13.26).margin(0.03));
    REQUIRE(b.hpbw_deg);
    CHECK(*b.hpbw_deg == Approx(2.03).margin(0.03));  // Balanis eq. 6-22a: 2 (90 - acos(1.391 / (pi N d)))
}

TEST_CASE("end-fire array with ripple from its phase reference: no side lobe at 0 dB", "[honest][beam]") {
    // Ordinary end-fire (beta = -k d), N = 10, d = lambda/4: side lobes about -13 dB (Balanis sec. 6.4).
    // A sampled, interpolated pattern with its phase reference off the origin dips between grid
    // points; modelled here as a 0.5 dB ripple on the main lobe. Ripple is not a lobe.
    const Cut c = cut_of(0.25, [](double a) {
        const double ripple = std::pow(10.0, -0.25 * (1 - std::cos(a * deg * 90)) / 10);  // 0..0.5 dB dips every 4 deg
        return array_factor(10, 0.25, -pi / 2, std::abs(a)) * ripple;
    });
    const BeamFigures b = beam_figures(c.angle_deg, c.power, -1, true);
    REQUIRE(b.sidelobe_db);
    CHECK(*b.sidelobe_db < -11);
    CHECK(*b.sidelobe_db > -14.5);
}

TEST_CASE("Gaussian beam with ripple: HPBW as the closed form, no side lobe", "[honest][beam]") {
    // exp(-4 ln2 (a / 40)^2) has HPBW 40 deg exactly; a 0.3 dB ripple on top moves no half-power point
    // by more than a fraction of a degree and makes no lobe (prominence below 3 dB).
    const Cut c = cut_of(0.25, [](double a) {
        return std::exp(-4 * std::log(2.0) * (a / 40) * (a / 40)) * std::pow(10.0, -0.15 * (1 + std::sin(a * deg * 45)) / 10) + 1e-6;
    });
    const BeamFigures b = beam_figures(c.angle_deg, c.power);
    REQUIRE(b.hpbw_deg);
    CHECK(*b.hpbw_deg == Approx(40).margin(1.0));
    CHECK_FALSE(b.sidelobe_db);
}

TEST_CASE("omnidirectional, wider than 180 deg, and edges outside the data", "[honest][beam]") {
    // An azimuth cut of a z dipole is constant: omnidirectional, ripple 0 (Balanis sec. 4.2).
    const Cut omni = cut_of(1, [](double) { return 1.5; });
    BeamFigures b = beam_figures(omni.angle_deg, omni.power);
    CHECK(b.shape == BeamShape::omnidirectional);
    CHECK_FALSE(b.hpbw_deg);
    REQUIRE(b.ripple_db);
    CHECK(*b.ripple_db == Approx(0).margin(1e-12));
    CHECK(exports::beamwidth_reason(b) == std::optional<std::string>("omnidirectional"));
    // 1 + 0.9 cos a in power never falls 3 dB... except near the back: crossings at
    // acos((0.5 * 1.9 - 1) / 0.9) = 93.2 deg each side, 186.4 deg apart: no beam.
    const Cut wide = cut_of(0.1, [](double a) { return 1 + 0.9 * std::cos(a * deg); });
    b = beam_figures(wide.angle_deg, wide.power);
    CHECK(b.shape == BeamShape::wider_than_180);
    CHECK_FALSE(b.hpbw_deg);
    REQUIRE(b.half_power_span_deg);
    CHECK(*b.half_power_span_deg == Approx(2 * std::acos((0.5 * 1.9 - 1) / 0.9) / deg).margin(0.2));
    // A partial range (data from -30 to 60 deg only) of a flat beam: the edges lie outside the data.
    Cut part = cut_of(1, [](double a) { return a >= -30 && a <= 60 ? 1.0 + 0.001 * a : std::nan(""); });
    b = beam_figures(part.angle_deg, part.power);
    CHECK(b.shape == BeamShape::edges_outside_data);
    CHECK(b.left == EdgeStatus::outside_data);
    CHECK(b.right == EdgeStatus::outside_data);
    CHECK(exports::beamwidth_text(b, "phi", "deg") == "none: the beam's edge lies outside the sampled range (on both sides)");
}

TEST_CASE("a partial azimuth range is not called omnidirectional", "[honest][summary]") {
    // issue 13 item 12: a single phi cut (phi = 0 only) of a half-wave dipole: the azimuth-like cut
    // through the peak leaves the data at once.
    FarFieldSet d = synthesize(ReferenceAntenna{}, 2, 1e9);
    FarFieldSet one = d;
    one.grid.phi.count = 1;
    one.frequencies[0].e_theta.clear();
    one.frequencies[0].e_phi.clear();
    for (int i = 0; i < d.grid.theta.count; ++i) {
        one.frequencies[0].e_theta.push_back(d.frequencies[0].e_theta[d.grid.index(i, 0)]);
        one.frequencies[0].e_phi.push_back(d.frequencies[0].e_phi[d.grid.index(i, 0)]);
    }
    const PatternSummary r = summarize(one, 0);
    CHECK(r.azimuth.shape == BeamShape::edges_outside_data);
    CHECK_FALSE(r.hpbw_azimuth_deg);
    REQUIRE(r.hpbw_elevation_deg);
    CHECK(*r.hpbw_elevation_deg == Approx(78.1).margin(0.3));  // Balanis sec. 4.6
}

// A beam at the zenith (issue 17): both principal planes are elevation planes there and the peak's
// phi is arbitrary, so the beamwidths are taken in the fixed planes phi = 0 and phi = 90 and named
// by their phi. The field x-hat cos^4(theta/2) in phi = 0 and cos^2(theta/2) in phi = 90 is one
// vector at the pole (E_theta cos(phi) - E_phi sin(phi) = x-hat). Half power of cos^(2n)(theta/2):
// theta = 2 acos(2^(-1/(2n))), so HPBW = 4 acos(2^(-1/8)) and 4 acos(2^(-1/4)) (closed form,
// arithmetic). One pole sample is raised by 1e-9 of itself at phi = 137 deg, as noise would.
TEST_CASE("a beam at a pole has its beamwidths in the planes phi = 0 and phi = 90", "[summary][pole]") {
    FarFieldSet s = closed_form(1.0, [](double t, double p) {
        const double c = std::cos(t / 2);
        return std::pair<cplx, cplx>{std::cos(p) * std::pow(c, 4), -std::sin(p) * std::pow(c, 2)};
    });
    const std::size_t noisy = s.grid.index(0, 137);
    s.frequencies[0].e_theta[noisy] *= 1 + 1e-8;
    s.frequencies[0].e_phi[noisy] *= 1 + 1e-8;
    const PatternSummary r = summarize(s, 0);
    CHECK(r.peak.phi_deg == Approx(137));  // the noise decides the peak's phi ...
    CHECK(r.peak_at_pole);                  // ... which the planes ignore
    REQUIRE(r.hpbw_elevation_deg);
    REQUIRE(r.hpbw_azimuth_deg);
    CHECK(*r.hpbw_elevation_deg == Approx(4 * std::acos(std::pow(2.0, -1.0 / 8)) / deg).margin(0.2));
    CHECK(*r.hpbw_azimuth_deg == Approx(4 * std::acos(std::pow(2.0, -1.0 / 4)) / deg).margin(0.2));
    CHECK(exports::beam_plane_text(r, false, "deg") == "plane phi = 0 deg");
    CHECK(exports::beam_plane_text(r, true, "\u00b0") == "plane \u03c6 = 90\u00b0");
    // The brief form of the same wording for narrow table labels (the viewer's figures).
    CHECK(exports::beam_plane_text(r, false, "\u00b0", true) == "\u03c6 = 0\u00b0");
    CHECK(exports::beam_plane_text(r, true, "deg", true) == "phi = 90 deg");
    CHECK(exports::peak_text(r, "dBi", "deg").find("(zenith)") != std::string::npos);
    CHECK(exports::peak_text(r, "dBi", "deg").find("phi") == std::string::npos);
    // A beam at the horizon keeps the usual names.
    const PatternSummary h = summarize(synthesize(ReferenceAntenna{}, 5.0, 1e9), 0);
    CHECK_FALSE(h.peak_at_pole);
    CHECK(exports::beam_plane_text(h, true, "deg") == "azimuth plane");
    CHECK(exports::beam_plane_text(h, false, "deg") == "elevation plane");
    CHECK(exports::beam_plane_text(h, false, "\u00b0", true) == "elev.");
    CHECK(exports::beam_plane_text(h, true, "\u00b0", true) == "azim.");
}

// MEG's parts with their shares (issue 17): an exactly zero part is "none (0 %)", never "-inf dBi (0.0 %)".
TEST_CASE("a zero part of a power reads none (0 %)", "[figure_text]") {
    CHECK(exports::part_text(0.0, 0.0, "dBi", "") == "none (0 %)");
    CHECK(exports::part_text(0.0, 0.0, "dBi", " of MEG") == "none (0 % of MEG)");
    CHECK(exports::part_text(0.5, 0.25, "dBi", "") == "-3.01 dBi (25.0 %)");  // 10 log10(0.5), common practice
    CHECK(exports::part_text(0.5, std::nullopt, "dBi", "") == "-3.01 dBi (share unavailable)");
}

TEST_CASE("the peak is one value, rounded alike wherever it is shown; the largest sample beside it", "[honest][peak]") {
    // A Gaussian beam, U = G0 exp(-(t - t0)^2 / (2 st^2)) exp(-(p - p0)^2 / (2 sp^2)), is a parabola in
    // dB along theta and along phi, so the parabola through the largest sample and its neighbours
    // (pattern/peak.hpp) finds G0 and (t0, p0) exactly (common practice). t0, p0 lie between the
    // samples of a 5-degree grid, so the largest sample is lower than the peak.
    const double g0 = 20.0, t0 = 41.3, p0 = 77.7, st = 9.0, sp = 14.0;
    const FarFieldSet s = closed_form(5.0, [&](double t, double p) {
        const double dt = t / deg - t0, dp = p / deg - p0;
        return std::pair<cplx, cplx>{std::sqrt(g0 * std::exp(-dt * dt / (2 * st * st) - dp * dp / (2 * sp * sp))), 0.0};
    });
    const PatternSummary r = summarize(s, 0);
    CHECK(r.peak_db == Approx(10 * std::log10(g0)).margin(1e-9));
    CHECK(r.peak.theta_deg == Approx(t0).margin(1e-9));
    CHECK(r.peak.phi_deg == Approx(p0).margin(1e-9));
    CHECK(to_db(r.peak.sample_value) < r.peak_db - 0.01);
    // The header (info, report) and the 3D view's caption (viewer, rendered views) print the same
    // rounding of the same number.
    const std::string shown = exports::with_unit(r.peak_db, exports::db_decimals, "dBi");
    CHECK(exports::peak_text(r, "dBi", "deg").rfind(shown, 0) == 0);
    CHECK(exports::radius_caption("Total", r.peak_db, "dBi", 40) == "radius: Total, peak " + shown + ", range 40 dB");
    CHECK(exports::radius_caption("Total", std::nullopt, "dBi", 40) == "radius: Total, no power (every sample of it is zero)");
}
