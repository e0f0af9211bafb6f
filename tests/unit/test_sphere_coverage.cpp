// Sphere coverage (share of the sphere at or above a level) against a short dipole's closed form.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstring>

#include "pattern/integrate.hpp"
#include "pattern/reference.hpp"
#include "pattern/sphere_coverage.hpp"

using namespace ellipsa;

namespace {
FarFieldSet short_dipole(double step) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    return synthesize(a, step, 1e9);
}
}  // namespace

TEST_CASE("short dipole: the share of the sphere where G >= g is cos t0, sin^2 t0 = g / 1.5", "[coverage]") {
    // Short dipole G = 1.5 sin^2 t (Balanis sec. 4.2). G >= g on t0 <= t <= 180 - t0 with
    // sin^2 t0 = g/1.5. That band's solid angle is 2 pi (cos t0 - cos(pi - t0)) = 4 pi cos t0,
    // so the share of the sphere is cos t0 (integration by hand, the area of a spherical zone).
    // At 0 dBi: cos t0 = 1/sqrt 3 = 0.5774. Counting whole cells, a 5-degree grid gave 0.609 (the
    // boundary at 54.7 deg falls inside the 55-degree cell, which counted in full): an error of a
    // cell row, first order in the step. With the power interpolated inside the cells the error
    // is second order: it falls about fourfold each time the step halves (common practice: the
    // convergence check of conventions.md).
    // The largest error over levels from 0.05 to 1.45 (linear), against the closed form: the 5-degree
    // grid 0.0023 (whole cells: up to 0.04), the 1.25-degree grid 0.00012.
    double previous = 0;
    for (double step : {5.0, 2.5, 1.25}) {
        const FarFieldSet s = short_dipole(step);
        const auto v = component_power_samples(s, 0, Component::total);
        const CoverageCurve c = coverage_curve(s.grid, v, {});
        CHECK(c.band_solid_angle_sr == Approx(4 * pi).epsilon(1e-12));
        CHECK(c.sampled_share == Approx(1.0).epsilon(1e-12));
        const double dt = step * deg;
        double worst = 0;
        for (int k = 1; k <= 29; ++k) {
            const double g = 0.05 * k, t0 = std::asin(std::sqrt(g / 1.5));
            const double share = share_at_or_above(c, 10 * std::log10(g));
            INFO("step " << step << " g " << g << " share " << share << " exact " << std::cos(t0));
            CHECK(std::abs(share - std::cos(t0)) <= dt * dt);
            // The same from the one-level function, without the curve.
            CHECK(solid_angle_at_or_above(s.grid, v, g) / (4 * pi) == Approx(share).margin(1e-9));
            // Within 0.4 dB of the maximum the boundary lies where the pattern is flat, and the
            // interpolation's error in the boundary's place falls only as the step there.
            if (g <= 1.35) worst = std::max(worst, std::abs(share - std::cos(t0)));
        }
        INFO("step " << step << " largest error " << worst);
        if (step == 5.0) CHECK(std::abs(share_at_or_above(c, 0.0) - 1 / std::sqrt(3.0)) < 0.001);
        if (previous > 0) CHECK(worst < previous / 3);
        previous = worst;
        // Above the peak nothing; at the bottom the whole sphere (the poles are exactly zero: -inf dB).
        CHECK(share_at_or_above(c, 10 * std::log10(1.5) + 0.01) == 0);
        CHECK(share_at_or_above(c, -INFINITY) == Approx(1.0).margin(1e-9));
        // The curve is a proper CCDF: levels fall, shares rise.
        for (std::size_t k = 1; k < c.level_db.size(); ++k) {
            CHECK(c.level_db[k] <= c.level_db[k - 1]);
            CHECK(c.share[k] >= c.share[k - 1]);
        }
    }
}

TEST_CASE("short dipole within 30 deg of the horizon: share cos t0 / sin 30 deg", "[coverage]") {
    // The band |elevation| <= 30 deg is 60 <= t <= 120 deg: 2 pi (cos 60 - cos 120) = 2 pi sr.
    // For t0 > 60 deg the part of the band with G >= g is t0..180-t0: 4 pi cos t0, so the share is
    // 2 cos t0; for t0 < 60 deg the whole band qualifies (by hand).
    const FarFieldSet s = short_dipole(1.0);
    const auto v = component_power_samples(s, 0, Component::total);
    const CoverageCurve c = coverage_curve(s.grid, v, horizon_band(30));
    CHECK(c.band_solid_angle_sr == Approx(2 * pi).epsilon(1e-12));
    for (double t0_deg : {70.5, 75.3, 84.0}) {
        const double t0 = t0_deg * deg;
        INFO("t0 " << t0_deg);
        // Second order in the step (1 deg): the share of the band is twice that of the sphere.
        CHECK(share_at_or_above(c, 10 * std::log10(1.5 * std::sin(t0) * std::sin(t0))) == Approx(2 * std::cos(t0)).margin(2 * deg * deg));
    }
    CHECK(share_at_or_above(c, 10 * std::log10(1.5 * 0.5)) == Approx(1.0).margin(1e-9));
    // A band edge inside a cell (elevation 30.25): the clipped cells still sum to the band exactly.
    const CoverageCurve c2 = coverage_curve(s.grid, v, {-30.25, 30.25});
    CHECK(c2.sampled_share == Approx(1.0).epsilon(1e-12));
    CHECK(c2.band_solid_angle_sr == Approx(4 * pi * std::sin(30.25 * deg)).epsilon(1e-12));
    CHECK(share_at_or_above(c2, -INFINITY) == Approx(1.0).margin(1e-9));
}

