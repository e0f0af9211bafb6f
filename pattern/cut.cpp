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

CutSamples sample_cut(const FarFieldSet& s, std::size_t fi, const CutSpec& spec, double step_deg) {
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
        auto f = interpolate(s, fi, t_deg, p_deg);
        c.valid[k_] = f.has_value();
        if (f) {
            c.e_theta[k_] = f->e_theta;
            c.e_phi[k_] = f->e_phi;
        }
    }
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

BeamFigures beam_figures(const std::vector<double>& angle_deg, const std::vector<double>& power, int start) {
    BeamFigures b;
    const int n = int(power.size());
    if (n < 3) return b;
    const double step = angle_deg.size() > 1 ? angle_deg[1] - angle_deg[0] : 1.0;
    auto at = [&](int k) { return power[std::size_t(((k % n) + n) % n)]; };
    auto ok = [&](int k) { return std::isfinite(at(k)); };

    int k = start;
    if (k < 0 || k >= n || !ok(k)) {
        k = -1;
        double best = -1;
        for (int i = 0; i < n; ++i)
            if (ok(i) && power[std::size_t(i)] > best) {
                best = power[std::size_t(i)];
                k = i;
            }
        if (k < 0) return b;
    }
    // Climb to the local maximum (within one loop).
    for (int guard = 0; guard < n; ++guard) {
        if (ok(k + 1) && at(k + 1) > at(k))
            ++k;
        else if (ok(k - 1) && at(k - 1) > at(k))
            --k;
        else
            break;
    }
    k = ((k % n) + n) % n;
    const double p0 = at(k);
    if (!(p0 > 0)) return b;
    double peak_db = to_db(p0), peak_off = 0;
    if (ok(k - 1) && ok(k + 1) && at(k - 1) > 0 && at(k + 1) > 0) {
        const double ym = to_db(at(k - 1)), yp = to_db(at(k + 1)), den = ym - 2 * peak_db + yp;
        if (den < 0) {
            peak_off = std::clamp(0.5 * (ym - yp) / den, -0.5, 0.5);
            peak_db += -0.5 * den * peak_off * peak_off;
        }
    }
    b.peak_angle_deg = angle_deg[std::size_t(k)] + peak_off * step;
    b.peak_db = peak_db;
    const double level_db = peak_db - 10.0 * std::log10(2.0);  // -3.0103 dB

    // Walk outward to the half-power crossing; interpolate linearly in dB.
    auto crossing = [&](int dir) -> std::optional<double> {
        for (int m = 1; m < n; ++m) {
            const int j = k + dir * m;
            if (!ok(j)) return std::nullopt;
            const double yj = to_db(at(j));
            // A pattern that just touches half power (1 + cos^2 t) counts as crossing it there.
            if (yj <= level_db + 1e-9) {
                const double yprev = to_db(at(j - dir));
                const double frac =
                    std::isfinite(yj) && yprev > yj ? std::clamp((yprev - level_db) / (yprev - yj), 0.0, 1.0) : 1.0;
                return dir * (m - 1 + frac) * step;  // offset from the peak sample
            }
        }
        return std::nullopt;
    };
    auto r = crossing(+1), l = crossing(-1);
    if (r && l && (*r - *l) < 360.0) {
        b.hpbw_deg = *r - *l;
        b.left_deg = angle_deg[std::size_t(k)] + *l;
        b.right_deg = angle_deg[std::size_t(k)] + *r;
    }
    // Front-to-back on this cut: the sample half-way round.
    if (n % 2 == 0 && ok(k + n / 2)) {
        const double back = at(k + n / 2);
        if (back > 0) b.front_to_back_db = to_db(p0) - to_db(back);
    }
    // First nulls: walk outward while the power keeps falling.
    auto null_at = [&](int dir) -> std::optional<int> {
        int j = k;
        for (int m = 1; m < n; ++m) {
            const int nxt = j + dir;
            if (!ok(nxt)) return std::nullopt;
            if (at(nxt) > at(j)) return j;
            j = nxt;
        }
        return std::nullopt;
    };
    auto nr = null_at(+1), nl = null_at(-1);
    if (nr && nl) {
        const int span = *nr - *nl;  // main lobe from nl to nr (unwrapped indices)
        if (span < n - 2) {
            double best = -1;
            for (int j = *nr + 1; j < *nl + n; ++j) {
                if (!ok(j) || !ok(j - 1) || !ok(j + 1)) continue;
                const double v = at(j);
                if (v >= at(j - 1) && v > at(j + 1) && v > best) best = v;
            }
            if (best > 0) b.sidelobe_db = to_db(best) - to_db(p0);
        }
    }
    return b;
}

}  // namespace ellipsa
