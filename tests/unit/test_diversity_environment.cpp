// Environment models (pattern/environment.hpp): numerical normalisation, shares, tables, presets.
#include <catch2/catch.hpp>

#include "importers/elevation_profile_csv.hpp"
#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"
#include "pattern/integrate.hpp"
#include "pattern/reference.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

namespace {
double grid_sum(const Grid& g, const std::vector<double>& p) {
    return integrate_samples(g, cell_weights(g), p.data());
}
}  // namespace

TEST_CASE("densities integrate to exactly 1 on the grid", "[diversity][environment]") {
    // Taga 1990: P_theta and P_phi each integrate to 1 over the sphere; done numerically with the
    // cell weights so a constant pattern gets exactly its value.
    const Environment e = taga_environment(15, 4, -10, 40, 0);
    for (double step : {0.5, 1.0, 5.0}) {
        Grid g = full_sphere_grid(step, step);
        auto s = sample_environment(e, g);
        REQUIRE(s);
        CHECK(grid_sum(g, s->p_theta) == Approx(1.0).epsilon(1e-13));
        CHECK(grid_sum(g, s->p_phi) == Approx(1.0).epsilon(1e-13));
        CHECK(s->sampled_share == 1.0);
    }
}

TEST_CASE("power shares of the continuous densities", "[diversity][environment]") {
    Environment u;
    // Uniform: a cap of half-angle a holds (1 - cos a) / 2 (area of a spherical cap).
    CHECK(density_share(u, true, 0, 60 * deg) == Approx(0.25).epsilon(1e-9));
    Environment g;
    g.model = EnvironmentModel::gaussian;
    g.v_mean_deg = g.h_mean_deg = 0;
    g.v_spread_deg = g.h_spread_deg = 10;
    // Centred on the horizon and symmetric: half above, half below (by symmetry).
    CHECK(density_share(g, true, 0, pi / 2) == Approx(0.5).epsilon(1e-9));
    // A narrow Gaussian: within +-1 sigma holds erf(1/sqrt 2) = 0.6827 (normal distribution tables);
    // the sin(theta) weight, 1 - d^2/2 near the horizon, shifts it by about sigma^2 / 2 = 1.5e-4.
    g.v_spread_deg = 1;
    CHECK(density_share(g, true, 89 * deg, 91 * deg) == Approx(0.682689).epsilon(3e-4));
}

TEST_CASE("profile tables: per solid angle and per elevation", "[diversity][environment]") {
    const FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(30, 10, 0));
    const Environment gauss = taga_environment(10, 15, 10, 15, 6);
    auto mg = mean_effective_gain(s, 0, gauss);
    REQUIRE(mg);
    // A table that tabulates the same Gaussian finely (per steradian) gives the same MEG.
    Environment t;
    t.model = EnvironmentModel::profile;
    t.xpr_db = 6;
    for (double el = -90; el <= 90 + 1e-9; el += 0.25) {
        const double v = raw_density(gauss, true, (90 - el) * deg);
        t.profile.push_back({el, v, v});
    }
    auto mt = mean_effective_gain(s, 0, t);
    REQUIRE(mt);
    CHECK(to_db(mt->meg) == Approx(to_db(mg->meg)).margin(1e-4));
    // A uniform environment per unit elevation is cos(elevation) (solid angle of a band); read
    // that way the table reproduces the uniform environment's MEG (Taga 1990: eta / 2).
    Environment c;
    c.model = EnvironmentModel::profile;
    c.profile_measure = ProfileMeasure::per_elevation;
    for (double el = -90; el <= 90 + 1e-9; el += 1) c.profile.push_back({el, std::cos(el * deg), std::cos(el * deg)});
    CHECK(polarisation_blind(c));
    CHECK(profile_xpr_db(c) == Approx(0.0).margin(1e-12));
    auto mc = mean_effective_gain(s, 0, c);
    REQUIRE(mc);
    CHECK(mc->meg == Approx(0.5).epsilon(1e-4));
}

