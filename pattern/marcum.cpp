#include "pattern/marcum.hpp"

#include <algorithm>
#include <cmath>

#include "pattern/vec3.hpp"

namespace ellipsa {

namespace {

// log(n!) - log(sqrt(2 pi n) (n / e)^n), the error of Stirling's formula (C. Loader, "Fast and
// accurate computation of binomial probabilities", 2000): directly for small n, else its series.
double stirling_error(double n) {
    if (n <= 15) return std::lgamma(n + 1) - (n + 0.5) * std::log(n) + n - 0.5 * std::log(2 * pi);
    const double nn = n * n;
    return (1.0 / 12 - (1.0 / 360 - (1.0 / 1260 - (1.0 / 1680 - 1.0 / (1188 * nn)) / nn) / nn) / nn) / n;
}

// x log(x / m) + m - x without cancellation (Loader 2000's bd0).
double deviance(double x, double m) {
    if (std::abs(x - m) < 0.1 * (x + m)) {
        double v = (x - m) / (x + m);
        double s = (x - m) * v, ej = 2 * x * v;
        v *= v;
        for (int j = 1; j < 1000; ++j) {
            ej *= v;
            const double s1 = s + ej / (2 * j + 1);
            if (s1 == s) return s1;
            s = s1;
        }
        return s;
    }
    return x * std::log(x / m) + m - x;
}

// log(e^-m m^k / k!), accurate to a few units of rounding in the result even where -m and
// k log m are each of order 1e7 (the plain formula loses all digits there).
double log_poisson(double k, double m) {
    if (!(m > 0)) return k == 0 ? 0.0 : -INFINITY;
    if (k == 0) return -m;
    return -0.5 * std::log(2 * pi * k) - stirling_error(k) - deviance(k, m);
}

// P(n, x) by its series e^-x x^n / n! * sum_m x^m / ((n+1)...(n+m)) (A&S 6.5.29), for x < n + 1.
double gamma_p_series(int n, double x) {
    double term = 1, sum = 1;
    for (int m = 1; m < 100000; ++m) {
        term *= x / (n + m);
        sum += term;
        if (term < 1e-17 * sum) break;
    }
    return std::exp(log_poisson(n, x)) * sum;
}

// Q(n, x) = e^-x sum_{j<n} x^j / j!, summed from the largest term (j = n - 1) down, for x >= n + 1.
double gamma_q_sum(int n, double x) {
    double term = std::exp(log_poisson(n - 1, x));
    double sum = 0;
    for (int j = n - 1; j >= 0; --j) {
        sum += term;
        if (term < 1e-17 * sum) break;
        term *= j / x;
    }
    return sum;
}

// The window of k outside which the Poisson-mixture terms are negligible (see the header).
struct Window {
    long lo, hi;
};
Window window(double mu, double y) {
    const double small = std::min(mu, y), large = std::max(mu, y);
    return {long(std::max(0.0, std::floor(small - 40 * std::sqrt(small) - 60))),
            long(std::ceil(large + 40 * std::sqrt(large) + 60))};
}

// sum_k Pois(k; mu) P(k + 1, y): P from the top of the window down, adding e^-y y^k / k!.
double lower_tail(double mu, double y) {
    if (!(y > 0)) return 0;
    if (!(mu > 0)) return -std::expm1(-y);
    if (y < mu && std::pow(std::sqrt(mu) - std::sqrt(y), 2) > 745) return 0;
    const Window w = window(mu, y);
    double g = gamma_p(int(w.hi) + 1, y);
    double sum = 0;
    for (long k = w.hi; k >= w.lo; --k) {
        sum += std::exp(log_poisson(double(k), mu)) * g;
        g += std::exp(log_poisson(double(k), y));  // P(k, y) = P(k + 1, y) + e^-y y^k / k!
    }
    return sum;
}

// sum_k Pois(k; mu) Q(k + 1, y): Q from the bottom of the window up, adding e^-y y^(k+1) / (k+1)!.
double upper_tail(double mu, double y) {
    if (!(y > 0)) return 1;
    if (!(mu > 0)) return std::exp(-y);
    if (y > mu && std::pow(std::sqrt(y) - std::sqrt(mu), 2) > 745) return 0;
    const Window w = window(mu, y);
    double h = gamma_q(int(w.lo) + 1, y);
    double sum = 0;
    for (long k = w.lo; k <= w.hi; ++k) {
        sum += std::exp(log_poisson(double(k), mu)) * h;
        h += std::exp(log_poisson(double(k + 1), y));  // Q(k + 2, y) = Q(k + 1, y) + e^-y y^(k+1) / (k+1)!
    }
    return sum;
}

}  // namespace

double poisson_probability(double k, double m) { return std::exp(log_poisson(k, m)); }

double gamma_p(int n, double x) {
    if (!(x > 0)) return 0;
    if (x < n + 1) return gamma_p_series(n, x);
    return 1 - gamma_q_sum(n, x);
}

double gamma_q(int n, double x) {
    if (!(x > 0)) return 1;
    if (x < n + 1) return 1 - gamma_p_series(n, x);
    return gamma_q_sum(n, x);
}

double marcum_q1(double a, double b) {
    const double mu = 0.5 * a * a, y = 0.5 * b * b;
    // The distribution function is below about one half where b^2 < a^2 + 2 (the mean of the
    // non-central chi-square): sum it there, and the survival function elsewhere.
    if (y < mu + 1) return 1 - lower_tail(mu, y);
    return upper_tail(mu, y);
}

double marcum_q1_complement(double a, double b) {
    const double mu = 0.5 * a * a, y = 0.5 * b * b;
    if (y < mu + 1) return lower_tail(mu, y);
    return 1 - upper_tail(mu, y);
}

double rician_power_cdf(double x, double k, double omega) {
    if (!(x > 0)) return 0;
    return marcum_q1_complement(std::sqrt(2 * k), std::sqrt(2 * (k + 1) * x / omega));
}

}  // namespace ellipsa
