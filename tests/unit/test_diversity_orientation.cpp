// Orientation robustness (pattern/diversity.hpp): the direct rotated-environment integral against
// synthesising the turned antenna and against resampling the pattern (pattern/rotate.hpp).
#include <catch2/catch.hpp>

#include "pattern/diversity.hpp"
#include "pattern/integrate.hpp"
#include "pattern/reference.hpp"
#include "pattern/rotate.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

TEST_CASE("MEG of a turned antenna: the direct integral equals synthesising it turned", "[diversity][orientation]") {
    // Re-orienting is E'(r) = R E(R^T r) (conventions.md); the closed-form antenna turned by R is the
    // exact answer. Integrating the original pattern against the turned environment is exact in
    // the continuum, so only the quadrature differs.
    const Environment e = taga_environment(10, 15, 25, 30, 6);
    const FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(0, 20, 0));
    for (const Mat3& r : {rotation_xyz_deg(30, 0, 0), rotation_xyz_deg(50, 20, 70), rotation_xyz_deg(90, 45, 0)}) {
        auto direct = mean_effective_gain_rotated(s, 0, e, r);
        REQUIRE(direct);
        auto exact = mean_effective_gain(diversity_fixture(ReferenceKind::crossed_dipoles, r * rotation_xyz_deg(0, 20, 0)), 0, e);
        REQUIRE(exact);
        CHECK(to_db(direct->meg) == Approx(to_db(exact->meg)).margin(0.005));
        CHECK(to_db(*direct->meg_vertical) == Approx(to_db(*exact->meg_vertical)).margin(0.01));
        CHECK(to_db(*direct->meg_horizontal) == Approx(to_db(*exact->meg_horizontal)).margin(0.01));
        // Resampling the pattern (bilinear on Cartesian vectors) agrees too, less closely.
        auto turned = rotate_pattern(s, r);
        REQUIRE(turned);
        auto resampled = mean_effective_gain(*turned, 0, e);
        REQUIRE(resampled);
        CHECK(to_db(resampled->meg) == Approx(to_db(exact->meg)).margin(0.03));
    }
}

TEST_CASE("uniform environment: every orientation gives efficiency / 2", "[diversity][orientation]") {
    // Taga 1990: MEG = eta / 2 in the isotropic environment whatever the orientation.
    const FarFieldSet s = diversity_fixture(ReferenceKind::dipole);
    const double eta = radiated_power(s.grid, s.frequencies[0]) / (4 * pi);  // 1 up to the grid quadrature
    auto o = orientation_robustness(s, 0, Environment{}, OrientationSweep{});
    REQUIRE(o);
    CHECK(o->exact_roll_shift);
    CHECK(o->samples.size() == 1 + 6 * 24);  // tilt 0 once, tilts 15..90 with 24 rolls each
    CHECK(o->min == Approx(eta / 2).epsilon(1e-12));
    CHECK(o->max == Approx(eta / 2).epsilon(1e-12));
    CHECK(o->random_mean == Approx(eta / 2).epsilon(1e-12));
}

TEST_CASE("orientation sweep: roll by column shift equals the general rotation", "[diversity][orientation]") {
    const Environment e = taga_environment(5, 10, 15, 25, 4);
    const FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(25, 0, 10), 2.0);
    OrientationSweep sw;
    sw.tilt_step_deg = 30;
    sw.roll_step_deg = 30;
    auto o = orientation_robustness(s, 0, e, sw);
    REQUIRE(o);
    CHECK(o->exact_roll_shift);
    for (const OrientationSample& q : o->samples) {
        // R = R_x(tilt) R_z(roll), as documented.
        auto m = mean_effective_gain_rotated(s, 0, e, rotation_x(q.tilt_deg * deg) * rotation_z(q.roll_deg * deg));
        REQUIRE(m);
        CHECK(q.meg == Approx(m->meg).epsilon(1e-10));
    }
    // A roll step that is not a multiple of the 2-deg phi step (15 / 2 = 7.5) takes the general
    // path, evaluating the environment for every orientation: same answers where the sets meet.
    sw.roll_step_deg = 15;
    auto o1 = orientation_robustness(s, 0, e, sw);
    REQUIRE(o1);
    CHECK(!o1->exact_roll_shift);
    int met = 0;
    for (const OrientationSample& q1 : o1->samples)
        for (const OrientationSample& q : o->samples)
            if (q.tilt_deg == q1.tilt_deg && q.roll_deg == q1.roll_deg) {
                CHECK(q1.meg == Approx(q.meg).epsilon(1e-10));
                ++met;
            }
    CHECK(met == int(o->samples.size()));
    CHECK(o1->min <= o1->median);
    CHECK(o1->median <= o1->max);
    // Tilt 0 is the antenna as given.
    auto m0 = mean_effective_gain(s, 0, e);
    REQUIRE(m0);
    CHECK(o->samples.front().meg == Approx(m0->meg).epsilon(1e-12));
}

