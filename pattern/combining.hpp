// Two antennas in Rayleigh fading: the exact output distributions of selection combining and of
// maximal-ratio combining, and the levels and diversity gains at the outage probabilities a user
// chooses (conventions.md, "Fading and combining").
//
// Model: the branch amplitudes are zero-mean complex Gaussian with mean powers G1, G2 (each
// antenna's MEG in the environment) and power correlation rho (the envelope correlation
// rho_e = |rho_c|^2 of Vaughan & Andersen, IEEE Trans. VT-36, 1987).
//
//   One branch:        F(x) = 1 - exp(-x / G)
//   Selection, exact:  F_SC(x) = P(|a1|^2 <= x, |a2|^2 <= x)
//                      = integral_0^x (1/G1) e^(-t/G1) [1 - Q1(sqrt(2 rho t / (G1 (1 - rho))),
//                                                         sqrt(2 x / (G2 (1 - rho))))] dt
//                      (the bivariate Rayleigh distribution; M. Schwartz, W. R. Bennett, S. Stein,
//                      Communication Systems and Techniques, 1966, ch. 10; M. K. Simon,
//                      M.-S. Alouini, Digital Communication over Fading Channels, 2005, ch. 9).
//                      Writing 1 - Q1 as its Poisson mixture (pattern/marcum.hpp) and integrating
//                      term by term (integral_0^X e^-(1+c)u (c u)^k / k! du = c^k / (1+c)^(k+1)
//                      P(k + 1, (1 + c) X), c = rho / (1 - rho)) gives the series summed here,
//                      F_SC(x) = (1 - rho) sum_k rho^k P(k + 1, x / (G1 (1 - rho))) P(k + 1, x / (G2 (1 - rho))),
//                      all terms positive (the Kibble-Moran form of the bivariate gamma
//                      distribution with shape 1). rho = 0 gives (1 - e^(-x/G1)) (1 - e^(-x/G2)).
//   Maximal ratio:     |a1|^2 + |a2|^2 is a sum of two independent exponentials whose means are
//                      the eigenvalues l1 >= l2 of [[G1, rho_c sqrt(G1 G2)], [conj, G2]]:
//                      F(x) = 1 - (l1 e^(-x/l1) - l2 e^(-x/l2)) / (l1 - l2), and
//                      1 - e^(-x/l)(1 + x/l) when l1 = l2 = l (Simon & Alouini 2005, ch. 9). Here as
//                      F(x) = x^2 / (l1 l2) * integral_0^1 psi(x (1/l1 + s (1/l2 - 1/l1))) ds,
//                      psi(z) = (1 - e^-z (1 + z)) / z^2, which has no cancellation for small x and
//                      none as l2 -> l1 (the equal-eigenvalue limit is the same integral).
//   Diversity gain at outage p: apparent = combined level / the stronger branch's level;
//   effective = combined level / the level of an ideal lossless antenna in the isotropic
//   environment (MEG 0.5, -3.01 dBi) (P.-S. Kildal, K. Rosengren, IEEE Commun. Mag. 42(12), 2004).
//
// Checks (tests): independent equal branches at 1 % outage give 10.2 dB (selection) and 11.7 dB
// (maximal ratio) over one branch; these exact values are 10.2054 and 11.6972 dB.
#pragma once
#include <functional>
#include <vector>

#include "pattern/result.hpp"

