#include "pattern/reference.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <vector>

namespace ellipsa {

const char* to_string(ReferenceKind k) {
    switch (k) {
        case ReferenceKind::short_dipole: return "short-dipole";
        case ReferenceKind::dipole: return "dipole";
        case ReferenceKind::small_loop: return "small-loop";
        case ReferenceKind::loop: return "loop";
        case ReferenceKind::crossed_dipoles: return "crossed-dipoles";
    }
    return "dipole";
}

bool parse_reference_kind(const std::string& name, ReferenceKind& out) {
    for (ReferenceKind k : {ReferenceKind::short_dipole, ReferenceKind::dipole, ReferenceKind::small_loop,
                            ReferenceKind::loop, ReferenceKind::crossed_dipoles})
        if (name == to_string(k)) {
            out = k;
            return true;
        }
    return false;
}

CVec3 local_field(const ReferenceAntenna& a, Vec3 r) {
    double t, p;
    to_spherical(r, t, p);
    const double st = std::sin(t), ct = std::cos(t);
    switch (a.kind) {
        case ReferenceKind::short_dipole: return cplx(st, 0) * theta_hat(t, p);
        case ReferenceKind::dipole: {
            if (st < 1e-12) return CVec3{};
            const double h = pi * a.length_wl;  // k L / 2
            const double e = (std::cos(h * ct) - std::cos(h)) / st;
            return cplx(e, 0) * theta_hat(t, p);
        }
        case ReferenceKind::small_loop: return cplx(st, 0) * phi_hat(p);
        case ReferenceKind::loop: {
            const double e = std::cyl_bessel_j(1.0, a.circumference_wl * st);
            return cplx(e, 0) * phi_hat(p);
        }
        case ReferenceKind::crossed_dipoles: {
            // p = x + exp(j phase) y; E = -(p - (p.r) r), written on theta-hat and phi-hat.
            const cplx iy = std::polar(1.0, a.phase_deg * deg);
            const Vec3 th = theta_hat(t, p), ph = phi_hat(p);
            const cplx et = -(th.x + iy * th.y), ep = -(ph.x + iy * ph.y);
            return et * th + ep * ph;
        }
    }
    return CVec3{};
}

namespace {

// Gauss-Legendre nodes and weights on [-1, 1] (Newton iteration on P_n).
void gauss_legendre(int n, std::vector<double>& x, std::vector<double>& w) {
    x.resize(std::size_t(n));
    w.resize(std::size_t(n));
    for (int i = 0; i < n; ++i) {
        double z = std::cos(pi * (i + 0.75) / (n + 0.5)), dp = 0;
        for (int it = 0; it < 100; ++it) {
            double p0 = 1, p1 = z;
            for (int k = 2; k <= n; ++k) {
                double pk = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
                p0 = p1;
                p1 = pk;
            }
            dp = n * (z * p1 - p0) / (z * z - 1);
            double dz = p1 / dp;
            z -= dz;
            if (std::abs(dz) < 1e-15) break;
        }
        x[std::size_t(i)] = z;
        w[std::size_t(i)] = 2 / ((1 - z * z) * dp * dp);
    }
}

}  // namespace

double normalisation(const ReferenceAntenna& a) {
    // Power in the antenna's own frame: Gauss-Legendre in cos(theta), trapezoid in phi (exact for the
    // low-order trigonometric phi dependence of these antennas).
    std::vector<double> x, w;
    gauss_legendre(256, x, w);
    const int nphi = 64;
    double p = 0;
    for (std::size_t i = 0; i < x.size(); ++i) {
        const double t = std::acos(x[i]);
        double s = 0;
        for (int j = 0; j < nphi; ++j) {
            const CVec3 e = local_field(a, direction(t, 2 * pi * j / nphi));
            s += std::norm(e.x) + std::norm(e.y) + std::norm(e.z);
        }
        p += w[i] * s * (2 * pi / nphi);
    }
    return p > 0 ? std::sqrt(4 * pi / p) : 0.0;
}

CVec3 reference_field(const ReferenceAntenna& a, double scale, Vec3 dir) {
    const CVec3 e = local_field(a, apply_transposed(a.orientation, dir));
    return scale * apply(a.orientation, e);
}

FarFieldSet synthesize(const ReferenceAntenna& a, double step_deg, double frequency_hz) {
    return synthesize_on(a, full_sphere_grid(step_deg, step_deg), frequency_hz);
}

FarFieldSet synthesize_on(const ReferenceAntenna& a, const Grid& grid, double frequency_hz) {
    FarFieldSet s;
    s.quantity = Quantity::gain;
    s.content = FieldContent::complex;
    s.grid = grid;
    s.name = to_string(a.kind);
    s.source = "ellipsa synth: " + describe(a);
    const double scale = normalisation(a);
    FarField f;
    f.frequency_hz = frequency_hz;
    f.e_theta.resize(s.grid.size());
    f.e_phi.resize(s.grid.size());
    for (int i = 0; i < s.grid.theta.count; ++i) {
        const double t = s.grid.theta.value_deg(i) * deg;
        for (int j = 0; j < s.grid.phi.count; ++j) {
            const double p = s.grid.phi.value_deg(j) * deg;
            const CVec3 e = reference_field(a, scale, direction(t, p));
            const std::size_t k = s.grid.index(i, j);
            f.e_theta[k] = dot(e, theta_hat(t, p));
            f.e_phi[k] = dot(e, phi_hat(p));
        }
    }
    // Projection onto theta-hat/phi-hat leaves rounding residue (~1e-17) where a component is
    // exactly zero in closed form (E_phi of a dipole); clear it so files show true zeros.
    double peak = 0;
    for (std::size_t k = 0; k < s.grid.size(); ++k) peak = std::max(peak, std::abs(f.e_theta[k]) + std::abs(f.e_phi[k]));
    auto clean = [&](cplx& v) {
        if (std::abs(v.real()) < 1e-14 * peak) v.real(0);
        if (std::abs(v.imag()) < 1e-14 * peak) v.imag(0);
    };
    for (std::size_t k = 0; k < s.grid.size(); ++k) {
        clean(f.e_theta[k]);
        clean(f.e_phi[k]);
    }
    s.frequencies.push_back(std::move(f));
    return s;
}

std::string describe(const ReferenceAntenna& a) {
    char buf[128];
    switch (a.kind) {
        case ReferenceKind::short_dipole: return "short dipole";
        case ReferenceKind::dipole:
            std::snprintf(buf, sizeof buf, "dipole, L = %g wavelengths", a.length_wl);
            return buf;
        case ReferenceKind::small_loop: return "small loop";
        case ReferenceKind::loop:
            std::snprintf(buf, sizeof buf, "loop, circumference = %g wavelengths", a.circumference_wl);
            return buf;
        case ReferenceKind::crossed_dipoles:
            std::snprintf(buf, sizeof buf, "crossed short dipoles, phase = %g deg", a.phase_deg);
            return buf;
    }
    return "";
}

}  // namespace ellipsa
