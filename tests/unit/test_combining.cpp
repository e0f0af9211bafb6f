// Fading statistics (pattern/marcum.hpp, pattern/combining.hpp) against closed forms, identities
// and the published two-branch figures. scipy's non-central chi-square is compared in
// tests/scripts/check_combining_scipy.py.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/combining.hpp"
#include "pattern/marcum.hpp"

using namespace ellipsa;

namespace {
// Composite Simpson of f on [a, b] with n (even) intervals.
template <class F>
double simpson(F f, double a, double b, int n) {
    const double h = (b - a) / n;
    double s = f(a) + f(b);
    for (int k = 1; k < n; ++k) s += (k % 2 ? 4 : 2) * f(a + k * h);
    return s * h / 3;
}
double db(double x) { return 10 * std::log10(x); }
}  // namespace

TEST_CASE("incomplete gamma of integer order", "[fading][marcum]") {
    // A&S 6.5.13: Q(n, x) = e^-x sum_{j<n} x^j / j!; P(1, x) = 1 - e^-x.
    for (double x : {1e-6, 0.3, 2.0, 7.5, 40.0, 300.0}) {
        CHECK(gamma_p(1, x) == Approx(-std::expm1(-x)).epsilon(1e-14));
        for (int n : {1, 2, 5, 30, 200}) {
            double sum = 0, term = std::exp(-x);
            for (int j = 0; j < n; ++j) sum += term, term *= x / (j + 1);
            CHECK(gamma_q(n, x) == Approx(sum).epsilon(1e-12).margin(1e-300));
            CHECK(gamma_p(n, x) + gamma_q(n, x) == Approx(1.0).epsilon(1e-14));
        }
    }
    // Small values keep their relative accuracy: P(3, 1e-3) = x^3/3! (1 - 3x/4 + ...).
    CHECK(gamma_p(3, 1e-3) == Approx(1e-9 / 6 * (1 - 0.75e-3)).epsilon(1e-6));
}

TEST_CASE("Marcum Q1: closed forms and identities in every regime", "[fading][marcum]") {
    // Q1(0, b) = exp(-b^2 / 2) (the Rayleigh case) and Q1(a, 0) = 1 (definition; Simon & Alouini 2005, ch. 4).
    for (double b : {0.01, 0.5, 1.0, 3.0, 10.0, 30.0})
        CHECK(marcum_q1(0, b) == Approx(std::exp(-b * b / 2)).epsilon(1e-13).margin(1e-300));
    CHECK(marcum_q1(3, 0) == 1.0);
    // Q1(a, b) + Q1(b, a) = 1 + exp(-(a^2 + b^2) / 2) I0(a b) (Simon & Alouini 2005, ch. 4), which
    // ties the two tails and the direct and complementary sums together; I0 from the standard library.
    const double pairs[][2] = {{0.5, 1.5}, {1, 1}, {2, 3}, {5, 7}, {10, 12}, {20, 21}, {25, 20}, {0.1, 4}};
    for (const auto& p : pairs) {
        const double a = p[0], b = p[1];
        const double rhs = 1 + std::exp(-(a * a + b * b) / 2) * std::cyl_bessel_i(0.0, a * b);
        CHECK(marcum_q1(a, b) + marcum_q1(b, a) == Approx(rhs).epsilon(1e-12));
        CHECK(marcum_q1(a, b) + marcum_q1_complement(a, b) == Approx(1.0).epsilon(1e-14));
    }
    // The deep tail keeps relative accuracy: against a Simpson integral of the Rician density
    // t exp(-(t^2 + a^2) / 2) I0(a t) (the definition), 1 - Q1(20, 14) about 8e-10.
    const double a = 20, b = 14;
    const double tail =
        simpson([&](double t) { return t * std::exp(-(t * t + a * a) / 2) * std::cyl_bessel_i(0.0, a * t); }, 0, b, 40000);
    CHECK(tail < 1e-6);
    CHECK(marcum_q1_complement(a, b) == Approx(tail).epsilon(1e-10));
    // Rician power with K = 0 is Rayleigh (conventions.md).
    CHECK(rician_power_cdf(0.3, 0, 2.0) == Approx(-std::expm1(-0.15)).epsilon(1e-14));
}

TEST_CASE("two independent equal branches at 1 %: 10.2 dB selection, 11.7 dB maximal ratio", "[fading][combining]") {
    // Published figures for two-branch Rayleigh diversity (M. Schwartz, W. R. Bennett, S. Stein,
    // Communication Systems and Techniques, 1966, ch. 10; M. K. Simon, M.-S. Alouini, Digital
    // Communication over Fading Channels, 2005, ch. 9): 10.2 dB and 11.7 dB over one branch.
    auto c = combine_two_branches({1, 1, 0}, {0.01});
    REQUIRE(c);
    const OutageFigures& o = c->outages.front();
    CHECK(o.selection_gain_db == Approx(10.2).margin(0.05));
    CHECK(o.mrc_gain_db == Approx(11.7).margin(0.05));
    // To more digits, from the closed forms: selection (1 - e^-x)^2 = 0.01, x = -ln 0.9;
    // maximal ratio 1 - e^-x (1 + x) = 0.01 (solved here by bisection); one branch -ln 0.99.
    const double one = -std::log(0.99);
    CHECK(o.selection_gain_db == Approx(db(-std::log(0.9) / one)).epsilon(1e-12));  // 10.2050 dB
    double lo = 0, hi = 1;
    for (int k = 0; k < 200; ++k) {
        const double m = 0.5 * (lo + hi);
        (1 - std::exp(-m) * (1 + m) < 0.01 ? lo : hi) = m;
    }
    CHECK(o.mrc_gain_db == Approx(db(lo / one)).epsilon(1e-10));  // 11.6971 dB
    // Effective gains: the branches are ideal lossless antennas in the isotropic environment when
    // each has mean power 0.5 (Kildal & Rosengren 2004): then effective equals apparent.
    auto ideal = combine_two_branches({0.5, 0.5, 0}, {0.01});
    CHECK(ideal->outages[0].selection_effective_gain_db == Approx(ideal->outages[0].selection_gain_db).epsilon(1e-12));
    CHECK(o.selection_effective_gain_db == Approx(o.selection_gain_db + db(2)).epsilon(1e-12));
}