TEST_CASE("coverage per component and best of two", "[coverage]") {
    // A z dipole (vertical only) and the same dipole along x: the vertical component of the x
    // dipole is small overhead; the best of the two totals covers at least what either covers.
    ReferenceAntenna z;
    z.kind = ReferenceKind::short_dipole;
    ReferenceAntenna x = z;
    x.orientation = rotation_y(90 * deg);
    const FarFieldSet a = synthesize(z, 2.0, 1e9), b = synthesize(x, 2.0, 1e9);
    const auto va = component_power_samples(a, 0, Component::total);
    const auto vb = component_power_samples(b, 0, Component::total);
    const auto best = best_of(va, vb);
    const CoverageCurve ca = coverage_curve(a.grid, va, {}), cb = coverage_curve(a.grid, vb, {}),
                        cbest = coverage_curve(a.grid, best, {});
    for (double lvl : {-10.0, -3.0, 0.0, 1.0}) {
        CHECK(share_at_or_above(cbest, lvl) >= share_at_or_above(ca, lvl) - 1e-12);
        CHECK(share_at_or_above(cbest, lvl) >= share_at_or_above(cb, lvl) - 1e-12);
    }
    // Same antenna, same grid: b's values interpolated onto a's grid equal its own samples.
    const auto vb2 = component_power_on_grid(b, 0, Component::total, a.grid);
    for (std::size_t k = 0; k < vb.size(); k += 97) CHECK(vb2[k] == Approx(vb[k]).margin(1e-12));
    // The horizontal (phi) part of the z dipole is zero everywhere: no share above any finite level.
    const auto h = component_power_samples(a, 0, Component::horizontal);
    CHECK(share_at_or_above(coverage_curve(a.grid, h, {}), -100) == 0);
}

namespace {
// Values on a grid: a smooth pattern with some exact zeros, negative dips, a few NaN holes.
std::vector<double> test_values(const Grid& g, double nan_share, unsigned seed) {
    std::vector<double> v(g.size());
    unsigned x = seed;
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            x = x * 1664525u + 1013904223u;  // Numerical Recipes' LCG (value from memory)
            const double t = g.theta.value_deg(i) * deg, p = g.phi.value_deg(j) * deg;
            double y = std::sin(t) * std::sin(t) * (1 + 0.4 * std::cos(3 * p)) - 0.05 + 0.01 * double(x >> 24) / 256;
            if ((x >> 8) % 17 == 0) y = 0;
            if (double((x >> 12) % 1000) < 1000 * nan_share) y = std::nan("");
            v[g.index(i, j)] = y;
        }
    return v;
}

bool same_bits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }
}  // namespace

TEST_CASE("the quarter cells' fast path gives the general path's cells bit for bit", "[coverage]") {
    // Reference: the general path (each sample's stretches clipped on their own, a neighbour
    // looked up with every check) is the project's own definition of the quarter-cell model
    // (pattern/sphere_coverage.hpp; the cells of docs/conventions.md). The fast path takes the
    // unclipped interior; both must hand the sums the same cells in the same order.
    struct Case {
        const char* what;
        AngleAxis theta, phi;
        ElevationBand band;
        double nan_share;
    };
    const Case cases[] = {
        {"full sphere, wrapping phi", {0, 5, 37}, {0, 5, 72}, {}, 0},
        {"full sphere, phi -180..175, NaN holes", {0, 2.5, 73}, {-180, 2.5, 144}, {}, 0.05},
        {"full sphere with a band cutting cells", {0, 3, 61}, {0, 3, 120}, {-17.3, 42.1}, 0.02},
        {"upper hemisphere, wrapping", {0, 2, 46}, {0, 2, 180}, {}, 0.01},
        {"half-open theta, no poles", {2.5, 5, 36}, {0, 5, 72}, horizon_band(30), 0},
        {"phi range that does not wrap", {0, 4, 46}, {-60, 4, 31}, {}, 0.03},
        {"phi range that does not wrap, band", {10, 1.5, 80}, {20, 1.5, 61}, {-5, 75}, 0.1},
        {"a single row", {90, 1, 1}, {0, 10, 36}, {}, 0},
        {"a single column", {0, 10, 19}, {0, 10, 1}, {}, 0},
        {"mostly NaN", {0, 5, 37}, {0, 5, 72}, {}, 0.7},
    };
    for (const Case& c : cases) {
        Grid g;
        g.theta = c.theta;
        g.phi = c.phi;
        for (unsigned seed : {1u, 7u, 123u}) {
            const std::vector<double> v = test_values(g, c.nan_share, seed);
            const std::vector<QuarterCell> fast = quarter_cells(g, v, c.band, false);
            const std::vector<QuarterCell> general = quarter_cells(g, v, c.band, true);
            INFO(c.what << ", seed " << seed);
            REQUIRE(fast.size() == general.size());
            if (g.theta.count > 1 && g.phi.count > 1) CHECK(!general.empty());  // one row or column: no area
            std::size_t differ = 0;
            for (std::size_t k = 0; k < fast.size(); ++k)
                differ += !same_bits(fast[k].lo, general[k].lo) || !same_bits(fast[k].hi, general[k].hi) ||
                          !same_bits(fast[k].solid_angle_sr, general[k].solid_angle_sr);
            CHECK(differ == 0);
        }
    }
}

