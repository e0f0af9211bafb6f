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