TEST_CASE("selection combining: the series is the conventions' Marcum-Q integral", "[fading][combining]") {
    // conventions.md: F_SC(x) = integral_0^x (1/G1) e^(-t/G1) [1 - Q1(sqrt(2 rho t/(G1(1-rho))),
    // sqrt(2x/(G2(1-rho))))] dt, integrated here by Simpson with marcum_q1_complement.
    for (const BranchPair& b : {BranchPair{1.3, 0.6, 0.45}, BranchPair{1, 1, 0.9}, BranchPair{0.2, 2.0, 0.1}})
        for (double x : {0.001, 0.02, 0.3, 2.0}) {
            const double r = b.rho;
            const double integral = simpson(
                [&](double t) {
                    return std::exp(-t / b.g1) / b.g1 *
                           marcum_q1_complement(std::sqrt(2 * r * t / (b.g1 * (1 - r))), std::sqrt(2 * x / (b.g2 * (1 - r))));
                },
                0, x, 4000);
            CHECK(selection_cdf(x, b) == Approx(integral).epsilon(1e-9));
        }
    // rho = 0 is the product of the two branch distributions (conventions.md).
    const BranchPair u{1.7, 0.4, 0};
    for (double x : {1e-4, 0.1, 3.0}) CHECK(selection_cdf(x, u) == Approx(rayleigh_cdf(x, 1.7) * rayleigh_cdf(x, 0.4)).epsilon(1e-14));
    // rho = 1: the stronger branch alone (selection gains nothing over it).
    auto full = combine_two_branches({2.0, 1.0, 1.0}, {0.01, 0.1});
    for (const OutageFigures& o : full->outages) CHECK(o.selection_gain_db == Approx(0).margin(1e-9));
}

TEST_CASE("maximal-ratio combining: closed form, equal eigenvalues and full correlation", "[fading][combining]") {
    // conventions.md / Simon & Alouini 2005: F = 1 - (l1 e^-x/l1 - l2 e^-x/l2) / (l1 - l2) where it
    // has no cancellation (x of the order of the means).
    const BranchPair b{1.3, 0.6, 0.45};
    const Eigenvalues e = branch_eigenvalues(b);
    CHECK(e.l1 + e.l2 == Approx(b.g1 + b.g2).epsilon(1e-14));                 // trace
    CHECK(e.l1 * e.l2 == Approx(b.g1 * b.g2 * (1 - b.rho)).epsilon(1e-14));  // determinant
    for (double x : {0.5, 1.0, 3.0})
        CHECK(mrc_cdf(x, b) ==
              Approx(1 - (e.l1 * std::exp(-x / e.l1) - e.l2 * std::exp(-x / e.l2)) / (e.l1 - e.l2)).epsilon(1e-12));
    // Equal eigenvalues (equal independent branches): 1 - e^-x (1 + x), and its series x^2/2 - x^3/3
    // for small x where the closed form cancels; nearly equal ones join it smoothly.
    const BranchPair eq{1, 1, 0};
    CHECK(mrc_cdf(2.0, eq) == Approx(1 - std::exp(-2.0) * 3).epsilon(1e-14));
    CHECK(mrc_cdf(1e-4, eq) == Approx(0.5e-8 - 1e-12 / 3 + 1e-16 / 8).epsilon(1e-13));
    CHECK(mrc_cdf(0.15, BranchPair{1, 1, 1e-12}) == Approx(mrc_cdf(0.15, eq)).epsilon(1e-11));
    CHECK(mrc_cdf(0.15, BranchPair{1, 1.000001, 0}) == Approx(mrc_cdf(0.15, eq)).epsilon(1e-5));
    // Fully correlated equal branches: the sum is twice one branch, 3.01 dB at every outage.
    auto full = combine_two_branches({1, 1, 1}, {0.01, 0.5});
    for (const OutageFigures& o : full->outages) CHECK(o.mrc_gain_db == Approx(db(2)).epsilon(1e-12));
}

TEST_CASE("combining figures order and refusals", "[fading][combining]") {
    // Maximal ratio is the best linear combiner and selection never loses to its stronger branch
    // (Simon & Alouini 2005); gains fall as the correlation rises.
    double last = 1e9;
    for (double rho : {0.0, 0.2, 0.5, 0.8, 0.95}) {
        auto c = combine_two_branches({1, 0.4, rho}, {0.01, 0.1});
        REQUIRE(c);
        for (const OutageFigures& o : c->outages) {
            CHECK(o.mrc_gain_db >= o.selection_gain_db);
            CHECK(o.selection_gain_db >= 0);
        }
        CHECK(c->outages[0].selection_gain_db < last);
        last = c->outages[0].selection_gain_db;
    }
    CHECK(!combine_two_branches({1, 0, 0.5}, {0.01}));
    CHECK(!combine_two_branches({1, 1, 1.5}, {0.01}));
    CHECK(!combine_two_branches({1, 1, 0.5}, {0.0}));
    CHECK(!combine_two_branches({1, 1, 0.5}, {1.0}));
    CHECK(!combine_two_branches({1, 1, 0.5}, {NAN}));
    CHECK(!combine_two_branches({1, 1, 0.5}, {}));
}
