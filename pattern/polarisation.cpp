#include "pattern/polarisation.hpp"

#include "pattern/fast_atan2.hpp"

#include <cmath>

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

std::optional<double> reported_axial_ratio_db(double ar) {
    if (!(ar < linear_axial_ratio)) return std::nullopt;  // linear, or NaN for a zero field
    return 20 * std::log10(ar);
}

double tilt_deg(const Stokes& s) {
    if (!tilt_defined(s)) return std::numeric_limits<double>::quiet_NaN();
    double t = 0.5 * std::atan2(s.u, s.q) / deg;
    if (t <= -90.0) t += 180.0;
    return t;
}

Sense sense_of(const Stokes& s) {
    // |V| / I = 2 AR / (AR^2 + 1): at or below that of linear_axial_ratio the field is linear.
    constexpr double max_v = 2 * linear_axial_ratio / (linear_axial_ratio * linear_axial_ratio + 1);
    if (!(s.i > 0)) return Sense::none;
    if (std::abs(s.v) <= max_v * s.i) return Sense::linear;
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
    if (p.sense == Sense::right || p.sense == Sense::left) {
        p.axial_ratio_db = reported_axial_ratio_db(p.axial_ratio);
        if (!p.axial_ratio_db) p.sense = Sense::linear;  // the two forms of the threshold agree up to rounding
    }
    return p;
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

}  // namespace ellipsa
