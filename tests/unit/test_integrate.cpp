// Sphere integration and coverage.
#include <catch2/catch.hpp>

#include "pattern/integrate.hpp"
#include "pattern/reference.hpp"
#include "pattern/summary.hpp"

using namespace ellipsa;

namespace {
// Keep only theta rows within [t0, t1].
FarFieldSet slice_theta(const FarFieldSet& s, double t0, double t1) {
    FarFieldSet o = s;
    int i0 = int(std::lround((t0 - s.grid.theta.start_deg) / s.grid.theta.step_deg));
    int i1 = int(std::lround((t1 - s.grid.theta.start_deg) / s.grid.theta.step_deg));
    o.grid.theta.start_deg = s.grid.theta.value_deg(i0);
    o.grid.theta.count = i1 - i0 + 1;
    for (std::size_t f = 0; f < s.frequencies.size(); ++f) {
        auto b = s.frequencies[f].e_theta.begin() + long(s.grid.index(i0, 0));
        auto c = s.frequencies[f].e_phi.begin() + long(s.grid.index(i0, 0));
        o.frequencies[f].e_theta.assign(b, b + long(o.grid.size()));
        o.frequencies[f].e_phi.assign(c, c + long(o.grid.size()));
    }
    return o;
}
}  // namespace

TEST_CASE("an isotropic field integrates to 4 pi with exact cell areas", "[integrate]") {
    // Exact cell solid angles (conventions.md) sum to 4 pi for any step, poles included.
    for (double step : {1.0, 2.5, 7.5, 30.0}) {
        FarFieldSet s;
        s.grid = full_sphere_grid(step, step);
        FarField f;
        f.e_theta.assign(s.grid.size(), 1.0);
        f.e_phi.assign(s.grid.size(), 0.0);
        s.frequencies.push_back(f);
        CHECK(radiated_power(s.grid, s.frequencies[0]) == Approx(4 * pi).epsilon(1e-12));
        CHECK(coverage(s.grid) == Approx(1.0).epsilon(1e-12));
        CHECK(is_full_sphere(s.grid));
    }
}

TEST_CASE("partial coverage is reported, never a silent directivity", "[integrate]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    FarFieldSet full = synthesize(a, 1.0, 1e9);
    FarFieldSet upper = slice_theta(full, 0, 90);
    CHECK(coverage(upper.grid) == Approx(0.5).epsilon(1e-12));  // a hemisphere is half the sphere
    PatternSummary r = summarize(upper, 0);
    CHECK(!r.directivity_dbi);
    CHECK(!r.power.radiation_efficiency);
    REQUIRE(r.power.directivity_sampled_only);
    // Symmetric dipole: the upper half holds half the power, so "assuming nothing outside" doubles D.
    CHECK(*r.power.directivity_sampled_only == Approx(2 * 1.6409).epsilon(0.01));
    // The dipole's peak on the horizon has its antipode on the horizon too: F/B is available ...
    CHECK(r.front_to_back_db);
    // ... but a cap that stops at 60 deg cannot say what lies behind its peak.
    CHECK(!summarize(slice_theta(full, 0, 60), 0).front_to_back_db);
    FarFieldSet band = slice_theta(full, 30, 150);
    CHECK(coverage(band.grid) == Approx(std::cos(30 * deg)).epsilon(1e-12));
}

TEST_CASE("directivity and relative data: no efficiency", "[integrate]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    FarFieldSet s = synthesize(a, 2.0, 1e9);
    s.quantity = Quantity::relative;
    for (auto& e : s.frequencies[0].e_theta) e *= 0.1;  // relative scale is arbitrary
    PatternSummary r = summarize(s, 0);
    CHECK(!r.power.radiation_efficiency);
    CHECK(*r.directivity_dbi == Approx(1.7609).margin(0.005));
}

TEST_CASE("absolute gain with losses gives the radiation efficiency", "[integrate]") {
    // Efficiency = P / 4 pi for absolute gain data (IEEE Std 145 definition of gain).
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    FarFieldSet s = synthesize(a, 1.0, 1e9);
    for (auto& e : s.frequencies[0].e_theta) e *= std::sqrt(0.6);
    PatternSummary r = summarize(s, 0);
    CHECK(*r.power.radiation_efficiency == Approx(0.6).epsilon(1e-4));
    CHECK(*r.directivity_dbi == Approx(2.15).margin(0.01));
    CHECK(r.peak_db == Approx(2.15 + 10 * std::log10(0.6)).margin(0.01));
}
