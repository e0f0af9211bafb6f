#include "pattern/polarisation.hpp"

#include "pattern/fast_atan2.hpp"

#include <cmath>
#include <cstring>

namespace ellipsa {

const char* to_string(Sense s) {
    switch (s) {
        case Sense::right: return "right";
        case Sense::left: return "left";
        case Sense::linear: return "linear";
        case Sense::none: return "none";
    }
    return "none";
}

void from_ludwig3(cplx co, cplx cross, double c, double s, Ludwig3Reference ref, cplx& et, cplx& ep) {
    // The Ludwig-3 transform is a rotation (x ref) or a rotation with a swap (y ref); invert it.
    if (ref == Ludwig3Reference::x) {
        et = co * c + cross * s;
        ep = -co * s + cross * c;
    } else {
        et = co * s + cross * c;
        ep = co * c - cross * s;
    }
}

double axial_ratio(cplx et, cplx ep) { return axial_ratio_from_circular(std::norm(rhcp(et, ep)), std::norm(lhcp(et, ep))); }

double tilt_deg(const Stokes& s) {
    if (s.q == 0 && s.u == 0) return 0.0;  // circular or zero: tilt undefined, report 0
    double t = 0.5 * std::atan2(s.u, s.q) / deg;
    if (t <= -90.0) t += 180.0;
    return t;
}

Sense sense_of(const Stokes& s) {
    if (!(s.i > 0)) return Sense::none;
    if (std::abs(s.v) <= linear_threshold * s.i) return Sense::linear;
    return s.v > 0 ? Sense::right : Sense::left;
}

PolarisationState decompose(cplx et, cplx ep, double phi_rad, Ludwig3Reference ref) {
    PolarisationState p;
    p.e_theta = et;
    p.e_phi = ep;
    p.e_rhcp = rhcp(et, ep);
    p.e_lhcp = lhcp(et, ep);
    CoCross cc = ludwig3(et, ep, std::cos(phi_rad), std::sin(phi_rad), ref);
    p.e_co = cc.co;
    p.e_cross = cc.cross;
    p.theta = std::norm(et);
    p.phi = std::norm(ep);
    p.total = p.theta + p.phi;
    p.rhcp = std::norm(p.e_rhcp);
    p.lhcp = std::norm(p.e_lhcp);
    p.co = std::norm(p.e_co);
    p.cross = std::norm(p.e_cross);
    p.stokes = stokes(et, ep);
    p.axial_ratio = axial_ratio_from_circular(p.rhcp, p.lhcp);
    p.stokes.v = p.rhcp - p.lhcp;  // same value, without the cancellation in 2 Im(Et Ep*)
    p.tilt_deg = tilt_deg(p.stokes);
    p.sense = sense_of(p.stokes);
    return p;
}

const char* to_string(Component c) {
    switch (c) {
        case Component::total: return "total";
        case Component::theta: return "theta";
        case Component::phi: return "phi";
        case Component::vertical: return "vertical";
        case Component::horizontal: return "horizontal";
        case Component::co: return "co";
        case Component::cross: return "cross";
        case Component::rhcp: return "rhcp";
        case Component::lhcp: return "lhcp";
    }
    return "total";
}

bool parse_component(const char* name, Component& out) {
    for (Component c : all_components)
        if (std::strcmp(name, to_string(c)) == 0) {
            out = c;
            return true;
        }
    return false;
}

bool needs_phase(Component c) {
    // Ludwig-3 co/cross mixes E_theta and E_phi coherently, as do the circular parts.
    return c == Component::co || c == Component::cross || c == Component::rhcp || c == Component::lhcp;
}

double component_power(const PolarisationState& s, Component c) {
    switch (c) {
        case Component::total: return s.total;
        case Component::theta:
        case Component::vertical: return s.theta;
        case Component::phi:
        case Component::horizontal: return s.phi;
        case Component::co: return s.co;
        case Component::cross: return s.cross;
        case Component::rhcp: return s.rhcp;
        case Component::lhcp: return s.lhcp;
    }
    return s.total;
}

DecompositionBuffer::DecompositionBuffer(std::size_t n) : n_(n) {
    constexpr std::size_t stagger = 72;  // doubles: 9 cache lines, not a power of two
    const std::size_t stride = n + stagger;
    storage_.assign(13 * stride, 0.0);
    double* p[13];
    for (std::size_t i = 0; i < 13; ++i) p[i] = storage_.data() + i * stride;
    arrays_ = {p[0], p[1], p[2], p[3], p[4], p[5], p[6], p[7], p[8], p[9], p[10], p[11], p[12]};
}

void decompose_many(std::size_t n, const cplx* e_theta, const cplx* e_phi, const double* cos_phi,
                    const double* sin_phi, Ludwig3Reference ref, const DecompositionArrays& o) {
    const bool xref = ref == Ludwig3Reference::x;
    for (std::size_t k = 0; k < n; ++k) {
        const double tr = e_theta[k].real(), ti = e_theta[k].imag();
        const double pr = e_phi[k].real(), pi_ = e_phi[k].imag();
        const double a = tr * tr + ti * ti, b = pr * pr + pi_ * pi_;
        // Et conj(Ep)
        const double cr = tr * pr + ti * pi_, ci = ti * pr - tr * pi_;
        // E_R = (Et + j Ep)/sqrt2, E_L = (Et - j Ep)/sqrt2, squared directly (no cancellation).
        const double rr = tr - pi_, ri = ti + pr, lr = tr + pi_, li = ti - pr;
        const double R = 0.5 * (rr * rr + ri * ri), L = 0.5 * (lr * lr + li * li);
        const double I = a + b, Q = a - b, U = 2 * cr, V = R - L;
        (void)ci;
        o.total[k] = I;
        o.theta[k] = a;
        o.phi[k] = b;
        o.rhcp[k] = R;
        o.lhcp[k] = L;
        const double s = sin_phi[k], c = cos_phi[k];
        // Ludwig-3 x: co = Et c - Ep s; cross = Et s + Ep c. |co|^2 = a c^2 + b s^2 - 2 cs Re(Et Ep*)
        const double co_x = a * c * c + b * s * s - 2 * c * s * cr;
        const double cross_x = a * s * s + b * c * c + 2 * c * s * cr;
        o.co[k] = xref ? co_x : cross_x;
        o.cross[k] = xref ? cross_x : co_x;
        o.axial_ratio[k] = axial_ratio_from_circular(R, L);
        double t = (Q == 0 && U == 0) ? 0.0 : 0.5 * fast_atan2(U, Q) / deg;
        o.tilt_deg[k] = t <= -90.0 ? t + 180.0 : t;
        o.stokes_i[k] = I;
        o.stokes_q[k] = Q;
        o.stokes_u[k] = U;
        o.stokes_v[k] = V;
    }
}

}  // namespace ellipsa
