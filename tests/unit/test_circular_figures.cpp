// Axial-ratio beamwidth and solid angle against the crossed-dipole turnstile's closed form.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/circular.hpp"
#include "pattern/cut.hpp"
#include "pattern/reference.hpp"
#include "pattern/summary.hpp"

using namespace ellipsa;

namespace {
FarFieldSet turnstile(double step_deg) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = -90;  // right-hand toward +z
    return synthesize(a, step_deg, 2.45e9);
}
}  // namespace

TEST_CASE("circularity threshold: AR <= t exactly when |V|/I >= 2t/(1+t^2)", "[circular]") {
    // sin 2chi = V/I and AR = |cot chi| (IEEE Std 145-2013; Balanis sec. 2.12): m = 2 AR / (1 + AR^2).
    const double t = std::pow(10.0, 3.0 / 20);
    CHECK(circularity_at_ar_db(3.0) == Approx(2 * t / (1 + t * t)).epsilon(1e-15));
    CHECK(circularity_at_ar_db(0.0) == Approx(1.0).epsilon(1e-15));
    // A field with AR exactly 2 (E_theta = 2, E_phi = j): m = 2*2/(1+4) = 0.8.
    CHECK(circularity(2.0, cplx(0, 1)) == Approx(0.8).epsilon(1e-15));
    CHECK(circularity(1.0, 0.0) == Approx(0.0).margin(1e-15));
    CHECK(std::isnan(circularity(0.0, 0.0)));
}

TEST_CASE("turnstile: AR beamwidth is 2 acos(10^(-3/20)) = 89.864 deg in every plane", "[circular]") {
    // conventions.md (closed-form reference antennas): two short dipoles crossed at right angles and
    // fed in quadrature give AR = 1/|cos t| at angle t from their common normal, for every azimuth.
    // AR <= 3 dB  <=>  |cos t| >= 10^(-3/20), so t <= acos(10^(-3/20)) = 44.932 deg on either side of
    // the normal and the width is 2 acos(10^(-3/20)) = 89.86395 deg (not 90: 3 dB is 10^(3/20) =
    // 1.4125 in field ratio, a little below sqrt 2 = 1/cos 45 deg). Derivation above; value by hand.
    const double expected = 2 * std::acos(std::pow(10.0, -3.0 / 20)) / deg;
    CHECK(expected == Approx(89.86395291988133).epsilon(1e-12));
    const FarFieldSet s = turnstile(1.0);
    const PatternSummary r = summarize(s, 0);
    REQUIRE(r.peak.theta_deg == Approx(0).margin(1e-9));  // peak on the normal (+z; ties go to lower theta)
    for (double phi : {0.0, 37.0, 90.0}) {
        for (bool along_phi : {false, true}) {
            const ArBeamwidth b = ar_beamwidth_through(s, 0, 0.0, phi, along_phi);
            INFO("phi " << phi << " along_phi " << along_phi << ": " << b.unavailable_reason);
            REQUIRE(b.width_deg);
            // The cut is interpolated from a 1-degree grid (Cartesian bilinear) and the crossing
            // linearly between 0.25-degree cut samples: agreement to 0.05 deg.
            CHECK(*b.width_deg == Approx(expected).margin(0.05));
            CHECK(*b.left_deg == Approx(-expected / 2).margin(0.05));
            CHECK(*b.right_deg == Approx(expected / 2).margin(0.05));
        }
    }
    // A user threshold: AR <= 6 dB gives 2 acos(10^(-6/20)) = 119.93 deg.
    const ArBeamwidth b6 = ar_beamwidth_through(s, 0, 0.0, 0.0, false, 6.0);
    REQUIRE(b6.width_deg);
    CHECK(*b6.width_deg == Approx(2 * std::acos(std::pow(10.0, -6.0 / 20)) / deg).margin(0.05));
}

TEST_CASE("AR beamwidth is missing with a reason where there is none", "[circular]") {
    const FarFieldSet s = turnstile(2.0);
    // On the horizon the turnstile is linear: AR there exceeds any threshold.
    const ArBeamwidth h = ar_beamwidth_through(s, 0, 90.0, 0.0, false);
    CHECK(!h.width_deg);
    CHECK(h.unavailable_reason.find("exceeds") != std::string::npos);
    // Without phase there is no axial ratio.
    FarFieldSet m = s;
    m.content = FieldContent::magnitude_only;
    const ArBeamwidth n = ar_beamwidth_through(m, 0, 0.0, 0.0, false);
    CHECK(!n.width_deg);
    CHECK(n.unavailable_reason.find("phase") != std::string::npos);
    // Linear dipole: AR infinite at its peak.
    ReferenceAntenna d;
    d.kind = ReferenceKind::dipole;
    const FarFieldSet ds = synthesize(d, 2.0, 1e9);
    const ArBeamwidth dl = ar_beamwidth_through(ds, 0, 90.0, 0.0, false);
    CHECK(!dl.width_deg);
}

