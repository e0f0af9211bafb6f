// The random-field simulation (pattern/fading.hpp) against the figures it must reproduce: MEG
// (Taga 1990), the Vaughan-Andersen correlation, the Rayleigh and Rician distributions and the
// exact combining figures (conventions.md, "The random-field simulation"). Seeds are fixed, so
// every check is deterministic; the tolerances are the simulation's own 95 % intervals.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/diversity.hpp"
#include "pattern/fading.hpp"
#include "pattern/marcum.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

namespace {
FadingOptions quick(std::size_t n = 40000) {
    FadingOptions o;
    o.realisations = n;
    o.seed = 7;
    return o;
}
bool inside(double v, const Interval& i) { return v >= i.lo && v <= i.hi; }
// A level against its estimate: inside the 95 % interval widened by 1.6 (about 99.9 %, as many
// checks share each seed) and 0.05 dB for a sum of 100 waves not being quite a Gaussian field.
bool near(double v, const LevelEstimate& l) {
    const double slack = 0.0116 * l.level;
    return v >= l.level - 1.6 * (l.level - l.ci95.lo) - slack && v <= l.level + 1.6 * (l.ci95.hi - l.level) + slack;
}
}  // namespace

TEST_CASE("simulated mean power agrees with MEG within its interval", "[fading][simulation]") {
    // conventions.md: the received power's expectation is exactly MEG (Taga 1990).
    const Environment envs[] = {Environment{}, urbanish_environment(), taga_environment(0, 30, 0, 30, 1)};
    const FarFieldSet ants[] = {diversity_fixture(ReferenceKind::dipole, {}, 2.0),
                                diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(50, 0, 0), 2.0),
                                diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(30, 10, 0), 2.0),
                                diversity_fixture(ReferenceKind::small_loop, rotation_xyz_deg(0, 70, 0), 2.0)};
    for (const Environment& e : envs) {
        std::vector<FadingAntenna> list;
        for (const FarFieldSet& s : ants) list.push_back({&s, 0});
        auto r = simulate_fading(list, e, quick());
        REQUIRE(r);
        for (std::size_t a = 0; a < list.size(); ++a) {
            const double meg = mean_effective_gain(ants[a], 0, e)->meg;
            INFO("antenna " << a << " environment " << e.name);
            CHECK(inside(meg, r->antennas[a].mean_ci95));
            REQUIRE(r->antennas[a].analytic_mean);
            CHECK(*r->antennas[a].analytic_mean == Approx(meg).epsilon(1e-12));
            // Rayleigh levels (conventions.md: the 1 % level is 0.01005 G): inside the order-statistic interval.
            for (const LevelEstimate& l : r->antennas[a].levels) CHECK(near(-meg * std::log1p(-l.outage), l));
            CHECK(r->antennas[a].fade_depth_db == Approx(19.98).margin(0.6));
        }
    }
}

TEST_CASE("simulated correlation and combining agree with the ECC and the exact figures", "[fading][simulation]") {
    // Vaughan & Andersen 1987: E[r1 conj r2] is the numerator of rho_e for any number of waves;
    // the power correlation tends to rho_e as the field becomes Gaussian (many waves).
    const Environment e = urbanish_environment();
    const FarFieldSet z = diversity_fixture(ReferenceKind::dipole, {}, 2.0);
    for (double tilt : {0.0, 35.0, 70.0, 90.0}) {
        const FarFieldSet t = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(tilt, 0, 0), 2.0);
        auto r = simulate_fading({{&z, 0}, {&t, 0}}, e, quick(60000));
        REQUIRE(r);
        REQUIRE(r->pair);
        REQUIRE(*r->pair);
        const SimulatedPair& q = **r->pair;
        REQUIRE(q.analytic_ecc);
        const double ecc = *q.analytic_ecc;
        INFO("tilt " << tilt << " ECC " << ecc << " power correlation " << q.power_correlation);
        CHECK(q.complex_correlation_squared == Approx(ecc).margin(0.01));
        // The interval plus the 1/waves distance of a finite sum of waves from a Gaussian field.
        CHECK(q.power_correlation >= q.power_correlation_ci95.lo - 1.0 / 100 - 1e-9);
        // The finite-wave value (pattern/fading.cpp finite_wave_correlation) is what the interval is around.
        REQUIRE(q.expected_power_correlation);
        CHECK(*q.expected_power_correlation == Approx(ecc).margin(0.02));
        CHECK(*q.expected_power_correlation >= q.power_correlation_ci95.lo - 0.003);
        CHECK(*q.expected_power_correlation <= q.power_correlation_ci95.hi + 0.003);
        CHECK(ecc >= q.power_correlation_ci95.lo - 0.01);
        CHECK(ecc <= q.power_correlation_ci95.hi + 0.01);
        // Selection and maximal ratio: the exact levels (pattern/combining.hpp) inside the intervals.
        REQUIRE(q.analytic);
        for (std::size_t k = 0; k < q.selection.size(); ++k) {
            CHECK(near(q.analytic->outages[k].selection_level, q.selection[k]));
            CHECK(near(q.analytic->outages[k].mrc_level, q.mrc[k]));
        }
    }
}

