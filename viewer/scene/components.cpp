#include "viewer/scene/components.hpp"

#include <cmath>
#include <limits>

namespace ellipsa::viewer {

const char* to_string(ColorBy c) {
    switch (c) {
        case ColorBy::component: return "component";
        case ColorBy::axial_ratio: return "axial-ratio";
        case ColorBy::circular_balance: return "rhcp-minus-lhcp";
        case ColorBy::tilt: return "tilt";
        case ColorBy::difference: return "difference";
    }
    return "?";
}

const char* label_of(ColorBy c) {
    switch (c) {
        case ColorBy::component: return "Shown component";
        case ColorBy::axial_ratio: return "Axial ratio";
        case ColorBy::circular_balance: return "RHCP minus LHCP";
        case ColorBy::tilt: return "Tilt of major axis";
        case ColorBy::difference: return "A minus B";
    }
    return "?";
}

bool parse_color_by(const std::string& name, ColorBy& out) {
    for (ColorBy c : all_color_by)
        if (name == to_string(c)) {
            out = c;
            return true;
        }
    if (name == "ar") return out = ColorBy::axial_ratio, true;
    return false;
}

bool color_by_needs_phase(ColorBy c) {
    return c == ColorBy::axial_ratio || c == ColorBy::circular_balance || c == ColorBy::tilt;
}

const char* label_of(Component c) {
    switch (c) {
        case Component::total: return "Total";
        case Component::theta: return "E-theta";
        case Component::phi: return "E-phi";
        case Component::vertical: return "Vertical";
        case Component::horizontal: return "Horizontal";
        case Component::co: return "Co-polar (Ludwig 3)";
        case Component::cross: return "Cross-polar (Ludwig 3)";
        case Component::rhcp: return "RHCP";
        case Component::lhcp: return "LHCP";
    }
    return "?";
}

std::string db_unit(Quantity q, Component c) {
    if (q == Quantity::relative) return "dB";
    return (c == Component::rhcp || c == Component::lhcp) ? "dBic" : "dBi";
}

std::string unavailable_reason(const FarFieldSet& s, Component c) {
    if (s.frequencies.empty()) return "the set holds no frequency";
    if (needs_phase(c) && !s.has_phase())
        return std::string(label_of(c)) + " needs phase; this file is " + to_string(s.content);
    if (s.content == FieldContent::total_only && c != Component::total)
        return std::string(label_of(c)) + " needs both field components; this file holds the total only";
    return "";
}

std::string unavailable_reason(const FarFieldSet& s, ColorBy c) {
    if (color_by_needs_phase(c) && !s.has_phase())
        return std::string(label_of(c)) + " needs phase; this file is " + to_string(s.content);
    return "";
}

std::vector<double> component_power_grid(const FarFieldSet& s, std::size_t k, Component c) {
    const Grid& g = s.grid;
    const FarField& f = s.frequencies.at(k);
    std::vector<double> out(g.size());
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            const std::size_t n = g.index(i, j);
            const cplx et = f.e_theta[n], ep = f.e_phi[n];
            double v = 0;
            switch (c) {
                case Component::total: v = std::norm(et) + std::norm(ep); break;
                case Component::theta:
                case Component::vertical: v = std::norm(et); break;
                case Component::phi:
                case Component::horizontal: v = std::norm(ep); break;
                case Component::rhcp: v = std::norm(rhcp(et, ep)); break;
                case Component::lhcp: v = std::norm(lhcp(et, ep)); break;
                case Component::co:
                case Component::cross: {
                    const double p = g.phi.value_deg(j) * deg;
                    CoCross cc = ludwig3(et, ep, std::cos(p), std::sin(p), s.ludwig3_reference);
                    v = std::norm(c == Component::co ? cc.co : cc.cross);
                    break;
                }
            }
            out[n] = v;
        }
    return out;
}

PolarisationGrid polarisation_grid(const FarFieldSet& s, std::size_t k) {
    const Grid& g = s.grid;
    const FarField& f = s.frequencies.at(k);
    PolarisationGrid out;
    out.axial_ratio_db.resize(g.size());
    out.balance_db.resize(g.size());
    out.tilt_deg.resize(g.size());
    for (std::size_t n = 0; n < g.size(); ++n) {
        const cplx et = f.e_theta[n], ep = f.e_phi[n];
        const double r = std::norm(rhcp(et, ep)), l = std::norm(lhcp(et, ep));
        const double ar = axial_ratio_from_circular(r, l);
        out.axial_ratio_db[n] = std::isinf(ar) ? std::numeric_limits<double>::infinity() : 20 * std::log10(ar);
        out.balance_db[n] = (r > 0 || l > 0) ? 10 * std::log10(std::max(r, 1e-300) / std::max(l, 1e-300))
                                             : std::numeric_limits<double>::quiet_NaN();
        out.tilt_deg[n] = tilt_deg(stokes(et, ep));
    }
    return out;
}

}  // namespace ellipsa::viewer