TEST_CASE("turnstile: the solid angle where AR <= threshold is two caps, 4 pi (1 - cos t0)", "[circular]") {
    // The region |cos t| >= c0 is two polar caps of half-angle t0 = acos c0, each 2 pi (1 - cos t0) sr
    // (the area of a spherical cap, common practice), so the share of the sphere is 1 - c0.
    // |V|/I is interpolated inside the cells (pattern/sphere_coverage.hpp), so the error is second
    // order in the step: a small fraction of the cell row (sin t0 dt / 2 per cap) that counting
    // whole cells could miss, and about four times smaller when the step halves.
    double previous = 0;
    for (double step : {2.0, 1.0}) {
        const FarFieldSet s = turnstile(step);
        double worst = 0;
        for (double t0_deg : {40.5, 44.93, 60.2}) {
            const double t0 = t0_deg * deg;
            const double thr_db = 20 * std::log10(1 / std::cos(t0));
            const auto a = ar_solid_angle(s, 0, thr_db);
            REQUIRE(a);
            INFO("step " << step << " t0 " << t0_deg << " share " << a->share);
            const double err = std::abs(a->share - (1 - std::cos(t0)));
            CHECK(err <= 0.05 * std::sin(t0) * step * deg);
            CHECK(a->solid_angle_sr == Approx(4 * pi * a->share).epsilon(1e-12));
            worst = std::max(worst, err);
        }
        if (previous > 0) CHECK(worst < previous / 3);
        previous = worst;
    }
    const FarFieldSet s = turnstile(1.0);
    const auto a3 = ar_solid_angle(s, 0, 3.0);
    REQUIRE(a3);
    CHECK(std::abs(a3->share - (1 - std::pow(10.0, -3.0 / 20))) <= 0.05 * std::sin(45 * deg) * 1.0 * deg);
    FarFieldSet m = s;
    m.content = FieldContent::magnitude_only;
    CHECK(!ar_solid_angle(m, 0));
}

TEST_CASE("AR beamwidth through a direction: the same figures as on the whole cut", "[circular]") {
    // Reference: ar_beamwidth on the whole cut as sample_cut gives it (pattern/circular.hpp, the
    // definition). ar_beamwidth_through interpolates only the chosen sample when that sample
    // decides the answer (outside the data, zero field, AR above the threshold); every answer
    // must be the same, bit for bit, as the definition's.
    auto same = [](const ArBeamwidth& a, const ArBeamwidth& b) {
        auto eq = [](const std::optional<double>& x, const std::optional<double>& y) { return x.has_value() == y.has_value() && (!x || *x == *y); };
        return eq(a.width_deg, b.width_deg) && eq(a.left_deg, b.left_deg) && eq(a.right_deg, b.right_deg) &&
               a.unavailable_reason == b.unavailable_reason;
    };
    ReferenceAntenna tilted;
    tilted.kind = ReferenceKind::crossed_dipoles;
    tilted.phase_deg = -60;
    tilted.orientation = rotation_axis(normalized(Vec3{0.3, 1, 0.2}), 35 * deg);
    ReferenceAntenna dipole;
    FarFieldSet partial = synthesize(tilted, 3.0, 2e9);  // only theta <= 60 deg sampled: cuts leave the data
    Grid g = partial.grid;
    g.theta = {0, 3, 21};
    partial = synthesize_on(tilted, g, 2e9);
    const FarFieldSet sets[] = {turnstile(2.0), synthesize(tilted, 2.5, 2e9), synthesize(dipole, 2.0, 1e9), partial};
    int decided_early = 0, whole = 0;
    for (const FarFieldSet& s : sets)
        for (const double t : {0.0, 20.0, 47.5, 90.0, 133.0, 180.0})
            for (const double p : {0.0, 41.0, 270.0})
                for (const bool along : {false, true})
                    for (const double thr : {3.0, 10.0}) {
                        const CutSamples c = sample_cut(s, 0, CutSpec::through(t, p, along), default_cut_step(s.grid));
                        const ArBeamwidth def = ar_beamwidth(s, c, nearest_cut_sample(c, direction(t * deg, p * deg)), thr);
                        const ArBeamwidth fast = ar_beamwidth_through(s, 0, t, p, along, thr);
                        INFO("theta " << t << " phi " << p << " along_phi " << along << " threshold " << thr << ": " << def.unavailable_reason);
                        CHECK(same(def, fast));
                        (def.width_deg || def.unavailable_reason.find("along the cut") != std::string::npos ||
                                 def.unavailable_reason.find("leaves") != std::string::npos
                             ? whole
                             : decided_early)++;
                    }
    CHECK(decided_early > 20);  // both kinds of answer were compared
    CHECK(whole > 20);
}