TEST_CASE("environment parameters are checked", "[diversity][environment]") {
    Environment e;
    e.model = EnvironmentModel::gaussian;
    e.v_spread_deg = 0;
    e.h_spread_deg = 10;
    CHECK(!validate(e));
    e.v_spread_deg = 10;
    CHECK(validate(e));
    e.v_mean_deg = 95;
    CHECK(!validate(e));
    e.v_mean_deg = 0;
    e.xpr_db = NAN;
    CHECK(!validate(e));
    // Narrow power aimed between the samples of a coarse grid is an error, not a silent zero.
    Environment n;
    n.model = EnvironmentModel::profile;
    n.profile = {{1, 0, 0}, {2, 1, 1}, {3, 0, 0}};
    CHECK(!sample_environment(n, full_sphere_grid(10, 10)));
    CHECK(sample_environment(n, full_sphere_grid(1, 1)));
    // Found by fuzzing (tests/fuzz/fuzz_profile): a subnormal density at the only sampled elevation
    // made target / sum overflow and filled the grid with inf; it is "no power at any sample" instead.
    Environment d;
    d.model = EnvironmentModel::profile;
    d.profile = {{-10, 0, 0}, {0, 11e-320, 0.3}, {6, 0.2, 0.1}};
    for (ProfileMeasure m : {ProfileMeasure::per_solid_angle, ProfileMeasure::per_elevation}) {
        d.profile_measure = m;
        auto s = sample_environment(d, full_sphere_grid(15, 15));
        if (s) {
            for (double v : s->p_theta) CHECK((std::isfinite(v) && v >= 0));
            for (double v : s->p_phi) CHECK((std::isfinite(v) && v >= 0));
        } else {
            CHECK(s.error().message.find("no power at any sample") != std::string::npos);
        }
    }
}

TEST_CASE("presets carry values and a source", "[diversity][environment]") {
    for (const EnvironmentPreset& p : environment_presets()) {
        auto q = environment_preset(p.name);
        REQUIRE(q);
        CHECK(validate(*q));
        CHECK(q->name == p.name);
        CHECK(q->xpr_db == p.xpr_db);
        // Every row says where its numbers come from; the non-definitions say "from memory".
        const std::string src = p.source;
        CHECK(!src.empty());
        if (p.model != EnvironmentModel::uniform) CHECK(src.find("from memory") != std::string::npos);
    }
    auto bad = environment_preset("moon");
    REQUIRE(!bad);
    CHECK(bad.error().message.find("urban") != std::string::npos);
}

TEST_CASE("choosing an environment: presets, changed angles, custom models and refusals", "[diversity][environment]") {
    EnvironmentChoice c;
    auto u = choose_environment(c);
    REQUIRE(u);
    CHECK(u->environment.model == EnvironmentModel::uniform);
    CHECK(u->xpr_from == XprOrigin::preset);
    c.model = "urban";
    auto same = choose_environment(c);
    REQUIRE(same);
    CHECK(same->environment.name == "urban");
    c.v_mean_deg = same->environment.v_mean_deg;  // the preset's own value: not a change
    CHECK(choose_environment(c)->environment.name == "urban");
    c.v_spread_deg = 25;
    auto changed = choose_environment(c);
    REQUIRE(changed);
    CHECK(changed->environment.name == "urban (modified)");
    CHECK(changed->environment.v_spread_deg == 25);
    c.xpr_db = INFINITY;
    CHECK(choose_environment(c)->xpr_from == XprOrigin::user);
    c.v_spread_deg = 0;
    CHECK(!choose_environment(c));  // a zero spread
    EnvironmentChoice g;
    g.model = "gaussian";
    g.v_mean_deg = 10;
    auto missing = choose_environment(g);
    REQUIRE(!missing);
    CHECK(missing.error().message.find("vertical spread") != std::string::npos);
    EnvironmentChoice angles_on_uniform;
    angles_on_uniform.model = "uniform";
    angles_on_uniform.h_mean_deg = 3;
    CHECK(!choose_environment(angles_on_uniform));
    EnvironmentChoice table_with_preset;
    table_with_preset.model = "urban";
    table_with_preset.profile = std::vector<ProfilePoint>{{0, 1, 1}, {10, 1, 1}};
    CHECK(!choose_environment(table_with_preset));
}