TEST_CASE("a vertical dipole laid down loses a vertical horizon field", "[diversity][orientation]") {
    // A short dipole radiates the transverse part of its moment (Balanis 4.2): lying horizontal it
    // sends only horizontal polarisation toward the horizon. In a vertical-only horizon
    // environment its MEG falls from 1.5 (standing) to nearly zero (tilt 90).
    const Environment e = taga_environment(0, 1, 0, 1, INFINITY);
    OrientationSweep sw;
    sw.tilt_step_deg = 90;
    sw.roll_step_deg = 90;
    auto o = orientation_robustness(diversity_fixture(ReferenceKind::short_dipole, {}, 0.5), 0, e, sw);
    REQUIRE(o);
    CHECK(o->best.tilt_deg == 0);
    CHECK(o->best.meg == Approx(1.5).epsilon(1e-3));
    CHECK(o->worst.tilt_deg == 90);
    CHECK(o->worst.meg < 1e-3);
}

TEST_CASE("random-orientation statistics weight each tilt by its solid angle", "[diversity][orientation]") {
    // A uniformly random axis direction has density sin(tilt) (area element of the sphere). A short
    // dipole radiates the transverse part of its moment p (Balanis 4.2, D = 1.5): toward a horizon
    // direction u (u.z = 0) the vertical part is p.z - (p.u)(u.z) = cos(tilt), whatever the azimuth.
    // So in a vertical-only field at the horizon MEG(tilt) = 1.5 cos^2(tilt); over the hemisphere
    // the mean is 1.5 * integral of cos^2 t sin t dt = 0.5, and as cos t is uniform on [0, 1] for a
    // random axis, the 10th percentile is 1.5 * 0.1^2 = 0.015. (Derived here.)
    Environment e;
    e.model = EnvironmentModel::gaussian;
    e.v_mean_deg = e.h_mean_deg = 0;
    e.v_spread_deg = e.h_spread_deg = 0.5;
    e.xpr_db = INFINITY;
    OrientationSweep sw;
    sw.tilt_step_deg = 1;
    sw.roll_step_deg = 90;
    auto o = orientation_robustness(diversity_fixture(ReferenceKind::short_dipole, {}, 0.5), 0, e, sw);
    REQUIRE(o);
    for (const TiltRow& r : o->by_tilt) {
        CHECK(r.mean == Approx(1.5 * std::pow(std::cos(r.tilt_deg * deg), 2)).margin(2e-3));
    }
    CHECK(o->random_mean == Approx(0.5).margin(3e-3));
    CHECK(o->random_p10 == Approx(0.015).margin(0.01));
    CHECK(o->random_p10 <= o->median);
}

TEST_CASE("per-elevation tables stay right when turned, up to the environment's poles", "[diversity][orientation]") {
    // A table of cos(elevation) per unit elevation is the uniform environment (the solid angle of a
    // band is 2 pi cos(el) d(el)); turned any way it must still give efficiency / 2 (Taga 1990).
    // This drives the cell-mean path used where such a table's per-steradian density diverges.
    Environment c;
    c.model = EnvironmentModel::profile;
    c.profile_measure = ProfileMeasure::per_elevation;
    for (double el = -90; el <= 90 + 1e-9; el += 1) c.profile.push_back({el, std::cos(el * deg), std::cos(el * deg)});
    const FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(20, 0, 0), 1.0);
    const double eta = radiated_power(s.grid, s.frequencies[0]) / (4 * pi);
    OrientationSweep sw;
    sw.tilt_step_deg = 30;
    sw.roll_step_deg = 60;
    auto o = orientation_robustness(s, 0, c, sw);
    REQUIRE(o);
    CHECK(o->min == Approx(eta / 2).epsilon(2e-4));
    CHECK(o->max == Approx(eta / 2).epsilon(2e-4));
}

TEST_CASE("an orientation sweep is bounded: fine steps over every orientation are refused, not run for hours",
          "[diversity][orientation]") {
    // Bad input gets a clear message, never a hang (common practice, the project's rule for bad
    // input). 0.1-degree steps over every orientation are 1802 x 3600 orientations, each a pass
    // over the grid; the audit found `diversity --orientations --tilt-step 0.1 --roll-step 0.1`
    // (and `rank` with the same steps) still running after 100 s.
    const OrientationSweep fine{0.1, 180, 0.1};
    CHECK(sweep_orientation_count(fine) > max_sweep_orientations);
    const Status s = validate(fine);
    REQUIRE_FALSE(s);
    CHECK_THAT(s.error().message, Catch::Contains("orientations, more than 100000") && Catch::Contains("larger"));
    auto r = orientation_robustness(diversity_fixture(ReferenceKind::dipole, {}, 10.0), 0, Environment{}, fine);
    CHECK_FALSE(r);
    // The documented defaults and 1-degree steps over every orientation stay allowed.
    CHECK(validate(OrientationSweep{}));
    CHECK(validate(OrientationSweep{1, 180, 1}));
    CHECK(sweep_orientation_count(OrientationSweep{15, 90, 15}) >= 7 * 24);
}
