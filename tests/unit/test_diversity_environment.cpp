// Environment models (pattern/environment.hpp): numerical normalisation, shares, tables, presets.
#include <catch2/catch.hpp>

#include "importers/elevation_profile_csv.hpp"
#include "pattern/diversity.hpp"
#include "pattern/environment.hpp"
#include "pattern/integrate.hpp"
#include "pattern/reference.hpp"

using namespace ellipsa;

namespace {
double grid_sum(const Grid& g, const std::vector<double>& p) {
    return integrate_samples(g, cell_weights(g), p.data());
}
}  // namespace

TEST_CASE("densities integrate to exactly 1 on the grid", "[diversity][environment]") {
    // Taga 1990: P_theta and P_phi each integrate to 1 over the sphere; done numerically with the
    // cell weights so a constant pattern gets exactly its value.
    Environment e;
    e.model = EnvironmentModel::gaussian;
    e.v_mean_deg = 15;
    e.v_spread_deg = 4;
    e.h_mean_deg = -10;
    e.h_spread_deg = 40;
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
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.orientation = rotation_xyz_deg(30, 10, 0);
    FarFieldSet s = synthesize(a, 1.0, 1e9);
    Environment gauss;
    gauss.model = EnvironmentModel::gaussian;
    gauss.v_mean_deg = gauss.h_mean_deg = 10;
    gauss.v_spread_deg = gauss.h_spread_deg = 15;
    gauss.xpr_db = 6;
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
}

TEST_CASE("presets carry values and a source", "[diversity][environment]") {
    for (const EnvironmentPreset& p : environment_presets()) {
        CHECK(validate(p.environment));
        CHECK(!p.environment.source.empty());
        auto q = environment_preset(p.name);
        REQUIRE(q);
        CHECK(q->name == p.name);
    }
    auto bad = environment_preset("moon");
    REQUIRE(!bad);
    CHECK(bad.error().message.find("urban") != std::string::npos);
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
    Environment g;
    g.model = EnvironmentModel::gaussian;
    g.v_mean_deg = 10;
    g.v_spread_deg = 15;
    g.h_mean_deg = 30;
    g.h_spread_deg = 25;
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
