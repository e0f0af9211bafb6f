#include "viewer/scene/probe.hpp"

#include <cmath>
#include <cstdio>

#include "pattern/interpolate.hpp"
#include "pattern/polarisation.hpp"
#include "viewer/scene/components.hpp"

namespace ellipsa::viewer {

namespace {
std::string db_text(double v, const char* unit) {
    char b[64];
    if (!std::isfinite(v)) return v < 0 ? std::string("no field (-inf ") + unit + ")" : "n/a";
    std::snprintf(b, sizeof b, "%.2f %s", v, unit);
    return b;
}
}  // namespace

std::vector<ProbeRow> probe_rows(const FarFieldSet& set, std::size_t k, double th, double ph) {
    std::vector<ProbeRow> rows;
    char b[128];
    std::snprintf(b, sizeof b, "\u03b8 %.1f\u00b0   \u03c6 %.1f\u00b0", th, ph);
    rows.push_back({"Direction", b});
    auto f = interpolate(set, k, th, ph);
    if (!f) {
        rows.push_back({"", "outside the sampled region"});
        return rows;
    }
    const PolarisationState st = decompose(f->e_theta, f->e_phi, ph * deg, set.ludwig3_reference);
    for (Component c : all_components) {
        if (!unavailable_reason(set, c).empty()) continue;
        rows.push_back({label_of(c), db_text(to_db(component_power(st, c)), db_unit(set.quantity, c).c_str())});
    }
    if (!set.has_phase()) {
        rows.push_back({"Polarisation", "needs phase (file is " + std::string(to_string(set.content)) + ")"});
        return rows;
    }
    if (std::isinf(st.axial_ratio))
        rows.push_back({"Axial ratio", "infinite (linear)"});
    else if (std::isnan(st.axial_ratio))
        rows.push_back({"Axial ratio", "n/a (no field)"});
    else
        rows.push_back({"Axial ratio", db_text(20 * std::log10(st.axial_ratio), "dB")});
    std::snprintf(b, sizeof b, "%.1f\u00b0", st.tilt_deg);
    rows.push_back({"Tilt", b});
    rows.push_back({"Sense", st.sense == Sense::right  ? "right-hand"
                             : st.sense == Sense::left ? "left-hand"
                             : st.sense == Sense::linear ? "linear"
                                                         : "no field"});
    const Stokes& S = st.stokes;
    if (S.i > 0) {
        std::snprintf(b, sizeof b, "%.4g", S.i);
        rows.push_back({"Stokes I", b});
        std::snprintf(b, sizeof b, "%+.2f %+.2f %+.2f", S.q / S.i, S.u / S.i, S.v / S.i);
        rows.push_back({"Q/I U/I V/I", b});
    }
    return rows;
}

}  // namespace ellipsa::viewer
