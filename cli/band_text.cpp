#include "cli/band_text.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "cli/format.hpp"
#include "exports/band_figure.hpp"
#include "exports/figure_text.hpp"
#include "pattern/integrate.hpp"

namespace ellipsa::cli {

using exports::edges_text;

namespace {
std::string number(double v, int decimals) {
    char b[64];
    std::snprintf(b, sizeof b, "%.*f", decimals, v);
    return b;
}
}  // namespace

void edges_json(JsonWriter& j, std::string_view key, const std::optional<BandEdges>& e) {
    j.key(key);
    if (!e) {
        j.null();
        return;
    }
    j.begin_object();
    j.field("lower_hz", e->lower_hz).field("upper_hz", e->upper_hz).field("centre_hz", e->centre_hz);
    j.field("percent", e->percent).field("lower_open", e->lower_open).field("upper_open", e->upper_open);
    j.field("anchor_hz", e->anchor_hz).field("interpolated", e->interpolated);
    j.end_object();
}

CircularFigures circular_figures(const FarFieldSet& s, std::size_t fi, const PatternSummary& r) {
    CircularFigures c;
    c.elevation = ar_beamwidth_through(s, fi, r.planes_theta_deg, r.planes_phi_deg, false);
    c.azimuth = ar_beamwidth_through(s, fi, r.planes_theta_deg, r.planes_phi_deg, true);
    c.solid_angle = ar_solid_angle(s, fi);
    c.peak_at_pole = r.peak_at_pole;
    if (s.grid.sampling == Sampling::cuts && s.has_phase()) c.solid_angle_shortfall = sphere_shortfall(s.grid);
    return c;
}

void circular_json(JsonWriter& j, const CircularFigures& c) {
    j.field("ar_beamwidth_deg", c.elevation.width_deg);
    if (!c.elevation.width_deg) j.field("ar_beamwidth_unavailable_reason", c.elevation.unavailable_reason);
    j.field("ar_beamwidth_azimuth_deg", c.azimuth.width_deg);
    std::optional<double> share;
    if (c.solid_angle) share = c.solid_angle->share;
    j.field("ar_solid_angle_share", share);
}

std::string circular_text(const CircularFigures& c) {
    if (!c.solid_angle && c.solid_angle_shortfall.empty()) return "unavailable (" + c.elevation.unavailable_reason + ")";
    std::string s;
    if (c.elevation.width_deg || c.azimuth.width_deg) {
        s = fmt(c.elevation.width_deg, "deg", 1, "none") + " (" + exports::beam_plane_text(c.peak_at_pole, false, "deg") + "), " +
            fmt(c.azimuth.width_deg, "deg", 1, "none") + " (" + exports::beam_plane_text(c.peak_at_pole, true, "deg") + ")";
    } else {
        s = "none (" + c.elevation.unavailable_reason + ")";
    }
    if (!c.solid_angle) return s + "; the AR <= 3 dB share of the sphere needs the whole sphere (" + c.solid_angle_shortfall + ")";
    return s + "; AR <= 3 dB over " + number(100 * c.solid_angle->share, 1) + " % of the sphere";
}

void band_summary_json(JsonWriter& j, const BandSummary& b) {
    j.key("band").begin_object();
    j.field("edges", "interpolated linearly between sampled frequencies");
    edges_json(j, "gain_bandwidth_1db", b.gain_1db);
    edges_json(j, "gain_bandwidth_3db", b.gain_3db);
    edges_json(j, "ar_bandwidth_3db", b.ar);
    j.field("ar_bandwidth_theta_deg", b.ar_theta_deg).field("ar_bandwidth_phi_deg", b.ar_phi_deg);
    if (!b.ar) j.field("ar_bandwidth_unavailable_reason", b.ar_unavailable_reason);
    if (!b.gain_1db) j.field("gain_bandwidth_unavailable_reason", b.gain_unavailable_reason);
    j.end_object();
}

std::string band_summary_text(const BandSummary& b) {
    auto line = [](const std::string& label, const std::optional<BandEdges>& e, const std::string& missing) {
        std::string l = "    " + label;
        l.resize(std::max<std::size_t>(l.size() + 1, 26), ' ');
        return l + (e ? edges_text(*e) : missing) + "\n";
    };
    std::string s = "\n  band (edges interpolated linearly between sampled frequencies)\n";
    s += line("peak within 1 dB", b.gain_1db, "unavailable (" + b.gain_unavailable_reason + ")");
    s += line("peak within 3 dB", b.gain_3db, "unavailable (" + b.gain_unavailable_reason + ")");
    s += line("AR <= 3 dB", b.ar, "none (" + b.ar_unavailable_reason + ")");
    s += "                          (AR at theta " + number(b.ar_theta_deg, 1) + ", phi " + number(b.ar_phi_deg, 1) +
         " deg)\n";
    return s;
}

}  // namespace ellipsa::cli
