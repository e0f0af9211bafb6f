#include "pattern/components.hpp"

#include <cmath>
#include <cstring>
#include <vector>

namespace ellipsa {

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

const char* short_label(Component c) {
    switch (c) {
        case Component::total: return "Total";
        case Component::theta: return "E\u03b8";
        case Component::phi: return "E\u03c6";
        case Component::vertical: return "Vertical";
        case Component::horizontal: return "Horizontal";
        case Component::co: return "Co-polar";
        case Component::cross: return "Cross-polar";
        case Component::rhcp: return "RHCP";
        case Component::lhcp: return "LHCP";
    }
    return "Total";
}

std::string long_label(Component c, Ludwig3Reference ref) {
    const char* l3 = ref == Ludwig3Reference::x ? " (Ludwig-3, x ref.)" : " (Ludwig-3, y ref.)";
    switch (c) {
        case Component::theta: return "\u03b8 component";
        case Component::phi: return "\u03c6 component";
        case Component::co:
        case Component::cross: return std::string(short_label(c)) + l3;
        default: return short_label(c);
    }
}

bool is_circular(Component c) { return c == Component::rhcp || c == Component::lhcp; }

bool needs_phase(Component c) {
    return c == Component::co || c == Component::cross || c == Component::rhcp || c == Component::lhcp;
}

const char* db_unit(Quantity q, Component c) {
    if (q == Quantity::relative) return "dB";
    return is_circular(c) ? "dBic" : "dBi";
}

const char* quantity_label(Quantity q) {
    switch (q) {
        case Quantity::gain: return "Gain";
        case Quantity::directivity: return "Directivity";
        case Quantity::relative: return "Relative power";
    }
    return "Power";
}

std::optional<std::string> component_unavailable(const FarFieldSet& s, Component c) {
    if (s.frequencies.empty()) return std::string("the set holds no frequency");
    if (s.content == FieldContent::total_only && c != Component::total)
        return std::string("component \"") + to_string(c) +
               "\" needs E_theta and E_phi separately, but the data hold only the total power";
    if (needs_phase(c) && !s.has_phase())
        return std::string("component \"") + to_string(c) + "\" needs the phase between E_theta and E_phi, but the data are " +
               to_string(s.content) + " (no phase); use total, theta, phi, vertical or horizontal";
    return std::nullopt;
}

std::optional<std::string> polarisation_unavailable(const FarFieldSet& s) {
    if (s.part != FieldPart::whole)
        return std::string("axial ratio, tilt and sense need the whole field, but the data hold its ") + to_string(s.part) +
               " part only (read its other part with it: FILE::join=OTHER)";
    if (s.has_phase()) return std::nullopt;
    return std::string("axial ratio, tilt and sense need the phase between E_theta and E_phi, but the data are ") +
           to_string(s.content) + " (no phase)";
}

namespace {
// One loop per component, so the choice is made once, not per sample.
template <class F>
void each(std::size_t n, double* out, F f) {
    for (std::size_t k = 0; k < n; ++k) out[k] = f(k);
}
}  // namespace

void component_power_many(std::size_t n, const cplx* et, const cplx* ep, const double* cos_phi, const double* sin_phi,
                          Ludwig3Reference ref, Component c, double* out) {
    switch (c) {
        case Component::total: each(n, out, [&](std::size_t k) { return std::norm(et[k]) + std::norm(ep[k]); }); return;
        case Component::theta:
        case Component::vertical: each(n, out, [&](std::size_t k) { return std::norm(et[k]); }); return;
        case Component::phi:
        case Component::horizontal: each(n, out, [&](std::size_t k) { return std::norm(ep[k]); }); return;
        case Component::rhcp:
        case Component::lhcp: {
            // |Et +- j Ep|^2 / 2 squared directly (no cancellation near circular).
            const double sg = c == Component::rhcp ? 1.0 : -1.0;
            each(n, out, [&](std::size_t k) {
                const double re = et[k].real() - sg * ep[k].imag(), im = et[k].imag() + sg * ep[k].real();
                return 0.5 * (re * re + im * im);
            });
            return;
        }
        case Component::co:
        case Component::cross:
            each(n, out, [&](std::size_t k) { return component_power(et[k], ep[k], cos_phi[k], sin_phi[k], ref, c); });
            return;
    }
}

void component_power_grid(const FarFieldSet& s, std::size_t fi, Component c, double* out, int first_row, int end_row) {
    const Grid& g = s.grid;
    const FarField& f = s.frequencies.at(fi);
    if (end_row < 0 || end_row > g.theta.count) end_row = g.theta.count;
    if (first_row < 0) first_row = 0;
    if (first_row >= end_row) return;
    const std::size_t np = std::size_t(g.phi.count), o0 = g.index(first_row, 0), o1 = g.index(end_row, 0);
    if (c != Component::co && c != Component::cross) {  // no dependence on phi: one pass over the rows
        component_power_many(o1 - o0, f.e_theta.data() + o0, f.e_phi.data() + o0, nullptr, nullptr, s.ludwig3_reference,
                             c, out + o0);
        return;
    }
    std::vector<double> cos_p(np), sin_p(np);
    for (std::size_t j = 0; j < np; ++j) {
        cos_p[j] = std::cos(g.phi.value_deg(int(j)) * deg);
        sin_p[j] = std::sin(g.phi.value_deg(int(j)) * deg);
    }
    for (int i = first_row; i < end_row; ++i) {
        const std::size_t o = g.index(i, 0);
        component_power_many(np, f.e_theta.data() + o, f.e_phi.data() + o, cos_p.data(), sin_p.data(),
                             s.ludwig3_reference, c, out + o);
    }
}

}  // namespace ellipsa
