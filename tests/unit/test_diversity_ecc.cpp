// Envelope correlation (Vaughan & Andersen, IEEE Trans. VT-36, 1987, XPR-weighted; conventions.md)
// and the selection-combining diversity gain it implies.
#include <catch2/catch.hpp>

#include "pattern/diversity.hpp"
#include "pattern/reference.hpp"
#include "tests/unit/diversity_fixtures.hpp"

using namespace ellipsa;

namespace {
double ecc(const FarFieldSet& a, const FarFieldSet& b, const Environment& e) {
    auto c = envelope_correlation(a, 0, b, 0, e);
    REQUIRE(c);
    return c->ecc;
}
}  // namespace

TEST_CASE("ECC of identical patterns is 1", "[diversity][ecc]") {
    // conventions.md check (Cauchy-Schwarz equality).
    FarFieldSet s = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(20, 30, 0));
    CHECK(ecc(s, s, Environment{}) == Approx(1.0).epsilon(1e-12));
    CHECK(ecc(s, s, urbanish_environment()) == Approx(1.0).epsilon(1e-12));
}

TEST_CASE("ECC of a z and an x dipole in a uniform environment is 0", "[diversity][ecc]") {
    // conventions.md check; also for every azimuth-uniform environment (the cross term integrates
    // cos(phi) over a full turn).
    FarFieldSet z = diversity_fixture(ReferenceKind::dipole), x = diversity_fixture(ReferenceKind::dipole, rotation_y(90 * deg));
    CHECK(ecc(z, x, Environment{}) == Approx(0.0).margin(1e-12));
    CHECK(ecc(z, x, urbanish_environment()) == Approx(0.0).margin(1e-12));
    // A z dipole (E_theta only) and a horizontal loop (E_phi only) are orthogonal in any environment.
    CHECK(ecc(z, diversity_fixture(ReferenceKind::small_loop), urbanish_environment()) == Approx(0.0).margin(1e-15));
}

TEST_CASE("ECC is symmetric in its arguments", "[diversity][ecc]") {
    FarFieldSet a = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(20, 30, 0));
    FarFieldSet b = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(0, 50, 10));
    const double ab = ecc(a, b, urbanish_environment()), ba = ecc(b, a, urbanish_environment());
    CHECK(ab > 0.01);
    CHECK(ab == Approx(ba).epsilon(1e-12));
}

TEST_CASE("short dipoles at an angle a: rho_e = cos^2 a in a uniform environment", "[diversity][ecc]") {
    // Derived here from the short-dipole field, the transverse part of the moment (Balanis 4.2):
    // the integral of p1_perp . p2_perp over the sphere is (8 pi / 3) p1 . p2, so the
    // Vaughan-Andersen envelope correlation is (p1 . p2)^2 for unit moments.
    FarFieldSet z = diversity_fixture(ReferenceKind::short_dipole);
    for (double a : {20.0, 45.0, 70.0}) {
        FarFieldSet t = diversity_fixture(ReferenceKind::short_dipole, rotation_y(a * deg));
        CHECK(ecc(z, t, Environment{}) == Approx(std::pow(std::cos(a * deg), 2)).margin(2e-4));
    }
}

TEST_CASE("ECC across different grids: the second pattern is resampled", "[diversity][ecc]") {
    FarFieldSet a = diversity_fixture(ReferenceKind::crossed_dipoles, rotation_xyz_deg(20, 30, 0), 1.0);
    FarFieldSet b = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(0, 50, 10), 1.0);
    FarFieldSet b2 = diversity_fixture(ReferenceKind::dipole, rotation_xyz_deg(0, 50, 10), 2.0);
    auto same = envelope_correlation(a, 0, b, 0, urbanish_environment());
    auto res = envelope_correlation(a, 0, b2, 0, urbanish_environment());
    REQUIRE(same);
    REQUIRE(res);
    CHECK(!same->resampled);
    CHECK(res->resampled);
    CHECK(res->ecc == Approx(same->ecc).margin(2e-3));
}

TEST_CASE("ECC needs phase: magnitude-only data is refused with the reason", "[diversity][ecc]") {
    FarFieldSet a = diversity_fixture(ReferenceKind::dipole), b = diversity_fixture(ReferenceKind::small_loop);
    b.content = FieldContent::magnitude_only;
    auto c = envelope_correlation(a, 0, b, 0, Environment{});
    REQUIRE(!c);
    CHECK(c.error().message.find("magnitude") != std::string::npos);
}

TEST_CASE("the approximate selection gain is only a comparison", "[diversity][ecc]") {
    // Approximation G = 10 sqrt(1 - rho_e) dB used with Vaughan & Andersen 1987 (common practice):
    // uncorrelated branches give 10 dB, fully correlated 0 dB. The exact figure for independent
    // equal branches is (1 - e^-x)^2 = 0.01 against 1 - e^-y = 0.01: 10.2 dB (pattern/combining.hpp).
    CHECK(approximate_selection_gain_db(0.0) == Approx(10.0));
    CHECK(approximate_selection_gain_db(0.5) == Approx(7.0711).epsilon(1e-4));
    CHECK(approximate_selection_gain_db(1.0) == Approx(0.0).margin(1e-12));
    const double x = -std::log(1 - 0.1), y = -std::log(1 - 0.01);
    CHECK(10 * std::log10(x / y) == Approx(approximate_selection_gain_db(0.0)).margin(0.25));
}