TEST_CASE("with few waves the power correlation is the finite-wave value, not the ECC", "[fading][simulation]") {
    // Short dipoles along z and x (Balanis sec. 4.2: E_theta = sqrt(1.5) sin t and
    // sqrt(1.5) cos t cos p on the gain scale), vertical waves only (XPR +inf), uniform arrival:
    // ECC 0. N waves of power 1/N with independent uniform phases; by hand, with the sphere
    // averages <cos^2 t> = 1/3, <cos^4 t> = 1/5, <sin^4 t> = 8/15, <sin^2 t cos^2 t> = 2/15,
    // <cos^2 p> = 1/2, <cos^4 p> = 3/8 (pattern/fading.cpp finite_wave_correlation's moments):
    //   cov = N (0.15 - 0.25) / N^2, var1 = 1 - 0.8 / N, var2 = 0.0625 + 0.04375 / N,
    //   rho_N = (-0.1 / N) / sqrt(var1 var2): -0.1031 for N = 4, -0.0040 for N = 100.
    ReferenceAntenna za;
    za.kind = ReferenceKind::short_dipole;
    ReferenceAntenna xa = za;
    xa.orientation = rotation_y(90 * deg);
    const FarFieldSet z = synthesize(za, 1.0, 1e9), x = synthesize(xa, 1.0, 1e9);
    Environment e;
    e.xpr_db = INFINITY;
    for (int n : {4, 100}) {
        FadingOptions o = quick(200000);
        o.waves = n;
        auto r = simulate_fading({{&z, 0}, {&x, 0}}, e, o);
        REQUIRE(r);
        REQUIRE(r->pair);
        REQUIRE(*r->pair);
        const SimulatedPair& q = **r->pair;
        const double rho = (-0.1 / n) / std::sqrt((1 - 0.8 / n) * (0.0625 + 0.04375 / n));
        INFO("waves " << n << " simulated " << q.power_correlation << " [" << q.power_correlation_ci95.lo << ", "
                      << q.power_correlation_ci95.hi << "]");
        REQUIRE(q.analytic_ecc);
        CHECK(*q.analytic_ecc == Approx(0).margin(1e-12));
        REQUIRE(q.expected_power_correlation);
        CHECK(*q.expected_power_correlation == Approx(rho).epsilon(2e-3));
        CHECK(inside(*q.expected_power_correlation, q.power_correlation_ci95));
        // With 4 waves the bias is far outside the interval around 0: the audit's finding.
        if (n == 4) CHECK(!inside(0.0, q.power_correlation_ci95));
    }
    // An antenna against itself: 1 for any number of waves.
    FadingOptions o = quick(1000);
    o.waves = 3;
    auto self = simulate_fading({{&x, 0}, {&x, 0}}, e, o);
    REQUIRE(self);
    CHECK((**self->pair).expected_power_correlation.value_or(0) == Approx(1).epsilon(1e-12));
}

