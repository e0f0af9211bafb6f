#include "viewer/scene/probe.hpp"

#include "pattern/component_phase.hpp"
#include "pattern/interpolate.hpp"
#include "viewer/scene/components.hpp"

namespace ellipsa::viewer {

std::optional<double> ProbeValues::db_of(Component c) const {
    for (const ComponentValue& v : components)
        if (v.component == c) return v.db;
    return std::nullopt;
}

ProbeValues probe(const FarFieldSet& set, std::size_t k, double th, double ph) {
    ProbeValues p;
    p.theta_deg = th;
    p.phi_deg = ph;
    const auto f = interpolate(set, k, th, ph);
    if (!f) return p;
    p.inside = true;
    const PolarisationState st = decompose(f->e_theta, f->e_phi, ph * deg, set.ludwig3_reference);
    const double cp = std::cos(ph * deg), sp = std::sin(ph * deg);
    for (Component c : all_components) {
        if (component_unavailable(set, c)) continue;
        const double phase = phase_unavailable(set, c) ? NAN : component_phase_deg(f->e_theta, f->e_phi, cp, sp, set.ludwig3_reference, c);
        p.components.push_back({c, to_db(component_power(st, c)), phase});
    }
    if (set.has_phase()) p.polarisation = st;
    return p;
}

}  // namespace ellipsa::viewer