TEST_CASE("the quarter cells: huge or infinite values take the general path", "[coverage]") {
    // The fast path holds only for values within 1e300 (no overflow in its differences); beyond,
    // the general path (the definition, as above) serves the whole grid, infinities included.
    Grid g;
    g.theta = {0, 10, 19};
    g.phi = {0, 10, 36};
    std::vector<double> v = test_values(g, 0.05, 5);
    v[g.index(9, 9)] = INFINITY;
    v[g.index(4, 20)] = 1e305;
    const std::vector<QuarterCell> fast = quarter_cells(g, v, {}, false), general = quarter_cells(g, v, {}, true);
    REQUIRE(fast.size() == general.size());
    for (std::size_t k = 0; k < fast.size(); ++k) {
        INFO("cell " << k);
        CHECK(same_bits(fast[k].lo, general[k].lo));
        CHECK(same_bits(fast[k].hi, general[k].hi));
    }
    // With an infinite neighbour the hi of a cell is infinite (the interpolant reaches it).
    bool any_inf = false;
    for (const QuarterCell& q : general) any_inf |= std::isinf(q.hi);
    CHECK(any_inf);
}

TEST_CASE("the AR solid angle passes over rows below the level without changing a bit", "[coverage]") {
    // Reference: the same sum visiting every row (every_row), which is the quarter-cell model as
    // defined (pattern/sphere_coverage.hpp). Rows whose values and neighbour rows' values all lie
    // below the level add +0 and may be passed over; the sums must agree bit for bit at levels
    // below, among and above the values, with NaN holes, bands and grids that do not wrap.
    struct Case {
        AngleAxis theta, phi;
        ElevationBand band;
        double nan_share;
    };
    const Case cases[] = {
        {{0, 5, 37}, {0, 5, 72}, {}, 0},
        {{0, 2.5, 73}, {-180, 2.5, 144}, {}, 0.05},
        {{0, 3, 61}, {0, 3, 120}, {-17.3, 42.1}, 0.02},
        {{10, 1.5, 80}, {20, 1.5, 61}, {-5, 75}, 0.1},
        {{90, 1, 1}, {0, 10, 36}, {}, 0},
    };
    for (const Case& c : cases) {
        Grid g;
        g.theta = c.theta;
        g.phi = c.phi;
        for (unsigned seed : {1u, 9u}) {
            std::vector<double> v = test_values(g, c.nan_share, seed);
            for (const double level : {-0.1, 0.0, 0.05, 0.3, 0.7, 0.95, 1.2, 1.5, 2.0}) {
                const double skipping = solid_angle_at_or_above(g, v, level, c.band);
                const double every = solid_angle_at_or_above(g, v, level, c.band, true);
                INFO("level " << level << ", seed " << seed);
                CHECK(same_bits(skipping, every));
                if (level >= 1.5) CHECK(every == 0);  // above every value (they stay below 1.45)
            }
        }
    }
    // Rows of negative values beside rows that reach the level; a huge negative value widens the margin.
    Grid g;
    g.theta = {0, 10, 19};
    g.phi = {0, 10, 36};
    std::vector<double> v = test_values(g, 0.02, 3);
    for (int j = 0; j < 36; ++j) v[g.index(3, j)] = -5.0, v[g.index(12, j)] = 0.6999999999;
    v[g.index(7, 4)] = -1e12;
    for (const double level : {0.3, 0.6999999999, 0.7}) CHECK(same_bits(solid_angle_at_or_above(g, v, level), solid_angle_at_or_above(g, v, level, {}, true)));
}
