#include "pattern/rotate.hpp"

#include <cmath>

#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"

namespace ellipsa {

namespace {

constexpr double on_grid_deg = 1e-7;

// Index of `value_deg` on an axis, or -1. Phi axes (periodic) compare modulo 360.
int axis_index(const AngleAxis& a, double value_deg, bool periodic) {
    double w = value_deg - a.start_deg;
    if (periodic) {
        w = wrap360(w);
        if (w > 360 - on_grid_deg) w -= 360;
    }
    const double u = w / a.step_deg;
    double k = std::round(u);
    if (std::abs(u - k) * a.step_deg > on_grid_deg) return -1;
    if (periodic && k >= a.count && std::abs(k * a.step_deg - 360) < on_grid_deg) k = 0;
    if (k < 0 || k >= a.count) return -1;
    return int(k);
}

// Source column at a pole: the one whose theta-hat R turns onto the destination's theta-hat.
int pole_column(const Grid& g, bool north, const Mat3& r, Vec3 th_dest) {
    const Vec3 v = apply_transposed(r, th_dest);  // theta-hat(pole, p) = +-(cos p, sin p, 0)
    const double p = north ? std::atan2(v.y, v.x) : std::atan2(-v.y, -v.x);
    const int j = axis_index(g.phi, p / deg, true);
    return j >= 0 ? j : 0;  // any column: at a pole they all hold the same Cartesian field
}

// The 2x2 change from the source sample's (theta-hat, phi-hat) to the destination's under R.
struct Basis {
    double tt, tp, pt, pp;  // e_theta' = tt e_theta + tp e_phi; e_phi' = pt e_theta + pp e_phi
};
Basis basis_change(const Grid& g, const Mat3& r, std::size_t src, int i, int j) {
    const double ts = g.theta.value_deg(int(src / std::size_t(g.phi.count))) * deg;
    const double ps = g.phi.value_deg(int(src % std::size_t(g.phi.count))) * deg;
    const double td = g.theta.value_deg(i) * deg, pd = g.phi.value_deg(j) * deg;
    const Vec3 th = apply(r, theta_hat(ts, ps)), ph = apply(r, phi_hat(ps));
    const Vec3 th_d = theta_hat(td, pd), ph_d = phi_hat(pd);
    return {dot(th, th_d), dot(ph, th_d), dot(th, ph_d), dot(ph, ph_d)};
}

// Clear the residue of the basis change (about 1e-16 |E|) in a component that is zero in the data.
void clear_residue(cplx& et, cplx& ep) {
    const double mag = std::sqrt(std::norm(et) + std::norm(ep));
    if (std::abs(et) < 1e-13 * mag) et = 0;
    if (std::abs(ep) < 1e-13 * mag) ep = 0;
}

Result<FarFieldSet> rotate_exact(const FarFieldSet& s, const Mat3& r, const std::vector<std::size_t>& from) {
    const Grid& g = s.grid;
    std::vector<Basis> b(g.size());
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) b[g.index(i, j)] = basis_change(g, r, from[g.index(i, j)], i, j);
    if (s.content == FieldContent::magnitude_only)
        for (const Basis& x : b)
            if (std::abs(x.tp) > 1e-9 || std::abs(x.pt) > 1e-9)
                return Error{"", 0, 0,
                             "this rotation mixes E_theta and E_phi, which needs the phase between them; this data "
                             "has magnitudes only (turns about z and up = -z work on such data)"};
    FarFieldSet out = s;
    for (std::size_t fi = 0; fi < s.frequencies.size(); ++fi) {
        const FarField& f = s.frequencies[fi];
        FarField& o = out.frequencies[fi];
        for (std::size_t k = 0; k < g.size(); ++k) {
            const cplx et = f.e_theta[from[k]], ep = f.e_phi[from[k]];
            if (s.content == FieldContent::complex) {
                o.e_theta[k] = b[k].tt * et + b[k].tp * ep;
                o.e_phi[k] = b[k].pt * et + b[k].pp * ep;
                clear_residue(o.e_theta[k], o.e_phi[k]);
            } else {  // magnitudes (or the total) follow the direction; the basis change is diagonal
                o.e_theta[k] = std::abs(et);
                o.e_phi[k] = std::abs(ep);
            }
        }
    }
    return out;
}

Result<FarFieldSet> rotate_resampled(const FarFieldSet& s, const Mat3& r) {
    if (!is_full_sphere(s.grid))
        return Error{"", 0, 0, "rotating a pattern needs the full sphere; this one covers only part of it"};
    if (s.content == FieldContent::magnitude_only)
        return Error{"", 0, 0,
                     "rotating a pattern needs the phase between E_theta and E_phi; this data has magnitudes only"};
    FarFieldSet out = s;
    const Grid& g = s.grid;
    for (std::size_t fi = 0; fi < s.frequencies.size(); ++fi) {
        FarField& f = out.frequencies[fi];
        for (int i = 0; i < g.theta.count; ++i) {
            const double t = g.theta.value_deg(i) * deg;
            for (int j = 0; j < g.phi.count; ++j) {
                const double p = g.phi.value_deg(j) * deg;
                const Vec3 src_dir = apply_transposed(r, direction(t, p));
                const std::size_t k = g.index(i, j);
                auto src = interpolate(s, fi, src_dir);
                if (!src) {
                    f.e_theta[k] = f.e_phi[k] = 0;
                    continue;
                }
                if (s.content == FieldContent::total_only) {
                    f.e_theta[k] = src->e_theta;
                    f.e_phi[k] = 0;
                    continue;
                }
                double t0, p0;
                to_spherical(src_dir, t0, p0);
                const CVec3 e = apply(r, src->e_theta * theta_hat(t0, p0) + src->e_phi * phi_hat(p0));
                f.e_theta[k] = dot(e, theta_hat(t, p));
                f.e_phi[k] = dot(e, phi_hat(p));
            }
        }
    }
    return out;
}

}  // namespace

std::optional<std::vector<std::size_t>> grid_permutation(const Grid& g, const Mat3& r) {
    std::vector<std::size_t> from(g.size());
    for (int i = 0; i < g.theta.count; ++i) {
        const double td = g.theta.value_deg(i) * deg;
        for (int j = 0; j < g.phi.count; ++j) {
            const double pd = g.phi.value_deg(j) * deg;
            double ts, ps;
            to_spherical(apply_transposed(r, direction(td, pd)), ts, ps);
            const int is = axis_index(g.theta, ts / deg, false);
            if (is < 0) return std::nullopt;
            const double t_src = g.theta.value_deg(is);
            int js;
            if (std::abs(t_src) < on_grid_deg || std::abs(t_src - 180) < on_grid_deg)
                js = pole_column(g, t_src < 90, r, theta_hat(td, pd));
            else
                js = axis_index(g.phi, ps / deg, true);
            if (js < 0) return std::nullopt;
            from[g.index(i, j)] = g.index(is, js);
        }
    }
    return from;
}

Result<FarFieldSet> rotate_pattern(const FarFieldSet& s, const Mat3& r) {
    auto from = grid_permutation(s.grid, r);
    auto out = from ? rotate_exact(s, r, *from) : rotate_resampled(s, r);
    if (!out) return out;
    // Points tied to the antenna turn with it.
    for (FarField& f : out->frequencies) {
        f.interpolation_centre_wl = apply(r, f.interpolation_centre_wl);
        f.reference_shift_wl = apply(r, f.reference_shift_wl);
    }
    return out;
}

}  // namespace ellipsa
