#include "pattern/combining.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "pattern/marcum.hpp"

namespace ellipsa {

namespace {

Error fail(std::string msg) { return Error{"", 0, 0, std::move(msg)}; }

// Beyond this many terms the selection series is replaced by its fully correlated limit (see the header).
constexpr double max_selection_terms = 1e6;

// psi(z) = (1 - e^-z (1 + z)) / z^2 = P(2, z) / z^2: its series 1/2 - z/3 + z^2/8 - ... below 1.
double psi(double z) {
    if (z < 1) {
        // sum_{k>=2} (-1)^k (k - 1) z^(k-2) / k!
        double term = 0.5, sum = 0.5;  // k = 2
        for (int k = 3; k < 40; ++k) {
            term *= -z / k;  // z^(k-2) / k! with the sign
            sum += term * (k - 1);
            if (std::abs(term) < 1e-18) break;
        }
        return sum;
    }
    return (-std::expm1(-z) - z * std::exp(-z)) / (z * z);
}

// Psi(z) = integral_0^z psi = (z - 1 + e^-z) / z: series z/2 - z^2/6 + z^3/24 - ... below 1.
double psi_integral(double z) {
    if (z < 1) {
        // sum_{k>=2} (-1)^k z^(k-1) / k!
        double term = z / 2, sum = z / 2;
        for (int k = 3; k < 40; ++k) {
            term *= -z / k;
            sum += term;
            if (std::abs(term) < 1e-18 * std::abs(sum)) break;
        }
        return sum;
    }
    return (z + std::expm1(-z)) / z;
}

// 16-point Gauss-Legendre nodes and weights on [0, 1] (Abramowitz & Stegun table 25.4).
constexpr double gl_x[8] = {0.0950125098376374, 0.2816035507792589, 0.4580167776572274, 0.6178762444026438,
                            0.7554044083550030, 0.8656312023878318, 0.9445750230732326, 0.9894009349916499};
constexpr double gl_w[8] = {0.1894506104550685, 0.1826034150449236, 0.1691565193950025, 0.1495959888165767,
                            0.1246289712555339, 0.0951585116824928, 0.0622535239386479, 0.0271524594117541};

// integral_0^1 psi(a + s (b - a)) ds for b <= 2 a: the integrand is analytic and varies by at most
// a factor of a few, so 16 points give it to rounding.
double psi_mean(double a, double b) {
    double sum = 0;
    for (int k = 0; k < 8; ++k) {
        const double u1 = 0.5 * (1 - gl_x[k]), u2 = 0.5 * (1 + gl_x[k]);
        sum += gl_w[k] * (psi(a + u1 * (b - a)) + psi(a + u2 * (b - a)));
    }
    return 0.5 * sum;
}

double outage_level_db(double level) { return 10 * std::log10(level); }

}  // namespace

Status validate(const BranchPair& b) {
    if (!std::isfinite(b.g1) || !std::isfinite(b.g2) || !(b.g1 > 0) || !(b.g2 > 0))
        return fail("both branches need a mean power above zero (MEG above -inf dB)");
    if (!(b.rho >= 0 && b.rho <= 1)) return fail("the power correlation must lie in [0, 1]");
    return Ok{};
}

Status validate_outages(const std::vector<double>& outages) {
    if (outages.empty()) return fail("at least one outage probability is needed");
    if (outages.size() > 20) return fail("at most 20 outage probabilities");
    for (double p : outages)
        if (!(p > 0 && p < 1)) {
            char buf[120];
            std::snprintf(buf, sizeof buf, "an outage probability must lie strictly between 0 and 1, found %g", p);
            return fail(buf);
        }
    return Ok{};
}

double rayleigh_cdf(double x, double g) { return x > 0 ? -std::expm1(-x / g) : 0.0; }
double rayleigh_level(double p, double g) { return -std::log1p(-p) * g; }

Eigenvalues branch_eigenvalues(const BranchPair& b) {
    const double half_sum = 0.5 * (b.g1 + b.g2), half_diff = 0.5 * (b.g1 - b.g2);
    Eigenvalues e;
    e.l1 = half_sum + std::sqrt(half_diff * half_diff + b.rho * b.g1 * b.g2);
    e.l2 = std::max(0.0, b.g1 * b.g2 * (1 - b.rho)) / e.l1;  // the determinant over l1
    return e;
}

double selection_cdf(double x, const BranchPair& b) {
    if (!(x > 0)) return 0;
    const double rho = b.rho;
    if (rho >= 1) return rayleigh_cdf(x, std::max(b.g1, b.g2));
    if (rho <= 0) return rayleigh_cdf(x, b.g1) * rayleigh_cdf(x, b.g2);
    const double z1 = x / (b.g1 * (1 - rho)), z2 = x / (b.g2 * (1 - rho));
    const double zmin = std::min(z1, z2);
    // Terms beyond k_top are below 1e-17 of the first: the smaller P(k + 1, z) has passed its
    // Poisson tail (12 sigma and more), or rho^k is below 1e-18.
    const double by_z = std::ceil(zmin + 12 * std::sqrt(zmin) + 60);
    const double by_rho = std::ceil(std::log(1e-18) / std::log(rho));
    if (std::min(by_z, by_rho) > max_selection_terms) return rayleigh_cdf(x, std::max(b.g1, b.g2));
    const int k_top = int(std::min(by_z, by_rho));
    // P(k + 1, z) from the top down, adding e^-z z^k / k!; the sum by Horner's rule in rho. The
    // steps e^-z z^k / k! follow from each other by the factor k / z... (k + 1) / z, and are taken
    // afresh from poisson_probability every 256 steps and wherever the product underflowed.
    double p1 = gamma_p(k_top + 1, z1), p2 = gamma_p(k_top + 1, z2);
    double d1 = 0, d2 = 0;
    double sum = 0;
    for (int k = k_top; k >= 0; --k) {
        sum = sum * rho + p1 * p2;
        if (k == 0) break;
        const bool afresh = k % 256 == 0 || k == k_top;
        d1 = afresh || d1 == 0 ? poisson_probability(k, z1) : d1 * (k + 1) / z1;
        d2 = afresh || d2 == 0 ? poisson_probability(k, z2) : d2 * (k + 1) / z2;
        p1 += d1;  // P(k, z) = P(k + 1, z) + e^-z z^k / k!
        p2 += d2;
    }
    return std::min(1.0, (1 - rho) * sum);
}

double mrc_cdf(double x, const BranchPair& b) {
    if (!(x > 0)) return 0;
    const Eigenvalues e = branch_eigenvalues(b);
    if (!(e.l2 > 0)) return rayleigh_cdf(x, e.l1);
    const double a = x / e.l1, c = x / e.l2;  // c >= a
    double f;
    if (c <= 2 * a)
        f = a * c * psi_mean(a, c);
    else
        f = a * c / (c - a) * (psi_integral(c) - psi_integral(a));
    return std::min(1.0, f);
}

double level_at(const std::function<double(double)>& cdf, double p, double x_start) {
    auto f = [&](double t) { return std::log(cdf(std::exp(t))) - std::log(p); };
    double t0 = std::log(x_start), f0 = f(t0);
    // Bracket: step by factors of 2 until the sign changes.
    double t1 = t0, f1 = f0;
    for (int k = 0; k < 2000 && (f0 < 0) == (f1 < 0); ++k) {
        t0 = t1, f0 = f1;
        t1 = t0 + (f0 < 0 ? std::log(2.0) : -std::log(2.0));
        f1 = f(t1);
    }
    double lo = std::min(t0, t1), hi = std::max(t0, t1);
    double flo = t0 < t1 ? f0 : f1, fhi = t0 < t1 ? f1 : f0;
    int side = 0;
    for (int it = 0; it < 200 && hi - lo > 1e-13; ++it) {
        double t = 0.5 * (lo + hi);
        if (std::isfinite(flo) && std::isfinite(fhi) && fhi != flo) t = lo - flo * (hi - lo) / (fhi - flo);
        if (!(t > lo && t < hi)) t = 0.5 * (lo + hi);
        const double ft = f(t);
        if (ft == 0) return std::exp(t);
        if (ft < 0) {
            lo = t, flo = ft;
            if (side == -1) fhi *= 0.5;  // Illinois: halve the stale end
            side = -1;
        } else {
            hi = t, fhi = ft;
            if (side == 1) flo *= 0.5;
            side = 1;
        }
    }
    return std::exp(0.5 * (lo + hi));
}

Result<CombiningFigures> combine_two_branches(const BranchPair& b, const std::vector<double>& outages) {
    if (Status v = validate(b); !v) return v.error();
    if (Status v = validate_outages(outages); !v) return v.error();
    CombiningFigures out;
    out.branches = b;
    out.eigenvalues = branch_eigenvalues(b);
    const double strong = std::max(b.g1, b.g2);
    for (double p : outages) {
        OutageFigures o;
        o.outage = p;
        const double single = rayleigh_level(p, 1.0);  // the level of a unit-mean branch
        o.branch1_level = b.g1 * single;
        o.branch2_level = b.g2 * single;
        o.ideal_level = ideal_isotropic_meg * single;
        // Selection lies between the stronger branch and the maximal-ratio sum.
        o.selection_level = level_at([&](double x) { return selection_cdf(x, b); }, p, strong * single);
        o.mrc_level = level_at([&](double x) { return mrc_cdf(x, b); }, p, strong * single);
        const double strong_level = strong * single;
        o.selection_gain_db = outage_level_db(o.selection_level / strong_level);
        o.mrc_gain_db = outage_level_db(o.mrc_level / strong_level);
        o.selection_effective_gain_db = outage_level_db(o.selection_level / o.ideal_level);
        o.mrc_effective_gain_db = outage_level_db(o.mrc_level / o.ideal_level);
        out.outages.push_back(o);
    }
    return out;
}

}  // namespace ellipsa
