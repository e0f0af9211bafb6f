// Special functions for fading statistics: the regularised incomplete gamma functions of integer
// order and the Marcum Q-function of order 1.
//
//   P(n, x) = gamma(n, x) / Gamma(n), Q(n, x) = 1 - P(n, x)       (Abramowitz & Stegun 6.5.1-6.5.3)
//   Q1(a, b) = integral from b to inf of t exp(-(t^2 + a^2)/2) I0(a t) dt
//            = P(R > b) for R the envelope of a unit-variance-per-component complex Gaussian with
//              a deterministic part of amplitude a (the Rician distribution);
//   1 - Q1(a, b) is the distribution function of a non-central chi-square variable with 2 degrees
//   of freedom and non-centrality a^2, at b^2 (so Q1(a, b) = scipy.stats.ncx2.sf(b^2, 2, a^2)).
//
// Method: the Poisson mixture of central chi-square distributions (Abramowitz & Stegun 26.4.25),
//   1 - Q1(a, b) = sum_k e^-mu mu^k / k! P(k + 1, y),  Q1(a, b) = sum_k e^-mu mu^k / k! Q(k + 1, y),
//   mu = a^2 / 2, y = b^2 / 2,
// the series that C. G. Ding's Algorithm AS 275 (Applied Statistics 41(2), 1992) sums for the
// non-central chi-square distribution. Here the smaller of the two tails is always summed
// directly (never as 1 minus something), only over the window of k where the terms matter (the
// Poisson weights, in logarithms, within about 40 standard deviations), and the P (or Q) values
// come from one direct evaluation at the window's end followed by the recurrence that only adds
// positive terms (P(k, y) = P(k + 1, y) + e^-y y^k / k! downward, Q upward). Every sum has
// positive terms, so the relative error stays near the rounding of the terms (about 1e-14) even
// for tails of 1e-300; tails below about exp(-740) are returned as 0.
// Cost: O(sqrt(max(mu, y)) + 60) terms, each a log and an exp or two.
#pragma once

namespace ellipsa {

// Regularised lower and upper incomplete gamma functions of integer order n >= 1, x >= 0.
// Each is computed directly where it is the smaller one (series, or the finite sum
// Q(n, x) = e^-x sum_{j<n} x^j / j!), so both keep their relative accuracy.
double gamma_p(int n, double x);
double gamma_q(int n, double x);

// The Poisson probability e^-m m^k / k! (k >= 0, m >= 0) without overflow or cancellation, from
// Stirling's error and the deviance (C. Loader, "Fast and accurate computation of binomial
// probabilities", 2000); also e^-x x^n / n!, the step between P(n, x) and P(n + 1, x).
double poisson_probability(double k, double m);

// Marcum Q1(a, b) for a, b >= 0, and its complement 1 - Q1(a, b), each accurate to about 1e-14
// relative (the complement is the one to use for small outage probabilities).
double marcum_q1(double a, double b);
double marcum_q1_complement(double a, double b);

// Distribution function of the received power of a Rician channel with K-factor k >= 0 (power of
// the deterministic part over the diffuse part) and mean power omega > 0:
// P(|a|^2 <= x) = 1 - Q1(sqrt(2 K), sqrt(2 (K + 1) x / omega)) (conventions.md). K = 0 is Rayleigh.
double rician_power_cdf(double x, double k, double omega);

}  // namespace ellipsa
