#include "pattern/cut.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>

#include "pattern/interpolate.hpp"

namespace ellipsa {

RatioDb ratio_db(double num, double den) {
    RatioDb r;
    if (!(num > 0) || !(den >= 0)) return r;
    const double d = to_db(num) - to_db(den);  // +inf for a zero denominator
    if (d > null_ratio_bound_db)
        r.above_db = null_ratio_bound_db;
    else
        r.db = d;
    return r;
}

CutSpec CutSpec::phi_cut(double phi_deg) {
    CutSpec c;
    c.kind = CutKind::phi_const;
    c.phi_deg = wrap360(phi_deg);
    return c;
}
CutSpec CutSpec::theta_cut(double theta_deg) {
    CutSpec c;
    c.kind = CutKind::theta_const;
    c.theta_deg = theta_deg;
    return c;
}
CutSpec CutSpec::great_circle(Vec3 centre, Vec3 tangent) {
    CutSpec c;
    c.kind = CutKind::great_circle;
    c.centre = normalized(centre);
    Vec3 t = tangent - dot(tangent, c.centre) * c.centre;
    if (norm(t) < 1e-12) {  // tangent parallel to centre: pick any orthogonal direction
        t = std::abs(c.centre.z) < 0.9 ? cross(c.centre, Vec3{0, 0, 1}) : cross(c.centre, Vec3{1, 0, 0});
    }
    c.tangent = normalized(t);
    return c;
}
CutSpec CutSpec::through(double theta_deg, double phi_deg, bool along_phi) {
    const double t = theta_deg * deg, p = phi_deg * deg;
    return great_circle(direction(t, p), along_phi ? phi_hat(p) : theta_hat(t, p));
}

std::string CutSpec::label() const {
    char buf[160];
    switch (kind) {
        case CutKind::phi_const: std::snprintf(buf, sizeof buf, "phi = %g deg", phi_deg); break;
        case CutKind::theta_const: std::snprintf(buf, sizeof buf, "theta = %g deg", theta_deg); break;
        case CutKind::great_circle: {
            double t, p;
            to_spherical(centre, t, p);
            std::snprintf(buf, sizeof buf, "great circle through theta = %.1f deg, phi = %.1f deg", t / deg,
                          p / deg);
            break;
        }
    }
    return buf;
}

const char* CutSpec::angle_name() const {
    switch (kind) {
        case CutKind::phi_const: return "theta";
        case CutKind::theta_const: return "phi";
        case CutKind::great_circle: return "angle";
    }
    return "angle";
}

int nearest_cut_sample(const CutSamples& c, Vec3 d) {
    int best = -1;
    double bd = -2;
    for (std::size_t k = 0; k < c.angle_deg.size(); ++k) {
        const double x = dot(direction(c.theta_deg[k] * deg, c.phi_deg[k] * deg), d);
        if (x > bd) {
            bd = x;
            best = int(k);
        }
    }
    return best;
}

double default_cut_step(const Grid& g) {
    double s = std::min(g.theta.step_deg, g.phi.step_deg) / 4;
    return std::max(s, 0.05);
}

CutSamples cut_positions(const CutSpec& spec, double step_deg) {
    int n = int(std::lround(360.0 / std::max(step_deg, 1e-3)));
    if (n < 8) n = 8;
    if (n % 2) ++n;
    CutSamples c;
    c.step_deg = 360.0 / n;
    c.angle_deg.resize(std::size_t(n));
    c.theta_deg.resize(std::size_t(n));
    c.phi_deg.resize(std::size_t(n));
    c.e_theta.resize(std::size_t(n));
    c.e_phi.resize(std::size_t(n));
    c.valid.resize(std::size_t(n));
    const double a0 = spec.kind == CutKind::theta_const ? 0.0 : -180.0;
    for (int k = 0; k < n; ++k) {
        const double a = a0 + k * c.step_deg;
        double t_deg, p_deg;
        switch (spec.kind) {
            case CutKind::phi_const:
                if (a >= 0) {
                    t_deg = a;
                    p_deg = spec.phi_deg;
                } else {
                    t_deg = -a;
                    p_deg = wrap360(spec.phi_deg + 180);
                }
                break;
            case CutKind::theta_const:
                t_deg = spec.theta_deg;
                p_deg = a;
                break;
            default: {
                const double sr = a * deg;
                Vec3 r = std::cos(sr) * spec.centre + std::sin(sr) * spec.tangent;
                double tr, pr;
                to_spherical(r, tr, pr);
                t_deg = tr / deg;
                p_deg = pr / deg;
            }
        }
        const std::size_t k_ = std::size_t(k);
        c.angle_deg[k_] = a;
        c.theta_deg[k_] = t_deg;
        c.phi_deg[k_] = p_deg;
    }
    return c;
}

void sample_cut_at(const FarFieldSet& s, std::size_t fi, CutSamples& c, std::size_t k) {
    auto f = interpolate(s, fi, c.theta_deg[k], c.phi_deg[k]);
    c.valid[k] = f.has_value();
    if (f) {
        c.e_theta[k] = f->e_theta;
        c.e_phi[k] = f->e_phi;
    }
}

CutSamples sample_cut(const FarFieldSet& s, std::size_t fi, const CutSpec& spec, double step_deg) {
    CutSamples c = cut_positions(spec, step_deg);
    for (std::size_t k = 0; k < c.angle_deg.size(); ++k) sample_cut_at(s, fi, c, k);
    return c;
}

std::vector<double> cut_power(const FarFieldSet& s, const CutSamples& c, Component comp) {
    const std::size_t n = c.angle_deg.size();
    std::vector<double> out(n), cos_p, sin_p;
    if (comp == Component::co || comp == Component::cross) {
        cos_p.resize(n);
        sin_p.resize(n);
        for (std::size_t k = 0; k < n; ++k) {
            cos_p[k] = std::cos(c.phi_deg[k] * deg);
            sin_p[k] = std::sin(c.phi_deg[k] * deg);
        }
    }
    component_power_many(n, c.e_theta.data(), c.e_phi.data(), cos_p.data(), sin_p.data(), s.ludwig3_reference, comp,
                         out.data());
    for (std::size_t k = 0; k < n; ++k)
        if (!c.valid[k]) out[k] = std::numeric_limits<double>::quiet_NaN();
    return out;
}

const char* to_string(BeamShape b) {
    switch (b) {
        case BeamShape::no_power: return "no_power";
        case BeamShape::beam: return "beam";
        case BeamShape::omnidirectional: return "omnidirectional";
        case BeamShape::wider_than_180: return "wider_than_180_deg";
        case BeamShape::edges_outside_data: return "edges_outside_data";
    }
    return "no_power";
}

namespace {

// A closed cut in dB: NaN outside the data, -inf for zero power; indices wrap.
struct Loop {
    std::vector<double> y;
    int n = 0;
    int wrap(int k) const { return ((k % n) + n) % n; }
    double at(int k) const { return y[std::size_t(wrap(k))]; }
    bool ok(int k) const { return !std::isnan(at(k)); }
};

// The half-power crossing walking from the peak sample k in direction dir (offset in samples).
struct Edge {
    EdgeStatus status = EdgeStatus::never_falls;
    double offset = 0;
};
Edge half_power_edge(const Loop& L, int k, int dir, double level_db) {
    for (int m = 1; m < L.n; ++m) {
        const int j = k + dir * m;
        if (!L.ok(j)) return {EdgeStatus::outside_data, 0};
        const double yj = L.at(j);
        // A pattern that just touches half power (1 + cos^2 t) counts as crossing it there.
        if (yj <= level_db + 1e-9) {
            const double yprev = L.at(j - dir);
            const double frac = std::isfinite(yj) && yprev > yj ? std::clamp((yprev - level_db) / (yprev - yj), 0.0, 1.0) : 1.0;
            return {EdgeStatus::found, dir * (m - 1 + frac)};
        }
    }
    return {};
}

// A local maximum (a plateau [first, last] whose neighbours are both lower) and its prominence:
// the drop to the lowest sample before a higher one (or the end of the data) on each side, the
// smaller of the two; reach_lo / reach_hi: how far (in samples) the lobe's base extends.
struct Lobe {
    int first = 0, last = 0;
    double prominence_db = 0;
    int reach_lo = 0, reach_hi = 0;
};
std::vector<Lobe> local_maxima(const Loop& L) {
    std::vector<Lobe> out;
    for (int i = 0; i < L.n; ++i) {
        if (!L.ok(i) || !std::isfinite(L.at(i)) || !L.ok(i - 1) || !(L.at(i - 1) < L.at(i))) continue;
        int j = i;
        while (j - i < L.n - 1 && L.ok(j + 1) && L.at(j + 1) == L.at(i)) ++j;
        if (L.ok(j + 1) && L.at(j + 1) < L.at(i)) out.push_back({i, j, 0, 0, 0});
    }
    return out;
}
void measure_prominence(const Loop& L, Lobe& b) {
    const double top = L.at(b.first);
    double lo_min = top, hi_min = top;
    int m = 1;
    for (; m < L.n && L.ok(b.first - m) && !(L.at(b.first - m) > top); ++m)
        if (L.at(b.first - m) < lo_min) lo_min = L.at(b.first - m), b.reach_lo = m;
    for (m = 1; m < L.n && L.ok(b.last + m) && !(L.at(b.last + m) > top); ++m)
        if (L.at(b.last + m) < hi_min) hi_min = L.at(b.last + m), b.reach_hi = m;
    b.prominence_db = top - std::max(lo_min, hi_min);  // +inf against an exact null
}

// The highest lobe other than the main one (containing sample k) and, with mirrored halves, other
// than the main beam's mirror image. Candidates are tried from the highest down.
void side_lobes(const Loop& L, int k, const std::vector<double>& angle_deg, bool mirrored, BeamFigures& b) {
    std::vector<Lobe> lobes = local_maxima(L);
    std::sort(lobes.begin(), lobes.end(), [&](const Lobe& x, const Lobe& y) { return L.at(x.first) > L.at(y.first); });
    const double step = angle_deg[1] - angle_deg[0];
    const int mirror_k = L.wrap(int(std::lround((-b.peak_angle_deg - angle_deg[0]) / step)));
    auto covers = [&](int lo, int len, int idx) { return L.wrap(idx - lo) <= len; };
    for (Lobe& c : lobes) {
        if (covers(c.first, c.last - c.first, k)) continue;  // the main lobe itself
        measure_prominence(L, c);
        if (!(c.prominence_db >= lobe_prominence_db)) continue;
        const double rel = L.at(c.first) - b.peak_db;
        if (mirrored && rel >= -half_power_db &&
            covers(c.first - c.reach_lo, c.last + c.reach_hi - (c.first - c.reach_lo), mirror_k)) {
            b.mirror_beam = true;
            continue;
        }
        b.sidelobe_db = std::min(rel, 0.0);
        return;
    }
}

}  // namespace

BeamFigures beam_figures(const std::vector<double>& angle_deg, const std::vector<double>& power, int start,
                         bool mirrored_halves) {
    BeamFigures b;
    Loop L;
    L.n = int(power.size());
    if (L.n < 3) return b;
    L.y.resize(power.size());
    for (std::size_t i = 0; i < power.size(); ++i) L.y[i] = std::isnan(power[i]) ? power[i] : to_db(power[i]);
    const double step = angle_deg[1] - angle_deg[0];
    int k = start;
    if (k < 0 || k >= L.n || !L.ok(k)) {
        k = -1;
        for (int i = 0; i < L.n; ++i)
            if (L.ok(i) && (k < 0 || L.at(i) > L.at(k))) k = i;
        if (k < 0) return b;
    }
    // Climb to the local maximum (within one loop).
    for (int guard = 0; guard < L.n; ++guard) {
        if (L.ok(k + 1) && L.at(k + 1) > L.at(k)) ++k;
        else if (L.ok(k - 1) && L.at(k - 1) > L.at(k)) --k;
        else break;
    }
    k = L.wrap(k);
    if (!std::isfinite(L.at(k))) return b;  // no positive sample
    double peak_db = L.at(k), peak_off = 0;
    if (L.ok(k - 1) && L.ok(k + 1) && std::isfinite(L.at(k - 1)) && std::isfinite(L.at(k + 1))) {
        const double ym = L.at(k - 1), yp = L.at(k + 1), den = ym - 2 * peak_db + yp;
        if (den < 0) {
            peak_off = std::clamp(0.5 * (ym - yp) / den, -0.5, 0.5);
            peak_db += -0.5 * den * peak_off * peak_off;
        }
    }
    b.peak_angle_deg = angle_deg[std::size_t(k)] + peak_off * step;
    b.peak_db = peak_db;

    const Edge r = half_power_edge(L, k, +1, peak_db - half_power_db), l = half_power_edge(L, k, -1, peak_db - half_power_db);
    b.left = l.status;
    b.right = r.status;
    if (l.status == EdgeStatus::found) b.left_deg = angle_deg[std::size_t(k)] + l.offset * step;
    if (r.status == EdgeStatus::found) b.right_deg = angle_deg[std::size_t(k)] + r.offset * step;
    if (l.status == EdgeStatus::outside_data || r.status == EdgeStatus::outside_data) {
        b.shape = BeamShape::edges_outside_data;
    } else if (l.status == EdgeStatus::found && r.status == EdgeStatus::found) {
        const double span = (r.offset - l.offset) * step;
        if (span <= 180.0 + 1e-9) {
            b.shape = BeamShape::beam;
            b.hpbw_deg = span;
        } else {
            b.shape = BeamShape::wider_than_180;
            b.half_power_span_deg = span;
        }
    } else {
        b.shape = BeamShape::omnidirectional;
        double lowest = L.at(k);
        for (double v : L.y)
            if (!std::isnan(v)) lowest = std::min(lowest, v);
        b.ripple_db = L.at(k) - lowest;
    }
    // Front-to-back on this cut: the sample half-way round.
    if (L.n % 2 == 0 && L.ok(k + L.n / 2)) {
        const RatioDb fb = ratio_db(power[std::size_t(k)], power[std::size_t(L.wrap(k + L.n / 2))]);
        b.front_to_back_db = fb.db;
        b.front_to_back_above_db = fb.above_db;
    }
    side_lobes(L, k, angle_deg, mirrored_halves, b);
    return b;
}

namespace {
// Where the climb to the main lobe starts: the largest sample, the one at a non-negative angle
// between equal maxima; -1 when no sample is positive.
int climb_start(const std::vector<double>& p, const std::vector<double>& angle_deg) {
    int best = -1;
    for (std::size_t k = 0; k < p.size(); ++k) {
        if (!(p[k] > 0)) continue;
        if (best < 0) {
            best = int(k);
            continue;
        }
        const double b = p[std::size_t(best)];
        const bool tie = std::abs(p[k] - b) <= 1e-9 * b;
        if ((!tie && p[k] > b) || (tie && angle_deg[k] >= 0 && angle_deg[std::size_t(best)] < 0)) best = int(k);
    }
    return best;
}
}  // namespace

Result<ComponentCut> compute_cut(const FarFieldSet& s, std::size_t fi, const CutSpec& spec,
                                 const std::vector<Component>& components, double step_deg) {
    if (fi >= s.frequencies.size()) return Error{"", 0, 0, "frequency index out of range"};
    if (spec.kind == CutKind::theta_const && !(spec.theta_deg >= 0 && spec.theta_deg <= 180))
        return Error{"", 0, 0, "a conical cut needs a polar angle theta from 0 to 180 deg"};
    for (Component c : components)
        if (auto why = component_unavailable(s, c)) return Error{"", 0, 0, *why};
    ComponentCut d;
    d.spec = spec;
    d.freq_index = fi;
    d.components = components;
    d.samples = sample_cut(s, fi, spec, step_deg > 0 ? step_deg : default_cut_step(s.grid));
    if (std::none_of(d.samples.valid.begin(), d.samples.valid.end(), [](unsigned char v) { return v != 0; }))
        return Error{"", 0, 0, "the " + spec.label() + " cut lies entirely outside the sampled region"};
    for (Component c : components) {
        d.power.push_back(cut_power(s, d.samples, c));
        const std::vector<double>& p = d.power.back();
        d.beams.push_back(beam_figures(d.samples.angle_deg, p, climb_start(p, d.samples.angle_deg), spec.kind == CutKind::phi_const));
    }
    return d;
}

}  // namespace ellipsa
