#include "pattern/interpolate.hpp"

#include <algorithm>
#include <cmath>

namespace ellipsa {

CVec3 cartesian_at(const Grid& g, const FarField& f, int it, int ip) {
    const double t = g.theta.value_deg(it) * deg, p = g.phi.value_deg(ip) * deg;
    const std::size_t k = g.index(it, ip);
    return f.e_theta[k] * theta_hat(t, p) + f.e_phi[k] * phi_hat(p);
}

namespace {
// Cuts (far_field.hpp, Sampling) have values along their phi columns only: nothing is blended
// between two cut planes. A single theta row (an azimuth cut) interpolates along phi as usual.
// v: the phi position in steps from the first column.
bool on_sampled_column(const Grid& g, double theta_deg, double v) {
    if (g.sampling != Sampling::cuts || g.theta.count == 1) return true;
    constexpr double eps = 1e-9;
    const bool at_pole = (std::abs(theta_deg) < eps && g.has_north_pole()) ||
                         (std::abs(theta_deg - 180) < eps && g.has_south_pole());
    const double span = 360.0 / g.phi.step_deg;
    const double near = std::round(v);
    const bool on_column = std::abs(v - near) < 1e-6 && (near <= g.phi.count - 1 || std::abs(v - span) < 1e-6);
    return at_pole || on_column;
}
}  // namespace

bool grid_stencil(const Grid& g, double theta_deg, double phi_deg, GridStencil& st) {
    constexpr double eps = 1e-9;
    const double u = (theta_deg - g.theta.start_deg) / g.theta.step_deg;
    const int nt = g.theta.count, np = g.phi.count;
    if (!(u >= -eps && u <= (nt - 1) + eps)) return false;
    int i0 = int(std::floor(u));
    if (i0 < 0) i0 = 0;
    if (i0 > nt - 1) i0 = nt - 1;
    int i1 = i0 + 1 < nt ? i0 + 1 : i0;
    double ft = i1 == i0 ? 0.0 : std::clamp(u - i0, 0.0, 1.0);

    // At a pole every phi is the same point: any phi column will do, and the Cartesian vectors
    // there agree. Still, use the asked phi so theta/phi projections stay continuous.
    double v = wrap360(phi_deg - g.phi.start_deg) / g.phi.step_deg;
    if (!on_sampled_column(g, theta_deg, v)) return false;
    int j0, j1;
    double fp;
    if (g.phi_wraps()) {
        j0 = int(std::floor(v));
        fp = v - j0;
        j0 %= np;
        j1 = (j0 + 1) % np;
    } else {
        const double span = 360.0 / g.phi.step_deg;
        if (v > span - eps) v -= span;  // just below the start, by rounding
        if (!(v >= -eps && v <= (np - 1) + eps)) {
            // Outside the phi range is still fine exactly at a sampled pole.
            const bool at_pole = (std::abs(theta_deg) < eps && g.has_north_pole()) ||
                                 (std::abs(theta_deg - 180) < eps && g.has_south_pole());
            if (!at_pole) return false;
            v = 0;
        }
        j0 = std::clamp(int(std::floor(v)), 0, np - 1);
        j1 = j0 + 1 < np ? j0 + 1 : j0;
        fp = j1 == j0 ? 0.0 : std::clamp(v - j0, 0.0, 1.0);
    }
    st.i_theta[0] = i0;
    st.i_theta[1] = i1;
    st.i_phi[0] = j0;
    st.i_phi[1] = j1;
    st.w[0][0] = (1 - ft) * (1 - fp);
    st.w[0][1] = (1 - ft) * fp;
    st.w[1][0] = ft * (1 - fp);
    st.w[1][1] = ft * fp;
    return true;
}

std::optional<FieldSample> interpolate(const FarFieldSet& s, std::size_t fi, double theta_deg, double phi_deg) {
    const Grid& g = s.grid;
    if (!(theta_deg >= -1e-9 && theta_deg <= 180 + 1e-9)) return std::nullopt;
    GridStencil st;
    if (!grid_stencil(g, theta_deg, phi_deg, st)) return std::nullopt;
    const FarField& f = s.frequencies[fi];
    if (s.content == FieldContent::complex) {
        // The linear phase of the phase centre c turns fast between samples when c is far from
        // the reference; blend the samples without it and put it back at the asked direction.
        const Vec3 c = f.interpolation_centre_wl;
        const bool centred = c.x != 0 || c.y != 0 || c.z != 0;
        auto unturn = [&](Vec3 r) { return std::polar(1.0, -2 * pi * dot(r, c)); };
        // sin and cos of the stencil's rows and columns, once each: the values direction(),
        // theta_hat() and phi_hat() (and so cartesian_at()) take from the same angles.
        double sin_t[2], cos_t[2], sin_p[2], cos_p[2];
        for (int a = 0; a < 2; ++a) {
            const double t = g.theta.value_deg(st.i_theta[a]) * deg, p = g.phi.value_deg(st.i_phi[a]) * deg;
            sin_t[a] = std::sin(t), cos_t[a] = std::cos(t), sin_p[a] = std::sin(p), cos_p[a] = std::cos(p);
        }
        CVec3 e{};
        for (int a = 0; a < 2; ++a)
            for (int b = 0; b < 2; ++b) {
                double w = st.w[a][b];
                if (w == 0) continue;
                cplx cw = w;
                if (centred) cw *= unturn({sin_t[a] * cos_p[b], sin_t[a] * sin_p[b], cos_t[a]});
                const std::size_t k = g.index(st.i_theta[a], st.i_phi[b]);
                const CVec3 v = f.e_theta[k] * Vec3{cos_t[a] * cos_p[b], cos_t[a] * sin_p[b], -sin_t[a]} +
                                f.e_phi[k] * Vec3{-sin_p[b], cos_p[b], 0.0};
                e = e + CVec3{cw * v.x, cw * v.y, cw * v.z};
            }
        const double t = theta_deg * deg, p = phi_deg * deg;
        const double s_t = std::sin(t), c_t = std::cos(t), s_p = std::sin(p), c_p = std::cos(p);
        if (centred) {
            const cplx back = std::conj(unturn({s_t * c_p, s_t * s_p, c_t}));
            e = CVec3{back * e.x, back * e.y, back * e.z};
        }
        FieldSample out{dot(e, Vec3{c_t * c_p, c_t * s_p, -s_t}), dot(e, Vec3{-s_p, c_p, 0.0})};
        // Going through Cartesian and back leaves rounding residue of about 1e-16 |E| in a
        // component that is zero in the data (E_phi of a dipole); clear it rather than report
        // -330 dB as if it were measured.
        const double mag = std::sqrt(std::norm(out.e_theta) + std::norm(out.e_phi));
        if (std::abs(out.e_theta) < 1e-13 * mag) out.e_theta = 0;
        if (std::abs(out.e_phi) < 1e-13 * mag) out.e_phi = 0;
        return out;
    }
    double pt = 0, pp = 0;
    for (int a = 0; a < 2; ++a)
        for (int b = 0; b < 2; ++b) {
            std::size_t k = g.index(st.i_theta[a], st.i_phi[b]);
            pt += st.w[a][b] * std::norm(f.e_theta[k]);
            pp += st.w[a][b] * std::norm(f.e_phi[k]);
        }
    return FieldSample{cplx(std::sqrt(pt), 0), cplx(std::sqrt(pp), 0)};
}

std::optional<FieldSample> interpolate(const FarFieldSet& s, std::size_t fi, Vec3 dir) {
    double t, p;
    to_spherical(dir, t, p);
    return interpolate(s, fi, t / deg, p / deg);
}

}  // namespace ellipsa
