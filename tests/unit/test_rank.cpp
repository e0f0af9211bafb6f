// Ranking candidates (pattern/rank.hpp) against closed forms: the reference dipole's MEG in the
// isotropic and the vertical-only environments, a short horizontal dipole's vertical share, a lossy
// copy of the reference, the random-orientation fading level of a short dipole by an independent
// quadrature over orientations, and the contract of the sorted rows.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

#include "diversity_fixtures.hpp"
#include "pattern/combining.hpp"
#include "pattern/diversity_study.hpp"
#include "pattern/rank.hpp"

using namespace ellipsa;

namespace {

double db(double x) { return 10 * std::log10(x); }

Environment uniform_environment(double xpr_db) {
    Environment e;
    e.xpr_db = xpr_db;
    return e;
}

FarFieldSet scaled(FarFieldSet s, double power) {
    for (FarField& f : s.frequencies) {
        for (cplx& v : f.e_theta) v *= std::sqrt(power);
        for (cplx& v : f.e_phi) v *= std::sqrt(power);
    }
    return s;
}

}  // namespace

TEST_CASE("the reference dipole's MEG: -3.01 dBi isotropic, 0 dBi vertical-only, 2.15 dBi at the horizon", "[rank]") {
    const FarFieldSet ref = reference_dipole(full_sphere_grid(1, 1), 1e9);
    const RankCandidate r{&ref, "reference", 0};
    RankOptions o;
    o.sweep = {30, 180, 30};
    // A lossless antenna in the isotropic environment with XPR 0 dB: MEG = 1/2 = -3.01 dBi in every
    // orientation (Taga, IEEE Trans. VT-39, 1990; Kildal & Rosengren, IEEE Commun. Mag. 42(12), 2004).
    auto k = rank_candidates({r}, r, {uniform_environment(0)}, o);
    REQUIRE(k);
    const RankFigures& f = k->rows.front().environments.front();
    REQUIRE(f.meg);
    CHECK(db(f.meg->meg) == Approx(-3.0103).margin(1e-4));
    REQUIRE(f.orientations);
    REQUIRE(*f.orientations);
    CHECK(db((**f.orientations).min) == Approx(-3.0103).margin(1e-3));
    CHECK(db((**f.orientations).median) == Approx(-3.0103).margin(1e-3));
    CHECK(db((**f.orientations).random_p10) == Approx(-3.0103).margin(1e-3));
    // Rayleigh at 1 %: 0.01005 of the mean, 19.98 dB below it (conventions.md, "Fading and combining").
    CHECK(db(*f.level) == Approx(-3.0103 - 19.978).margin(2e-3));
    CHECK(db(*f.random_level) == Approx(db(*f.level)).margin(2e-3));
    CHECK(*k->rows.front().score_db == Approx(0).margin(1e-12));

    // Vertical-only uniform field (XPR +inf): MEG = integral of G_theta / (4 pi) = 1 for a lossless
    // vertical antenna (Taga 1990's definition).
    auto v = rank_candidates({r}, r, {uniform_environment(INFINITY)}, o);
    REQUIRE(v);
    CHECK(db(v->reference.front().meg->meg) == Approx(0).margin(1e-4));

    // All the vertical power at the horizon (Gaussian, mean 0, spread 2 deg): MEG tends to the
    // dipole's gain there, D = 1.64 = 2.15 dBi (Balanis sec. 4.5); 2.143 dBi for a 2-deg spread by
    // a fine 1-D quadrature (computed here from the closed form, 2e5 midpoints).
    auto h = rank_candidates({r}, r, {taga_environment(0, 2, 0, 2, INFINITY)}, o);
    REQUIRE(h);
    CHECK(db(h->reference.front().meg->meg) == Approx(2.1431).margin(0.01));
}

TEST_CASE("a short horizontal dipole in a vertical-only field: a quarter of its power, -6.02 dB", "[rank]") {
    // A short dipole along x: E ~ x - (x.r) r, so |E_theta|^2 = cos^2 t cos^2 p integrates to 2 pi / 3
    // of the total 8 pi / 3 (Balanis sec. 4.2 field; the integrals are elementary): MEG = 1/4 in a
    // vertical-only uniform field, against 1 for the vertical reference dipole.
    const FarFieldSet ref = reference_dipole(full_sphere_grid(1, 1), 1e9);
    const FarFieldSet x = diversity_fixture(ReferenceKind::short_dipole, rotation_xyz_deg(0, 90, 0));
    RankOptions o;
    o.orientations = false;
    auto k = rank_candidates({{&x, "x", 0}}, {&ref, "ref", 0}, {uniform_environment(INFINITY)}, o);
    REQUIRE(k);
    CHECK(*k->rows.front().score_db == Approx(db(0.25)).margin(1e-3));
    CHECK(*k->rows.front().environments.front().advantage_db == Approx(-6.0206).margin(1e-3));
}

TEST_CASE("a lossy copy of the reference scores its loss under every score", "[rank]") {
    // MEG is linear in the gain and every orientation's MEG scales alike, so a copy at half the
    // power is 3.01 dB behind in every figure and environment (definition; common practice).
    const FarFieldSet ref = reference_dipole(full_sphere_grid(2, 2), 1e9);
    const FarFieldSet half = scaled(ref, 0.5);
    const std::vector<Environment> envs{uniform_environment(0), urbanish_environment(), taga_environment(0, 20, 10, 30, 3)};
    for (RankScore s : {RankScore::mounted, RankScore::random, RankScore::worst}) {
        RankOptions o;
        o.score = s;
        o.sweep = {30, 180, 30};
        o.threads = 2;
        auto k = rank_candidates({{&half, "half", 0}, {&ref, "same", 0}}, {&ref, "ref", 0}, envs, o);
        REQUIRE(k);
        REQUIRE(k->rows.size() == 2);
        CHECK(k->rows[0].input == 1);
        CHECK(*k->rows[0].score_db == Approx(0).margin(1e-9));
        CHECK(k->rows[1].input == 0);
        CHECK(*k->rows[1].score_db == Approx(-3.0103).margin(1e-4));
        for (const RankFigures& f : k->rows[1].environments) {
            CHECK(*f.advantage_db == Approx(-3.0103).margin(1e-4));
            CHECK(*f.random_advantage_db == Approx(-3.0103).margin(1e-4));
            CHECK(*f.worst_advantage_db == Approx(-3.0103).margin(1e-4));
        }
    }
}