TEST_CASE("extreme but valid profile values give finite figures on any scale", "[diversity][environment]") {
    // Issue 13 item 14: p_h = 1e-320 (a subnormal) gave MEG NaN and XPR +inf, 1e308 in both columns
    // gave XPR NaN. Each column is a shape on its own scale; the XPR of the table is the ratio of
    // the integrated columns (conventions.md, Taga 1990), here computed without overflow.
    const FarFieldSet z = diversity_fixture(ReferenceKind::dipole, {}, 2.0);
    auto table = [](double v, double h) {
        EnvironmentChoice c;
        c.profile = std::vector<ProfilePoint>{{-10, v, h}, {10, v, h}};
        c.profile_name = "t.csv";
        return choose_environment(c);
    };
    auto unit = table(1, 1), huge = table(1e308, 1e308), tiny = table(1, 1e-320);
    REQUIRE(unit);
    REQUIRE(huge);
    REQUIRE(tiny);
    CHECK(huge->environment.xpr_db == Approx(0).margin(1e-9));
    // 1 against 1e-320 (stored as a subnormal, 1e-320 to about three digits): XPR about 3200 dB.
    CHECK(tiny->environment.xpr_db == Approx(3200).epsilon(1e-3));
    CHECK(tiny->environment.weight_horizontal() == 0.0);
    CHECK(tiny->environment.weight_vertical() == 1.0);
    auto m1 = mean_effective_gain(z, 0, unit->environment), m2 = mean_effective_gain(z, 0, huge->environment);
    auto m3 = mean_effective_gain(z, 0, tiny->environment);
    REQUIRE(m1);
    REQUIRE(m2);
    REQUIRE(m3);
    CHECK(std::isfinite(m1->meg));
    CHECK(m2->meg == Approx(m1->meg).epsilon(1e-12));
    // XPR 0 dB halves the vertical dipole's take against the vertical-only case.
    CHECK(m3->meg == Approx(2 * m1->meg).epsilon(1e-9));
    // Built by hand without rescaling, such columns are refused with the reason, never NaN.
    Environment raw;
    raw.model = EnvironmentModel::profile;
    raw.profile = {{-10, 1e308, 1e308}, {10, 1e308, 1e308}};
    auto refused = mean_effective_gain(z, 0, raw);
    REQUIRE(!refused);
    CHECK(refused.error().message.find("rescale") != std::string::npos);
    // A huge finite XPR gives the limiting weights, not inf/inf.
    Environment big;
    big.xpr_db = 5000;
    CHECK(big.weight_vertical() == 1.0);
    CHECK(big.weight_horizontal() == 0.0);
}

TEST_CASE("elevation profile files: good tables and clear errors", "[diversity][environment]") {
    auto ok = parse_elevation_profile("# a comment\nP_H, elevation_deg ,p_v\n0.5,-10,1\n0,20,2\n", "t.csv");
    REQUIRE(ok);
    REQUIRE(ok->size() == 2);
    CHECK((*ok)[0].elevation_deg == -10);
    CHECK((*ok)[0].p_h == 0.5);
    CHECK((*ok)[1].p_v == 2);
    auto e1 = parse_elevation_profile("elevation_deg,p_v,p_h\n0,1,1\n10,x,1\n", "t.csv");
    REQUIRE(!e1);
    CHECK(e1.error().line == 3);
    CHECK(e1.error().column == 4);
    CHECK(e1.error().format().find("t.csv:3:4:") == 0);
    auto e2 = parse_elevation_profile("elevation_deg,p_v,p_h\n10,1,1\n5,1,1\n", "t.csv");
    REQUIRE(!e2);
    CHECK(e2.error().line == 3);
    auto e3 = parse_elevation_profile("elevation_deg,p_v\n0,1\n", "t.csv");
    REQUIRE(!e3);
    CHECK(e3.error().message.find("p_h") != std::string::npos);
    auto e4 = parse_elevation_profile("elevation_deg,p_v,p_h\n0,1,-1\n1,1,1\n", "t.csv");
    REQUIRE(!e4);
    CHECK(e4.error().column == 5);
    CHECK(!parse_elevation_profile("elevation_deg,p_v,p_h\n100,1,1\n101,1,1\n", "t.csv"));
    CHECK(!parse_elevation_profile("elevation_deg,p_v,p_h\n0,1,1\n", "t.csv"));
    CHECK(!parse_elevation_profile("", "t.csv"));
}

TEST_CASE("elevation curves for plots integrate to 1 over the sphere", "[diversity][environment]") {
    // Taga 1990: each density integrates to 1; over the sphere dOmega = 2 pi cos(el) d(el).
    const Environment g = taga_environment(10, 15, 30, 25, 0);
    const int n = 1800;
    ElevationCurve c = elevation_curve(g, n);
    REQUIRE(int(c.elevation_deg.size()) == n);
    double sv = 0, sh = 0;
    const double d = pi / n;
    for (int k = 0; k < n; ++k) {
        sv += c.p_v[std::size_t(k)] * 2 * pi * std::cos(c.elevation_deg[std::size_t(k)] * deg) * d;
        sh += c.p_h[std::size_t(k)] * 2 * pi * std::cos(c.elevation_deg[std::size_t(k)] * deg) * d;
    }
    CHECK(sv == Approx(1.0).epsilon(1e-5));
    CHECK(sh == Approx(1.0).epsilon(1e-5));
    // The uniform environment is 1 / (4 pi) everywhere.
    ElevationCurve u = elevation_curve(Environment{}, 7);
    for (double p : u.p_v) CHECK(p == Approx(1 / (4 * pi)).epsilon(1e-9));
}
