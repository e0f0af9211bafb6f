#include "pattern/sphere_coverage.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

#include "pattern/components.hpp"
#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"

namespace ellipsa {

CoverageCurve coverage_curve(const Grid& g, const std::vector<double>& values, ElevationBand band) {
    CoverageCurve c;
    const double t_lo = std::clamp(90.0 - band.max_deg, 0.0, 180.0) * deg;
    const double t_hi = std::clamp(90.0 - band.min_deg, 0.0, 180.0) * deg;
    c.band_solid_angle_sr = 2 * pi * (std::cos(t_lo) - std::cos(t_hi));
    if (!(c.band_solid_angle_sr > 0)) return c;
    // Exact cell weights, with each theta cell clipped to the sampled range and to the band.
    const CellWeights w = cell_weights(g);
    const double dt = g.theta.step_deg * deg;
    const double s_lo = std::max(0.0, g.theta.start_deg * deg), s_hi = std::min(pi, g.theta.last_deg() * deg);
    std::vector<std::pair<double, double>> samples;  // (value, solid angle)
    double sampled = 0;
    for (int i = 0; i < g.theta.count; ++i) {
        const double t = g.theta.value_deg(i) * deg;
        const double a = std::clamp(std::clamp(t - dt / 2, s_lo, s_hi), t_lo, t_hi);
        const double b = std::clamp(std::clamp(t + dt / 2, s_lo, s_hi), t_lo, t_hi);
        const double wt = std::cos(a) - std::cos(b);
        if (!(wt > 0)) continue;
        for (int j = 0; j < g.phi.count; ++j) {
            const double v = values[g.index(i, j)];
            const double sa = wt * w.phi[std::size_t(j)];
            sampled += sa;
            if (!std::isnan(v)) samples.emplace_back(v, sa);
        }
    }
    std::sort(samples.begin(), samples.end(), [](const auto& x, const auto& y) { return x.first > y.first; });
    c.level_db.reserve(samples.size());
    c.share.reserve(samples.size());
    double acc = 0;
    for (std::size_t k = 0; k < samples.size(); ++k) {
        acc += samples[k].second;
        // Equal levels (in dB) form one step: only the last of them carries the share.
        const double db = to_db(samples[k].first);
        if (k + 1 < samples.size() && to_db(samples[k + 1].first) == db) continue;
        c.level_db.push_back(db);
        c.share.push_back(acc / c.band_solid_angle_sr);
    }
    c.sampled_share = sampled / c.band_solid_angle_sr;
    return c;
}

double share_at_or_above(const CoverageCurve& c, double level_db) {
    // level_db is descending: the last entry >= level_db carries the share.
    const auto it = std::partition_point(c.level_db.begin(), c.level_db.end(), [&](double v) { return v >= level_db; });
    if (it == c.level_db.begin()) return 0;
    return c.share[std::size_t(it - c.level_db.begin()) - 1];
}

std::vector<double> component_power_samples(const FarFieldSet& s, std::size_t fi, Component c) {
    std::vector<double> out(s.grid.size());
    component_power_grid(s, fi, c, out.data());
    return out;
}

std::vector<double> component_power_on_grid(const FarFieldSet& b, std::size_t fi, Component c, const Grid& g) {
    std::vector<double> out(g.size());
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            const double td = g.theta.value_deg(i), pd = g.phi.value_deg(j);
            const auto v = interpolate(b, fi, td, pd);
            out[g.index(i, j)] = v ? component_power(decompose(v->e_theta, v->e_phi, pd * deg, b.ludwig3_reference), c)
                                   : std::nan("");
        }
    return out;
}

std::vector<double> best_of(const std::vector<double>& a, const std::vector<double>& b) {
    std::vector<double> out(std::min(a.size(), b.size()));
    for (std::size_t k = 0; k < out.size(); ++k)
        out[k] = (std::isnan(a[k]) || std::isnan(b[k])) ? std::nan("") : std::max(a[k], b[k]);
    return out;
}

}  // namespace ellipsa