TEST_CASE("a dominant wave gives the Rician distribution with the antenna's own K-factor", "[fading][simulation]") {
    // conventions.md: P(|a|^2 <= x) = 1 - Q1(sqrt(2K), sqrt(2(K+1)x/Omega)); the deterministic part is the
    // field against the wave's polarisation, the diffuse part MEG.
    const Environment e = urbanish_environment();
    const FarFieldSet z = diversity_fixture(ReferenceKind::dipole, {}, 2.0);
    FadingOptions o = quick(60000);
    o.dominant = DominantWave{90, 30, incoming_field(WavePolarisation::vertical, 90, 30), 10.0};
    auto r = simulate_fading({{&z, 0}}, e, o);
    REQUIRE(r);
    const SimulatedAntenna& a = r->antennas[0];
    const double meg = mean_effective_gain(z, 0, e)->meg;
    // A vertical half-wave dipole meets a vertical wave at the horizon with its full gain, 1.641
    // (Balanis 4.6); its own K is 10 * 1.641 / MEG.
    REQUIRE(a.analytic_k);
    CHECK(*a.analytic_k == Approx(10 * 1.641 / meg).epsilon(2e-3));
    CHECK(inside(*a.analytic_mean, a.mean_ci95));
    for (std::size_t k = 0; k < a.levels.size(); ++k) {
        CHECK(near(a.analytic_levels[k], a.levels[k]));
        const double p = rician_power_cdf(a.analytic_levels[k], *a.analytic_k, *a.analytic_mean);
        CHECK(p == Approx(a.levels[k].outage).epsilon(1e-9));
    }
    // A horizontal wave: the dipole sees none of it, the distribution stays Rayleigh around MEG / (K + 1).
    o.dominant->field = incoming_field(WavePolarisation::horizontal, 90, 30);
    auto h = simulate_fading({{&z, 0}}, e, o);
    REQUIRE(h);
    CHECK(*h->antennas[0].analytic_k == Approx(0).margin(1e-12));
    CHECK(inside(meg / 11, h->antennas[0].mean_ci95));
}

TEST_CASE("circular dominant waves: matched and opposite senses", "[fading][simulation]") {
    // IEEE Std 145: crossed dipoles fed at -90 deg radiate right-hand circular toward +z; an RHCP wave
    // arriving from the zenith meets their full zenith gain (1.5 for short dipoles in quadrature,
    // directivity 3 dBi... measured here against the pattern itself), an LHCP wave almost none.
    const FarFieldSet c = diversity_fixture(ReferenceKind::crossed_dipoles, {}, 2.0);
    const double zenith = std::norm(c.frequencies[0].e_theta[0]) + std::norm(c.frequencies[0].e_phi[0]);
    FadingOptions o = quick(2000);
    o.dominant = DominantWave{0, 0, incoming_field(WavePolarisation::rhcp, 0, 0), 100.0};
    auto r = simulate_fading({{&c, 0}}, Environment{}, o);
    REQUIRE(r);
    const double meg = mean_effective_gain(c, 0, Environment{})->meg;
    CHECK(*r->antennas[0].analytic_k * meg / 100 == Approx(zenith).epsilon(1e-9));
    o.dominant->field = incoming_field(WavePolarisation::lhcp, 0, 0);
    auto l = simulate_fading({{&c, 0}}, Environment{}, o);
    REQUIRE(l);
    CHECK(*l->antennas[0].analytic_k == Approx(0).margin(1e-9));
    // A partner with the same crossed dipoles standing at the zenith, facing down at us: it sends
    // RHCP toward -z only if it is mounted upside down (turned 180 deg about x).
    const FarFieldSet partner = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(180, 0, 0), 2.0);
    auto f = partner_field(partner, 0, 0, 0);
    REQUIRE(f);
    const CVec3 rh = incoming_field(WavePolarisation::rhcp, 0, 0);
    const cplx overlap = std::conj(rh.x) * f->x + std::conj(rh.y) * f->y + std::conj(rh.z) * f->z;
    CHECK(std::norm(overlap) == Approx(1).epsilon(1e-9));
}