TEST_CASE("random-orientation fading level of a short dipole against a quadrature over orientations", "[rank]") {
    // A short dipole with its axis at angle a from vertical, in a vertical-only uniform field:
    // MEG(a) = cos^2 a + sin^2 a / 4 (the field integrals of the previous case). Over uniformly
    // random orientations u = cos a is uniform on [0, 1], and the received power's distribution is
    // F(x) = integral_0^1 (1 - exp(-x / MEG(u))) du. Its 1 % point by midpoints and bisection here,
    // independent of the sweep's solid-angle weights.
    const auto meg = [](double u) { return u * u + (1 - u * u) / 4; };
    const auto cdf = [&](double x) {
        const int n = 20000;
        double f = 0;
        for (int k = 0; k < n; ++k) f += rayleigh_cdf(x, meg((k + 0.5) / n));
        return f / n;
    };
    double lo = 1e-5, hi = 1;
    for (int it = 0; it < 80; ++it) (cdf(std::sqrt(lo * hi)) < 0.01 ? lo : hi) = std::sqrt(lo * hi);
    const FarFieldSet z = diversity_fixture(ReferenceKind::short_dipole);
    RankOptions o;
    o.score = RankScore::random;
    o.sweep = {5, 180, 30};
    auto k = rank_candidates({{&z, "z", 0}}, {&z, "z", 0}, {uniform_environment(INFINITY)}, o);
    REQUIRE(k);
    const RankFigures& f = k->rows.front().environments.front();
    // 5-deg tilt bands stand in for the continuum: within 0.05 dB.
    CHECK(db(*f.random_level) == Approx(db(lo)).margin(0.05));
    // Worst orientation: lying flat, MEG 1/4; the as-mounted level is the upright one, MEG 1.
    CHECK(db((**f.orientations).min) == Approx(db(0.25)).margin(1e-3));
    CHECK(db(*f.level) == Approx(db(rayleigh_level(0.01, 1.0))).margin(1e-3));
}

TEST_CASE("ranking rows: sorted by score, MEG as the diversity study gives it, unavailable last", "[rank]") {
    const FarFieldSet ref = reference_dipole(full_sphere_grid(2, 2), 1e9);
    const FarFieldSet loop = diversity_fixture(ReferenceKind::small_loop, {}, 2);
    const FarFieldSet tilted = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(45, 0, 0), 2);
    FarFieldSet magnitude = ref;
    magnitude.content = FieldContent::magnitude_only;
    for (FarField& f : magnitude.frequencies)
        for (cplx& v : f.e_theta) v = std::abs(v);
    const Environment env = urbanish_environment();
    RankOptions o;
    o.score = RankScore::random;
    o.sweep = {30, 180, 30};
    auto k = rank_candidates({{&magnitude, "mag", 0}, {&loop, "loop", 0}, {&tilted, "tilted", 0}}, {&ref, "ref", 0},
                             {env}, o);
    REQUIRE(k);
    REQUIRE(k->rows.size() == 3);
    CHECK(k->rows[0].score_db);
    CHECK(k->rows[1].score_db);
    CHECK(*k->rows[0].score_db >= *k->rows[1].score_db);
    CHECK(k->rows[2].input == 0);  // magnitude-only data cannot be turned: no random score
    CHECK_FALSE(k->rows[2].score_db);
    CHECK(k->rows[2].unavailable_reason.find("orientation") != std::string::npos);
    // meg_db is the diversity study's, to the last bit.
    for (const RankRow& row : k->rows) {
        const FarFieldSet* s = row.input == 0 ? &magnitude : row.input == 1 ? &loop : &tilted;
        auto st = study_diversity(env, DiversityOptions{}, {StudyPattern{s, "x", {0}}});
        REQUIRE(st);
        CHECK(st->patterns[0][0].meg->meg == row.environments[0].meg->meg);
    }
    // The mounted score exists for all three.
    o.score = RankScore::mounted;
    auto m = rank_candidates({{&magnitude, "mag", 0}, {&loop, "loop", 0}, {&tilted, "tilted", 0}}, {&ref, "ref", 0},
                             {env}, o);
    REQUIRE(m);
    for (const RankRow& row : m->rows) CHECK(row.score_db);
}

TEST_CASE("ranking refusals", "[rank]") {
    const FarFieldSet ref = reference_dipole(full_sphere_grid(5, 5), 1e9);
    const RankCandidate r{&ref, "ref", 0};
    RankOptions o;
    CHECK_FALSE(rank_candidates({}, r, {Environment{}}, o));
    CHECK_FALSE(rank_candidates({r}, r, {}, o));
    CHECK_FALSE(rank_candidates({{&ref, "bad", 3}}, r, {Environment{}}, o));
    o.outage = 1.5;
    CHECK_FALSE(rank_candidates({r}, r, {Environment{}}, o));
    o.outage = 0.01;
    o.orientations = false;
    o.score = RankScore::worst;
    auto k = rank_candidates({r}, r, {Environment{}}, o);
    REQUIRE_FALSE(k);
    CHECK(k.error().message.find("sweep") != std::string::npos);
}
