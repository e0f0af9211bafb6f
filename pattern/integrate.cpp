#include "pattern/integrate.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace ellipsa {

CellWeights cell_weights(const Grid& g) {
    CellWeights w;
    w.theta.resize(std::size_t(g.theta.count));
    const double dt = g.theta.step_deg * deg;
    const double t_lo = std::max(0.0, g.theta.start_deg * deg);
    const double t_hi = std::min(pi, g.theta.last_deg() * deg);
    for (int i = 0; i < g.theta.count; ++i) {
        double t = g.theta.value_deg(i) * deg;
        double a = std::clamp(t - dt / 2, t_lo, t_hi);
        double b = std::clamp(t + dt / 2, t_lo, t_hi);
        w.theta[std::size_t(i)] = std::cos(a) - std::cos(b);
    }
    w.phi.resize(std::size_t(g.phi.count));
    if (g.sampling == Sampling::cuts) return w;  // columns (or a row) with nothing between: no solid angle
    const double dp = g.phi.step_deg * deg;
    if (g.phi_wraps()) {
        std::fill(w.phi.begin(), w.phi.end(), dp);
    } else {
        const double p_lo = g.phi.start_deg * deg, p_hi = g.phi.last_deg() * deg;
        for (int j = 0; j < g.phi.count; ++j) {
            double p = g.phi.value_deg(j) * deg;
            double a = std::clamp(p - dp / 2, p_lo, p_hi);
            double b = std::clamp(p + dp / 2, p_lo, p_hi);
            w.phi[std::size_t(j)] = b - a;
        }
    }
    return w;
}

double coverage(const Grid& g) {
    if (is_full_sphere(g)) return 1.0;
    CellWeights w = cell_weights(g);
    double st = 0, sp = 0;
    for (double x : w.theta) st += x;
    for (double x : w.phi) sp += x;
    return std::clamp(st * sp / (4 * pi), 0.0, 1.0);
}

bool is_full_sphere(const Grid& g) {
    return g.sampling == Sampling::surface && g.phi_wraps() && g.has_north_pole() && g.has_south_pole() && g.theta.count >= 2;
}

std::string sphere_shortfall(const Grid& g) {
    if (is_full_sphere(g)) return "";
    char buf[96];
    if (g.sampling == Sampling::cuts) {
        const bool azimuth = g.theta.count == 1;
        const AngleAxis& a = azimuth ? g.theta : g.phi;
        std::string list;
        for (int i = 0; i < a.count && i < 8; ++i) {
            std::snprintf(buf, sizeof buf, "%s%g", i ? ", " : "", a.value_deg(i));
            list += buf;
        }
        if (a.count > 8) list += ", ...";
        return std::string("the data hold cuts only (") + (azimuth ? "theta " : "phi ") + list + " deg)";
    }
    std::snprintf(buf, sizeof buf, "the data cover %.1f %% of it", 100 * coverage(g));
    return buf;
}

double integrate_samples(const Grid& g, const CellWeights& w, const double* values) {
    double total = 0;
    for (int i = 0; i < g.theta.count; ++i) {
        const double* row = values + g.index(i, 0);
        double s = 0;
        for (int j = 0; j < g.phi.count; ++j) s += row[j] * w.phi[std::size_t(j)];
        total += s * w.theta[std::size_t(i)];
    }
    return total;
}

double radiated_power(const Grid& g, const FarField& f) {
    CellWeights w = cell_weights(g);
    double total = 0;
    for (int i = 0; i < g.theta.count; ++i) {
        const std::size_t base = g.index(i, 0);
        double s = 0;
        for (int j = 0; j < g.phi.count; ++j)
            s += (std::norm(f.e_theta[base + std::size_t(j)]) + std::norm(f.e_phi[base + std::size_t(j)])) *
                 w.phi[std::size_t(j)];
        total += s * w.theta[std::size_t(i)];
    }
    return total;
}

PowerFigures power_figures(const FarFieldSet& s, std::size_t fi, double u_max) {
    PowerFigures p;
    p.radiated_power = radiated_power(s.grid, s.frequencies[fi]);
    p.coverage = coverage(s.grid);
    const bool full = is_full_sphere(s.grid);
    if (p.radiated_power > 0) {
        double d = 4 * pi * u_max / p.radiated_power;
        if (full)
            p.directivity = d;
        else
            p.directivity_sampled_only = d;
    }
    if (full && s.quantity == Quantity::gain) p.radiation_efficiency = p.radiated_power / (4 * pi);
    return p;
}

}  // namespace ellipsa