TEST_CASE("random orientation: uniform turns keep the isotropic MEG; tilts follow the sweep", "[fading][simulation]") {
    // Taga 1990: in the uniform environment with XPR 0 dB, MEG = efficiency / 2 in every orientation.
    const FarFieldSet z = diversity_fixture(ReferenceKind::dipole, {}, 2.0);
    FadingOptions o = quick(20000);
    o.random_tilt_max_deg = 180;
    auto r = simulate_fading({{&z, 0}}, Environment{}, o);
    REQUIRE(r);
    CHECK(inside(mean_effective_gain(z, 0, Environment{})->meg, r->antennas[0].mean_ci95));
    CHECK(!r->antennas[0].analytic_mean);  // no closed form with random orientation
    // In a Gaussian environment, the mean over random orientations with the axis within 90 deg is
    // the orientation sweep's random mean (pattern/diversity.hpp; 5-deg steps), to its quadrature.
    const Environment e = urbanish_environment();
    o.random_tilt_max_deg = 90;
    auto t = simulate_fading({{&z, 0}}, e, o);
    REQUIRE(t);
    OrientationSweep sw;
    sw.tilt_step_deg = 5;
    sw.roll_step_deg = 10;
    auto sweep = orientation_robustness(z, 0, e, sw);
    REQUIRE(sweep);
    const Interval& ci = t->antennas[0].mean_ci95;
    CHECK(sweep->random_mean >= ci.lo * 0.99);
    CHECK(sweep->random_mean <= ci.hi * 1.01);
}

TEST_CASE("the simulation is reproducible and independent of the thread count", "[fading][simulation]") {
    const FarFieldSet z = diversity_fixture(ReferenceKind::dipole, {}, 3.0);
    const FarFieldSet c = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(30, 0, 0), 3.0);
    FadingOptions o = quick(10000);
    auto a = simulate_fading({{&z, 0}, {&c, 0}}, urbanish_environment(), o);
    o.threads = 3;
    auto b = simulate_fading({{&z, 0}, {&c, 0}}, urbanish_environment(), o);
    o.seed = 8;
    auto d = simulate_fading({{&z, 0}, {&c, 0}}, urbanish_environment(), o);
    REQUIRE(a);
    REQUIRE(b);
    REQUIRE(d);
    CHECK(a->antennas[1].mean == b->antennas[1].mean);
    CHECK((*a->pair)->power_correlation == (*b->pair)->power_correlation);
    CHECK(a->antennas[1].mean != d->antennas[1].mean);
}

TEST_CASE("the simulation refuses what it cannot do, with the reason", "[fading][simulation]") {
    const FarFieldSet z = diversity_fixture(ReferenceKind::dipole, {}, 3.0);
    FarFieldSet m = z;
    m.content = FieldContent::magnitude_only;
    for (auto& v : m.frequencies[0].e_theta) v = std::abs(v);
    // Magnitudes alone: one antenna's statistics are fine, a pair's correlation is not.
    auto r = simulate_fading({{&z, 0}, {&m, 0}}, Environment{}, quick(1000));
    REQUIRE(r);
    REQUIRE(r->pair);
    CHECK(!*r->pair);
    FadingOptions turned = quick(1000);
    turned.random_tilt_max_deg = 30;
    auto t = simulate_fading({{&m, 0}}, Environment{}, turned);
    REQUIRE(!t);
    CHECK(t.error().message.find("phase") != std::string::npos);
    FadingOptions bad = quick(1000);
    bad.realisations = 10;
    CHECK(!simulate_fading({{&z, 0}}, Environment{}, bad));
    bad = quick(1000);
    bad.outages = {1.5};
    CHECK(!simulate_fading({{&z, 0}}, Environment{}, bad));
    bad = quick(1000);
    bad.dominant = DominantWave{90, 0, incoming_field(WavePolarisation::vertical, 0, 0), 5};  // field along the direction
    CHECK(!simulate_fading({{&z, 0}}, Environment{}, bad));
}
