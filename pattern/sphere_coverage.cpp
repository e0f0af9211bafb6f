#include "pattern/sphere_coverage.hpp"

#include <algorithm>
#include <array>
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

// Where a neighbour's value is missing (NaN), the sample's own stands in (see at() below).
inline double or_own(double x, double own) { return std::isnan(x) ? own : x; }

// add_quarter() for an unclipped quarter (fractions 0 and 1 on both axes): its corners are v,
// the two half-way values and the corner value. The same figures bit for bit as add_quarter()
// when every value is finite and at most 1e300 in size (so that no sum overflows and x * 0 is
// a zero, which max(0, ...) turns into +0 as it does there).
template <class Add>
void add_unclipped_quarter(double v, double nt, double np, double nd, double w, Add& add) {
    if (!(w > 0)) return;
    const double dt = (nt - v) / 2, dp = (np - v) / 2, dx = (v - nt - np + nd) / 4;
    const double c00 = std::max(0.0, v), c01 = std::max(0.0, v + dp), c10 = std::max(0.0, v + dt);
    const double c11 = std::max(0.0, v + dt + dp + dx);
    add(std::min(std::min(c00, c01), std::min(c10, c11)), std::max(std::max(c00, c01), std::max(c10, c11)), w);
}

// True when every value is NaN or finite and at most 1e300 in size (add_unclipped_quarter's condition).
bool values_moderate(const std::vector<double>& values) {
    bool ok = true;
    for (const double x : values) ok &= !(std::abs(x) > 1e300);
    return ok;
}

// One sample's four quarters by the general path (any clipping, any neighbour missing).
// at(i, j, own): a neighbour's value, or `own` where there is none.
template <class At, class Add>
void general_sample(int i, int j, double v, const Stretch th[2], const Stretch ph[2], At& at, Add& add) {
    for (int a = 0; a < 2; ++a)
        for (int b = 0; b < 2; ++b) {
            const double vt = at(i + 2 * a - 1, j, v), vp = at(i, j + 2 * b - 1, v);
            add_quarter(v, vt, vp, at(i + 2 * a - 1, j + 2 * b - 1, vt + vp - v), th[a], ph[b], add);
        }
}

// The four quarters of sample j of an unclipped row (r: the row, rt[0], rt[1]: the rows before
// and after; jn: the neighbouring columns) whose column is unclipped too. The same add() calls,
// in the same order and with the same figures, as general_sample().
template <class Add>
void unclipped_sample(const double* r, const double* const rt[2], const int jn[2], int j, const Stretch th[2],
                      const Stretch ph[2], Add& add) {
    const double v = r[j];
    const double vt[2] = {or_own(rt[0][j], v), or_own(rt[1][j], v)};
    const double vp[2] = {or_own(r[jn[0]], v), or_own(r[jn[1]], v)};
    for (int a = 0; a < 2; ++a)
        for (int b = 0; b < 2; ++b)
            add_unclipped_quarter(v, vt[a], vp[b], or_own(rt[a][jn[b]], vt[a] + vp[b] - v), th[a].measure * ph[b].measure, add);
}

bool unclipped(const Stretch s[2]) {
    return s[0].measure > 0 && s[1].measure > 0 && s[0].f0 == 0 && s[0].f1 == 1 && s[1].f0 == 0 && s[1].f1 == 1;
}

