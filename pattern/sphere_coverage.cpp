#include "pattern/sphere_coverage.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <utility>

#include "pattern/components.hpp"
#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"

namespace ellipsa {

namespace {

// A stretch of one cell along one axis: its measure (solid-angle factor or radians) and how far
// it reaches from the sample toward the cell edge on that side, as fractions 0 (the sample) .. 1
// (the edge, half-way to the neighbour).
struct Stretch {
    double measure = 0, f0 = 0, f1 = 0;
};

// The part of [from, to] (from: the sample, to: the cell edge) inside [lo, hi]; `weight` turns an
// interval into its measure.
template <class Weight>
Stretch stretch(double from, double to, double lo, double hi, Weight weight) {
    const double a = std::max(std::min(from, to), lo), b = std::min(std::max(from, to), hi);
    if (!(b > a)) return {};
    const double half = std::abs(to - from);
    return {weight(a, b), std::abs((to > from ? a : b) - from) / half, std::abs((to > from ? b : a) - from) / half};
}

// One quarter of a cell: the value is bilinear between the sample v, half-way to the theta
// neighbour, half-way to the phi neighbour and the corner (the mean of the four samples); the
// quarter's solid angle is spread evenly over the range [lo, hi] the interpolant spans on it.
template <class Add>
void add_quarter(double v, double nt, double np, double nd, const Stretch& st, const Stretch& sp, Add& add) {
    const double w = st.measure * sp.measure;
    if (!(w > 0)) return;
    const double dt = (nt - v) / 2, dp = (np - v) / 2, dx = (v - nt - np + nd) / 4;
    double lo = INFINITY, hi = -INFINITY;
    for (double ft : {st.f0, st.f1})
        for (double fp : {sp.f0, sp.f1}) {
            const double x = std::max(0.0, v + dt * ft + dp * fp + dx * ft * fp);
            lo = std::min(lo, x);
            hi = std::max(hi, x);
        }
    add(lo, hi, w);
}

// Every quarter cell inside the band t_lo..t_hi (theta, radians): add(lo, hi, solid angle).
// Returns the sampled solid angle of the band (NaN samples included).
template <class Add>
double for_each_quarter(const Grid& g, const std::vector<double>& values, double t_lo, double t_hi, Add add) {
    // The cells of pattern/integrate, clipped to the sampled range and to the band, in halves.
    const double dt = g.theta.step_deg * deg, dp = g.phi.step_deg * deg;
    const double lo_t = std::max({0.0, g.theta.start_deg * deg, t_lo}), hi_t = std::min({pi, g.theta.last_deg() * deg, t_hi});
    const bool wraps = g.phi_wraps();
    const double lo_p = wraps ? -INFINITY : g.phi.start_deg * deg, hi_p = wraps ? INFINITY : g.phi.last_deg() * deg;
    const auto solid = [](double a, double b) { return std::cos(a) - std::cos(b); };
    const auto width = [](double a, double b) { return b - a; };
    const int nt = g.theta.count, np = g.phi.count;
    // A neighbour's value; the sample's own where there is none (the cell ends at the data's edge).
    auto at = [&](int i, int j, double own) {
        if (wraps) j = (j + np) % np;
        if (i < 0 || i >= nt || j < 0 || j >= np) return own;
        const double x = values[g.index(i, j)];
        return std::isnan(x) ? own : x;
    };
    double sampled = 0;
    for (int i = 0; i < nt; ++i) {
        const double t = g.theta.value_deg(i) * deg;
        const Stretch th[2] = {stretch(t, t - dt / 2, lo_t, hi_t, solid), stretch(t, t + dt / 2, lo_t, hi_t, solid)};
        if (!(th[0].measure + th[1].measure > 0)) continue;
        for (int j = 0; j < np; ++j) {
            const double p = g.phi.value_deg(j) * deg;
            const Stretch ph[2] = {stretch(p, p - dp / 2, lo_p, hi_p, width), stretch(p, p + dp / 2, lo_p, hi_p, width)};
            sampled += (th[0].measure + th[1].measure) * (ph[0].measure + ph[1].measure);
            const double v = values[g.index(i, j)];
            if (std::isnan(v)) continue;
            for (int a = 0; a < 2; ++a)
                for (int b = 0; b < 2; ++b) {
                    const double vt = at(i + 2 * a - 1, j, v), vp = at(i, j + 2 * b - 1, v);
                    add_quarter(v, vt, vp, at(i + 2 * a - 1, j + 2 * b - 1, vt + vp - v), th[a], ph[b], add);
                }
        }
    }
    return sampled;
}

// Events of the level sweep: a uniform density of share starts (at hi) or ends (at lo), or a
// point mass of share sits at one level.
struct Event {
    double level, slope, mass;
};

// The sweep from the highest level down: the share at or above each event's level.
void sweep(std::vector<Event>& ev, CoverageCurve& c) {
    std::sort(ev.begin(), ev.end(), [](const Event& x, const Event& y) { return x.level > y.level; });
    double acc = 0, slope = 0;
    auto knot = [&](double level) {
        c.level.push_back(level);
        c.level_db.push_back(to_db(level));
        c.share.push_back(acc / c.band_solid_angle_sr);
    };
    for (std::size_t k = 0; k < ev.size();) {
        const double level = ev[k].level;
        if (!c.level.empty()) acc += std::max(0.0, slope) * (c.level.back() - level);
        knot(level);
        double mass = 0;
        for (; k < ev.size() && ev[k].level == level; ++k) {
            slope += ev[k].slope;
            mass += ev[k].mass;
        }
        if (mass > 0) {
            acc += mass;
            knot(level);
        }
    }
}

// Theta limits (radians) of an elevation band.
std::pair<double, double> band_theta(ElevationBand band) {
    return {std::clamp(90.0 - band.max_deg, 0.0, 180.0) * deg, std::clamp(90.0 - band.min_deg, 0.0, 180.0) * deg};
}

}  // namespace

CoverageCurve coverage_curve(const Grid& g, const std::vector<double>& values, ElevationBand band) {
    CoverageCurve c;
    const auto [t_lo, t_hi] = band_theta(band);
    c.band_solid_angle_sr = 2 * pi * (std::cos(t_lo) - std::cos(t_hi));
    if (!(c.band_solid_angle_sr > 0)) return c;
    std::vector<Event> ev;
    const double sampled = for_each_quarter(g, values, t_lo, t_hi, [&](double lo, double hi, double w) {
        if (hi > lo) {
            ev.push_back({hi, w / (hi - lo), 0});
            ev.push_back({lo, -w / (hi - lo), 0});
        } else {
            ev.push_back({hi, 0, w});
        }
    });
    c.sampled_share = sampled / c.band_solid_angle_sr;
    sweep(ev, c);
    return c;
}

double solid_angle_at_or_above(const Grid& g, const std::vector<double>& values, double level, ElevationBand band) {
    const auto [t_lo, t_hi] = band_theta(band);
    double sum = 0;
    for_each_quarter(g, values, t_lo, t_hi, [&](double lo, double hi, double w) {
        if (hi > lo) sum += w * std::clamp((hi - level) / (hi - lo), 0.0, 1.0);
        else if (hi >= level) sum += w;
    });
    return sum;
}

double share_at_or_above(const CoverageCurve& c, double level_db) {
    // The knots descend; between two of them the share is linear in the linear level.
    const auto it = std::partition_point(c.level_db.begin(), c.level_db.end(), [&](double v) { return v >= level_db; });
    if (it == c.level_db.begin()) return 0;
    const std::size_t k = std::size_t(it - c.level_db.begin()) - 1;
    if (k + 1 == c.level.size()) return c.share[k];
    const double x = std::pow(10.0, level_db / 10), x0 = c.level[k], x1 = c.level[k + 1];
    const double f = x0 > x1 ? std::clamp((x0 - x) / (x0 - x1), 0.0, 1.0) : 0.0;
    return c.share[k] + f * (c.share[k + 1] - c.share[k]);
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
