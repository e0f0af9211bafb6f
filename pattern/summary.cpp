#include "pattern/summary.hpp"

#include <cmath>
#include <limits>

#include "pattern/cut.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/parallel.hpp"

namespace ellipsa {

bool peak_at_pole(const Grid& g, const Peak& pk) {
    return (pk.i_theta == 0 && g.has_north_pole()) || (pk.i_theta == g.theta.count - 1 && g.has_south_pole());
}

double elevation_plane_phi_deg(const Grid& g, const Peak& pk) { return peak_at_pole(g, pk) ? 0.0 : pk.phi_deg; }

PatternSummary summarize(const FarFieldSet& s, std::size_t fi) {
    PatternSummary r;
    r.frequency_hz = s.frequencies[fi].frequency_hz;
    r.peak = find_peak(s, fi, Component::total);
    r.peak_db = to_db(r.peak.value);
    r.power = power_figures(s, fi, r.peak.value);
    r.tilt_deg = std::numeric_limits<double>::quiet_NaN();
    if (!(r.peak.value > 0)) {  // a zero field has no direction, sense or tilt (conventions.md)
        r.zero_field = true;
        if (auto why = polarisation_unavailable(s)) r.unavailable_reason = *why;
        else r.sense = Sense::none;
        return r;
    }
    if (r.power.directivity) r.directivity_dbi = to_db(*r.power.directivity);
    r.efficiency_above_100 = r.power.radiation_efficiency && *r.power.radiation_efficiency > 1 + efficiency_tolerance;

    const Vec3 pd = direction(r.peak.theta_deg * deg, r.peak.phi_deg * deg);
    const double step = default_cut_step(s.grid);
    const Grid& g = s.grid;
    r.peak_at_pole = peak_at_pole(g, r.peak);
    r.planes_theta_deg = r.peak_at_pole ? g.theta.value_deg(r.peak.i_theta) : r.peak.theta_deg;
    r.planes_phi_deg = elevation_plane_phi_deg(g, r.peak);
    {
        CutSamples c = sample_cut(s, fi, CutSpec::phi_cut(r.planes_phi_deg), step);
        r.elevation = beam_figures(c.angle_deg, cut_power(s, c, Component::total), nearest_cut_sample(c, pd), true);
        r.hpbw_elevation_deg = r.elevation.hpbw_deg;
        r.sidelobe_elevation_db = r.elevation.sidelobe_db;
    }
    {
        CutSamples c = sample_cut(s, fi, r.peak_at_pole ? CutSpec::phi_cut(90.0) : CutSpec::through(r.peak.theta_deg, r.peak.phi_deg, true), step);
        r.azimuth = beam_figures(c.angle_deg, cut_power(s, c, Component::total), nearest_cut_sample(c, pd), r.peak_at_pole);
        r.hpbw_azimuth_deg = r.azimuth.hpbw_deg;
    }
    if (auto back = interpolate(s, fi, 180.0 - r.peak.theta_deg, r.peak.phi_deg + 180.0)) {
        const RatioDb fb = ratio_db(r.peak.value, power(back->e_theta, back->e_phi));
        r.front_to_back_db = fb.db;
        r.front_to_back_above_db = fb.above_db;
    }
    if (auto why = polarisation_unavailable(s)) {
        r.unavailable_reason = *why;
    } else if (auto f = interpolate(s, fi, r.peak.theta_deg, r.peak.phi_deg)) {
        const PolarisationState st = decompose(f->e_theta, f->e_phi, r.peak.phi_deg * deg, s.ludwig3_reference);
        r.sense = st.sense;
        r.axial_ratio_db = st.axial_ratio_db;
        r.tilt_deg = st.tilt_deg;
    }
    return r;
}

std::vector<PatternSummary> summarize_each(const FarFieldSet& s, const std::vector<std::size_t>& freq_indices) {
    std::vector<PatternSummary> out(freq_indices.size());
    parallel_each(freq_indices.size(), [&](std::size_t i) { out[i] = summarize(s, freq_indices[i]); });
    return out;
}

}  // namespace ellipsa
