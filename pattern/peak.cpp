#include "pattern/peak.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <utility>
#include <vector>

namespace ellipsa {

namespace {

// Parabola through (-1, ym), (0, y0), (1, yp): offset of the vertex in [-0.5, 0.5] and the rise.
bool parabola(double ym, double y0, double yp, double& offset, double& rise) {
    if (!std::isfinite(ym) || !std::isfinite(y0) || !std::isfinite(yp)) return false;
    const double den = ym - 2 * y0 + yp;
    if (!(den < 0)) return false;
    offset = std::clamp(0.5 * (ym - yp) / den, -0.5, 0.5);
    // y(d) = y0 + (yp - ym) d / 2 + den d^2 / 2; at the vertex this rises by -den d^2 / 2.
    rise = -0.5 * den * offset * offset;
    return true;
}

// The largest sample. Ties within rounding keep the first sample (lowest theta, then phi), so
// symmetric patterns report the same peak on every machine.
void largest_sample(const Grid& g, const std::vector<double>& power, Peak& pk) {
    double best = -1;
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            double v = power[g.index(i, j)];
            if (v > best * (1 + 1e-9) || (best <= 0 && v > best)) {
                best = v;
                pk.i_theta = i;
                pk.i_phi = j;
            }
        }
    pk.sample_value = best;
    pk.value = best;
    pk.theta_deg = g.theta.value_deg(pk.i_theta);
    pk.phi_deg = wrap360(g.phi.value_deg(pk.i_phi));
}

// The neighbours of the largest sample along theta, in dB (NaN where there is none). Across a
// pole the neighbour lies at phi + 180, when the grid has it.
std::pair<double, double> theta_neighbours_db(const Grid& g, const std::vector<double>& power, const Peak& pk) {
    const int it = pk.i_theta, ip = pk.i_phi, nt = g.theta.count, np = g.phi.count;
    auto sample_db = [&](int i, int j) { return to_db(power[g.index(i, j)]); };
    auto opposite_column = [&](int j) -> int {
        if (!g.phi_wraps()) return -1;
        double half = 180.0 / g.phi.step_deg;
        if (std::abs(half - std::round(half)) > 1e-9) return -1;
        return (j + int(std::lround(half))) % np;
    };
    double ym = std::numeric_limits<double>::quiet_NaN(), yp = ym;
    if (it > 0)
        ym = sample_db(it - 1, ip);
    else if (g.has_north_pole() && nt > 1) {
        int jo = opposite_column(ip);
        if (jo >= 0) ym = sample_db(1, jo);
    }
    if (it < nt - 1)
        yp = sample_db(it + 1, ip);
    else if (g.has_south_pole() && nt > 1) {
        int jo = opposite_column(ip);
        if (jo >= 0) yp = sample_db(nt - 2, jo);
    }
    return {ym, yp};
}

// Moves the peak along theta by the parabola's vertex (over a pole onto phi + 180); the rise.
double refine_theta(const Grid& g, const std::vector<double>& power, Peak& pk) {
    const auto [ym, yp] = theta_neighbours_db(g, power, pk);
    double off, rise;
    if (!parabola(ym, to_db(pk.sample_value), yp, off, rise)) return 0;
    double t = pk.theta_deg + off * g.theta.step_deg;
    double p = pk.phi_deg;
    if (t < 0) {
        t = -t;
        p = wrap360(p + 180);
    } else if (t > 180) {
        t = 360 - t;
        p = wrap360(p + 180);
    }
    pk.theta_deg = t;
    pk.phi_deg = p;
    return rise;
}

// Moves the peak along phi by the parabola's vertex (not at a pole, where all phi are one point);
// the rise.
double refine_phi(const Grid& g, const std::vector<double>& power, Peak& pk) {
    const int it = pk.i_theta, ip = pk.i_phi, nt = g.theta.count, np = g.phi.count;
    const bool pole = (it == 0 && g.has_north_pole()) || (it == nt - 1 && g.has_south_pole());
    // Cut-only data: the next phi column is another cut, not a neighbour (far_field.hpp, Sampling).
    if (pole || np < 3 || !(g.sampling == Sampling::surface || nt == 1)) return 0;
    int jm = ip - 1, jp = ip + 1;
    if (g.phi_wraps()) {
        jm = (ip - 1 + np) % np;
        jp = (ip + 1) % np;
    }
    if (jm < 0 || jp >= np) return 0;
    double off, rise;
    if (!parabola(to_db(power[g.index(it, jm)]), to_db(pk.sample_value), to_db(power[g.index(it, jp)]), off, rise)) return 0;
    pk.phi_deg = wrap360(pk.phi_deg + off * g.phi.step_deg);
    return rise;
}

}  // namespace

Peak find_peak(const FarFieldSet& s, std::size_t fi, Component c) {
    const Grid& g = s.grid;
    std::vector<double> power(g.size());
    component_power_grid(s, fi, c, power.data());
    Peak pk;
    largest_sample(g, power, pk);
    if (!(pk.sample_value > 0)) return pk;
    double rise_total = refine_theta(g, power, pk);
    rise_total += refine_phi(g, power, pk);
    pk.value = pk.sample_value * std::pow(10.0, rise_total / 10.0);
    return pk;
}

}  // namespace ellipsa
