// Mean effective gain (pattern/diversity.hpp) against the properties Taga derives and the
// handbook dipole figures.
#include <catch2/catch.hpp>

#include "pattern/diversity.hpp"
#include "pattern/integrate.hpp"
#include "pattern/reference.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

namespace {
double meg_of(const FarFieldSet& s, const Environment& e) {
    auto m = mean_effective_gain(s, 0, e);
    REQUIRE(m);
    return m->meg;
}
}  // namespace

TEST_CASE("uniform environment: MEG = efficiency / 2 for any antenna and orientation", "[diversity]") {
    // Taga 1990: in the isotropic environment with XPR = 0 dB, MEG = eta / 2 (-3.01 dB lossless).
    const Environment u;  // uniform, XPR 0 dB
    const Mat3 turns[] = {Mat3{}, rotation_xyz_deg(37, 0, 0), rotation_xyz_deg(20, 65, 110),
                          rotation_xyz_deg(90, 0, 0)};
    for (ReferenceKind k : {ReferenceKind::short_dipole, ReferenceKind::dipole, ReferenceKind::small_loop,
                            ReferenceKind::loop, ReferenceKind::crossed_dipoles})
        for (const Mat3& r : turns) {
            FarFieldSet s = diversity_fixture(k, r);
            const double eta = radiated_power(s.grid, s.frequencies[0]) / (4 * pi);
            CHECK(meg_of(s, u) == Approx(eta / 2).epsilon(1e-12));
            CHECK(to_db(meg_of(s, u)) == Approx(-3.0103).margin(2e-3));
        }
    // With losses: scale a dipole's fields to 60 % radiation efficiency.
    FarFieldSet s = diversity_fixture(ReferenceKind::dipole);
    for (auto& v : s.frequencies[0].e_theta) v *= std::sqrt(0.6);
    const double eta = radiated_power(s.grid, s.frequencies[0]) / (4 * pi);
    CHECK(eta == Approx(0.6).epsilon(1e-3));
    CHECK(meg_of(s, u) == Approx(eta / 2).epsilon(1e-12));
}

TEST_CASE("all power vertical at the horizon: a vertical dipole gets its horizon gain", "[diversity]") {
    // Taga 1990 with P_theta a narrow Gaussian at m_V = 0 and XPR -> inf: MEG -> G_theta(90 deg).
    // Horizon gains: short dipole 1.5, half-wave dipole 1.641 (Balanis, Antenna Theory, 4.2 and 4.6).
    const Environment e = taga_environment(0, 0.25, 0, 0.25, INFINITY);
    CHECK(meg_of(diversity_fixture(ReferenceKind::short_dipole, {}, 0.5), e) == Approx(1.5).epsilon(2e-4));
    CHECK(meg_of(diversity_fixture(ReferenceKind::dipole, {}, 0.5), e) == Approx(1.641).epsilon(1e-3));
    // The same environment given as a user table: a 0.5-deg-wide spike at the horizon.
    Environment t;
    t.model = EnvironmentModel::profile;
    t.profile = {{-0.5, 0, 0}, {0, 1, 0}, {0.5, 0, 0}};
    t.xpr_db = INFINITY;
    CHECK(meg_of(diversity_fixture(ReferenceKind::short_dipole, {}, 0.5), t) == Approx(1.5).epsilon(1e-12));
    // A horizontal small loop is all E_phi: it takes in nothing of a vertical-only field.
    CHECK(meg_of(diversity_fixture(ReferenceKind::small_loop, {}, 0.5), e) == Approx(0.0).margin(1e-15));
}

TEST_CASE("XPR -> infinity keeps only the vertical part", "[diversity]") {
    // Taga 1990: the weights are XPR/(1+XPR) and 1/(1+XPR); their limits are 1 and 0.
    FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(35, 10, 0));
    Environment e = taga_environment(10, 15, 25, 30, 0);
    auto m0 = mean_effective_gain(s, 0, e);  // XPR 0 dB: each part has weight 1/2
    REQUIRE(m0);
    e.xpr_db = INFINITY;
    auto mi = mean_effective_gain(s, 0, e);
    REQUIRE(mi);
    CHECK(*mi->meg_horizontal == 0.0);
    CHECK(mi->meg == Approx(2 * *m0->meg_vertical).epsilon(1e-12));
    CHECK(*mi->vertical_share == Approx(1.0));
    e.xpr_db = 60;  // continuity toward the limit
    CHECK(meg_of(s, e) == Approx(mi->meg).epsilon(2e-6));
    e.xpr_db = -INFINITY;  // and the other way: horizontal only
    auto mh = mean_effective_gain(s, 0, e);
    REQUIRE(mh);
    CHECK(mh->meg == Approx(2 * *m0->meg_horizontal).epsilon(1e-12));
    // The parts always add up to MEG (Taga's formula is a sum of the two).
    CHECK(*m0->meg_vertical + *m0->meg_horizontal == Approx(m0->meg).epsilon(1e-14));
}

TEST_CASE("MEG does not change when the antenna turns about the vertical", "[diversity]") {
    // The Gaussian model is uniform in azimuth (Taga 1990), so a turn about z cannot matter.
    const Environment e = taga_environment(10, 15, 20, 30, 6);
    const Mat3 base = rotation_xyz_deg(40, 15, 0);
    const double m = meg_of(diversity_fixture(ReferenceKind::crossed_dipoles, base), e);
    for (double az : {30.0, 90.0, 137.0, 250.0}) {
        CHECK(meg_of(diversity_fixture(ReferenceKind::crossed_dipoles, rotation_z(az * deg) * base), e) ==
              Approx(m).epsilon(1e-9));
        auto r = mean_effective_gain_rotated(diversity_fixture(ReferenceKind::crossed_dipoles, base), 0, e, rotation_z(az * deg));
        REQUIRE(r);
        CHECK(r->meg == Approx(m).epsilon(1e-9));
    }
}