namespace ellipsa {

// The mean power of an ideal lossless antenna in the isotropic environment, XPR 0 dB (MEG = 0.5).
inline constexpr double ideal_isotropic_meg = 0.5;
// The default outage probabilities.
inline constexpr double default_outages[] = {0.01, 0.1};

struct BranchPair {
    double g1 = 1, g2 = 1;  // mean powers, linear (> 0)
    double rho = 0;         // power (envelope) correlation, [0, 1]
};
// Checks g1, g2 finite and > 0, rho in [0, 1].
Status validate(const BranchPair& b);

// Distribution functions of the received power x >= 0 (linear, the unit of the means).
double rayleigh_cdf(double x, double g);
// Its inverse: the level a Rayleigh branch of mean power g falls below with probability p,
// g (-ln(1 - p)) (0.01005 g at 1 %: 19.98 dB below the mean).
double rayleigh_level(double p, double g);
// Exact. Cost: about min(x / (G (1 - rho)), 41 / (1 - rho)) + 60 terms, a few hundred for rho up
// to 0.99 at the usual outages. Where that would exceed 1e6 terms (rho within about x / (1e6 G)
// of 1) the fully correlated limit (the stronger branch alone) is returned; the selection gain
// there is below 0.003 dB (measured: 0.0025 dB just inside the limit, at every outage from 1e-6 to 0.5).
double selection_cdf(double x, const BranchPair& b);
double mrc_cdf(double x, const BranchPair& b);
// The eigenvalues l1 >= l2 >= 0 of the branch covariance (l2 from the determinant: no cancellation).
struct Eigenvalues {
    double l1 = 0, l2 = 0;
};
Eigenvalues branch_eigenvalues(const BranchPair& b);

// The level x > 0 where a distribution function reaches p in (0, 1): solved in log x to about
// 1e-13 relative by bracketing and Illinois (safeguarded secant) steps on log F; `x_start` is a
// first guess. `cdf` must rise from 0 to 1. Cost: about 10 to 20 evaluations of `cdf`.
double level_at(const std::function<double(double)>& cdf, double p, double x_start);

// One outage probability's figures. Levels are linear powers in the unit of the means (gain);
// the gains in dB.
struct OutageFigures {
    double outage = 0.01;
    double branch1_level = 0, branch2_level = 0;
    double selection_level = 0, mrc_level = 0;
    double ideal_level = 0;  // the ideal lossless antenna in the isotropic environment
    double selection_gain_db = 0, mrc_gain_db = 0;                      // apparent: over the stronger branch
    double selection_effective_gain_db = 0, mrc_effective_gain_db = 0;  // effective: over the ideal antenna
};
struct CombiningFigures {
    BranchPair branches;
    Eigenvalues eigenvalues;
    std::vector<OutageFigures> outages;
};
// Errors: invalid branches, an outage outside (0, 1) or not a number.
Result<CombiningFigures> combine_two_branches(const BranchPair& b, const std::vector<double>& outages);

// Checks a list of outage probabilities (each in (0, 1), at least one, at most 20).
Status validate_outages(const std::vector<double>& outages);

// What the combining figures are, in one sentence for outputs that state their method.
inline constexpr const char* combining_method =
    "two-branch combining in Rayleigh fading, mean branch powers = each antenna's MEG, power correlation = ECC; "
    "selection exact (bivariate Rayleigh, Schwartz, Bennett & Stein 1966), maximal ratio exact (sum of two "
    "exponentials with the eigenvalues of the branch covariance, Simon & Alouini 2005); apparent gain over the "
    "stronger branch, effective gain over an ideal lossless antenna in the isotropic environment (MEG -3.01 dBi; "
    "Kildal & Rosengren, IEEE Commun. Mag. 42(12), 2004)";
// The old approximation's description, for the labelled comparison.
inline constexpr const char* approximate_gain_method =
    "10 sqrt(1 - ECC) dB: an approximation of selection combining at 1 % outage for equal branches (common "
    "practice with Vaughan & Andersen 1987); a comparison only: for equal branches 0.2 to 2.3 dB below the exact "
    "figure at correlations 0 to 0.7, and it ignores unequal branch powers";

// The cautions that go beside every outage figure (command output, JSON, report, docs).
inline constexpr const char* outage_cautions[] = {
    "The environments are statistical models, not a survey of your site.",
    ("A link budget must add the receiver's own figures (sensitivity, noise figure, cable and "
     "mismatch losses, fade margins for other effects)."),
    "Radiated power and exposure limits follow local regulations and licensed practice.",
};

}  // namespace ellipsa
