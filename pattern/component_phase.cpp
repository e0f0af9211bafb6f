#include "pattern/component_phase.hpp"

#include <limits>

namespace ellipsa {

cplx component_field(cplx et, cplx ep, double cos_phi, double sin_phi, Ludwig3Reference ref, Component c) {
    switch (c) {
        case Component::total:
        case Component::theta:
        case Component::vertical: return et;
        case Component::phi:
        case Component::horizontal: return ep;
        case Component::rhcp: return rhcp(et, ep);
        case Component::lhcp: return lhcp(et, ep);
        case Component::co: return ludwig3(et, ep, cos_phi, sin_phi, ref).co;
        case Component::cross: return ludwig3(et, ep, cos_phi, sin_phi, ref).cross;
    }
    return et;
}

double component_phase_deg(cplx et, cplx ep, double cos_phi, double sin_phi, Ludwig3Reference ref, Component c) {
    constexpr double none = std::numeric_limits<double>::quiet_NaN();
    if (!has_phase(c)) return none;
    const double total = std::norm(et) + std::norm(ep);
    const cplx e = component_field(et, ep, cos_phi, sin_phi, ref, c);
    // The component's power as the gains compute it (no cancellation near circular).
    if (!(total > 0) || !(component_power(et, ep, cos_phi, sin_phi, ref, c) > linear_threshold * total)) return none;
    const double d = std::atan2(e.imag(), e.real()) / deg;
    return d <= -180 ? d + 360 : d;  // (-180, 180]: atan2 gives -180 for a negative real with -0 imaginary
}

std::optional<std::string> phase_unavailable(const FarFieldSet& s, Component c) {
    if (!has_phase(c)) return std::string("component \"total\" is a power and has no phase; choose theta, phi, vertical, "
                                          "horizontal, co, cross, rhcp or lhcp");
    if (auto why = component_unavailable(s, c)) return why;
    if (!s.has_phase())
        return std::string("the phase of \"") + to_string(c) + "\" needs complex data, but the data are " + to_string(s.content) +
               " (no phase)";
    return std::nullopt;
}

std::vector<double> cut_phase_deg(const FarFieldSet& s, const CutSamples& c, Component comp) {
    const std::size_t n = c.angle_deg.size();
    std::vector<double> out(n, std::numeric_limits<double>::quiet_NaN());
    if (phase_unavailable(s, comp)) return out;  // stored phases of magnitude-only data are not the antenna's
    for (std::size_t k = 0; k < n; ++k) {
        if (!c.valid[k]) continue;
        const double p = c.phi_deg[k] * deg;
        out[k] = component_phase_deg(c.e_theta[k], c.e_phi[k], std::cos(p), std::sin(p), s.ludwig3_reference, comp);
    }
    return out;
}

}  // namespace ellipsa