// Every quarter cell inside the band t_lo..t_hi (theta, radians): add(lo, hi, solid angle), in
// the order of the samples (row by row), each sample's four quarters in the order (theta side,
// phi side) = (-,-), (-,+), (+,-), (+,+). Returns the sampled solid angle of the band (NaN
// samples included). The general path (add_quarter on each sample's clipped stretches) is the
// definition; where a row and a column are both unclipped (the interior of the grid, and every
// column of a wrapping one) and the values moderate, a fast path gives the same calls, bit for
// bit (tests/unit/test_sphere_coverage.cpp compares the two). general_only: the definition alone.
// skip_row(i): true when no quarter of row i could matter to add (its samples still count in
// the sampled solid angle returned).
template <class Add, class SkipRow = bool (*)(int)>
double for_each_quarter(const Grid& g, const std::vector<double>& values, double t_lo, double t_hi, Add add,
                        bool general_only = false, SkipRow skip_row = [](int) { return false; }) {
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
        return or_own(values[g.index(i, j)], own);
    };
    // Each column's phi stretches (the same in every row), its neighbours, and whether it is unclipped.
    std::vector<std::array<Stretch, 2>> ph(std::size_t(std::max(np, 0)));
    std::vector<std::array<int, 2>> jn(ph.size());
    std::vector<unsigned char> col_fast(ph.size(), 0);
    for (int j = 0; j < np; ++j) {
        const double p = g.phi.value_deg(j) * deg;
        ph[j] = {stretch(p, p - dp / 2, lo_p, hi_p, width), stretch(p, p + dp / 2, lo_p, hi_p, width)};
        jn[j] = {wraps ? (j - 1 + np) % np : j - 1, wraps ? (j + 1) % np : j + 1};
        col_fast[j] = unclipped(ph[j].data()) && jn[j][0] >= 0 && jn[j][1] < np;
    }
    const bool fast = !general_only && values_moderate(values);
    double sampled = 0;
    for (int i = 0; i < nt; ++i) {
        const double t = g.theta.value_deg(i) * deg;
        const Stretch th[2] = {stretch(t, t - dt / 2, lo_t, hi_t, solid), stretch(t, t + dt / 2, lo_t, hi_t, solid)};
        if (!(th[0].measure + th[1].measure > 0)) continue;
        const bool row_fast = fast && unclipped(th) && i > 0 && i + 1 < nt;
        const double* r = values.data() + g.index(i, 0);
        const double* const rt[2] = {row_fast ? r - np : r, row_fast ? r + np : r};
        if (skip_row(i)) {
            for (int j = 0; j < np; ++j) sampled += (th[0].measure + th[1].measure) * (ph[j][0].measure + ph[j][1].measure);
            continue;
        }
        for (int j = 0; j < np; ++j) {
            sampled += (th[0].measure + th[1].measure) * (ph[j][0].measure + ph[j][1].measure);
            const double v = r[j];
            if (std::isnan(v)) continue;
            if (row_fast && col_fast[j]) unclipped_sample(r, rt, jn[j].data(), j, th, ph[j].data(), add);
            else general_sample(i, j, v, th, ph[j].data(), at, add);
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

namespace {
// For each row, whether every quarter cell of its samples lies below `level` (> 0), so that it
// adds exactly nothing to solid_angle_at_or_above. A quarter's interpolant is a weighted mean
// of values of its own row and the rows beside it (a missing neighbour stands in as the
// sample's own, a missing corner as a sum whose mean with the rest stays within them), so it
// stays at most the largest of those values, up to rounding of a few units in the last place
// of the largest size among them: 1e-9 of that size is margin enough.
std::vector<unsigned char> rows_below(const Grid& g, const std::vector<double>& values, double level) {
    const int nt = g.theta.count, np = g.phi.count;
    std::vector<unsigned char> below(std::size_t(std::max(nt, 0)), 0);
    if (!(level > 0) || np <= 0) return below;
    std::vector<double> top(below.size(), -INFINITY), size(below.size(), 0.0);
    for (int i = 0; i < nt; ++i) {
        const double* r = values.data() + g.index(i, 0);
        double t = -INFINITY, a = 0;
        for (int j = 0; j < np; ++j) {
            const double x = r[j];
            if (std::isnan(x)) continue;
            t = std::max(t, x);
            a = std::max(a, std::abs(x));
        }
        top[std::size_t(i)] = t, size[std::size_t(i)] = a;
    }
    for (int i = 0; i < nt; ++i) {
        double t = -INFINITY, a = 0;
        for (int k = std::max(i - 1, 0); k <= std::min(i + 1, nt - 1); ++k)
            t = std::max(t, top[std::size_t(k)]), a = std::max(a, size[std::size_t(k)]);
        below[std::size_t(i)] = t + 1e-9 * a < level;
    }
    return below;
}
}  // namespace

double solid_angle_at_or_above(const Grid& g, const std::vector<double>& values, double level, ElevationBand band,
                               bool every_row) {
    const auto [t_lo, t_hi] = band_theta(band);
    double sum = 0;
    // A quarter entirely below the level adds +0 to a sum that is +0 or positive: rows of such
    // quarters alone are passed over (the same sum bit for bit).
    const std::vector<unsigned char> below = every_row ? std::vector<unsigned char>() : rows_below(g, values, level);
    auto skip = [&](int i) { return !below.empty() && below[std::size_t(i)] != 0; };
    for_each_quarter(
        g, values, t_lo, t_hi,
        [&](double lo, double hi, double w) {
            if (hi > lo) sum += w * std::clamp((hi - level) / (hi - lo), 0.0, 1.0);
            else if (hi >= level) sum += w;
        },
        false, skip);
    return sum;
}

std::vector<QuarterCell> quarter_cells(const Grid& g, const std::vector<double>& values, ElevationBand band, bool general_only) {
    const auto [t_lo, t_hi] = band_theta(band);
    std::vector<QuarterCell> out;
    for_each_quarter(g, values, t_lo, t_hi, [&](double lo, double hi, double w) { out.push_back({lo, hi, w}); }, general_only);
    return out;
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
