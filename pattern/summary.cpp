#include "pattern/summary.hpp"

#include <cmath>

#include "pattern/cut.hpp"
#include "pattern/interpolate.hpp"

namespace ellipsa {

PatternSummary summarize(const FarFieldSet& s, std::size_t fi) {
    PatternSummary r;
    r.frequency_hz = s.frequencies[fi].frequency_hz;
    r.peak = find_peak(s, fi, Component::total);
    r.peak_db = to_db(r.peak.value);
    r.power = power_figures(s, fi, r.peak.value);
    if (r.power.directivity) r.directivity_dbi = to_db(*r.power.directivity);

    const Vec3 pd = direction(r.peak.theta_deg * deg, r.peak.phi_deg * deg);
    const double step = default_cut_step(s.grid);
    {
        CutSamples c = sample_cut(s, fi, CutSpec::phi_cut(r.peak.phi_deg), step);
        BeamFigures b = beam_figures(c.angle_deg, cut_power(s, c, Component::total), nearest_cut_sample(c, pd));
        r.hpbw_elevation_deg = b.hpbw_deg;
        r.sidelobe_elevation_db = b.sidelobe_db;
    }
    {
        CutSamples c = sample_cut(s, fi, CutSpec::through(r.peak.theta_deg, r.peak.phi_deg, true), step);
        BeamFigures b = beam_figures(c.angle_deg, cut_power(s, c, Component::total), nearest_cut_sample(c, pd));
        r.hpbw_azimuth_deg = b.hpbw_deg;
    }
    auto back = interpolate(s, fi, 180.0 - r.peak.theta_deg, r.peak.phi_deg + 180.0);
    if (back) {
        const double u = power(back->e_theta, back->e_phi);
        if (u > 0) r.front_to_back_db = r.peak_db - to_db(u);
    }
    if (s.has_phase()) {
        auto f = interpolate(s, fi, r.peak.theta_deg, r.peak.phi_deg);
        if (f) {
            const PolarisationState st = decompose(f->e_theta, f->e_phi, r.peak.phi_deg * deg, s.ludwig3_reference);
            r.sense = st.sense;
            const double ar = st.axial_ratio;
            if (std::isfinite(ar)) r.axial_ratio_db = 20 * std::log10(ar);
        }
    } else {
        r.unavailable_reason = std::string("the data are ") + to_string(s.content) +
                               ": axial ratio and sense need the phase between E_theta and E_phi";
    }
    return r;
}

}  // namespace ellipsa