TEST_CASE("MEG converges with the grid step", "[diversity]") {
    // conventions.md: smooth patterns converge to well under 0.01 dB at 2 deg steps.
    const Environment e = taga_environment(10, 15, 20, 30, 6);
    const Mat3 r = rotation_xyz_deg(30, 20, 0);
    const double m1 = to_db(meg_of(diversity_fixture(ReferenceKind::crossed_dipoles, r, 1.0), e));
    const double m2 = to_db(meg_of(diversity_fixture(ReferenceKind::crossed_dipoles, r, 2.0), e));
    CHECK(m1 == Approx(m2).margin(0.01));
}

TEST_CASE("polarisation balance of known antennas", "[diversity]") {
    // A z dipole is all E_theta, a horizontal loop all E_phi (Balanis 4.2, 5.2): no direction is
    // balanced. Crossed dipoles in quadrature are circular on their axis, AR = 1/|cos t| (conventions.md),
    // so |E_theta|^2/|E_phi|^2 = cos^2 t for the horizontal pair: within 3 dB where |cos t| >= 10^(-0.15).
    const Environment u;
    auto d = mean_effective_gain(diversity_fixture(ReferenceKind::dipole), 0, u);
    REQUIRE(d);
    CHECK(*d->balanced_share == 0.0);
    CHECK(*d->vertical_share == Approx(1.0));
    auto c = mean_effective_gain(diversity_fixture(ReferenceKind::crossed_dipoles, {}, 0.5), 0, u);
    REQUIRE(c);
    // Uniform density: the share is the solid-angle fraction of |cos t| >= 10^(-0.15).
    CHECK(*c->balanced_share == Approx(1 - std::pow(10.0, -0.15)).margin(3e-3));
}

TEST_CASE("quantity and content: assumptions are stated, impossible figures refused", "[diversity]") {
    const Environment u;
    FarFieldSet s = diversity_fixture(ReferenceKind::dipole);
    s.quantity = Quantity::directivity;
    auto m = mean_effective_gain(s, 0, u);
    REQUIRE(m);
    CHECK(m->assumption.find("lossless") != std::string::npos);
    // Relative data of unknown scale: scaled to directivity over the full sphere.
    s.quantity = Quantity::relative;
    for (auto& v : s.frequencies[0].e_theta) v *= 7.0;
    m = mean_effective_gain(s, 0, u);
    REQUIRE(m);
    CHECK(m->meg == Approx(0.5).epsilon(1e-12));
    CHECK(m->assumption.find("lossless") != std::string::npos);
    // ... but not on part of the sphere.
    FarFieldSet half = s;
    half.grid.theta.count = 91;
    half.frequencies[0].e_theta.resize(half.grid.size());
    half.frequencies[0].e_phi.resize(half.grid.size());
    CHECK(!mean_effective_gain(half, 0, u));
    // Total-only data: only in a polarisation-blind environment.
    FarFieldSet t = diversity_fixture(ReferenceKind::dipole);
    t.content = FieldContent::total_only;
    CHECK(mean_effective_gain(t, 0, u));
    auto bad = mean_effective_gain(t, 0, taga_environment(10, 15, 10, 15, 6));
    REQUIRE(!bad);
    CHECK(bad.error().message.find("total-only") != std::string::npos);
}

TEST_CASE("partial grids count only the power that arrives where the pattern is known", "[diversity]") {
    // Upper hemisphere of a uniform environment: half of the incoming power (by symmetry).
    FarFieldSet s = diversity_fixture(ReferenceKind::dipole);
    s.grid.theta.count = 91;
    s.frequencies[0].e_theta.resize(s.grid.size());
    s.frequencies[0].e_phi.resize(s.grid.size());
    auto m = mean_effective_gain(s, 0, Environment{});
    REQUIRE(m);
    CHECK(m->sampled_share == Approx(0.5).epsilon(1e-9));
    CHECK(m->meg == Approx(0.25).epsilon(1e-3));  // half of efficiency/2 for a symmetric dipole
    CHECK(!m->notes.empty());
}

TEST_CASE("MEG needs no phase: magnitude-only data give the same MEG, but cannot be turned", "[diversity]") {
    // Taga's MEG uses only the partial gains |E_theta|^2 and |E_phi|^2 (Taga 1990).
    const Environment e = taga_environment(10, 15, 25, 30, 6);
    FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(30, 20, 0));
    FarFieldSet m = s;
    m.content = FieldContent::magnitude_only;
    for (auto& v : m.frequencies[0].e_theta) v = std::abs(v);
    for (auto& v : m.frequencies[0].e_phi) v = std::abs(v);
    auto a = mean_effective_gain(s, 0, e), b = mean_effective_gain(m, 0, e);
    REQUIRE(a);
    REQUIRE(b);
    CHECK(b->meg == Approx(a->meg).epsilon(1e-14));
    CHECK(*b->balanced_share == Approx(*a->balanced_share).epsilon(1e-14));
    // Turning it would need the phase between E_theta and E_phi.
    auto o = orientation_robustness(m, 0, e, OrientationSweep{});
    REQUIRE(!o);
    CHECK(o.error().message.find("phase") != std::string::npos);
}
